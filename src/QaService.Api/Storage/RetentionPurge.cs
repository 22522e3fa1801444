using Microsoft.Extensions.Options;

namespace QaService.Api.Storage;

/// <summary>
/// <c>Storage:RetentionDays</c>: deletes reports (of every tenant) created more than that many days ago, at start and
/// then every <see cref="Interval"/>, in batches of <see cref="BatchSize"/>, each its own short transaction, so a large
/// first purge never holds a long lock against uploads. Unset: does nothing. A failed run is logged and retried at the
/// next interval; it never stops the service.
/// </summary>
internal sealed class RetentionPurge(IReportStore store, IOptions<StorageOptions> options, TimeProvider clock, ILogger<RetentionPurge> logger) : BackgroundService
{
    public static readonly TimeSpan Interval = TimeSpan.FromHours(1);

    public const int BatchSize = 500;

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        if (options.Value.RetentionDays is not { } days)
            return;
        using var timer = new PeriodicTimer(Interval, clock);
        do
        {
            try
            {
                await PurgeAsync(days, BatchSize, stoppingToken);
            }
            catch (Exception fault) when (fault is not OperationCanceledException)
            {
                RetentionLog.Failed(logger, fault);
            }
        }
        while (await timer.WaitForNextTickAsync(stoppingToken));
    }

    /// <summary>One run: deletes every report created before now − <paramref name="days"/>; returns how many.</summary>
    internal async Task<int> PurgeAsync(int days, int batchSize, CancellationToken cancellationToken)
    {
        var cutoff = clock.GetUtcNow() - TimeSpan.FromDays(days);
        int total = 0, deleted;
        do
        {
            deleted = await store.DeleteCreatedBeforeAsync(cutoff, batchSize, cancellationToken);
            total += deleted;
        }
        while (deleted == batchSize);
        RetentionLog.Purged(logger, total, days, cutoff);
        return total;
    }
}

internal static partial class RetentionLog
{
    [LoggerMessage(EventId = 1201, EventName = "RetentionPurged", Level = LogLevel.Information,
        Message = "Retention removed {DeletedCount} reports created before {Cutoff:O} (Storage:RetentionDays = {RetentionDays})")]
    public static partial void Purged(ILogger logger, int deletedCount, int retentionDays, DateTimeOffset cutoff);

    [LoggerMessage(EventId = 1202, EventName = "RetentionFailed", Level = LogLevel.Warning,
        Message = "Retention run failed; it is tried again at the next interval")]
    public static partial void Failed(ILogger logger, Exception fault);
}
