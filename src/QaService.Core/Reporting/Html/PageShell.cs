using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>The document around every page this service renders: one inline stylesheet, no script, no external resource.</summary>
public static class PageShell
{
    /// <summary>
    /// The response header's policy (with frame-ancestors, which only a header can carry), repeated in a meta
    /// element so a saved copy keeps the same rules: only inline styles, data: images and same-origin form posts.
    /// </summary>
    public const string ContentSecurityPolicy = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'self'";

    /// <summary>The brand mark: a target reticle with an offset dot (a fix beside its mark).</summary>
    private const string BrandMark =
        "<svg viewBox=\"0 0 44 44\" aria-hidden=\"true\" focusable=\"false\"><circle cx=\"22\" cy=\"22\" r=\"19\" fill=\"none\" stroke=\"#1f2a30\" stroke-width=\"2.5\"/>" +
        "<circle cx=\"22\" cy=\"22\" r=\"10\" fill=\"none\" stroke=\"#b8482a\" stroke-width=\"2.5\"/><path d=\"M22 0v12M22 32v12M0 22h12M32 22h12\" stroke=\"#1f2a30\" stroke-width=\"2\"/>" +
        "<circle cx=\"26\" cy=\"18\" r=\"3.2\" fill=\"#24557a\"/></svg>";

    /// <param name="policy">The page's policy when it differs from <see cref="ContentSecurityPolicy"/> (a page with its own hashed script);
    /// a constant of this service (no double quote), written as is.</param>
    public static void Open(StringBuilder html, string title, string heading, string brand, string? policy = null)
    {
        html.Append("<!doctype html><html lang=\"en\"><head><meta charset=\"utf-8\">")
            .Append($"<meta http-equiv=\"Content-Security-Policy\" content=\"{policy ?? ContentSecurityPolicy}\">")
            .Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"><meta name=\"referrer\" content=\"no-referrer\">")
            .Append("<link rel=\"icon\" href=\"data:,\">")
            .Append($"<title>{Escape(title)}</title><style>{PageStyle.Css}</style></head><body>")
            .Append("<a class=\"skip\" href=\"#main\">Skip to content</a>")
            .Append($"<header class=\"masthead\">{BrandMark}<div><p class=\"brand\">{Escape(brand)}</p><h1>{Escape(heading)}</h1></div></header>")
            .Append("<main id=\"main\">");
    }

    /// <param name="script">Markup placed at the end of the body (an inline script the page's policy allows), or null.</param>
    public static void Close(StringBuilder html, string footer, string? script = null) =>
        html.Append($"</main><footer>{footer}</footer>{script}</body></html>");
}
