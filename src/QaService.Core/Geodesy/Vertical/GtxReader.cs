using System.Buffers.Binary;

namespace QaService.Core.Geodesy.Vertical;

/// <summary>
/// Reads a geoid grid in NOAA/NGS VDatum GTX format, the format PROJ's <c>vgridshift</c> reads
/// (PROJ documentation, "Grid formats: GTX"): a 40-byte big-endian header — south latitude, west longitude,
/// latitude step, longitude step (float64, degrees), rows, columns (int32) — then rows × columns float32
/// undulations in metres, big-endian, row by row from the south-west; −88.8888 marks a missing node.
/// </summary>
public static class GtxReader
{
    private const int HeaderBytes = 40;

    /// <summary>Largest grid accepted, nodes (a 1′ global grid has 9.3 million): guards memory against a corrupt header.</summary>
    public const long MaximumNodes = 100_000_000;

    /// <summary>Reads a GTX stream; throws <see cref="InvalidDataException"/> with a reason when it is not a GTX grid.</summary>
    public static GeoidGrid Read(Stream stream, string name)
    {
        Span<byte> header = stackalloc byte[HeaderBytes];
        stream.ReadExactly(header);
        var south = BinaryPrimitives.ReadDoubleBigEndian(header[0..]);
        var west = BinaryPrimitives.ReadDoubleBigEndian(header[8..]);
        var dLat = BinaryPrimitives.ReadDoubleBigEndian(header[16..]);
        var dLon = BinaryPrimitives.ReadDoubleBigEndian(header[24..]);
        var rows = BinaryPrimitives.ReadInt32BigEndian(header[32..]);
        var columns = BinaryPrimitives.ReadInt32BigEndian(header[36..]);
        if (!(dLat > 0 && dLon > 0 && south >= -90 && south <= 90 && double.IsFinite(west)) || rows < 2 || columns < 2 || (long)rows * columns > MaximumNodes)
            throw new InvalidDataException($"not a GTX grid: header gives {rows} × {columns} nodes, steps {dLat}° × {dLon}° from {south}°, {west}°");
        if (west >= 180)
            west -= 360; // some GTX files give the west edge in 0..360

        var values = new float[rows * columns];
        var bytes = new byte[4 * columns];
        for (var r = 0; r < rows; r++)
        {
            try
            {
                stream.ReadExactly(bytes);
            }
            catch (EndOfStreamException)
            {
                throw new InvalidDataException($"GTX grid ends after {r} of {rows} rows");
            }
            for (var c = 0; c < columns; c++)
                values[r * columns + c] = BinaryPrimitives.ReadSingleBigEndian(bytes.AsSpan(4 * c));
        }
        return new GeoidGrid(name, south, west, dLat, dLon, rows, columns, values);
    }
}
