namespace QaService.Api.Home;

/// <summary>A plain landing page at <c>/</c> that points a person to the demo and the API explorer.</summary>
internal static class HomePage
{
    private const string Html = """
        <!doctype html>
        <html lang="en"><head><meta charset="utf-8"><title>QaService</title>
        <style>body{font:16px/1.5 system-ui,sans-serif;max-width:44rem;margin:2rem auto;padding:0 1rem;color:#1d2a33}
        a{color:#0b5e7a}code{background:#eef3f5;padding:0 .25rem}</style></head>
        <body>
        <h1>QaService</h1>
        <p>Positional accuracy testing for GNSS field collections: post fixes and surveyed check points,
        get NSSDA, RMSE and circular-error figures, checks and a verdict.</p>
        <ul>
          <li><a href="/v1/assessments/demo">Demo report</a> (invented scenario: Millbrook Ferry Water Cooperative hydrants)</li>
          <li><a href="/swagger">API explorer</a> and the <a href="/openapi/v1.json">OpenAPI document</a></li>
          <li><a href="/healthz">/healthz</a> and <a href="/readyz">/readyz</a></li>
        </ul>
        <p><small>Reports are statistical accuracy tests, not survey certifications.</small></p>
        </body></html>
        """;

    public static void MapHome(this IEndpointRouteBuilder routes) =>
        routes.MapGet("/", () => TypedResults.Content(Html, "text/html; charset=utf-8")).ExcludeFromDescription();
}
