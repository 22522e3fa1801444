namespace QaService.Api.Storage;

/// <summary>The default place a large report is serialised to before it is stored: a self-deleting temporary file.</summary>
internal static class TemporaryJsonSpool
{
    public const int FileBufferBytes = 81_920;

    public static Stream Create() =>
        new FileStream(Path.Combine(Path.GetTempPath(), $"qaservice-report-{Guid.NewGuid():N}.json"), FileMode.CreateNew, FileAccess.ReadWrite,
            FileShare.None, FileBufferBytes, FileOptions.DeleteOnClose | FileOptions.Asynchronous);
}
