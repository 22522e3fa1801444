using System.Text;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using QaService.Api.Storage;

namespace QaService.Api.Tests.Production;

/// <summary>
/// The SQLite store's streamed paths: a report above the group-commit size goes in through incremental BLOB I/O
/// (SQLite sqlite3_blob_open, checked here with the sqlite3 library itself reading the row back), small ones through
/// the group commit; both read back byte for byte, and a duplicate id fails without losing the stored report.
/// </summary>
public sealed class SqliteStreamingStoreTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("qaservice-stream-").FullName;

    [Theory]
    [InlineData(3_000_000)]
    [InlineData(20_000)]
    public async Task Stored_bytes_come_back_unchanged_through_every_reader(int length)
    {
        var store = new SqliteReportStore(Options.Create(new StorageOptions { ConnectionString = $"Data Source={Path.Combine(folder, "r.db")}" }));
        await store.InitializeAsync(CancellationToken.None);
        var json = Encoding.UTF8.GetBytes("{\"text\":\"" + new string('é', (length - 12) / 2) + "\"}");
        var header = new ReportHeader("t1", "id1", DateTimeOffset.UnixEpoch, "title", "pass");
        await ((IReportStore)store).SaveAsync(header, new MemoryStream(json), CancellationToken.None);

        Assert.Equal(Encoding.UTF8.GetString(json), await store.FindJsonAsync("t1", "id1", CancellationToken.None));
        await using (var stream = await ((IReportStore)store).OpenJsonAsync("t1", "id1", CancellationToken.None))
        {
            Assert.NotNull(stream);
            Assert.Equal(json.Length, stream!.Length);
            var copy = new MemoryStream();
            await stream.CopyToAsync(copy);
            Assert.Equal(json, copy.ToArray());
        }
        Assert.Null(await ((IReportStore)store).OpenJsonAsync("t2", "id1", CancellationToken.None));

        // SQLite's own length() of the stored value: the whole UTF-8 text, nothing padded.
        await using (var connection = new SqliteConnection($"Data Source={Path.Combine(folder, "r.db")}"))
        {
            await connection.OpenAsync();
            await using var command = connection.CreateCommand();
            command.CommandText = "SELECT length(CAST(json AS BLOB)) FROM reports WHERE id = 'id1'";
            Assert.Equal((long)json.Length, (long)(await command.ExecuteScalarAsync())!);
        }

        await Assert.ThrowsAsync<SqliteException>(() => ((IReportStore)store).SaveAsync(header, new MemoryStream([(byte)'{', (byte)'}']), CancellationToken.None));
        Assert.Equal(Encoding.UTF8.GetString(json), await store.FindJsonAsync("t1", "id1", CancellationToken.None));
    }

    [Fact]
    public async Task A_large_report_reaches_the_database_file_through_the_background_checkpoint()
    {
        var path = Path.Combine(folder, "c.db");
        var store = new SqliteReportStore(Options.Create(new StorageOptions { ConnectionString = $"Data Source={path}" }));
        await store.InitializeAsync(CancellationToken.None);
        var json = Encoding.UTF8.GetBytes("{\"text\":\"" + new string('x', (int)SqliteBackgroundCheckpoint.ThresholdBytes) + "\"}");
        await ((IReportStore)store).SaveAsync(new ReportHeader("t1", "big", DateTimeOffset.UnixEpoch, null, "pass"), new MemoryStream(json), CancellationToken.None);

        // The commit skipped SQLite's automatic checkpoint; the background one copies the pages into the main file
        // (its length grows past the report's) without anyone here checkpointing.
        var deadline = DateTime.UtcNow.AddSeconds(20);
        while (new FileInfo(path).Length < json.Length && DateTime.UtcNow < deadline)
            await Task.Delay(50);
        Assert.True(new FileInfo(path).Length >= json.Length, $"database file {new FileInfo(path).Length} bytes after the checkpoint");
    }

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(folder, recursive: true);
    }
}
