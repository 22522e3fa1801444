using QaService.Core.Geodesy;

namespace QaService.Core.Assessment;

/// <summary>
/// The marks within the pairing radius of one fix, found through a uniform grid on the marks' unit normals
/// (n-vectors) instead of by testing every mark. Grid cells are cubes in the 3D space of the unit normal, so the
/// antimeridian and the poles are ordinary places; only the candidates the grid returns are measured, each by exactly
/// the test <see cref="WithinRadius"/> that a test of every mark would apply, so the answer is the same bit for bit.
/// Reads only after construction: one instance serves many threads.
/// </summary>
/// <remarks>
/// Why the grid misses no mark. On the surface at height h above an ellipsoid whose smallest radius of curvature is
/// ρ = b²/a (the meridian radius at the equator, a(1 − e²); EPSG Guidance Note 7-2 §4.1.1 gives the radii), every
/// principal radius is at least ρ + h, so the surface is a convex body with a ball of radius ρ + h as a Minkowski
/// summand (Blaschke's rolling theorem; R. Schneider, Convex Bodies: The Brunn–Minkowski Theory, 2nd ed. 2014, §3.2,
/// from memory). For such a body the tangent-plane (horizontal) distance at the mark to a point whose normal makes an
/// angle θ ≤ 90° with the mark's normal is at least (ρ + h)·sin θ (support-point argument: the summand's part of the
/// difference has a non-negative horizontal component toward the point). So a fix within radius r of a mark at height
/// h has sin θ ≤ r / (ρ + h), and its normal lies within the chord 2·sin(θ/2) of the mark's; the grid's cell is at
/// least that chord, so the cells touched by a ball of that chord around the fix's normal hold every such mark.
/// Fixes on the far side of the Earth (θ ≥ 90°) are never within the radius (<see cref="WithinRadius"/>).
/// </remarks>
internal sealed class MarkNeighbourhood
{
    /// <summary>Added to the radius before bounding the angle, metres: covers the few-nanometre rounding of the exact test many times over.</summary>
    private const double RadiusSlackMetres = 1e-3;

    /// <summary>Relative widening of the chord bound, for the rounding of the unit normals (≈ 1e-16 each).</summary>
    private const double ChordRelativeSlack = 1e-9;

    /// <summary>
    /// Largest sin θ the grid is used for (θ = 30°); beyond it (a tiny ellipsoid or marks thousands of kilometres below
    /// it) every mark is a candidate, which is slow but exact.
    /// </summary>
    private const double LargestIndexedSine = 0.5;

    /// <summary>Smallest cell edge in normal-vector units (2^−19, about 12 m on the Earth), so cell numbers fit 21 bits per axis.</summary>
    private const double SmallestCellEdge = 1.0 / (1 << 19);

    /// <summary>Offset that makes every cell number (|n| ≤ 1, so |cell| ≤ 2^19 + 2) non-negative within 21 bits.</summary>
    private const long CellOffset = 1L << 20;

    private const int CellBits = 21;

    private readonly IReadOnlyList<FramedPoint> marks;
    private readonly Ellipsoid ellipsoid;
    private readonly double radiusMetres;
    private readonly TopocentricFrame[] frames;
    private readonly UnitNormal[] normals;

    // Null when every mark is a candidate; otherwise the marks sorted by cell (ascending mark row within a cell) and
    // each occupied cell's slice of them.
    private readonly Dictionary<long, (int Start, int Count)>? cells;
    private readonly int[] marksByCell = [];
    private readonly double cellEdge, chord;

    /// <param name="marks">The marks, in the marks' geodetic frame.</param>
    /// <param name="markGeocentric">The same marks, geocentric X, Y, Z in metres on <paramref name="ellipsoid"/>.</param>
    /// <param name="ellipsoid">The marks' ellipsoid.</param>
    /// <param name="radiusMetres">Pairing radius in metres, finite and &gt; 0.</param>
    public MarkNeighbourhood(IReadOnlyList<FramedPoint> marks, IReadOnlyList<GeocentricCoordinate> markGeocentric, Ellipsoid ellipsoid, double radiusMetres)
    {
        this.marks = marks;
        this.ellipsoid = ellipsoid;
        this.radiusMetres = radiusMetres;
        frames = new TopocentricFrame[marks.Count];
        normals = new UnitNormal[marks.Count];
        var lowestHeightMetres = 0.0;
        for (var i = 0; i < marks.Count; i++)
        {
            frames[i] = TopocentricFrame.At(markGeocentric[i], marks[i].Geodetic);
            normals[i] = UnitNormal.Of(marks[i].Geodetic);
            lowestHeightMetres = Math.Min(lowestHeightMetres, marks[i].Geodetic.EllipsoidalHeightMetres);
        }

        var a = ellipsoid.SemiMajorAxisMetres;
        var smallestRadiusOfCurvatureMetres = a * (1.0 - ellipsoid.FirstEccentricitySquared);
        var sine = (radiusMetres + RadiusSlackMetres) / (smallestRadiusOfCurvatureMetres + lowestHeightMetres);
        if (!(sine > 0 && sine <= LargestIndexedSine))
            return;
        chord = 2.0 * Math.Sin(Math.Asin(sine) / 2.0) * (1.0 + ChordRelativeSlack);
        cellEdge = Math.Max(chord, SmallestCellEdge);

        var keys = new long[marks.Count];
        marksByCell = new int[marks.Count];
        for (var i = 0; i < marks.Count; i++)
        {
            keys[i] = Key(Cell(normals[i].X), Cell(normals[i].Y), Cell(normals[i].Z));
            marksByCell[i] = i;
        }
        Array.Sort(keys, marksByCell);
        SortRowsWithinCells(keys);
        cells = [];
        for (var start = 0; start < keys.Length;)
        {
            var end = start + 1;
            while (end < keys.Length && keys[end] == keys[start])
                end++;
            cells[keys[start]] = (start, end - start);
            start = end;
        }
    }

    /// <summary>
    /// The nearest mark within the radius (ties: the lowest row) and, when more than one is within it, the ids of the
    /// others in row order; (−1, null) when none is.
    /// </summary>
    /// <param name="fix">The fix, in the marks' geodetic frame.</param>
    /// <param name="candidates">Scratch list owned by the calling thread.</param>
    public (int Nearest, List<string>? Others) Nearest(FramedPoint fix, List<int> candidates) => Nearest(fix.Geodetic, candidates);

    /// <summary>As <see cref="Nearest(FramedPoint, List{int})"/>, for a fix position read from a column.</summary>
    public (int Nearest, List<string>? Others) Nearest(GeodeticCoordinate fix, List<int> candidates)
    {
        var fixNormal = UnitNormal.Of(fix);
        Candidates(fixNormal, candidates);
        var best = -1;
        var bestDistance = double.PositiveInfinity;
        var within = 0;
        for (var c = 0; c < candidates.Count; c++)
        {
            var row = candidates[c];
            if (!WithinRadius(fix, fixNormal, row, out var distance))
            {
                candidates[c] = -1;
                continue;
            }
            within++;
            if (distance < bestDistance)
            {
                best = row;
                bestDistance = distance;
            }
        }
        if (within < 2)
            return (best, null);
        var others = new List<string>(within - 1);
        foreach (var row in candidates)
        {
            if (row >= 0 && row != best)
                others.Add(marks[row].Id);
        }
        return (best, others);
    }

    /// <summary>
    /// The pairing test: the fix, taken at the mark's height (so height differences do not count, common practice), is
    /// within the radius horizontally in the mark's east-north-up frame (EPSG method 9836), and lies on the mark's side
    /// of the Earth (normals less than 90° apart), where the tangent-plane distance grows with the distance on the ground.
    /// </summary>
    /// <param name="distanceMetres">The horizontal distance in metres.</param>
    private bool WithinRadius(GeodeticCoordinate fix, UnitNormal fixNormal, int row, out double distanceMetres)
    {
        var mark = marks[row];
        var fixAtMarkHeight = fix with { EllipsoidalHeightMetres = mark.Geodetic.EllipsoidalHeightMetres };
        var enu = frames[row].Difference(GeocentricConversion.ToGeocentric(fixAtMarkHeight, ellipsoid));
        distanceMetres = Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres);
        return !(distanceMetres > radiusMetres) && fixNormal.Dot(normals[row]) > 0;
    }

    /// <summary>Fills <paramref name="candidates"/> with the rows of every mark that may be within the radius, ascending.</summary>
    private void Candidates(UnitNormal fixNormal, List<int> candidates)
    {
        candidates.Clear();
        if (cells is null)
        {
            for (var i = 0; i < marks.Count; i++)
                candidates.Add(i);
            return;
        }
        var (x0, x1) = (Cell(fixNormal.X - chord), Cell(fixNormal.X + chord));
        var (y0, y1) = (Cell(fixNormal.Y - chord), Cell(fixNormal.Y + chord));
        var (z0, z1) = (Cell(fixNormal.Z - chord), Cell(fixNormal.Z + chord));
        var cellsHit = 0;
        for (var x = x0; x <= x1; x++)
        for (var y = y0; y <= y1; y++)
        for (var z = z0; z <= z1; z++)
        {
            if (!cells.TryGetValue(Key(x, y, z), out var slice))
                continue;
            cellsHit++;
            for (var k = slice.Start; k < slice.Start + slice.Count; k++)
                candidates.Add(marksByCell[k]);
        }
        if (cellsHit > 1)
            candidates.Sort();
    }

    private long Cell(double component) => (long)Math.Floor(component / cellEdge);

    private static long Key(long x, long y, long z) =>
        ((x + CellOffset) << (2 * CellBits)) | ((y + CellOffset) << CellBits) | (z + CellOffset);

    /// <summary>Array.Sort is not stable: put each run of equal keys back into row order.</summary>
    private void SortRowsWithinCells(long[] keys)
    {
        for (var start = 0; start < keys.Length;)
        {
            var end = start + 1;
            while (end < keys.Length && keys[end] == keys[start])
                end++;
            if (end - start > 1)
                Array.Sort(marksByCell, start, end - start);
            start = end;
        }
    }

    /// <summary>The outward unit normal of the ellipsoid at a geodetic position (cos φ cos λ, cos φ sin λ, sin φ); dimensionless.</summary>
    private readonly record struct UnitNormal(double X, double Y, double Z)
    {
        public static UnitNormal Of(GeodeticCoordinate p)
        {
            var (sinPhi, cosPhi) = AngleMath.SinCosDegrees(p.LatitudeDegrees);
            var (sinLam, cosLam) = AngleMath.SinCosDegrees(p.LongitudeDegrees);
            return new UnitNormal(cosPhi * cosLam, cosPhi * sinLam, sinPhi);
        }

        public double Dot(UnitNormal other) => X * other.X + Y * other.Y + Z * other.Z;
    }
}
