namespace QaService.Core.Geodesy.Catalog;

/// <summary>
/// A geodetic reference frame (EPSG "datum"): what coordinates of a CRS are measured against.
/// Two CRSs with the same <see cref="Code"/> need no datum transformation between them.
/// </summary>
/// <param name="Code">EPSG datum code, e.g. <c>EPSG:6326</c> (WGS 84 ensemble), <c>EPSG:1165</c> (ITRF2014);
/// for a datum read from WKT without an EPSG identifier, <c>WKT:</c> and its name.</param>
/// <param name="Name">Name as the EPSG dataset gives it.</param>
/// <param name="Ellipsoid">The datum's ellipsoid.</param>
/// <param name="FrameReferenceEpochYear">Reference epoch of a dynamic frame, decimal year; null for static frames.</param>
public sealed record GeodeticDatum(string Code, string Name, Ellipsoid Ellipsoid, double? FrameReferenceEpochYear = null)
{
    /// <summary>EPSG:6326, World Geodetic System 1984 ensemble (accuracy of the ensemble about 2 m, EPSG dataset).</summary>
    public static GeodeticDatum Wgs84Ensemble { get; } = new("EPSG:6326", "World Geodetic System 1984 ensemble", Ellipsoid.Wgs84) { EnsembleAccuracyMetres = 2.0 };

    /// <summary>Accuracy of a datum ensemble as the EPSG dataset states it, metres; null for a single frame.</summary>
    public double? EnsembleAccuracyMetres { get; init; }

    /// <summary>A WKT1 TOWGS84 clause given with the CRS (position-vector convention); null otherwise.</summary>
    public HelmertToWgs84? HelmertToWgs84 { get; init; }
}
