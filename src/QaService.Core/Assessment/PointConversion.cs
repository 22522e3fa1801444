using System.Globalization;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Assessment;

/// <summary>
/// Brings one request point into geodetic coordinates on its CRS's ellipsoid, checking that its
/// fields fit the CRS kind (api-v1 "Coordinates") and that the values are physically plausible.
/// </summary>
internal static class PointConversion
{
    /// <summary>Lowest ellipsoidal height accepted, metres (below the deepest ocean trench, about −11 km, with margin for geoid separation).</summary>
    internal const double MinimumHeightMetres = -12_000.0;

    /// <summary>Highest ellipsoidal height accepted, metres (100 km, the conventional edge of space): field positions lie far below.</summary>
    internal const double MaximumHeightMetres = 100_000.0;

    /// <summary>
    /// Largest |easting − false easting| accepted for Transverse Mercator input, metres. About 18° of
    /// longitude from the central meridian at the equator; the Krüger series stays at the nanometre
    /// level to 3 900 km (Karney 2011), so this is a plausibility bound, not an accuracy bound.
    /// </summary>
    internal const double MaximumTransverseMercatorOffsetMetres = 2_000_000.0;

    /// <summary>
    /// Largest |northing − false northing| accepted, metres: the pole's distance from the equator on the
    /// WGS 84 ellipsoid (10 001 966 m, the meridian quadrant; Karney 2011 gives the formula) with margin.
    /// </summary>
    internal const double MaximumTransverseMercatorNorthingMetres = 10_010_000.0;

    private static readonly string[] GeographicFields = ["lat", "lon"];
    private static readonly string[] ProjectedFields = ["e", "n"];
    private static readonly string[] GeocentricFields = ["x", "y", "z"];

    public static GeodeticCoordinate? ToGeodetic(CoordinateReferenceSystem crs, PointRecord point, string pointer, bool useHeight, List<InputError> errors)
    {
        var before = errors.Count;
        RejectForeignFields(crs.Kind, point, pointer, errors);
        var height = ReadHeight(crs, point, pointer, useHeight, errors);
        GeodeticCoordinate? result = crs.Kind switch
        {
            CrsKind.Geographic => FromGeographic(point, pointer, height, errors),
            CrsKind.Projected => FromProjected(crs, point, pointer, height, errors),
            CrsKind.Geocentric => FromGeocentric(crs, point, pointer, errors),
            _ => null,
        };
        return errors.Count == before ? result : null;
    }

    private static double ReadHeight(CoordinateReferenceSystem crs, PointRecord point, string pointer, bool useHeight, List<InputError> errors)
    {
        if (!useHeight || point.H is not { } h)
            return 0.0;
        var metres = h * crs.Unit.MetresPerUnit;
        if (!double.IsFinite(metres) || metres < MinimumHeightMetres || metres > MaximumHeightMetres)
            errors.Add(new($"{pointer}/h", Invariant($"height {h} is outside {MinimumHeightMetres}..{MaximumHeightMetres} m; heights are in the CRS unit ({crs.Unit.PluralName})")));
        return metres;
    }

    private static GeodeticCoordinate? FromGeographic(PointRecord p, string pointer, double heightMetres, List<InputError> errors)
    {
        if (!Require(p.Lat, "lat", pointer, errors) | !Require(p.Lon, "lon", pointer, errors))
            return null;
        var lat = p.Lat!.Value;
        var lon = p.Lon!.Value;
        if (!double.IsFinite(lat) || lat < -90 || lat > 90)
            errors.Add(new($"{pointer}/lat", Invariant($"latitude {lat} is outside -90..90 degrees")));
        if (!double.IsFinite(lon) || lon < -180 || lon > 180)
            errors.Add(new($"{pointer}/lon", Invariant($"longitude {lon} is outside -180..180 degrees")));
        return new GeodeticCoordinate(lat, lon, heightMetres);
    }

    private static GeodeticCoordinate? FromProjected(CoordinateReferenceSystem crs, PointRecord p, string pointer, double heightMetres, List<InputError> errors)
    {
        if (!Require(p.E, "e", pointer, errors) | !Require(p.N, "n", pointer, errors))
            return null;
        var projection = crs.Projection!;
        var eastingMetres = p.E!.Value * crs.Unit.MetresPerUnit;
        var northingMetres = p.N!.Value * crs.Unit.MetresPerUnit;
        var (falseEasting, falseNorthing) = projection is TransverseMercator tm ? (tm.FalseEastingMetres, tm.FalseNorthingMetres) : (0.0, 0.0);
        if (!double.IsFinite(eastingMetres) || Math.Abs(eastingMetres - falseEasting) > MaximumTransverseMercatorOffsetMetres)
        {
            errors.Add(new($"{pointer}/e", Invariant($"easting {p.E} is more than {MaximumTransverseMercatorOffsetMetres / 1000} km from the false easting of {crs.Identifier}: check the zone, the unit and that e/n are not swapped")));
            return null;
        }
        if (!double.IsFinite(northingMetres) || Math.Abs(northingMetres - falseNorthing) > MaximumTransverseMercatorNorthingMetres)
        {
            errors.Add(new($"{pointer}/n", Invariant($"northing {p.N} lies beyond the pole in {crs.Identifier}: check the zone, the hemisphere, the unit and that e/n are not swapped")));
            return null;
        }
        double lat, lon;
        try
        {
            (lat, lon) = projection.Inverse(eastingMetres, northingMetres);
        }
        catch (ArgumentOutOfRangeException)
        {
            lat = lon = double.NaN;
        }
        if (!double.IsFinite(lat) || Math.Abs(lat) >= 90)
        {
            errors.Add(new($"{pointer}/n", Invariant($"northing {p.N} lies beyond the pole in {crs.Identifier}: check the zone, the hemisphere and that e/n are not swapped")));
            return null;
        }
        return new GeodeticCoordinate(lat, lon, heightMetres);
    }

    private static GeodeticCoordinate? FromGeocentric(CoordinateReferenceSystem crs, PointRecord p, string pointer, List<InputError> errors)
    {
        if (!Require(p.X, "x", pointer, errors) | !Require(p.Y, "y", pointer, errors) | !Require(p.Z, "z", pointer, errors))
            return null;
        var xyz = new GeocentricCoordinate(p.X!.Value, p.Y!.Value, p.Z!.Value);
        if (!double.IsFinite(xyz.XMetres) || !double.IsFinite(xyz.YMetres) || !double.IsFinite(xyz.ZMetres))
        {
            errors.Add(new(pointer, "x, y and z must be finite numbers (metres)"));
            return null;
        }
        var geodetic = GeocentricConversion.ToGeodetic(xyz, crs.Ellipsoid);
        if (geodetic.EllipsoidalHeightMetres < MinimumHeightMetres || geodetic.EllipsoidalHeightMetres > MaximumHeightMetres)
        {
            errors.Add(new(pointer, Invariant($"x, y, z lie {geodetic.EllipsoidalHeightMetres:F0} m from the ellipsoid, outside {MinimumHeightMetres}..{MaximumHeightMetres} m: geocentric coordinates are in metres from the Earth's centre")));
            return null;
        }
        return geodetic;
    }

    private static void RejectForeignFields(CrsKind kind, PointRecord p, string pointer, List<InputError> errors)
    {
        var given = new List<string>(3);
        if (p.Lat is not null) given.Add("lat");
        if (p.Lon is not null) given.Add("lon");
        if (p.E is not null) given.Add("e");
        if (p.N is not null) given.Add("n");
        if (p.X is not null) given.Add("x");
        if (p.Y is not null) given.Add("y");
        if (p.Z is not null) given.Add("z");
        var expected = kind switch
        {
            CrsKind.Geographic => GeographicFields,
            CrsKind.Projected => ProjectedFields,
            _ => GeocentricFields,
        };
        foreach (var field in given.Where(f => !expected.Contains(f)))
        {
            errors.Add(new($"{pointer}/{field}",
                $"a {kind.ToString().ToLowerInvariant()} CRS takes {string.Join(", ", expected)}; \"{field}\" does not fit it"));
        }
        if (kind == CrsKind.Geocentric && p.H is not null)
            errors.Add(new($"{pointer}/h", "a geocentric CRS takes x, y, z only; the height is implied by them"));
    }

    private static bool Require(double? value, string field, string pointer, List<InputError> errors)
    {
        if (value is not null)
            return true;
        errors.Add(new($"{pointer}/{field}", $"\"{field}\" is required"));
        return false;
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
