using System.Globalization;
using System.Xml;
using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// Reads GPX 1.1 (topografix.com/GPX/1/1) waypoints, route points and track points as a stream
/// (<see cref="XmlReader"/>, never a DOM): attributes <c>lat</c>/<c>lon</c> (decimal degrees, WGS 84),
/// children <c>ele</c> (metres), <c>time</c>, <c>name</c> (the point's id), and the receiver's
/// <c>fix</c>, <c>sat</c>, <c>hdop</c>, <c>vdop</c>, <c>pdop</c>, <c>ageofdgpsdata</c>. GPX 1.0 files,
/// which use the same element names, are read too. DTDs are refused and no external entity is ever
/// resolved (no XXE), values are length-limited. Rows are the line of each point's start tag.
/// </summary>
public sealed class GpxFieldReader
{
    private static readonly XmlReaderSettings Settings = new()
    {
        DtdProcessing = DtdProcessing.Prohibit,
        XmlResolver = null,
        MaxCharactersFromEntities = 0,
        IgnoreComments = true,
        IgnoreProcessingInstructions = true,
        IgnoreWhitespace = true,
        CloseInput = false,
    };

    public IEnumerable<FieldRow> Read(Stream stream)
    {
        using var text = TextDecoding.Open(stream);
        using var xml = XmlReader.Create(text, Settings);
        var lineInfo = (IXmlLineInfo)xml;
        var sawRoot = false;
        while (true)
        {
            FieldRow? row = null;
            try
            {
                if (!xml.Read())
                    break;
                if (xml.NodeType != XmlNodeType.Element)
                    continue;
                if (!sawRoot)
                {
                    if (xml.LocalName != "gpx")
                        throw new FieldFileException(lineInfo.LineNumber, $"the root element is <{xml.LocalName}>, not <gpx>");
                    sawRoot = true;
                    continue;
                }
                if (xml.LocalName is "wpt" or "trkpt" or "rtept")
                    row = ReadPoint(xml, lineInfo.LineNumber);
            }
            catch (XmlException exception)
            {
                var line = exception.LineNumber > 0 ? exception.LineNumber : Math.Max(1, lineInfo.LineNumber);
                throw new FieldFileException(line, Describe(exception, line));
            }
            catch (System.Text.DecoderFallbackException)
            {
                throw new FieldFileException(lineInfo.LineNumber, TextDecoding.NotText(lineInfo.LineNumber));
            }
            if (row is not null)
                yield return row;
        }
        if (!sawRoot)
            throw new FieldFileException(lineInfo.LineNumber, "the file has no <gpx> element");
    }

    private static string Describe(XmlException exception, long line) =>
        exception.Message.Contains("DTD", StringComparison.OrdinalIgnoreCase)
            ? InvariantText.Format($"line {line}: DTDs and entity declarations are not accepted in GPX uploads")
            : InvariantText.Format($"line {line}: the GPX is not well-formed XML ({exception.Message.Split(" Line ")[0].TrimEnd('.')})");

    private static FieldRow ReadPoint(XmlReader xml, long line)
    {
        var element = xml.LocalName;
        var lat = Attribute(xml, "lat");
        var lon = Attribute(xml, "lon");
        FieldProblem? problem = null;
        double? Angle(string? text, string field)
        {
            if (text is null)
            {
                problem ??= new FieldProblem(field, $"<{element}> has no {field} attribute");
                return null;
            }
            if (FieldText.TryNumber(text, decimalComma: false, out var v))
                return v;
            problem ??= new FieldProblem(field, $"{field}=\"{CsvFieldReader.Shorten(text)}\" is not a decimal number of degrees");
            return null;
        }
        var latitude = Angle(lat, ContractFields.Lat);
        var longitude = Angle(lon, ContractFields.Lon);

        string? name = null, fix = null, featureClass = null, receiverName = null;
        double? ele = null, hdop = null, vdop = null, pdop = null, age = null;
        int? sat = null;
        DateTimeOffset? time = null;
        if (!xml.IsEmptyElement)
        {
            var depth = xml.Depth;
            while (xml.Read() && !(xml.NodeType == XmlNodeType.EndElement && xml.Depth == depth))
            {
                if (xml.NodeType != XmlNodeType.Element || xml.Depth != depth + 1)
                    continue;
                var child = xml.LocalName;
                if (child == "extensions")
                {
                    xml.Skip();
                    if (xml.NodeType == XmlNodeType.EndElement && xml.Depth == depth)
                        break;
                    continue;
                }
                var value = ShortText(xml, line);
                switch (child)
                {
                    case "name": name = value.Trim(); break;
                    // GPX 1.1 wptType: <type> "type (classification) of the waypoint" is the feature class; <src> "source of
                    // data ... e.g. 'Garmin eTrex'" is the receiver. GPX has no element for a crew (<desc> is free text).
                    case "type": featureClass = value.Trim(); break;
                    case "src": receiverName = value.Trim(); break;
                    case "fix": fix = value.Trim(); break;
                    case "ele": ele = Number(value, "ele", ContractFields.H, ref problem); break;
                    case "hdop": hdop = Number(value, "hdop", null, ref problem); break;
                    case "vdop": vdop = Number(value, "vdop", null, ref problem); break;
                    case "pdop": pdop = Number(value, "pdop", null, ref problem); break;
                    case "ageofdgpsdata": age = Number(value, "ageofdgpsdata", null, ref problem); break;
                    case "sat":
                        if (int.TryParse(value.Trim(), NumberStyles.None, CultureInfo.InvariantCulture, out var s)) sat = s;
                        else problem ??= new FieldProblem(null, $"<sat> \"{CsvFieldReader.Shorten(value)}\" is not a count of satellites");
                        break;
                    case "time":
                        if (FieldText.TryTime(value, out var t)) time = t;
                        else problem ??= new FieldProblem(ContractFields.Time, $"<time> \"{CsvFieldReader.Shorten(value)}\" is not an ISO 8601 time");
                        break;
                }
            }
        }
        if (problem is not null)
            return new FieldRow(line, null, null, problem);
        var receiver = fix is null && sat is null && hdop is null && vdop is null && pdop is null && age is null
            ? null
            : new ReceiverReport(Quality(fix), sat, pdop, hdop, vdop, CorrectionAgeSeconds: age, RawQualityCode: fix);
        return new FieldRow(line, new PointRecord(Id: string.IsNullOrEmpty(name) ? null : name, Lat: latitude, Lon: longitude, H: ele, Time: time,
            FeatureClass: string.IsNullOrEmpty(featureClass) ? null : featureClass, Receiver: string.IsNullOrEmpty(receiverName) ? null : receiverName), receiver);
    }

    /// <summary>GPX 1.1 <c>fixType</c>: none, 2d, 3d, dgps, pps.</summary>
    private static FixQuality? Quality(string? fix) => fix switch
    {
        "2d" or "3d" => FixQuality.Autonomous,
        "dgps" => FixQuality.Differential,
        "pps" => FixQuality.Autonomous,
        "none" => FixQuality.NotMeasured,
        _ => null,
    };

    private static double? Number(string text, string element, string? field, ref FieldProblem? problem)
    {
        if (FieldText.TryNumber(text, decimalComma: false, out var v))
            return v;
        problem ??= new FieldProblem(field, $"<{element}> \"{CsvFieldReader.Shorten(text)}\" is not a decimal number");
        return null;
    }

    private static string? Attribute(XmlReader xml, string name)
    {
        var value = xml.GetAttribute(name);
        return value is { Length: > ReadLimits.MaximumXmlValueCharacters } ? value[..ReadLimits.MaximumXmlValueCharacters] : value;
    }

    /// <summary>An element's text, read in chunks so a huge value is refused before it is held.</summary>
    private static string ShortText(XmlReader xml, long line)
    {
        if (xml.IsEmptyElement)
            return "";
        var chunk = new char[ReadLimits.MaximumXmlValueCharacters + 1];
        var text = new System.Text.StringBuilder();
        xml.Read();
        while (xml.NodeType is XmlNodeType.Text or XmlNodeType.CDATA or XmlNodeType.SignificantWhitespace)
        {
            int n;
            while ((n = xml.ReadValueChunk(chunk, 0, chunk.Length)) > 0)
            {
                text.Append(chunk, 0, n);
                if (text.Length > ReadLimits.MaximumXmlValueCharacters)
                    throw new FieldFileException(line, InvariantText.Format($"a value in the point on line {line} is longer than {ReadLimits.MaximumXmlValueCharacters} characters"));
            }
            xml.Read();
        }
        return text.ToString();
    }
}
