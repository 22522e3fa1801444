using QaService.Core.Assessment;

namespace QaService.Core.Transform;

/// <summary>Reads a requested EPSG operation code, <c>"EPSG:15948"</c> or <c>"15948"</c>.</summary>
public static class OperationCodeText
{
    private const string Prefix = "EPSG:";

    /// <summary>The code, or null when none was given; a malformed text adds an error at <paramref name="pointer"/>.</summary>
    public static int? Parse(string? text, string pointer, List<InputError> errors)
    {
        if (text is null)
            return null;
        var digits = text.Trim();
        if (digits.StartsWith(Prefix, StringComparison.OrdinalIgnoreCase))
            digits = digits[Prefix.Length..];
        if (int.TryParse(digits, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out var code) && code > 0)
            return code;
        errors.Add(new(pointer, $"operationCode \"{text}\" is not an EPSG code such as \"EPSG:15948\""));
        return null;
    }
}
