using QaService.Core.Reporting;

namespace QaService.Core.Screening;

/// <summary>How much larger (or smaller) a receiver's observed horizontal errors were than the precision it reported.</summary>
/// <param name="Receiver">Receiver name as the fixes gave it.</param>
/// <param name="Quality">Fix type (screening words), or null for every fix type of the receiver together.</param>
/// <param name="Basis"><c>sigma</c>: predicted radial σ = √2 · reported per-axis σ; <c>hdop</c>: predicted radial σ = HDOP · UERE(1σ).</param>
/// <param name="Pairs">Assessed pairs (counted, not excluded) behind the ratio.</param>
/// <param name="Ratio">√(Σ dH² / Σ predicted²): observed RMS radial error over predicted RMS radial error.</param>
/// <param name="ObservedRmsRadialMetres">√(Σ dH² / n), m.</param>
/// <param name="PredictedRmsRadialMetres">√(Σ predicted² / n), m.</param>
public sealed record CalibrationEntry(string Receiver, string? Quality, string Basis, int Pairs, double Ratio, double ObservedRmsRadialMetres,
    double PredictedRmsRadialMetres);

/// <summary>The calibration the expected-error rule may use, with the constants it was made with.</summary>
/// <param name="Entries">Per receiver (all fix types), and per receiver and fix type, per basis.</param>
/// <param name="Uere95Metres">UERE at 95 % used for the <c>hdop</c> basis, m (UERE(1σ) = UERE95 / 1.96).</param>
/// <param name="MinimumPairs">Fewer pairs than this and an entry is not used: the profile's rule is.</param>
/// <param name="Source">Where the pairs came from (e.g. the assessment ids), for the reasons.</param>
public sealed record ReceiverCalibration(IReadOnlyList<CalibrationEntry> Entries, double Uere95Metres, int MinimumPairs, string Source)
{
    public const string SigmaBasis = "sigma", HdopBasis = "hdop";

    /// <summary>
    /// Default minimum pairs per entry: 20, borrowed from the NSSDA minimum of 20 check points (FGDC-STD-007.3-1998 §3.2.1) as the
    /// smallest sample an accuracy figure is stated on; using it for a ratio is common practice, not a standard's rule.
    /// </summary>
    public const int DefaultMinimumPairs = 20;

    public const string Method =
        "ratio = √(Σ dH² / Σ σ_pred²) over the counted pairs of one receiver (and fix type): σ_pred = √2 · reported per-axis σ (fix sigmaH, NMEA GST), " +
        "or HDOP · UERE(1σ) with UERE(1σ) = UERE95 / 1.96 (HDOP = √(σ_E² + σ_N²) / σ_UERE by the definition of dilution of precision)";

    /// <summary>
    /// The calibration from assessed residuals (a stored report's, or several reports' joined): every counted residual whose fix
    /// names its receiver and reports a σ and/or an HDOP. One pass; sums per (receiver, fix type, basis) and per (receiver, basis).
    /// </summary>
    /// <param name="uere95Metres">UERE at 95 % for the HDOP basis; the default is the C/A code budget of the screening profiles
    /// (<see cref="ScreeningProfiles.CaCodeUere95Metres"/>, GPS User Equipment Introduction Table 3-1).</param>
    public static ReceiverCalibration FromResiduals(IEnumerable<Residual> residuals, string source, double uere95Metres = ScreeningProfiles.CaCodeUere95Metres,
        int minimumPairs = DefaultMinimumPairs)
    {
        var uereOneSigma = uere95Metres / ScreeningRules.NormalQuantile95;
        var sums = new Dictionary<(string Receiver, string? Quality, string Basis), (int N, double Observed, double Predicted)>();
        foreach (var r in residuals)
        {
            if (r.Excluded is not null || r.Attributes is not { Receiver: { } receiver } a)
                continue;
            var observed = r.DH * r.DH;
            if (a.SigmaHorizontalMetres is { } sigma)
                Add(sums, receiver, a.Quality, SigmaBasis, observed, 2 * sigma * sigma);
            if (a.Hdop is { } hdop)
                Add(sums, receiver, a.Quality, HdopBasis, observed, hdop * uereOneSigma * hdop * uereOneSigma);
        }
        var entries = sums
            .Where(kv => kv.Value.Predicted > 0)
            .OrderBy(kv => kv.Key.Receiver, StringComparer.Ordinal).ThenBy(kv => kv.Key.Quality ?? "", StringComparer.Ordinal).ThenBy(kv => kv.Key.Basis, StringComparer.Ordinal)
            .Select(kv => new CalibrationEntry(kv.Key.Receiver, kv.Key.Quality, kv.Key.Basis, kv.Value.N, Math.Sqrt(kv.Value.Observed / kv.Value.Predicted),
                Math.Sqrt(kv.Value.Observed / kv.Value.N), Math.Sqrt(kv.Value.Predicted / kv.Value.N)))
            .ToList();
        return new ReceiverCalibration(entries, uere95Metres, minimumPairs, source);
    }

    private static void Add(Dictionary<(string, string?, string), (int N, double Observed, double Predicted)> sums, string receiver, string? quality, string basis,
        double observed, double predicted)
    {
        // Every pair counts for its receiver as a whole, and for its fix type when the fix gives one.
        Accumulate(sums, (receiver, null, basis), observed, predicted);
        if (quality is not null)
            Accumulate(sums, (receiver, quality, basis), observed, predicted);
    }

    private static void Accumulate(Dictionary<(string, string?, string), (int N, double Observed, double Predicted)> sums, (string, string?, string) key,
        double observed, double predicted)
    {
        var s = sums.GetValueOrDefault(key);
        sums[key] = (s.N + 1, s.Observed + observed, s.Predicted + predicted);
    }

    /// <summary>
    /// The entry for a fix: its receiver and fix type first, else its receiver over all fix types; among those, the first with at
    /// least <see cref="MinimumPairs"/> pairs. <paramref name="tooFew"/> is the best entry that exists but has too few pairs.
    /// </summary>
    public CalibrationEntry? Find(string receiver, string? quality, string basis, out CalibrationEntry? tooFew)
    {
        tooFew = null;
        foreach (var q in quality is null ? new string?[] { null } : [quality, null])
        {
            var entry = Entries.FirstOrDefault(e => e.Receiver == receiver && e.Quality == q && e.Basis == basis);
            if (entry is null)
                continue;
            if (entry.Pairs >= MinimumPairs)
                return entry;
            tooFew ??= entry;
        }
        return null;
    }
}
