using System.Text;
using Microsoft.AspNetCore.Antiforgery;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Reporting.Html;
using QaService.Core.Standards;
using static QaService.Api.Upload.FormMarkup;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Upload;

/// <summary>What step one shows: the typed settings, their errors, CRS search results and files already received.</summary>
internal sealed record SettingsView(
    GuidedSettings Settings,
    IReadOnlyDictionary<string, string> Errors,
    string? Token,
    StagedFileNote? Marks,
    StagedFileNote? Fixes,
    CrsMatches? MarksMatches,
    CrsMatches? FixesMatches,
    long MaxFileBytes);

/// <summary>A file already staged: its name and size.</summary>
internal sealed record StagedFileNote(string Name, long Bytes);

/// <summary>A catalog search for one side: the words, the total and the entries shown.</summary>
internal sealed record CrsMatches(string Query, int Total, IReadOnlyList<CoordinateReferenceSystem> Items);

/// <summary>
/// Step one of the guided upload: each side's CRS (searched in the catalog: without script by a Search button that
/// shows the page again with the matches to choose from; with script also as live suggestions), heights, the standard,
/// the required accuracy in a chosen unit, an optional title and the two files.
/// </summary>
internal static class SettingsPage
{
    public const string FileTypes = ".csv,.txt,.geojson,.json,.gpx,.nmea,.nma,.log";

    /// <summary>Most catalog matches listed under a CRS field.</summary>
    public const int ListedMatches = 20;

    private static readonly string[] ErrorOrder =
        ["marksCrs", "marksHeights", "marks", "fixesCrs", "fixesHeights", "fixes", "standard", "horizontal", "vertical", "mapScale", "contourInterval", "pairingRadius", "title"];

    public static string Render(SettingsView view, AntiforgeryTokenSet tokens)
    {
        var html = new StringBuilder();
        var errors = view.Errors;
        PageShell.Open(html, "QaService — new accuracy test", "New accuracy test: settings and files", "QaService", UploadScript.ContentSecurityPolicy);
        html.Append("<p>Step 1 of 3: say how the two files are written and what accuracy is required; the next step shows the first rows of each file before anything is tested.</p>");
        html.Append($"<form id=\"guided\" class=\"upload guided\" method=\"post\" action=\"{GuidedUploadApi.Root}\" enctype=\"multipart/form-data\">");
        // Enter in a text field submits with the first submit button: make that the step's main action, not a Search.
        html.Append("<button type=\"submit\" name=\"action\" value=\"preview\" class=\"visually-hidden\" tabindex=\"-1\">Upload and preview</button>");
        Antiforgery(html, tokens);
        if (view.Token is not null)
            html.Append($"<input type=\"hidden\" name=\"token\" value=\"{Escape(view.Token)}\">");
        Summary(html, ErrorOrder.Where(errors.ContainsKey).Select(id => (id, $"{FieldName(id)}: {errors[id]}")));

        Side(html, "marks", "Marks: the surveyed check points", view.Settings.MarksCrs, view.Settings.MarksHeights, view.Marks, view.MarksMatches, view, 1);
        Side(html, "fixes", "Fixes: the field positions to test", view.Settings.FixesCrs, view.Settings.FixesHeights, view.Fixes, view.FixesMatches, view, 2);
        Requirement(html, view.Settings, errors);

        html.Append("<section aria-labelledby=\"send-h\"><h2 id=\"send-h\"><span class=\"num\">4</span> Send</h2>");
        Text(html, "title", "Title of the report (optional)", view.Settings.Title, null, errors, " maxlength=\"200\" autocomplete=\"off\"");
        html.Append("<div id=\"upload-progress-box\" class=\"progress\" hidden><label for=\"upload-progress\">Upload progress</label> ")
            .Append("<progress id=\"upload-progress\" max=\"1\" value=\"0\"></progress> <span id=\"upload-progress-text\" role=\"status\"></span></div>")
            .Append("<p><button type=\"submit\" name=\"action\" value=\"preview\" id=\"preview-button\">Upload and preview</button></p></section></form>");
        PageShell.Close(html, "Nothing is tested before the preview's Run button; staged files are removed after the run or when they expire.", UploadScript.Element);
        return html.ToString();
    }

    private static void Side(StringBuilder html, string side, string legend, string? crs, string? heights, StagedFileNote? file, CrsMatches? matches, SettingsView view, int number)
    {
        var errors = view.Errors;
        var crsId = side + "Crs";
        html.Append($"<section aria-labelledby=\"{side}-h\"><h2 id=\"{side}-h\"><span class=\"num\">{number}</span> {Escape(legend)}</h2>");
        html.Append($"<div class=\"field\"><label for=\"{crsId}\">Coordinate reference system (EPSG code or words of its name)</label>");
        Hint(html, crsId, "For example <code>EPSG:32633</code>, <code>4979</code> or <code>UTM 33N</code>. Press Search to list matching entries of the catalog.");
        Error(html, crsId, errors);
        html.Append($"<div class=\"inline\"><input type=\"text\" id=\"{crsId}\" name=\"{crsId}\" value=\"{Escape(crs)}\" list=\"{crsId}-list\" autocomplete=\"off\" data-crs-suggest{Described(crsId, true, errors)}>")
            .Append($"<datalist id=\"{crsId}-list\"></datalist>")
            .Append($" <button type=\"submit\" name=\"action\" value=\"search-{side}\" class=\"secondary\" id=\"{side}-search\">Search</button></div>")
            .Append($"<p class=\"hint\" id=\"{crsId}-status\" role=\"status\"></p>");
        if (GuidedSettings.Resolve(crs) is { } chosen)
            html.Append($"<p class=\"chosen\" id=\"{crsId}-chosen\">Chosen: <strong>{Escape(chosen.Identifier)}</strong> {Escape(chosen.Name)} ({KindText(chosen)}, {Escape(chosen.Unit.PluralName)})</p>");
        html.Append("</div>");
        if (matches is not null)
            Matches(html, crsId, matches);

        Select(html, side + "Heights", "Heights in the file", heights, GuidedSettings.HeightChoices, null, errors);

        html.Append($"<div class=\"field\"><label for=\"{side}\">{(side == "marks" ? "Marks file" : "Fixes file")}</label>");
        Hint(html, side, Escape($"CSV with a header row, GeoJSON points, GPX 1.1 or NMEA 0183; recognised from the content. At most {Size(view.MaxFileBytes)}.")
            + (file is null ? "" : $" Received: <strong id=\"{side}-received\">{Escape(file.Name)}</strong> ({Size(file.Bytes)}); choose another file only to replace it."));
        Error(html, side, errors);
        html.Append($"<input type=\"file\" id=\"{side}\" name=\"{side}\" accept=\"{FileTypes}\"{Described(side, true, errors)}></div></section>");
    }

    private static void Matches(StringBuilder html, string crsId, CrsMatches matches)
    {
        html.Append($"<fieldset class=\"matches\" id=\"{crsId}-matches\"><legend>");
        if (matches.Total == 0)
        {
            html.Append($"No CRS of the catalog matches “{Escape(matches.Query)}”</legend><p class=\"hint\">Try fewer words, a zone (<code>UTM 17N</code>) or an EPSG code.</p></fieldset>");
            return;
        }
        html.Append(matches.Total > matches.Items.Count
            ? Escape($"Choose one: the first {matches.Items.Count} of {matches.Total} matches for “{matches.Query}”")
            : Escape($"Choose one of {matches.Total} matches for “{matches.Query}”"));
        html.Append("</legend>");
        for (var i = 0; i < matches.Items.Count; i++)
        {
            var crs = matches.Items[i];
            var id = $"{crsId}Pick-{i}";
            html.Append($"<div class=\"choice\"><input type=\"radio\" name=\"{crsId}Pick\" id=\"{id}\" value=\"{Escape(crs.Identifier)}\"{(matches.Items.Count == 1 ? " checked" : "")}>")
                .Append($"<label for=\"{id}\"><strong>{Escape(crs.Identifier)}</strong> {Escape(crs.Name)} <span class=\"small\">({KindText(crs)}, {Escape(crs.Unit.PluralName)})</span></label></div>");
        }
        html.Append("</fieldset>");
    }

    private static void Requirement(StringBuilder html, GuidedSettings settings, IReadOnlyDictionary<string, string> errors)
    {
        html.Append("<section aria-labelledby=\"spec-h\"><h2 id=\"spec-h\"><span class=\"num\">3</span> Standard and required accuracy</h2>");
        Select(html, "standard", "Standard", settings.Standard, GuidedSettings.StandardChoices, null, errors);
        Length(html, "horizontal", "Required horizontal accuracy", settings.Horizontal, settings.HorizontalUnit,
            "NSSDA: radius at 95 % confidence; ASPRS: RMSE_H; CE90/LE90: CE90. Leave empty to test only the vertical.", errors);
        Length(html, "vertical", "Required vertical accuracy", settings.Vertical, settings.VerticalUnit,
            "NSSDA: 95 % confidence; ASPRS: RMSE_V; CE90/LE90: LE90. Leave empty to test only the horizontal.", errors);
        Text(html, "mapScale", "Map scale denominator (NMAS only)", settings.MapScale, "For 1:24,000 write 24000.", errors, " inputmode=\"numeric\" autocomplete=\"off\"");
        Text(html, "contourInterval", "Contour interval (NMAS only, in the vertical unit above)", settings.ContourInterval, null, errors, " inputmode=\"decimal\" autocomplete=\"off\"");
        Text(html, "pairingRadius", "Pair fixes that name no mark with the nearest mark within this many metres (optional)", settings.PairingRadius,
            "Without it, a fix pairs only with the mark its row names.", errors, " inputmode=\"decimal\" autocomplete=\"off\"");
        html.Append("<p class=\"small\">Units: an international foot is exactly 0.3048 m (1959 international yard and pound agreement); a US survey foot exactly 1200/3937 m. The service converts to metres before the test.</p></section>");
    }

    private static void Length(StringBuilder html, string id, string label, string? value, string? unit, string hint, IReadOnlyDictionary<string, string> errors)
    {
        html.Append($"<div class=\"field\"><label for=\"{id}\">{Escape(label)}</label>");
        Hint(html, id, Escape(hint));
        Error(html, id, errors);
        html.Append($"<div class=\"inline\"><input type=\"text\" id=\"{id}\" name=\"{id}\" value=\"{Escape(value)}\" inputmode=\"decimal\" autocomplete=\"off\"{Described(id, true, errors)}>")
            .Append($" <label class=\"unit\" for=\"{id}Unit\">unit</label> <select id=\"{id}Unit\" name=\"{id}Unit\">");
        Options(html, unit, LengthEntry.Units);
        html.Append("</select></div></div>");
    }

    internal static string KindText(CoordinateReferenceSystem crs) => crs.Kind switch
    {
        CrsKind.Geographic => "latitude/longitude",
        CrsKind.Projected => "easting/northing",
        _ => "geocentric x/y/z",
    };

    private static string FieldName(string id) => id switch
    {
        "marksCrs" => "Marks CRS",
        "fixesCrs" => "Fixes CRS",
        "marksHeights" => "Marks heights",
        "fixesHeights" => "Fixes heights",
        "marks" => "Marks file",
        "fixes" => "Fixes file",
        "standard" => "Standard",
        "horizontal" => "Horizontal accuracy",
        "vertical" => "Vertical accuracy",
        "mapScale" => "Map scale",
        "contourInterval" => "Contour interval",
        "pairingRadius" => "Pairing radius",
        _ => "Title",
    };
}
