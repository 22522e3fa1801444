using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;

namespace QaService.Core.Tests.Geodesy.Transformations;

/// <summary>
/// Which EPSG operation the planner takes where EPSG offers several, pinning one by code, and a missing grid file.
/// The expected choices are PROJ 9.1.1's first candidates (<c>projinfo -s … -t … --bbox … --spatial-test intersects</c>).
/// </summary>
public sealed class OperationChoiceTests
{
    private static CoordinateReferenceSystem Crs(string id) => CrsCatalog.Resolve(id).Crs!;

    [Fact]
    public void Ed50InMadrid_TakesTheSpanishOperation_AsProjDoes()
    {
        // projinfo -s EPSG:23030 -t EPSG:4326 --bbox -3.71,40.41,-3.69,40.43 --spatial-test intersects → first: ED50 to WGS 84 (28), 1.5 m
        var box = new AreaOfUse("Madrid", 40.41, 40.43, -3.71, -3.69);
        var operation = CoordinateOperationPlanner.Plan(Crs("EPSG:4230"), Crs("EPSG:4326"), pointsBox: box).Operation!;
        Assert.Equal("ED50 to WGS 84 (28)", Assert.Single(operation.DatumEdges).OperationName);
        var text = operation.Describe(null);
        Assert.Contains("over EPSG:", text, StringComparison.Ordinal);
        Assert.Contains("operationCode", text, StringComparison.Ordinal);
    }

    [Fact]
    public void OperationCode_PinsTheRoute_AndAnUnrelatedOrUnknownCodeIsRefused()
    {
        var pinned = CoordinateOperationPlanner.Plan(Crs("EPSG:4230"), Crs("EPSG:4326"), operationCode: 1133);
        Assert.Equal(1133, Assert.Single(pinned.Operation!.DatumEdges).OperationCode); // EPSG:1133 ED50 to WGS 84 (1)
        var unrelated = CoordinateOperationPlanner.Plan(Crs("EPSG:4230"), Crs("EPSG:4326"), operationCode: 15948);
        Assert.Null(unrelated.Operation);
        Assert.True(unrelated.ProblemIsOperationCode);
        var unknown = CoordinateOperationPlanner.Plan(Crs("EPSG:4230"), Crs("EPSG:4326"), operationCode: 99999999);
        Assert.True(unknown.ProblemIsOperationCode);
        Assert.Contains("EPSG:99999999", unknown.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void MissingGrid_IsNamedWithItsPackage_AndAnAlternativeOffered()
    {
        var noGrids = new DatumGraph(HelmertTable.Transformations, FrameEquivalence.All, [], GridTable.Transformations) { GridLocator = _ => null };
        var box = new AreaOfUse("Stuttgart", 48.7, 48.8, 9.1, 9.2);
        var plan = CoordinateOperationPlanner.Plan(Crs("EPSG:4314"), Crs("EPSG:4258"), graph: noGrids, pointsBox: box);
        Assert.Null(plan.Operation);
        Assert.Contains("BETA2007.gsb", plan.Problem, StringComparison.Ordinal);
        Assert.Contains("proj-data", plan.Problem, StringComparison.Ordinal);
        Assert.Contains("operationCode", plan.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void PointsOutsideTheOperationsArea_AreListedByIndex()
    {
        var operation = CoordinateOperationPlanner.Plan(Crs("EPSG:4230"), Crs("EPSG:4326"), operationCode: 1133).Operation!;
        var area = operation.DatumEdges[0].Area!;
        var warnings = operation.OutsideAreas([area.SouthDegrees + 0.1, -30.0], [area.WestDegrees + 0.1, 100.0]);
        Assert.Contains(warnings, w => w.PointIndexes.SequenceEqual([1]) && w.Message.Contains("EPSG:1133", StringComparison.Ordinal));
        Assert.DoesNotContain(warnings, w => w.PointIndexes.Contains(0) && w.Message.Contains("EPSG:1133", StringComparison.Ordinal));
    }
}
