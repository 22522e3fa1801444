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
/// <param name="Standard">The selected standard's own figures and statement (spec.standard; nssda when no spec).</param>
/// <param name="Confidence">Confidence intervals, bootstrap bounds and sample-size advice.</param>
/// <param name="Approximations">Rules of thumb beside the exact horizontal radii, each with its validity range.</param>
/// <param name="OffsetModel">Radii about the mark predicted with the observed mean offset (noncentral case).</param>
/// <param name="OutlierSensitivity">Figures with and without the fixes the outlier check flags (never dropped silently).</param>
/// <param name="Pairing">Ambiguous proximity pairings and repeat occupations (precision per mark); null when neither occurred.</param>
/// <param name="Ingest">How uploaded files were read; null for JSON requests.</param>
/// <param name="Groups">Figures per value of each fix attribute present (featureClass, crew, receiver); left out of the JSON when no fix gives one.</param>
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
    Standards.StandardResult? Standard = null,
    Standards.ConfidenceSummary? Confidence = null,
    IReadOnlyList<Approximation>? Approximations = null,
    OffsetRadii? OffsetModel = null,
    OutlierSensitivity? OutlierSensitivity = null,
    PairingSummary? Pairing = null,
    IngestSummary? Ingest = null,
    [property: System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
    IReadOnlyList<AttributeGroups>? Groups = null);

/// <summary>
/// The headline figures with and without the residuals the outlier check flags, so a blunder's weight is visible and
/// nothing is dropped silently: the report's own figures always include them unless the request excludes them.
/// </summary>
/// <param name="Flagged">Fix ids flagged by the <c>outliers</c> check.</param>
/// <param name="RmseRWith">rmseR with every included residual, m.</param>
/// <param name="RmseRWithout">rmseR without the flagged fixes, m; null when nothing would remain.</param>
/// <param name="Nssda95With">Horizontal nssda95 with them, m.</param>
/// <param name="Nssda95Without">Horizontal nssda95 without them, m.</param>
/// <param name="VerticalRmseWith">Vertical rmse with them, m; null without heights.</param>
/// <param name="VerticalRmseWithout">Vertical rmse without them, m.</param>
public sealed record OutlierSensitivity(IReadOnlyList<string> Flagged, double RmseRWith, double? RmseRWithout, double Nssda95With, double? Nssda95Without,
    double? VerticalRmseWith, double? VerticalRmseWithout);

/// <summary>The required accuracy as judged (95 % confidence, metres) and how each figure fared.</summary>
/// <param name="Standard">e.g. <c>nssda</c>.</param>
/// <param name="Horizontal">Required horizontal accuracy, metres.</param>
/// <param name="Vertical">Required vertical accuracy, metres.</param>
/// <param name="HorizontalMet">Whether the tested horizontal nssda95 is within it; null when not judged.</param>
/// <param name="VerticalMet">Whether the tested vertical nssda95 is within it; null when not judged.</param>
/// <param name="Confidence">spec.confidence when given.</param>
/// <param name="HorizontalMetAtConfidence">Whether the upper confidence bound of the judged horizontal figure meets it; null when not judged at a confidence.</param>
/// <param name="VerticalMetAtConfidence">Likewise vertical.</param>
/// <remarks>For a standard other than nssda, HorizontalMet/VerticalMet judge that standard's own figures (see <c>standard</c>).</remarks>
public sealed record SpecSummary(string Standard, double? Horizontal, double? Vertical, bool? HorizontalMet, bool? VerticalMet,
    double? Confidence = null, bool? HorizontalMetAtConfidence = null, bool? VerticalMetAtConfidence = null);

/// <summary>The frames of both sides and the operation that joined them.</summary>
/// <param name="Marks">Marks' CRS identifier and name.</param>
/// <param name="Fixes">Fixes' CRS identifier and name.</param>
/// <param name="Heights">Height reference of marks and fixes.</param>
/// <param name="Operation">The steps used, in words.</param>
public sealed record FrameSummary(string Marks, string Fixes, string Heights, string Operation);
