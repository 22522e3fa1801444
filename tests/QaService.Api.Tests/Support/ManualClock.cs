namespace QaService.Api.Tests.Support;

/// <summary>A clock the test moves by hand (the service takes TimeProvider from DI).</summary>
public sealed class ManualClock(DateTimeOffset start) : TimeProvider
{
    public DateTimeOffset Now { get; private set; } = start;

    public override DateTimeOffset GetUtcNow() => Now;

    public void Advance(TimeSpan by) => Now += by;
}
