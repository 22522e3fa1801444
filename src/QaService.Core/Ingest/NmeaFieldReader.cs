using System.Globalization;
using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// Reads an NMEA 0183 log line by line. Each GGA with a position is one fix: latitude/longitude
/// (ddmm.mmmm, WGS 84), fix quality, satellites used, HDOP, altitude above mean sea level (geoid) and
/// geoid separation, whose sum is the height above the WGS 84 ellipsoid (NMEA 0183 GGA fields 9 and 11),
/// and the age of differential corrections. GST of the same time gives the receiver's 1σ error
/// estimates; the latest GSA gives PDOP/HDOP/VDOP; RMC gives the date. Every talker id is read.
/// GGA with quality 0 or no position are not fixes and are skipped. Other sentences are checked
/// (checksum) and otherwise ignored. Rows are the GGA's line.
/// </summary>
/// <param name="wantHeights">False when the options say heights "none": a GGA without geoid separation is then still read.</param>
public sealed class NmeaFieldReader(bool wantHeights)
{
    private const double MinutesPerDegree = 60.0;

    /// <summary>GGA sentences without a fix (quality 0 or empty position).</summary>
    public long SkippedWithoutFix { get; private set; }

    public IEnumerable<FieldRow> Read(Stream stream)
    {
        using var text = TextDecoding.Open(stream);
        using var lines = new LineSource(text);
        Pending? pending = null;
        DateOnly? date = null;
        TimeSpan? lastTime = null;
        NmeaSentence? lastGsa = null;
        while (lines.ReadLine() is { } line)
        {
            var number = lines.LineNumber;
            if (line.Trim().Length == 0)
                continue;
            var (sentence, problem) = NmeaSentence.Parse(line);
            if (sentence is null)
            {
                yield return FieldRow.Bad(number, null, problem!);
                continue;
            }
            switch (sentence.Formatter)
            {
                case "GGA":
                    if (pending is not null)
                        yield return pending.Finish(lastGsa, date);
                    pending = null;
                    var gga = ReadGga(sentence, number);
                    if (gga is { Problem: not null })
                        yield return gga;
                    else if (gga is { Point: not null })
                    {
                        var time = ParseTime(sentence[1]);
                        if (time is { } t && lastTime is { } lt && t < lt && date is { } d)
                            date = d.AddDays(1);
                        lastTime = time ?? lastTime;
                        pending = new Pending(gga, time);
                    }
                    break;
                case "GST":
                    if (pending is not null && ParseTime(sentence[1]) == pending.Time)
                        pending.Gst = sentence;
                    break;
                case "GSA":
                    lastGsa = sentence;
                    break;
                case "RMC":
                    if (ParseDate(sentence[9]) is { } rmcDate)
                    {
                        date = rmcDate;
                        lastTime = ParseTime(sentence[1]) ?? lastTime;
                    }
                    break;
            }
        }
        if (pending is not null)
            yield return pending.Finish(lastGsa, date);
    }

    private sealed class Pending(FieldRow row, TimeSpan? time)
    {
        public TimeSpan? Time { get; } = time;
        public NmeaSentence? Gst { get; set; }

        public FieldRow Finish(NmeaSentence? gsa, DateOnly? date)
        {
            var receiver = row.Receiver! with
            {
                Pdop = Optional(gsa?[15]),
                Vdop = Optional(gsa?[17]),
                SigmaLatitudeMetres = Optional(Gst?[6]),
                SigmaLongitudeMetres = Optional(Gst?[7]),
                SigmaAltitudeMetres = Optional(Gst?[8]),
            };
            var stamp = date is { } d && Time is { } t ? new DateTimeOffset(d.ToDateTime(TimeOnly.MinValue), TimeSpan.Zero) + t : (DateTimeOffset?)null;
            return row with { Receiver = receiver, Point = row.Point! with { Time = stamp } };
        }
    }

    private FieldRow? ReadGga(NmeaSentence s, long line)
    {
        if (s[2].Length == 0 || s[4].Length == 0 || s[6] is "" or "0")
        {
            SkippedWithoutFix++;
            return null;
        }
        var lat = Coordinate(s[2], s[3], 'N', 'S', 2);
        var lon = Coordinate(s[4], s[5], 'E', 'W', 3);
        if (lat is null)
            return FieldRow.Bad(line, ContractFields.Lat, $"GGA latitude \"{s[2]},{s[3]}\" is not ddmm.mmmm followed by N or S");
        if (lon is null)
            return FieldRow.Bad(line, ContractFields.Lon, $"GGA longitude \"{s[4]},{s[5]}\" is not dddmm.mmmm followed by E or W");
        double? height = null;
        var altitude = Optional(s[9]);
        var separation = Optional(s[11]);
        if (wantHeights)
        {
            if (altitude is null)
                return FieldRow.Bad(line, ContractFields.H, "GGA has no altitude (field 9)");
            if (separation is null)
                return FieldRow.Bad(line, ContractFields.H, "GGA has no geoid separation (field 11), so the ellipsoidal height cannot be formed; send \"heights\": \"none\" for a horizontal-only test");
            height = altitude + separation;
        }
        var satellites = int.TryParse(s[7], NumberStyles.None, CultureInfo.InvariantCulture, out var n) ? n : (int?)null;
        var receiver = new ReceiverReport(Quality(s[6]), satellites, Hdop: Optional(s[8]), CorrectionAgeSeconds: Optional(s[13]), RawQualityCode: s[6]);
        return new FieldRow(line, new PointRecord(Lat: lat, Lon: lon, H: height), receiver);
    }

    /// <summary>GGA quality: 1 GPS/SPS, 2 differential (DGNSS, SBAS), 3 PPS, 4 RTK fixed, 5 RTK float, 6 dead reckoning, 7 manual, 8 simulator.</summary>
    private static FixQuality? Quality(string code) => code switch
    {
        "1" or "3" => FixQuality.Autonomous,
        "2" => FixQuality.Differential,
        "4" => FixQuality.RtkFixed,
        "5" => FixQuality.RtkFloat,
        "6" or "7" or "8" => FixQuality.NotMeasured,
        _ => null,
    };

    /// <summary>(d)ddmm.mmmm plus hemisphere to signed decimal degrees.</summary>
    private static double? Coordinate(string value, string hemisphere, char positive, char negative, int degreeDigits)
    {
        if (value.Length < degreeDigits + 2 || hemisphere.Length != 1 || (hemisphere[0] != positive && hemisphere[0] != negative))
            return null;
        if (!int.TryParse(value.AsSpan(0, degreeDigits), NumberStyles.None, CultureInfo.InvariantCulture, out var degrees)
            || !double.TryParse(value.AsSpan(degreeDigits), NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var minutes)
            || minutes >= MinutesPerDegree)
            return null;
        var result = degrees + minutes / MinutesPerDegree;
        return hemisphere[0] == negative ? -result : result;
    }

    private static double? Optional(string? text) =>
        text is { Length: > 0 } && double.TryParse(text, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var v) && double.IsFinite(v) ? v : null;

    private static TimeSpan? ParseTime(string hhmmss)
    {
        if (hhmmss.Length < 6
            || !int.TryParse(hhmmss.AsSpan(0, 2), NumberStyles.None, CultureInfo.InvariantCulture, out var h)
            || !int.TryParse(hhmmss.AsSpan(2, 2), NumberStyles.None, CultureInfo.InvariantCulture, out var m)
            || !double.TryParse(hhmmss.AsSpan(4), NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var s)
            || h > 23 || m > 59 || s >= 61)
            return null;
        return new TimeSpan(h, m, 0) + TimeSpan.FromSeconds(s);
    }

    private static DateOnly? ParseDate(string ddmmyy) =>
        ddmmyy.Length == 6 && DateOnly.TryParseExact(ddmmyy, "ddMMyy", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d) ? d : null;
}
