using System.Globalization;
using System.Text;
using QaService.Api.Assessments;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.Reporting;
using QaService.Core.Screening;

namespace QaService.Api.Screening;

/// <summary>Per-fix screening for apps on upload: accept / flag / reject each fix with every reason. Rules live in Core.</summary>
internal static class ScreeningApi
{
    public static RouteGroupBuilder MapScreening(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/screenings").WithTags("Screening");

        group.MapPost("/", ScreenAsync)
            .WithName("ScreenFixes")
            .WithSummary("Accept, flag or reject each fix from its receiver metadata, with every reason")
            .WithDescription(Description())
            .WithMetadata(new JsonRequestBody(typeof(ScreeningRequest)))
            .Produces<ScreeningReport>()
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType);

        group.MapGet("/profiles", () => TypedResults.Ok(ScreeningProfiles.All))
            .WithName("ListScreeningProfiles")
            .WithSummary("The named screening profiles and their thresholds")
            .Produces<IReadOnlyList<ScreeningProfile>>();
        return group;
    }

    internal static async Task<IResult> ScreenAsync(HttpRequest request, JsonBodyReader<ScreeningRequest> reader, IReportStore store, IProjectStore projects,
        ITenantContext tenant, CancellationToken cancellationToken)
    {
        var (body, problem) = await reader.ReadAsync(request, cancellationToken);
        if (problem is not null)
            return problem;
        var (residuals, source, missing) = body?.ProjectId is { } projectId
            ? await ProjectResidualsAsync(projectId, projects, store, tenant.TenantId, cancellationToken)
            : await CalibrationResidualsAsync(body?.Calibration, store, tenant.TenantId, cancellationToken);
        if (missing.Count > 0)
            return InputProblems.Invalid(missing);
        var (report, errors) = FixScreening.Screen(body, residuals, source);
        return report is null ? InputProblems.Invalid(errors) : TypedResults.Ok(report);
    }

    /// <summary>
    /// The residuals of the stored assessments <c>calibration.assessments</c> names, this tenant's only (another tenant's id is
    /// "no such assessment", as on GET). Core computes the calibration from them; nothing here is maths.
    /// </summary>
    private static async Task<(List<Residual>? Residuals, string? Source, List<InputError> Missing)> CalibrationResidualsAsync(
        ScreeningCalibrationInput? calibration, IReportStore store, string tenant, CancellationToken cancellationToken)
    {
        var missing = new List<InputError>();
        if (calibration?.Assessments is not { Count: > 0 and <= FixScreening.MaximumCalibrationAssessments } ids || calibration.Entries is not null
            || ids.Any(string.IsNullOrWhiteSpace))
            return (null, null, missing);
        var residuals = new List<Residual>();
        for (var i = 0; i < ids.Count; i++)
        {
            var report = await StoredReports.LoadAsync(store, tenant, ids[i]!.Trim(), cancellationToken);
            if (report is null)
                missing.Add(new(string.Create(CultureInfo.InvariantCulture, $"/calibration/assessments/{i}"), $"no assessment \"{ids[i]}\""));
            else
                residuals.AddRange(report.Residuals);
        }
        return (residuals, "assessments " + string.Join(", ", ids.Select(id => id!.Trim())), missing);
    }

    /// <summary>
    /// The residuals of every delivery of the tenant's project <paramref name="projectId"/> (another tenant's project is "no
    /// such project"); the calibration then says which project and how many assessments it rests on.
    /// </summary>
    private static async Task<(List<Residual>? Residuals, string? Source, List<InputError> Missing)> ProjectResidualsAsync(
        string projectId, IProjectStore projects, IReportStore store, string tenant, CancellationToken cancellationToken)
    {
        var project = string.IsNullOrWhiteSpace(projectId) ? null : await projects.FindAsync(tenant, projectId.Trim(), cancellationToken);
        if (project is null)
            return (null, null, [new("/projectId", $"no project \"{projectId}\"")]);
        var residuals = new List<Residual>();
        var deliveries = await projects.ListDeliveriesAsync(tenant, project.Id, cancellationToken);
        foreach (var delivery in deliveries)
        {
            if (await StoredReports.LoadAsync(store, tenant, delivery.Report.Id, cancellationToken) is { } report)
                residuals.AddRange(report.Residuals);
        }
        return (residuals, string.Create(CultureInfo.InvariantCulture, $"project \"{project.Name}\" ({deliveries.Count} assessments)"), []);
    }

    /// <summary>The profiles, written out for the OpenAPI description from the same objects the rules use.</summary>
    private static string Description()
    {
        var text = new StringBuilder(
            "Rules: quality (profile's reject/flag lists), satellites (fewer than 4 cannot give a 3-D fix: always reject; profile minimum and flag level), " +
            "pdop/hdop/vdop (flag above the profile's maximum), horizontal-error and vertical-error (reported estimates: flag/reject above the profile's limits), " +
            "correction-age (flag/reject), elevation-mask (flag below the minimum: low satellites suffer more ionospheric delay), expected-error (autonomous fixes: " +
            "2·HDOP·UERE(1σ), UERE(95 %) 15.7 m C/A budget, flagged above the horizontal flag limit; autonomous is typically 5–10 m; with \"calibration\" " +
            "(stored assessment ids, or entries; or \"projectId\": that project's deliveries), any fix naming its receiver: 2 · ratio · predicted radial σ, the ratio being that receiver's observed/reported RMS " +
            "radial error on at least minimumPairs (default 20) assessed pairs, else the profile's rule, and each result says which). " +
            "Rules marked \"common practice\" have no standard behind their numbers. Every threshold can be overridden in \"thresholds\". Profiles:");
        foreach (var p in ScreeningProfiles.All)
        {
            var t = p.Thresholds;
            text.Append(CultureInfo.InvariantCulture,
                $" [{p.Name}{(p.Name == ScreeningProfiles.DefaultName ? ", default" : "")}] {p.Purpose} Reject qualities: {string.Join("/", t.RejectQualities ?? [])}; flag: {string.Join("/", t.FlagQualities ?? [])}; " +
                $"satellites reject < {t.MinimumSatellites}, flag < {t.FlagSatellitesBelow}; PDOP/HDOP/VDOP ≤ {t.MaximumPdop}/{t.MaximumHdop}/{t.MaximumVdop}; " +
                $"horizontal error flag > {t.FlagHorizontalError} m, reject > {t.RejectHorizontalError} m; vertical flag > {t.FlagVerticalError} m, reject > {t.RejectVerticalError} m; " +
                $"correction age flag > {t.MaximumCorrectionAge} s, reject > {t.RejectCorrectionAge} s; elevation mask ≥ {t.MinimumElevationMask}°.");
        }
        return text.ToString();
    }
}
