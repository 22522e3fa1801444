using Microsoft.AspNetCore.Diagnostics;
using Microsoft.AspNetCore.Http.Features;
using QaService.Api.Assessments;
using QaService.Api.Demo;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Storage;
using QaService.Core.Assessment;
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

        builder.Services.AddOptions<StorageOptions>().BindConfiguration(StorageOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        builder.Services.AddOptions<LimitsOptions>().BindConfiguration(LimitsOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        builder.Services.AddOptions<DemoOptions>().BindConfiguration(DemoOptions.Section);

        var maxBodyBytes = builder.Configuration.GetValue<long?>($"{LimitsOptions.Section}:{nameof(LimitsOptions.MaxBodyBytes)}") ?? new LimitsOptions().MaxBodyBytes;
        builder.WebHost.ConfigureKestrel(kestrel => kestrel.Limits.MaxRequestBodySize = maxBodyBytes);

        builder.Services.AddSingleton(TimeProvider.System);
        builder.Services.AddSingleton<IReportStore, SqliteReportStore>();
        builder.Services.AddSingleton(typeof(JsonBodyReader<>));
        builder.Services.AddSingleton<MultipartUploadReader>();
        builder.Services.AddHostedService<StartupTasks>();

        builder.Services.AddProblemDetails(options => options.CustomizeProblemDetails = context =>
        {
            context.ProblemDetails.Extensions.TryAdd("traceId", context.HttpContext.TraceIdentifier);
            context.ProblemDetails.Detail ??= DefaultProblemDetail.For(context.HttpContext);
        });
        builder.Services.AddOpenApi(options =>
        {
            options.AddSchemaTransformer<FieldDescriptionTransformer>();
            options.AddOperationTransformer<RequestBodyTransformer>();
            options.AddDocumentTransformer((document, _, _) =>
            {
                document.Info.Title = "QaService";
                document.Info.Description = "Positional accuracy testing of GNSS field positions against surveyed check points (NSSDA, RMSE, CEP). Lengths in metres unless a field says otherwise.";
                return Task.CompletedTask;
            });
        });
        return builder;
    }

    public static WebApplication UseQaServicePipeline(this WebApplication app)
    {
        app.UseExceptionHandler(handler => handler.Run(async context =>
        {
            // Last resort: an unexpected fault still answers with a problem body, never a stack trace.
            var fault = context.Features.Get<IExceptionHandlerFeature>()?.Error;
            var status = fault is BadHttpRequestException bad ? bad.StatusCode : StatusCodes.Status500InternalServerError;
            var result = status == StatusCodes.Status500InternalServerError
                ? InputProblems.Status(status, "Internal error", "the service failed to handle this request; the fault is logged with this traceId")
                : InputProblems.Status(status, "Bad request", fault?.Message ?? "the request could not be read");
            await result.ExecuteAsync(context);
        }));
        app.UseStatusCodePages();
        app.UseSerilogRequestLogging();

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
