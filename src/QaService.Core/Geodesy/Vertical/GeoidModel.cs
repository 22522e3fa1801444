namespace QaService.Core.Geodesy.Vertical;

/// <summary>A named geoid model and the accuracy its producer states for it, metres.</summary>
public sealed record GeoidModel(string Name, GeoidGrid Grid, double AccuracyMetres)
{
    /// <summary>EGM96, 15′ grid (built in). Accuracy: NGA states about 0.5–1 m globally; 1 m is taken.</summary>
    public static GeoidModel Egm96 => new("egm96", Vertical.Egm96.Grid, Egm96AccuracyMetres);

    /// <summary>EGM96 global accuracy taken for the operation's accuracy, metres (NGA: ±0.5…1 m).</summary>
    public const double Egm96AccuracyMetres = 1.0;

    /// <summary>Names the service knows, for messages.</summary>
    public const string KnownNames = "\"egm96\"";

    /// <summary>The built-in model of that name (case-insensitive), or null.</summary>
    public static GeoidModel? Find(string? name) =>
        string.Equals(name?.Trim(), "egm96", StringComparison.OrdinalIgnoreCase) ? Egm96 : null;
}
