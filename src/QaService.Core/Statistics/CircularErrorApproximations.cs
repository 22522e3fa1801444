using QaService.Core.Standards;

namespace QaService.Core.Statistics;

/// <summary>
/// One rule of thumb beside the exact figure it stands in for.
/// </summary>
/// <param name="Name">Stable id, e.g. <c>cep-0.5887</c>.</param>
/// <param name="Formula">The rule as written, σ₁ ≥ σ₂ the principal standard deviations of the second-moment matrix.</param>
/// <param name="Value">The rule's value, metres.</param>
/// <param name="ComparedWith">Which exact report figure it approximates (<c>cep50</c>, <c>r95</c>).</param>
/// <param name="Exact">That exact figure, metres.</param>
/// <param name="RelativeError">(Value − Exact)/Exact.</param>
/// <param name="Probability">For DRMS and 2DRMS: the exact probability their circle holds for these residuals; else null.</param>
/// <param name="ValidRange">Where the rule holds and how well (σ₂/σ₁ ranges; errors computed, check-values §4).</param>
/// <param name="WithinRange">Whether this data set's σ₂/σ₁ lies in that range.</param>
/// <param name="Source">Where the rule comes from and how sure the attribution is.</param>
public sealed record Approximation(
    string Name, string Formula, double Value, string ComparedWith, double Exact, double RelativeError,
    double? Probability, string ValidRange, bool WithinRange, string Source);

/// <summary>
/// The usual circular-error rules of thumb, each set beside the exact value the report computes, with its validity range
/// (check-values.md §4: rows "CEP ≈ 0.5887(σx + σy)", "0.615σmin + 0.562σmax", "2DRMS 95.45–98.17 %", the
/// FGDC-STD-007.2-1998 K polynomial, and §1 "NSSDA case 2"). The exact values are never replaced by these.
/// </summary>
public static class CircularErrorApproximations
{
    /// <summary>CEP ≈ 0.5887(σ₁ + σ₂) (NRC GPS report quotes 0.589; attribution of 0.5887 from memory).</summary>
    public const double CepSumFactor = 0.5887;

    /// <summary>CEP ≈ 0.615σmin + 0.562σmax (attribution from memory; errors computed, check-values §4).</summary>
    public const double CepMinorFactor = 0.615, CepMajorFactor = 0.562;

    /// <summary>FGDC-STD-007.2-1998 95 % circle r95 = K·σmax, K = 1.960790 + 0.004071C + 0.114276C² + 0.371625C³ (from memory).</summary>
    public const double K0 = 1.960790, K1 = 0.004071, K2 = 0.114276, K3 = 0.371625;

    /// <summary>σ₂/σ₁ from which the CEP rules hold to a few per cent (check-values §4, computed).</summary>
    public const double CepRuleRatioLimit = 0.3;

    /// <summary>The rows for residuals with the given second moments and exact figures.</summary>
    /// <param name="meanSquareE">Σ dE²/n, m².</param>
    /// <param name="meanSquareN">Σ dN²/n, m².</param>
    /// <param name="meanProductEN">Σ dE·dN/n, m².</param>
    /// <param name="exact">The exact horizontal block (cep50, r95, drms, twoDrms).</param>
    public static IReadOnlyList<Approximation> For(double meanSquareE, double meanSquareN, double meanProductEN, HorizontalAccuracy exact)
    {
        var (s1, s2) = PrincipalAxes.FromSecondMoments(meanSquareE, meanSquareN, meanProductEN);
        if (s1 == 0.0)
            return [];
        double q = s2 / s1;
        double rmseRatio = Math.Min(exact.RmseE, exact.RmseN) / Math.Max(exact.RmseE, exact.RmseN);
        double k = K0 + (K1 * q) + (K2 * q * q) + (K3 * q * q * q);
        Approximation Row(string name, string formula, double value, string comparedWith, double exactValue, double? probability,
            string range, bool within, string source) =>
            new(name, formula, value, comparedWith, exactValue, exactValue > 0 ? (value - exactValue) / exactValue : 0.0, probability, range, within, source);

        return
        [
            Row("cep-0.5887", "0.5887·(σ1 + σ2)", CepSumFactor * (s1 + s2), "cep50", exact.Cep50, null,
                "σ2/σ1 ≥ 0.3: within about +2.1 % (worst at 0.3); −12.7 % at σ2/σ1 = 0", q >= CepRuleRatioLimit,
                "NRC GPS report quotes 0.589(σN + σE) (V); the 0.5887 form from memory; errors computed (check-values §4)"),
            Row("cep-0.615-0.562", "0.615·σmin + 0.562·σmax", (CepMinorFactor * s2) + (CepMajorFactor * s1), "cep50", exact.Cep50, null,
                "σ2/σ1 ≥ 0.3: within ±0.5 %", q >= CepRuleRatioLimit,
                "attribution from memory; errors computed (check-values §4)"),
            Row("nssda-case-2", "2.4477·0.5·(rmseE + rmseN)", Nssda.HorizontalFactor * 0.5 * (exact.RmseE + exact.RmseN), "r95", exact.R95, null,
                "rmse ratio 0.6–1.0 without correlation: −5.9 % at 0.6, −0.3 % at 0.9; −14.5 % at 0.4",
                rmseRatio >= Nssda.ApproximationRatioLimit,
                "FGDC-STD-007.3-1998 appendix 3-A case 2 (wording from memory); errors computed (check-values §1)"),
            Row("fgdc-007.2-k", "K·σmax, K = 1.960790 + 0.004071C + 0.114276C² + 0.371625C³, C = σmin/σmax", k * s1, "r95", exact.R95, null,
                "all σ2/σ1: within ±0.17 %", true,
                "FGDC-STD-007.2-1998 (geodetic networks), polynomial from memory; error bound computed (check-values §4)"),
            Row("drms", "sqrt(rmseE² + rmseN²)", exact.Drms, "r95", exact.R95, CircleProbability.ZeroMean(exact.Drms, s1, s2),
                "holds 63.2 % (circular) to 68.3 % (one-dimensional) of the errors, never a fixed probability", true,
                "check-values §4 (V2; probabilities computed)"),
            Row("2drms", "2·sqrt(rmseE² + rmseN²)", exact.TwoDrms, "r95", exact.R95, CircleProbability.ZeroMean(exact.TwoDrms, s1, s2),
                "holds 95.45 % (one-dimensional) to 98.17 % (circular) of the errors; NRC GPS report 95.5–98.2 %", true,
                "check-values §4 (V; probabilities computed)"),
        ];
    }
}
