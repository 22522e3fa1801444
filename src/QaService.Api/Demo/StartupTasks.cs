using System.Text.Json;
using Microsoft.Extensions.Options;
using QaService.Api.Assessments;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.Reporting;

namespace QaService.Api.Demo;

/// <summary>
/// Runs before the server listens: creates the storage schema, then stores the demo report
/// (an invented scenario: Millbrook Ferry Water Cooperative's hydrants) if it is missing. The local tenant may
/// delete the demo; it is stored again at the next start (set <c>Demo:Enabled</c> to false to keep it gone).
/// </summary>
internal sealed class StartupTasks(IReportStore store, IOptions<DemoOptions> demo, TimeProvider clock, ILogger<StartupTasks> logger) : IHostedService
{
    private const string DemoResource = "QaService.Api.Demo.millbrook-ferry-hydrants.json";

    public async Task StartAsync(CancellationToken cancellationToken)
    {
        await store.InitializeAsync(cancellationToken);
        if (!demo.Value.Enabled || await store.FindJsonAsync(Tenants.Local, DemoOptions.ReportId, cancellationToken) is not null)
            return;

        await using var stream = typeof(StartupTasks).Assembly.GetManifestResourceStream(DemoResource)
                                 ?? throw new InvalidOperationException($"embedded resource {DemoResource} is missing from the build");
        var request = await JsonSerializer.DeserializeAsync<AssessmentRequest>(stream, ReportJson.Read, cancellationToken);
        var outcome = RequestValidator.Validate(request);
        if (outcome.Assessment is null)
            throw new InvalidOperationException($"the demo request is invalid: {outcome.Errors[0].Pointer} {outcome.Errors[0].Message}");

        var report = AssessmentRunner.Run(outcome.Assessment, DemoOptions.ReportId, clock.GetUtcNow());
        // Insert-if-absent: another instance starting at the same moment may have stored it since the check above.
        if (await AssessmentsApi.StoreIfAbsentAsync(store, Tenants.Local, report, cancellationToken))
            StartupLog.DemoStored(logger, DemoOptions.ReportId, report.Verdict.ToString());
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}

internal static partial class StartupLog
{
    [LoggerMessage(EventId = 1101, EventName = "DemoStored", Level = LogLevel.Information,
        Message = "Demo assessment stored as {AssessmentId}: verdict {Verdict}")]
    public static partial void DemoStored(ILogger logger, string assessmentId, string verdict);
}
