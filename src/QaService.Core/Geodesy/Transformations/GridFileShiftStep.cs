using System.Globalization;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// An EPSG NTv2 transformation (method 9615, GN 7-2 §4.4.3) whose grid is read from PROJ's data folder on first use;
/// forward or reversed. When the file shifts the other way (proj.db inverse_direction), forward uses the grid's reverse.
/// </summary>
public sealed class GridFileShiftStep(GridTransformationDefinition definition, bool reversed) : IOperationStep
{
    public GridTransformationDefinition Definition => definition;

    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"{(reversed ? "inverse of " : "")}EPSG:{definition.EpsgCode} \"{definition.Name}\" (NTv2 grid {definition.FileName} from Debian {definition.Package}, bilinear interpolation, EPSG method 9615); accuracy {definition.AccuracyMetres:0.###} m (EPSG); area: {definition.Area.Name}");

    public double AccuracyMetres => definition.AccuracyMetres;

    public void Apply(CoordinateBuffer points)
    {
        var grid = GridFiles.Load(definition.FileName);
        var useReverse = reversed != definition.FileIsInverse;
        for (var i = 0; i < points.Count; i++)
        {
            var (lat, lon) = useReverse ? grid.Reverse(points.First[i], points.Second[i]) : grid.Forward(points.First[i], points.Second[i]);
            points.First[i] = lat;
            points.Second[i] = lon;
        }
    }
}
