namespace QaService.Core.Screening;

/// <summary>A named set of screening thresholds for one kind of field work.</summary>
public sealed record ScreeningProfile(string Name, string Purpose, ScreeningThresholds Thresholds);

/// <summary>
/// The named profiles. Their numbers are common practice for the kind of work named (no standard sets
/// per-fix gates), except where a rule cites its source; every value can be overridden per request.
/// </summary>
public static class ScreeningProfiles
{
    public const string DefaultName = "asset-inventory-sbas";

    /// <summary>
    /// Budgeted user equivalent range error at 95 %, C/A code, metres (GPS User Equipment Introduction,
    /// Table 3-1). A conservative budget: modern single-frequency receivers usually do better.
    /// </summary>
    public const double CaCodeUere95Metres = 15.7;

    /// <summary>A 3-D fix solves x, y, z and the receiver clock: four unknowns need four satellites.</summary>
    public const int SatellitesForThreeDimensionalFix = 4;

    public static IReadOnlyList<ScreeningProfile> All { get; } =
    [
        new(DefaultName,
            "Asset inventory (hydrants, valves, poles, signs) with SBAS-corrected handheld or GIS receivers: metre-level positions, autonomous fixes flagged.",
            new ScreeningThresholds(
                RejectQualities: [ScreeningQuality.Names.Invalid],
                FlagQualities: [ScreeningQuality.Names.Autonomous],
                MinimumSatellites: SatellitesForThreeDimensionalFix,
                FlagSatellitesBelow: 6,
                MaximumPdop: 6.0, MaximumHdop: 4.0, MaximumVdop: 6.0,
                FlagHorizontalError: 1.0, RejectHorizontalError: 5.0,
                FlagVerticalError: 2.0, RejectVerticalError: 10.0,
                MaximumCorrectionAge: 60.0, RejectCorrectionAge: 300.0,
                MinimumElevationMask: 5.0,
                Uere95: CaCodeUere95Metres)),
        new("utility-locating-rtk",
            "Locating buried utilities and their fittings with RTK: centimetre-level positions; only RTK fixed accepted, float flagged.",
            new ScreeningThresholds(
                RejectQualities: [ScreeningQuality.Names.Invalid, ScreeningQuality.Names.Autonomous, ScreeningQuality.Names.Dgnss, ScreeningQuality.Names.Sbas],
                FlagQualities: [ScreeningQuality.Names.RtkFloat, ScreeningQuality.Names.Ppp],
                MinimumSatellites: 5,
                FlagSatellitesBelow: 8,
                MaximumPdop: 4.0, MaximumHdop: 2.0, MaximumVdop: 3.0,
                FlagHorizontalError: 0.05, RejectHorizontalError: 0.15,
                FlagVerticalError: 0.08, RejectVerticalError: 0.25,
                MaximumCorrectionAge: 5.0, RejectCorrectionAge: 30.0,
                MinimumElevationMask: 10.0,
                Uere95: CaCodeUere95Metres)),
        new("mapping-autonomous",
            "Reconnaissance mapping with autonomous handhelds: 5–10 m is typical, larger expected errors flagged.",
            new ScreeningThresholds(
                RejectQualities: [ScreeningQuality.Names.Invalid],
                FlagQualities: [],
                MinimumSatellites: SatellitesForThreeDimensionalFix,
                FlagSatellitesBelow: 5,
                MaximumPdop: 8.0, MaximumHdop: 5.0, MaximumVdop: 8.0,
                FlagHorizontalError: 10.0, RejectHorizontalError: 30.0,
                FlagVerticalError: 20.0, RejectVerticalError: 50.0,
                MaximumCorrectionAge: 120.0, RejectCorrectionAge: 600.0,
                MinimumElevationMask: 5.0,
                Uere95: CaCodeUere95Metres)),
    ];

    public static ScreeningProfile? Find(string? name) =>
        All.FirstOrDefault(p => string.Equals(p.Name, (name ?? DefaultName).Trim(), StringComparison.OrdinalIgnoreCase));

    /// <summary>The profile's thresholds with every value the request gives taking precedence.</summary>
    public static ScreeningThresholds Merge(ScreeningThresholds profile, ScreeningThresholds? overrides) => overrides is null ? profile : new(
        overrides.RejectQualities ?? profile.RejectQualities,
        overrides.FlagQualities ?? profile.FlagQualities,
        overrides.MinimumSatellites ?? profile.MinimumSatellites,
        overrides.FlagSatellitesBelow ?? profile.FlagSatellitesBelow,
        overrides.MaximumPdop ?? profile.MaximumPdop,
        overrides.MaximumHdop ?? profile.MaximumHdop,
        overrides.MaximumVdop ?? profile.MaximumVdop,
        overrides.FlagHorizontalError ?? profile.FlagHorizontalError,
        overrides.RejectHorizontalError ?? profile.RejectHorizontalError,
        overrides.FlagVerticalError ?? profile.FlagVerticalError,
        overrides.RejectVerticalError ?? profile.RejectVerticalError,
        overrides.MaximumCorrectionAge ?? profile.MaximumCorrectionAge,
        overrides.RejectCorrectionAge ?? profile.RejectCorrectionAge,
        overrides.MinimumElevationMask ?? profile.MinimumElevationMask,
        overrides.Uere95 ?? profile.Uere95);
}
