using System.Runtime.InteropServices;
using System.Text;

namespace QaService.Api.Storage;

/// <summary>
/// fsync of a folder, so a file created or renamed in it survives a power cut (POSIX: the new directory entry is durable
/// only once the directory itself is synced). .NET opens no handle on a folder, hence libc. Windows journals the entry
/// with the file: nothing to do there. DllImport with blittable arguments (a NUL-terminated UTF-8 path as bytes) needs no
/// unsafe code, which LibraryImport would.
/// </summary>
internal static class FolderSync
{
    private const int ReadOnlyFlag = 0; // O_RDONLY

    public static void Flush(string folder)
    {
        if (OperatingSystem.IsWindows())
            return;
        var descriptor = Open(Encoding.UTF8.GetBytes(folder + '\0'), ReadOnlyFlag);
        if (descriptor < 0)
            throw new IOException($"cannot open folder {folder} to sync it (errno {Marshal.GetLastPInvokeError()})");
        try
        {
            if (Fsync(descriptor) != 0)
                throw new IOException($"fsync of folder {folder} failed (errno {Marshal.GetLastPInvokeError()})");
        }
        finally
        {
            _ = Close(descriptor);
        }
    }

    [DllImport("libc", EntryPoint = "open", SetLastError = true)]
    private static extern int Open(byte[] path, int flags);

    [DllImport("libc", EntryPoint = "fsync", SetLastError = true)]
    private static extern int Fsync(int descriptor);

    [DllImport("libc", EntryPoint = "close", SetLastError = true)]
    private static extern int Close(int descriptor);
}
