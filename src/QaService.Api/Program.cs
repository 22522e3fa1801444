using QaService.Api;
using QaService.Api.Assessments;
using QaService.Api.Health;
using QaService.Api.Home;

var builder = WebApplication.CreateBuilder(args);
builder.AddQaService();

var app = builder.Build();
app.UseQaServicePipeline();
app.MapHome();
app.MapHealth();
app.MapAssessments();

await app.RunAsync();

/// <summary>Entry point; public so the API tests can host it.</summary>
public partial class Program;
