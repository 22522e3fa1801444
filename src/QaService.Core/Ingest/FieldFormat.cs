namespace QaService.Core.Ingest;

/// <summary>The field file formats this service reads, recognised from content (<see cref="FormatSniffer"/>).</summary>
public enum FieldFormat
{
    /// <summary>Delimited text with a header row (<c>,</c> <c>;</c> or tab).</summary>
    Csv,
    /// <summary>GeoJSON (RFC 7946) Point features.</summary>
    GeoJson,
    /// <summary>GPX 1.1 waypoints, route points and track points.</summary>
    Gpx,
    /// <summary>NMEA 0183 sentences (GGA with GST, GSA, RMC).</summary>
    Nmea,
}
