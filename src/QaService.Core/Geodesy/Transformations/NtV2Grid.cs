using System.Buffers.Binary;
using System.Text;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// An NTv2 horizontal grid shift file (<c>.gsb</c>; Natural Resources Canada, "NTv2 Developer's Guide", 1995:
/// overview header of 11 16-byte records, then per sub-grid an 11-record header and GS_COUNT nodes of four
/// float32: latitude shift, longitude shift (arc-seconds, longitude positive WEST), and their accuracies),
/// applied as EPSG method 9615 "NTv2" (EPSG Guidance Note 7-2 (IOGP 373-7-2) §4.4.3): the shift at a point is
/// interpolated bilinearly from the four surrounding nodes of the finest sub-grid that contains it.
/// </summary>
/// <remarks>
/// Units: angles in degrees outside, arc-seconds in the file (GS_TYPE "SECONDS"; other units are rejected).
/// Forward adds the shift (source → target datum); the reverse solves source = target − shift(source) by
/// fixed-point iteration as PROJ's <c>hgridshift</c> does (converges to 1e-12° in a few steps, the shift gradient
/// being tiny). Points outside every sub-grid give NaN. Either byte order is read (the header's NUM_OREC = 11 tells).
/// </remarks>
public sealed class NtV2Grid
{
    private const int RecordBytes = 16;
    private const int HeaderRecords = 11;
    private const double ArcSecondsPerDegree = 3600.0;
    private const int MaximumInverseIterations = 10;
    private const double InverseToleranceDegrees = 1e-12;
    private readonly List<SubGrid> _roots;

    private NtV2Grid(string name, List<SubGrid> roots)
    {
        Name = name;
        _roots = roots;
    }

    /// <summary>File or grid name, for operation descriptions.</summary>
    public string Name { get; }

    /// <summary>Reads a .gsb file; throws <see cref="InvalidDataException"/> when it is not NTv2.</summary>
    public static NtV2Grid Read(Stream stream, string name)
    {
        using var memory = new MemoryStream();
        stream.CopyTo(memory);
        var data = memory.ToArray();
        if (data.Length < RecordBytes * HeaderRecords)
            throw new InvalidDataException("file too short for an NTv2 header");
        var little = BinaryPrimitives.ReadInt32LittleEndian(data.AsSpan(8)) == HeaderRecords;
        if (!little && BinaryPrimitives.ReadInt32BigEndian(data.AsSpan(8)) != HeaderRecords)
            throw new InvalidDataException("not an NTv2 file: NUM_OREC is not 11");
        var reader = new Reader(data, little);
        var subGridCount = reader.Int(2 * RecordBytes); // NUM_FILE
        var units = reader.Text(3 * RecordBytes).Trim();
        if (!units.Equals("SECONDS", StringComparison.OrdinalIgnoreCase))
            throw new InvalidDataException($"NTv2 GS_TYPE \"{units}\" is not supported (only SECONDS)");

        var all = new List<SubGrid>();
        var offset = RecordBytes * HeaderRecords;
        for (var i = 0; i < subGridCount; i++)
        {
            var sub = new SubGrid(
                reader.Text(offset).Trim(), reader.Text(offset + RecordBytes).Trim(),
                reader.Double(offset + 4 * RecordBytes), reader.Double(offset + 5 * RecordBytes),
                reader.Double(offset + 6 * RecordBytes), reader.Double(offset + 7 * RecordBytes),
                reader.Double(offset + 8 * RecordBytes), reader.Double(offset + 9 * RecordBytes));
            var count = reader.Int(offset + 10 * RecordBytes);
            offset += HeaderRecords * RecordBytes;
            if (count != sub.Rows * sub.Columns || offset + (long)count * RecordBytes > data.Length)
                throw new InvalidDataException($"NTv2 sub-grid {sub.Name}: GS_COUNT {count} does not match its extent or the file length");
            sub.LatitudeShifts = new float[count];
            sub.WestLongitudeShifts = new float[count];
            for (var k = 0; k < count; k++, offset += RecordBytes)
            {
                sub.LatitudeShifts[k] = reader.Single(offset);
                sub.WestLongitudeShifts[k] = reader.Single(offset + 4);
            }
            all.Add(sub);
        }
        foreach (var sub in all)
        {
            var parent = all.FirstOrDefault(p => p.Name == sub.Parent && !ReferenceEquals(p, sub));
            parent?.Children.Add(sub);
        }
        return new NtV2Grid(name, all.Where(s => all.All(p => p.Name != s.Parent || ReferenceEquals(p, s))).ToList());
    }

    /// <summary>Shift in degrees (Δφ, Δλ east-positive) at a point of the source datum, or NaN outside the grid.</summary>
    public (double LatitudeShiftDegrees, double LongitudeShiftDegrees) ShiftAt(double latitudeDegrees, double longitudeDegrees)
    {
        var latSeconds = latitudeDegrees * ArcSecondsPerDegree;
        var westSeconds = -longitudeDegrees * ArcSecondsPerDegree;
        SubGrid? grid = null;
        var candidates = _roots;
        while (true)
        {
            var inside = candidates.FirstOrDefault(g => g.Contains(latSeconds, westSeconds));
            if (inside is null)
                break;
            grid = inside;
            candidates = inside.Children;
        }
        if (grid is null)
            return (double.NaN, double.NaN);
        var (dLat, dWest) = grid.Interpolate(latSeconds, westSeconds);
        return (dLat / ArcSecondsPerDegree, -dWest / ArcSecondsPerDegree);
    }

    /// <summary>Source → target: (φ + Δφ, λ + Δλ), degrees.</summary>
    public (double LatitudeDegrees, double LongitudeDegrees) Forward(double latitudeDegrees, double longitudeDegrees)
    {
        var (dLat, dLon) = ShiftAt(latitudeDegrees, longitudeDegrees);
        return (latitudeDegrees + dLat, longitudeDegrees + dLon);
    }

    /// <summary>Target → source by iteration (see remarks), degrees; NaN outside the grid.</summary>
    public (double LatitudeDegrees, double LongitudeDegrees) Reverse(double latitudeDegrees, double longitudeDegrees)
    {
        var (lat, lon) = (latitudeDegrees, longitudeDegrees);
        for (var i = 0; i < MaximumInverseIterations; i++)
        {
            var (dLat, dLon) = ShiftAt(lat, lon);
            if (double.IsNaN(dLat))
                return (double.NaN, double.NaN);
            var nextLat = latitudeDegrees - dLat;
            var nextLon = longitudeDegrees - dLon;
            var converged = Math.Abs(nextLat - lat) < InverseToleranceDegrees && Math.Abs(nextLon - lon) < InverseToleranceDegrees;
            (lat, lon) = (nextLat, nextLon);
            if (converged)
                break;
        }
        return (lat, lon);
    }

    /// <summary>One NTv2 sub-grid; extents in arc-seconds, longitude positive west; nodes from the south-east corner, west along each row.</summary>
    private sealed class SubGrid(string name, string parent, double south, double north, double east, double west, double latStep, double lonStep)
    {
        public string Name { get; } = name;
        public string Parent { get; } = parent;
        public List<SubGrid> Children { get; } = [];
        public int Rows { get; } = (int)Math.Round((north - south) / latStep) + 1;
        public int Columns { get; } = (int)Math.Round((west - east) / lonStep) + 1;
        public float[] LatitudeShifts { get; set; } = [];
        public float[] WestLongitudeShifts { get; set; } = [];

        public bool Contains(double latSeconds, double westSeconds) =>
            latSeconds >= south && latSeconds <= north && westSeconds >= east && westSeconds <= west;

        public (double DLat, double DWest) Interpolate(double latSeconds, double westSeconds)
        {
            var row = (latSeconds - south) / latStep;
            var column = (westSeconds - east) / lonStep;
            var r0 = Math.Min((int)row, Rows - 2);
            var c0 = Math.Min((int)column, Columns - 2);
            var fr = row - r0;
            var fc = column - c0;
            int i00 = r0 * Columns + c0, i01 = i00 + 1, i10 = i00 + Columns, i11 = i10 + 1;
            double w00 = (1 - fr) * (1 - fc), w01 = (1 - fr) * fc, w10 = fr * (1 - fc), w11 = fr * fc;
            return (
                w00 * LatitudeShifts[i00] + w01 * LatitudeShifts[i01] + w10 * LatitudeShifts[i10] + w11 * LatitudeShifts[i11],
                w00 * WestLongitudeShifts[i00] + w01 * WestLongitudeShifts[i01] + w10 * WestLongitudeShifts[i10] + w11 * WestLongitudeShifts[i11]);
        }
    }

    private readonly struct Reader(byte[] data, bool littleEndian)
    {
        public int Int(int offset) => littleEndian
            ? BinaryPrimitives.ReadInt32LittleEndian(data.AsSpan(offset + 8))
            : BinaryPrimitives.ReadInt32BigEndian(data.AsSpan(offset + 8));

        public double Double(int offset) => littleEndian
            ? BinaryPrimitives.ReadDoubleLittleEndian(data.AsSpan(offset + 8))
            : BinaryPrimitives.ReadDoubleBigEndian(data.AsSpan(offset + 8));

        public float Single(int offset) => littleEndian
            ? BinaryPrimitives.ReadSingleLittleEndian(data.AsSpan(offset))
            : BinaryPrimitives.ReadSingleBigEndian(data.AsSpan(offset));

        public string Text(int offset) => Encoding.ASCII.GetString(data, offset + 8, 8);
    }
}
