using System.Buffers.Text;
using System.Globalization;
using System.Text;

namespace QaService.Api.Storage;

/// <summary>
/// One page of a tenant's reports, newest first (created_at DESC, id DESC), with optional filters. Keyset paging:
/// <see cref="After"/> is the last row of the previous page, so reports added or deleted between pages neither repeat
/// nor push others out of view.
/// </summary>
/// <param name="TitleContains">Case-insensitive substring of the title, taken literally (no wildcards).</param>
/// <param name="From">Inclusive lower bound of created_at.</param>
/// <param name="To">Exclusive upper bound of created_at.</param>
public sealed record ReportListQuery(
    string Tenant,
    int Limit,
    ListCursor? After = null,
    string? Verdict = null,
    string? TitleContains = null,
    DateTimeOffset? From = null,
    DateTimeOffset? To = null);

/// <summary>A page of summaries and the cursor of the next page (null on the last page).</summary>
public sealed record ReportSummaryPage(IReadOnlyList<ReportSummary> Items, ListCursor? Next)
{
    public static readonly ReportSummaryPage Empty = new([], null);

    /// <summary>The page from up to limit + 1 rows read in list order: the extra row only says that more follow.</summary>
    public static ReportSummaryPage FromRows(List<ReportSummary> rows, int limit)
    {
        if (rows.Count <= limit)
            return new ReportSummaryPage(rows, null);
        rows.RemoveRange(limit, rows.Count - limit);
        var last = rows[^1];
        return new ReportSummaryPage(rows, new ListCursor(last.CreatedAt, last.Id));
    }
}

/// <summary>
/// Where a page ends: the (created_at, id) of its last row. Sent to callers as an opaque base64url token
/// ("v1:" + UTC ticks + ":" + id); nothing but this type reads it.
/// </summary>
public readonly record struct ListCursor(DateTimeOffset CreatedAt, string Id)
{
    private const string Version = "v1";

    /// <summary>Longest id a cursor may carry (report ids are 22 characters; the demo's is "demo").</summary>
    private const int MaximumIdLength = 64;

    public string Encode() =>
        Base64Url.EncodeToString(Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture, $"{Version}:{CreatedAt.UtcTicks}:{Id}")));

    public static bool TryDecode(string token, out ListCursor cursor)
    {
        cursor = default;
        if (token.Length is 0 or > 200)
            return false;
        byte[] bytes;
        try
        {
            bytes = Base64Url.DecodeFromChars(token);
        }
        catch (FormatException)
        {
            return false;
        }
        var parts = Encoding.UTF8.GetString(bytes).Split(':', 3);
        if (parts.Length != 3 || parts[0] != Version || parts[2].Length is 0 or > MaximumIdLength
            || !long.TryParse(parts[1], NumberStyles.None, CultureInfo.InvariantCulture, out var ticks)
            || ticks > DateTimeOffset.MaxValue.UtcTicks)
            return false;
        cursor = new ListCursor(new DateTimeOffset(ticks, TimeSpan.Zero), parts[2]);
        return true;
    }
}
