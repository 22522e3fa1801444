using System.Net;
using System.Text;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using QaService.Api.Storage;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>Hardening: security headers, no internals in any answer, correlation ids, metrics.</summary>
public sealed class HardeningTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    [Theory]
    [InlineData("/")]
    [InlineData("/v1/assessments/nothing-here")]
    [InlineData("/healthz")]
    public async Task Every_answer_carries_the_security_headers(string path)
    {
        var response = await host.Factory.CreateClient().GetAsync(path);
        Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
        Assert.Equal("DENY", response.Headers.GetValues("X-Frame-Options").Single());
        Assert.Equal("no-referrer", response.Headers.GetValues("Referrer-Policy").Single());
        var policy = response.Headers.GetValues("Content-Security-Policy").Single();
        Assert.Contains("default-src 'none'", policy);
        Assert.Contains("frame-ancestors 'none'", policy);
    }

    [Fact]
    public async Task A_storage_fault_is_a_problem_without_stack_trace_or_paths()
    {
        using var factory = new QaServiceFactory().WithWebHostBuilder(builder =>
            builder.ConfigureTestServices(services => services.AddSingleton<IReportStore, BrokenStore>()));
        var response = await factory.CreateClient().PostJsonAsync(Requests.Minimal());
        var text = await response.Content.ReadAsStringAsync();
        await ProblemAssert.IsProblemAsync(response, HttpStatusCode.InternalServerError);
        Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
        Assert.DoesNotContain(BrokenStore.Secret, text);
        Assert.DoesNotContain(" at ", text);
        Assert.DoesNotContain(".cs", text);
        Assert.DoesNotContain("/work", text);
        Assert.DoesNotContain("Exception", text);
    }

    [Fact]
    public async Task The_correlation_id_is_echoed_and_names_the_problem()
    {
        var client = host.Factory.CreateClient();
        var request = new HttpRequestMessage(HttpMethod.Get, "/v1/assessments/unknown-id");
        request.Headers.Add("X-Correlation-Id", "field-upload-42");
        var response = await client.SendAsync(request);
        Assert.Equal("field-upload-42", response.Headers.GetValues("X-Correlation-Id").Single());
        var problem = await ProblemAssert.IsProblemAsync(response, HttpStatusCode.NotFound);
        Assert.Equal("field-upload-42", problem.GetProperty("traceId").GetString());

        // An id that could forge log lines is replaced by the service's own.
        var forged = new HttpRequestMessage(HttpMethod.Get, "/healthz");
        forged.Headers.TryAddWithoutValidation("X-Correlation-Id", "a\" injected=1");
        var own = (await client.SendAsync(forged)).Headers.GetValues("X-Correlation-Id").Single();
        Assert.NotEqual("a\" injected=1", own);
        Assert.False(string.IsNullOrEmpty(own));
    }

    [Fact]
    public async Task Metrics_are_served_in_prometheus_text_with_requests_points_and_verdicts()
    {
        var client = host.Factory.CreateClient();
        Assert.Equal(HttpStatusCode.Created, (await client.PostJsonAsync(Requests.Minimal())).StatusCode);
        // The Prometheus exporter caches a scrape for a short while; ask until the new figures appear (bounded).
        string text = "";
        for (var attempt = 0; attempt < 20 && !text.Contains("qaservice_assessments_total"); attempt++)
        {
            await Task.Delay(250);
            var response = await client.GetAsync("/metrics");
            Assert.Equal(HttpStatusCode.OK, response.StatusCode);
            Assert.StartsWith("text/plain", response.Content.Headers.ContentType!.MediaType);
            text = await response.Content.ReadAsStringAsync();
        }
        Assert.Contains("qaservice_assessments_total{", text);
        Assert.Contains("verdict=\"inconclusive\"", text);
        Assert.Contains("qaservice_points_processed_total{", text);
        Assert.Contains("http_server_request_duration_seconds_bucket{", text);
        Assert.Contains("# TYPE http_server_request_duration_seconds histogram", text);
    }

    private sealed class BrokenStore : IReportStore
    {
        public const string Secret = "/var/lib/secret-db-path/connection";

        public Task InitializeAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public Task SaveAsync(StoredReport report, CancellationToken cancellationToken) =>
            throw new InvalidOperationException($"disk full at {Secret}");

        public Task<string?> FindJsonAsync(string tenant, string id, CancellationToken cancellationToken) => Task.FromResult<string?>(null);

        public Task<bool> IsReachableAsync(CancellationToken cancellationToken) => Task.FromResult(true);
    }
}
