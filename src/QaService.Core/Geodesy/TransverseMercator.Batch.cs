using System.Runtime.Intrinsics;

namespace QaService.Core.Geodesy;

/// <summary>
/// Vectorised forward transverse Mercator: four points at a time in <see cref="Vector256{T}"/> lanes, the same
/// Karney (2011, doi:10.1007/s00190-011-0445-3) formulation as the scalar path with its transcendental functions
/// replaced by algebraic forms that vectorise:
/// <list type="bullet">
/// <item>τ′ = τ√(1 + σ²) − σ√(1 + τ²) (§2, eq. 7), σ = sinh(e·atanh(e sin φ)) with atanh x = ½ ln((1 + x)/(1 − x)) and
/// sinh y = (eʸ − e⁻ʸ)/2 (|y| ≤ e² ≈ 0.0067: absolute error ~1e-16, i.e. nanometres on the grid);</item>
/// <item>the Gauss–Schreiber step (§3, eqs. 9–10) from r = √(τ′² + cos²λ): sin ξ′ = τ′/r, cos ξ′ = cos λ/r,
/// sinh η′ = sin λ/r, cosh η′ = √(1 + τ′²)/r, hence η′ = ln((sin λ + √(1 + τ′²))/r) (asinh without cancellation for
/// λ ≥ 0) and ξ′ = atan(τ′/cos λ) (<see cref="VectorAtan"/>); the Clenshaw sum's sin/cos 2ξ′ and sinh/cosh 2η′ follow
/// by double-angle identities, with no further sin, cos or exp (the scheme of Karney's GeographicLib
/// <c>TransverseMercator::Forward</c>).</item>
/// </list>
/// sin, cos, exp and ln are .NET's <see cref="Vector256"/> implementations (ports of AMD's AOCL-LibM vector routines,
/// within a few ulp). Accuracy against PROJ 9.1.1 is tested on tests/reference-data/tm-utm-proj.tsv like the scalar
/// path (≤ 1e-6 m, the file's rounding); lanes at a pole, outside the domain or needing longitude reduction fall back
/// to the scalar method, which also raises its errors there.
/// </summary>
public sealed partial class TransverseMercator
{
    /// <summary>Whether <see cref="Forward(ReadOnlySpan{double}, ReadOnlySpan{double}, Span{double}, Span{double})"/> uses the vector kernel on this machine.</summary>
    internal static bool VectorKernelAvailable => Vector256.IsHardwareAccelerated;

    /// <summary>
    /// Projects whole blocks of four points with the vector kernel, from index 0 up; returns how many were done. A block
    /// holding a pole, a point outside the domain or a longitude needing reduction stops it (the scalar path continues).
    /// </summary>
    private int ForwardVector(ReadOnlySpan<double> latitudesDegrees, ReadOnlySpan<double> longitudesDegrees, Span<double> eastingsMetres, Span<double> northingsMetres)
    {
        int width = Vector256<double>.Count;
        var one = Vector256.Create(1.0);
        var half = Vector256.Create(0.5);
        var two = Vector256.Create(2.0);
        var radiansPerDegree = Vector256.Create(AngleMath.RadiansPerDegree);
        var e = Vector256.Create(_eccentricity);
        var centralMeridian = Vector256.Create(CentralMeridianDegrees);
        var quarterTurn = Vector256.Create(AngleMath.QuarterTurnDegrees);
        var scale = Vector256.Create(_scaledRectifyingRadiusMetres);
        var falseEasting = Vector256.Create(FalseEastingMetres);
        var northingOffset = Vector256.Create(FalseNorthingMetres - _originNorthingMetres);
        var a1 = Vector256.Create(_alpha[1]);
        var a2 = Vector256.Create(_alpha[2]);
        var a3 = Vector256.Create(_alpha[3]);
        var a4 = Vector256.Create(_alpha[4]);
        var a5 = Vector256.Create(_alpha[5]);
        var a6 = Vector256.Create(_alpha[6]);
        var signBit = Vector256.Create(-0.0);

        int i = 0;
        for (; i + width <= latitudesDegrees.Length; i += width)
        {
            var lat = Vector256.Create(latitudesDegrees.Slice(i, width));
            var dLon = Vector256.Create(longitudesDegrees.Slice(i, width)) - centralMeridian;
            var absLat = Vector256.Abs(lat);
            var absLon = Vector256.Abs(dLon);
            // Strictly inside the pole and the domain, and no reduction needed (NaN fails both comparisons).
            if (!Vector256.LessThanAll(absLat, quarterTurn) || !Vector256.LessThanAll(absLon, quarterTurn))
                break;

            var latSign = lat & signBit;
            var lonSign = dLon & signBit;
            var (sinPhi, cosPhi) = Vector256.SinCos(absLat * radiansPerDegree);
            var (sinLam, cosLam) = Vector256.SinCos(absLon * radiansPerDegree);

            // Conformal latitude τ′ (Karney 2011 eq. 7).
            var tau = sinPhi / cosPhi;
            var tau1 = Vector256.Sqrt(one + (tau * tau));
            var eSinPhi = e * tau / tau1;
            var expY = Vector256.Exp(e * half * Vector256.Log((one + eSinPhi) / (one - eSinPhi)));
            var sigma = half * (expY - (one / expY));
            var tauP = (Vector256.Sqrt(one + (sigma * sigma)) * tau) - (sigma * tau1);

            // Gauss–Schreiber (Karney 2011 eqs. 9–10) algebraically.
            var tauP1 = Vector256.Sqrt(one + (tauP * tauP));
            var r = Vector256.Sqrt((tauP * tauP) + (cosLam * cosLam));
            var xiP = VectorAtan.NonNegative(tauP / cosLam);
            var etaP = Vector256.Log((sinLam + tauP1) / r);
            var sinXi = tauP / r;
            var cosXi = cosLam / r;
            var sinhEta = sinLam / r;
            var coshEta = tauP1 / r;
            var s0 = two * sinXi * cosXi;                          // sin 2ξ′
            var c0 = (cosXi - sinXi) * (cosXi + sinXi);            // cos 2ξ′
            var sh0 = two * sinhEta * coshEta;                     // sinh 2η′
            var ch0 = (coshEta * coshEta) + (sinhEta * sinhEta);   // cosh 2η′

            // Clenshaw summation (Karney 2011 eqs. 45–46), as KrugerSeries.Sum with the α coefficients.
            var aRe = two * c0 * ch0;
            var aIm = -two * s0 * sh0;
            var y0Re = a6;
            var y0Im = Vector256<double>.Zero;
            var y1Re = (aRe * y0Re) + a5;       // b_5 (b_7 = 0)
            var y1Im = aIm * y0Re;
            (y0Re, y0Im) = ((aRe * y1Re) - (aIm * y1Im) - y0Re + a4, (aRe * y1Im) + (aIm * y1Re) - y0Im);
            (y1Re, y1Im) = ((aRe * y0Re) - (aIm * y0Im) - y1Re + a3, (aRe * y0Im) + (aIm * y0Re) - y1Im);
            (y0Re, y0Im) = ((aRe * y1Re) - (aIm * y1Im) - y0Re + a2, (aRe * y1Im) + (aIm * y1Re) - y0Im);
            (y1Re, y1Im) = ((aRe * y0Re) - (aIm * y0Im) - y1Re + a1, (aRe * y0Im) + (aIm * y0Re) - y1Im);
            var sRe = s0 * ch0;
            var sIm = c0 * sh0;
            var xi = xiP + ((sRe * y1Re) - (sIm * y1Im));
            var eta = etaP + ((sRe * y1Im) + (sIm * y1Re));

            (((scale * eta) ^ lonSign) + falseEasting).CopyTo(eastingsMetres.Slice(i, width));
            (((scale * xi) ^ latSign) + northingOffset).CopyTo(northingsMetres.Slice(i, width));
        }

        return i;
    }
}
