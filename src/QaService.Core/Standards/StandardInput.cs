using QaService.Core.Geodesy.Catalog;
using QaService.Core.Statistics;

namespace QaService.Core.Standards;

/// <summary>What every standard profile may use: the figures, the residual lengths, the marks' own sigmas and the spec.</summary>
/// <param name="Horizontal">Horizontal block; null without paired fixes.</param>
/// <param name="Vertical">Vertical block; null without heights.</param>
/// <param name="RadialMetres">dH of every included residual, m.</param>
/// <param name="AbsoluteVerticalMetres">|dU| of every included residual with heights, m.</param>
/// <param name="MarkSigmaHorizontalMetres">Declared per-axis σ of each tested mark, m; null where a mark declares none.</param>
/// <param name="MarkSigmaVerticalMetres">Declared vertical σ of each tested mark, m; null where none.</param>
/// <param name="RequiredHorizontalMetres">spec.horizontal in the standard's own measure, m.</param>
/// <param name="RequiredVerticalMetres">spec.vertical in the standard's own measure, m.</param>
/// <param name="MapScaleDenominator">spec.mapScale, e.g. 24000 for 1:24,000 (NMAS).</param>
/// <param name="ContourIntervalMetres">spec.contourInterval, m (NMAS vertical).</param>
/// <param name="Unit">Linear unit of the marks' CRS, for statements.</param>
public sealed record StandardInput(
    HorizontalAccuracy? Horizontal,
    VerticalAccuracy? Vertical,
    IReadOnlyList<double> RadialMetres,
    IReadOnlyList<double> AbsoluteVerticalMetres,
    IReadOnlyList<double?> MarkSigmaHorizontalMetres,
    IReadOnlyList<double?> MarkSigmaVerticalMetres,
    double? RequiredHorizontalMetres,
    double? RequiredVerticalMetres,
    double? MapScaleDenominator,
    double? ContourIntervalMetres,
    LinearUnit Unit);

/// <summary>The standards selectable by <c>spec.standard</c>.</summary>
public static class AccuracyStandards
{
    public const string NssdaId = "nssda", AsprsId = "asprs-2023", NmasId = "nmas-1947", NgaId = "nga-ce90";

    /// <summary>Accepted spellings → canonical id.</summary>
    public static IReadOnlyDictionary<string, string> Aliases { get; } = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase)
    {
        ["nssda"] = NssdaId, ["fgdc-std-007.3-1998"] = NssdaId,
        ["asprs-2023"] = AsprsId, ["asprs"] = AsprsId, ["asprs-ed2"] = AsprsId,
        ["nmas-1947"] = NmasId, ["nmas"] = NmasId,
        ["nga-ce90"] = NgaId, ["nga"] = NgaId, ["ce90"] = NgaId, ["ce90-le90"] = NgaId,
    };

    /// <summary>One line per standard, for error messages and the API description.</summary>
    public const string Summary =
        "\"nssda\" (FGDC-STD-007.3-1998; horizontal/vertical = required accuracy at 95 %), " +
        "\"asprs-2023\" (ASPRS Positional Accuracy Standards, Edition 2, 2023; horizontal = required RMSE_H, vertical = required RMSE_V), " +
        "\"nmas-1947\" (US National Map Accuracy Standards, 1947; needs mapScale and/or contourInterval), " +
        "\"nga-ce90\" (CE90/LE90 after NGA practice; horizontal = required CE90, vertical = required LE90)";

    /// <summary>Minimum check points of a standard id.</summary>
    public static int MinimumPoints(string? id) => id switch
    {
        AsprsId => AsprsEdition2.MinimumCheckPoints,
        NmasId => Nmas1947.MinimumCheckPoints,
        _ => Nssda.MinimumCheckPoints,
    };

    /// <summary>Evaluates the standard <paramref name="id"/> (canonical) on <paramref name="input"/>.</summary>
    public static StandardResult Evaluate(string id, StandardInput input) => id switch
    {
        AsprsId => AsprsEdition2.Evaluate(input),
        NmasId => Nmas1947.Evaluate(input),
        NgaId => NgaCircularError.Evaluate(input),
        _ => NssdaProfile.Evaluate(input),
    };

    internal static StandardFigure Figure(string name, string axis, double value, double? required, bool judged, string note, string unit = "m") =>
        new(name, axis, value, unit, required, required is { } r ? value <= r : null, judged, note);
}
