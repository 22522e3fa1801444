using System.Globalization;

namespace QaService.Core.Standards;

/// <summary>
/// United States National Map Accuracy Standards (Bureau of the Budget, 1947), as stated in the USGS map accuracy
/// leaflet (check-values §3, status V): horizontally, for maps at publication scales larger than 1:20,000 not more than
/// 10 % of the well-defined points tested may be in error by more than 1/30 inch at map scale; at 1:20,000 or smaller,
/// 1/50 inch. Vertically, not more than 10 % of the elevations tested may be in error by more than half the contour
/// interval. The test is a count of points over the tolerance (sample-based); the predictive CMAS = 2.1460·RMSE_r/√2
/// and VMAS = 1.6449·RMSE_z of FGDC-STD-007.3-1998's appendix on other standards are shown beside it (appendix from memory).
/// At least 20 check points (NSSDA practice; NMAS's own count from memory).
/// </summary>
public static class Nmas1947
{
    /// <summary>Inch, exactly 0.0254 m.</summary>
    public const double MetresPerInch = 0.0254;

    /// <summary>Scale denominators below this ("larger than 1:20,000") use 1/30 inch; the rest 1/50 inch.</summary>
    public const double LargeScaleLimitDenominator = 20_000;

    /// <summary>1/30 inch at publication scale (larger than 1:20,000).</summary>
    public const double LargeScaleToleranceInches = 1.0 / 30.0;

    /// <summary>1/50 inch at publication scale (1:20,000 or smaller).</summary>
    public const double SmallScaleToleranceInches = 1.0 / 50.0;

    /// <summary>At most 10 % of the points tested may exceed the tolerance (90 % confidence of the standard).</summary>
    public const double AllowedShareOverTolerance = 0.10;

    /// <summary>Fewest check points (NSSDA's 20; from memory for NMAS itself).</summary>
    public const int MinimumCheckPoints = 20;

    /// <summary>Horizontal tolerance on the ground, metres, for a 1:<paramref name="scaleDenominator"/> map (1:24,000 → 12.192 m).</summary>
    public static double HorizontalToleranceMetres(double scaleDenominator) =>
        scaleDenominator * MetresPerInch * (scaleDenominator < LargeScaleLimitDenominator ? LargeScaleToleranceInches : SmallScaleToleranceInches);

    public static StandardResult Evaluate(StandardInput input)
    {
        var figures = new List<StandardFigure>();
        var notes = new List<string>
        {
            "spec.mapScale (publication scale denominator) and spec.contourInterval (metres) set the tolerances; spec.horizontal/vertical are not used.",
            "The verdict rests on the share of check points over the tolerance (at most 10 %); CMAS and VMAS are predictive figures shown beside it.",
        };
        double? hTolerance = input.MapScaleDenominator is { } scale ? HorizontalToleranceMetres(scale) : null;
        double? vTolerance = input.ContourIntervalMetres is { } ci ? ci / 2.0 : null;
        string? hShare = null, vShare = null;
        if (input.Horizontal is { } h && hTolerance is { } ht)
        {
            double share = input.RadialMetres.Count(d => d > ht) / (double)input.RadialMetres.Count;
            figures.Add(AccuracyStandards.Figure("share over horizontal tolerance", "horizontal", share, AllowedShareOverTolerance, true,
                string.Create(CultureInfo.InvariantCulture, $"points with dH > {ht:F3} m ({(input.MapScaleDenominator < LargeScaleLimitDenominator ? "1/30" : "1/50")} inch at 1:{input.MapScaleDenominator:F0})"), "share"));
            figures.Add(AccuracyStandards.Figure("CMAS", "horizontal", Nmas.CmasFromRadialRmse(h.RmseR), ht, false, "predictive 90 % circle, 2.1460·RMSE_r/√2 (circular errors)"));
            hShare = share <= AllowedShareOverTolerance ? "complies" : "does not comply";
        }
        else if (input.Horizontal is not null)
            notes.Add("Horizontal not judged: spec.mapScale was not given.");
        if (input.Vertical is { } v && vTolerance is { } vt)
        {
            double share = input.AbsoluteVerticalMetres.Count(d => d > vt) / (double)input.AbsoluteVerticalMetres.Count;
            figures.Add(AccuracyStandards.Figure("share over vertical tolerance", "vertical", share, AllowedShareOverTolerance, true,
                string.Create(CultureInfo.InvariantCulture, $"points with |dU| > half the contour interval, {vt:F3} m"), "share"));
            figures.Add(AccuracyStandards.Figure("VMAS", "vertical", LinearError.Le90(v.Rmse), vt, false, "predictive 90 % linear error, 1.6449·RMSE_z"));
            vShare = share <= AllowedShareOverTolerance ? "complies" : "does not comply";
        }
        else if (input.Vertical is not null)
            notes.Add("Vertical not judged: spec.contourInterval was not given.");

        string statement;
        if (hShare is null && vShare is null)
            statement = "Not tested against National Map Accuracy Standards: give spec.mapScale and/or spec.contourInterval.";
        else
        {
            var parts = new List<string>();
            if (hShare is not null) parts.Add(string.Create(CultureInfo.InvariantCulture, $"horizontally {hShare} at 1:{input.MapScaleDenominator:F0}"));
            if (vShare is not null) parts.Add(string.Create(CultureInfo.InvariantCulture, $"vertically {vShare} for a {Units.Format(input.ContourIntervalMetres!.Value, input.Unit)} {input.Unit.PluralName} contour interval"));
            bool all = hShare != "does not comply" && vShare != "does not comply";
            statement = (all ? "This map complies with National Map Accuracy Standards" : "This map does not comply with National Map Accuracy Standards") + " (" + string.Join("; ", parts) + ").";
        }
        notes.Add("Statement wording after the customary NMAS legend, from memory.");
        return new StandardResult(AccuracyStandards.NmasId, "United States National Map Accuracy Standards", "1947 (Bureau of the Budget)",
            MinimumCheckPoints, figures, statement, notes);
    }
}
