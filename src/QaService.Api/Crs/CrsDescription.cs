using QaService.Core.Geodesy.Catalog;

namespace QaService.Api.Crs;

/// <summary>One page of catalog search results.</summary>
internal sealed record CrsPage(int Total, int Offset, int Limit, IReadOnlyList<CrsSummary> Items);

/// <summary>A catalog entry in a search result.</summary>
internal sealed record CrsSummary(string Id, string Name, string Kind, string Datum, string? Method, string Unit)
{
    public static CrsSummary From(CoordinateReferenceSystem crs) =>
        new(crs.Identifier, crs.Name, KindText(crs), crs.Datum.Name, crs.Conversion?.MethodName, crs.Unit.Name);

    internal static string KindText(CoordinateReferenceSystem crs) => crs.Kind switch
    {
        CrsKind.Geographic => crs.HasHeightAxis ? "geographic 3D" : "geographic 2D",
        CrsKind.Geocentric => "geocentric",
        _ => "projected",
    };
}

/// <summary>The full definition of one CRS (GET /v1/crs/{id}).</summary>
internal sealed record CrsDescription(
    string Id, string Name, string Kind, string? BaseCrs, DatumDescription Datum, ProjectionDescription? Projection,
    IReadOnlyList<AxisDescription> Axes, UnitDescription Unit, AreaDescription? AreaOfUse, string Source)
{
    /// <summary>EPSG attribution the dataset's terms of use ask for.</summary>
    public const string EpsgSource = "EPSG Geodetic Parameter Dataset, IOGP (via PROJ 9.1.1 proj.db, EPSG v10.076)";

    public static CrsDescription From(CoordinateReferenceSystem crs) => new(
        crs.Identifier, crs.Name, CrsSummary.KindText(crs), crs.BaseCrsIdentifier,
        new DatumDescription(crs.Datum.Code, crs.Datum.Name, crs.Datum.FrameReferenceEpochYear, crs.Datum.EnsembleAccuracyMetres,
            new EllipsoidDescription(crs.Ellipsoid.Name, crs.Ellipsoid.SemiMajorAxisMetres,
                double.IsInfinity(crs.Ellipsoid.InverseFlattening) ? null : crs.Ellipsoid.InverseFlattening),
            crs.Datum.HelmertToWgs84),
        crs.Conversion is { } c ? new ProjectionDescription(c.MethodCode is { } m ? $"EPSG:{m}" : null, c.MethodName,
            c.Parameters.Select(p => new ParameterDescription($"EPSG:{p.Code}", p.Name, p.Value, p.Unit)).ToList()) : null,
        crs.Axes.Select(a => new AxisDescription(a.Abbreviation, a.Direction, a.Unit, a.Field)).ToList(),
        new UnitDescription(crs.Unit.Name, crs.Unit.MetresPerUnit),
        crs.AreaOfUse is { } area ? new AreaDescription(area.Name, area.SouthDegrees, area.NorthDegrees, area.WestDegrees, area.EastDegrees) : null,
        crs.Identifier.StartsWith("EPSG:", StringComparison.Ordinal) ? EpsgSource : "WKT");
}

/// <summary>Datum part of a CRS description.</summary>
internal sealed record DatumDescription(string Code, string Name, double? ReferenceEpoch, double? EnsembleAccuracy, EllipsoidDescription Ellipsoid, HelmertToWgs84? Towgs84);

/// <summary>Ellipsoid: semi-major axis in metres, inverse flattening (null for a sphere).</summary>
internal sealed record EllipsoidDescription(string Name, double SemiMajorAxis, double? InverseFlattening);

/// <summary>Projection method and parameters.</summary>
internal sealed record ProjectionDescription(string? Method, string MethodName, IReadOnlyList<ParameterDescription> Parameters);

/// <summary>One projection parameter in degrees, metres or unity.</summary>
internal sealed record ParameterDescription(string Code, string Name, double Value, string Unit);

/// <summary>One axis and the API point field that carries it.</summary>
internal sealed record AxisDescription(string Abbreviation, string Direction, string Unit, string Field);

/// <summary>The CRS's linear unit with its exact size in metres.</summary>
internal sealed record UnitDescription(string Name, double MetresPerUnit);

/// <summary>Area of use box, degrees.</summary>
internal sealed record AreaDescription(string Name, double South, double North, double West, double East);
