using System.Globalization;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// A datum change by an EPSG Helmert transformation on geocentric coordinates, forward or reversed
/// (<see cref="HelmertMatrix"/>); for a time-dependent one, evaluated at each point's observation epoch
/// (GN 7-2 §4.3.5), or at the reference epoch when a point has none (as PROJ does without a time coordinate).
/// </summary>
public sealed class HelmertStep(DatumTransformationDefinition definition, bool reversed) : IOperationStep
{
    public DatumTransformationDefinition Definition => definition;

    public bool Reversed => reversed;

    public bool UsesEpoch => definition.Parameters.IsTimeDependent;

    public double AccuracyMetres => definition.AccuracyMetres;

    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"{(reversed ? "inverse of " : "")}EPSG:{definition.EpsgCode} \"{definition.Name}\" ({(definition.Parameters.IsTimeDependent ? "time-dependent 14-parameter" : "7-parameter")} Helmert, EPSG method {definition.MethodCode}: {definition.Parameters.Describe()}); accuracy {definition.AccuracyMetres:0.###} m (EPSG){(definition.Area is { } area ? "; area: " + area.Name : "")}");

    public void Apply(CoordinateBuffer points)
    {
        var parameters = definition.Parameters;
        var epochs = parameters.IsTimeDependent ? points.EpochYears : null;
        var lastEpoch = double.NaN;
        var matrix = parameters.AtEpoch(null);
        for (var i = 0; i < points.Count; i++)
        {
            if (epochs is not null && !epochs[i].Equals(lastEpoch))
            {
                lastEpoch = epochs[i];
                matrix = parameters.AtEpoch(double.IsNaN(lastEpoch) ? null : lastEpoch);
            }
            ref var x = ref points.First[i];
            ref var y = ref points.Second[i];
            ref var z = ref points.Third[i];
            if (reversed)
                matrix.Reverse(ref x, ref y, ref z);
            else
                matrix.Forward(ref x, ref y, ref z);
        }
    }
}

/// <summary>
/// Two frames the service treats as the same within a stated accuracy (no change to coordinates), e.g. the
/// WGS 84 ensemble taken as ITRF2014 (EPSG gives the ensemble's accuracy as 2 m).
/// </summary>
public sealed class FrameEquivalenceStep(FrameEquivalence equivalence) : IOperationStep
{
    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"{equivalence.FromName} taken as {equivalence.ToName} (no coordinate change; {equivalence.Reason}); accuracy {equivalence.AccuracyMetres:0.###} m");

    public double AccuracyMetres => equivalence.AccuracyMetres;

    public void Apply(CoordinateBuffer points)
    {
    }
}

/// <summary>An NTv2 grid shift on geographic coordinates (EPSG method 9615), forward or reversed.</summary>
public sealed class GridShiftStep(NtV2Grid grid, bool reversed, double accuracyMetres, string? source = null) : IOperationStep
{
    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"{(reversed ? "inverse " : "")}NTv2 grid shift {grid.Name}{(source is null ? "" : $" ({source})")}, bilinear interpolation; accuracy {accuracyMetres:0.###} m");

    public double AccuracyMetres => accuracyMetres;

    public void Apply(CoordinateBuffer points)
    {
        for (var i = 0; i < points.Count; i++)
        {
            var (lat, lon) = reversed ? grid.Reverse(points.First[i], points.Second[i]) : grid.Forward(points.First[i], points.Second[i]);
            points.First[i] = lat;
            points.Second[i] = lon;
        }
    }
}
