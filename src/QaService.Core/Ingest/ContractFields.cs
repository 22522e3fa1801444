namespace QaService.Core.Ingest;

/// <summary>The point fields of api-v1 a field file can fill, by their contract names.</summary>
public static class ContractFields
{
    public const string Id = "id", Mark = "mark", Lat = "lat", Lon = "lon", E = "e", N = "n",
        X = "x", Y = "y", Z = "z", H = "h", SigmaH = "sigmaH", SigmaV = "sigmaV", Time = "time";

    public static IReadOnlyList<string> All { get; } = [Id, Mark, Lat, Lon, E, N, X, Y, Z, H, SigmaH, SigmaV, Time];

    /// <summary>Fields holding a length (scaled by a file's length unit).</summary>
    public static IReadOnlyList<string> Lengths { get; } = [E, N, X, Y, Z, H, SigmaH, SigmaV];
}
