using System.Globalization;

namespace QaService.Core.Standards;

/// <summary>
/// CE90 / LE90 as NGA practice reports them (Dolloff &amp; Carr, NGA, "Computation of scalar accuracy metrics LE, CE, and
/// SE as both predictive and sample-based statistics"; check-values §3, V): predictive figures from the error
/// covariance — CE90 the exact 90 % radius of N(0, M) (the contract's <c>ce90</c>), LE90 = 1.6449·RMSE_z — and
/// sample-based figures from the order statistics of the check points (here the type-7 90th percentile of dH and |dU|;
/// the interpolation rule of the paper is not reproduced, from memory). spec.horizontal is read as the required CE90 and
/// spec.vertical as the required LE90, metres. The verdict rests on the predictive figures; the sample-based ones are shown.
/// </summary>
public static class NgaCircularError
{
    public static StandardResult Evaluate(StandardInput input)
    {
        var figures = new List<StandardFigure>();
        var parts = new List<string>();
        if (input.Horizontal is { } h)
        {
            figures.Add(AccuracyStandards.Figure("CE90", "horizontal", h.Ce90, input.RequiredHorizontalMetres, true, "predictive: exact 90 % radius of N(0, M), M the second moments about zero"));
            figures.Add(AccuracyStandards.Figure("CE90 sample", "horizontal", h.P90, input.RequiredHorizontalMetres, false, "sample-based: 90th percentile of dH (type 7)"));
            parts.Add(string.Create(CultureInfo.InvariantCulture, $"CE90 {Units.Format(h.Ce90, input.Unit)} {input.Unit.PluralName} (sample-based {Units.Format(h.P90, input.Unit)})"));
        }
        if (input.Vertical is { } v)
        {
            double sample = Statistics.Percentile.LinearInterpolation(input.AbsoluteVerticalMetres.ToArray(), 0.90);
            figures.Add(AccuracyStandards.Figure("LE90", "vertical", v.Le90, input.RequiredVerticalMetres, true, "predictive: 1.6449·RMSE_z"));
            figures.Add(AccuracyStandards.Figure("LE90 sample", "vertical", sample, input.RequiredVerticalMetres, false, "sample-based: 90th percentile of |dU| (type 7)"));
            parts.Add(string.Create(CultureInfo.InvariantCulture, $"LE90 {Units.Format(v.Le90, input.Unit)} {input.Unit.PluralName} (sample-based {Units.Format(sample, input.Unit)})"));
        }
        string statement = parts.Count == 0
            ? "No accuracy tested: no fix could be paired with a mark"
            : $"Tested {string.Join("; ", parts)} at 90 % probability.";
        return new StandardResult(AccuracyStandards.NgaId, "Circular and linear error at 90 % (CE90/LE90), NGA practice",
            "Dolloff & Carr (NGA), predictive and sample-based scalar accuracy metrics", Nssda.MinimumCheckPoints, figures, statement,
            ["spec.horizontal is the required CE90 and spec.vertical the required LE90, metres.",
             "Minimum of 20 check points taken from NSSDA; the sample-based interpolation rule is the service's (type 7)."]);
    }
}
