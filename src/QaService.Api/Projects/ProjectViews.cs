using System.Text.Json;
using QaService.Core.SignOff;

namespace QaService.Api.Projects;

/// <summary>A project as the API returns it; <paramref name="Spec"/> is the stored spec, as sent.</summary>
internal sealed record ProjectView(string Id, string Name, DateTimeOffset CreatedAt, JsonElement Spec);

/// <summary>The tenant's projects, newest first.</summary>
internal sealed record ProjectList(IReadOnlyList<ProjectView> Projects);

/// <summary>A project with its deliveries (oldest first) and the trend of their figures.</summary>
internal sealed record ProjectDetail(string Id, string Name, DateTimeOffset CreatedAt, JsonElement Spec,
    IReadOnlyList<DeliveryView> Assessments, IReadOnlyList<TrendPoint> Trend);

/// <summary>One delivery: the report's id, time, title and verdict, its acceptance state and latest decision.</summary>
internal sealed record DeliveryView(string Id, DateTimeOffset CreatedAt, string? Title, string Verdict, string Acceptance, SignOffDecision? Decision);

/// <summary>A delivery's headline figures, metres (n: check points used), taken from its stored report.</summary>
internal sealed record TrendPoint(string Assessment, DateTimeOffset CreatedAt, int? HorizontalN, double? HorizontalNssda95, double? RmseH,
    int? VerticalN, double? VerticalNssda95, double? RmseV);
