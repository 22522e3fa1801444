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
        double lon = AngleMath.ReduceToHalfTurn(longitudeDegrees);
        double width = AngleMath.ReduceToHalfTurn(EastDegrees - WestDegrees);
        if (width <= 0)
            width += AngleMath.FullTurnDegrees;
        double fromWest = lon - WestDegrees;
        fromWest -= AngleMath.FullTurnDegrees * Math.Floor(fromWest / AngleMath.FullTurnDegrees); // [0, 360)
        double dLon = fromWest <= width ? 0 : Math.Min(fromWest - width, AngleMath.FullTurnDegrees - fromWest);
        if (dLon == 0 && !double.IsNaN(latitudeDegrees))
            return dLat; // inside in longitude (every point of a batch that belongs there): no cosine needed
        double cosLat = Math.Cos(Math.Clamp(latitudeDegrees, -AngleMath.QuarterTurnDegrees, AngleMath.QuarterTurnDegrees) * AngleMath.RadiansPerDegree);
        return Math.Max(dLat, dLon * cosLat);
    }

    /// <summary>The smallest box holding every point (longitudes as given; a set across the antimeridian gets the wide box).</summary>
    public static AreaOfUse? Around(ReadOnlySpan<double> latitudesDegrees, ReadOnlySpan<double> longitudesDegrees, string name = "the points")
    {
        double s = double.PositiveInfinity, n = double.NegativeInfinity, w = double.PositiveInfinity, e = double.NegativeInfinity;
        for (var i = 0; i < latitudesDegrees.Length; i++)
        {
            if (!double.IsFinite(latitudesDegrees[i]) || !double.IsFinite(longitudesDegrees[i]))
                continue;
            s = Math.Min(s, latitudesDegrees[i]);
            n = Math.Max(n, latitudesDegrees[i]);
            w = Math.Min(w, longitudesDegrees[i]);
            e = Math.Max(e, longitudesDegrees[i]);
        }
        return double.IsFinite(s) ? new AreaOfUse(name, s, n, w, e) : null;
    }

    /// <summary>True when <paramref name="box"/> lies wholly inside this area (antimeridian-crossing areas handled).</summary>
    public bool Contains(AreaOfUse box) =>
        box.SouthDegrees >= SouthDegrees && box.NorthDegrees <= NorthDegrees &&
        Shifts(box).Any(b => b.West >= Span.West && b.East <= Span.East);

    /// <summary>True when <paramref name="box"/> and this area overlap.</summary>
    public bool Intersects(AreaOfUse box) =>
        box.SouthDegrees <= NorthDegrees && box.NorthDegrees >= SouthDegrees &&
        Shifts(box).Any(b => b.West <= Span.East && b.East >= Span.West);

    /// <summary>West/east as an increasing interval (east + 360 when the area crosses the antimeridian).</summary>
    private (double West, double East) Span => EastDegrees >= WestDegrees ? (WestDegrees, EastDegrees) : (WestDegrees, EastDegrees + AngleMath.FullTurnDegrees);

    private static IEnumerable<(double West, double East)> Shifts(AreaOfUse box)
    {
        var (w, e) = box.Span;
        yield return (w, e);
        yield return (w + AngleMath.FullTurnDegrees, e + AngleMath.FullTurnDegrees);
        yield return (w - AngleMath.FullTurnDegrees, e - AngleMath.FullTurnDegrees);
    }
}
