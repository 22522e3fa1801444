namespace QaService.Api.OpenApi;

/// <summary>
/// One line per tag used by <c>WithTags</c>: Redocly's recommended ruleset asks every tag for a description, and
/// the convention test fails for a tag missing here.
/// </summary>
internal static class TagDescriptions
{
    public static IReadOnlyDictionary<string, string> All { get; } = new Dictionary<string, string>(StringComparer.Ordinal)
    {
        ["Assessments"] = "Test field fixes against surveyed marks (JSON or multipart files) and read the stored conformance report.",
        ["Reports"] = "Views of a stored report: the self-contained HTML page, the residuals as CSV and as GeoJSON.",
        ["Transform"] = "Coordinate transformation of a batch of points between CRSs, frames and epochs.",
        ["CRS"] = "The catalog of supported coordinate reference systems: search and definitions.",
        ["Screening"] = "Accept, flag or reject single fixes from their receiver metadata under named profiles.",
        ["Share links"] = "Links that open one report's HTML page, CSV and GeoJSON without credentials until they expire or are revoked.",
        ["Projects"] = "A contract's spec that its deliveries (assessments naming the project) inherit; the deliveries' acceptance and the trend of their figures.",
        ["Sign-off"] = "Append-only accept/reject decisions on a delivery, each bound to the SHA-256 of the report bytes it was taken on.",
        ["Admin"] = "Tenant administration with the admin token (Auth:AdminToken).",
    };
}
