namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// A projection whose grid values count westwards and/or southwards from the false origin: EPSG methods 9808
/// "Transverse Mercator (South Orientated)" (W = FE − E′, S = FN − N′) and 9826 "Lambert Conic Conformal (West
/// Orientated)" (W = FE − E′, N = FN + N′), EPSG Guidance Note 7-2 (IOGP 373-7-2, 2019), sections of those names,
/// where E′, N′ are the offsets of the north-and-east method from its origin. Units and domain are the inner
/// method's; values are (westing or easting, southing or northing) in metres, in that order (PROJ's
/// <c>+axis=wsu</c> / <c>+axis=wnu</c>).
/// </summary>
public sealed class OrientedAxes(string methodName, IMapProjection innerWithoutFalseOrigin, bool westing, bool southing,
    double falseEastingMetres, double falseNorthingMetres) : IMapProjection
{
    private readonly double _signX = westing ? -1 : 1, _signY = southing ? -1 : 1;

    /// <inheritdoc />
    public string MethodName => methodName;

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        var p = innerWithoutFalseOrigin.Forward(latitudeDegrees, longitudeDegrees);
        return new ProjectedCoordinate(falseEastingMetres + (_signX * p.EastingMetres), falseNorthingMetres + (_signY * p.NorthingMetres));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres) =>
        innerWithoutFalseOrigin.Inverse(_signX * (eastingMetres - falseEastingMetres), _signY * (northingMetres - falseNorthingMetres));
}
