using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Antiforgery;
using Microsoft.Extensions.Options;
using QaService.Api.Assessments;
using QaService.Api.Home;
using QaService.Api.Observability;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Ingest;

namespace QaService.Api.Upload;

/// <summary>
/// The guided upload for people who do not write JSON: settings and files (step 1), a preview of each file with its
/// column choices (step 2), the run (step 3) leading to the HTML report. Server-rendered forms that work without script,
/// each with an antiforgery token. The files are staged once, tenant-scoped, behind an unguessable token
/// (<see cref="IUploadStagingStore"/>), so the preview and the run never ask for them again. Under <c>/v1</c>, where the
/// tenant is resolved; the run applies exactly the multipart API's reading and validation.
/// </summary>
internal static partial class GuidedUploadApi
{
    public const string Root = "/v1/uploads";

    private static readonly JsonSerializerOptions SettingsJson = new(JsonSerializerDefaults.Web);

    public static RouteGroupBuilder MapGuidedUpload(this IEndpointRouteBuilder routes)
    {
        var limits = routes.ServiceProvider.GetRequiredService<IOptions<UploadStagingOptions>>().Value;
        // Browser pages (HTML forms and HTML error pages), not the JSON API: named and summarised like every endpoint,
        // but left out of the OpenAPI document, as the home page is.
        var group = routes.MapGroup(Root).WithTags("Guided upload").ExcludeFromDescription();

        group.MapGet("/new", NewAsync)
            .WithName("ShowGuidedUpload")
            .WithSummary("Step 1 of the guided upload: an HTML form for each side's CRS and heights, the standard, the required accuracy and the two files")
            .Produces<string>(StatusCodes.Status200OK, "text/html")
            .Produces<string>(StatusCodes.Status404NotFound, "text/html")
            .Produces<string>(StatusCodes.Status410Gone, "text/html")
            .ProducesProblem(StatusCodes.Status401Unauthorized);

        group.MapPost("/", StageAsync)
            .WithName("StageGuidedUpload")
            .WithSummary("Stage the guided upload's files and settings (multipart form with an antiforgery token); 303 to the preview, or the form again with the errors or CRS search results")
            .WithFormOptions(multipartBodyLengthLimit: 2 * limits.MaxStagedFileBytes + 1_048_576)
            .Produces(StatusCodes.Status303SeeOther)
            .Produces<string>(StatusCodes.Status200OK, "text/html")
            .Produces<string>(StatusCodes.Status400BadRequest, "text/html")
            .Produces<string>(StatusCodes.Status413PayloadTooLarge, "text/html")
            .ProducesProblem(StatusCodes.Status401Unauthorized);

        group.MapGet("/{token}", PreviewAsync)
            .WithName("PreviewGuidedUpload")
            .WithSummary("Step 2: each staged file's format, first rows and (CSV) column choices, as an HTML form")
            .Produces<string>(StatusCodes.Status200OK, "text/html")
            .Produces<string>(StatusCodes.Status404NotFound, "text/html")
            .Produces<string>(StatusCodes.Status410Gone, "text/html")
            .ProducesProblem(StatusCodes.Status401Unauthorized);

        group.MapPost("/{token}/run", RunAsync)
            .WithName("RunGuidedUpload")
            .WithSummary("Step 3: run the test on the staged files with the chosen columns; 303 to the HTML report, or the preview again with each error at its file, row and column")
            .Produces(StatusCodes.Status303SeeOther)
            .Produces<string>(StatusCodes.Status400BadRequest, "text/html")
            .Produces<string>(StatusCodes.Status404NotFound, "text/html")
            .Produces<string>(StatusCodes.Status410Gone, "text/html")
            .ProducesProblem(StatusCodes.Status401Unauthorized);

        return group;
    }

    internal static async Task<IResult> NewAsync(HttpContext context, string? token, IAntiforgery antiforgery, IUploadStagingStore staging,
        ITenantContext tenant, IOptions<UploadStagingOptions> options, TimeProvider clock, CancellationToken cancellationToken)
    {
        var settings = GuidedSettings.Defaults;
        StagedUpload? staged = null;
        if (token is not null)
        {
            (staged, var missing) = await FindAsync(token, staging, tenant, clock, cancellationToken);
            if (missing is not null)
                return missing;
            settings = Settings(staged!) ?? settings;
        }
        var view = new SettingsView(settings, new Dictionary<string, string>(), staged is null ? null : token, Note(staged?.Marks), Note(staged?.Fixes), null, null, options.Value.MaxStagedFileBytes);
        return Page(context, SettingsPage.Render(view, antiforgery.GetAndStoreTokens(context)));
    }

    internal static async Task<IResult> StageAsync(HttpContext context, IAntiforgery antiforgery, IUploadStagingStore staging,
        ITenantContext tenant, IOptions<UploadStagingOptions> options, TimeProvider clock, CancellationToken cancellationToken)
    {
        var cap = options.Value.MaxStagedFileBytes;
        IFormCollection form;
        try
        {
            if (await Refused(context, antiforgery) is { } refused)
                return refused;
            form = await context.Request.ReadFormAsync(cancellationToken);
        }
        catch (Exception exception) when (exception is InvalidDataException || exception is BadHttpRequestException { StatusCode: StatusCodes.Status413PayloadTooLarge })
        {
            return Error(StatusCodes.Status413PayloadTooLarge, "Upload too large",
                $"the files together are larger than this service stages (each at most {FormMarkup.Size(cap)}, Uploads:MaxStagedFileBytes)");
        }

        var settings = GuidedSettings.FromForm(form);
        var errors = new Dictionary<string, string>(StringComparer.Ordinal);
        var now = clock.GetUtcNow();
        var token = form["token"].ToString() is { Length: > 0 } given ? given : null;
        StagedUpload? staged = null;
        if (token is not null)
        {
            (staged, var missing) = await FindAsync(token, staging, tenant, clock, cancellationToken);
            if (missing is not null)
                return missing;
        }

        var status = StatusCodes.Status200OK;
        var files = new Dictionary<string, StagedFile>();
        foreach (var side in new[] { MultipartUploadReader.MarksPart, MultipartUploadReader.FixesPart })
        {
            if (form.Files.GetFile(side) is not { Length: > 0 } file)
                continue;
            if (file.Length > cap)
            {
                errors[side] = $"the file is {FormMarkup.Size(file.Length)}; the largest file this service stages is {FormMarkup.Size(cap)}";
                status = StatusCodes.Status413PayloadTooLarge;
                continue;
            }
            using var bytes = new MemoryStream((int)file.Length);
            await file.CopyToAsync(bytes, cancellationToken);
            files[side] = new StagedFile(Path.GetFileName(file.FileName), bytes.ToArray());
        }

        if (staged is null && files.Count > 0)
        {
            await staging.DeleteExpiredAsync(now, cancellationToken);
            (token, var hash) = StagingTokens.New();
            staged = new StagedUpload(tenant.TenantId, hash, now, now, null, null, null);
        }
        if (staged is not null)
        {
            staged = staged with
            {
                ExpiresAt = now.AddMinutes(options.Value.StagingMinutes),
                Settings = JsonSerializer.Serialize(settings, SettingsJson),
                Marks = files.GetValueOrDefault(MultipartUploadReader.MarksPart) ?? staged.Marks,
                Fixes = files.GetValueOrDefault(MultipartUploadReader.FixesPart) ?? staged.Fixes,
            };
            await staging.SaveAsync(staged, cancellationToken);
        }

        var action = form["action"].ToString();
        CrsMatches? marksMatches = null, fixesMatches = null;
        if (status == StatusCodes.Status200OK && action is "search-marks" or "search-fixes")
        {
            var query = form[action == "search-marks" ? "marksCrs" : "fixesCrs"].ToString().Trim();
            var found = CrsCatalog.Search(query, 0, SettingsPage.ListedMatches);
            var matches = new CrsMatches(query, found.Total, found.Items);
            if (action == "search-marks")
                marksMatches = matches;
            else
                fixesMatches = matches;
        }
        else
        {
            foreach (var (field, message) in settings.Validate())
                errors.TryAdd(field, message);
            if (staged?.Marks is null)
                errors.TryAdd(MultipartUploadReader.MarksPart, "choose the marks file");
            if (staged?.Fixes is null)
                errors.TryAdd(MultipartUploadReader.FixesPart, "choose the fixes file");
            if (errors.Count == 0)
                return SeeOther($"{Root}/{token}");
            if (status == StatusCodes.Status200OK)
                status = StatusCodes.Status400BadRequest;
        }

        var view = new SettingsView(settings, errors, staged is null ? null : token, Note(staged?.Marks), Note(staged?.Fixes), marksMatches, fixesMatches, cap);
        return Page(context, SettingsPage.Render(view, antiforgery.GetAndStoreTokens(context)), status);
    }

    internal static async Task<IResult> PreviewAsync(HttpContext context, string token, IAntiforgery antiforgery, IUploadStagingStore staging,
        ITenantContext tenant, TimeProvider clock, CancellationToken cancellationToken)
    {
        var (staged, missing) = await FindAsync(token, staging, tenant, clock, cancellationToken);
        if (missing is not null)
            return missing;
        if (Settings(staged!) is not { } settings || staged!.Marks is null || staged.Fixes is null)
            return SeeOther($"{Root}/new?token={Uri.EscapeDataString(token)}");
        var marks = await SideAsync(MultipartUploadReader.MarksPart, staged.Marks, settings.MarksCrs, null, [], new Dictionary<string, string>(), cancellationToken);
        var fixes = await SideAsync(MultipartUploadReader.FixesPart, staged.Fixes, settings.FixesCrs, null, [], new Dictionary<string, string>(), cancellationToken);
        return Page(context, PreviewPage.Render(token, settings, marks, fixes, [], antiforgery.GetAndStoreTokens(context)));
    }

    internal static async Task<IResult> RunAsync(HttpContext context, string token, IAntiforgery antiforgery, IUploadStagingStore staging,
        IReportStore store, ITenantContext tenant, IOptions<LimitsOptions> limits, QaMetrics metrics, TimeProvider clock,
        ILogger<GuidedSettings> logger, CancellationToken cancellationToken)
    {
        if (await Refused(context, antiforgery) is { } refused)
            return refused;
        var (staged, missing) = await FindAsync(token, staging, tenant, clock, cancellationToken);
        if (missing is not null)
            return missing;
        if (Settings(staged!) is not { } settings || staged!.Marks is null || staged.Fixes is null)
            return SeeOther($"{Root}/new?token={Uri.EscapeDataString(token)}");
        var form = await context.Request.ReadFormAsync(cancellationToken);

        var marksFormat = (await FilePreview.ReadAsync(new MemoryStream(staged.Marks.Content, writable: false), 0, cancellationToken)).Format;
        var fixesFormat = (await FilePreview.ReadAsync(new MemoryStream(staged.Fixes.Content, writable: false), 0, cancellationToken)).Format;
        var fileErrors = new Dictionary<string, Dictionary<string, string>>
        {
            [MultipartUploadReader.MarksPart] = new(StringComparer.Ordinal),
            [MultipartUploadReader.FixesPart] = new(StringComparer.Ordinal),
        };
        var marksColumns = marksFormat == FieldFormat.Csv ? ChosenColumns(form, MultipartUploadReader.MarksPart, fileErrors[MultipartUploadReader.MarksPart]) : null;
        var fixesColumns = fixesFormat == FieldFormat.Csv ? ChosenColumns(form, MultipartUploadReader.FixesPart, fileErrors[MultipartUploadReader.FixesPart]) : null;

        var errors = new List<InputError>();
        var otherErrors = settings.Validate().Select(e => ($"/{e.Key}", e.Value)).ToList();
        if (otherErrors.Count == 0 && fileErrors.Values.All(e => e.Count == 0))
        {
            var options = settings.ToOptions(marksColumns, fixesColumns);
            var (marks, marksError) = await FieldPartReader.ReadAsync(MultipartUploadReader.MarksPart, new MemoryStream(staged.Marks.Content, writable: false), options.Marks, cancellationToken);
            var (fixes, fixesError) = await FieldPartReader.ReadAsync(MultipartUploadReader.FixesPart, new MemoryStream(staged.Fixes.Content, writable: false), options.Fixes, cancellationToken);
            errors.AddRange(new[] { marksError, fixesError }.OfType<InputError>());
            if (errors.Count == 0)
            {
                var (id, invalid, problem) = await AssessmentsApi.CreateFromPartsAsync(options, marks!, fixes!, store, tenant.TenantId, limits.Value, clock, metrics, logger, cancellationToken);
                if (problem is not null)
                    return Error(StatusCodes.Status413PayloadTooLarge, "Too many points", $"the files hold more points than one test takes (Limits:MaxPoints is {limits.Value.MaxPoints}); split them");
                if (id is not null)
                {
                    await staging.DeleteAsync(tenant.TenantId, staged.TokenHash, cancellationToken);
                    return SeeOther($"/v1/assessments/{id}/report.html");
                }
                errors.AddRange(invalid);
            }
        }

        var rowErrors = new Dictionary<string, List<(long Row, string? Field, string Message)>>
        {
            [MultipartUploadReader.MarksPart] = [],
            [MultipartUploadReader.FixesPart] = [],
        };
        foreach (var error in errors)
        {
            var match = FilePointer().Match(error.Pointer);
            if (match.Success && match.Groups["row"].Success)
                rowErrors[match.Groups["part"].Value].Add((long.Parse(match.Groups["row"].Value, System.Globalization.CultureInfo.InvariantCulture),
                    match.Groups["field"].Success ? match.Groups["field"].Value : null, error.Message));
            else if (match.Success)
                fileErrors[match.Groups["part"].Value].TryAdd(match.Groups["part"].Value, error.Message);
            else
                otherErrors.Add((error.Pointer, error.Message));
        }
        var marksView = await SideAsync(MultipartUploadReader.MarksPart, staged.Marks, settings.MarksCrs, marksColumns, rowErrors[MultipartUploadReader.MarksPart], fileErrors[MultipartUploadReader.MarksPart], cancellationToken);
        var fixesView = await SideAsync(MultipartUploadReader.FixesPart, staged.Fixes, settings.FixesCrs, fixesColumns, rowErrors[MultipartUploadReader.FixesPart], fileErrors[MultipartUploadReader.FixesPart], cancellationToken);
        return Page(context, PreviewPage.Render(token, settings, marksView, fixesView, otherErrors, antiforgery.GetAndStoreTokens(context)), StatusCodes.Status400BadRequest);
    }

    /// <summary>The column choices of one side's selects (contract field → header); a header chosen twice is an error at the second select.</summary>
    private static Dictionary<string, string> ChosenColumns(IFormCollection form, string side, Dictionary<string, string> errors)
    {
        var chosen = new Dictionary<string, string>(StringComparer.Ordinal);
        var byHeader = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        foreach (var field in ContractFields.All)
        {
            if (form[$"{side}.{field}"].ToString() is not { Length: > 0 } header)
                continue;
            if (byHeader.TryGetValue(header, out var other))
            {
                errors[PreviewPage.ColumnId(side, field)] = $"the column “{header}” is already chosen for {other}";
                continue;
            }
            byHeader[header] = field;
            chosen[field] = header;
        }
        return chosen;
    }

    private static async Task<SidePreview> SideAsync(string side, StagedFile file, string? crs, IReadOnlyDictionary<string, string>? chosen,
        List<(long Row, string? Field, string Message)> rowErrors, IReadOnlyDictionary<string, string> fileErrors, CancellationToken cancellationToken)
    {
        var preview = await FilePreview.ReadAsync(new MemoryStream(file.Content, writable: false), FilePreview.DefaultRows, cancellationToken);
        var lineFormat = preview.Format != FieldFormat.GeoJson;
        var errors = rowErrors.OrderBy(e => e.Row).Take(PreviewLimits.ListedRowErrors)
            .Select(e => new RowError(e.Row, e.Field, e.Message, lineFormat ? FilePreview.Line(new MemoryStream(file.Content, writable: false), e.Row) : null))
            .ToList();
        return new SidePreview(side, file.Name, file.Content.LongLength, preview, GuidedSettings.Resolve(crs), chosen ?? preview.DetectedColumns, errors, fileErrors);
    }

    /// <summary>The tenant's staged upload, or the page to answer: 404 for a token that is malformed, unknown or another tenant's; 410 once expired.</summary>
    private static async Task<(StagedUpload? Staged, IResult? Missing)> FindAsync(string token, IUploadStagingStore staging, ITenantContext tenant, TimeProvider clock, CancellationToken cancellationToken)
    {
        var staged = StagingTokens.IsPlausible(token) ? await staging.FindAsync(tenant.TenantId, StagingTokens.Hash(token), cancellationToken) : null;
        if (staged is null)
            return (null, Error(StatusCodes.Status404NotFound, "Upload not found", "there is no staged upload at this address; start a new one"));
        if (staged.ExpiresAt <= clock.GetUtcNow())
        {
            await staging.DeleteAsync(tenant.TenantId, staged.TokenHash, cancellationToken);
            return (null, Error(StatusCodes.Status410Gone, "Upload expired", "the staged files were kept for a limited time (Uploads:StagingMinutes) and are gone; start a new upload"));
        }
        return (staged, null);
    }

    private static async Task<IResult?> Refused(HttpContext context, IAntiforgery antiforgery) =>
        await antiforgery.IsRequestValidAsync(context) ? null
            : Error(StatusCodes.Status400BadRequest, "Form expired", "the form's antiforgery token is missing or stale (or the post came from another site); open the form again and resend");

    private static GuidedSettings? Settings(StagedUpload staged) =>
        staged.Settings is null ? null : JsonSerializer.Deserialize<GuidedSettings>(staged.Settings, SettingsJson);

    private static StagedFileNote? Note(StagedFile? file) => file is null ? null : new StagedFileNote(file.Name, file.Content.LongLength);

    private static IResult Page(HttpContext context, string html, int status = StatusCodes.Status200OK)
    {
        context.Items[SecurityHeadersMiddleware.PagePolicyItem] = UploadScript.ContentSecurityPolicy;
        return new HtmlPage(html, status);
    }

    private static IResult Error(int status, string title, string detail) =>
        new HtmlPage(UploadForm.ErrorPage(status, title, detail, [], $"{Root}/new", "Start a new upload"), status);

    /// <summary>303 See Other: the next page is fetched with GET whatever the post was (RFC 9110 §15.4.4).</summary>
    private static IResult SeeOther(string location) => new SeeOtherResult(location);

    [GeneratedRegex(@"^/(?<part>marks|fixes)(?:/(?:line|features)/(?<row>\d+)(?:/(?<field>[A-Za-z]+))?)?$")]
    private static partial Regex FilePointer();

    private sealed class SeeOtherResult(string location) : IResult
    {
        public Task ExecuteAsync(HttpContext httpContext)
        {
            httpContext.Response.StatusCode = StatusCodes.Status303SeeOther;
            httpContext.Response.Headers.Location = location;
            return Task.CompletedTask;
        }
    }
}
