using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;
using QaService.Core.Assessment;

namespace QaService.Api.Tests.Projects;

/// <summary>
/// Projects: create and validate (the assessment request's own spec rules), deliveries inherit the project's spec when
/// they bring none and keep their own when they do. Figures come from case 0 of tests/reference-data/assessment-cases.json
/// (make-assessment-cases.py: PROJ cs2cs, numpy): horizontal NSSDA 95 % = 0.749 m.
/// </summary>
public sealed class ProjectTests(ReferenceCaseTests.Host host) : IClassFixture<ReferenceCaseTests.Host>
{
    private readonly HttpClient client = host.Factory.CreateClient();

    /// <summary>A spec case 0 fails (0.5 m &lt; 0.749 m) and one it passes (1.0 m), checked against the reference value below.</summary>
    private const double StrictHorizontalMetres = 0.5, LooseHorizontalMetres = 1.0;

    [Fact]
    public async Task Create_answers_201_with_location_and_the_spec_as_sent()
    {
        // featureClasses is part of the assessment spec once that type knows it; sent only when it does (strict reading).
        bool featureClasses = typeof(AccuracySpec).GetProperty("FeatureClasses") is not null;
        var spec = featureClasses
            ? """{"standard":"nssda","horizontal":0.3,"vertical":0.5,"featureClasses":{"valve":{"horizontal":0.10,"vertical":0.15},"hydrant":{"horizontal":0.50}}}"""
            : """{"standard":"nssda","horizontal":0.3,"vertical":0.5}""";
        var response = await client.PostProjectAsync($$"""{ "name": "Eastbrook water mains 2026", "spec": {{spec}} }""");
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var body = JsonDocument.Parse(text).RootElement;
        var id = body.GetProperty("id").GetString()!;
        Assert.Equal($"/v1/projects/{id}", response.Headers.Location!.OriginalString);
        Assert.Equal("Eastbrook water mains 2026", body.GetProperty("name").GetString());
        Assert.True(JsonNode.DeepEquals(JsonNode.Parse(spec), JsonNode.Parse(body.GetProperty("spec").GetRawText())));

        var read = JsonDocument.Parse(await client.GetStringAsync($"/v1/projects/{id}")).RootElement;
        Assert.True(JsonNode.DeepEquals(JsonNode.Parse(spec), JsonNode.Parse(read.GetProperty("spec").GetRawText())));
        Assert.Empty(read.GetProperty("assessments").EnumerateArray());
        var list = JsonDocument.Parse(await client.GetStringAsync("/v1/projects")).RootElement.GetProperty("projects");
        Assert.Contains(list.EnumerateArray(), p => p.GetProperty("id").GetString() == id);
    }

    [Theory]
    [InlineData("""{ "spec": { "horizontal": 0.5 } }""", "/name", "required")]
    [InlineData("""{ "name": "  ", "spec": { "horizontal": 0.5 } }""", "/name", "required")]
    [InlineData("""{ "name": "Hillcrest" }""", "/spec", "required")]
    [InlineData("""{ "name": "Hillcrest", "spec": 0.5 }""", "/spec", "object")]
    [InlineData("""{ "name": "Hillcrest", "spec": { "horizontal": 0.5, "colour": "red" } }""", "/spec/colour", "not a field")]
    [InlineData("""{ "name": "Hillcrest", "spec": { "horizontal": "half a metre" } }""", "/spec/horizontal", "wrong type")]
    [InlineData("""{ "name": "Hillcrest", "nmae": "typo", "spec": { "horizontal": 0.5 } }""", "/nmae", "not a field")]
    public async Task Bad_projects_get_400_with_a_pointer(string body, string pointer, string fragment) =>
        await ProblemAssert.IsBadInputAsync(await client.PostProjectAsync(body), pointer, fragment);

    [Theory]
    [InlineData("""{ "horizontal": -0.5 }""", "/spec/horizontal")]
    [InlineData("""{ "standard": "iso-9999", "horizontal": 0.5 }""", "/spec/standard")]
    [InlineData("""{ "standard": "nmas-1947" }""", "/spec/mapScale")]
    [InlineData("""{ "horizontal": 0.5, "confidence": 1.5 }""", "/spec/confidence")]
    public async Task A_project_spec_is_judged_by_the_assessment_spec_rules_word_for_word(string spec, string pointer)
    {
        var asProject = await ProblemAssert.IsProblemAsync(await client.PostProjectAsync($$"""{ "name": "Hillcrest", "spec": {{spec}} }"""), HttpStatusCode.BadRequest);
        var request = ProjectRequests.Case0(host.Cases, null, JsonNode.Parse(spec)!.AsObject());
        var asAssessment = await ProblemAssert.IsProblemAsync(await client.PostJsonAsync(request), HttpStatusCode.BadRequest);
        string Message(JsonElement problem) => problem.GetProperty("errors").EnumerateArray().Single(e => e.GetProperty("pointer").GetString() == pointer).GetProperty("message").GetString()!;
        Assert.Equal(Message(asAssessment), Message(asProject));
    }

    [Fact]
    public async Task A_delivery_without_spec_is_judged_by_the_project_spec_and_its_own_spec_wins_when_given()
    {
        // Source of the expectation: the reference value, not the service (make-assessment-cases.py, numpy).
        double expected = ProjectRequests.Case0HorizontalNssda95(host.Cases);
        Assert.InRange(expected, StrictHorizontalMetres + 0.1, LooseHorizontalMetres - 0.1);
        var project = await client.CreateProjectAsync("Millford street lights", $$"""{ "standard": "nssda", "horizontal": {{StrictHorizontalMetres}} }""");

        var (inheritedId, inheritedBody) = await client.AssessAsync(ProjectRequests.Case0(host.Cases, project, null));
        var inherited = JsonDocument.Parse(inheritedBody).RootElement;
        Assert.Equal("fail", inherited.GetProperty("verdict").GetString());
        Assert.Equal(StrictHorizontalMetres, inherited.GetProperty("spec").GetProperty("horizontal").GetDouble());
        Assert.Equal(expected, inherited.GetProperty("horizontal").GetProperty("nssda95").GetDouble(), 0.002);

        var own = new JsonObject { ["standard"] = "nssda", ["horizontal"] = LooseHorizontalMetres };
        var (ownId, ownBody) = await client.AssessAsync(ProjectRequests.Case0(host.Cases, project, own));
        var overridden = JsonDocument.Parse(ownBody).RootElement;
        Assert.Equal("pass", overridden.GetProperty("verdict").GetString());
        Assert.Equal(LooseHorizontalMetres, overridden.GetProperty("spec").GetProperty("horizontal").GetDouble());

        // Without the project, no spec: inconclusive (api-v1), so the fail above came from the project.
        var (_, noneBody) = await client.AssessAsync(ProjectRequests.Case0(host.Cases, null, null));
        Assert.Equal("inconclusive", JsonDocument.Parse(noneBody).RootElement.GetProperty("verdict").GetString());

        var detail = JsonDocument.Parse(await client.GetStringAsync($"/v1/projects/{project}")).RootElement;
        var deliveries = detail.GetProperty("assessments").EnumerateArray().ToList();
        Assert.Equal([inheritedId, ownId], deliveries.Select(d => d.GetProperty("id").GetString()));
        Assert.Equal(["fail", "pass"], deliveries.Select(d => d.GetProperty("verdict").GetString()));
        Assert.All(deliveries, d => Assert.Equal("awaiting decision", d.GetProperty("acceptance").GetString()));
        var trend = detail.GetProperty("trend").EnumerateArray().ToList();
        Assert.Equal(2, trend.Count);
        var horizontal = case0Horizontal;
        foreach (var point in trend)
        {
            Assert.Equal(horizontal.GetProperty("n").GetInt32(), point.GetProperty("horizontalN").GetInt32());
            Assert.Equal(horizontal.GetProperty("nssda95").GetDouble(), point.GetProperty("horizontalNssda95").GetDouble(), 0.002);
            Assert.Equal(horizontal.GetProperty("rmseR").GetDouble(), point.GetProperty("rmseH").GetDouble(), 0.002);
            Assert.Equal(case0Vertical.GetProperty("rmse").GetDouble(), point.GetProperty("rmseV").GetDouble(), 0.002);
            Assert.Equal(case0Vertical.GetProperty("nssda95").GetDouble(), point.GetProperty("verticalNssda95").GetDouble(), 0.002);
        }
    }

    private JsonElement case0Horizontal => host.Cases[0].GetProperty("expected").GetProperty("horizontal");

    private JsonElement case0Vertical => host.Cases[0].GetProperty("expected").GetProperty("vertical");

    [Fact]
    public async Task An_upload_names_its_project_in_the_options()
    {
        var project = await client.CreateProjectAsync("Millford uploads", $$"""{ "horizontal": {{StrictHorizontalMetres}} }""");
        const string marks = "\"marks\": { \"crs\": \"EPSG:32633\", \"heights\": \"ellipsoidal\" }, \"fixes\": { \"heights\": \"ellipsoidal\" }";
        var response = await client.PostFormAsync(Uploads.Form($$"""{ {{marks}}, "projectId": "{{project}}" }""",
            Uploads.FieldFile("case0-marks.geojson"), Uploads.FieldFile("case0-fixes.geojson")));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        Assert.Equal("fail", JsonDocument.Parse(text).RootElement.GetProperty("verdict").GetString());

        var unknown = await client.PostFormAsync(Uploads.Form($$"""{ {{marks}}, "projectId": "AAAAAAAAAAAAAAAAAAAAAA" }""",
            Uploads.FieldFile("case0-marks.geojson"), Uploads.FieldFile("case0-fixes.geojson")));
        await ProblemAssert.IsBadInputAsync(unknown, "/options/projectId", "no project");
    }

    [Theory]
    [InlineData("AAAAAAAAAAAAAAAAAAAAAA")]
    [InlineData("not a plausible id!")]
    public async Task An_unknown_project_is_400_at_projectId(string projectId)
    {
        var response = await client.PostJsonAsync(ProjectRequests.Case0(host.Cases, projectId, null));
        await ProblemAssert.IsBadInputAsync(response, "/projectId", "no project");
    }

    [Fact]
    public async Task Unknown_project_paths_are_404_problems()
    {
        await ProblemAssert.IsProblemAsync(await client.GetAsync("/v1/projects/AAAAAAAAAAAAAAAAAAAAAA"), HttpStatusCode.NotFound);
        await ProblemAssert.IsProblemAsync(await client.GetAsync("/v1/projects/AAAAAAAAAAAAAAAAAAAAAA/report.html"), HttpStatusCode.NotFound);
    }
}
