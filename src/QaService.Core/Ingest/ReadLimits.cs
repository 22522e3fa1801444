namespace QaService.Core.Ingest;

/// <summary>Limits that keep a hostile or broken file from exhausting memory. Common practice, not a standard.</summary>
public static class ReadLimits
{
    /// <summary>
    /// Longest line read, characters. A CSV or NMEA record is well under 1 KiB (NMEA 0183 caps a sentence
    /// at 82 characters); 64 KiB leaves room for wide CSV exports and still stops a file with no line breaks.
    /// </summary>
    public const int MaximumLineCharacters = 65_536;

    /// <summary>Longest text of one GPX element or attribute value read, characters.</summary>
    public const int MaximumXmlValueCharacters = 4_096;

    /// <summary>Largest single GeoJSON feature, bytes: a Point feature with properties is a few hundred bytes.</summary>
    public const int MaximumGeoJsonFeatureBytes = 1_048_576;

    /// <summary>Bytes inspected to recognise a format.</summary>
    public const int SniffBytes = 4_096;
}
