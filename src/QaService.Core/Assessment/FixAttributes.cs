namespace QaService.Core.Assessment;

/// <summary>
/// What a fix may carry besides its position: the attributes the report groups by and what the receiver said about
/// its precision. One object per fix that gives any of them, shared (not copied) by the fix's residual.
/// </summary>
/// <param name="FeatureClass">Kind of feature located (e.g. <c>valve</c>); the group key for <c>spec.featureClasses</c>.</param>
/// <param name="Crew">Field crew that took the fix.</param>
/// <param name="Receiver">Receiver (make/model or unit id) that took the fix.</param>
/// <param name="SigmaHorizontalMetres">Receiver-reported per-axis 1σ horizontal precision (the fix's <c>sigmaH</c>, or NMEA GST), metres.</param>
/// <param name="Hdop">Horizontal dilution of precision reported with the fix (dimensionless).</param>
/// <param name="Quality">Solution kind in the screening words (<c>autonomous</c>, <c>dgnss</c>, <c>sbas</c>, <c>ppp</c>, <c>rtk-float</c>, <c>rtk-fixed</c>, <c>invalid</c>).</param>
public sealed record FixAttributes(string? FeatureClass, string? Crew, string? Receiver, double? SigmaHorizontalMetres, double? Hdop, string? Quality)
{
    /// <summary>Longest attribute text accepted (characters): a class, crew or receiver name, not free text.</summary>
    public const int MaximumLength = 64;

    /// <summary>The grouping attributes, by their JSON names, in report order.</summary>
    public static IReadOnlyList<string> GroupingNames { get; } = ["featureClass", "crew", "receiver"];

    /// <summary>The value of the grouping attribute at <paramref name="index"/> of <see cref="GroupingNames"/>.</summary>
    public string? Grouping(int index) => index switch { 0 => FeatureClass, 1 => Crew, _ => Receiver };
}
