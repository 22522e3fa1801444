using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Upload;

/// <summary>
/// Form pieces shared by the guided upload's pages. A field with an error carries <c>aria-invalid="true"</c> and names
/// its message (and its hint) in <c>aria-describedby</c> (WAI-ARIA 1.2; WCAG 2.2 SC 3.3.1 Error Identification).
/// </summary>
internal static class FormMarkup
{
    /// <summary>The attributes that tie a control to its hint and error text.</summary>
    public static string Described(string id, bool hint, IReadOnlyDictionary<string, string> errors)
    {
        var ids = new List<string>();
        if (hint)
            ids.Add(id + "-hint");
        if (errors.ContainsKey(id))
            ids.Add(id + "-error");
        var described = ids.Count == 0 ? "" : $" aria-describedby=\"{string.Join(' ', ids)}\"";
        return errors.ContainsKey(id) ? described + " aria-invalid=\"true\"" : described;
    }

    /// <summary>The error text under a field (nothing when the field is fine).</summary>
    public static void Error(StringBuilder html, string id, IReadOnlyDictionary<string, string> errors)
    {
        if (errors.TryGetValue(id, out var message))
            html.Append($"<p class=\"field-error\" id=\"{id}-error\"><strong>Error:</strong> {Escape(message)}</p>");
    }

    public static void Hint(StringBuilder html, string id, string text) =>
        html.Append($"<p class=\"hint\" id=\"{id}-hint\">{text}</p>");

    /// <summary>A labelled text input with its hint and error.</summary>
    public static void Text(StringBuilder html, string id, string label, string? value, string? hint, IReadOnlyDictionary<string, string> errors, string extra = "")
    {
        html.Append($"<div class=\"field\"><label for=\"{id}\">{label}</label>");
        if (hint is not null)
            Hint(html, id, hint);
        Error(html, id, errors);
        html.Append($"<input type=\"text\" id=\"{id}\" name=\"{id}\" value=\"{Escape(value)}\"{Described(id, hint is not null, errors)}{extra}></div>");
    }

    /// <summary>A labelled select with its hint and error.</summary>
    public static void Select(StringBuilder html, string id, string label, string? value, IReadOnlyList<(string Value, string Label)> choices, string? hint, IReadOnlyDictionary<string, string> errors)
    {
        html.Append($"<div class=\"field\"><label for=\"{id}\">{label}</label>");
        if (hint is not null)
            Hint(html, id, hint);
        Error(html, id, errors);
        html.Append($"<select id=\"{id}\" name=\"{id}\"{Described(id, hint is not null, errors)}>");
        Options(html, value, choices);
        html.Append("</select></div>");
    }

    public static void Options(StringBuilder html, string? value, IReadOnlyList<(string Value, string Label)> choices)
    {
        foreach (var (option, text) in choices)
            html.Append($"<option value=\"{Escape(option)}\"{(option == value ? " selected" : "")}>{Escape(text)}</option>");
    }

    /// <summary>A list of every error linking to its field, first in the form, so a screen reader hears them at once.</summary>
    public static void Summary(StringBuilder html, IEnumerable<(string Target, string Text)> errors)
    {
        var list = errors.ToList();
        if (list.Count == 0)
            return;
        html.Append("<div class=\"error-summary\" id=\"error-summary\" role=\"alert\" tabindex=\"-1\"><h2 id=\"error-summary-h\">")
            .Append(list.Count == 1 ? "One thing to fix" : $"{list.Count} things to fix").Append("</h2><ul>");
        foreach (var (target, text) in list)
            html.Append($"<li><a href=\"#{Escape(target)}\">{Escape(text)}</a></li>");
        html.Append("</ul></div>");
    }

    public static void Antiforgery(StringBuilder html, Microsoft.AspNetCore.Antiforgery.AntiforgeryTokenSet tokens) =>
        html.Append($"<input type=\"hidden\" name=\"{Escape(tokens.FormFieldName)}\" value=\"{Escape(tokens.RequestToken)}\">");

    public static string Size(long bytes) => bytes switch
    {
        < 1024 => FormattableString.Invariant($"{bytes} bytes"),
        < 1024 * 1024 => FormattableString.Invariant($"{bytes / 1024.0:0.#} KiB"),
        _ => FormattableString.Invariant($"{bytes / (1024.0 * 1024.0):0.#} MiB"),
    };
}
