using System.Globalization;

namespace QaService.Core.Standards;

/// <summary>
/// ASPRS Positional Accuracy Standards for Digital Geospatial Data, Edition 2, Version 1.0 (adopted 23 August 2023).
/// Read in published summaries of the edition (PE&amp;RS 89(10):581–588, doi:10.14358/PERS.89.10.581; GPS World, Dec
/// 2023): accuracy is reported as RMSE, references to 95 % confidence are gone; the check points' own survey accuracy is
/// folded into the product accuracy; at least 30 check points (at most 120); vegetated vertical accuracy is no longer
/// pass/fail; a three-dimensional accuracy is introduced.
/// From memory, not confirmed in the standard's text here (check-values §2, status M): RMSE_H = sqrt(RMSE_x² + RMSE_y²)
/// (a horizontal class "X-cm" means RMSE_H ≤ X, radial); the combination RMSE_H = sqrt(RMSE_H1² + RMSE_H2²) with H1 the
/// product-versus-check-point figure and H2 the check points' own survey RMSE, likewise RMSE_V = sqrt(RMSE_V1² + RMSE_V2²);
/// RMSE_3D = sqrt(RMSE_H² + RMSE_V²); the statement's wording.
/// </summary>
public static class AsprsEdition2
{
    /// <summary>At least 30 check points (Edition 2 change list, V2).</summary>
    public const int MinimumCheckPoints = 30;

    /// <summary>At most 120 check points for large projects (Edition 2 change list, V2).</summary>
    public const int MaximumCheckPoints = 120;

    public static StandardResult Evaluate(StandardInput input)
    {
        var figures = new List<StandardFigure>();
        var notes = new List<string>
        {
            "Edition 2 reports RMSE only; spec.horizontal is read as the required RMSE_H and spec.vertical as the required RMSE_V (non-vegetated), metres.",
            "RMSE_H/RMSE_V combination with the check points' own accuracy, RMSE_3D and the statement's wording are from memory (check-values.md §2, status M).",
            "Vegetated vertical accuracy (VVA) is not computed: the request carries no land-cover class per check point; Edition 2 no longer makes it pass/fail.",
        };
        double? rmseH = null, rmseV = null;
        if (input.Horizontal is { } h)
        {
            double h1 = h.RmseR;
            double? h2 = SurveyRmse(input.MarkSigmaHorizontalMetres, axes: 2);
            rmseH = h2 is { } s ? Math.Sqrt((h1 * h1) + (s * s)) : h1;
            figures.Add(AccuracyStandards.Figure("RMSE_H", "horizontal", rmseH.Value, input.RequiredHorizontalMetres, true,
                h2 is null ? "= RMSE_H1 (no mark declares sigmaH, so the check points' own accuracy is not folded in)" : "sqrt(RMSE_H1² + RMSE_H2²)"));
            figures.Add(AccuracyStandards.Figure("RMSE_H1", "horizontal", h1, null, false, "product against check points, sqrt(RMSE_x² + RMSE_y²)"));
            if (h2 is { } hv)
                figures.Add(AccuracyStandards.Figure("RMSE_H2", "horizontal", hv, null, false, "check points' own survey accuracy, sqrt(mean of 2·sigmaH²) over the tested marks"));
            if (h.N > MaximumCheckPoints)
                notes.Add(string.Create(CultureInfo.InvariantCulture, $"{h.N} check points: Edition 2 caps large projects at {MaximumCheckPoints}."));
        }
        if (input.Vertical is { } v)
        {
            double v1 = v.Rmse;
            double? v2 = SurveyRmse(input.MarkSigmaVerticalMetres, axes: 1);
            rmseV = v2 is { } s ? Math.Sqrt((v1 * v1) + (s * s)) : v1;
            figures.Add(AccuracyStandards.Figure("RMSE_V", "vertical", rmseV.Value, input.RequiredVerticalMetres, true,
                v2 is null ? "= RMSE_V1 (no mark declares sigmaV)" : "sqrt(RMSE_V1² + RMSE_V2²), non-vegetated (NVA)"));
            figures.Add(AccuracyStandards.Figure("RMSE_V1", "vertical", v1, null, false, "product against check points"));
            if (v2 is { } vv)
                figures.Add(AccuracyStandards.Figure("RMSE_V2", "vertical", vv, null, false, "check points' own survey accuracy, sqrt(mean sigmaV²)"));
        }
        if (rmseH is { } rh && rmseV is { } rv)
            figures.Add(AccuracyStandards.Figure("RMSE_3D", "3d", Math.Sqrt((rh * rh) + (rv * rv)), null, false, "sqrt(RMSE_H² + RMSE_V²)"));

        return new StandardResult(AccuracyStandards.AsprsId, "ASPRS Positional Accuracy Standards for Digital Geospatial Data",
            "Edition 2, Version 1.0 (August 2023)", MinimumCheckPoints, figures, Statement(input, rmseH, rmseV), notes);
    }

    /// <summary>RMS of the marks' declared sigmas (axes = 2 for a radial figure from per-axis σ); null unless every mark declares one.</summary>
    private static double? SurveyRmse(IReadOnlyList<double?> sigmas, int axes)
    {
        if (sigmas.Count == 0 || sigmas.Any(s => s is null))
            return null;
        return Math.Sqrt(sigmas.Average(s => axes * s!.Value * s.Value));
    }

    private static string Statement(StandardInput input, double? rmseH, double? rmseV)
    {
        var parts = new List<string>();
        if (rmseH is { } h)
            parts.Add(Sentence("horizontal", "RMSE_H", h, input.RequiredHorizontalMetres, input));
        if (rmseV is { } v)
            parts.Add(Sentence("vertical (non-vegetated)", "RMSE_V", v, input.RequiredVerticalMetres, input));
        return parts.Count == 0 ? "No accuracy tested: no fix could be paired with a mark" : string.Join(" ", parts);
    }

    private static string Sentence(string what, string symbol, double metres, double? required, StandardInput input)
    {
        string tested = Units.Format(metres, input.Unit);
        if (required is not { } r)
            return $"This data set was tested for ASPRS Positional Accuracy Standards for Digital Geospatial Data, Edition 2 (2023): {what} {symbol} = {tested} {input.Unit.PluralName}.";
        string verb = metres <= r ? "meets" : "does not meet";
        return $"This data set was tested against ASPRS Positional Accuracy Standards for Digital Geospatial Data, Edition 2 (2023), and {verb} the {Units.Format(r, input.Unit)} {input.Unit.PluralName} {symbol} {what} positional accuracy class: tested {symbol} = {tested} {input.Unit.PluralName}.";
    }
}
