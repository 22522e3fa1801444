namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// Calendar time to decimal year, the time coordinate of time-dependent transformations (EPSG GN 7-2 §4.3.5
/// gives epochs as decimal years): year + (time since 1 January 00:00 UTC) / (length of that year).
/// Common practice (IERS and PROJ's <c>cct</c> take such decimal years); the convention's ambiguity (calendar vs
/// 365.25-day years) is below 1 day, i.e. under 0.1 mm of plate motion.
/// </summary>
public static class DecimalYear
{
    public static double From(DateTimeOffset time)
    {
        var utc = time.UtcDateTime;
        var start = new DateTime(utc.Year, 1, 1, 0, 0, 0, DateTimeKind.Utc);
        var length = start.AddYears(1) - start;
        return utc.Year + (utc - start).TotalSeconds / length.TotalSeconds;
    }
}
