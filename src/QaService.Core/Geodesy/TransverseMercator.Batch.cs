using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

namespace QaService.Core.Geodesy;

/// <summary>
/// Vectorised forward transverse Mercator: four points at a time in <see cref="Vector256{T}"/> lanes, the same
/// Karney (2011, doi:10.1007/s00190-011-0445-3) formulation as the scalar path with its transcendental functions
/// replaced by algebraic forms that vectorise:
/// <list type="bullet">
/// <item>τ′ = τ√(1 + σ²) − σ√(1 + τ²) (§2, eq. 7), σ = sinh(e·atanh(e sin φ)) with atanh and sinh by their series
/// (e sin φ ≤ e ≤ 0.1, so |e·atanh(e sin φ)| ≤ 0.011);</item>
/// <item>the Gauss–Schreiber step (§3, eqs. 9–10) from r = √(τ′² + cos²λ): sin ξ′ = τ′/r, cos ξ′ = cos λ/r,
/// sinh η′ = sin λ/r, cosh η′ = √(1 + τ′²)/r, hence η′ = ln((sin λ + √(1 + τ′²))/r) (asinh without cancellation for
/// λ ≥ 0) and ξ′ = atan(τ′/cos λ) (<see cref="VectorAtan"/>); the Clenshaw sum's sin/cos 2ξ′ and sinh/cosh 2η′ follow
/// by double-angle identities, with no further sin, cos or exp (the scheme of Karney's GeographicLib
/// <c>TransverseMercator::Forward</c>).</item>
/// </list>
/// sin, cos, ln, atanh and sinh are <see cref="VectorElementary"/>'s, made of IEEE-exact operations only, so a lane's bits
/// depend on its input alone, whatever the build, the runtime's recompilation or the lane (.NET's vector functions
/// did not give that: see there). Accuracy against PROJ 9.1.1 is tested on tests/reference-data/tm-utm-proj.tsv like
/// the scalar path (≤ 1e-6 m, the file's rounding); lanes at a pole, outside the domain or needing longitude
/// reduction fall back to the scalar method, which also raises its errors there.
/// </summary>
public sealed partial class TransverseMercator
{
    /// <summary>Whether <see cref="Forward(ReadOnlySpan{double}, ReadOnlySpan{double}, Span{double}, Span{double})"/> uses the vector kernel on this machine.</summary>
    internal static bool VectorKernelAvailable => Vector256.IsHardwareAccelerated;

    /// <summary>Largest first eccentricity the kernel's series cover (every Earth ellipsoid in EPSG is below 0.083).</summary>
    internal const double MaxKernelEccentricity = 0.1;

    /// <summary>Whether this projection's batches go through the vector kernel (the hardware has it, and e is in range).</summary>
    private bool UsesVectorKernel => VectorKernelAvailable && _eccentricity <= MaxKernelEccentricity;

    /// <summary>
    /// Projects every point through the vector kernel, a block of four at a time, the tail padded with the origin;
    /// lanes the kernel declines go through the scalar method (see <see cref="ForwardEach"/>).
    /// </summary>
    private void ForwardBlocks(ReadOnlySpan<double> latitudesDegrees, ReadOnlySpan<double> longitudesDegrees, Span<double> eastingsMetres, Span<double> northingsMetres, bool outsideAsNaN)
    {
        int width = Vector256<double>.Count;
        int count = latitudesDegrees.Length;
        int i = 0;
        for (; i + width <= count; i += width)
        {
            ForwardBlock(latitudesDegrees.Slice(i, width), longitudesDegrees.Slice(i, width), eastingsMetres.Slice(i, width), northingsMetres.Slice(i, width), outsideAsNaN);
        }

        int tail = count - i;
        if (tail == 0)
        {
            return;
        }

        Span<double> latitudes = stackalloc double[width];
        Span<double> longitudes = stackalloc double[width];
        Span<double> eastings = stackalloc double[width];
        Span<double> northings = stackalloc double[width];
        latitudes.Clear();
        longitudes.Fill(CentralMeridianDegrees);
        latitudesDegrees[i..].CopyTo(latitudes);
        longitudesDegrees[i..].CopyTo(longitudes);
        ForwardBlock(latitudes, longitudes, eastings, northings, outsideAsNaN);
        eastings[..tail].CopyTo(eastingsMetres[i..]);
        northings[..tail].CopyTo(northingsMetres[i..]);
    }

    /// <summary>
    /// One block of <see cref="Vector256{T}.Count"/> points. Lanes strictly inside the pole and the domain with no
    /// longitude reduction needed (NaN fails both tests) come from the kernel; the others are set to the origin for the
    /// kernel and then done by the scalar method, in lane order.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void ForwardBlock(ReadOnlySpan<double> latitudesDegrees, ReadOnlySpan<double> longitudesDegrees, Span<double> eastingsMetres, Span<double> northingsMetres, bool outsideAsNaN)
    {
        var quarterTurn = Vector256.Create(AngleMath.QuarterTurnDegrees);
        var lat = Vector256.Create(latitudesDegrees);
        var dLon = Vector256.Create(longitudesDegrees) - Vector256.Create(CentralMeridianDegrees);
        var inside = Vector256.LessThan(Vector256.Abs(lat), quarterTurn) & Vector256.LessThan(Vector256.Abs(dLon), quarterTurn);
        uint insideLanes = inside.ExtractMostSignificantBits();
        if (insideLanes == (1u << Vector256<double>.Count) - 1)
        {
            var (allEastings, allNorthings) = Kernel(lat, dLon);
            allEastings.CopyTo(eastingsMetres);
            allNorthings.CopyTo(northingsMetres);
            return;
        }

        // Declined lanes go through the kernel at the origin, keep what the output held, and are then written (or
        // raised) by the scalar method in lane order.
        var (easting, northing) = Kernel(Vector256.ConditionalSelect(inside, lat, Vector256<double>.Zero), Vector256.ConditionalSelect(inside, dLon, Vector256<double>.Zero));
        Vector256.ConditionalSelect(inside, easting, Vector256.Create(eastingsMetres)).CopyTo(eastingsMetres);
        Vector256.ConditionalSelect(inside, northing, Vector256.Create(northingsMetres)).CopyTo(northingsMetres);
        for (int lane = 0; lane < Vector256<double>.Count; lane++)
        {
            if ((insideLanes & (1u << lane)) == 0)
            {
                ForwardScalarInto(latitudesDegrees[lane], longitudesDegrees[lane], out eastingsMetres[lane], out northingsMetres[lane], outsideAsNaN);
            }
        }
    }

    /// <summary>The kernel on four lanes: |φ| &lt; 90° and |λ − λ0| &lt; 90°, degrees → easting and northing, metres.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private (Vector256<double> EastingMetres, Vector256<double> NorthingMetres) Kernel(Vector256<double> lat, Vector256<double> dLon)
    {
        var one = Vector256.Create(1.0);
        var two = Vector256.Create(2.0);
        var radiansPerDegree = Vector256.Create(AngleMath.RadiansPerDegree);
        var e = Vector256.Create(_eccentricity);
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

        var absLat = Vector256.Abs(lat);
        var absLon = Vector256.Abs(dLon);
        var latSign = lat & signBit;
        var lonSign = dLon & signBit;
        var (sinPhi, cosPhi) = VectorElementary.SinCosQuarterTurn(absLat * radiansPerDegree);
        var (sinLam, cosLam) = VectorElementary.SinCosQuarterTurn(absLon * radiansPerDegree);

        // Conformal latitude τ′ (Karney 2011 eq. 7), σ = sinh(e·atanh(e sin φ)) by series (e ≤ MaxKernelEccentricity).
        var tau = sinPhi / cosPhi;
        var tau1 = Vector256.Sqrt(one + (tau * tau));
        var eSinPhi = e * tau / tau1;
        var sigma = VectorElementary.SinhSmall(e * VectorElementary.AtanhSmall(eSinPhi));
        var tauP = (Vector256.Sqrt(one + (sigma * sigma)) * tau) - (sigma * tau1);

        // Gauss–Schreiber (Karney 2011 eqs. 9–10) algebraically.
        var tauP1 = Vector256.Sqrt(one + (tauP * tauP));
        var r = Vector256.Sqrt((tauP * tauP) + (cosLam * cosLam));
        var xiP = VectorAtan.NonNegative(tauP / cosLam);
        var etaP = VectorElementary.LogPositive((sinLam + tauP1) / r);
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

        return (((scale * eta) ^ lonSign) + falseEasting, ((scale * xi) ^ latSign) + northingOffset);
    }
}
