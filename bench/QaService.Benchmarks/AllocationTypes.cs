using System.Collections.Concurrent;
using System.Diagnostics.Tracing;
using System.Text.Json;
using QaService.Core.Assessment;
using QaService.Core.Ingest;
using QaService.Core.Reporting;

/// <summary>
/// Which types a file upload allocates, in one process without HTTP: the runtime's allocation ticks (one event about
/// every 100 kB allocated, naming the type that crossed it) summed by type, for reading, validation, the assessment
/// and the JSON, after one warm-up round. Sampled, so the megabytes are estimates; for finding what to pool or turn
/// into columns.
///
///   dotnet run -c Release --project bench/QaService.Benchmarks -- allocations MARKS.csv FIXES.csv OPTIONS.json
/// </summary>
internal static class AllocationTypes
{
    public static async Task RunAsync(string[] args)
    {
        var options = JsonSerializer.Deserialize<UploadOptions>(await File.ReadAllBytesAsync(args[3]), ReportJson.Read)!;
        await OneRoundAsync(args[1], args[2], options);
        using var listener = new TickListener();
        foreach (var (stage, work) in Stages(args[1], args[2], options))
        {
            listener.Stage = stage;
            await work();
        }
        foreach (var stage in listener.ByStage.Keys.Order())
        {
            var top = listener.ByStage[stage].OrderByDescending(t => t.Value).Take(8);
            Console.WriteLine($"{stage}: {listener.ByStage[stage].Values.Sum() / 1e6:F1} MB sampled");
            foreach (var (type, bytes) in top)
                Console.WriteLine($"  {bytes / 1e6,8:F1} MB  {type}");
        }
    }

    private static async Task OneRoundAsync(string marks, string fixes, UploadOptions options)
    {
        foreach (var (_, work) in Stages(marks, fixes, options))
            await work();
    }

    private static IEnumerable<(string Stage, Func<Task> Work)> Stages(string marksPath, string fixesPath, UploadOptions options)
    {
        PartReading? marks = null, fixes = null;
        ValidatedAssessment? input = null;
        AssessmentReport? report = null;
        yield return ("1 read", async () =>
        {
            await using var m = File.OpenRead(marksPath);
            await using var f = File.OpenRead(fixesPath);
            marks = (await FieldPartReader.ReadAsync("marks", m, options.Marks, default)).Reading!;
            fixes = (await FieldPartReader.ReadAsync("fixes", f, options.Fixes, default)).Reading!;
        });
        yield return ("2 validate", () =>
        {
            input = UploadValidation.Validate(options, marks!, fixes!).Outcome.Assessment!;
            return Task.CompletedTask;
        });
        yield return ("3 run", () =>
        {
            report = AssessmentRunner.Run(input!, "allocations", DateTimeOffset.UnixEpoch);
            return Task.CompletedTask;
        });
        yield return ("4 serialise", () => ReportJsonStream.WriteAsync(report!, Stream.Null, default));
    }

    private sealed class TickListener : EventListener
    {
        private const EventKeywords GcKeyword = (EventKeywords)0x1;

        public volatile string Stage = "";

        public ConcurrentDictionary<string, ConcurrentDictionary<string, long>> ByStage { get; } = new();

        protected override void OnEventSourceCreated(EventSource source)
        {
            if (source.Name == "Microsoft-Windows-DotNETRuntime")
                EnableEvents(source, EventLevel.Verbose, GcKeyword);
        }

        protected override void OnEventWritten(EventWrittenEventArgs e)
        {
            if (e.EventName is not { } name || !name.StartsWith("GCAllocationTick", StringComparison.Ordinal) || Stage.Length == 0 || e.PayloadNames is null)
                return;
            var type = e.Payload![e.PayloadNames.IndexOf("TypeName")] as string ?? "?";
            var amount = Convert.ToInt64(e.Payload[e.PayloadNames.IndexOf("AllocationAmount64")], System.Globalization.CultureInfo.InvariantCulture);
            ByStage.GetOrAdd(Stage, _ => new()).AddOrUpdate(type, amount, (_, sum) => sum + amount);
        }
    }
}
