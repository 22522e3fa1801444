using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;

namespace QaService.Core.Tests.Geodesy.Transformations;

/// <summary>
/// A large batch runs in ranges side by side; it must give exactly what the steps give run one after the other over
/// the whole batch: the same bits, the points outside a step's domain (NaN) in the same places, epochs carried.
/// </summary>
public sealed class ParallelExecutionTests
{
    [Theory]
    [InlineData("EPSG:4326", "EPSG:32633", false)] // projection only (its batch path, points far off the zone fail)
    [InlineData("EPSG:7912", "EPSG:6319", true)]   // ITRF2014 → NAD83(2011): time-dependent Helmert, per-point epochs
    public void Ranges_side_by_side_give_the_bits_of_one_pass(string from, string to, bool withEpochs)
    {
        var operation = CoordinateOperationPlanner.Plan(CrsCatalog.Resolve(from).Crs!, CrsCatalog.Resolve(to).Crs!).Operation!;
        const int count = 150_001; // several ranges, the last one uneven
        var random = new Random(11);
        var batch = new CoordinateBuffer(count, withEpochs);
        for (var i = 0; i < count; i++)
        {
            batch.First[i] = random.NextDouble() * 170.0 - 85.0;
            batch.Second[i] = random.NextDouble() * 360.0 - 180.0;
            batch.Third[i] = random.NextDouble() * 1000.0;
            if (withEpochs)
                batch.EpochYears![i] = 2000.0 + random.NextDouble() * 30.0;
        }
        var onePass = batch.Copy(0, count);
        foreach (var step in operation.Steps)
            step.Apply(onePass);

        operation.Execute(batch);

        Assert.Equal(onePass.First, batch.First);
        Assert.Equal(onePass.Second, batch.Second);
        Assert.Equal(onePass.Third, batch.Third);
        if (!withEpochs)
            Assert.Contains(batch.First, double.IsNaN); // the projection case covers points that fail as well
    }
}
