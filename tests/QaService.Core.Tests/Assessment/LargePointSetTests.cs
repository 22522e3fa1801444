using QaService.Core.Assessment;
using QaService.Core.Ingest;

namespace QaService.Core.Tests.Assessment;

/// <summary>
/// A set large enough to be read in slices on several threads must give what a point-by-point reading gives:
/// every point in order, every problem in point order with its pointer. Expected values follow from how the set
/// is built (api-v1 "Coordinates": latitude within −90..90°, a fix's mark must name a mark); invented data.
/// </summary>
public sealed class LargePointSetTests
{
    private const int FixCount = 150_001;
    private static readonly int[] OutOfRange = [3, 65_535, 65_536, 75_000, FixCount - 1];
    private const int UnknownMark = 99_999;

    [Fact]
    public void Problems_of_a_sliced_set_come_in_point_order()
    {
        var outcome = RequestValidator.Validate(Request(Fixes(asColumns: false)));
        // Point problems are listed as the points are read, then the fixes' mark ids are checked against the marks.
        Assert.Equal(OutOfRange.Select(i => $"/fixes/points/{i}/lat").Append($"/fixes/points/{UnknownMark}/mark"), outcome.Errors.Select(e => e.Pointer));
    }

    [Fact]
    public void A_sliced_column_store_gives_every_fix_in_order()
    {
        var outcome = RequestValidator.Validate(Request(Fixes(asColumns: true, clean: true)));
        var fixes = outcome.Assessment!.Fixes;
        Assert.Equal(FixCount, fixes.Count);
        Assert.Equal(Enumerable.Range(0, FixCount), fixes.Select(f => f.Index));
        Assert.Equal("F150000", fixes[^1].Id);
        Assert.Equal(47.0 + 150_000 * 1e-7, fixes[^1].Geodetic.LatitudeDegrees);
    }

    private static AssessmentRequest Request(IReadOnlyList<PointRecord?> fixes) => new(
        new PointSet("EPSG:4979", [new PointRecord("NB-1", Lat: 47.0, Lon: 8.0, H: 400.0), new PointRecord("NB-2", Lat: 47.01, Lon: 8.0, H: 400.0)]),
        new PointSet("EPSG:4979", fixes));

    private static IReadOnlyList<PointRecord?> Fixes(bool asColumns, bool clean = false)
    {
        var records = new List<PointRecord?>(FixCount);
        for (var i = 0; i < FixCount; i++)
        {
            var bad = !clean && OutOfRange.Contains(i);
            var mark = !clean && i == UnknownMark ? "NB-9" : i % 2 == 0 ? "NB-1" : "NB-2";
            records.Add(new PointRecord($"F{i}", mark, Lat: bad ? 95.0 : 47.0 + i * 1e-7, Lon: 8.0, H: 400.0));
        }
        if (!asColumns)
            return records;
        var columns = new PointColumns();
        for (var i = 0; i < FixCount; i++)
            columns.Add(i + 2, records[i]!);
        return columns;
    }
}
