using System.Globalization;
using System.Text;
using Microsoft.AspNetCore.Antiforgery;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Ingest;
using QaService.Core.Reporting.Html;
using static QaService.Api.Upload.FormMarkup;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Upload;

/// <summary>What the preview shows of one side.</summary>
/// <param name="Chosen">Contract field → header chosen (first the reader's own detection, then the person's changes).</param>
/// <param name="RowErrors">Errors of the last run that point at a row of this file.</param>
/// <param name="FileErrors">Errors of the last run about the whole file or a column choice (form field id → message).</param>
internal sealed record SidePreview(
    string Side,
    string FileName,
    long Bytes,
    FilePreview Preview,
    CoordinateReferenceSystem? Crs,
    IReadOnlyDictionary<string, string> Chosen,
    IReadOnlyList<RowError> RowErrors,
    IReadOnlyDictionary<string, string> FileErrors);

/// <summary>An error at a row of a file, with the row as written.</summary>
internal sealed record RowError(long Row, string? Field, string Message, string? RowText);

/// <summary>
/// Step two: per file the recognised format, the first rows and, for CSV, a select per contract field preselected
/// from the reader's own header detection; errors of a run are shown at the file, the row and the column they name.
/// </summary>
internal static class PreviewPage
{
    public static string Render(string token, GuidedSettings settings, SidePreview marks, SidePreview fixes, IReadOnlyList<(string Pointer, string Message)> otherErrors, AntiforgeryTokenSet tokens)
    {
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — check the files", "Check the files before the test", "QaService", UploadScript.ContentSecurityPolicy);
        html.Append("<p>Step 2 of 3: this is how the service reads the first rows. For CSV files, check which column holds each field and change it where it is wrong; then run the test.</p>");
        var summary = new List<(string, string)>();
        foreach (var side in new[] { marks, fixes })
        {
            summary.AddRange(side.FileErrors.Select(e => (e.Key, $"{Title(side)}: {e.Value}")));
            summary.AddRange(side.RowErrors.Take(20).Select(e => (RowId(side.Side, e.Row), $"{Title(side)}, {RowName(side, e.Row)}{(e.Field is null ? "" : $", {e.Field}")}: {e.Message}")));
        }
        summary.AddRange(otherErrors.Select(e => ("settings", $"Settings ({e.Pointer}): {e.Message}")));
        Summary(html, summary);

        html.Append($"<form id=\"run\" class=\"upload\" method=\"post\" action=\"{GuidedUploadApi.Root}/{Escape(token)}/run\">");
        Antiforgery(html, tokens);
        Settings(html, token, settings, otherErrors);
        Side(html, marks, 2);
        Side(html, fixes, 3);
        html.Append("<section aria-labelledby=\"run-h\"><h2 id=\"run-h\"><span class=\"num\">4</span> Run</h2>")
            .Append("<p><button type=\"submit\" id=\"run-button\">Run the test</button></p></section></form>");
        PageShell.Close(html, "The files stay staged until the test runs or they expire.");
        return html.ToString();
    }

    private static void Settings(StringBuilder html, string token, GuidedSettings settings, IReadOnlyList<(string Pointer, string Message)> otherErrors)
    {
        html.Append("<section aria-labelledby=\"settings-h\" id=\"settings\" tabindex=\"-1\"><h2 id=\"settings-h\"><span class=\"num\">1</span> Settings</h2><dl class=\"frames\">");
        Row(html, "Marks", $"{settings.MarksCrs} · heights {settings.MarksHeights}");
        Row(html, "Fixes", $"{settings.FixesCrs} · heights {settings.FixesHeights}");
        Row(html, "Standard", settings.Standard ?? "");
        Row(html, "Horizontal", Typed(settings.Horizontal, settings.HorizontalUnit));
        Row(html, "Vertical", Typed(settings.Vertical, settings.VerticalUnit));
        if (!string.IsNullOrWhiteSpace(settings.Title))
            Row(html, "Title", settings.Title);
        html.Append("</dl>");
        if (otherErrors.Count > 0)
        {
            html.Append("<ul class=\"field-error\" id=\"settings-errors\">");
            foreach (var (pointer, message) in otherErrors)
                html.Append($"<li><code>{Escape(pointer)}</code>: {Escape(message)}</li>");
            html.Append("</ul>");
        }
        html.Append($"<p><a href=\"{GuidedUploadApi.Root}/new?token={Uri.EscapeDataString(token)}\" id=\"change-settings\">Change the settings or the files</a></p></section>");
    }

    private static void Row(StringBuilder html, string term, string value) =>
        html.Append($"<div><dt>{Escape(term)}</dt><dd>{Escape(value)}</dd></div>");

    private static string Typed(string? value, string? unit) => string.IsNullOrWhiteSpace(value) ? "not tested" : $"{value} {unit}";

    private static void Side(StringBuilder html, SidePreview side, int number)
    {
        var preview = side.Preview;
        html.Append($"<section aria-labelledby=\"{side.Side}-h\" id=\"{side.Side}-section\"><h2 id=\"{side.Side}-h\"><span class=\"num\">{number}</span> {Title(side)}: {Escape(side.FileName)}</h2>");
        html.Append($"<p id=\"{side.Side}-format\">Format: <strong>{FormatName(preview.Format)}</strong> (recognised from the content) · {Size(side.Bytes)}</p>");
        if (preview.Problem is not null)
            html.Append($"<p class=\"field-error\" id=\"{side.Side}-problem\"><strong>Error:</strong> {Escape(preview.Problem)}</p>");
        if (side.FileErrors.TryGetValue(side.Side, out var fileError))
            html.Append($"<p class=\"field-error\" id=\"{side.Side}\" tabindex=\"-1\"><strong>Error:</strong> {Escape(fileError)}</p>");
        if (preview.Rows.Count > 0)
            Rows(html, side);
        if (preview.Format == FieldFormat.Csv && preview.Headers.Count > 0)
            Columns(html, side);
        if (side.RowErrors.Count > 0)
            Errors(html, side);
        html.Append("</section>");
    }

    private static void Rows(StringBuilder html, SidePreview side)
    {
        var preview = side.Preview;
        html.Append($"<div class=\"scroll\" tabindex=\"0\" role=\"region\" aria-labelledby=\"{side.Side}-rows-caption\"><table id=\"{side.Side}-preview\"><caption id=\"{side.Side}-rows-caption\">First {preview.Rows.Count} rows as read</caption><thead><tr><th scope=\"col\">{RowHeading(side)}</th>");
        foreach (var header in preview.Headers)
            html.Append($"<th scope=\"col\">{Escape(header)}</th>");
        html.Append("</tr></thead><tbody>");
        foreach (var row in preview.Rows)
        {
            html.Append($"<tr><th scope=\"row\" class=\"n\">{row.Row}</th>");
            foreach (var cell in row.Cells)
                html.Append($"<td>{Escape(cell)}</td>");
            html.Append("</tr>");
        }
        html.Append("</tbody></table></div>");
    }

    private static void Columns(StringBuilder html, SidePreview side)
    {
        var headers = side.Preview.Headers.Select(h => (h, h)).Prepend(("", "(not in the file)")).ToList();
        html.Append($"<fieldset class=\"columns\" id=\"{side.Side}-columns\"><legend>Which column holds each field</legend><div class=\"colmap\">");
        var rowFields = side.RowErrors.Where(e => e.Field is not null).Select(e => e.Field!).ToHashSet(StringComparer.Ordinal);
        foreach (var (field, meaning) in Fields(side))
        {
            var id = ColumnId(side.Side, field);
            var error = side.FileErrors.TryGetValue(id, out var message) ? message : null;
            var invalid = error is not null || rowFields.Contains(field);
            var described = new List<string>();
            if (error is not null)
                described.Add(id + "-error");
            if (rowFields.Contains(field))
                described.Add(side.Side + "-errors");
            html.Append($"<div class=\"field\"><label for=\"{id}\"><code>{field}</code> {Escape(meaning)}</label>");
            if (error is not null)
                html.Append($"<p class=\"field-error\" id=\"{id}-error\"><strong>Error:</strong> {Escape(error)}</p>");
            html.Append($"<select id=\"{id}\" name=\"{side.Side}.{field}\"")
                .Append(described.Count > 0 ? $" aria-describedby=\"{string.Join(' ', described)}\"" : "")
                .Append(invalid ? " aria-invalid=\"true\">" : ">");
            Options(html, side.Chosen.GetValueOrDefault(field, ""), headers);
            html.Append("</select></div>");
        }
        html.Append("</div><p class=\"hint\">Preselected where a header is the field's own name; columns not chosen are ignored.</p></fieldset>");
    }

    private static void Errors(StringBuilder html, SidePreview side)
    {
        html.Append($"<div class=\"scroll\" tabindex=\"0\" role=\"region\" aria-labelledby=\"{side.Side}-errors-caption\"><table id=\"{side.Side}-errors\" class=\"row-errors\"><caption id=\"{side.Side}-errors-caption\">Rows to fix in {Escape(side.FileName)}")
            .Append(side.RowErrors.Count > PreviewLimits.ListedRowErrors ? $" (the first {PreviewLimits.ListedRowErrors})" : "")
            .Append($"</caption><thead><tr><th scope=\"col\">{RowHeading(side)}</th><th scope=\"col\">field (column)</th><th scope=\"col\">problem</th><th scope=\"col\">the row as written</th></tr></thead><tbody>");
        foreach (var error in side.RowErrors.Take(PreviewLimits.ListedRowErrors))
        {
            var column = error.Field is not null && side.Chosen.TryGetValue(error.Field, out var header) && header != error.Field ? $" (“{header}”)" : "";
            html.Append($"<tr id=\"{RowId(side.Side, error.Row)}\" tabindex=\"-1\"><th scope=\"row\" class=\"n\">{error.Row}</th><td>{Escape(error.Field ?? "(whole row)")}{Escape(column)}</td>")
                .Append($"<td>{Escape(error.Message)}</td><td><code>{Escape(error.RowText ?? "")}</code></td></tr>");
        }
        html.Append("</tbody></table></div>");
    }

    /// <summary>The contract fields a file of this side can fill, with their meaning in the side's CRS.</summary>
    internal static IReadOnlyList<(string Field, string Meaning)> Fields(SidePreview side)
    {
        var fields = new List<(string, string)> { (ContractFields.Id, "point id") };
        if (side.Side == "fixes")
            fields.Add((ContractFields.Mark, "id of the mark the fix was taken at"));
        var unit = side.Crs?.Unit.PluralName ?? "CRS unit";
        fields.AddRange(side.Crs?.Kind switch
        {
            CrsKind.Projected => [(ContractFields.E, $"easting ({unit})"), (ContractFields.N, $"northing ({unit})")],
            CrsKind.Geocentric => [(ContractFields.X, "x (metres)"), (ContractFields.Y, "y (metres)"), (ContractFields.Z, "z (metres)")],
            _ => new (string, string)[] { (ContractFields.Lat, "latitude (degrees)"), (ContractFields.Lon, "longitude (degrees)") },
        });
        if (side.Crs?.Kind != CrsKind.Geocentric)
            fields.Add((ContractFields.H, $"height ({unit})"));
        fields.Add((ContractFields.SigmaH, "horizontal standard deviation (metres)"));
        fields.Add((ContractFields.SigmaV, "vertical standard deviation (metres)"));
        if (side.Side == "fixes")
            fields.Add((ContractFields.Time, "time (ISO 8601)"));
        return fields;
    }

    public static string ColumnId(string side, string field) => $"{side}-col-{field}";

    public static string RowId(string side, long row) => string.Create(CultureInfo.InvariantCulture, $"{side}-row-{row}");

    private static string Title(SidePreview side) => side.Side == "marks" ? "Marks file" : "Fixes file";

    private static string RowHeading(SidePreview side) => side.Preview.Format == FieldFormat.GeoJson ? "feature" : "line";

    private static string RowName(SidePreview side, long row) =>
        string.Create(CultureInfo.InvariantCulture, $"{RowHeading(side)} {row}");

    private static string FormatName(FieldFormat? format) => format switch
    {
        FieldFormat.Csv => "CSV (delimited text with a header row)",
        FieldFormat.GeoJson => "GeoJSON",
        FieldFormat.Gpx => "GPX",
        FieldFormat.Nmea => "NMEA 0183",
        _ => "not recognised",
    };
}

/// <summary>How much of a run's errors the preview lists.</summary>
internal static class PreviewLimits
{
    public const int ListedRowErrors = 100;
}
