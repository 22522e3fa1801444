namespace QaService.Core.Geodesy.Catalog;

/// <summary>
/// Where a CRS is meant to be used (EPSG "extent"): a latitude/longitude box in degrees and its name.
/// A box with <see cref="WestDegrees"/> &gt; <see cref="EastDegrees"/> crosses the antimeridian.
/// </summary>
/// <param name="Name">EPSG extent name, e.g. "Europe - ETRF extended".</param>
/// <param name="SouthDegrees">Southern bound, degrees, [−90, 90].</param>
/// <param name="NorthDegrees">Northern bound, degrees.</param>
/// <param name="WestDegrees">Western bound, degrees, [−180, 180].</param>
/// <param name="EastDegrees">Eastern bound, degrees.</param>
public sealed record AreaOfUse(string Name, double SouthDegrees, double NorthDegrees, double WestDegrees, double EastDegrees)
{
    /// <summary>
    /// How far a point lies outside the box, degrees of arc measured separately in latitude and in
    /// longitude (the larger of the two; longitude scaled by cos φ so it is comparable): 0 inside.
    /// </summary>
    /// <param name="latitudeDegrees">Latitude, degrees.</param>
    /// <param name="longitudeDegrees">Longitude, degrees (any; reduced to [−180, 180]).</param>
    public double DegreesOutside(double latitudeDegrees, double longitudeDegrees)
    {
        double dLat = latitudeDegrees < SouthDegrees ? SouthDegrees - latitudeDegrees
            : latitudeDegrees > NorthDegrees ? latitudeDegrees - NorthDegrees : 0;
        double lon = Math.IEEERemainder(longitudeDegrees, AngleMath.FullTurnDegrees);
        double width = Math.IEEERemainder(EastDegrees - WestDegrees, AngleMath.FullTurnDegrees);
        if (width <= 0)
            width += AngleMath.FullTurnDegrees;
        double fromWest = lon - WestDegrees;
        fromWest -= AngleMath.FullTurnDegrees * Math.Floor(fromWest / AngleMath.FullTurnDegrees); // [0, 360)
        double dLon = fromWest <= width ? 0 : Math.Min(fromWest - width, AngleMath.FullTurnDegrees - fromWest);
        double cosLat = Math.Cos(Math.Clamp(latitudeDegrees, -AngleMath.QuarterTurnDegrees, AngleMath.QuarterTurnDegrees) * AngleMath.RadiansPerDegree);
        return Math.Max(dLat, dLon * cosLat);
    }
}
