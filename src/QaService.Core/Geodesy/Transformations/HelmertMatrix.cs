namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// A 7-parameter Helmert transformation ready to apply: X' = T + M·R·X (EPSG Guidance Note 7-2
/// (IOGP 373-7-2) §4.3.3, methods 1032/1033), with the small-angle rotation matrix of the guidance note,
/// as PROJ's <c>+proj=helmert</c> builds it without <c>+exact</c>:
/// coordinate frame R = [[1, rz, −ry], [−rz, 1, rx], [ry, −rx, 1]]; position vector Rᵀ (rotations in radians).
/// </summary>
/// <remarks>
/// Units: translations metres, rotations arc-seconds, scale parts per million; coordinates geocentric metres.
/// The reverse direction is PROJ's: X = Rᵀ·(X' − T)/M, the exact inverse up to second order in the
/// angles (the small-angle R is not orthogonal: for |r| ≤ 5″ the difference from an exact rotation, and
/// from R's true inverse, is below about 2 mm at the Earth's surface; for ITRF frame changes, ≤ 30 mas, below 0.1 mm).
/// Valid for rotations of a few arc-seconds, the range EPSG publishes such transformations for.
/// </remarks>
public readonly struct HelmertMatrix
{
    /// <summary>Radians per arc-second, π/648 000.</summary>
    public const double RadiansPerArcSecond = Math.PI / 648_000.0;

    /// <summary>Parts per million as a fraction.</summary>
    private const double PerPpm = 1e-6;

    private readonly double _r00, _r01, _r02, _r10, _r11, _r12, _r20, _r21, _r22;
    private readonly double _tx, _ty, _tz, _scale;

    /// <summary>Builds the matrix; see <see cref="HelmertParameters"/> for the units.</summary>
    public HelmertMatrix(HelmertConvention convention, double txMetres, double tyMetres, double tzMetres,
        double rxArcSeconds, double ryArcSeconds, double rzArcSeconds, double scalePpm)
    {
        var rx = rxArcSeconds * RadiansPerArcSecond;
        var ry = ryArcSeconds * RadiansPerArcSecond;
        var rz = rzArcSeconds * RadiansPerArcSecond;
        // Coordinate frame rotation matrix (GN 7-2 §4.3.3, method 1032); position vector is its transpose.
        var sign = convention == HelmertConvention.CoordinateFrame ? 1.0 : -1.0;
        _r00 = 1; _r01 = sign * rz; _r02 = -sign * ry;
        _r10 = -sign * rz; _r11 = 1; _r12 = sign * rx;
        _r20 = sign * ry; _r21 = -sign * rx; _r22 = 1;
        _tx = txMetres; _ty = tyMetres; _tz = tzMetres;
        _scale = 1.0 + scalePpm * PerPpm;
    }

    /// <summary>Source → target, geocentric metres.</summary>
    public void Forward(ref double x, ref double y, ref double z)
    {
        var nx = _scale * (_r00 * x + _r01 * y + _r02 * z) + _tx;
        var ny = _scale * (_r10 * x + _r11 * y + _r12 * z) + _ty;
        var nz = _scale * (_r20 * x + _r21 * y + _r22 * z) + _tz;
        x = nx; y = ny; z = nz;
    }

    /// <summary>Target → source, geocentric metres (transposed rotation, as PROJ's reverse Helmert).</summary>
    public void Reverse(ref double x, ref double y, ref double z)
    {
        var dx = x - _tx;
        var dy = y - _ty;
        var dz = z - _tz;
        x = (_r00 * dx + _r10 * dy + _r20 * dz) / _scale;
        y = (_r01 * dx + _r11 * dy + _r21 * dz) / _scale;
        z = (_r02 * dx + _r12 * dy + _r22 * dz) / _scale;
    }

    /// <summary>Forward on a coordinate record.</summary>
    public GeocentricCoordinate Forward(GeocentricCoordinate p)
    {
        var (x, y, z) = (p.XMetres, p.YMetres, p.ZMetres);
        Forward(ref x, ref y, ref z);
        return new GeocentricCoordinate(x, y, z);
    }

    /// <summary>Reverse on a coordinate record.</summary>
    public GeocentricCoordinate Reverse(GeocentricCoordinate p)
    {
        var (x, y, z) = (p.XMetres, p.YMetres, p.ZMetres);
        Reverse(ref x, ref y, ref z);
        return new GeocentricCoordinate(x, y, z);
    }
}
