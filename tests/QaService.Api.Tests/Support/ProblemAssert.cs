using System.Net;
using System.Text.Json;

namespace QaService.Api.Tests.Support;

/// <summary>Asserts the api-v1 error shape: RFC 9457 problem details, with a pointer for bad input.</summary>
public static class ProblemAssert
{
    public static async Task<JsonElement> IsProblemAsync(HttpResponseMessage response, HttpStatusCode status)
    {
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(status == response.StatusCode, $"expected {(int)status}, got {(int)response.StatusCode}: {body}");
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var problem = JsonDocument.Parse(body).RootElement;
        Assert.Equal((int)status, problem.GetProperty("status").GetInt32());
        Assert.False(string.IsNullOrWhiteSpace(problem.GetProperty("title").GetString()));
        Assert.False(string.IsNullOrWhiteSpace(problem.GetProperty("detail").GetString()));
        return problem;
    }

    /// <summary>A 400 whose errors array names <paramref name="pointer"/> with a message containing <paramref name="fragment"/>.</summary>
    public static async Task<JsonElement> IsBadInputAsync(HttpResponseMessage response, string pointer, string fragment)
    {
        var problem = await IsProblemAsync(response, HttpStatusCode.BadRequest);
        var errors = problem.GetProperty("errors").EnumerateArray().ToList();
        Assert.Contains(errors, e => e.GetProperty("pointer").GetString() == pointer
                                     && e.GetProperty("message").GetString()!.Contains(fragment, StringComparison.OrdinalIgnoreCase));
        return problem;
    }
}
