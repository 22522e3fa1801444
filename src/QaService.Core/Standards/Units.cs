using System.Globalization;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Standards;

/// <summary>Figures in statements: metres to the millimetre, feet to 0.01 ft (as <see cref="NssdaStatement"/>).</summary>
internal static class Units
{
    public static string Format(double metres, LinearUnit unit)
    {
        var inUnit = metres / unit.MetresPerUnit;
        return inUnit.ToString(unit.MetresPerUnit == 1.0 ? "F3" : "F2", CultureInfo.InvariantCulture);
    }
}
