using System.Collections.Frozen;
using System.Globalization;
using System.Text.RegularExpressions;
using QaService.Core.Geodesy.Catalog.Wkt;

namespace QaService.Core.Geodesy.Catalog;

/// <summary>
/// Resolves CRS strings to the CRSs this build supports: the geographic, geocentric and projected CRSs
/// of the EPSG Geodetic Parameter Dataset (attribution: "EPSG Geodetic Parameter Dataset, IOGP") on
/// WGS 84 and its realisations, ITRF2000–ITRF2020, ETRS89 and ETRF89–ETRF2014, NAD83, NAD83(2011),
/// NAD83(CSRS), GDA94 and GDA2020, for every projection method implemented in
/// <see cref="Projections"/> — generated into <c>epsg-catalog.tsv</c> by <c>make-epsg-catalog.py</c>
/// from PROJ's proj.db. OGC WKT1 and WKT2 are read by <see cref="WktCrsReader"/>.
/// </summary>
public static partial class CrsCatalog
{
    /// <summary>The identifiers resolved by this catalog, for error messages and discovery.</summary>
    public const string SupportedSummary =
        "EPSG geographic, geocentric and projected CRSs on WGS 84, ITRF2000–2020, ETRS89/ETRF, NAD83, NAD83(2011), " +
        "NAD83(CSRS), GDA94 and GDA2020 (UTM, State Plane, LAEA/LCC Europe, Web Mercator and others; list them with GET /v1/crs), " +
        "or OGC WKT1/WKT2 using one of the implemented projection methods";

    private static readonly Lazy<Index> Catalog = new(BuildIndex, LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>Every CRS of the catalog, ordered by EPSG code.</summary>
    public static IReadOnlyList<CoordinateReferenceSystem> All => Catalog.Value.Ordered;

    /// <summary>
    /// Reads <c>EPSG:code</c> (any case), <c>urn:ogc:def:crs:EPSG::code</c>,
    /// <c>http(s)://www.opengis.net/def/crs/EPSG/0/code</c>, or OGC WKT1/WKT2 text. Anything else, and
    /// CRSs outside the catalog, are answered with a message that says what is supported.
    /// </summary>
    public static CrsResolution Resolve(string? text)
    {
        if (string.IsNullOrWhiteSpace(text))
            return CrsResolution.Failed($"a CRS is required, e.g. \"EPSG:4326\"; supported: {SupportedSummary}");

        var trimmed = text.Trim();
        if (WktCrsReader.LooksLikeWkt(trimmed))
            return WktCrsReader.Read(trimmed);

        var match = EpsgPattern().Match(trimmed);
        if (!match.Success)
            return CrsResolution.Failed($"\"{Shorten(trimmed)}\" is not a CRS identifier; write \"EPSG:<code>\" or OGC WKT (supported: {SupportedSummary})");

        if (!int.TryParse(match.Groups["code"].Value, NumberStyles.None, CultureInfo.InvariantCulture, out var code))
            return CrsResolution.Failed($"EPSG code \"{Shorten(match.Groups["code"].Value)}\" is out of range");

        return ResolveCode(code);
    }

    /// <summary>The CRS for an EPSG code, or a "not supported yet" message.</summary>
    public static CrsResolution ResolveCode(int epsgCode)
    {
        var crs = ByCode(epsgCode);
        return crs is null
            ? CrsResolution.Failed($"EPSG:{epsgCode} is not supported yet; supported: {SupportedSummary}")
            : CrsResolution.Found(crs);
    }

    /// <summary>The CRS for an EPSG code, or null when the code is not in this catalog.</summary>
    public static CoordinateReferenceSystem? ByCode(int epsgCode) =>
        Catalog.Value.ByCode.TryGetValue(epsgCode, out var crs) ? crs : null;

    /// <summary>
    /// Catalog entries whose code starts with <paramref name="query"/> (digits, optionally after "EPSG:")
    /// or whose name contains every word of it (case-insensitive), ordered by code.
    /// </summary>
    /// <param name="query">Code or words; empty lists everything.</param>
    /// <param name="offset">Entries to skip, ≥ 0.</param>
    /// <param name="limit">Most entries to return, ≥ 1.</param>
    public static CrsSearchResult Search(string? query, int offset, int limit)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(offset);
        ArgumentOutOfRangeException.ThrowIfLessThan(limit, 1);
        var text = (query ?? string.Empty).Trim();
        if (text.StartsWith("EPSG:", StringComparison.OrdinalIgnoreCase))
            text = text[5..];
        var words = text.Split((char[])[' ', '\t', '/', ',', '(', ')'], StringSplitOptions.RemoveEmptyEntries);
        bool isCode = words.Length == 1 && words[0].All(char.IsAsciiDigit);
        var matches = All.Where(crs =>
            isCode ? crs.Identifier.AsSpan(5).StartsWith(words[0], StringComparison.Ordinal)
                     || words.All(w => crs.Name.Contains(w, StringComparison.OrdinalIgnoreCase))
                   : words.All(w => crs.Name.Contains(w, StringComparison.OrdinalIgnoreCase))).ToList();
        return new CrsSearchResult(matches.Count, matches.Skip(offset).Take(limit).ToList());
    }

    private static Index BuildIndex()
    {
        var all = EpsgCatalogFile.Load();
        var byCode = all.ToFrozenDictionary(c => int.Parse(c.Identifier.AsSpan(5), CultureInfo.InvariantCulture));
        return new Index(all.OrderBy(c => int.Parse(c.Identifier.AsSpan(5), CultureInfo.InvariantCulture)).ToList(), byCode);
    }

    private static string Shorten(string text) => text.Length <= 40 ? text : text[..40] + "…";

    [GeneratedRegex(@"^(?:EPSG:|urn:ogc:def:crs:EPSG:[^:]*:|https?://www\.opengis\.net/def/crs/EPSG/[^/]+/)(?<code>\d{1,9})$", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex EpsgPattern();

    private sealed record Index(IReadOnlyList<CoordinateReferenceSystem> Ordered, FrozenDictionary<int, CoordinateReferenceSystem> ByCode);
}

/// <summary>One page of a catalog search.</summary>
/// <param name="Total">Entries matching the query in all.</param>
/// <param name="Items">The entries of this page.</param>
public sealed record CrsSearchResult(int Total, IReadOnlyList<CoordinateReferenceSystem> Items);
