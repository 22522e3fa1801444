using QaService.Core.Statistics;

namespace QaService.Core.Reporting;

/// <summary>
/// The conformance report (api-v1 "Response 201"). One model, rendered as JSON now and by other
/// renderers later; nothing downstream recomputes a figure.
/// </summary>
/// <param name="Id">Unguessable report id.</param>
/// <param name="Title">Title from the request.</param>
/// <param name="CreatedAt">When the report was made (UTC).</param>
/// <param name="Verdict">pass, fail or inconclusive.</param>
/// <param name="Counts">How many points took part.</param>
/// <param name="Horizontal">Horizontal accuracy figures, metres; null with no paired fix.</param>
/// <param name="Vertical">Vertical accuracy figures, metres; null when either side has no heights.</param>
/// <param name="Residuals">Every paired fix, excluded ones marked.</param>
/// <param name="Checks">Findings about the data.</param>
/// <param name="Statement">The NSSDA reporting sentence, in the unit of the marks' CRS.</param>
/// <param name="Cautions">What the report is not, and how to use it safely.</param>
/// <param name="Spec">The required accuracy the verdict was judged against.</param>
/// <param name="Frames">How marks and fixes were brought into one frame.</param>
/// <param name="Pairing">Ambiguous proximity pairings and repeat occupations (precision per mark); null when neither occurred.</param>
/// <param name="Ingest">How uploaded files were read; null for JSON requests.</param>
public sealed record AssessmentReport(
    string Id,
    string? Title,
    DateTimeOffset CreatedAt,
    Verdict Verdict,
    ReportCounts Counts,
    HorizontalAccuracy? Horizontal,
    VerticalAccuracy? Vertical,
    IReadOnlyList<Residual> Residuals,
    IReadOnlyList<CheckResult> Checks,
    string Statement,
    IReadOnlyList<string> Cautions,
    SpecSummary? Spec,
    FrameSummary Frames,
    PairingSummary? Pairing = null,
    IngestSummary? Ingest = null);

/// <summary>The required accuracy as judged (95 % confidence, metres) and how each figure fared.</summary>
/// <param name="Standard">e.g. <c>nssda</c>.</param>
/// <param name="Horizontal">Required horizontal accuracy, metres.</param>
/// <param name="Vertical">Required vertical accuracy, metres.</param>
/// <param name="HorizontalMet">Whether the tested horizontal nssda95 is within it; null when not judged.</param>
/// <param name="VerticalMet">Whether the tested vertical nssda95 is within it; null when not judged.</param>
public sealed record SpecSummary(string Standard, double? Horizontal, double? Vertical, bool? HorizontalMet, bool? VerticalMet);

/// <summary>The frames of both sides and the operation that joined them.</summary>
/// <param name="Marks">Marks' CRS identifier and name.</param>
/// <param name="Fixes">Fixes' CRS identifier and name.</param>
/// <param name="Heights">Height reference of marks and fixes.</param>
/// <param name="Operation">The steps used, in words.</param>
public sealed record FrameSummary(string Marks, string Fixes, string Heights, string Operation);
