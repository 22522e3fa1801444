using QaService.Core.Assessment;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Catalog.Wkt;

namespace QaService.Core.Tests.Assessment;

/// <summary>
/// Proximity pairing (api-v1 "A fix without mark is paired with the nearest mark within pairing.radius metres") held
/// to a plain test of every mark against every fix, written here from the contract: the same pairs in fix order, the
/// same ambiguity lists in mark order, ties to the first mark, the same unpaired count. Marks and fixes are invented
/// and drawn from seeded generators in several shapes: one town, a continent, across the antimeridian, at both poles,
/// duplicated positions, fixes outside every radius, far-side fixes.
/// </summary>
public sealed class MarkPairingTests
{
    private const double EarthRadiusMetres = 6_371_000.0;
    private const double MetresPerDegree = EarthRadiusMetres * Math.PI / 180.0;

    private static readonly PointSetFrame Wgs84Frame = Frame(CrsCatalog.ByCode(4979)!);

    /// <summary>What api-v1 defines, written without any index: for each fix, every mark in order.</summary>
    private static (List<MarkFixPair> Pairs, int Unpaired) Reference(ValidatedAssessment input, IReadOnlyList<FramedPoint>? fixesSubset = null)
    {
        var ellipsoid = input.MarksFrame.Crs.Ellipsoid;
        var markXyz = input.Marks.Select(m => GeocentricConversion.ToGeocentric(m.Geodetic, ellipsoid)).ToArray();
        var pairs = new List<MarkFixPair>();
        var unpaired = 0;
        foreach (var fix in fixesSubset ?? input.Fixes)
        {
            var named = input.Marks.FirstOrDefault(m => m.Id == fix.MarkId);
            if (named is not null)
            {
                pairs.Add(new MarkFixPair(named, fix, MarkPairing.ById));
                continue;
            }
            var within = new List<(int Row, double Distance)>();
            if (input.PairingRadiusMetres is { } radius)
            {
                for (var i = 0; i < input.Marks.Count; i++)
                {
                    var mark = input.Marks[i];
                    // Horizontal distance in the mark's east-north-up frame, the fix taken at the mark's height.
                    var fixXyz = GeocentricConversion.ToGeocentric(fix.Geodetic with { EllipsoidalHeightMetres = mark.Geodetic.EllipsoidalHeightMetres }, ellipsoid);
                    var enu = LocalTangentPlane.Difference(markXyz[i], mark.Geodetic, fixXyz);
                    var horizontal = Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres);
                    // A point on the far side of the Earth can project onto the mark's tangent plane near the mark; it is
                    // thousands of kilometres away, so not "within the radius".
                    var straight = Math.Sqrt(horizontal * horizontal + enu.UpMetres * enu.UpMetres);
                    if (horizontal <= radius && straight < ellipsoid.SemiMajorAxisMetres)
                        within.Add((i, horizontal));
                }
            }
            if (within.Count == 0)
            {
                unpaired++;
                continue;
            }
            var best = within.MinBy(w => w.Distance); // the first of equals
            var others = within.Where(w => w.Row != best.Row).Select(w => input.Marks[w.Row].Id).ToList();
            pairs.Add(new MarkFixPair(input.Marks[best.Row], fix, MarkPairing.ByProximity, others.Count == 0 ? null : others));
        }
        return (pairs, unpaired);
    }

    private static void AssertSame((List<MarkFixPair> Pairs, int Unpaired) expected, (IReadOnlyList<MarkFixPair> Pairs, int Unpaired) actual)
    {
        Assert.Equal(expected.Unpaired, actual.Unpaired);
        Assert.Equal(expected.Pairs.Count, actual.Pairs.Count);
        for (var i = 0; i < expected.Pairs.Count; i++)
        {
            var (e, a) = (expected.Pairs[i], actual.Pairs[i]);
            Assert.Same(e.Fix, a.Fix);
            Assert.True(ReferenceEquals(e.Mark, a.Mark), $"pair {i} (fix {e.Fix.Id}): expected mark {e.Mark.Id}, got {a.Mark.Id}");
            Assert.Equal(e.PairedBy, a.PairedBy);
            Assert.Equal(e.AlsoWithinRadius, a.AlsoWithinRadius);
        }
    }

    private static void AssertMatchesReference(ValidatedAssessment input)
    {
        var markXyz = input.Marks.Select(m => GeocentricConversion.ToGeocentric(m.Geodetic, input.MarksFrame.Crs.Ellipsoid)).ToArray();
        var actual = MarkPairing.Pair(input, markXyz);
        AssertSame(Reference(input), actual);
        // The rows handed to the residual stage name each pair's mark and fix, in the reference's order.
        var rows = MarkPairing.PairByRows(input, markXyz);
        var reference = Reference(input);
        Assert.Equal(reference.Pairs.Select(p => p.Mark), rows.MarkRows.Select(r => input.Marks[r]));
        Assert.Equal(reference.Pairs.Select(p => p.Fix), rows.FixRows.Select(r => input.Fixes[r]));
    }

    [Theory]
    [InlineData(1, 5.0)]
    [InlineData(2, 0.5)]
    [InlineData(3, 50.0)]
    public void One_town_with_marks_closer_than_the_radius(int seed, double radiusMetres)
    {
        var random = new Random(seed);
        var marks = Marks(300, _ => (48.75 + random.NextDouble() * 0.05, 15.0 + random.NextDouble() * 0.07, 200 + random.NextDouble() * 300));
        AssertMatchesReference(Input(marks, FixesAround(marks, 2000, radiusMetres, random), radiusMetres));
    }

    [Theory]
    [InlineData(11)]
    [InlineData(12)]
    public void Continent_at_the_largest_radius(int seed)
    {
        var random = new Random(seed);
        var radius = RequestValidator.MaximumPairingRadiusMetres;
        var marks = Marks(1200, _ => (30 + random.NextDouble() * 40, -10 + random.NextDouble() * 60, -50 + random.NextDouble() * 4000));
        AssertMatchesReference(Input(marks, FixesAround(marks, 2000, radius, random), radius));
    }

    [Theory]
    [InlineData(21)]
    [InlineData(22)]
    public void Across_the_antimeridian_in_any_longitude_spelling(int seed)
    {
        var random = new Random(seed);
        var marks = Marks(400, _ => (-17 + random.NextDouble() * 0.02, Spell(180 + (random.NextDouble() - 0.5) * 0.03, random), random.NextDouble() * 50));
        var fixes = FixesAround(marks, 2000, 10.0, random).Select(f => f with { Geodetic = f.Geodetic with { LongitudeDegrees = Spell(f.Geodetic.LongitudeDegrees, random) } }).ToList();
        AssertMatchesReference(Input(marks, fixes, 10.0));
    }

    [Theory]
    [InlineData(31, 90.0)]
    [InlineData(32, -90.0)]
    public void Around_a_pole(int seed, double poleDegrees)
    {
        var random = new Random(seed);
        var sign = Math.Sign(poleDegrees);
        // Within about 400 m of the pole, including the pole itself under several longitudes.
        var marks = Marks(200, i => (i % 10 == 0 ? poleDegrees : sign * (90 - random.NextDouble() * 0.004), random.NextDouble() * 720 - 360, random.NextDouble() * 10));
        var fixes = Enumerable.Range(0, 2000).Select(i => Fix(i, sign * (90 - random.NextDouble() * 0.005), random.NextDouble() * 360 - 180, random.NextDouble() * 10)).ToList();
        fixes.Add(Fix(fixes.Count, poleDegrees, 0, 3));
        AssertMatchesReference(Input(marks, fixes, 20.0));
    }

    [Fact]
    public void Duplicate_marks_tie_to_the_first_and_name_the_others_in_order()
    {
        var random = new Random(41);
        var places = Enumerable.Range(0, 50).Select(_ => (48.0 + random.NextDouble() * 0.01, 9.0 + random.NextDouble() * 0.01)).ToArray();
        var marks = Marks(300, i => (places[i % 50].Item1, places[i % 50].Item2, 100.0 + i % 7));
        var fixes = FixesAround(marks, 1500, 3.0, random);
        // Fixes exactly on a duplicated place: every copy is at distance zero.
        fixes.AddRange(places.Select((p, i) => Fix(fixes.Count + i, p.Item1, p.Item2, 100)));
        var input = Input(marks, fixes, 3.0);
        AssertMatchesReference(input);

        var onPlace = MarkPairing.Pair(input, input.Marks.Select(m => GeocentricConversion.ToGeocentric(m.Geodetic, Ellipsoid.Wgs84)).ToArray())
            .Pairs.First(p => p.Fix.Id == fixes[^1].Id);
        Assert.Equal("M0049", onPlace.Mark.Id);
        Assert.Equal(Enumerable.Range(1, 5).Select(k => $"M{49 + 50 * k:0000}"), onPlace.AlsoWithinRadius!.Take(5));
    }

    [Fact]
    public void A_fix_exactly_at_the_radius_is_within_it()
    {
        var mark = Marks(1, _ => (52.1, 5.2, 10.0));
        var fix = Fix(0, 52.1 + 3.0 / MetresPerDegree, 5.2 + 2.0 / MetresPerDegree, 12.0);
        var xyz = GeocentricConversion.ToGeocentric(mark[0].Geodetic, Ellipsoid.Wgs84);
        var enu = LocalTangentPlane.Difference(xyz, mark[0].Geodetic,
            GeocentricConversion.ToGeocentric(fix.Geodetic with { EllipsoidalHeightMetres = 10.0 }, Ellipsoid.Wgs84));
        var distance = Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres);

        Assert.Single(MarkPairing.Pair(Input(mark, [fix], distance), [xyz]).Pairs);
        Assert.Empty(MarkPairing.Pair(Input(mark, [fix], Math.BitDecrement(distance)), [xyz]).Pairs);
    }

    [Fact]
    public void Fixes_outside_every_radius_named_marks_and_unknown_names()
    {
        var random = new Random(51);
        var marks = Marks(500, _ => (40 + random.NextDouble(), -3 + random.NextDouble(), 600));
        var fixes = new List<FramedPoint>();
        for (var i = 0; i < 1500; i++)
        {
            var (lat, lon) = (40 + random.NextDouble(), -3 + random.NextDouble());
            var markId = (i % 3) switch { 0 => null, 1 => marks[random.Next(marks.Count)].Id, _ => "NO-SUCH-MARK" };
            fixes.Add(new FramedPoint(i, $"F{i:00000}", markId, new GeodeticCoordinate(lat, lon, 600), true, null, null, null));
        }
        AssertMatchesReference(Input(marks, fixes, 2.0));
        AssertMatchesReference(Input(marks, fixes, null));
    }

    [Fact]
    public void A_fix_on_the_far_side_of_the_Earth_is_not_within_the_radius()
    {
        // The normal at (0°, 0°) passes through the centre and leaves at (0°, 180°): there the fix projects onto the
        // mark's tangent plane at the mark itself, 12,756 km away.
        var marks = Marks(2, i => (0.0, 90.0 * i, 0.0));
        var input = Input(marks, [Fix(0, 0.0, 180.0, 0.0), Fix(1, 0.0, -90.0, 0.0), Fix(2, 0.0, 1e-6, 0.0)], 5.0);
        AssertMatchesReference(input);
        var (pairs, unpaired) = MarkPairing.Pair(input, input.Marks.Select(m => GeocentricConversion.ToGeocentric(m.Geodetic, Ellipsoid.Wgs84)).ToArray());
        Assert.Equal(2, unpaired);
        Assert.Equal("M0000", Assert.Single(pairs).Mark.Id);
    }

    [Theory]
    [InlineData("SPHEROID[\"Bessel 1841\",6377397.155,299.1528128]", 0.0)]
    [InlineData("SPHEROID[\"Authalic sphere\",6371007.181,0]", 0.0)]
    // Marks far below the ellipsoid (the grid's angle bound loosens), and deeper than its smallest radius of curvature
    // (the bound does not hold, so every mark is measured).
    [InlineData("SPHEROID[\"Bessel 1841\",6377397.155,299.1528128]", -5_000_000.0)]
    [InlineData("SPHEROID[\"Bessel 1841\",6377397.155,299.1528128]", -7_000_000.0)]
    public void Other_ellipsoids_and_deep_marks(string spheroid, double baseHeightMetres)
    {
        var crs = WktCrsReader.Read($"GEOGCS[\"Invented\",DATUM[\"Invented datum\",{spheroid}],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]]").Crs!;
        var random = new Random(61);
        var marks = Marks(300, _ => (60 + random.NextDouble() * 0.05, 25 + random.NextDouble() * 0.1, baseHeightMetres + random.NextDouble() * 100));
        AssertMatchesReference(Input(marks, FixesAround(marks, 1500, 8.0, random), 8.0, Frame(crs)));
    }

    /// <summary>A large upload completes, and a sample of its fixes pairs as the plain test of every mark says.</summary>
    [Fact]
    public void Large_upload_agrees_with_the_plain_test_on_a_sample()
    {
        var random = new Random(71);
        var marks = Marks(5000, _ => (45 + random.NextDouble() * 0.5, 7 + random.NextDouble() * 0.7, 300 + random.NextDouble() * 100));
        var fixes = FixesAround(marks, 100_000, 5.0, random);
        var input = Input(marks, fixes, 5.0);
        var actual = MarkPairing.Pair(input, marks.Select(m => GeocentricConversion.ToGeocentric(m.Geodetic, Ellipsoid.Wgs84)).ToArray());

        var sample = Enumerable.Range(0, 400).Select(_ => fixes[random.Next(fixes.Count)]).Distinct().OrderBy(f => f.Index).ToList();
        var (expectedPairs, expectedUnpaired) = Reference(input, sample);
        var sampled = sample.Select(f => f.Index).ToHashSet();
        var actualPairs = actual.Pairs.Where(p => sampled.Contains(p.Fix.Index)).ToList();
        AssertSame((expectedPairs, expectedUnpaired), (actualPairs, sample.Count - actualPairs.Count));
        Assert.Equal(fixes.Count, actual.Pairs.Count + actual.Unpaired);
        Assert.InRange(actual.Unpaired, 1, fixes.Count - 1);
    }

    private static PointSetFrame Frame(CoordinateReferenceSystem crs) => new(crs, HeightReference.Ellipsoidal, null, null, true);

    private static ValidatedAssessment Input(IReadOnlyList<FramedPoint> marks, IReadOnlyList<FramedPoint> fixes, double? radiusMetres, PointSetFrame? frame = null) =>
        new("pairing", frame ?? Wgs84Frame, frame ?? Wgs84Frame, marks, fixes, null, radiusMetres, new Dictionary<string, string>());

    private static List<FramedPoint> Marks(int count, Func<int, (double Lat, double Lon, double H)> place) =>
        Enumerable.Range(0, count).Select(i =>
        {
            var (lat, lon, h) = place(i);
            return new FramedPoint(i, $"M{i:0000}", null, new GeodeticCoordinate(lat, lon, h), true, null, null, null);
        }).ToList();

    private static FramedPoint Fix(int index, double lat, double lon, double h) =>
        new(index, $"F{index:000000}", null, new GeodeticCoordinate(lat, lon, h), true, null, null, null);

    /// <summary>
    /// Fixes near random marks, at up to 1.5 radii (a third of them within a few per cent of the radius, where the
    /// boundary is decided), plus one in ten anywhere in the marks' box; heights unlike the marks'.
    /// </summary>
    private static List<FramedPoint> FixesAround(IReadOnlyList<FramedPoint> marks, int count, double radiusMetres, Random random)
    {
        var (latMin, latMax) = (marks.Min(m => m.Geodetic.LatitudeDegrees), marks.Max(m => m.Geodetic.LatitudeDegrees));
        var (lonMin, lonMax) = (marks.Min(m => m.Geodetic.LongitudeDegrees), marks.Max(m => m.Geodetic.LongitudeDegrees));
        var fixes = new List<FramedPoint>(count);
        for (var i = 0; i < count; i++)
        {
            var h = random.NextDouble() * 1000 - 100;
            if (i % 10 == 9)
            {
                fixes.Add(Fix(i, latMin + random.NextDouble() * (latMax - latMin), lonMin + random.NextDouble() * (lonMax - lonMin), h));
                continue;
            }
            var mark = marks[random.Next(marks.Count)].Geodetic;
            var distance = radiusMetres * (i % 3 == 0 ? 0.97 + random.NextDouble() * 0.06 : random.NextDouble() * 1.5);
            var azimuth = random.NextDouble() * 2 * Math.PI;
            var lat = Math.Clamp(mark.LatitudeDegrees + distance * Math.Cos(azimuth) / MetresPerDegree, -90, 90);
            var lon = mark.LongitudeDegrees + distance * Math.Sin(azimuth) / (MetresPerDegree * Math.Max(Math.Cos(lat * Math.PI / 180), 1e-3));
            fixes.Add(Fix(i, lat, lon, h));
        }
        return fixes;
    }

    /// <summary>The same longitude written in (−180, 180], shifted by a whole turn, or as given.</summary>
    private static double Spell(double lonDegrees, Random random)
    {
        var wrapped = Math.IEEERemainder(lonDegrees, 360.0);
        return random.Next(3) switch { 0 => wrapped, 1 => wrapped + 360.0, _ => lonDegrees };
    }
}
