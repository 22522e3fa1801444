using System.Text.Json.Serialization;

namespace QaService.Core.Reporting;

/// <summary>
/// One fix − mark difference in the local east-north-up frame at the mark (api-v1 "Residual"), metres.
/// </summary>
/// <param name="Mark">Mark id.</param>
/// <param name="Fix">Fix id (or <c>#row</c> when the fix had none).</param>
/// <param name="DE">East component, metres.</param>
/// <param name="DN">North component, metres.</param>
/// <param name="DU">Up component, metres; null when either side has no height.</param>
/// <param name="DH">Horizontal length sqrt(dE² + dN²), metres.</param>
/// <param name="PairedBy"><c>id</c> when the fix named its mark, <c>proximity</c> when it was paired by distance.</param>
/// <param name="Excluded">Reason the fix was left out of the statistics; null when it counts.</param>
/// <param name="MarkLatitude">Mark latitude, WGS 84 decimal degrees (for maps and exports).</param>
/// <param name="MarkLongitude">Mark longitude, WGS 84 decimal degrees.</param>
public sealed record Residual(
    string Mark,
    string Fix,
    [property: JsonPropertyName("dE")] double DE,
    [property: JsonPropertyName("dN")] double DN,
    [property: JsonPropertyName("dU")] double? DU,
    [property: JsonPropertyName("dH")] double DH,
    string PairedBy,
    string? Excluded,
    double MarkLatitude,
    double MarkLongitude)
{
    /// <summary>The fix's attributes and reported precision, shared with the fix; null when it gave none (then none is written).</summary>
    [JsonIgnore]
    public Assessment.FixAttributes? Attributes { get; init; }

    /// <summary>The fix's feature class; written only when given.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public string? FeatureClass => Attributes?.FeatureClass;

    /// <summary>The crew that took the fix; written only when given.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public string? Crew => Attributes?.Crew;

    /// <summary>The receiver that took the fix; written only when given.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public string? Receiver => Attributes?.Receiver;

    /// <summary>Receiver-reported per-axis 1σ horizontal precision of the fix, metres; written only when given.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public double? FixSigmaH => Attributes?.SigmaHorizontalMetres;

    /// <summary>HDOP reported with the fix; written only when given.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public double? Hdop => Attributes?.Hdop;

    /// <summary>Solution kind of the fix (screening words); written only when given.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public string? Quality => Attributes?.Quality;
}
