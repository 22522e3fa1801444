namespace QaService.Core.Ingest;

/// <summary>The point fields of api-v1 a field file can fill, by their contract names.</summary>
public static class ContractFields
{
    public const string Id = "id", Mark = "mark", Lat = "lat", Lon = "lon", E = "e", N = "n",
        X = "x", Y = "y", Z = "z", H = "h", SigmaH = "sigmaH", SigmaV = "sigmaV", Time = "time",
        FeatureClass = "featureClass", Crew = "crew", Receiver = "receiver", Hdop = "hdop", Quality = "quality";

    public static IReadOnlyList<string> All { get; } = [Id, Mark, Lat, Lon, E, N, X, Y, Z, H, SigmaH, SigmaV, Time, FeatureClass, Crew, Receiver, Hdop, Quality];

    /// <summary>Fields read as text (names), never probed or parsed as numbers.</summary>
    public static IReadOnlyList<string> Texts { get; } = [Id, Mark, Time, FeatureClass, Crew, Receiver, Quality];

    /// <summary>The text attributes of a fix, in <see cref="AttributeTexts"/> order.</summary>
    public static IReadOnlyList<string> Attributes { get; } = [FeatureClass, Crew, Receiver, Quality];

    /// <summary>Fields holding a length (scaled by a file's length unit).</summary>
    public static IReadOnlyList<string> Lengths { get; } = [E, N, X, Y, Z, H, SigmaH, SigmaV];
}
