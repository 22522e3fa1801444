using QaService.Core.Geodesy.Vertical;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// Orthometric ↔ ellipsoidal height with a geoid grid: h = H + N(φ, λ) (EPSG GN 7-2 §4.4.4, as PROJ's
/// <c>vgridshift</c>). N is taken at the point's latitude/longitude in whatever frame it is in at this step:
/// frame differences of a few metres move N by well under a millimetre (geoid slopes are below 1e-4).
/// </summary>
public sealed class GeoidHeightStep(GeoidGrid geoid, bool toEllipsoidal, double accuracyMetres) : IOperationStep
{
    public string Description => toEllipsoidal
        ? $"orthometric height H to ellipsoidal h = H + N with the {geoid.Name} geoid (bilinear)"
        : $"ellipsoidal height h to orthometric H = h − N with the {geoid.Name} geoid (bilinear)";

    public double AccuracyMetres => accuracyMetres;

    public void Apply(CoordinateBuffer points)
    {
        var sign = toEllipsoidal ? 1.0 : -1.0;
        for (var i = 0; i < points.Count; i++)
            points.Third[i] += sign * geoid.UndulationMetres(points.First[i], points.Second[i]);
    }
}
