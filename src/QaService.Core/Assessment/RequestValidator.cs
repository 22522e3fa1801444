using static QaService.Core.InvariantText;
using System.Globalization;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;
using QaService.Core.Geodesy.Vertical;
using QaService.Core.Standards;

namespace QaService.Core.Assessment;

/// <summary>
/// Checks an <see cref="AssessmentRequest"/> against api-v1 and brings every point into the common
/// geodetic frame. Returns every problem found, each with a JSON pointer, rather than stopping at the first.
/// </summary>
public static class RequestValidator
{
    /// <summary>Default proximity pairing radius, metres (api-v1: "default 5 m").</summary>
    public const double DefaultPairingRadiusMetres = 5.0;

    /// <summary>Largest proximity pairing radius accepted, metres: beyond this, "nearest mark" stops meaning "the mark that was occupied".</summary>
    public const double MaximumPairingRadiusMetres = 1_000.0;

    /// <summary>Plausible range of coordinate epochs, decimal years (GNSS era with margin).</summary>
    public const double MinimumEpochYear = 1950.0, MaximumEpochYear = 2150.0;

    /// <summary>Longest id or title accepted, characters.</summary>
    public const int MaximumTextLength = 200;

    /// <summary>Range accepted for spec.confidence (a one-sided level; below 0.5 a "bound" is below the estimate).</summary>
    public const double MinimumConfidence = 0.5, MaximumConfidence = 0.999;

    public static ValidationOutcome Validate(AssessmentRequest? request)
    {
        var errors = new List<InputError>();
        if (request is null)
            return ValidationOutcome.Invalid([new InputError("", "the body must be a JSON object with \"marks\" and \"fixes\"")]);

        if (request.Title is { Length: > MaximumTextLength })
            errors.Add(new("/title", $"title is longer than {MaximumTextLength} characters"));

        var marksFrame = ReadFrame(request.Marks, "/marks", errors);
        var fixesFrame = ReadFrame(request.Fixes, "/fixes", errors);
        if (marksFrame is not null && fixesFrame is not null)
            CheckHeightsCompatible(marksFrame, fixesFrame, errors);

        // The request is not used after its points are read, so a large upload's parsed columns can be collected while
        // the fixes are aligned (the options below are read first).
        var title = string.IsNullOrWhiteSpace(request.Title) ? null : request.Title.Trim();
        var optionErrors = new List<InputError>();
        var spec = ReadSpec(request.Spec, optionErrors);
        var radius = ReadPairing(request.Pairing, optionErrors);
        var occupations = OccupationModes.Read(request.Pairing?.Occupations, optionErrors);
        var requestedExclusions = request.Exclusions;

        var marks = marksFrame is null ? [] : PointSetReading.ReadMarks(request.Marks!, marksFrame, "/marks", errors);
        // Each fix's mark is checked as the fix is read; those problems are listed after the marks' duplicate ids.
        var markCheck = new MarkCheck(marks.Select(mark => mark.Id).ToHashSet(StringComparer.Ordinal), []);
        var fixes = fixesFrame is null ? FixTable.Of([]) : PointSetReading.ReadFixes(request.Fixes!, fixesFrame, "/fixes", errors, markCheck);
        ReportDuplicateMarkIds(marks, errors);
        errors.AddRange(markCheck.Unknown);
        errors.AddRange(optionErrors);
        var exclusions = ReadExclusions(requestedExclusions, fixes, errors);

        if (errors.Count > 0)
            return ValidationOutcome.Invalid(errors);

        var (aligned, problem, problemIsOperationCode) = FrameAlignment.Align(marksFrame!, fixesFrame!, marks, fixes);
        if (aligned is null)
            return ValidationOutcome.Invalid([problemIsOperationCode
                ? new InputError("/fixes/operationCode", problem!)
                : new InputError("/fixes/crs", $"{problem}; send both sides in frames the service can join")]);

        return ValidationOutcome.Valid(new ValidatedAssessment(
            title,
            marksFrame!, fixesFrame!, aligned.Marks, aligned.Fixes, spec, radius, exclusions, aligned.Operation, occupations)
        {
            AreaWarnings = aligned.AreaWarnings,
        });
    }

    private static PointSetFrame? ReadFrame(PointSet? set, string pointer, List<InputError> errors)
    {
        if (set is null)
        {
            errors.Add(new(pointer, $"\"{pointer[1..]}\" is required: an object with \"crs\", \"heights\" and \"points\""));
            return null;
        }
        var resolution = CrsCatalog.Resolve(set.Crs);
        if (!resolution.Succeeded)
            errors.Add(new($"{pointer}/crs", resolution.Problem!));

        var heightsStated = set.Heights is not null;
        HeightReference? heights = (set.Heights?.Trim().ToLowerInvariant()) switch
        {
            null or "ellipsoidal" => HeightReference.Ellipsoidal,
            "orthometric" => HeightReference.Orthometric,
            "none" => HeightReference.None,
            _ => null,
        };
        if (heights is null)
            errors.Add(new($"{pointer}/heights", $"heights \"{set.Heights}\" is not one of \"ellipsoidal\", \"orthometric\", \"none\""));
        if (resolution.Crs is { Kind: CrsKind.Geocentric } && heights == HeightReference.Orthometric)
            errors.Add(new($"{pointer}/heights", "geocentric coordinates imply ellipsoidal heights; \"orthometric\" does not fit a geocentric CRS"));
        if (heights == HeightReference.Orthometric && string.IsNullOrWhiteSpace(set.Geoid))
            errors.Add(new($"{pointer}/geoid", "orthometric heights need the geoid model they refer to, e.g. \"egm96\""));

        if (set.Epoch is { } epoch && (!double.IsFinite(epoch) || epoch < MinimumEpochYear || epoch > MaximumEpochYear))
            errors.Add(new($"{pointer}/epoch", Format($"epoch {epoch} is not a decimal year in {MinimumEpochYear}..{MaximumEpochYear}")));

        if (set.Points is null || set.Points.Count == 0)
            errors.Add(new($"{pointer}/points", "at least one point is required"));

        var isMarks = pointer == "/marks";
        int? operationCode = null;
        if (set.OperationCode is not null && isMarks)
            errors.Add(new($"{pointer}/operationCode", "operationCode belongs to \"fixes\": it names the transformation that brings the fixes into the marks' frame"));
        else
            operationCode = Transform.OperationCodeText.Parse(set.OperationCode, $"{pointer}/operationCode", errors);
        var plateMotion = ReadPlate(set, pointer, isMarks, errors);

        return resolution.Crs is null || heights is null
            ? null
            : new PointSetFrame(resolution.Crs, heights.Value, set.Geoid?.Trim().ToLowerInvariant(), set.Epoch, heightsStated)
            {
                OperationCode = operationCode,
                PlateMotion = plateMotion,
            };
    }

    /// <summary>Marks' <c>plate</c> and <c>plateModel</c> (see <see cref="PlateMotionModel"/>).</summary>
    private static (PlateMotionModel, PlateRotation)? ReadPlate(PointSet set, string pointer, bool isMarks, List<InputError> errors)
    {
        if (set.Plate is null && set.PlateModel is null)
            return null;
        if (!isMarks)
        {
            errors.Add(new($"{pointer}/{(set.Plate is null ? "plateModel" : "plate")}", "plate and plateModel belong to \"marks\": the marks are carried to the fixes' epoch"));
            return null;
        }
        var model = set.PlateModel is null ? PlateMotionModel.Default : PlateMotionModel.Find(set.PlateModel);
        if (model is null)
        {
            errors.Add(new($"{pointer}/plateModel", $"plateModel \"{set.PlateModel}\" is not known; known: {string.Join(", ", PlateMotionModel.All.Select(m => m.Id))}"));
            return null;
        }
        if (model.Plate(set.Plate) is not { } plate)
        {
            errors.Add(new($"{pointer}/plate", $"plate \"{set.Plate}\" is not in {model.Id}; its plates: {string.Join(", ", model.Plates.Order(StringComparer.Ordinal))}"));
            return null;
        }
        return (model, plate);
    }

    private static void CheckHeightsCompatible(PointSetFrame marks, PointSetFrame fixes, List<InputError> errors)
    {
        // Mixed references are converted (h = H + N); only a geoid the service does not have stops the request.
        foreach (var (frame, pointer) in new[] { (marks, "/marks/geoid"), (fixes, "/fixes/geoid") })
        {
            if (frame.Heights == HeightReference.Orthometric && !string.IsNullOrWhiteSpace(frame.Geoid) && GeoidModel.Find(frame.Geoid) is null)
                errors.Add(new(pointer, $"geoid \"{frame.Geoid}\" is not known; known: {GeoidModel.KnownNames}. Send ellipsoidal heights, or \"heights\": \"none\" for a horizontal-only test"));
        }
    }

    private static string Describe(PointSetFrame frame) =>
        frame.Heights == HeightReference.Orthometric ? $"orthometric ({frame.Geoid})" : "ellipsoidal";

    private static void ReportDuplicateMarkIds(List<FramedPoint> marks, List<InputError> errors)
    {
        var markIds = new HashSet<string>(StringComparer.Ordinal);
        foreach (var mark in marks.Where(mark => !markIds.Add(mark.Id)))
            errors.Add(new(Format($"/marks/points/{mark.Index}/id"), $"mark id \"{mark.Id}\" appears more than once"));
    }

    /// <summary>
    /// The checks a request's <c>spec</c> gets, for a spec stored elsewhere (a project's): problems point at <c>/spec/…</c>.
    /// </summary>
    public static IReadOnlyList<InputError> ValidateSpec(AccuracySpec spec)
    {
        var errors = new List<InputError>();
        ReadSpec(spec, errors);
        return errors;
    }

    private static RequiredAccuracy? ReadSpec(AccuracySpec? spec, List<InputError> errors)
    {
        if (spec is null)
            return null;
        var requested = spec.Standard?.Trim() ?? AccuracyStandards.NssdaId;
        if (!AccuracyStandards.Aliases.TryGetValue(requested, out var standard))
        {
            errors.Add(new("/spec/standard", $"standard \"{spec.Standard}\" is not supported; use one of {AccuracyStandards.Summary}"));
            standard = AccuracyStandards.NssdaId;
        }
        CheckRequirement(spec.Horizontal, "/spec/horizontal", errors);
        CheckRequirement(spec.Vertical, "/spec/vertical", errors);
        if (spec.Confidence is { } c && !(c >= MinimumConfidence && c <= MaximumConfidence))
            errors.Add(new("/spec/confidence", Format($"confidence {c} must be a level between {MinimumConfidence} and {MaximumConfidence}, e.g. 0.9")));
        if (spec.MapScale is { } scale && !(double.IsFinite(scale) && scale >= 1))
            errors.Add(new("/spec/mapScale", Format($"map scale {scale} must be the scale denominator, a number ≥ 1 (24000 for 1:24,000)")));
        if (spec.ContourInterval is { } ci && !(double.IsFinite(ci) && ci > 0))
            errors.Add(new("/spec/contourInterval", Format($"contour interval {ci} must be a positive number of metres")));
        if (standard == AccuracyStandards.NmasId && spec.MapScale is null && spec.ContourInterval is null)
            errors.Add(new("/spec/mapScale", "nmas-1947 judges against the map: give \"mapScale\" (e.g. 24000) and/or \"contourInterval\" (metres)"));
        var classes = ReadFeatureClasses(spec.FeatureClasses, standard, errors);
        return new RequiredAccuracy(standard, spec.Horizontal, spec.Vertical, spec.Confidence, spec.MapScale, spec.ContourInterval, classes);
    }

    /// <summary>
    /// spec.featureClasses: each key a class name as fixes give it (non-blank, at most <see cref="FixAttributes.MaximumLength"/>
    /// characters), each value at least one positive figure in the standard's own measures. NMAS judges against a map
    /// scale, not figures, so it takes no per-class figures.
    /// </summary>
    private static Dictionary<string, ClassAccuracy>? ReadFeatureClasses(IReadOnlyDictionary<string, FeatureClassSpec?>? classes, string standard,
        List<InputError> errors)
    {
        if (classes is null)
            return null;
        if (standard == AccuracyStandards.NmasId && classes.Count > 0)
        {
            errors.Add(new("/spec/featureClasses", "nmas-1947 judges against the map scale and contour interval, not per-class figures; use another standard for featureClasses"));
            return null;
        }
        var result = new Dictionary<string, ClassAccuracy>(StringComparer.Ordinal);
        foreach (var (name, figures) in classes)
        {
            var pointer = "/spec/featureClasses/" + name.Replace("~", "~0", StringComparison.Ordinal).Replace("/", "~1", StringComparison.Ordinal);
            var key = name.Trim();
            if (key.Length == 0 || key.Length > FixAttributes.MaximumLength)
            {
                errors.Add(new(pointer, Format($"a feature class name is 1 to {FixAttributes.MaximumLength} characters, as the fixes' featureClass gives it")));
                continue;
            }
            if (figures is null || (figures.Horizontal is null && figures.Vertical is null))
            {
                errors.Add(new(pointer, "give the class's required \"horizontal\" and/or \"vertical\" accuracy, metres"));
                continue;
            }
            CheckRequirement(figures.Horizontal, pointer + "/horizontal", errors);
            CheckRequirement(figures.Vertical, pointer + "/vertical", errors);
            if (!result.TryAdd(key, new ClassAccuracy(figures.Horizontal, figures.Vertical)))
                errors.Add(new(pointer, $"feature class \"{key}\" is given twice (names are compared after trimming)"));
        }
        return result;
    }

    private static void CheckRequirement(double? metres, string pointer, List<InputError> errors)
    {
        if (metres is { } m && (!double.IsFinite(m) || m <= 0))
            errors.Add(new(pointer, Format($"required accuracy {m} must be a positive number of metres at 95 % confidence")));
    }

    private static double? ReadPairing(PairingOptions? pairing, List<InputError> errors)
    {
        if (pairing is null)
            return null;
        var radius = pairing.Radius ?? DefaultPairingRadiusMetres;
        if (!double.IsFinite(radius) || radius <= 0 || radius > MaximumPairingRadiusMetres)
            errors.Add(new("/pairing/radius", Format($"pairing radius {radius} must be in (0, {MaximumPairingRadiusMetres}] metres")));
        return radius;
    }

    private static Dictionary<string, string> ReadExclusions(IReadOnlyList<Exclusion?>? exclusions, FixTable fixes, List<InputError> errors)
    {
        var result = new Dictionary<string, string>(StringComparer.Ordinal);
        if (exclusions is null)
            return result;
        // The named ids that some fix has, found in one pass over the fixes by their characters (no string per fix).
        var named = exclusions.Select(e => e?.Fix?.Trim()).OfType<string>().ToHashSet(StringComparer.Ordinal);
        var fixIds = new HashSet<string>(StringComparer.Ordinal);
        var byText = named.GetAlternateLookup<ReadOnlySpan<char>>();
        for (var i = 0; i < fixes.Count && fixIds.Count < named.Count; i++)
        {
            if (byText.TryGetValue(fixes.IdText(i).Span, out var id))
                fixIds.Add(id);
        }
        for (var i = 0; i < exclusions.Count; i++)
        {
            var pointer = Format($"/exclusions/{i}");
            var exclusion = exclusions[i];
            if (exclusion is null || string.IsNullOrWhiteSpace(exclusion.Fix))
                errors.Add(new($"{pointer}/fix", "an exclusion names the fix id it leaves out"));
            else if (!fixIds.Contains(exclusion.Fix.Trim()))
                errors.Add(new($"{pointer}/fix", $"no fix has the id \"{exclusion.Fix}\""));
            else if (string.IsNullOrWhiteSpace(exclusion.Reason))
                errors.Add(new($"{pointer}/reason", "say why the fix is excluded: the reason is printed on the report"));
            else if (!result.TryAdd(exclusion.Fix.Trim(), exclusion.Reason.Trim()))
                errors.Add(new($"{pointer}/fix", $"fix \"{exclusion.Fix}\" is excluded twice"));
        }
        return result;
    }

}

/// <summary>Either a validated assessment or the problems that stop it.</summary>
public sealed record ValidationOutcome(ValidatedAssessment? Assessment, IReadOnlyList<InputError> Errors)
{
    public static ValidationOutcome Valid(ValidatedAssessment assessment) => new(assessment, []);

    public static ValidationOutcome Invalid(IReadOnlyList<InputError> errors) => new(null, errors);
}
