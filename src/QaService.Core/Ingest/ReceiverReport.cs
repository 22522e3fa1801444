namespace QaService.Core.Ingest;

/// <summary>Kind of GNSS solution, as receivers report it (NMEA 0183 GGA field 6, GPX <c>fix</c>).</summary>
public enum FixQuality
{
    /// <summary>Single-point positioning from broadcast orbits and clocks only.</summary>
    Autonomous,
    /// <summary>Differential code corrections: ground station (DGNSS) or satellite-based (SBAS: WAAS, EGNOS, MSAS, GAGAN).</summary>
    Differential,
    /// <summary>Precise point positioning with precise orbits and clocks.</summary>
    Ppp,
    /// <summary>Carrier-phase RTK with float ambiguities.</summary>
    RtkFloat,
    /// <summary>Carrier-phase RTK with integer ambiguities fixed.</summary>
    RtkFixed,
    /// <summary>Dead reckoning, manual input or simulator: not a measured position.</summary>
    NotMeasured,
}

/// <summary>
/// What a receiver said about one fix, as read from the file (no judgement). Any value may be missing.
/// </summary>
/// <param name="Quality">Solution kind.</param>
/// <param name="Satellites">Satellites used in the solution.</param>
/// <param name="Pdop">Position dilution of precision (dimensionless).</param>
/// <param name="Hdop">Horizontal dilution of precision (dimensionless).</param>
/// <param name="Vdop">Vertical dilution of precision (dimensionless).</param>
/// <param name="SigmaLatitudeMetres">Receiver's 1σ error estimate of latitude, metres (NMEA GST).</param>
/// <param name="SigmaLongitudeMetres">Receiver's 1σ error estimate of longitude, metres (NMEA GST).</param>
/// <param name="SigmaAltitudeMetres">Receiver's 1σ error estimate of altitude, metres (NMEA GST).</param>
/// <param name="CorrectionAgeSeconds">Age of differential corrections, seconds.</param>
/// <param name="RawQualityCode">The code as written (NMEA GGA quality digit, GPX fix word).</param>
public sealed record ReceiverReport(
    FixQuality? Quality = null,
    int? Satellites = null,
    double? Pdop = null,
    double? Hdop = null,
    double? Vdop = null,
    double? SigmaLatitudeMetres = null,
    double? SigmaLongitudeMetres = null,
    double? SigmaAltitudeMetres = null,
    double? CorrectionAgeSeconds = null,
    string? RawQualityCode = null);
