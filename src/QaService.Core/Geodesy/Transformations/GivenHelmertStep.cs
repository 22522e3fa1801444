using System.Globalization;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// The Helmert shift to WGS 84 that came with a CRS (WKT1 <c>TOWGS84</c>, WKT2 <c>BOUNDCRS</c>), applied on geocentric
/// coordinates from the datum to the WGS 84 hub or back: X' = T + M·R·X with the small-angle matrix of EPSG Guidance
/// Note 7-2 §4.3.3 (method 1033, position vector), as PROJ 9.1.1 applies <c>+towgs84</c> (<c>+proj=helmert
/// +convention=position_vector</c>, no <c>+exact</c>); the reverse is PROJ's (transposed rotation, see
/// <see cref="HelmertMatrix"/>). Units: metres, arc-seconds, ppm. Nobody states how accurate such parameters are,
/// so the step's accuracy is unknown (<see cref="IOperationStep.AccuracyUnknown"/>), never a guessed number.
/// </summary>
public sealed class GivenHelmertStep(GeodeticDatum datum, HelmertToWgs84 shift, bool toWgs84) : IOperationStep
{
    private readonly HelmertMatrix _matrix = new(HelmertConvention.PositionVector, shift.TranslationXMetres, shift.TranslationYMetres,
        shift.TranslationZMetres, shift.RotationXArcSeconds, shift.RotationYArcSeconds, shift.RotationZArcSeconds, shift.ScaleDifferencePpm);

    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"{(toWgs84 ? "" : "inverse of ")}the shift given with the CRS, {datum.Name} → WGS 84 ({shift.GivenAs}; 7-parameter Helmert, EPSG method 1033: tx {shift.TranslationXMetres:0.#####} m, ty {shift.TranslationYMetres:0.#####} m, tz {shift.TranslationZMetres:0.#####} m, rx {shift.RotationXArcSeconds:0.########}″, ry {shift.RotationYArcSeconds:0.########}″, rz {shift.RotationZArcSeconds:0.########}″, ds {shift.ScaleDifferencePpm:0.#####} ppm, position vector); accuracy as given, unknown");

    /// <summary>Not stated; 0 so a route's sum counts only the stated steps (<see cref="AccuracyUnknown"/> marks it).</summary>
    public double AccuracyMetres => 0;

    public bool AccuracyUnknown => true;

    public void Apply(CoordinateBuffer points)
    {
        for (var i = 0; i < points.Count; i++)
        {
            ref var x = ref points.First[i];
            ref var y = ref points.Second[i];
            ref var z = ref points.Third[i];
            if (toWgs84)
                _matrix.Forward(ref x, ref y, ref z);
            else
                _matrix.Reverse(ref x, ref y, ref z);
        }
    }
}
