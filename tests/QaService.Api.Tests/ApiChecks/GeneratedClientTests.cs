using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;
using QaService.Api.Tests.Support;
using QaService.Tests.Shared;
using Xunit.Abstractions;

namespace QaService.Api.Tests.ApiChecks;

/// <summary>
/// A TypeScript client made only from the document: the real service runs as a child process, openapi-typescript
/// 7.13.0 generates types from its live /openapi/v1.json, tsc 5.9 type-checks tools/api-checks/client against them
/// (a wrong field name fails compilation), and node runs it against the service: a JSON and a multipart assessment,
/// each read back, with the figures checked against the contract's definitions (see the script's comments).
/// </summary>
public sealed class GeneratedClientTests(ITestOutputHelper output)
{
    public static TheoryData<string> Modes => ["none", "keys"];

    [Theory]
    [MemberData(nameof(Modes))]
    public async Task Client_generated_from_the_document_posts_json_and_multipart_and_reads_the_report(string authMode)
    {
        var (openapiTypescript, tsc) = (NodeTools.Bin("openapi-typescript"), NodeTools.Bin("tsc"));
        var settings = new Dictionary<string, string> { ["Auth:Mode"] = authMode, ["Demo:Enabled"] = "false", ["WarmUp:Enabled"] = "false" };
        if (authMode == "keys")
            settings["Auth:AdminToken"] = KeysHost.AdminToken;
        await using var service = await ServiceProcess.StartAsync(settings);
        // Beside tools/api-checks/node_modules, so the script's import of openapi-fetch resolves.
        var work = Directory.CreateDirectory(Path.Combine(NodeTools.Folder, ".work", Guid.NewGuid().ToString("N"))).FullName;
        try
        {
            await File.WriteAllTextAsync(Path.Combine(work, "openapi.json"), await service.Http.GetStringAsync("openapi/v1.json"));
            await RunAsync(work, openapiTypescript, "openapi.json", "--output", "api.d.ts");
            foreach (var file in Directory.GetFiles(Path.Combine(NodeTools.Folder, "client")))
                File.Copy(file, Path.Combine(work, Path.GetFileName(file)));
            await RunAsync(work, tsc, "--project", "tsconfig.json");

            var key = authMode == "keys" ? await CreateTenantKeyAsync(service) : null;
            var run = await RunAsync(work, "assessment-client.mjs", key is null ? [service.BaseAddress.ToString()] : [service.BaseAddress.ToString(), key]);
            Assert.Contains("client checks passed", run);
            Assert.DoesNotContain("FAIL", run);

            if (key is not null)
            {
                // The same client without its key: the service answers 401 and the script stops with it.
                var (exit, stdout, stderr) = await NodeTools.RunNodeAsync(work, "assessment-client.mjs", service.BaseAddress.ToString());
                output.WriteLine($"without a key: exit {exit}\n{stdout}{stderr}");
                Assert.NotEqual(0, exit);
                Assert.Contains("JSON POST answered 401", stderr);
            }
        }
        finally
        {
            Directory.Delete(work, recursive: true);
        }
    }

    /// <summary>Runs a node script and fails with its output unless it exits 0; returns standard output.</summary>
    private async Task<string> RunAsync(string work, string script, params string[] args)
    {
        var (exit, stdout, stderr) = await NodeTools.RunNodeAsync(work, script, args);
        output.WriteLine($"node {Path.GetFileName(script)} {string.Join(' ', args.Select(a => a.StartsWith("qak_", StringComparison.Ordinal) ? "qak_…" : a))}: exit {exit}\n{stdout}{stderr}");
        Assert.True(exit == 0, $"{Path.GetFileName(script)} exited {exit}:\n{stdout}\n{stderr}");
        return stdout;
    }

    private static async Task<string> CreateTenantKeyAsync(ServiceProcess service)
    {
        using var request = new HttpRequestMessage(HttpMethod.Post, "v1/admin/tenants") { Content = JsonContent.Create(new { name = "alderbrook-fen" }) };
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", KeysHost.AdminToken);
        var response = await service.Http.SendAsync(request);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement.GetProperty("apiKey").GetString()!;
    }
}
