namespace QaService.Core.Assessment;

/// <summary>What a mark's repeat occupations contribute to the accuracy figures.</summary>
public enum OccupationMode
{
    /// <summary>Every fix is a test point (api-v1 default).</summary>
    Each,
    /// <summary>The mean of each mark's occupations is one test point (survey practice for repeat occupations; common practice).</summary>
    Mean,
}

/// <summary>Reads <c>pairing.occupations</c>.</summary>
public static class OccupationModes
{
    public static OccupationMode Read(string? text, List<InputError> errors)
    {
        switch (text?.Trim().ToLowerInvariant())
        {
            case null or "each":
                return OccupationMode.Each;
            case "mean":
                return OccupationMode.Mean;
            default:
                errors.Add(new InputError("/pairing/occupations", $"occupations \"{text}\" is not \"each\" (every fix is tested) or \"mean\" (each mark's occupations are averaged)"));
                return OccupationMode.Each;
        }
    }
}
