namespace QaService.Core.Screening;

/// <summary>
/// The per-fix rules. Each reads one kind of receiver metadata, and fires (flag or reject) or stays
/// silent; a rule whose input the fix lacks reports itself as not checked. Every rule names its basis.
/// </summary>
public static class ScreeningRules
{
    public const string CommonPractice = "common practice";

    /// <summary>Basis of the four-satellite floor: four unknowns (x, y, z, receiver clock) need four ranges (check-values §6, V).</summary>
    public const string FourSatelliteBasis = "a 3-D fix solves x, y, z and the receiver clock, so it needs at least 4 satellites";

    /// <summary>
    /// Expected 2DRMS horizontal error of an autonomous fix, metres: 2 · HDOP · UERE(1σ), with
    /// UERE(1σ) = UERE(95 %) / 1.96 (the budget's 95 % taken as a one-dimensional normal figure).
    /// Source: "expected horizontal error (1σ) ≈ HDOP × UERE(1σ); 2DRMS ≈ 2·HDOP·UERE" (GPS User
    /// Equipment Introduction; NRC GPS report), UERE budget Table 3-1. Valid for HDOP ≥ 0; it describes
    /// an error budget, not a measured error, and 2DRMS holds 95.4–98.2 % of fixes depending on ellipticity.
    /// </summary>
    public static double ExpectedTwoDrmsMetres(double hdop, double uere95Metres) => 2.0 * hdop * uere95Metres / NormalQuantile95;

    /// <summary>Two-sided 95 % quantile of the standard normal distribution.</summary>
    public const double NormalQuantile95 = 1.959964;

    public static ScreeningResult Evaluate(int index, ScreeningFix fix, ScreeningThresholds t, ReceiverCalibration? calibration = null)
    {
        var reasons = new List<ScreeningReason>();
        var notChecked = new List<string>();
        var quality = ScreeningQuality.Normalise(fix.Quality);

        if (quality is null) notChecked.Add("quality");
        else Quality(quality, t, reasons);

        if (fix.Satellites is not { } sats) notChecked.Add("satellites");
        else Satellites(sats, t, reasons);

        Dop("pdop", "PDOP", fix.Pdop, t.MaximumPdop, reasons, notChecked);
        Dop("hdop", "HDOP", fix.Hdop, t.MaximumHdop, reasons, notChecked);
        Dop("vdop", "VDOP", fix.Vdop, t.MaximumVdop, reasons, notChecked);

        Limit("horizontal-error", "reported horizontal error", fix.HorizontalError, t.FlagHorizontalError, t.RejectHorizontalError, "m", reasons, notChecked);
        Limit("vertical-error", "reported vertical error", fix.VerticalError, t.FlagVerticalError, t.RejectVerticalError, "m", reasons, notChecked);
        Limit("correction-age", "age of corrections", fix.CorrectionAge, t.MaximumCorrectionAge, t.RejectCorrectionAge, "s", reasons,
            quality is ScreeningQuality.Names.Autonomous ? [] : notChecked);

        if (fix.ElevationMask is not { } mask) notChecked.Add("elevation-mask");
        else if (t.MinimumElevationMask is { } minMask && mask < minMask)
            reasons.Add(new("elevation-mask", ScreeningDecision.Flag,
                InvariantText.Format($"elevation mask {mask:0.#}° is below {minMask:0.#}°: satellites near the horizon add ionospheric, tropospheric and multipath delay"),
                mask, minMask, "deg", CommonPractice));

        var (expected, note) = CalibratedExpectedError(fix, quality, t, calibration, reasons);
        if (expected is null && quality == ScreeningQuality.Names.Autonomous && fix.Hdop is { } hdop && t.Uere95 is { } uere)
        {
            expected = ExpectedTwoDrmsMetres(hdop, uere);
            if (t.FlagHorizontalError is { } limit && expected > limit)
                reasons.Add(new("expected-error", ScreeningDecision.Flag,
                    InvariantText.Format($"autonomous fix: expected horizontal error 2·HDOP·UERE = {expected:0.0} m exceeds {limit:0.###} m (autonomous fixes are typically 5–10 m)") +
                    (note is null ? "" : "; " + note),
                    expected, limit, "m", "2DRMS ≈ 2·HDOP·UERE(1σ), UERE budget GPS User Equipment Introduction Table 3-1; 5–10 m typical: common practice"));
        }

        var decision = reasons.Count == 0 ? ScreeningDecision.Accept : reasons.Max(r => r.Decision);
        return new ScreeningResult(index, fix.Id, decision, reasons, expected, notChecked, note);
    }

    /// <summary>
    /// The expected-error rule with a calibration: expected 2DRMS = 2 · ratio · σ_pred, where σ_pred is the fix's predicted radial σ
    /// on the entry's basis (√2 · reported horizontal error taken as the per-axis σ the assessments' fixes gave as sigmaH, or
    /// HDOP · UERE(1σ)) and ratio the receiver's observed/predicted RMS radial error (<see cref="ReceiverCalibration"/>). 2DRMS as in
    /// the profile's rule (2DRMS ≈ 2·σ_radial). Returns no expected error, and says why, when no entry has enough pairs: the
    /// profile's rule then applies.
    /// </summary>
    private static (double? Expected, string? Note) CalibratedExpectedError(ScreeningFix fix, string? quality, ScreeningThresholds t,
        ReceiverCalibration? calibration, List<ScreeningReason> reasons)
    {
        if (calibration is null)
            return (null, null);
        if (fix.Receiver is not { } receiver)
            return (null, "the fix names no receiver, so the calibration does not apply; the profile's expected-error rule was used");
        var (basis, predicted) = fix.HorizontalError is { } reported
            ? (ReceiverCalibration.SigmaBasis, Math.Sqrt(2) * reported)
            : fix.Hdop is { } hdop ? (ReceiverCalibration.HdopBasis, hdop * calibration.Uere95Metres / NormalQuantile95) : (null, 0.0);
        if (basis is null)
            return (null, $"receiver \"{receiver}\": the fix reports neither a horizontal error nor an HDOP to scale; the profile's expected-error rule was used");
        var entry = calibration.Find(receiver, quality, basis, out var tooFew);
        var type = quality is null ? "" : $" ({quality})";
        if (entry is null)
        {
            return (null, tooFew is null
                ? $"no calibration for receiver \"{receiver}\"{type} on its {basis}; the profile's expected-error rule was used"
                : InvariantText.Format($"the calibration of receiver \"{receiver}\"{(tooFew.Quality is null ? "" : $" ({tooFew.Quality})")} rests on {tooFew.Pairs} pairs, fewer than the {calibration.MinimumPairs} required; the profile's expected-error rule was used"));
        }
        var expected = 2 * entry.Ratio * predicted;
        var scope = entry.Quality is null ? "all fix types" : entry.Quality;
        var note = InvariantText.Format($"calibration of receiver \"{receiver}\" ({scope}, {basis}): observed/predicted {entry.Ratio:0.###} on {entry.Pairs} pairs ({calibration.Source})");
        if (t.FlagHorizontalError is { } limit && expected > limit)
        {
            reasons.Add(new("expected-error", ScreeningDecision.Flag,
                InvariantText.Format($"calibrated expected horizontal error 2 · {entry.Ratio:0.###} · {predicted:0.###} m = {expected:0.###} m exceeds {limit:0.###} m; uses the {note}"),
                expected, limit, "m",
                InvariantText.Format($"receiver calibration on {entry.Pairs} assessed pairs: {ReceiverCalibration.Method}; 2DRMS ≈ 2·σ_radial")));
        }
        return (expected, note);
    }

    private static void Quality(string quality, ScreeningThresholds t, List<ScreeningReason> reasons)
    {
        if (Names(t.RejectQualities, quality))
            reasons.Add(new("quality", ScreeningDecision.Reject, $"fix quality \"{quality}\" is not accepted for this work", null, null, null, CommonPractice));
        else if (Names(t.FlagQualities, quality))
            reasons.Add(new("quality", ScreeningDecision.Flag, quality == ScreeningQuality.Names.Autonomous
                ? "autonomous fix: no corrections, typically 5–10 m horizontal; re-occupy with corrections"
                : $"fix quality \"{quality}\" is below what this work expects; re-occupy if possible", null, null, null, CommonPractice));
    }

    private static void Satellites(int sats, ScreeningThresholds t, List<ScreeningReason> reasons)
    {
        if (sats < SatellitesFloor(t))
            reasons.Add(new("satellites", ScreeningDecision.Reject,
                sats < ScreeningProfiles.SatellitesForThreeDimensionalFix
                    ? InvariantText.Format($"{sats} satellites cannot give a 3-D fix (x, y, z and clock need 4)")
                    : InvariantText.Format($"{sats} satellites, fewer than the {SatellitesFloor(t)} this work requires"),
                sats, SatellitesFloor(t), "satellites", sats < ScreeningProfiles.SatellitesForThreeDimensionalFix ? FourSatelliteBasis : CommonPractice));
        else if (t.FlagSatellitesBelow is { } flag && sats < flag)
            reasons.Add(new("satellites", ScreeningDecision.Flag, InvariantText.Format($"only {sats} satellites (fewer than {flag}): weak geometry and little redundancy"),
                sats, flag, "satellites", CommonPractice));
    }

    private static bool Names(IReadOnlyList<string>? list, string quality) =>
        list?.Any(q => string.Equals(q?.Trim(), quality, StringComparison.OrdinalIgnoreCase)) == true;

    /// <summary>The reject floor: the profile's, never below four.</summary>
    private static int SatellitesFloor(ScreeningThresholds t) => Math.Max(t.MinimumSatellites ?? 0, ScreeningProfiles.SatellitesForThreeDimensionalFix);

    private static void Dop(string rule, string name, double? value, double? maximum, List<ScreeningReason> reasons, List<string> notChecked)
    {
        if (value is not { } v)
        {
            notChecked.Add(rule);
            return;
        }
        if (maximum is { } max && v > max)
            reasons.Add(new(rule, ScreeningDecision.Flag, InvariantText.Format($"{name} {v:0.0#} exceeds {max:0.0#}: poor satellite geometry magnifies range errors"),
                v, max, null, CommonPractice));
    }

    private static void Limit(string rule, string what, double? value, double? flag, double? reject, string unit,
        List<ScreeningReason> reasons, List<string> notChecked)
    {
        if (value is not { } v)
        {
            notChecked.Add(rule);
            return;
        }
        if (reject is { } r && v > r)
            reasons.Add(new(rule, ScreeningDecision.Reject, InvariantText.Format($"{what} {v:0.###} {unit} exceeds the rejection limit {r:0.###} {unit}"), v, r, unit, CommonPractice));
        else if (flag is { } f && v > f)
            reasons.Add(new(rule, ScreeningDecision.Flag, InvariantText.Format($"{what} {v:0.###} {unit} exceeds {f:0.###} {unit}"), v, f, unit, CommonPractice));
    }
}
