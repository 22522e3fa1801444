using QaService.Api.Storage;
using QaService.Core.Assessment;

namespace QaService.Api.Projects;

/// <summary>
/// An assessment that names a project (<c>projectId</c>) is one of its deliveries: the project must be the caller's,
/// and its spec applies when the request brings none (the request's own spec wins when given).
/// </summary>
internal static class ProjectResolution
{
    /// <summary>The spec to judge by and the project to file the report under; or an error at <paramref name="pointer"/>.</summary>
    public static async Task<(AccuracySpec? Spec, string? ProjectId, InputError? Error)> ResolveAsync(
        string? projectId, AccuracySpec? requestSpec, string pointer, IProjectStore projects, string tenant, CancellationToken cancellationToken)
    {
        if (projectId is null)
            return (requestSpec, null, null);
        var project = ReportIds.IsPlausible(projectId) ? await projects.FindAsync(tenant, projectId, cancellationToken) : null;
        if (project is null)
            return (null, null, new InputError(pointer, $"there is no project \"{(projectId.Length <= 64 ? projectId : projectId[..64] + "…")}\": create one with POST /v1/projects, or leave projectId out"));
        return (requestSpec ?? ProjectSpecs.Read(project.SpecJson), project.Id, null);
    }
}

/// <summary>The caller's projects, for <see cref="ProjectResolution"/> inside a request.</summary>
internal sealed record ProjectScope(IProjectStore Projects, string Tenant)
{
    public Task<(AccuracySpec? Spec, string? ProjectId, InputError? Error)> ResolveAsync(string? projectId, AccuracySpec? requestSpec, string pointer, CancellationToken cancellationToken) =>
        ProjectResolution.ResolveAsync(projectId, requestSpec, pointer, Projects, Tenant, cancellationToken);
}
