namespace QaService.Core.Geodesy.Catalog;

/// <summary>
/// The seven parameters of an OGC WKT1 <c>TOWGS84[dx,dy,dz,rx,ry,rz,ds]</c> clause, kept on the datum
/// so a datum transformation can use them. OGC 01-009 (Coordinate Transformation Services, §7.4.3
/// "TOWGS84") defines them as the Bursa–Wolf shift to WGS 84 in the position-vector convention
/// (EPSG method 9606, EPSG Guidance Note 7-2 "Helmert 7-parameter transformations"); PROJ reads them
/// the same way (<c>+towgs84</c>).
/// </summary>
/// <param name="TranslationXMetres">dx, metres.</param>
/// <param name="TranslationYMetres">dy, metres.</param>
/// <param name="TranslationZMetres">dz, metres.</param>
/// <param name="RotationXArcSeconds">rx, arc-seconds (position-vector sign).</param>
/// <param name="RotationYArcSeconds">ry, arc-seconds.</param>
/// <param name="RotationZArcSeconds">rz, arc-seconds.</param>
/// <param name="ScaleDifferencePpm">ds, parts per million.</param>
public sealed record HelmertToWgs84(
    double TranslationXMetres, double TranslationYMetres, double TranslationZMetres,
    double RotationXArcSeconds, double RotationYArcSeconds, double RotationZArcSeconds,
    double ScaleDifferencePpm)
{
    /// <summary>Sign convention of the rotations: always "position vector" for WKT1 TOWGS84 (EPSG method 9606).</summary>
    public const string Convention = "position vector";

    /// <summary>Where the parameters were read and the rotation convention they were written in, for the operation text.</summary>
    public string GivenAs { get; init; } = "WKT1 TOWGS84 (position vector rotations)";
}
