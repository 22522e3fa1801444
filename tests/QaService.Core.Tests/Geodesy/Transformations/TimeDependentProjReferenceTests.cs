using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;

namespace QaService.Core.Tests.Geodesy.Transformations;

/// <summary>
/// EPSG time-dependent (14-parameter) transformations between geographic 3D CRSs at observation epochs,
/// planned by <see cref="CoordinateOperationPlanner"/> from the generated EPSG table, against PROJ 9.1.1
/// <c>cct</c> running the pipeline <c>projinfo -o PROJ</c> prints (pinned in the file header) with a time column
/// (tests/reference-data/datum-proj.tsv: ITRF2014/2020/2008 → ETRF2000, ITRF2014/2008 → NAD83(2011),
/// ITRF2014 → ITRF2020, ITRF2014 → GDA2020; epochs 2010.0–2031.2). Tolerance 1 mm, the acceptance
/// figure; the same formulas as PROJ leave only the file's rounding (1e-10° ≈ 11 µm, 0.1 mm in height).
/// </summary>
public sealed class TimeDependentProjReferenceTests
{
    private const double ToleranceMetres = 1e-3;
    private const double MetresPerDegree = 111_320.0; // equatorial degree, an upper bound for turning ° into m

    [Fact]
    public void EpsgTimeDependentTransformations_AtObservationEpochs_MatchCct()
    {
        var rows = ReferenceData.Load("datum-proj.tsv");
        Assert.True(rows.Count >= 1600, $"expected the full reference file, got {rows.Count} rows");
        foreach (var group in rows.GroupBy(r => (r[1], r[2])))
        {
            var source = CrsCatalog.Resolve(group.Key.Item1).Crs!;
            var target = CrsCatalog.Resolve(group.Key.Item2).Crs!;
            var operation = CoordinateOperationPlanner.Plan(source, target).Operation!;
            var list = group.ToList();
            var buffer = new CoordinateBuffer(list.Count, withEpochs: true);
            for (var i = 0; i < list.Count; i++)
            {
                buffer.First[i] = ReferenceData.D(list[i][4]);
                buffer.Second[i] = ReferenceData.D(list[i][5]);
                buffer.Third[i] = ReferenceData.D(list[i][6]);
                buffer.EpochYears![i] = ReferenceData.D(list[i][3]);
            }
            operation.Execute(buffer);
            for (var i = 0; i < list.Count; i++)
            {
                var dLat = (buffer.First[i] - ReferenceData.D(list[i][7])) * MetresPerDegree;
                var dLon = (buffer.Second[i] - ReferenceData.D(list[i][8])) * MetresPerDegree * Math.Cos(buffer.First[i] * Math.PI / 180);
                var dH = buffer.Third[i] - ReferenceData.D(list[i][9]);
                var error = Math.Sqrt(dLat * dLat + dLon * dLon + dH * dH);
                Assert.True(error < ToleranceMetres, $"{list[i][0]} at {list[i][3]} ({list[i][4]}, {list[i][5]}): {error:E2} m; {operation.Describe(null)}");
            }
        }
    }

    [Fact]
    public void Itrf2014ToNad83v2011_UsesEpsg8970_AndMovesMetres()
    {
        // EPSG:8970 (proj.db v10.076): coordinate-frame convention, tx 1.0053 m; the shift is about 1–2 m across the USA.
        var operation = CoordinateOperationPlanner.Plan(CrsCatalog.Resolve("EPSG:7912").Crs!, CrsCatalog.Resolve("EPSG:6319").Crs!).Operation!;
        var helmert = Assert.Single(operation.Steps.OfType<HelmertStep>());
        Assert.Equal(8970, helmert.Definition.EpsgCode);
        Assert.Equal(HelmertConvention.CoordinateFrame, helmert.Definition.Parameters.Convention);
        Assert.Contains("EPSG:8970", operation.Describe("2026.4 (request)"), StringComparison.Ordinal);
        Assert.Contains("2026.4", operation.Describe("2026.4 (request)"), StringComparison.Ordinal);
    }

    [Fact]
    public void Wgs84Ensemble_RoutesThroughItrf2014_WithTheEnsembleAccuracy()
    {
        // EPSG dataset (proj.db v10.076): WGS 84 ensemble accuracy 2 m (geodetic_datum 6326); ITRF2014 → ITRF2020
        // (EPSG:9991) 0.001 m. The cheapest path sums to 2.001 m.
        var operation = CoordinateOperationPlanner.Plan(CrsCatalog.Resolve("EPSG:4979").Crs!, CrsCatalog.Resolve("EPSG:9989").Crs!).Operation!;
        Assert.Contains(operation.Steps, s => s is FrameEquivalenceStep);
        Assert.Contains(operation.Steps.OfType<HelmertStep>(), s => s.Definition.EpsgCode == 9991);
        Assert.Equal(2.001, operation.AccuracyMetres, 6);
    }

    [Fact]
    public void Wgs84ToEtrs89_TakesEpsg1149_ButEtrs89IsNoThoroughfare()
    {
        // EPSG:1149 "ETRS89 to WGS 84 (1)" states 1 m (valid in Europe only): used between the two ensembles
        // themselves, never as a detour to other frames (WGS 84 → ETRF2000 goes through the ITRF2014 hub, 2 m).
        var direct = CoordinateOperationPlanner.Plan(CrsCatalog.Resolve("EPSG:4979").Crs!, CrsCatalog.Resolve("EPSG:4937").Crs!).Operation!;
        Assert.Contains(direct.Steps.OfType<HelmertStep>(), s => s.Definition.EpsgCode == 1149 && s.Reversed);
        Assert.Equal(1.0, direct.AccuracyMetres, 6);
        var toEtrf2000 = CoordinateOperationPlanner.Plan(CrsCatalog.Resolve("EPSG:4979").Crs!, CrsCatalog.Resolve("EPSG:7931").Crs!).Operation!;
        Assert.Contains(toEtrf2000.Steps.OfType<HelmertStep>(), s => s.Definition.EpsgCode == 8405);
        Assert.Equal(2.0, toEtrf2000.AccuracyMetres, 6);
    }

    [Fact]
    public void SameDatum_IsProjectionOnly()
    {
        var operation = CoordinateOperationPlanner.Plan(CrsCatalog.Resolve("EPSG:4326").Crs!, CrsCatalog.Resolve("EPSG:32633").Crs!).Operation!;
        Assert.IsType<ForwardProjectionStep>(Assert.Single(operation.Steps));
        Assert.Contains("projection only, same datum", operation.Describe(null), StringComparison.Ordinal);
    }

    [Fact]
    public void DecimalYear_MatchesCalendar()
    {
        // 2026 is not a leap year: 26 May 09:14 UTC is day 145 + 9.233 h → 2026 + 145.3847/365 (arithmetic by hand).
        Assert.Equal(2026.0 + (145 + 9 / 24.0 + 14 / 1440.0) / 365.0, DecimalYear.From(new DateTimeOffset(2026, 5, 26, 9, 14, 0, TimeSpan.Zero)), 12);
        Assert.Equal(2024.5, DecimalYear.From(new DateTimeOffset(2024, 7, 2, 0, 0, 0, TimeSpan.Zero)), 12); // leap year: day 183 of 366
    }
}
