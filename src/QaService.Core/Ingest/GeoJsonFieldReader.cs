using System.Text.Json;
using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>Which point fields the positions of a coordinate array fill (by the CRS kind of the options).</summary>
public enum PositionAxes
{
    /// <summary>[lon, lat, h] (RFC 7946 §3.1.1 order).</summary>
    LonLatH,
    /// <summary>[e, n, h].</summary>
    EastNorthH,
    /// <summary>[x, y, z].</summary>
    Xyz,
}

/// <summary>
/// Reads GeoJSON (RFC 7946) as a stream: a FeatureCollection's features are taken one at a time from a
/// bounded buffer, never the whole document. Each feature must be a Point (§3.1.2) with a position
/// [lon, lat] or [lon, lat, h] (§3.1.1; h in metres above the WGS 84 ellipsoid per §4); properties
/// <c>id</c>, <c>mark</c>, <c>time</c>, <c>sigmaH</c>, <c>sigmaV</c> are read, the feature's own
/// <c>id</c> (§3.2) when properties have none. Rows are feature indexes (0-based).
/// </summary>
public sealed class GeoJsonFieldReader(PositionAxes axes)
{
    private const int InitialBufferBytes = 65_536;

    public IEnumerable<FieldRow> Read(Stream stream)
    {
        var buffer = new byte[InitialBufferBytes];
        var filled = 0;
        var final = false;
        var state = new JsonReaderState(new JsonReaderOptions { CommentHandling = JsonCommentHandling.Disallow, MaxDepth = 16 });
        var stage = Stage.Start;
        long featureIndex = 0;
        var sawFeatures = false;

        while (true)
        {
            if (!final && filled < buffer.Length)
            {
                var read = stream.Read(buffer, filled, buffer.Length - filled);
                if (read == 0)
                    final = true;
                filled += read;
            }
            var (rows, consumed, newState, newStage, done, sawNow) = Scan(buffer.AsSpan(0, filled), final, state, stage, ref featureIndex);
            sawFeatures |= sawNow;
            foreach (var row in rows)
                yield return row;
            if (done)
                break;
            state = newState;
            stage = newStage;
            if (consumed == 0 && filled == buffer.Length)
            {
                if (buffer.Length >= ReadLimits.MaximumGeoJsonFeatureBytes)
                    throw new FieldFileException(featureIndex, InvariantText.Format($"feature {featureIndex} is larger than {ReadLimits.MaximumGeoJsonFeatureBytes} bytes: only Point features are read"));
                Array.Resize(ref buffer, buffer.Length * 2);
            }
            Buffer.BlockCopy(buffer, consumed, buffer, 0, filled - consumed);
            filled -= consumed;
            if (final && consumed == 0)
                throw new FieldFileException(featureIndex, "the GeoJSON ends before it is complete (truncated file?)");
        }
        if (!sawFeatures)
            throw new FieldFileException(0, "the GeoJSON has no \"features\" array: send a FeatureCollection (RFC 7946 §3.3)");
    }

    private enum Stage { Start, TopLevel, InFeatures, AfterFeatures }

    private (List<FieldRow> Rows, int Consumed, JsonReaderState State, Stage Stage, bool Done, bool SawFeatures) Scan(
        ReadOnlySpan<byte> data, bool final, JsonReaderState state, Stage stage, ref long featureIndex)
    {
        var rows = new List<FieldRow>();
        var reader = new Utf8JsonReader(data, final, state);
        var sawFeatures = false;
        try
        {
            while (true)
            {
                var before = reader.CurrentState;
                var consumedBefore = (int)reader.BytesConsumed;
                if (!reader.Read())
                    return (rows, consumedBefore, before, stage, false, sawFeatures);
                switch (stage)
                {
                    case Stage.Start:
                        if (reader.TokenType != JsonTokenType.StartObject)
                            throw new FieldFileException(0, "a GeoJSON file is one JSON object (a FeatureCollection)");
                        stage = Stage.TopLevel;
                        break;
                    case Stage.TopLevel or Stage.AfterFeatures:
                        if (reader.TokenType == JsonTokenType.EndObject)
                            return (rows, (int)reader.BytesConsumed, reader.CurrentState, stage, true, sawFeatures);
                        var isFeatures = reader.ValueTextEquals("features"u8);
                        if (isFeatures && stage == Stage.TopLevel)
                        {
                            if (!reader.Read())
                                return (rows, consumedBefore, before, stage, false, sawFeatures);
                            if (reader.TokenType != JsonTokenType.StartArray)
                                throw new FieldFileException(0, "\"features\" must be an array (RFC 7946 §3.3)");
                            stage = Stage.InFeatures;
                            sawFeatures = true;
                        }
                        else if (!reader.Read() || !reader.TrySkip())
                            return (rows, consumedBefore, before, stage, false, sawFeatures);
                        break;
                    case Stage.InFeatures:
                        if (reader.TokenType == JsonTokenType.EndArray)
                        {
                            stage = Stage.AfterFeatures;
                            break;
                        }
                        var start = (int)reader.TokenStartIndex;
                        if (reader.TokenType != JsonTokenType.StartObject)
                        {
                            if (!reader.TrySkip())
                                return (rows, consumedBefore, before, stage, false, sawFeatures);
                            rows.Add(FieldRow.Bad(featureIndex++, null, "a feature must be a JSON object"));
                            break;
                        }
                        if (!reader.TrySkip())
                            return (rows, consumedBefore, before, stage, false, sawFeatures);
                        rows.Add(ReadFeature(featureIndex++, data[start..(int)reader.BytesConsumed]));
                        break;
                }
            }
        }
        catch (JsonException exception)
        {
            throw new FieldFileException(featureIndex, InvariantText.Format($"the GeoJSON is not valid JSON near feature {featureIndex} (line {exception.LineNumber + 1} of the current block): {exception.Message.Split(". ")[0]}"));
        }
    }

    private FieldRow ReadFeature(long index, ReadOnlySpan<byte> json)
    {
        using var document = JsonDocument.Parse(json.ToArray());
        var feature = document.RootElement;
        if (!feature.TryGetProperty("type", out var type) || type.ValueKind != JsonValueKind.String || type.GetString() != "Feature")
            return FieldRow.Bad(index, null, "each member of \"features\" must have \"type\": \"Feature\" (RFC 7946 §3.2)");
        if (!feature.TryGetProperty("geometry", out var geometry) || geometry.ValueKind != JsonValueKind.Object)
            return FieldRow.Bad(index, null, "the feature has no geometry: a fix or mark needs a Point");
        if (!geometry.TryGetProperty("type", out var geometryType) || geometryType.ValueKind != JsonValueKind.String || geometryType.GetString() != "Point")
            return FieldRow.Bad(index, null, $"the geometry is {(geometryType.ValueKind == JsonValueKind.String ? geometryType.GetString() : "untyped")}, not a Point: only Point features are read");
        if (!geometry.TryGetProperty("coordinates", out var coordinates) || coordinates.ValueKind != JsonValueKind.Array)
            return FieldRow.Bad(index, null, "the Point has no \"coordinates\" array");
        var position = new List<double>(3);
        foreach (var value in coordinates.EnumerateArray())
        {
            if (value.ValueKind != JsonValueKind.Number || !value.TryGetDouble(out var number) || !double.IsFinite(number))
                return FieldRow.Bad(index, null, "every coordinate must be a finite number");
            position.Add(number);
        }
        if (position.Count is < 2 or > 3)
            return FieldRow.Bad(index, null, InvariantText.Format($"a position has 2 or 3 numbers (RFC 7946 §3.1.1); this one has {position.Count}"));

        var properties = feature.TryGetProperty("properties", out var p) && p.ValueKind == JsonValueKind.Object ? p : default;
        var id = Text(properties, "id") ?? (feature.TryGetProperty("id", out var fid) ? Scalar(fid) : null);
        var mark = Text(properties, "mark");
        DateTimeOffset? time = null;
        if (Text(properties, "time") is { } timeText)
        {
            if (!FieldText.TryTime(timeText, out var parsed))
                return FieldRow.Bad(index, ContractFields.Time, $"properties.time \"{CsvFieldReader.Shorten(timeText)}\" is not an ISO 8601 time");
            time = parsed;
        }
        var sigmaH = Number(properties, "sigmaH");
        var sigmaV = Number(properties, "sigmaV");
        if (sigmaH is { Problem: { } sp } || sigmaV is { Problem: { } })
            return FieldRow.Bad(index, sigmaH.Problem is not null ? ContractFields.SigmaH : ContractFields.SigmaV, sigmaH.Problem ?? sigmaV.Problem!);
        var hdop = Number(properties, ContractFields.Hdop);
        if (hdop.Problem is not null)
            return FieldRow.Bad(index, ContractFields.Hdop, $"properties.hdop must be a number (a dilution of precision)");

        double? third = position.Count == 3 ? position[2] : null;
        var point = axes switch
        {
            PositionAxes.LonLatH => new PointRecord(Id: id, Mark: mark, Lon: position[0], Lat: position[1], H: third),
            PositionAxes.EastNorthH => new PointRecord(Id: id, Mark: mark, E: position[0], N: position[1], H: third),
            _ => new PointRecord(Id: id, Mark: mark, X: position[0], Y: position[1], Z: third),
        };
        return new FieldRow(index, point with
        {
            Time = time, SigmaH = sigmaH.Value, SigmaV = sigmaV.Value, Hdop = hdop.Value,
            FeatureClass = Text(properties, ContractFields.FeatureClass), Crew = Text(properties, ContractFields.Crew),
            Receiver = Text(properties, ContractFields.Receiver), Quality = Text(properties, ContractFields.Quality),
        });
    }

    private static string? Text(JsonElement properties, string name) =>
        properties.ValueKind == JsonValueKind.Object && properties.TryGetProperty(name, out var value) ? Scalar(value) : null;

    private static string? Scalar(JsonElement value) => value.ValueKind switch
    {
        JsonValueKind.String => value.GetString() is { Length: > 0 } s ? s : null,
        JsonValueKind.Number => value.GetRawText(),
        _ => null,
    };

    private static (double? Value, string? Problem) Number(JsonElement properties, string name)
    {
        if (properties.ValueKind != JsonValueKind.Object || !properties.TryGetProperty(name, out var value) || value.ValueKind == JsonValueKind.Null)
            return (null, null);
        return value.ValueKind == JsonValueKind.Number && value.TryGetDouble(out var d) && double.IsFinite(d)
            ? (d, null)
            : (null, $"properties.{name} must be a number (metres)");
    }
}
