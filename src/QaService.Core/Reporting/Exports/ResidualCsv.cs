using System.Text;
using QaService.Core.Reporting.Plots;

namespace QaService.Core.Reporting.Exports;

/// <summary>
/// The residual table as CSV (RFC 4180: header row, CRLF line ends, UTF-8). Lengths in metres to 0.1 mm,
/// mark positions WGS 84 degrees to 1e-9°; featureClass, crew and receiver columns follow when any fix gave one. Text fields are neutralised against formula injection (<see cref="CsvCell"/>).
/// </summary>
public static class ResidualCsv
{
    public const string MediaType = "text/csv; charset=utf-8; header=present";

    private const string LengthFormat = "0.0000";
    private const string DegreeFormat = "0.000000000";

    public static readonly string[] Header =
        ["mark", "fix", "pairedBy", "dE_m", "dN_m", "dU_m", "dH_m", "markLat_deg", "markLon_deg", "excluded", "flags"];

    /// <summary>Columns added after <see cref="Header"/> when any fix carried a name attribute (the report's groups).</summary>
    public static readonly string[] AttributeHeader = ["featureClass", "crew", "receiver"];

    public static string Write(AssessmentReport report) => Write(report, ResidualFlags.For(report));

    public static string Write(AssessmentReport report, IReadOnlyList<IReadOnlyList<string>> flags)
    {
        var csv = new StringBuilder();
        var withAttributes = report.Residuals.Any(r => r.FeatureClass is not null || r.Crew is not null || r.Receiver is not null);
        csv.Append(string.Join(',', withAttributes ? [.. Header, .. AttributeHeader] : Header)).Append("\r\n");
        for (int i = 0; i < report.Residuals.Count; i++)
        {
            var r = report.Residuals[i];
            string[] fields =
            [
                CsvCell.Text(r.Mark),
                CsvCell.Text(r.Fix),
                CsvCell.Text(r.PairedBy),
                CsvCell.Number(r.DE, LengthFormat),
                CsvCell.Number(r.DN, LengthFormat),
                CsvCell.Number(r.DU, LengthFormat),
                CsvCell.Number(r.DH, LengthFormat),
                CsvCell.Number(r.MarkLatitude, DegreeFormat),
                CsvCell.Number(r.MarkLongitude, DegreeFormat),
                CsvCell.Text(r.Excluded),
                CsvCell.Text(string.Join(' ', flags[i])),
            ];
            csv.Append(string.Join(',', fields));
            if (withAttributes)
                csv.Append(',').Append(CsvCell.Text(r.FeatureClass)).Append(',').Append(CsvCell.Text(r.Crew)).Append(',').Append(CsvCell.Text(r.Receiver));
            csv.Append("\r\n");
        }

        return csv.ToString();
    }
}
