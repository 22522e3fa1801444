using System.ComponentModel.DataAnnotations;
using System.Globalization;
using Microsoft.AspNetCore.Diagnostics;
using Microsoft.AspNetCore.Http.Timeouts;
using QaService.Api.Assessments;
using QaService.Api.Demo;
using QaService.Api.Limits;
using QaService.Api.Observability;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Security;
using QaService.Api.SignOff;
using QaService.Api.Storage;
using OpenTelemetry.Metrics;
using Serilog;
using Serilog.Formatting.Compact;

namespace QaService.Api;

/// <summary>Service registration and the middleware pipeline, kept out of Program.cs so it reads top-down.</summary>
internal static class ServiceSetup
{
    public static WebApplicationBuilder AddQaService(this WebApplicationBuilder builder)
    {
        builder.Services.AddSerilog((services, logger) => logger
            .ReadFrom.Configuration(builder.Configuration)
            .Enrich.FromLogContext()
            .WriteTo.Console(new CompactJsonFormatter()));

        builder.Services.AddReportStorage(builder.Configuration);
        // PROJ's grid files (NTv2) are read at run time from this folder; Debian's proj-data installs them in /usr/share/proj.
        QaService.Core.Geodesy.Transformations.GridFiles.Directory =
            builder.Configuration["Geodesy:GridDirectory"] ?? QaService.Core.Geodesy.Transformations.GridFiles.DefaultDirectory;
        builder.Services.AddOptions<LimitsOptions>().BindConfiguration(LimitsOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        builder.Services.AddOptions<AuthOptions>().BindConfiguration(AuthOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        builder.Services.AddOptions<DemoOptions>().BindConfiguration(DemoOptions.Section);
        builder.Services.AddOptions<WarmUp.WarmUpOptions>().BindConfiguration(WarmUp.WarmUpOptions.Section);
        builder.Services.AddOptions<Upload.UploadStagingOptions>().BindConfiguration(Upload.UploadStagingOptions.Section).ValidateDataAnnotations().ValidateOnStart();

        // Read now as well (Kestrel, the rate limiter and the timeout policy are built from it), so check it now too.
        var limits = builder.Configuration.GetSection(LimitsOptions.Section).Get<LimitsOptions>() ?? new LimitsOptions();
        Validator.ValidateObject(limits, new ValidationContext(limits), validateAllProperties: true);
        builder.WebHost.ConfigureKestrel(kestrel => kestrel.Limits.MaxRequestBodySize = limits.MaxBodyBytes);
        builder.Services.AddKeyRateLimiting(limits);
        builder.Services.AddRequestTimeouts(options => options.DefaultPolicy = new RequestTimeoutPolicy
        {
            Timeout = TimeSpan.FromSeconds(limits.RequestTimeoutSeconds),
            TimeoutStatusCode = StatusCodes.Status503ServiceUnavailable,
            WriteTimeoutResponse = context => InputProblems.Status(StatusCodes.Status503ServiceUnavailable, "Request timed out",
                string.Create(CultureInfo.InvariantCulture, $"the request took longer than {limits.RequestTimeoutSeconds} s (Limits:RequestTimeoutSeconds); send fewer points per request")).ExecuteAsync(context),
        });

        builder.Services.AddPeopleAuthentication(builder.Configuration.GetSection(AuthOptions.Section).Get<AuthOptions>() ?? new AuthOptions());
        builder.Services.AddSingleton<Sharing.ShareLinkSigning>();
        builder.Services.AddSingleton(TimeProvider.System);
        builder.Services.AddHttpContextAccessor();
        builder.Services.AddSingleton<ITenantContext, HttpTenantContext>();
        builder.Services.AddSingleton(typeof(JsonBodyReader<>));
        builder.Services.AddSingleton<QaMetrics>();
        builder.Services.AddSingleton<MultipartUploadReader>();
        builder.Services.AddSignOff();
        builder.Services.AddHostedService<StartupTasks>();
        builder.Services.AddHostedService<RetentionPurge>();
        builder.Services.AddHostedService<ExposureWarning>();
        builder.Services.AddHostedService<WarmUp.CodeWarmUp>();

        builder.Services.AddOpenTelemetry().WithMetrics(metrics => metrics
            .AddMeter(QaMetrics.MeterName, "Microsoft.AspNetCore.Hosting", "Microsoft.AspNetCore.Server.Kestrel", "Microsoft.AspNetCore.RateLimiting")
            .AddPrometheusExporter());

        builder.Services.AddProblemDetails(options => options.CustomizeProblemDetails = context =>
        {
            // The correlation id (CorrelationIdMiddleware), so a caller can quote it and it is found in the logs.
            context.ProblemDetails.Extensions["traceId"] = context.HttpContext.TraceIdentifier;
            context.ProblemDetails.Detail ??= DefaultProblemDetail.For(context.HttpContext);
        });
        builder.Services.AddQaServiceOpenApi();
        return builder;
    }

    public static WebApplication UseQaServicePipeline(this WebApplication app)
    {
        app.UseExceptionHandler(handler => handler.Run(async context =>
        {
            // Last resort: an unexpected fault still answers with a problem body, never a stack trace or a path.
            var fault = context.Features.Get<IExceptionHandlerFeature>()?.Error;
            var status = fault is BadHttpRequestException bad ? bad.StatusCode : StatusCodes.Status500InternalServerError;
            var result = status == StatusCodes.Status500InternalServerError
                ? InputProblems.Status(status, "Internal error", "the service failed to handle this request; the fault is logged with this traceId")
                : InputProblems.Status(status, "Bad request", fault?.Message ?? "the request could not be read");
            await result.ExecuteAsync(context);
        }));
        app.UseMiddleware<CorrelationIdMiddleware>();
        app.UseMiddleware<SecurityHeadersMiddleware>();
        app.UseStatusCodePages();
        app.UseSerilogRequestLogging(options => options.EnrichDiagnosticContext = (diagnostics, context) =>
        {
            if (context.Features.Get<TenantFeature>() is { } tenant)
                diagnostics.Set("Tenant", tenant.TenantId);
        });
        app.UseRequestTimeouts();
        app.UseMiddleware<TenantResolutionMiddleware>();
        // After tenant resolution, which sets the user that antiforgery tokens are bound to.
        app.UseAntiforgery();
        app.UseRateLimiter();
        app.UseAntiforgery();

        app.MapPrometheusScrapingEndpoint("/metrics");
        app.MapOpenApi();
        app.UseSwaggerUI(options =>
        {
            options.SwaggerEndpoint("/openapi/v1.json", "QaService v1");
            options.RoutePrefix = "swagger";
            options.DocumentTitle = "QaService API explorer";
        });
        return app;
    }
}
