using System.Text.Json;
using BenchmarkDotNet.Attributes;
using QaService.Core.Assessment;
using QaService.Core.Reporting;

namespace QaService.Benchmarks;

/// <summary>One small JSON assessment (reference case 0, 24 marks and fixes): validation, the run, and the report JSON.</summary>
[MemoryDiagnoser]
public class AssessmentBenchmarks
{
    private AssessmentRequest request = null!;
    private ValidatedAssessment validated = null!;
    private AssessmentReport report = null!;
    private static readonly DateTimeOffset CreatedAt = new(2026, 1, 1, 0, 0, 0, TimeSpan.Zero);

    [GlobalSetup]
    public void Setup()
    {
        var path = Path.Combine(RepositoryRoot(), "tests", "reference-data", "assessment-cases.json");
        using var document = JsonDocument.Parse(File.ReadAllText(path));
        var requestJson = document.RootElement.GetProperty("cases")[0].GetProperty("request").GetRawText();
        request = JsonSerializer.Deserialize<AssessmentRequest>(requestJson, ReportJson.Read)!;
        validated = RequestValidator.Validate(request).Assessment!;
        report = AssessmentRunner.Run(validated, "r", CreatedAt);
    }

    [Benchmark]
    public ValidationOutcome Validate() => RequestValidator.Validate(request);

    [Benchmark]
    public AssessmentReport Run() => AssessmentRunner.Run(validated, "r", CreatedAt);

    [Benchmark]
    public byte[] Serialise() => JsonSerializer.SerializeToUtf8Bytes(report, ReportJson.Write);

    private static string RepositoryRoot()
    {
        var directory = new DirectoryInfo(AppContext.BaseDirectory);
        while (directory is not null && !File.Exists(Path.Combine(directory.FullName, "QaService.sln")))
            directory = directory.Parent;
        return directory?.FullName ?? throw new InvalidOperationException("QaService.sln not found above the benchmark binary.");
    }
}
