namespace QaService.Core.Assessment;

/// <summary>
/// The fields of one request point as a value, the shape validation reads: a <see cref="PointRecord"/> copied,
/// or a row of a file upload's column store read in place (a large upload then makes no object per point).
/// Fields and units as in <see cref="PointRecord"/>.
/// </summary>
public readonly record struct PointValues(
    string? Id,
    string? Mark,
    double? Lat,
    double? Lon,
    double? E,
    double? N,
    double? X,
    double? Y,
    double? Z,
    double? H,
    double? SigmaH,
    double? SigmaV,
    DateTimeOffset? Time,
    string? FeatureClass = null,
    string? Crew = null,
    string? Receiver = null,
    double? Hdop = null,
    string? Quality = null)
{
    public static PointValues Of(PointRecord point) => new(point.Id, point.Mark, point.Lat, point.Lon, point.E, point.N,
        point.X, point.Y, point.Z, point.H, point.SigmaH, point.SigmaV, point.Time, point.FeatureClass, point.Crew, point.Receiver,
        point.Hdop, point.Quality);
}

/// <summary>A point list that hands out its points as <see cref="PointValues"/> without making a record for each.</summary>
public interface IPointValueList : IReadOnlyList<PointRecord?>
{
    /// <summary>The point at <paramref name="index"/>; false when that entry is null.</summary>
    bool TryGetValues(int index, out PointValues point);
}
