namespace QaService.Core.Geodesy;

/// <summary>
/// Coefficients of the Krüger series for the transverse Mercator projection, to 6th order in the third
/// flattening n, from C. F. F. Karney (2011), "Transverse Mercator with an accuracy of a few nanometers",
/// J. Geodesy 85(8):475–485, doi:10.1007/s00190-011-0445-3:
/// rectifying radius A eq. (14), forward coefficients α_j eq. (35), inverse coefficients β_j eq. (36).
/// The rational numbers below are transcribed exactly from those equations.
/// </summary>
internal static class KrugerSeries
{
    /// <summary>Order of the series in n (Karney 2011 uses 6 for ≈ 5 nm accuracy within 3900 km of the central meridian).</summary>
    internal const int Order = 6;

    /// <summary>
    /// Rectifying radius A = a/(1 + n) · (1 + n²/4 + n⁴/64 + n⁶/256) (Karney 2011 eq. 14), metres.
    /// </summary>
    /// <param name="semiMajorAxisMetres">a, metres.</param>
    /// <param name="n">Third flattening n (dimensionless).</param>
    internal static double RectifyingRadiusMetres(double semiMajorAxisMetres, double n)
    {
        double n2 = n * n;
        return semiMajorAxisMetres / (1.0 + n) * (1.0 + (n2 * ((1.0 / 4.0) + (n2 * ((1.0 / 64.0) + (n2 / 256.0))))));
    }

    /// <summary>
    /// Forward coefficients α_1..α_6 (Karney 2011 eq. 35), returned in a 7-element array with index 0 unused.
    /// </summary>
    /// <param name="n">Third flattening n.</param>
    internal static double[] Alpha(double n)
    {
        double n2 = n * n, n3 = n2 * n, n4 = n3 * n, n5 = n4 * n, n6 = n5 * n;
        return
        [
            0.0,
            (n / 2) - (2 * n2 / 3) + (5 * n3 / 16) + (41 * n4 / 180) - (127 * n5 / 288) + (7891 * n6 / 37800),
            (13 * n2 / 48) - (3 * n3 / 5) + (557 * n4 / 1440) + (281 * n5 / 630) - (1983433 * n6 / 1935360),
            (61 * n3 / 240) - (103 * n4 / 140) + (15061 * n5 / 26880) + (167603 * n6 / 181440),
            (49561 * n4 / 161280) - (179 * n5 / 168) + (6601661 * n6 / 7257600),
            (34729 * n5 / 80640) - (3418889 * n6 / 1995840),
            212378941 * n6 / 319334400,
        ];
    }

    /// <summary>
    /// Inverse coefficients β_1..β_6 (Karney 2011 eq. 36), returned in a 7-element array with index 0 unused.
    /// </summary>
    /// <param name="n">Third flattening n.</param>
    internal static double[] Beta(double n)
    {
        double n2 = n * n, n3 = n2 * n, n4 = n3 * n, n5 = n4 * n, n6 = n5 * n;
        return
        [
            0.0,
            (n / 2) - (2 * n2 / 3) + (37 * n3 / 96) - (n4 / 360) - (81 * n5 / 512) + (96199 * n6 / 604800),
            (n2 / 48) + (n3 / 15) - (437 * n4 / 1440) + (46 * n5 / 105) - (1118711 * n6 / 3870720),
            (17 * n3 / 480) - (37 * n4 / 840) - (209 * n5 / 4480) + (5569 * n6 / 90720),
            (4397 * n4 / 161280) - (11 * n5 / 504) - (830251 * n6 / 7257600),
            (4583 * n5 / 161280) - (108847 * n6 / 3991680),
            20648693 * n6 / 638668800,
        ];
    }

    /// <summary>
    /// Clenshaw summation of ζ + Σ_{j=1..6} c_j sin(2jζ) for complex ζ = ξ + iη (Karney 2011 §5, eqs. 45–46,
    /// after Clenshaw 1955), where sin/cos of 2ζ are supplied in real/imaginary parts. Used with c = α
    /// for the forward map (ζ′ → ζ) and with c = −β for the inverse (ζ → ζ′).
    /// </summary>
    /// <param name="coefficients">c_0..c_6 with c_0 unused.</param>
    /// <param name="sign">+1 to add the coefficients, −1 to subtract them.</param>
    /// <param name="xi">Real part ξ (radians).</param>
    /// <param name="eta">Imaginary part η (dimensionless).</param>
    /// <returns>Real and imaginary parts of the sum.</returns>
    internal static (double Xi, double Eta) Sum(double[] coefficients, double sign, double xi, double eta)
    {
        (double s0, double c0) = Math.SinCos(2 * xi);
        // cosh and sinh from one exponential (half the cost of Math.Cosh + Math.Sinh); for small η, sinh loses relative but
        // not absolute precision (~2e-16), which after the coefficients (≤ n/2 ≈ 8.4e-4) is below 1e-12 m on the grid.
        double exp2Eta = Math.Exp(2 * eta), expMinus2Eta = 1.0 / exp2Eta;
        double ch0 = 0.5 * (exp2Eta + expMinus2Eta), sh0 = 0.5 * (exp2Eta - expMinus2Eta);

        // a = 2 cos(2ζ) = 2 (cos2ξ cosh2η − i sin2ξ sinh2η)
        double aRe = 2 * c0 * ch0, aIm = -2 * s0 * sh0;

        // Recurrence b_k = a b_{k+1} − b_{k+2} + c_k, from k = Order down to 1; Order is even, so start with b_{Order+1} = 0.
        double y0Re = 0, y0Im = 0, y1Re = 0, y1Im = 0;
        for (int j = Order; j > 0; j -= 2)
        {
            double nextRe = (aRe * y0Re) - (aIm * y0Im) - y1Re + (sign * coefficients[j]);
            double nextIm = (aRe * y0Im) + (aIm * y0Re) - y1Im;
            y1Re = nextRe;
            y1Im = nextIm;

            nextRe = (aRe * y1Re) - (aIm * y1Im) - y0Re + (sign * coefficients[j - 1]);
            nextIm = (aRe * y1Im) + (aIm * y1Re) - y0Im;
            y0Re = nextRe;
            y0Im = nextIm;
        }

        // Σ c_j sin(2jζ) = sin(2ζ) · b_1, sin(2ζ) = sin2ξ cosh2η + i cos2ξ sinh2η.
        double sRe = s0 * ch0, sIm = c0 * sh0;
        return (xi + ((sRe * y0Re) - (sIm * y0Im)), eta + ((sRe * y0Im) + (sIm * y0Re)));
    }
}
