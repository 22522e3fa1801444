using static QaService.Core.InvariantText;
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
    /// Farthest a projected point may lie outside its CRS's EPSG area of use, degrees of arc (common
    /// practice: UTM data often spill a zone or half a zone into the neighbour, 3–6°; beyond this a
    /// wrong zone, unit or swapped axes is far likelier than real data).
    /// </summary>
    internal const double MaximumDegreesOutsideAreaOfUse = 5.0;

    /// <summary>
    /// Largest forward(inverse(e, n)) − (e, n) accepted, metres: the methods agree with PROJ to micrometres
    /// (DEVELOPERS.md), so a larger round-trip gap means the grid point is outside the part of the plane the
    /// projection maps one-to-one (e.g. a Transverse Mercator easting mirrored past 90° from the central meridian).
    /// </summary>
    internal const double RoundTripToleranceMetres = 0.001;

    private static readonly string[] GeographicFields = ["lat", "lon"];
    private static readonly string[] ProjectedFields = ["e", "n"];
    private static readonly string[] GeocentricFields = ["x", "y", "z"];

    public static GeodeticCoordinate? ToGeodetic(CoordinateReferenceSystem crs, in PointValues point, PointPointer pointer, bool useHeight, List<InputError> errors)
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

    private static double ReadHeight(CoordinateReferenceSystem crs, in PointValues point, PointPointer pointer, bool useHeight, List<InputError> errors)
    {
        if (!useHeight || point.H is not { } h)
            return 0.0;
        var metres = h * crs.Unit.MetresPerUnit;
        if (!double.IsFinite(metres) || metres < MinimumHeightMetres || metres > MaximumHeightMetres)
            errors.Add(new($"{pointer}/h", Format($"height {h} is outside {MinimumHeightMetres}..{MaximumHeightMetres} m; heights are in the CRS unit ({crs.Unit.PluralName})")));
        return metres;
    }

    private static GeodeticCoordinate? FromGeographic(in PointValues p, PointPointer pointer, double heightMetres, List<InputError> errors)
    {
        if (!Require(p.Lat, "lat", pointer, errors) | !Require(p.Lon, "lon", pointer, errors))
            return null;
        var lat = p.Lat!.Value;
        var lon = p.Lon!.Value;
        if (!double.IsFinite(lat) || lat < -90 || lat > 90)
            errors.Add(new($"{pointer}/lat", Format($"latitude {lat} is outside -90..90 degrees")));
        if (!double.IsFinite(lon) || lon < -180 || lon > 180)
            errors.Add(new($"{pointer}/lon", Format($"longitude {lon} is outside -180..180 degrees")));
        return new GeodeticCoordinate(lat, lon, heightMetres);
    }

    private static GeodeticCoordinate? FromProjected(CoordinateReferenceSystem crs, in PointValues p, PointPointer pointer, double heightMetres, List<InputError> errors)
    {
        if (!Require(p.E, "e", pointer, errors) | !Require(p.N, "n", pointer, errors))
            return null;
        var projection = crs.Projection!;
        var eastingMetres = p.E!.Value * crs.Unit.MetresPerUnit;
        var northingMetres = p.N!.Value * crs.Unit.MetresPerUnit;
        if (!double.IsFinite(eastingMetres))
        {
            errors.Add(new($"{pointer}/e", "easting must be a finite number"));
            return null;
        }
        if (!double.IsFinite(northingMetres))
        {
            errors.Add(new($"{pointer}/n", "northing must be a finite number"));
            return null;
        }

        double lat, lon;
        ProjectedCoordinate back;
        try
        {
            (lat, lon) = projection.Inverse(eastingMetres, northingMetres);
            back = projection.Forward(lat, lon);
        }
        catch (ArgumentOutOfRangeException)
        {
            lat = lon = double.NaN;
            back = default;
        }
        if (!double.IsFinite(lat) || !double.IsFinite(lon) || Math.Abs(lat) >= 90)
        {
            errors.Add(new($"{pointer}/n", Format($"e {p.E}, n {p.N} lie beyond the pole or outside the projection of {crs.Identifier}: check the zone, the hemisphere, the unit ({crs.Unit.PluralName}) and that e/n are not swapped")));
            return null;
        }
        var eastGap = Math.Abs(back.EastingMetres - eastingMetres);
        var northGap = Math.Abs(back.NorthingMetres - northingMetres);
        if (!(Math.Max(eastGap, northGap) <= RoundTripToleranceMetres))
        {
            var field = eastGap >= northGap ? "e" : "n";
            errors.Add(new($"{pointer}/{field}", Format($"e {p.E}, n {p.N} lie outside the part of the plane that {crs.Identifier} maps one-to-one (too far from its origin; for UTM the easting is far outside the zone): check the zone, the unit ({crs.Unit.PluralName}) and that e/n are not swapped")));
            return null;
        }
        if (crs.AreaOfUse is { } area && area.DegreesOutside(lat, lon) is var outside && outside > MaximumDegreesOutsideAreaOfUse)
        {
            var latitudeOutside = lat < area.SouthDegrees ? area.SouthDegrees - lat : lat > area.NorthDegrees ? lat - area.NorthDegrees : 0;
            var field = latitudeOutside >= outside ? "n" : "e";
            errors.Add(new($"{pointer}/{field}", Format($"e {p.E}, n {p.N} fall at lat {lat:F3}, lon {lon:F3}, {outside:F1}° outside the area of use of {crs.Identifier} ({area.Name}): check the zone, the unit ({crs.Unit.PluralName}) and that e/n are not swapped")));
            return null;
        }
        return new GeodeticCoordinate(lat, lon, heightMetres);
    }

    private static GeodeticCoordinate? FromGeocentric(CoordinateReferenceSystem crs, in PointValues p, PointPointer pointer, List<InputError> errors)
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
            errors.Add(new(pointer, Format($"x, y, z lie {geodetic.EllipsoidalHeightMetres:F0} m from the ellipsoid, outside {MinimumHeightMetres}..{MaximumHeightMetres} m: geocentric coordinates are in metres from the Earth's centre")));
            return null;
        }
        return geodetic;
    }

    private static void RejectForeignFields(CrsKind kind, in PointValues p, PointPointer pointer, List<InputError> errors)
    {
        // Checked without allocating: this runs for every point of an upload and almost always finds nothing.
        var foreign = kind switch
        {
            CrsKind.Geographic => p.E is not null || p.N is not null || p.X is not null || p.Y is not null || p.Z is not null,
            CrsKind.Projected => p.Lat is not null || p.Lon is not null || p.X is not null || p.Y is not null || p.Z is not null,
            _ => p.Lat is not null || p.Lon is not null || p.E is not null || p.N is not null,
        };
        if (foreign)
            ReportForeignFields(kind, p, pointer, errors);
        if (kind == CrsKind.Geocentric && p.H is not null)
            errors.Add(new($"{pointer}/h", "a geocentric CRS takes x, y, z only; the height is implied by them"));
    }

    private static void ReportForeignFields(CrsKind kind, in PointValues p, PointPointer pointer, List<InputError> errors)
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
    }

    private static bool Require(double? value, string field, PointPointer pointer, List<InputError> errors)
    {
        if (value is not null)
            return true;
        errors.Add(new($"{pointer}/{field}", $"\"{field}\" is required"));
        return false;
    }

}
