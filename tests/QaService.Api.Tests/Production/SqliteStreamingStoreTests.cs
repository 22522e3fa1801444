using System.Text;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using QaService.Api.Storage;

namespace QaService.Api.Tests.Production;

/// <summary>
/// The SQLite store's streamed paths: a report above the group-commit size is kept as a file beside the database (its row
/// names it; checked here on disk and with the sqlite3 library reading the row back), small ones in the row through the
/// group commit; both read back byte for byte, and a duplicate id fails without losing the stored report or leaving a file.
/// </summary>
public sealed class SqliteStreamingStoreTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("qaservice-stream-").FullName;

    private string DatabasePath => Path.Combine(folder, "r.db");

    private string ReportFolder => DatabasePath + ".reports";

    [Theory]
    [InlineData(3_000_000)]
    [InlineData(20_000)]
    public async Task Stored_bytes_come_back_unchanged_through_every_reader(int length)
    {
        var store = await StoreAsync();
        var json = Json(length, 'é');
        var header = new ReportHeader("t1", "id1", DateTimeOffset.UnixEpoch, "title", "pass");
        await store.SaveAsync(header, new MemoryStream(json), CancellationToken.None);

        Assert.Equal(Encoding.UTF8.GetString(json), await store.FindJsonAsync("t1", "id1", CancellationToken.None));
        Assert.Equal(json, await ReadAllAsync(store, "id1"));
        Assert.Null(await store.OpenJsonAsync("t2", "id1", CancellationToken.None));

        // Where the bytes are: a large report in its file (the row holds none), a small one in the row (SQLite's own length()).
        var (file, rowBytes) = await RowAsync("id1");
        Assert.Equal(length > 1_048_576 ? (long)json.Length : 0, file is null ? 0 : new FileInfo(Path.Combine(ReportFolder, file)).Length);
        Assert.Equal(length > 1_048_576 ? 0 : json.Length, rowBytes);

        var filesBefore = Directory.GetFiles(ReportFolder);
        await Assert.ThrowsAsync<SqliteException>(() => store.SaveAsync(header, new MemoryStream([(byte)'{', (byte)'}']), CancellationToken.None));
        await Assert.ThrowsAsync<SqliteException>(() => store.SaveAsync(header, new MemoryStream(Json(2_000_000, 'x')), CancellationToken.None));
        Assert.Equal(Encoding.UTF8.GetString(json), await store.FindJsonAsync("t1", "id1", CancellationToken.None));
        Assert.Equal(filesBefore, Directory.GetFiles(ReportFolder));
    }

    /// <summary>
    /// Saves arriving together share commits (one prepared insert per batch, values rebound per report); a duplicate id
    /// among them fails alone, and every other report of its batch is stored with its own bytes and title.
    /// </summary>
    [Fact]
    public async Task Concurrent_saves_share_commits_and_a_duplicate_fails_alone()
    {
        var store = await StoreAsync();
        await store.SaveAsync(new ReportHeader("t1", "taken", DateTimeOffset.UnixEpoch, "first", "pass"), new MemoryStream(Json(100, 'a')), CancellationToken.None);
        var saves = Enumerable.Range(0, 60).Select(i => i == 30
            ? store.SaveAsync(new ReportHeader("t1", "taken", DateTimeOffset.UnixEpoch, "second", "fail"), new MemoryStream(Json(100, 'b')), CancellationToken.None)
            : store.SaveAsync(new ReportHeader("t1", $"r{i}", DateTimeOffset.UnixEpoch, i % 2 == 0 ? $"title {i}" : null, "pass"),
                new MemoryStream(Json(200 + i, 'c')), CancellationToken.None)).ToList();
        var outcomes = await Task.WhenAll(saves.Select(async save => { try { await save; return null; } catch (SqliteException e) { return e; } }));

        Assert.Equal([30], outcomes.Select((e, i) => (e, i)).Where(o => o.e is not null).Select(o => o.i));
        Assert.Equal(Json(100, 'a'), await ReadAllAsync(store, "taken"));
        for (var i = 0; i < 60; i++)
        {
            if (i != 30)
                Assert.Equal(Json(200 + i, 'c'), await ReadAllAsync(store, $"r{i}"));
        }
        var titles = await store.ListAsync(new ReportListQuery("t1", 100), CancellationToken.None);
        Assert.Equal("title 58", titles.Items.Single(r => r.Id == "r58").Title);
        Assert.Null(titles.Items.Single(r => r.Id == "r59").Title);
    }

    [Fact]
    public async Task The_spool_is_published_without_a_copy_and_an_unsaved_one_leaves_nothing()
    {
        var store = await StoreAsync();
        var json = Json(1_500_000, 'x');
        string stagedName;
        await using (var spool = store.CreateJsonSpool())
        {
            stagedName = Assert.IsType<StagedReportFile>(spool).FileName;
            await spool.WriteAsync(json);
            spool.Position = 0;
            await store.SaveAsync(new ReportHeader("t1", "kept", DateTimeOffset.UnixEpoch, null, "pass"), spool, CancellationToken.None);
            // The POST answers from the same stream, now the stored file.
            spool.Position = 0;
            var answered = new MemoryStream();
            await spool.CopyToAsync(answered);
            Assert.Equal(json, answered.ToArray());
        }
        var stored = Assert.Single(Directory.GetFiles(ReportFolder));
        Assert.Equal(Path.GetFileName(stored), (await RowAsync("kept")).File);
        Assert.Equal(Path.GetFileName(stored), stagedName);

        await using (var abandoned = store.CreateJsonSpool())
            await abandoned.WriteAsync(json); // a request that failed before saving
        Assert.Equal([stored], Directory.GetFiles(ReportFolder));
    }

    [Fact]
    public async Task Deleting_and_purging_remove_the_files_and_older_in_row_blobs_still_read()
    {
        var store = await StoreAsync();
        await store.SaveAsync(new ReportHeader("t1", "deleted", DateTimeOffset.UnixEpoch, null, "pass"), new MemoryStream(Json(1_200_000, 'x')), CancellationToken.None);
        await store.SaveAsync(new ReportHeader("t1", "purged", DateTimeOffset.UnixEpoch, null, "pass"), new MemoryStream(Json(1_200_000, 'y')), CancellationToken.None);
        await store.SaveAsync(new ReportHeader("t1", "recent", DateTimeOffset.UnixEpoch.AddYears(50), null, "pass"), new MemoryStream(Json(1_200_000, 'z')), CancellationToken.None);
        Assert.Equal(3, Directory.GetFiles(ReportFolder).Length);

        Assert.True(await store.DeleteAsync("t1", "deleted", CancellationToken.None));
        Assert.Equal(1, await store.DeleteCreatedBeforeAsync(DateTimeOffset.UnixEpoch.AddYears(1), 10, CancellationToken.None));
        Assert.Equal((await RowAsync("recent")).File, Path.GetFileName(Assert.Single(Directory.GetFiles(ReportFolder))));

        // A report stored before files (a BLOB of UTF-8 in the row, no file) reads through incremental BLOB I/O as before.
        await using (var connection = new SqliteConnection($"Data Source={DatabasePath};Pooling=False"))
        {
            await connection.OpenAsync();
            await using var command = connection.CreateCommand();
            command.CommandText = "INSERT INTO reports (tenant, id, created_at, verdict, json) VALUES ('t1', 'blob', '2001-01-01', 'pass', CAST('{\"a\":1}' AS BLOB))";
            await command.ExecuteNonQueryAsync();
        }
        Assert.Equal("{\"a\":1}"u8.ToArray(), await ReadAllAsync(store, "blob"));
    }

    [Fact]
    public async Task Reports_in_rows_reach_the_database_file_through_the_background_checkpoint()
    {
        var store = await StoreAsync();
        // Reports just under the group-commit size, enough to pass the checkpoint threshold, all in the WAL.
        var json = Json(1_000_000, 'x');
        var count = (int)(SqliteBackgroundCheckpoint.ThresholdBytes / json.Length) + 2;
        for (var i = 0; i < count; i++)
            await store.SaveAsync(new ReportHeader("t1", $"r{i}", DateTimeOffset.UnixEpoch, null, "pass"), new MemoryStream(json), CancellationToken.None);
        Assert.True((long)count * json.Length > SqliteBackgroundCheckpoint.ThresholdBytes);

        // The commits skipped SQLite's automatic checkpoint; the background one copies the pages into the main file
        // (its length grows past the reports') without anyone here checkpointing.
        var deadline = DateTime.UtcNow.AddSeconds(20);
        var copied = (long)(count - 1) * json.Length;
        while (new FileInfo(DatabasePath).Length < copied && DateTime.UtcNow < deadline)
            await Task.Delay(50);
        Assert.True(new FileInfo(DatabasePath).Length >= copied, $"database file {new FileInfo(DatabasePath).Length} bytes after the checkpoint");
    }

    private async Task<IReportStore> StoreAsync()
    {
        var store = new SqliteReportStore(Options.Create(new StorageOptions { ConnectionString = $"Data Source={DatabasePath}" }));
        await store.InitializeAsync(CancellationToken.None);
        return store;
    }

    /// <summary>A JSON document of about <paramref name="length"/> UTF-8 bytes (é takes two).</summary>
    private static byte[] Json(int length, char filler) =>
        Encoding.UTF8.GetBytes("{\"text\":\"" + new string(filler, (length - 12) / Encoding.UTF8.GetByteCount([filler])) + "\"}");

    private static async Task<byte[]> ReadAllAsync(IReportStore store, string id)
    {
        await using var stream = await store.OpenJsonAsync("t1", id, CancellationToken.None);
        Assert.NotNull(stream);
        var copy = new MemoryStream();
        await stream!.CopyToAsync(copy);
        Assert.Equal(copy.Length, stream.Length);
        return copy.ToArray();
    }

    /// <summary>The row's file name and the length of the JSON it holds itself.</summary>
    private async Task<(string? File, long RowBytes)> RowAsync(string id)
    {
        await using var connection = new SqliteConnection($"Data Source={DatabasePath}");
        await connection.OpenAsync();
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT json_file, length(CAST(json AS BLOB)) FROM reports WHERE id = $id";
        command.Parameters.AddWithValue("$id", id);
        await using var reader = await command.ExecuteReaderAsync();
        Assert.True(await reader.ReadAsync());
        return (reader.IsDBNull(0) ? null : reader.GetString(0), reader.GetInt64(1));
    }

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(folder, recursive: true);
    }
}
