using System.Buffers.Binary;
using System.IO.Compression;

namespace QaService.Core.Geodesy.Vertical;

/// <summary>
/// The EGM96 geoid (NGA/NASA Earth Gravitational Model 1996; Lemoine et al. 1998, NASA/TP-1998-206861)
/// as the 15′ undulation grid NGA publishes (public domain) and PROJ ships as <c>egm96_15.gtx</c>, referred to
/// WGS 84. Shipped in this assembly (egm96-15.grid.gz, made by tools/geodesy/make-egm96-grid.py from PROJ's file,
/// undulations rounded to 1 mm) so the service needs no proj-data. Loaded once, on first use.
/// </summary>
/// <remarks>
/// Grid: 721 rows × 1440 columns, 90°S…90°N, 180°W…179.75°E, wrapping in longitude. Interpolation bilinear
/// (<see cref="GeoidGrid"/>). Measured against PROJ 9.1.1 <c>vgridshift</c> on the same grid: see the tests
/// (agreement to the 1 mm storage rounding). EGM96's own accuracy: about ±0.5–1 m globally (NGA).
/// </remarks>
public static class Egm96
{
    private const string ResourceName = "QaService.Core.Geodesy.Vertical.egm96-15.grid.gz";
    private const double MetresPerMillimetre = 1e-3;
    private static readonly byte[] Magic = "EGM96Q1\0"u8.ToArray();
    private static readonly Lazy<GeoidGrid> Loaded = new(Load);

    /// <summary>The EGM96 15′ grid.</summary>
    public static GeoidGrid Grid => Loaded.Value;

    private static GeoidGrid Load()
    {
        using var resource = typeof(Egm96).Assembly.GetManifestResourceStream(ResourceName)
                             ?? throw new InvalidOperationException($"embedded resource {ResourceName} is missing from the build");
        using var gzip = new GZipStream(resource, CompressionMode.Decompress);
        using var buffer = new MemoryStream();
        gzip.CopyTo(buffer);
        var data = buffer.GetBuffer().AsSpan(0, (int)buffer.Length);
        if (!data[..8].SequenceEqual(Magic))
            throw new InvalidDataException("EGM96 resource has an unknown layout");
        var rows = BinaryPrimitives.ReadInt32LittleEndian(data[8..]);
        var columns = BinaryPrimitives.ReadInt32LittleEndian(data[12..]);
        var south = BinaryPrimitives.ReadDoubleLittleEndian(data[16..]);
        var west = BinaryPrimitives.ReadDoubleLittleEndian(data[24..]);
        var dLat = BinaryPrimitives.ReadDoubleLittleEndian(data[32..]);
        var dLon = BinaryPrimitives.ReadDoubleLittleEndian(data[40..]);
        var values = new float[rows * columns];
        var position = 48;
        for (var r = 0; r < rows; r++)
        {
            long millimetres = 0;
            for (var c = 0; c < columns; c++)
            {
                ulong zigzag = 0;
                var shift = 0;
                byte b;
                do
                {
                    b = data[position++];
                    zigzag |= (ulong)(b & 0x7F) << shift;
                    shift += 7;
                } while ((b & 0x80) != 0);
                millimetres += (long)(zigzag >> 1) ^ -(long)(zigzag & 1);
                values[r * columns + c] = (float)(millimetres * MetresPerMillimetre);
            }
        }
        return new GeoidGrid("EGM96 15′", south, west, dLat, dLon, rows, columns, values);
    }
}
