using System.Globalization;
using QaService.Core.Assessment;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Ingest;
using QaService.Core.Standards;

namespace QaService.Api.Upload;

/// <summary>
/// The guided upload's first step as typed (kept as text so a page shown again holds exactly what was entered), and
/// its translation into the multipart request's options. Form field names are the property names in camelCase.
/// </summary>
public sealed record GuidedSettings(
    string? Title = null,
    string? MarksCrs = null,
    string? MarksHeights = null,
    string? FixesCrs = null,
    string? FixesHeights = null,
    string? Standard = null,
    string? Horizontal = null,
    string? HorizontalUnit = null,
    string? Vertical = null,
    string? VerticalUnit = null,
    string? MapScale = null,
    string? ContourInterval = null,
    string? PairingRadius = null)
{
    public const string Ellipsoidal = "ellipsoidal", Orthometric = "orthometric", NoHeights = "none";

    /// <summary>Height choices: value and label. Orthometric heights use the one geoid the service has built in.</summary>
    public static IReadOnlyList<(string Value, string Label)> HeightChoices { get; } =
    [
        (Ellipsoidal, "ellipsoidal (h above the ellipsoid)"),
        (Orthometric, "orthometric, EGM96 geoid (H above mean sea level)"),
        (NoHeights, "none (2D only; no vertical test)"),
    ];

    /// <summary>Standard choices: the ids of <see cref="AccuracyStandards"/> and what their two figures mean.</summary>
    public static IReadOnlyList<(string Value, string Label)> StandardChoices { get; } =
    [
        (AccuracyStandards.NssdaId, "NSSDA (FGDC-STD-007.3-1998): accuracy at 95 % confidence"),
        (AccuracyStandards.AsprsId, "ASPRS Positional Accuracy Standards, Edition 2 (2023): RMSE_H and RMSE_V"),
        (AccuracyStandards.NmasId, "NMAS (1947): map scale and contour interval"),
        (AccuracyStandards.NgaId, "CE90 / LE90 (NGA practice)"),
    ];

    public static GuidedSettings FromForm(IFormCollection form) => new(
        Text(form, "title"),
        Pick(form, "marksCrs"),
        Text(form, "marksHeights"),
        Pick(form, "fixesCrs"),
        Text(form, "fixesHeights"),
        Text(form, "standard"),
        Text(form, "horizontal"),
        Text(form, "horizontalUnit"),
        Text(form, "vertical"),
        Text(form, "verticalUnit"),
        Text(form, "mapScale"),
        Text(form, "contourInterval"),
        Text(form, "pairingRadius"));

    /// <summary>What a fresh form starts with.</summary>
    public static GuidedSettings Defaults { get; } = new(
        MarksHeights: Ellipsoidal, FixesHeights: Ellipsoidal, Standard: AccuracyStandards.NssdaId,
        HorizontalUnit: LengthEntry.Metre, VerticalUnit: LengthEntry.Metre);

    /// <summary>The CRS of a side when it resolves (for the preview's coordinate columns).</summary>
    public static CoordinateReferenceSystem? Resolve(string? crs) => string.IsNullOrWhiteSpace(crs) ? null : CrsCatalog.Resolve(crs.Trim()).Crs;

    /// <summary>Every problem of the settings, keyed by form field name; empty when they can be used.</summary>
    public IReadOnlyDictionary<string, string> Validate()
    {
        var errors = new Dictionary<string, string>(StringComparer.Ordinal);
        CheckCrs("marksCrs", MarksCrs, errors);
        CheckCrs("fixesCrs", FixesCrs, errors);
        CheckChoice("marksHeights", MarksHeights, HeightChoices, errors);
        CheckChoice("fixesHeights", FixesHeights, HeightChoices, errors);
        CheckChoice("standard", Standard, StandardChoices, errors);
        if (Title is { Length: > 200 })
            errors["title"] = "keep the title under 200 characters";
        var spec = Spec(errors);
        if (Standard == AccuracyStandards.NmasId && spec.MapScale is null && spec.ContourInterval is null && !errors.ContainsKey("mapScale"))
            errors["mapScale"] = "NMAS judges against the map: give the map scale and/or the contour interval";
        if (Standard != AccuracyStandards.NmasId && spec.Horizontal is null && spec.Vertical is null && !errors.ContainsKey("horizontal") && !errors.ContainsKey("vertical"))
            errors["horizontal"] = "give the required horizontal accuracy, the vertical one, or both";
        return errors;
    }

    /// <summary>The multipart request's options for these settings and the chosen CSV columns (contract field → header).</summary>
    public UploadOptions ToOptions(IReadOnlyDictionary<string, string>? marksColumns, IReadOnlyDictionary<string, string>? fixesColumns)
    {
        var ignored = new Dictionary<string, string>();
        var radius = Optional(PairingRadius, LengthEntry.Metre, "pairingRadius", ignored);
        return new UploadOptions(
            Side(MarksCrs, MarksHeights, marksColumns),
            Side(FixesCrs, FixesHeights, fixesColumns),
            string.IsNullOrWhiteSpace(Title) ? null : Title.Trim(),
            Spec(ignored),
            radius is null ? null : new PairingOptions(radius));
    }

    private static FilePartOptions Side(string? crs, string? heights, IReadOnlyDictionary<string, string>? columns) => new(
        crs?.Trim(),
        heights,
        heights == Orthometric ? "egm96" : null,
        Columns: columns is { Count: > 0 } ? columns : null);

    private AccuracySpec Spec(Dictionary<string, string> errors)
    {
        var standard = string.IsNullOrWhiteSpace(Standard) ? AccuracyStandards.NssdaId : Standard;
        double? scale = null;
        if (!string.IsNullOrWhiteSpace(MapScale))
        {
            var text = MapScale.Trim().Replace("1:", "", StringComparison.Ordinal).Replace(",", "", StringComparison.Ordinal).Replace(" ", "", StringComparison.Ordinal);
            if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var s) && double.IsFinite(s) && s >= 1)
                scale = s;
            else
                errors["mapScale"] = "write the scale's denominator, e.g. 24000 for 1:24,000";
        }
        return new AccuracySpec(
            standard,
            Optional(Horizontal, HorizontalUnit, "horizontal", errors),
            Optional(Vertical, VerticalUnit, "vertical", errors),
            MapScale: scale,
            ContourInterval: Optional(ContourInterval, VerticalUnit, "contourInterval", errors));
    }

    private static double? Optional(string? text, string? unit, string field, Dictionary<string, string> errors)
    {
        if (string.IsNullOrWhiteSpace(text))
            return null;
        var (metres, problem) = LengthEntry.ToMetres(text, unit);
        if (problem is not null)
            errors[field] = problem;
        return metres;
    }

    private static void CheckCrs(string field, string? crs, Dictionary<string, string> errors)
    {
        if (string.IsNullOrWhiteSpace(crs))
            errors[field] = "choose a CRS: type an EPSG code or words of its name and press Search";
        else if (CrsCatalog.Resolve(crs.Trim()) is { Crs: null } failed)
            errors[field] = $"{failed.Problem} — type words of its name (e.g. \"UTM 33N\") and press Search";
    }

    private static void CheckChoice(string field, string? value, IReadOnlyList<(string Value, string Label)> choices, Dictionary<string, string> errors)
    {
        if (!choices.Any(c => c.Value == value))
            errors[field] = "choose one of the listed options";
    }

    private static string? Text(IFormCollection form, string name) =>
        form.TryGetValue(name, out var value) && value.ToString() is { Length: > 0 } text ? text : null;

    /// <summary>A CRS picked from search results wins over the typed text.</summary>
    private static string? Pick(IFormCollection form, string name) => Text(form, name + "Pick") ?? Text(form, name);
}
