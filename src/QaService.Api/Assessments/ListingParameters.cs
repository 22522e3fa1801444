using System.Globalization;
using System.Text.RegularExpressions;
using QaService.Api.Storage;
using QaService.Core.Assessment;

namespace QaService.Api.Assessments;

/// <summary>
/// The query parameters of a report list (<c>GET /v1/assessments</c> and the list page), read into a
/// <see cref="ReportListQuery"/>. Each bad parameter is one error whose pointer names it (<c>/limit</c>, as the CRS search does).
/// </summary>
internal static partial class ListingParameters
{
    public const int DefaultLimit = 20, MaximumLimit = 100;

    /// <summary>Longest title search text, characters.</summary>
    public const int MaximumQueryLength = 200;

    public static readonly string[] Verdicts = ["pass", "fail", "inconclusive"];

    /// <summary>The names, in the order a list page and a next-page link write them.</summary>
    public static readonly string[] Names = ["verdict", "q", "from", "to", "limit", "cursor"];

    public static (ReportListQuery? Query, List<InputError> Errors) Read(string tenant, Func<string, string?> parameter)
    {
        var errors = new List<InputError>();
        var limit = ReadLimit(parameter("limit"), errors);

        ListCursor? after = null;
        if (parameter("cursor") is { Length: > 0 } token)
        {
            if (ListCursor.TryDecode(token, out var cursor))
                after = cursor;
            else
                errors.Add(new("/cursor", "cursor is not one this service issued; use the \"next\" value of the previous page, unchanged"));
        }

        string? verdict = null;
        if (parameter("verdict") is { Length: > 0 } verdictText)
        {
            verdict = Array.Find(Verdicts, v => string.Equals(v, verdictText, StringComparison.OrdinalIgnoreCase));
            if (verdict is null)
                errors.Add(new("/verdict", $"verdict \"{Shorten(verdictText)}\" must be one of {string.Join(", ", Verdicts)}"));
        }

        var q = parameter("q") is { Length: > 0 } text ? text : null;
        if (q is { Length: > MaximumQueryLength })
            errors.Add(new("/q", $"q is longer than {MaximumQueryLength} characters"));

        var from = ReadTime(parameter("from"), "from", errors);
        var to = ReadTime(parameter("to"), "to", errors);
        if (from is not null && to is not null && from >= to)
            errors.Add(new("/to", "to must be later than from (from is inclusive, to exclusive)"));

        return errors.Count > 0 ? (null, errors) : (new ReportListQuery(tenant, limit, after, verdict, q, from, to), errors);
    }

    private static int ReadLimit(string? text, List<InputError> errors)
    {
        if (string.IsNullOrEmpty(text))
            return DefaultLimit;
        if (int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var value) && value is >= 1 and <= MaximumLimit)
            return value;
        errors.Add(new("/limit", string.Create(CultureInfo.InvariantCulture, $"limit \"{Shorten(text)}\" must be a whole number in 1..{MaximumLimit}")));
        return DefaultLimit;
    }

    /// <summary>An RFC 3339 §5.6 date-time: date, "T", time with optional fraction (up to 7 digits), and "Z" or an offset.</summary>
    private static DateTimeOffset? ReadTime(string? text, string name, List<InputError> errors)
    {
        if (string.IsNullOrEmpty(text))
            return null;
        if (Rfc3339().IsMatch(text)
            && DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.None, out var time))
            return time;
        errors.Add(new($"/{name}", $"{name} \"{Shorten(text)}\" is not an RFC 3339 date-time such as 2026-05-01T00:00:00Z"));
        return null;
    }

    [GeneratedRegex(@"^\d{4}-\d{2}-\d{2}[Tt]\d{2}:\d{2}:\d{2}(\.\d{1,7})?([Zz]|[+-]\d{2}:\d{2})$")]
    private static partial Regex Rfc3339();

    private static string Shorten(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
