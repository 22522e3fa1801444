using System.Net.Http.Json;
using System.Text;
using System.Text.Json.Nodes;

namespace QaService.Api.Tests.Support;

/// <summary>Small request bodies for error-path tests (invented values; they test shape, not accuracy).</summary>
public static class Requests
{
    /// <summary>A valid two-mark request: marks in UTM 33N, fixes in lat/lon/h.</summary>
    public static JsonObject Minimal() => JsonNode.Parse("""
        {
          "title": "error-path fixture",
          "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal", "points": [
            { "id": "A", "e": 500000.0, "n": 5400000.0, "h": 200.0 },
            { "id": "B", "e": 500100.0, "n": 5400100.0, "h": 201.0 } ] },
          "fixes": { "crs": "EPSG:4326", "heights": "ellipsoidal", "points": [
            { "id": "F1", "mark": "A", "lat": 48.753013, "lon": 15.0, "h": 200.1 } ] },
          "spec": { "standard": "nssda", "horizontal": 0.5 }
        }
        """)!.AsObject();

    public static Task<HttpResponseMessage> PostJsonAsync(this HttpClient client, JsonNode body) =>
        client.PostAsync("/v1/assessments", new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json"));

    public static Task<HttpResponseMessage> PostRawAsync(this HttpClient client, string body, string mediaType = "application/json") =>
        client.PostAsync("/v1/assessments", new StringContent(body, Encoding.UTF8, mediaType));
}
