using QaService.Api;
using QaService.Api.Assessments;
using QaService.Api.Crs;
using QaService.Api.Health;
using QaService.Api.Home;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Api.Sharing;
using QaService.Api.Transform;
using QaService.Api.Screening;
using QaService.Api.Upload;
using QaService.Api.Projects;
using QaService.Api.SignOff;

StartupErrors.ExitOnConfigurationError();

// Settings ship beside the binary; the working folder is only where data/ goes.
var builder = WebApplication.CreateBuilder(new WebApplicationOptions { Args = args, ContentRootPath = AppContext.BaseDirectory });
builder.AddQaService();

var app = builder.Build();
app.ValidateConfiguration();
app.UseQaServicePipeline();
app.MapHome();
app.MapHealth();
app.MapAssessments();
app.MapListing();
app.MapListPage();
app.MapReports();
app.MapTransform();
app.MapCrs();
app.MapAdmin();
app.MapScreening();
app.MapShareLinks();
app.MapSharedReports();
app.MapGuidedUpload();
app.MapProjects();
app.MapDecisions();

await app.RunAsync();

/// <summary>Entry point; public so the API tests can host it.</summary>
public partial class Program;
