namespace QaService.Api.Storage;

/// <summary>
/// A report's JSON being written under a staging name (<c>*.partial</c>) in the SQLite store's report folder. Publishing
/// makes it durable under its final name; disposing an unpublished one deletes it, so a failed request leaves nothing.
/// After publishing the stream stays open on the same bytes (the POST response reads them back).
/// </summary>
internal sealed class StagedReportFile : ForwardingStream
{
    private readonly string stagingPath;

    private StagedReportFile(SqliteReportFiles folder, string name, FileStream file) : base(file)
    {
        Folder = folder;
        FileName = name;
        stagingPath = file.Name;
    }

    /// <summary>The folder this file belongs to.</summary>
    public SqliteReportFiles Folder { get; }

    /// <summary>The final file name (in <see cref="Folder"/>) the row refers to once published.</summary>
    public string FileName { get; }

    public static StagedReportFile Create(SqliteReportFiles folder)
    {
        var name = $"{Guid.NewGuid():N}{SqliteReportFiles.ReportSuffix}";
        // Shared read: once published, GETs of the report may open the file while this stream still answers the POST.
        var file = new FileStream(folder.PathOf(Path.ChangeExtension(name, SqliteReportFiles.StagingSuffix)), FileMode.CreateNew, FileAccess.ReadWrite,
            FileShare.Read | FileShare.Delete, TemporaryJsonSpool.FileBufferBytes, FileOptions.Asynchronous);
        return new StagedReportFile(folder, name, file);
    }

    /// <summary>fsyncs the bytes, renames the file to <see cref="FileName"/> and fsyncs the folder: durable before any row names it.</summary>
    public void Publish()
    {
        ((FileStream)Inner).Flush(flushToDisk: true);
        File.Move(stagingPath, Folder.PathOf(FileName));
        Folder.Sync();
    }

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing)
            File.Delete(stagingPath); // no-op once published (renamed away)
    }

    public override async ValueTask DisposeAsync()
    {
        await base.DisposeAsync();
        File.Delete(stagingPath);
    }
}
