namespace QaService.Api.Tests.Support;

/// <summary>One in-memory service per test class (xunit class fixture), on its own SQLite file, demo off.</summary>
public sealed class ServiceHost : IDisposable
{
    public QaServiceFactory Factory { get; } = new();

    public void Dispose() => Factory.Dispose();
}

/// <summary>As <see cref="ServiceHost"/>, with the demo report stored at start-up.</summary>
public sealed class DemoServiceHost : IDisposable
{
    public QaServiceFactory Factory { get; } = new(demo: true);

    public void Dispose() => Factory.Dispose();
}
