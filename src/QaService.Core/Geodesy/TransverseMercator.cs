namespace QaService.Core.Geodesy;

/// <summary>
/// Transverse Mercator projection (EPSG method 9807) evaluated with the Krüger series to 6th order in the
/// third flattening n, exactly as described by C. F. F. Karney (2011), "Transverse Mercator with an accuracy
/// of a few nanometers", J. Geodesy 85(8):475–485, doi:10.1007/s00190-011-0445-3: geodetic → conformal
/// latitude via τ/τ′, Gauss–Schreiber (spherical) TM of the conformal sphere, then the α series
/// (Clenshaw summation in complex arithmetic) to the Gauss–Krüger TM; the inverse uses the β series and
/// Newton's method for τ.
/// </summary>
/// <remarks>
/// <para>Units: angles in degrees, lengths in metres, scale factor dimensionless.</para>
/// <para>
/// Domain: any latitude in [−90°, 90°] and longitude with |λ − λ0| &lt; 90° (the hemisphere centred on the
/// central meridian). Longitudes are reduced modulo 360°.
/// </para>
/// <para>
/// Accuracy: Karney (2011) gives the truncation error of the 6th-order series as ≤ 5 nm
/// within 3900 km of the central meridian (about 35° of longitude at the equator), growing steadily beyond
/// that; the series remains finite but is increasingly wrong near |λ − λ0| → 90° on the equator, where the
/// projection itself is singular. Measured in this repository against GeographicLib 2.1.2's exact TM
/// (<c>TransverseMercatorProj</c>, Lee's elliptic-function formulation) on latitudes 0–84° — see
/// tests/reference-data/tm-exact-geographiclib.tsv: ≤ 4e-9 m (file rounding 1e-9 m; Karney's 5 nm) out to 40° from the central
/// meridian, 1.2e-7 m at 50°, 1.1e-5 m at 60°, 4.8 mm at 70° (UTM k0 = 0.9996). Against PROJ 9.1.1
/// (<c>cs2cs</c>, whose UTM uses the same 6th-order series) the agreement is ≤ 7e-7 m, i.e. the 1e-6 m rounding of
/// the reference file, over 2 400 points up to 12° from the central meridian and up to ±84° latitude.
/// </para>
/// <para>Instances are immutable and thread-safe.</para>
/// </remarks>
public sealed partial class TransverseMercator : IMapProjection
{
    /// <inheritdoc />
    public string MethodName => "Transverse Mercator";

    private readonly double _eccentricity;
    private readonly double _scaledRectifyingRadiusMetres; // k0·A
    private readonly double _originNorthingMetres;          // k0·A·ξ(φ0, 0)
    private readonly double[] _alpha;
    private readonly double[] _beta;

    /// <summary>Creates a transverse Mercator projection.</summary>
    /// <param name="ellipsoid">Ellipsoid (a in metres; oblate or spherical).</param>
    /// <param name="centralMeridianDegrees">Longitude of natural origin λ0, degrees, finite.</param>
    /// <param name="scaleFactor">Scale factor on the central meridian k0, dimensionless, finite and &gt; 0.</param>
    /// <param name="falseEastingMetres">False easting FE, metres, finite.</param>
    /// <param name="falseNorthingMetres">False northing FN, metres, finite.</param>
    /// <param name="latitudeOfOriginDegrees">Latitude of natural origin φ0, degrees, [−90, 90]; the northing of
    /// (φ0, λ0) is FN (EPSG Guidance Note 7-2, method 9807: N = FN + k0(M − M0), M the meridian arc).</param>
    /// <exception cref="ArgumentOutOfRangeException">Any parameter outside the ranges above.</exception>
    public TransverseMercator(Ellipsoid ellipsoid, double centralMeridianDegrees, double scaleFactor, double falseEastingMetres, double falseNorthingMetres, double latitudeOfOriginDegrees = 0)
    {
        ellipsoid.Validate(nameof(ellipsoid));
        AngleMath.ValidateFinite(centralMeridianDegrees, nameof(centralMeridianDegrees));
        if (!(double.IsFinite(scaleFactor) && scaleFactor > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(scaleFactor), scaleFactor, "Scale factor must be finite and positive.");
        }

        AngleMath.ValidateFinite(falseEastingMetres, nameof(falseEastingMetres));
        AngleMath.ValidateFinite(falseNorthingMetres, nameof(falseNorthingMetres));
        AngleMath.ValidateLatitude(latitudeOfOriginDegrees, nameof(latitudeOfOriginDegrees));

        Ellipsoid = ellipsoid;
        CentralMeridianDegrees = centralMeridianDegrees;
        ScaleFactor = scaleFactor;
        FalseEastingMetres = falseEastingMetres;
        FalseNorthingMetres = falseNorthingMetres;
        LatitudeOfOriginDegrees = latitudeOfOriginDegrees;

        double n = ellipsoid.ThirdFlattening;
        _eccentricity = ellipsoid.FirstEccentricity;
        _scaledRectifyingRadiusMetres = scaleFactor * KrugerSeries.RectifyingRadiusMetres(ellipsoid.SemiMajorAxisMetres, n);
        _alpha = KrugerSeries.Alpha(n);
        _beta = KrugerSeries.Beta(n);
        _originNorthingMetres = 0;
        _originNorthingMetres = ForwardUnshifted(latitudeOfOriginDegrees, 0).NorthingMetres;
    }

    /// <summary>The ellipsoid.</summary>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>Longitude of the central meridian λ0, degrees.</summary>
    public double CentralMeridianDegrees { get; }

    /// <summary>Scale factor on the central meridian k0 (dimensionless).</summary>
    public double ScaleFactor { get; }

    /// <summary>False easting, metres.</summary>
    public double FalseEastingMetres { get; }

    /// <summary>False northing, metres.</summary>
    public double FalseNorthingMetres { get; }

    /// <summary>Latitude of natural origin φ0, degrees.</summary>
    public double LatitudeOfOriginDegrees { get; }

    /// <summary>
    /// Largest accepted |λ − λ0|, degrees (exclusive): the projection maps the hemisphere centred on the central
    /// meridian; at 90° on the equator easting is infinite.
    /// </summary>
    public const double MaxLongitudeOffsetDegrees = AngleMath.QuarterTurnDegrees;

    /// <summary>Projects a geodetic position to grid coordinates (see the class remarks for accuracy).</summary>
    /// <param name="latitudeDegrees">Geodetic latitude φ, degrees, [−90, 90].</param>
    /// <param name="longitudeDegrees">Longitude λ, degrees, finite, with |λ − λ0| (mod 360) &lt; 90.</param>
    /// <returns>Easting and northing in metres, including false easting/northing.</returns>
    /// <exception cref="ArgumentOutOfRangeException">Latitude or longitude outside the domain.</exception>
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double dLon = AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, CentralMeridianDegrees);
        if (!(Math.Abs(dLon) < MaxLongitudeOffsetDegrees))
        {
            throw new ArgumentOutOfRangeException(nameof(longitudeDegrees), longitudeDegrees, "Longitude must be within 90 degrees of the central meridian.");
        }

        ProjectedCoordinate xy = ForwardUnshifted(latitudeDegrees, dLon);
        return new ProjectedCoordinate(xy.EastingMetres + FalseEastingMetres, xy.NorthingMetres - _originNorthingMetres + FalseNorthingMetres);
    }

    /// <summary>
    /// Batch form of <see cref="Forward(double, double)"/>; allocation-free. Element i of the outputs is the
    /// projection of element i of the inputs, and the same bits whatever else is in the batch or where element i sits
    /// in it (see <see cref="ForwardEach"/>). Same units, domain and accuracy as the single-point method.
    /// </summary>
    /// <param name="latitudesDegrees">Latitudes, degrees.</param>
    /// <param name="longitudesDegrees">Longitudes, degrees; same length as <paramref name="latitudesDegrees"/>.</param>
    /// <param name="eastingsMetres">Output eastings, metres; at least as long as the inputs.</param>
    /// <param name="northingsMetres">Output northings, metres; at least as long as the inputs.</param>
    /// <exception cref="ArgumentException">Span lengths inconsistent.</exception>
    /// <exception cref="ArgumentOutOfRangeException">An input outside the domain (outputs before it are already written).</exception>
    public void Forward(ReadOnlySpan<double> latitudesDegrees, ReadOnlySpan<double> longitudesDegrees, Span<double> eastingsMetres, Span<double> northingsMetres)
        => ForwardEach(latitudesDegrees, longitudesDegrees, eastingsMetres, northingsMetres, outsideAsNaN: false);

    /// <summary>
    /// As <see cref="Forward(ReadOnlySpan{double}, ReadOnlySpan{double}, Span{double}, Span{double})"/>, but a point
    /// outside the domain (or not finite) gets NaN easting and northing instead of an error, and the rest are projected.
    /// </summary>
    /// <exception cref="ArgumentException">Span lengths inconsistent.</exception>
    public void ForwardOrNaN(ReadOnlySpan<double> latitudesDegrees, ReadOnlySpan<double> longitudesDegrees, Span<double> eastingsMetres, Span<double> northingsMetres)
        => ForwardEach(latitudesDegrees, longitudesDegrees, eastingsMetres, northingsMetres, outsideAsNaN: true);

    /// <summary>
    /// Where the vector kernel runs (TransverseMercator.Batch.cs), every point inside its domain goes through it, also
    /// in a block shared with a point it declines and in the short tail (padded to a full block); only the declined
    /// points (a pole, outside the domain, a longitude to reduce) take the scalar method. The kernel and the scalar
    /// method differ by a few ulp, so this choice per point (not per position) is what keeps a point's bits
    /// independent of how a large request is cut into ranges and blocks.
    /// </summary>
    private void ForwardEach(ReadOnlySpan<double> latitudesDegrees, ReadOnlySpan<double> longitudesDegrees, Span<double> eastingsMetres, Span<double> northingsMetres, bool outsideAsNaN)
    {
        if (longitudesDegrees.Length != latitudesDegrees.Length)
        {
            throw new ArgumentException("Latitude and longitude spans must have the same length.", nameof(longitudesDegrees));
        }

        if (eastingsMetres.Length < latitudesDegrees.Length || northingsMetres.Length < latitudesDegrees.Length)
        {
            throw new ArgumentException("Output spans must be at least as long as the input spans.", nameof(eastingsMetres));
        }

        if (UsesVectorKernel)
        {
            ForwardBlocks(latitudesDegrees, longitudesDegrees, eastingsMetres, northingsMetres, outsideAsNaN);
            return;
        }

        for (int i = 0; i < latitudesDegrees.Length; i++)
        {
            ForwardScalarInto(latitudesDegrees[i], longitudesDegrees[i], out eastingsMetres[i], out northingsMetres[i], outsideAsNaN);
        }
    }

    /// <summary>The scalar method for one element of a batch: an error, or NaN when <paramref name="outsideAsNaN"/>.</summary>
    private void ForwardScalarInto(double latitudeDegrees, double longitudeDegrees, out double eastingMetres, out double northingMetres, bool outsideAsNaN)
    {
        if (outsideAsNaN && !InDomain(latitudeDegrees, longitudeDegrees))
        {
            eastingMetres = northingMetres = double.NaN;
            return;
        }

        ProjectedCoordinate en = Forward(latitudeDegrees, longitudeDegrees);
        eastingMetres = en.EastingMetres;
        northingMetres = en.NorthingMetres;
    }

    /// <summary>Whether <see cref="Forward(double, double)"/> accepts the point (the same tests, without the throw).</summary>
    private bool InDomain(double latitudeDegrees, double longitudeDegrees)
        => Math.Abs(latitudeDegrees) <= AngleMath.QuarterTurnDegrees && double.IsFinite(longitudeDegrees)
           && Math.Abs(AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, CentralMeridianDegrees)) < MaxLongitudeOffsetDegrees;

    /// <summary>
    /// Inverse projection: grid coordinates → geodetic latitude and longitude (Karney 2011 §5: β series, then
    /// Newton's method for τ).
    /// </summary>
    /// <param name="eastingMetres">Easting E, metres, finite.</param>
    /// <param name="northingMetres">Northing N, metres, finite.</param>
    /// <returns>Latitude in degrees [−90, 90] and longitude in degrees, reduced to [−180, 180].</returns>
    /// <remarks>
    /// Accurate to the same few nanometres as <see cref="Forward(double, double)"/> for grid coordinates that are
    /// images of the forward domain within 3900 km of the central meridian. Grid points outside the image of the
    /// hemisphere |λ − λ0| &lt; 90° (e.g. |N − FN| beyond the meridian quadrant) return a point mirrored across the
    /// pole or equator rather than an error. Grid coordinates so far out that the series overflows
    /// (|E − FE| ≳ 150 k0·a) are rejected.
    /// </remarks>
    /// <exception cref="ArgumentOutOfRangeException">A non-finite input, or one for which the series overflows.</exception>
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));

        double xi = (northingMetres - FalseNorthingMetres + _originNorthingMetres) / _scaledRectifyingRadiusMetres;
        double eta = (eastingMetres - FalseEastingMetres) / _scaledRectifyingRadiusMetres;

        // Work in the first quadrant and restore signs at the end: exact odd symmetry in ξ and η.
        double xiSign = double.IsNegative(xi) ? -1 : 1;
        double etaSign = double.IsNegative(eta) ? -1 : 1;
        xi *= xiSign;
        eta *= etaSign;

        (double xiP, double etaP) = KrugerSeries.Sum(_beta, -1.0, xi, eta);
        double sinhEtaP = Math.Sinh(etaP);
        (double sinXiP, double cosXiP) = Math.SinCos(xiP);
        cosXiP = Math.Max(0.0, cosXiP); // cos(π/2) may round negative
        double r = double.Hypot(sinhEtaP, cosXiP);

        double latitudeDegrees, dLonDegrees;
        if (r != 0)
        {
            dLonDegrees = Math.Atan2(sinhEtaP, cosXiP) / AngleMath.RadiansPerDegree;
            double tau = ConformalLatitude.TauFromTauPrime(sinXiP / r, _eccentricity);
            latitudeDegrees = Math.Atan(tau) / AngleMath.RadiansPerDegree;
        }
        else
        {
            latitudeDegrees = AngleMath.QuarterTurnDegrees;
            dLonDegrees = 0;
        }

        if (!(double.IsFinite(latitudeDegrees) && double.IsFinite(dLonDegrees)))
        {
            throw new ArgumentOutOfRangeException(nameof(eastingMetres), eastingMetres, "Grid coordinates are outside the range where the inverse series can be evaluated.");
        }

        double longitudeDegrees = Math.IEEERemainder(CentralMeridianDegrees + (etaSign * dLonDegrees), AngleMath.FullTurnDegrees);
        return (xiSign * latitudeDegrees, longitudeDegrees);
    }

    /// <summary>Karney (2011) forward map without false origin: returns (k0·A·η, k0·A·ξ) in metres.</summary>
    /// <param name="latitudeDegrees">φ, degrees, [−90, 90].</param>
    /// <param name="dLonDegrees">λ − λ0, degrees, |·| &lt; 90.</param>
    private ProjectedCoordinate ForwardUnshifted(double latitudeDegrees, double dLonDegrees)
    {
        // Work in the first quadrant and restore signs at the end: exact odd symmetry in φ and Δλ.
        double latSign = double.IsNegative(latitudeDegrees) ? -1 : 1;
        double lonSign = double.IsNegative(dLonDegrees) ? -1 : 1;
        double phi = latSign * latitudeDegrees;
        double lam = lonSign * dLonDegrees;

        (double sinLam, double cosLam) = AngleMath.SinCosDegrees(lam);
        double xiP, etaP;
        if (phi != AngleMath.QuarterTurnDegrees)
        {
            (double sinPhi, double cosPhi) = AngleMath.SinCosDegrees(phi);
            double tauP = ConformalLatitude.TauPrime(sinPhi / cosPhi, _eccentricity);
            xiP = Math.Atan2(tauP, cosLam);
            etaP = Math.Asinh(sinLam / double.Hypot(tauP, cosLam));
        }
        else
        {
            xiP = Math.PI / 2;
            etaP = 0;
        }

        (double xi, double eta) = KrugerSeries.Sum(_alpha, 1.0, xiP, etaP);
        return new ProjectedCoordinate(
            lonSign * _scaledRectifyingRadiusMetres * eta,
            latSign * _scaledRectifyingRadiusMetres * xi);
    }
}
