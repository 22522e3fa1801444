using System.Text.Json;

namespace QaService.Api.Tests.ApiChecks;

/// <summary>
/// The house rules for every operation of the OpenAPI document (an endpoint added without its description breaks
/// them): operationId, summary, a described tag; a 2xx with a body schema; problem responses as
/// application/problem+json of the one ProblemDetails schema; under /v1 the bearer (admin: admin-token) security
/// requirement with 401, 429 and 503; 400/413/415 with a request body, 400 with query parameters, 404 with path parameters.
/// </summary>
internal static class OperationConventions
{
    private const string ProblemRef = "#/components/schemas/ProblemDetails";

    public static List<string> Violations(JsonElement document)
    {
        var violations = new List<string>();
        var described = document.TryGetProperty("tags", out var tags)
            ? tags.EnumerateArray().Where(t => t.TryGetProperty("description", out var d) && d.GetString() is { Length: > 0 })
                .Select(t => t.GetProperty("name").GetString()).ToHashSet()
            : [];
        foreach (var path in document.GetProperty("paths").EnumerateObject())
        {
            foreach (var (method, operation) in path.Value.EnumerateObject().Select(o => (o.Name, o.Value)))
                violations.AddRange(Check(path.Name, operation, described).Select(v => $"{method.ToUpperInvariant()} {path.Name}: {v}"));
        }
        return violations;
    }

    private static IEnumerable<string> Check(string path, JsonElement operation, HashSet<string?> describedTags)
    {
        if (Text(operation, "operationId") is null)
            yield return "no operationId (.WithName)";
        if (Text(operation, "summary") is null)
            yield return "no summary (.WithSummary)";
        var operationTags = operation.TryGetProperty("tags", out var t) ? t.EnumerateArray().Select(x => x.GetString()).ToList() : [];
        if (operationTags.Count == 0)
            yield return "no tag (.WithTags)";
        foreach (var tag in operationTags.Where(tag => !describedTags.Contains(tag)))
            yield return $"tag \"{tag}\" has no description (OpenApi/TagDescriptions.cs)";

        var responses = operation.TryGetProperty("responses", out var r) ? r.EnumerateObject().ToDictionary(x => x.Name, x => x.Value) : [];
        var success = responses.Where(x => x.Key.StartsWith('2')).ToList();
        if (success.Count == 0)
            yield return "no 2xx response (.Produces<T>)";
        foreach (var (status, response) in success.Where(x => x.Key != "204"))
        {
            if (!response.TryGetProperty("content", out var content) || !content.EnumerateObject().Any(m => m.Value.TryGetProperty("schema", out _)))
                yield return $"{status} has no body schema (.Produces<T>(status, contentType))";
        }
        foreach (var (status, response) in responses.Where(x => x.Key[0] is '4' or '5'))
        {
            if (!response.TryGetProperty("content", out var content) || !content.TryGetProperty("application/problem+json", out var problem)
                || !problem.TryGetProperty("schema", out var schema) || Text(schema, "$ref") != ProblemRef)
                yield return $"{status} is not application/problem+json of {ProblemRef} (.ProducesProblem)";
        }

        var parameters = operation.TryGetProperty("parameters", out var p) ? p.EnumerateArray().Select(x => Text(x, "in")).ToList() : [];
        var needed = new List<string>();
        if (operation.TryGetProperty("requestBody", out _))
            needed.AddRange(["400", "413", "415"]);
        if (parameters.Contains("query"))
            needed.Add("400");
        if (parameters.Contains("path"))
            needed.Add("404");
        if (path == "/v1" || path.StartsWith("/v1/", StringComparison.Ordinal))
        {
            needed.AddRange(["401", "429", "503"]);
            var admin = path.StartsWith("/v1/admin/", StringComparison.Ordinal);
            if (admin)
                needed.Add("403");
            var scheme = admin ? "adminToken" : "bearer";
            var requirements = operation.TryGetProperty("security", out var s) ? s.EnumerateArray().ToList() : [];
            if (!requirements.Any(x => x.TryGetProperty(scheme, out _)))
                yield return $"no security requirement naming \"{scheme}\"";
        }
        foreach (var status in needed.Distinct().Where(status => !responses.ContainsKey(status)))
            yield return $"no {status} problem response (.ProducesProblem({status}))";
    }

    private static string? Text(JsonElement element, string name) =>
        element.TryGetProperty(name, out var value) && value.ValueKind == JsonValueKind.String && value.GetString() is { Length: > 0 } text ? text : null;
}
