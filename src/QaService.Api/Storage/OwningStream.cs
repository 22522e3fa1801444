namespace QaService.Api.Storage;

/// <summary>A view of a (read-only) inner stream that also disposes what the stream depends on (its connection).</summary>
internal sealed class OwningStream(Stream inner, IAsyncDisposable owner) : ForwardingStream(inner)
{
    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing)
            owner.DisposeAsync().AsTask().GetAwaiter().GetResult();
    }

    public override async ValueTask DisposeAsync()
    {
        await base.DisposeAsync();
        await owner.DisposeAsync();
    }
}
