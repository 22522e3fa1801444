namespace QaService.Api.Storage;

/// <summary>Disposes what a streamed read holds, last opened first.</summary>
internal sealed class DisposeAll(IAsyncDisposable first) : IAsyncDisposable
{
    private readonly Stack<IAsyncDisposable> held = new([first]);

    public void Add(IAsyncDisposable item) => held.Push(item);

    public async ValueTask DisposeAsync()
    {
        while (held.TryPop(out var item))
            await item.DisposeAsync();
    }
}
