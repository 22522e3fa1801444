namespace QaService.Core.Reporting;

/// <summary>
/// Renders numbered blocks of output side by side and hands them on in order: a window of blocks (two per processor)
/// is rendered at once on the thread pool, each into its own pooled buffer, then written one after the other. The
/// bytes are those of rendering every block in turn, whatever the scheduling. Used for a large report's residuals and
/// a large transform response.
/// </summary>
public static class OrderedBlockRendering
{
    /// <param name="blocks">Number of blocks, rendered by index 0 … blocks − 1.</param>
    /// <param name="render">Renders block i into the buffer given (empty when called).</param>
    /// <param name="write">Takes one block's bytes, in block order; they are valid only until it returns.</param>
    /// <param name="blockBytes">First size of each block's buffer (it grows as needed).</param>
    public static async Task WriteAsync(int blocks, Action<int, PooledBufferWriter> render, Func<ReadOnlyMemory<byte>, ValueTask> write,
        int blockBytes = PooledBufferWriter.DefaultInitialBytes)
    {
        var window = blocks <= 1 ? 1 : Math.Min(blocks, 2 * Environment.ProcessorCount);
        var buffers = new PooledBufferWriter[window];
        try
        {
            for (var slot = 0; slot < window; slot++)
                buffers[slot] = new PooledBufferWriter(blockBytes);
            for (var first = 0; first < blocks; first += window)
            {
                var count = Math.Min(window, blocks - first);
                if (count == 1)
                    render(first, buffers[0]);
                else
                    Parallel.For(0, count, slot => render(first + slot, buffers[slot]));
                for (var slot = 0; slot < count; slot++)
                {
                    await write(buffers[slot].WrittenMemory);
                    buffers[slot].Reset();
                }
            }
        }
        finally
        {
            foreach (var buffer in buffers)
                buffer?.Dispose();
        }
    }
}
