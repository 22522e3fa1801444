using System.Text.RegularExpressions;
using QaService.Core.Assessment;
using QaService.Core.Reporting;

namespace QaService.Core.Ingest;

/// <summary>
/// Turns an upload (options + two read files) into the JSON request's shape and validates it with the
/// same <see cref="RequestValidator"/>, so a file row is judged exactly as a JSON point would be. Errors
/// that point at a point (<c>/fixes/points/5/lat</c>) are re-pointed at the file row
/// (<c>/fixes/line/17/lat</c>); errors about the options are pointed into the options part
/// (<c>/options/spec/horizontal</c>). In <c>lenient</c> mode rows with errors are dropped and listed.
/// </summary>
public static partial class UploadValidation
{
    public const string Strict = "strict", Lenient = "lenient";

    /// <summary>Most skipped rows listed in a report; the count is always complete.</summary>
    public const int MaximumListedRows = 1_000;

    public static (ValidationOutcome Outcome, IngestSummary? Summary) Validate(UploadOptions options, PartReading marks, PartReading fixes)
    {
        var mode = options.RowErrors?.Trim().ToLowerInvariant() ?? Strict;
        if (mode is not (Strict or Lenient))
            return (ValidationOutcome.Invalid([new InputError("/options/rowErrors", $"rowErrors \"{options.RowErrors}\" is not \"strict\" or \"lenient\"")]), null);

        var skipped = new List<InputError>();
        var rowProblems = marks.RowProblems.Concat(fixes.RowProblems).ToList();
        if (rowProblems.Count > 0)
        {
            if (mode == Strict)
                return (ValidationOutcome.Invalid(rowProblems), null);
            skipped.AddRange(rowProblems);
        }

        var outcome = RequestValidator.Validate(ToRequest(options, marks, fixes));
        if (outcome.Assessment is null)
        {
            var (mapped, markRows, fixRows, others) = Locate(outcome.Errors, marks, fixes);
            if (mode == Strict || others > 0)
                return (ValidationOutcome.Invalid(mapped), null);
            skipped.AddRange(mapped);
            marks = marks with { Points = marks.Points.Without(markRows) };
            fixes = fixes with { Points = fixes.Points.Without(fixRows) };
            outcome = RequestValidator.Validate(ToRequest(options, marks, fixes));
            if (outcome.Assessment is null)
                return (ValidationOutcome.Invalid(Locate(outcome.Errors, marks, fixes).Mapped), null);
        }
        return (outcome, new IngestSummary(
            mode,
            Describe(marks),
            Describe(fixes),
            skipped.Count,
            skipped.Take(MaximumListedRows).Select(e => new IngestProblem(e.Pointer, e.Message)).ToList()));
    }

    private static IngestPartSummary Describe(PartReading part) => new(
        part.Format.ToString().ToLowerInvariant() switch { "geojson" => "geojson", var f => f },
        part.Points.Count,
        part.Columns.Count == 0 ? null : part.Columns,
        part.SentencesWithoutFix == 0 ? null : part.SentencesWithoutFix);

    private static AssessmentRequest ToRequest(UploadOptions options, PartReading marks, PartReading fixes) => new(
        Set(options.Marks, marks),
        Set(options.Fixes, fixes),
        options.Title,
        options.Spec,
        options.Pairing,
        options.Exclusions);

    private static PointSet Set(FilePartOptions? options, PartReading part) => new(
        options?.Crs ?? (part.Format == FieldFormat.Csv ? null : FieldPartReader.DefaultGeographicCrs),
        part.Points,
        options?.Heights,
        options?.Geoid,
        options?.Epoch);

    private static (List<InputError> Mapped, HashSet<int> MarkRows, HashSet<int> FixRows, int Others) Locate(
        IReadOnlyList<InputError> errors, PartReading marks, PartReading fixes)
    {
        var mapped = new List<InputError>(errors.Count);
        var markRows = new HashSet<int>();
        var fixRows = new HashSet<int>();
        var others = 0;
        foreach (var error in errors)
        {
            var m = PointPointer().Match(error.Pointer);
            if (m.Success)
            {
                var part = m.Groups["part"].Value == "marks" ? marks : fixes;
                var index = int.Parse(m.Groups["index"].Value, System.Globalization.CultureInfo.InvariantCulture);
                var field = m.Groups["field"].Success ? m.Groups["field"].Value : null;
                var column = field is null ? null : part.ColumnOf(field);
                var message = column is null || column == field ? error.Message : $"{error.Message} (column \"{column}\")";
                mapped.Add(new InputError(part.PointerOf(part.Points.RowOf(index), field), message));
                (part == marks ? markRows : fixRows).Add(index);
            }
            else if (error.Pointer is "/marks/points" or "/fixes/points")
            {
                others++;
                mapped.Add(new InputError(error.Pointer[..^"/points".Length], "the file holds no points that could be read"));
            }
            else
            {
                others++;
                mapped.Add(new InputError("/options" + error.Pointer, error.Message));
            }
        }
        return (mapped, markRows, fixRows, others);
    }

    [GeneratedRegex(@"^/(?<part>marks|fixes)/points/(?<index>\d+)(?:/(?<field>[A-Za-z]+))?$")]
    private static partial Regex PointPointer();
}
