using System.Diagnostics;
using System.Text.Json;
using QaService.Core.Assessment;
using QaService.Core.Diagnosis;
using QaService.Core.Ingest;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

/// <summary>
/// Wall-clock time of each stage of a file upload, in one process, without HTTP: read the two files, validate,
/// run the assessment (and, apart, its statistics, each check and the extra report blocks), serialise the JSON.
/// Best of N rounds after one warm-up, milliseconds. For finding where the time of bench/run-all.sh part (b) goes.
///
///   dotnet run -c Release --project bench/QaService.Benchmarks -- stages MARKS.csv FIXES.csv OPTIONS.json [rounds=5]
/// </summary>
internal static class StageTimes
{
    public static async Task RunAsync(string[] args)
    {
        var (marksPath, fixesPath, optionsPath) = (args[1], args[2], args[3]);
        var rounds = args.Length > 4 ? int.Parse(args[4], System.Globalization.CultureInfo.InvariantCulture) : 5;
        var options = JsonSerializer.Deserialize<UploadOptions>(await File.ReadAllBytesAsync(optionsPath), ReportJson.Read)!;
        var best = new Dictionary<string, double>(StringComparer.Ordinal);
        var allocated = new Dictionary<string, double>(StringComparer.Ordinal);
        var order = new List<string>();
        // Times and bytes allocated (all threads) per stage; bytes from the last round.
        for (var round = 0; round <= rounds; round++)
        {
            var times = await OneRoundAsync(marksPath, fixesPath, options);
            if (round == 0)
            {
                order.AddRange(times.Select(t => t.Stage));
                continue; // warm-up
            }
            foreach (var (stage, ms, megabytes) in times)
            {
                best[stage] = best.TryGetValue(stage, out var b) ? Math.Min(b, ms) : ms;
                allocated[stage] = megabytes;
            }
        }
        foreach (var stage in order)
            Console.WriteLine($"{stage,-34} {best[stage],9:F1} ms {allocated[stage],9:F1} MB allocated");
    }

    private static async Task<List<(string Stage, double Ms, double AllocatedMegabytes)>> OneRoundAsync(string marksPath, string fixesPath, UploadOptions options)
    {
        var times = new List<(string, double, double)>();
        var clock = Stopwatch.StartNew();
        T Time<T>(string stage, Func<T> work)
        {
            var before = GC.GetTotalAllocatedBytes(precise: true);
            clock.Restart();
            var result = work();
            times.Add((stage, clock.Elapsed.TotalMilliseconds, (GC.GetTotalAllocatedBytes(precise: true) - before) / 1e6));
            return result;
        }

        PartReading marks, fixes;
        await using (var marksFile = File.OpenRead(marksPath))
        await using (var fixesFile = File.OpenRead(fixesPath))
        {
            marks = Time("read marks", () => FieldPartReader.ReadAsync("marks", marksFile, options.Marks, default).GetAwaiter().GetResult().Reading!);
            fixes = Time("read fixes", () => FieldPartReader.ReadAsync("fixes", fixesFile, options.Fixes, default).GetAwaiter().GetResult().Reading!);
        }
        var (outcome, ingest) = Time("validate", () => UploadValidation.Validate(options, marks, fixes));
        var input = outcome.Assessment ?? throw new InvalidOperationException(string.Join("; ", outcome.Errors.Select(e => $"{e.Pointer}: {e.Message}")));
        var report = Time("run (whole assessment)", () => AssessmentRunner.Run(input, "stage-times", DateTimeOffset.UnixEpoch) with { Ingest = ingest });

        var included = report.Residuals.Where(r => r.Excluded is null).ToList();
        var dE = included.Select(r => r.DE).ToArray();
        var dN = included.Select(r => r.DN).ToArray();
        var up = included.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
        var horizontal = Time("  horizontal figures", () => HorizontalAccuracy.Compute(dE, dN));
        var vertical = Time("  vertical figures", () => up.Length == 0 ? null : VerticalAccuracy.Compute(up));
        var context = new CheckContext(input, included, horizontal, vertical);
        var checks = DataChecks.All.Select(check => Time($"  check {check.Id}", () => check.Evaluate(context))).ToList();
        Time("  report blocks (standard, CI, ...)", () => ReportFigures.Compute(input, included, horizontal, vertical, checks));
        Time("  groups (by fix attribute)", () => AttributeGrouping.Compute(input, included));

        Time("serialise JSON", () =>
        {
            using var sink = new CountingStream();
            ReportJsonStream.WriteAsync(report, sink, default).GetAwaiter().GetResult();
            return sink.Length;
        });
        return times;
    }

    /// <summary>Counts what is written and keeps nothing.</summary>
    private sealed class CountingStream : Stream
    {
        private long length;
        public override bool CanRead => false;
        public override bool CanSeek => false;
        public override bool CanWrite => true;
        public override long Length => length;
        public override long Position { get => length; set => throw new NotSupportedException(); }
        public override void Flush() { }
        public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();
        public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();
        public override void SetLength(long value) => throw new NotSupportedException();
        public override void Write(byte[] buffer, int offset, int count) => length += count;
        public override void Write(ReadOnlySpan<byte> buffer) => length += buffer.Length;
    }
}
