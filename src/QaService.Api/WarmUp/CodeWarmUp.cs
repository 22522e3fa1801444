using System.Diagnostics;
using System.Globalization;
using System.Runtime;
using System.Text;
using Microsoft.Extensions.Options;
using QaService.Api.Observability;
using QaService.Core.Assessment;
using QaService.Core.Ingest;
using QaService.Core.Reporting;
using QaService.Core.Transform;

namespace QaService.Api.WarmUp;

/// <summary>
/// After start, runs an invented upload (a grid of marks and fixes scattered about them) through every stage of a
/// real one, in memory, storing nothing: transform, CSV reading, validation, the assessment, the report JSON. The
/// JIT then compiles that code, and the tiered compiler promotes its per-point methods, before the first client
/// upload rather than inside it (a fresh service's first 400,000-fix upload: see DEVELOPERS.md "Performance").
/// Runs in the background: the service answers meanwhile, and a failure here is logged, never fatal.
/// </summary>
internal sealed class CodeWarmUp(IOptions<WarmUpOptions> options, QaMetrics metrics, ILogger<CodeWarmUp> logger) : BackgroundService
{
    /// <summary>Fixes in the invented upload: enough for every per-point method to pass the tiering call count many times, and for the report writer's parallel batches.</summary>
    private const int Fixes = 12_000;

    /// <summary>Marks on a square grid, metres apart (invented positions in UTM zone 33N).</summary>
    private const int MarksPerSide = 10;
    private const double MarkSpacingMetres = 40.0, FirstEastingMetres = 500_000.0, FirstNorthingMetres = 5_540_000.0, MarkHeightMetres = 250.0;

    /// <summary>Scatter of the fixes about their marks, degrees (~0.3 m) and metres.</summary>
    private const double ScatterDegrees = 3e-6, ScatterHeightMetres = 0.5;

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        if (!options.Value.Enabled)
            return;
        await Task.Yield();
        var clock = Stopwatch.StartNew();
        try
        {
            await RunAsync(stoppingToken);
            // Hand the warm-up's working memory back before the first real request (it would otherwise sit in the
            // heap until a full collection; the 1,000,000-fix upload's peak counts it).
            GCSettings.LargeObjectHeapCompactionMode = GCLargeObjectHeapCompactionMode.CompactOnce;
            GC.Collect(GC.MaxGeneration, GCCollectionMode.Forced, blocking: true, compacting: true);
            metrics.WarmUpFinished(clock.Elapsed.TotalSeconds);
            WarmUpLog.Finished(logger, clock.ElapsedMilliseconds);
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
        catch (Exception exception)
        {
            WarmUpLog.Failed(logger, exception);
        }
    }

    private static async Task RunAsync(CancellationToken cancellationToken)
    {
        var grid = Enumerable.Range(0, MarksPerSide * MarksPerSide)
            .Select(i => new TransformPoint(E: FirstEastingMetres + (MarkSpacingMetres * (i % MarksPerSide)), N: FirstNorthingMetres + (MarkSpacingMetres * (i / MarksPerSide)), H: MarkHeightMetres))
            .ToList();
        var geographic = TransformRunner.Run(new TransformRequest("EPSG:32633", "EPSG:4979", grid)).Result
                         ?? throw new InvalidOperationException("the warm-up marks did not transform");

        var marks = new StringBuilder("id,e,n,h\n");
        for (var i = 0; i < grid.Count; i++)
            marks.Append(CultureInfo.InvariantCulture, $"W{i:D3},{grid[i].E:F3},{grid[i].N:F3},{grid[i].H:F3}\n");
        var random = new Random(Fixes);
        var fixes = new StringBuilder("id,mark,lat,lon,h\n");
        for (var i = 0; i < Fixes; i++)
        {
            var m = i % grid.Count;
            fixes.Append(CultureInfo.InvariantCulture,
                $"F{i:D6},W{m:D3},{geographic.Points.First[m] + (ScatterDegrees * (random.NextDouble() - 0.5)):F9},{geographic.Points.Second[m] + (ScatterDegrees * (random.NextDouble() - 0.5)):F9},{MarkHeightMetres + (ScatterHeightMetres * (random.NextDouble() - 0.5)):F3}\n");
        }

        var upload = new UploadOptions(new FilePartOptions("EPSG:32633", "ellipsoidal"), new FilePartOptions("EPSG:4979", "ellipsoidal"),
            Spec: new AccuracySpec("nssda", 1.0, 1.0));
        var (markPart, _) = await FieldPartReader.ReadAsync("marks", new MemoryStream(Encoding.UTF8.GetBytes(marks.ToString())), upload.Marks, cancellationToken);
        var (fixPart, _) = await FieldPartReader.ReadAsync("fixes", new MemoryStream(Encoding.UTF8.GetBytes(fixes.ToString())), upload.Fixes, cancellationToken);
        var (outcome, ingest) = UploadValidation.Validate(upload, markPart!, fixPart!);
        var input = outcome.Assessment ?? throw new InvalidOperationException($"the warm-up upload is invalid: {outcome.Errors[0].Pointer} {outcome.Errors[0].Message}");
        var report = AssessmentRunner.Run(input, "warm-up", DateTimeOffset.UnixEpoch) with { Ingest = ingest };
        await ReportJsonStream.WriteAsync(report, Stream.Null, cancellationToken);
    }
}

internal static partial class WarmUpLog
{
    [LoggerMessage(EventId = 1301, EventName = "WarmUpFinished", Level = LogLevel.Information, Message = "Warm-up upload run in {ElapsedMilliseconds} ms")]
    public static partial void Finished(ILogger logger, long elapsedMilliseconds);

    [LoggerMessage(EventId = 1302, EventName = "WarmUpFailed", Level = LogLevel.Warning, Message = "Warm-up upload failed; the service runs on, only its first large upload is slower")]
    public static partial void Failed(ILogger logger, Exception exception);
}
