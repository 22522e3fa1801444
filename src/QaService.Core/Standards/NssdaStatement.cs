using System.Globalization;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Statistics;

namespace QaService.Core.Standards;

/// <summary>
/// The NSSDA reporting sentence: "Tested __ (meters, feet) horizontal accuracy at 95% confidence
/// level" and the same for vertical (FGDC-STD-007.3-1998 §3.2.3; wording from memory, check-values.md
/// §1 status M). Figures are given in the unit of the marks' CRS, to the millimetre (or 0.01 ft).
/// </summary>
public static class NssdaStatement
{
    public static string Compose(HorizontalAccuracy? horizontal, VerticalAccuracy? vertical, LinearUnit unit)
    {
        var parts = new List<string>(2);
        if (horizontal is not null)
            parts.Add($"Tested {Value(horizontal.Nssda95, unit)} {unit.PluralName} horizontal accuracy at 95% confidence level");
        if (vertical is not null)
            parts.Add($"Tested {Value(vertical.Nssda95, unit)} {unit.PluralName} vertical accuracy at 95% confidence level");
        return parts.Count == 0
            ? "No accuracy tested: no fix could be paired with a mark"
            : string.Join("; ", parts);
    }

    private static string Value(double metres, LinearUnit unit)
    {
        var inUnit = metres / unit.MetresPerUnit;
        var format = unit.MetresPerUnit == 1.0 ? "F3" : "F2";
        return inUnit.ToString(format, CultureInfo.InvariantCulture);
    }
}
