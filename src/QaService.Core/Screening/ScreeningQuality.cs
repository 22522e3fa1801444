namespace QaService.Core.Screening;

/// <summary>The fix-quality words of the screening API.</summary>
public static class ScreeningQuality
{
    public static class Names
    {
        public const string Invalid = "invalid", Autonomous = "autonomous", Dgnss = "dgnss", Sbas = "sbas",
            Ppp = "ppp", RtkFloat = "rtk-float", RtkFixed = "rtk-fixed";
    }

    public static IReadOnlyList<string> All { get; } =
        [Names.Invalid, Names.Autonomous, Names.Dgnss, Names.Sbas, Names.Ppp, Names.RtkFloat, Names.RtkFixed];

    public static string? Normalise(string? text) =>
        text?.Trim().ToLowerInvariant() is { } t && All.Contains(t) ? t : null;
}
