using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Http.Metadata;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.ApiChecks;

/// <summary>
/// Convention tests over the generated document and the endpoint data source (issue: OpenAPI for generated
/// clients): every endpoint is described or deliberately left out, and every described operation follows
/// <see cref="OperationConventions"/>. Requirements from OpenAPI 3.1.1 (security requirement objects, encoding
/// objects) and RFC 9457 (problem details).
/// </summary>
public sealed class OpenApiConventionTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    /// <summary>Endpoints mapped from a bare RequestDelegate, which the API explorer never sees: the Prometheus scrape.</summary>
    private static readonly HashSet<string> UndescribedByDesign = ["/metrics"];

    private async Task<JsonElement> DocumentAsync() =>
        JsonDocument.Parse(await host.Factory.CreateClient().GetStringAsync("/openapi/v1.json")).RootElement;

    [Fact]
    public async Task Every_operation_follows_the_conventions()
    {
        var document = await DocumentAsync();
        var violations = OperationConventions.Violations(document);
        Assert.True(violations.Count == 0, "describe these endpoints:\n" + string.Join("\n", violations));
        Assert.True(document.GetProperty("paths").EnumerateObject().Count() >= 10, "the document lost its paths");
    }

    [Fact]
    public async Task Conventions_catch_an_endpoint_mapped_without_its_description()
    {
        // What the framework writes for app.MapGet("/v1/projects/{id}", handler) with no metadata: a bare 200.
        var document = JsonNode.Parse((await DocumentAsync()).GetRawText())!;
        document["paths"]!["/v1/projects/{id}"] = JsonNode.Parse("""
            { "get": { "parameters": [ { "name": "id", "in": "path", "required": true, "schema": { "type": "string" } } ],
                       "responses": { "200": { "description": "OK" } } } }
            """);
        var violations = OperationConventions.Violations(JsonDocument.Parse(document.ToJsonString()).RootElement);
        foreach (var expected in new[] { "no operationId", "no summary", "no tag", "200 has no body schema", "no security requirement naming \"bearer\"",
                     "no 401 problem", "no 404 problem", "no 429 problem", "no 503 problem" })
            Assert.Contains(violations, v => v.StartsWith("GET /v1/projects/{id}: " + expected, StringComparison.Ordinal));
    }

    [Fact]
    public async Task Every_mapped_endpoint_is_described_or_deliberately_excluded()
    {
        var document = await DocumentAsync();
        var operationIds = document.GetProperty("paths").EnumerateObject()
            .SelectMany(p => p.Value.EnumerateObject()).Select(o => o.Value.GetProperty("operationId").GetString()).ToHashSet();
        var endpoints = host.Factory.Services.GetRequiredService<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>()
            .Where(e => e.Metadata.GetMetadata<HttpMethodMetadata>() is not null).ToList();
        Assert.NotEmpty(endpoints);
        var missing = endpoints
            .Where(e => e.Metadata.GetMetadata<IExcludeFromDescriptionMetadata>() is not { ExcludeFromDescription: true })
            .Where(e => !operationIds.Contains(e.Metadata.GetMetadata<IEndpointNameMetadata>()?.EndpointName))
            .Where(e => !UndescribedByDesign.Contains(e.RoutePattern.RawText ?? ""))
            .Select(e => $"{string.Join(",", e.Metadata.GetMetadata<HttpMethodMetadata>()!.HttpMethods)} {e.RoutePattern.RawText}")
            .ToList();
        Assert.True(missing.Count == 0, "not in the OpenAPI document (describe it, or .ExcludeFromDescription() for pages and probes):\n" + string.Join("\n", missing));
    }

    [Fact]
    public async Task Assessment_request_is_described_as_json_and_as_multipart_parts()
    {
        var post = (await DocumentAsync()).GetProperty("paths").GetProperty("/v1/assessments").GetProperty("post");
        var content = post.GetProperty("requestBody").GetProperty("content");
        var json = content.GetProperty("application/json").GetProperty("schema").GetProperty("properties");
        Assert.True(json.GetProperty("marks").GetProperty("properties").TryGetProperty("points", out _));

        var multipart = content.GetProperty("multipart/form-data");
        var parts = multipart.GetProperty("schema").GetProperty("properties");
        // options: the JSON request without points (UploadOptions), plus how to read the files.
        var options = parts.GetProperty("options").GetProperty("properties");
        Assert.False(options.GetProperty("marks").GetProperty("properties").TryGetProperty("points", out _));
        Assert.True(options.GetProperty("fixes").GetProperty("properties").TryGetProperty("columns", out _));
        Assert.True(options.TryGetProperty("spec", out _));
        foreach (var file in new[] { "marks", "fixes" })
        {
            Assert.Equal("binary", parts.GetProperty(file).GetProperty("format").GetString());
            Assert.Contains("text/csv", multipart.GetProperty("encoding").GetProperty(file).GetProperty("contentType").GetString());
        }
        Assert.Equal("application/json", multipart.GetProperty("encoding").GetProperty("options").GetProperty("contentType").GetString());
        Assert.Equal(["marks", "fixes"], multipart.GetProperty("schema").GetProperty("required").EnumerateArray().Select(x => x.GetString()));
        Assert.Equal("#/components/schemas/AssessmentReport",
            post.GetProperty("responses").GetProperty("201").GetProperty("content").GetProperty("application/json").GetProperty("schema").GetProperty("$ref").GetString());
    }

    [Fact]
    public async Task Problem_schema_carries_trace_id_and_pointer_errors()
    {
        var problem = (await DocumentAsync()).GetProperty("components").GetProperty("schemas").GetProperty("ProblemDetails");
        var properties = problem.GetProperty("properties");
        foreach (var member in new[] { "type", "title", "status", "detail", "instance", "traceId", "errors" })
            Assert.True(properties.TryGetProperty(member, out _), member);
        var error = properties.GetProperty("errors").GetProperty("items").GetProperty("properties");
        Assert.True(error.TryGetProperty("pointer", out _) && error.TryGetProperty("message", out _));
        Assert.Equal("integer", properties.GetProperty("status").GetProperty("type").GetString());
    }

    [Theory]
    [InlineData("none", true)]
    [InlineData("keys", false)]
    public async Task Security_schemes_are_http_bearer_and_say_when_a_key_is_needed(string mode, bool anonymousAllowed)
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Auth:Mode"] = mode });
        var document = JsonDocument.Parse(await factory.CreateClient().GetStringAsync("/openapi/v1.json")).RootElement;
        var schemes = document.GetProperty("components").GetProperty("securitySchemes");
        foreach (var name in new[] { "bearer", "adminToken" })
        {
            Assert.Equal("http", schemes.GetProperty(name).GetProperty("type").GetString());
            Assert.Equal("bearer", schemes.GetProperty(name).GetProperty("scheme").GetString());
        }
        Assert.Contains("Auth:Mode=none", schemes.GetProperty("bearer").GetProperty("description").GetString());
        Assert.Contains("Auth:AdminToken", schemes.GetProperty("adminToken").GetProperty("description").GetString());

        // An empty requirement object means "no authentication" (OpenAPI 3.1.1 §4.8.30): offered only without keys.
        var security = document.GetProperty("paths").GetProperty("/v1/assessments").GetProperty("post").GetProperty("security").EnumerateArray().ToList();
        Assert.Equal(anonymousAllowed, security.Any(r => !r.EnumerateObject().Any()));
        var admin = document.GetProperty("paths").GetProperty("/v1/admin/tenants").GetProperty("post").GetProperty("security").EnumerateArray().ToList();
        Assert.True(admin.Count == 1 && admin[0].TryGetProperty("adminToken", out _), "admin operations need the admin token in every mode");
    }
}
