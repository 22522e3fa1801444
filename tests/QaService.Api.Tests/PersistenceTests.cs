using System.Net;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>Reports survive a restart (issue "Done when"): same SQLite file, new host, same JSON.</summary>
public sealed class PersistenceTests
{
    [Fact]
    public async Task Report_reads_back_unchanged_after_a_restart()
    {
        var path = Path.Combine(Path.GetTempPath(), $"qaservice-restart-{Guid.NewGuid():N}.db");
        try
        {
            string created;
            Uri location;
            using (var first = new QaServiceFactory(path))
            {
                var response = await first.CreateClient().PostJsonAsync(Requests.Minimal());
                Assert.Equal(HttpStatusCode.Created, response.StatusCode);
                location = response.Headers.Location!;
                created = await response.Content.ReadAsStringAsync();
            }

            using var second = new QaServiceFactory(path);
            var again = await second.CreateClient().GetAsync(location);
            Assert.Equal(HttpStatusCode.OK, again.StatusCode);
            Assert.Equal(created, await again.Content.ReadAsStringAsync());
        }
        finally
        {
            foreach (var file in Directory.GetFiles(Path.GetTempPath(), Path.GetFileName(path) + "*"))
                File.Delete(file);
        }
    }

    [Fact]
    public async Task Ids_carry_at_least_122_random_bits()
    {
        using var factory = new QaServiceFactory();
        var client = factory.CreateClient();
        var ids = new HashSet<string>();
        for (var i = 0; i < 5; i++)
        {
            var response = await client.PostJsonAsync(Requests.Minimal());
            var id = response.Headers.Location!.OriginalString.Split('/')[^1];
            // 22 base64url characters = 132 bits of text; the id encodes 16 random bytes (128 bits).
            Assert.Matches("^[A-Za-z0-9_-]{22}$", id);
            Assert.True(ids.Add(id));
        }
    }
}
