using System.Diagnostics;
using System.Text.Json;
using QaService.Core.Reporting;
using QaService.Core.Transform;

/// <summary>
/// Wall-clock time of each stage of POST /v1/transform, in one process, without HTTP: read the JSON body (streamed,
/// whole in one pass, and with the points in pieces side by side as the endpoint does above 1 MB), plan and run the batch. Best of N rounds after one warm-up, milliseconds.
///
///   dotnet run -c Release --project bench/QaService.Benchmarks -- transform-stages BODY.json [rounds=5]
/// </summary>
internal static class TransformStages
{
    public static async Task RunAsync(string[] args)
    {
        var body = await File.ReadAllBytesAsync(args[1]);
        var rounds = args.Length > 2 ? int.Parse(args[2], System.Globalization.CultureInfo.InvariantCulture) : 5;
        double bestRead = double.MaxValue, bestRun = double.MaxValue, bestBytes = double.MaxValue, bestPieces = double.MaxValue;
        for (var round = 0; round <= rounds; round++)
        {
            var clock = Stopwatch.StartNew();
            var request = await JsonSerializer.DeserializeAsync<TransformRequest>(new MemoryStream(body), ReportJson.Read);
            var read = clock.Elapsed.TotalMilliseconds;
            clock.Restart();
            request = JsonSerializer.Deserialize<TransformRequest>(body, ReportJson.Read);
            var readBytes = clock.Elapsed.TotalMilliseconds;
            clock.Restart();
            var inPieces = ParallelPointReading.TryRead(body, ReportJson.Read);
            var readPieces = inPieces is null ? double.NaN : clock.Elapsed.TotalMilliseconds;
            clock.Restart();
            var outcome = TransformRunner.Run(request!);
            var run = clock.Elapsed.TotalMilliseconds;
            if (outcome.Result is null)
                throw new InvalidOperationException(string.Join("; ", outcome.Errors.Select(e => $"{e.Pointer}: {e.Message}")));
            if (round > 0)
                (bestRead, bestRun, bestBytes, bestPieces) = (Math.Min(bestRead, read), Math.Min(bestRun, run), Math.Min(bestBytes, readBytes), Math.Min(bestPieces, readPieces));
        }
        Console.WriteLine($"read body (DeserializeAsync)   {bestRead,9:F1} ms");  // the streaming path assessments use
        Console.WriteLine($"read body (Deserialize, bytes) {bestBytes,9:F1} ms");  // the whole body, then one pass (small bodies)
        Console.WriteLine($"read body (points in pieces)   {bestPieces,9:F1} ms");  // the endpoint's path above 1 MB (NaN: fell back)
        Console.WriteLine($"plan and run                   {bestRun,9:F1} ms");
    }
}
