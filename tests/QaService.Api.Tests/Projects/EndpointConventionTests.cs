using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Http.Metadata;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Projects;

/// <summary>The project and sign-off endpoints carry a name, a summary and their problem responses (DEVELOPERS "Adding an endpoint").</summary>
public sealed class EndpointConventionTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    [Fact]
    public void Project_and_decision_endpoints_are_named_summarised_and_declare_their_problems()
    {
        _ = host.Factory.CreateClient();
        var endpoints = host.Factory.Services.GetRequiredService<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>()
            .Where(e => e.RoutePattern.RawText is { } route && (route.StartsWith("/v1/projects", StringComparison.Ordinal) || route.Contains("/decisions", StringComparison.Ordinal)))
            .Where(e => !e.RoutePattern.RawText!.StartsWith("/ui/", StringComparison.Ordinal)).ToList();
        Assert.Contains(endpoints, e => e.RoutePattern.RawText!.StartsWith("/v1/projects", StringComparison.Ordinal));
        Assert.Contains(endpoints, e => e.RoutePattern.RawText!.Contains("/decisions", StringComparison.Ordinal));
        Assert.All(endpoints, endpoint =>
        {
            string route = endpoint.RoutePattern.RawText!;
            Assert.False(string.IsNullOrWhiteSpace(endpoint.Metadata.GetMetadata<IEndpointNameMetadata>()?.EndpointName), $"{route}: no WithName");
            Assert.False(string.IsNullOrWhiteSpace(endpoint.Metadata.GetMetadata<IEndpointSummaryMetadata>()?.Summary), $"{route}: no WithSummary");
            var statuses = endpoint.Metadata.OfType<IProducesResponseTypeMetadata>().Select(p => p.StatusCode).ToList();
            Assert.True(statuses.Any(s => s is >= 200 and < 300), $"{route}: no Produces for success");
            Assert.True(statuses.Any(s => s >= 400), $"{route}: no ProducesProblem");
        });
    }
}
