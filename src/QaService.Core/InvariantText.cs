using System.Globalization;

namespace QaService.Core;

/// <summary>Culture-independent formatting for messages: reports read the same on every server.</summary>
internal static class InvariantText
{
    public static string Format(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
