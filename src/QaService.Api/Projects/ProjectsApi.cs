using System.Text.Json;
using QaService.Api.Assessments;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.Projects;
using QaService.Core.Reporting.Html;
using QaService.Core.SignOff;
using QaService.Core.Standards;

namespace QaService.Api.Projects;

/// <summary>
/// Projects: a contract's spec that its deliveries (assessments naming the project) inherit, and the deliveries'
/// acceptance and figures over time. Tenant-scoped like reports.
/// </summary>
internal static class ProjectsApi
{
    /// <summary>Most projects one list returns (newest first).</summary>
    public const int MaximumListed = 1000;

    public static RouteGroupBuilder MapProjects(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/projects").WithTags("Projects");

        group.MapPost("/", CreateAsync)
            .WithName("CreateProject")
            .WithSummary("Create a project: a name and the spec its deliveries are judged by")
            .WithDescription("The spec is the same object as an assessment request's spec and is checked by the same rules. An assessment with \"projectId\" and no spec of its own is judged by it.")
            .WithMetadata(new JsonRequestBody(typeof(ProjectRequest)))
            .Produces<ProjectView>(StatusCodes.Status201Created)
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType);

        group.MapGet("/", ListAsync)
            .WithName("ListProjects")
            .WithSummary("The caller's projects, newest first")
            .Produces<ProjectList>();

        group.MapGet("/{id}", GetAsync)
            .WithName("GetProject")
            .WithSummary("A project with its deliveries (oldest first, each with its acceptance and latest decision) and the trend of their figures")
            .Produces<ProjectDetail>()
            .ProducesProblem(StatusCodes.Status404NotFound);

        group.MapGet("/{id}/report.html", HtmlAsync)
            .WithName("GetProjectReportHtml")
            .WithSummary("The project as one self-contained HTML page: acceptance of each delivery and the trend plot (inline SVG with a table)")
            .Produces<string>(StatusCodes.Status200OK, "text/html")
            .ProducesProblem(StatusCodes.Status404NotFound);

        return group;
    }

    internal static async Task<IResult> CreateAsync(HttpRequest request, JsonBodyReader<ProjectRequest> reader, IProjectStore projects,
        ITenantContext tenant, TimeProvider clock, CancellationToken cancellationToken)
    {
        var (body, problem) = await reader.ReadAsync(request, cancellationToken);
        if (problem is not null)
            return problem;
        var errors = new List<InputError>();
        var (name, nameError) = ProjectNames.Read(body!.Name);
        if (nameError is not null)
            errors.Add(nameError);
        if (body.Spec is not { } specJson)
        {
            errors.Add(new InputError("/spec", "\"spec\" is required: the accuracy the deliveries must meet, as an assessment request's spec"));
        }
        else
        {
            var (spec, specError) = ProjectSpecs.Parse(specJson, "/spec");
            if (specError is not null)
                errors.Add(specError);
            else
                errors.AddRange(RequestValidator.ValidateSpec(spec!));
        }
        if (errors.Count > 0)
            return InputProblems.Invalid(errors);

        var now = clock.GetUtcNow();
        var project = new StoredProject(tenant.TenantId, ReportIds.New(), name!, now.AddTicks(-(now.Ticks % TimeSpan.TicksPerMillisecond)), body.Spec!.Value.GetRawText());
        await projects.CreateAsync(project, cancellationToken);
        return TypedResults.Created($"/v1/projects/{project.Id}", View(project));
    }

    internal static async Task<IResult> ListAsync(IProjectStore projects, ITenantContext tenant, CancellationToken cancellationToken)
    {
        var list = await projects.ListAsync(tenant.TenantId, MaximumListed, cancellationToken);
        return TypedResults.Ok(new ProjectList(list.Select(View).ToList()));
    }

    internal static async Task<IResult> GetAsync(string id, IProjectStore projects, IReportStore reports, ITenantContext tenant, CancellationToken cancellationToken)
    {
        var loaded = await LoadAsync(id, projects, reports, tenant.TenantId, cancellationToken);
        if (loaded is not var (project, deliveries))
            return NotFound(id);
        var view = View(project);
        return TypedResults.Ok(new ProjectDetail(view.Id, view.Name, view.CreatedAt, view.Spec,
            deliveries.Select(d => new DeliveryView(d.Row.Report.Id, d.Row.Report.CreatedAt, d.Row.Report.Title, d.Row.Report.Verdict,
                DecisionWords.StateOf(d.Row.Latest), d.Row.Latest)).ToList(),
            deliveries.Select(d => new TrendPoint(d.Row.Report.Id, d.Row.Report.CreatedAt, d.Figures.HorizontalN, d.Figures.HorizontalNssda95, d.Figures.RmseH,
                d.Figures.VerticalN, d.Figures.VerticalNssda95, d.Figures.RmseV)).ToList()));
    }

    internal static async Task<IResult> HtmlAsync(string id, IProjectStore projects, IReportStore reports, ITenantContext tenant, CancellationToken cancellationToken)
    {
        var loaded = await LoadAsync(id, projects, reports, tenant.TenantId, cancellationToken);
        if (loaded is not var (project, deliveries))
            return NotFound(id);
        var spec = ProjectSpecs.Read(project.SpecJson);
        var model = new ProjectPageModel(project.Id, project.Name, project.CreatedAt, project.SpecJson, spec.Standard ?? AccuracyStandards.NssdaId,
            spec.Horizontal, spec.Vertical,
            deliveries.Select(d => new ProjectDelivery(d.Row.Report.Id, d.Row.Report.CreatedAt, d.Row.Report.Title, d.Row.Report.Verdict, d.Row.Latest, d.Figures)).ToList());
        return new HtmlPage(ProjectPage.Render(model));
    }

    /// <summary>The project and each delivery with its figures, read from the head of its stored JSON.</summary>
    private static async Task<(StoredProject Project, List<(DeliveryRow Row, DeliveryFigures Figures)> Deliveries)?> LoadAsync(
        string id, IProjectStore projects, IReportStore reports, string tenant, CancellationToken cancellationToken)
    {
        var project = ReportIds.IsPlausible(id) ? await projects.FindAsync(tenant, id, cancellationToken) : null;
        if (project is null)
            return null;
        var deliveries = new List<(DeliveryRow, DeliveryFigures)>();
        foreach (var row in await projects.ListDeliveriesAsync(tenant, project.Id, cancellationToken))
        {
            await using var json = await reports.OpenJsonAsync(tenant, row.Report.Id, cancellationToken);
            if (json is not null) // deleted since the list was read
                deliveries.Add((row, await DeliveryFigures.ReadAsync(json, cancellationToken)));
        }

        return (project, deliveries);
    }

    private static ProjectView View(StoredProject project)
    {
        using var spec = JsonDocument.Parse(project.SpecJson);
        return new ProjectView(project.Id, project.Name, project.CreatedAt, spec.RootElement.Clone());
    }

    private static IResult NotFound(string id) =>
        InputProblems.Status(StatusCodes.Status404NotFound, "Project not found", $"there is no project with id \"{(id.Length <= 64 ? id : id[..64] + "…")}\"");
}
