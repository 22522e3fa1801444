namespace QaService.Core.Geodesy.Catalog;

/// <summary>Outcome of reading a CRS string: the CRS, or a message a person can act on.</summary>
public sealed record CrsResolution(CoordinateReferenceSystem? Crs, string? Problem)
{
    public bool Succeeded => Crs is not null;

    public static CrsResolution Found(CoordinateReferenceSystem crs) => new(crs, null);

    public static CrsResolution Failed(string problem) => new(null, problem);
}
