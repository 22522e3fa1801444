using Microsoft.Data.Sqlite;

namespace QaService.Api.Storage;

/// <summary>
/// The folder beside a SQLite database (<c>&lt;database file&gt;.reports/</c>) where reports above the group-commit size
/// are kept as plain files, one per row (<c>reports.json_file</c>): SQLite's own advice for large blobs
/// (https://sqlite.org/intern-v-extern-blob.html); a 71 MB report took ~450 ms through incremental BLOB I/O, writing and
/// fsyncing the same bytes to a file ~85 ms.
/// A file is written once, made durable before its row is inserted, and removed after its row is deleted; a crash
/// between the two leaves an orphan, removed at the next start.
/// </summary>
internal sealed class SqliteReportFiles
{
    public const string ReportSuffix = ".json";
    public const string StagingSuffix = ".partial";

    private const string FolderSuffix = ".reports";

    public SqliteReportFiles(string connectionString)
    {
        var builder = new SqliteConnectionStringBuilder(connectionString);
        // An in-memory database has no file to sit beside: its reports live as long as the process, in a fresh temporary folder.
        Folder = builder.Mode == SqliteOpenMode.Memory || string.IsNullOrEmpty(builder.DataSource) || builder.DataSource == ":memory:"
            ? Path.Combine(Path.GetTempPath(), $"qaservice-{Guid.NewGuid():N}{FolderSuffix}")
            : Path.GetFullPath(builder.DataSource) + FolderSuffix;
    }

    public string Folder { get; }

    public string PathOf(string fileName) => Path.Combine(Folder, fileName);

    public StagedReportFile CreateStaged() => StagedReportFile.Create(this);

    public void Sync() => FolderSync.Flush(Folder);

    /// <summary>Removes a report's file; a file already gone is not an error (a delete retried after a crash).</summary>
    public void Delete(string fileName) => File.Delete(PathOf(fileName));

    /// <summary>
    /// Creates the folder and removes what no row names: staging files of interrupted requests and published files whose
    /// row never committed. Only at start, before requests are served. Returns how many files were removed.
    /// </summary>
    public int RemoveOrphans(IReadOnlySet<string> namedByRows)
    {
        Directory.CreateDirectory(Folder);
        var removed = 0;
        foreach (var path in Directory.EnumerateFiles(Folder))
        {
            var name = Path.GetFileName(path);
            var orphan = name.EndsWith(StagingSuffix, StringComparison.Ordinal)
                         || (name.EndsWith(ReportSuffix, StringComparison.Ordinal) && !namedByRows.Contains(name));
            if (!orphan)
                continue;
            File.Delete(path);
            removed++;
        }
        return removed;
    }
}
