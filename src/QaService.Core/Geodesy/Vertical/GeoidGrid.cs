namespace QaService.Core.Geodesy.Vertical;

/// <summary>
/// A geoid model as a regular latitude/longitude grid of undulations N (metres above the ellipsoid),
/// interpolated bilinearly as PROJ's <c>vgridshift</c> does: N at (φ, λ) from the four surrounding nodes,
/// weighted by the fractional position in the cell (EPSG Guidance Note 7-2 (IOGP 373-7-2) §4.4.4
/// "Geographic3D to GravityRelatedHeight", bilinear interpolation of a grid file).
/// </summary>
/// <remarks>
/// Units: angles in degrees, N in metres. Nodes run from the south-west corner, row by row northwards, west to east.
/// A grid spanning 360° of longitude wraps around; otherwise a point outside the grid (or next to a node marked
/// missing) has no value (NaN). Orthometric and ellipsoidal heights are related by h = H + N.
/// Interpolation adds no error beyond the model's own (EGM96 15′: commission error about 0.5–1 m, NGA); between the
/// nodes the bilinear surface differs from other interpolants (bicubic, spline) by up to a few centimetres in rough terrain.
/// </remarks>
public sealed class GeoidGrid
{
    /// <summary>GTX grids mark missing nodes with exactly −88.8888 m as float32 (PROJ's GTX reader tests the same value).</summary>
    public const float MissingValueMetres = -88.8888f;

    private const double FullTurnDegrees = 360.0;
    private readonly float[] _values;

    /// <param name="name">Model name, e.g. "EGM96 15′".</param>
    /// <param name="southLatitudeDegrees">Latitude of the first row, degrees.</param>
    /// <param name="westLongitudeDegrees">Longitude of the first column, degrees.</param>
    /// <param name="latitudeStepDegrees">Row spacing, degrees, &gt; 0.</param>
    /// <param name="longitudeStepDegrees">Column spacing, degrees, &gt; 0.</param>
    /// <param name="rows">Number of rows (≥ 2).</param>
    /// <param name="columns">Number of columns (≥ 2).</param>
    /// <param name="valuesMetres">rows × columns undulations, metres, row-major from the south-west.</param>
    public GeoidGrid(string name, double southLatitudeDegrees, double westLongitudeDegrees, double latitudeStepDegrees,
        double longitudeStepDegrees, int rows, int columns, float[] valuesMetres)
    {
        if (!(latitudeStepDegrees > 0) || !(longitudeStepDegrees > 0) || rows < 2 || columns < 2 || valuesMetres.Length != (long)rows * columns)
            throw new ArgumentException("grid dimensions do not match its values");
        Name = name;
        SouthLatitudeDegrees = southLatitudeDegrees;
        WestLongitudeDegrees = westLongitudeDegrees;
        LatitudeStepDegrees = latitudeStepDegrees;
        LongitudeStepDegrees = longitudeStepDegrees;
        Rows = rows;
        Columns = columns;
        _values = valuesMetres;
        WrapsInLongitude = Math.Abs(columns * longitudeStepDegrees - FullTurnDegrees) < longitudeStepDegrees * 1e-6;
    }

    public string Name { get; }
    public double SouthLatitudeDegrees { get; }
    public double WestLongitudeDegrees { get; }
    public double LatitudeStepDegrees { get; }
    public double LongitudeStepDegrees { get; }
    public int Rows { get; }
    public int Columns { get; }

    /// <summary>True when the columns cover the whole circle of longitude (the column after the last is the first).</summary>
    public bool WrapsInLongitude { get; }

    /// <summary>Geoid undulation N in metres at a point, or NaN outside the grid or beside a missing node.</summary>
    public double UndulationMetres(double latitudeDegrees, double longitudeDegrees)
    {
        var row = (latitudeDegrees - SouthLatitudeDegrees) / LatitudeStepDegrees;
        var column = (longitudeDegrees - WestLongitudeDegrees) / LongitudeStepDegrees;
        if (WrapsInLongitude)
        {
            column %= Columns;
            if (column < 0)
                column += Columns;
        }
        if (!(row >= 0 && row <= Rows - 1) || !(column >= 0 && (WrapsInLongitude ? column < Columns : column <= Columns - 1)))
            return double.NaN;

        var r0 = Math.Min((int)row, Rows - 2);
        var c0 = Math.Min((int)column, WrapsInLongitude ? Columns - 1 : Columns - 2);
        var c1 = c0 + 1 == Columns ? 0 : c0 + 1;
        var fr = row - r0;
        var fc = column - c0;
        double v00 = _values[r0 * Columns + c0], v01 = _values[r0 * Columns + c1];
        double v10 = _values[(r0 + 1) * Columns + c0], v11 = _values[(r0 + 1) * Columns + c1];
        if (IsMissing(v00) || IsMissing(v01) || IsMissing(v10) || IsMissing(v11))
            return double.NaN;
        return (1 - fr) * ((1 - fc) * v00 + fc * v01) + fr * ((1 - fc) * v10 + fc * v11);
    }

    private static bool IsMissing(double value) => (float)value == MissingValueMetres;
}
