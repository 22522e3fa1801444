using Microsoft.Playwright;

namespace QaService.Browser.Tests;

/// <summary>
/// A fresh browser page that records every request it makes, every console error and page error, and any
/// dialog (an injected <c>alert</c> would open one).
/// </summary>
internal sealed class BrowserSession : IAsyncDisposable
{
    private readonly IBrowserContext context;

    private BrowserSession(IBrowserContext context, IPage page)
    {
        this.context = context;
        Page = page;
        page.Request += (_, request) => Requests.Add(request.Url);
        page.Console += (_, message) =>
        {
            if (message.Type == "error")
                Errors.Add($"console: {message.Text}");
        };
        page.PageError += (_, error) => Errors.Add($"page: {error}");
        page.Dialog += async (_, dialog) =>
        {
            Dialogs.Add(dialog.Message);
            await dialog.DismissAsync();
        };
    }

    public IPage Page { get; }

    public List<string> Requests { get; } = [];

    public List<string> Errors { get; } = [];

    public List<string> Dialogs { get; } = [];

    /// <param name="javaScript">False for a browser with script turned off (the pages must work without it).</param>
    /// <param name="bypassCsp">True only where a test injects its own script (the axe audit); the pages' policy stays tested elsewhere.</param>
    public static async Task<BrowserSession> OpenAsync(LiveService service, int width = 1100, int height = 900, bool javaScript = true, bool bypassCsp = false)
    {
        var context = await service.Browser.NewContextAsync(new BrowserNewContextOptions
        {
            ViewportSize = new ViewportSize { Width = width, Height = height },
            BaseURL = service.BaseAddress.ToString(),
            JavaScriptEnabled = javaScript,
            BypassCSP = bypassCsp,
        });
        return new BrowserSession(context, await context.NewPageAsync());
    }

    /// <summary>Requests that left the service's own origin.</summary>
    public IEnumerable<string> ExternalRequests(LiveService service) =>
        Requests.Where(url => !url.StartsWith(service.BaseAddress.ToString(), StringComparison.Ordinal) && !url.StartsWith("data:", StringComparison.Ordinal));

    public ValueTask DisposeAsync() => context.DisposeAsync();
}
