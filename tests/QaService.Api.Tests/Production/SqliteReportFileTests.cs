using System.Globalization;
using System.Net;
using System.Net.Http.Json;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using Microsoft.Data.Sqlite;
using QaService.Api.Tests.Projects;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>
/// Reports above the group-commit size (1 MiB) kept as files beside the SQLite database (<c>&lt;db&gt;.reports/</c>):
/// an upload of 8,000 fixes (~1.4 MB of report JSON) goes through every reader byte for byte, survives a restart, and its
/// file goes with DELETE; files no row names are removed at start.
/// </summary>
public sealed class SqliteReportFileTests : IDisposable
{
    private const int FixCount = 8_000;
    private const int GroupCommitMaximumBytes = 1_048_576;

    private readonly string databasePath = Path.Combine(Path.GetTempPath(), $"qaservice-files-{Guid.NewGuid():N}.db");

    private string ReportFolder => databasePath + ".reports";

    [Fact]
    public async Task A_large_report_is_one_file_read_by_every_view_kept_across_a_restart_and_deleted_with_its_row()
    {
        string id, sha256;
        using (var first = new QaServiceFactory(databasePath))
        {
            var client = first.CreateClient();
            var project = await client.CreateProjectAsync("Larkfield mains", """{ "standard": "nssda", "horizontal": 0.5, "vertical": 1.0 }""");
            var created = await client.PostFormAsync(LargeUpload(project));
            var body = await created.Content.ReadAsByteArrayAsync();
            Assert.True(created.StatusCode == HttpStatusCode.Created, Encoding.UTF8.GetString(body[..Math.Min(body.Length, 2000)]));
            Assert.True(body.Length > GroupCommitMaximumBytes, $"{body.Length} bytes");
            id = created.Headers.Location!.OriginalString.Split('/')[^1];
            sha256 = Convert.ToHexStringLower(SHA256.HashData(body));

            // One file, named by the row, holding exactly the bytes answered; the row itself holds no JSON.
            var file = Assert.Single(Directory.GetFiles(ReportFolder));
            Assert.Equal(sha256, Convert.ToHexStringLower(SHA256.HashData(await File.ReadAllBytesAsync(file))));
            Assert.Equal((Path.GetFileName(file), ""), await RowAsync(id));

            Assert.Equal(sha256, await Sha256Async(client, $"/v1/assessments/{id}"));
            foreach (var view in new[] { "report.html", "residuals.csv", "residuals.geojson" })
                Assert.Equal(HttpStatusCode.OK, (await client.GetAsync($"/v1/assessments/{id}/{view}")).StatusCode);

            // Share link, decision hash and the project's delivery figures all read the file.
            var link = await client.PostAsJsonAsync($"/v1/assessments/{id}/share-links", new { expiresInHours = 1 });
            Assert.Equal(HttpStatusCode.Created, link.StatusCode);
            var url = JsonDocument.Parse(await link.Content.ReadAsStringAsync()).RootElement.GetProperty("url").GetString()!;
            var shared = await client.GetAsync(url);
            Assert.Equal(HttpStatusCode.OK, shared.StatusCode);
            Assert.Contains("Larkfield file-backed", await shared.Content.ReadAsStringAsync());
            Assert.Equal(HttpStatusCode.OK, (await client.GetAsync(url.Replace("/report.html", "/residuals.csv", StringComparison.Ordinal))).StatusCode);

            var decision = await client.PostDecisionAsync(id, new { decision = "accepted", by = "A. Lund" });
            Assert.Equal(HttpStatusCode.Created, decision.StatusCode);
            Assert.Equal(sha256, JsonDocument.Parse(await decision.Content.ReadAsStringAsync()).RootElement.GetProperty("reportSha256").GetString());

            var trend = JsonDocument.Parse(await client.GetStringAsync($"/v1/projects/{project}")).RootElement.GetProperty("trend");
            Assert.Equal(FixCount, Assert.Single(trend.EnumerateArray()).GetProperty("horizontalN").GetInt32());
        }

        using var second = new QaServiceFactory(databasePath);
        var again = second.CreateClient();
        Assert.Equal(sha256, await Sha256Async(again, $"/v1/assessments/{id}"));

        Assert.Equal(HttpStatusCode.NoContent, (await again.DeleteAsync($"/v1/assessments/{id}")).StatusCode);
        Assert.Equal(HttpStatusCode.NotFound, (await again.GetAsync($"/v1/assessments/{id}")).StatusCode);
        Assert.Empty(Directory.GetFiles(ReportFolder));
    }

    [Fact]
    public async Task Staging_files_and_files_no_row_names_are_removed_at_start()
    {
        string id;
        using (var first = new QaServiceFactory(databasePath))
        {
            var created = await first.CreateClient().PostFormAsync(LargeUpload(null));
            Assert.Equal(HttpStatusCode.Created, created.StatusCode);
            id = created.Headers.Location!.OriginalString.Split('/')[^1];
        }
        var kept = Assert.Single(Directory.GetFiles(ReportFolder));
        // What a crash leaves: a report still being written, and one written whose row never committed.
        var partial = Path.Combine(ReportFolder, $"{Guid.NewGuid():N}.partial");
        var orphan = Path.Combine(ReportFolder, $"{Guid.NewGuid():N}.json");
        await File.WriteAllTextAsync(partial, "{\"half");
        await File.WriteAllTextAsync(orphan, "{}");

        using var second = new QaServiceFactory(databasePath);
        var client = second.CreateClient();
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync($"/v1/assessments/{id}")).StatusCode);
        Assert.Equal([kept], Directory.GetFiles(ReportFolder));
    }

    /// <summary>Marks on a 40 m grid and <see cref="FixCount"/> fixes a few millimetres off them, as CSV in EPSG:32633.</summary>
    private static MultipartFormDataContent LargeUpload(string? projectId)
    {
        const int markCount = 100;
        var marks = new StringBuilder("id,e,n,h\n");
        for (var i = 0; i < markCount; i++)
            marks.Append(CultureInfo.InvariantCulture, $"M{i},{500000 + 40 * (i % 10)}.000,{5400000 + 40 * (i / 10)}.000,200.000\n");
        var fixes = new StringBuilder("id,mark,e,n,h\n");
        for (var i = 0; i < FixCount; i++)
        {
            var mark = i % markCount;
            double Offset(int salt) => ((i * salt) % 17 - 8) * 0.002;
            fixes.Append(CultureInfo.InvariantCulture,
                $"F{i},M{mark},{500000 + 40 * (mark % 10) + Offset(37):F3},{5400000 + 40 * (mark / 10) + Offset(53):F3},{200 + Offset(71):F3}\n");
        }
        var project = projectId is null ? "" : $", \"projectId\": \"{projectId}\"";
        var options = $$"""{ "title": "Larkfield file-backed", "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal" }, "fixes": { "crs": "EPSG:32633", "heights": "ellipsoidal" }{{project}} }""";
        return Uploads.Form(options, marks.ToString(), fixes.ToString());
    }

    private static async Task<string> Sha256Async(HttpClient client, string path)
    {
        var response = await client.GetAsync(path);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        return Convert.ToHexStringLower(SHA256.HashData(await response.Content.ReadAsByteArrayAsync()));
    }

    private async Task<(string? File, string Json)> RowAsync(string id)
    {
        await using var connection = new SqliteConnection($"Data Source={databasePath};Pooling=False");
        await connection.OpenAsync();
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT json_file, json FROM reports WHERE id = $id";
        command.Parameters.AddWithValue("$id", id);
        await using var reader = await command.ExecuteReaderAsync();
        Assert.True(await reader.ReadAsync());
        return (reader.IsDBNull(0) ? null : reader.GetString(0), reader.GetString(1));
    }

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        foreach (var file in Directory.GetFiles(Path.GetDirectoryName(databasePath)!, Path.GetFileName(databasePath) + "*"))
            File.Delete(file);
        if (Directory.Exists(ReportFolder))
            Directory.Delete(ReportFolder, recursive: true);
    }
}
