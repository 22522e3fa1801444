using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Projects;

/// <summary>Requests for project and sign-off tests, built on case 0 of tests/reference-data/assessment-cases.json.</summary>
public static class ProjectRequests
{
    public static Task<HttpResponseMessage> PostProjectAsync(this HttpClient client, string body) =>
        client.PostAsync("/v1/projects", new StringContent(body, Encoding.UTF8, "application/json"));

    /// <summary>Creates a project and returns its id.</summary>
    public static async Task<string> CreateProjectAsync(this HttpClient client, string name, string specJson)
    {
        var response = await client.PostProjectAsync($$"""{ "name": {{JsonSerializer.Serialize(name)}}, "spec": {{specJson}} }""");
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement.GetProperty("id").GetString()!;
    }

    /// <summary>Case 0's JSON request (24 points) with its spec removed or replaced, and optionally a projectId.</summary>
    public static JsonObject Case0(JsonElement cases, string? projectId, JsonObject? spec)
    {
        var request = JsonNode.Parse(cases[0].GetProperty("request").GetRawText())!.AsObject();
        request.Remove("spec");
        if (spec is not null)
            request["spec"] = spec;
        if (projectId is not null)
            request["projectId"] = projectId;
        return request;
    }

    /// <summary>Posts an assessment and returns its id and the exact bytes of the 201 body.</summary>
    public static async Task<(string Id, byte[] Body)> AssessAsync(this HttpClient client, JsonNode request)
    {
        var response = await client.PostJsonAsync(request);
        var body = await response.Content.ReadAsByteArrayAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, Encoding.UTF8.GetString(body));
        return (response.Headers.Location!.OriginalString.Split('/')[^1], body);
    }

    public static Task<HttpResponseMessage> PostDecisionAsync(this HttpClient client, string assessmentId, object body) =>
        client.PostAsJsonAsync($"/v1/assessments/{assessmentId}/decisions", body);

    /// <summary>Case 0's expected horizontal NSSDA 95 % (numpy, make-assessment-cases.py), metres.</summary>
    public static double Case0HorizontalNssda95(JsonElement cases) =>
        cases[0].GetProperty("expected").GetProperty("horizontal").GetProperty("nssda95").GetDouble();
}
