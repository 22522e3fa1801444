using System.Globalization;

namespace QaService.Core.Geodesy.Catalog.Wkt;

/// <summary>
/// One WKT element, <c>KEYWORD[value, value, …]</c> (OGC 01-009 §7 for WKT1, ISO 19162 / OGC 18-010r7 §6
/// for WKT2): a keyword and its ordered values — quoted texts, numbers, bare enumeration words, or
/// nested elements.
/// </summary>
public sealed class WktNode(string keyword, IReadOnlyList<object> values)
{
    /// <summary>The keyword in upper case, e.g. "PROJCS", "GEOGCRS".</summary>
    public string Keyword { get; } = keyword;

    /// <summary>Values in order: <see cref="string"/> (quoted text), <see cref="WktNumber"/>, <see cref="WktWord"/> or <see cref="WktNode"/>.</summary>
    public IReadOnlyList<object> Values { get; } = values;

    /// <summary>The first quoted text (the element's name), or null.</summary>
    public string? Name => Values.Count > 0 ? Values[0] as string : null;

    /// <summary>Child elements with any of the keywords (upper case).</summary>
    public IEnumerable<WktNode> Children(params string[] keywords) =>
        Values.OfType<WktNode>().Where(n => keywords.Contains(n.Keyword));

    /// <summary>The first child element with any of the keywords, or null.</summary>
    public WktNode? Child(params string[] keywords) => Children(keywords).FirstOrDefault();

    /// <summary>The i-th number among the values (0-based), or null.</summary>
    public double? Number(int index)
    {
        var numbers = Values.OfType<WktNumber>().ToList();
        return index < numbers.Count ? numbers[index].Value : null;
    }

    /// <summary>The first bare word among the values, lower case, or null.</summary>
    public string? Word => Values.OfType<WktWord>().FirstOrDefault()?.Text.ToLowerInvariant();

    /// <summary>
    /// The (authority, code) of an <c>AUTHORITY["EPSG","4326"]</c> (WKT1) or <c>ID["EPSG",4326]</c> (WKT2)
    /// directly inside this element, or null.
    /// </summary>
    public (string Authority, string Code)? Identifier()
    {
        var id = Child("AUTHORITY", "ID");
        if (id is null || id.Values.Count < 2 || id.Values[0] is not string authority)
            return null;
        string? code = id.Values[1] switch
        {
            string s => s,
            WktNumber n => n.Value.ToString("R", CultureInfo.InvariantCulture),
            _ => null,
        };
        return code is null ? null : (authority, code);
    }

    /// <summary>The EPSG code of <see cref="Identifier"/> when the authority is EPSG and the code an integer.</summary>
    public int? EpsgCode() =>
        Identifier() is { } id && id.Authority.Equals("EPSG", StringComparison.OrdinalIgnoreCase)
        && int.TryParse(id.Code, NumberStyles.None, CultureInfo.InvariantCulture, out var code) ? code : null;
}

/// <summary>A WKT number.</summary>
public sealed record WktNumber(double Value);

/// <summary>A bare WKT word (enumeration value such as <c>north</c> or <c>ellipsoidal</c>).</summary>
public sealed record WktWord(string Text);
