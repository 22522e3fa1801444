using static QaService.Core.InvariantText;
using QaService.Core.Assessment;
using QaService.Core.Geodesy.Vertical;
using QaService.Core.Reporting;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Signs of a height-reference blunder in the vertical residuals. The local EGM96 undulation N at the tested marks
/// (<see cref="Egm96"/>, bilinear on the 15′ grid) is compared with the mean dU: h_fix − H_mark ≈ +N when the marks'
/// heights are orthometric but declared ellipsoidal (or the fixes' are ellipsoidal and declared orthometric), ≈ −N the
/// other way round. Tolerance max(1 m, 3·SE of the mean): EGM96 is good to about ±1 m absolute (NGA) and another
/// geoid model differs from it by that much. A near-constant offset of 1.5–2.5 m matches a survey pole or tripod
/// antenna height that was not applied (common practice); a near-constant offset of 10 m or more that matches no
/// undulation is still geoid-sized (EGM96 spans about −107…+85 m) and is reported. "Near-constant": SD under a
/// quarter of |mean|.
/// </summary>
public sealed class HeightReferenceCheck : IDataCheck
{
    /// <summary>|mean dU| from which an offset looks geoid-sized, metres (common practice).</summary>
    public const double GeoidLikeOffsetMetres = 10.0;

    /// <summary>Range of typical pole or tripod antenna heights, metres (common practice).</summary>
    public const double AntennaHeightMinimumMetres = 1.5, AntennaHeightMaximumMetres = 2.5;

    /// <summary>Largest SD/|mean| for an offset to count as near-constant.</summary>
    public const double ConstantOffsetSpreadRatio = 0.25;

    /// <summary>Fewest vertical residuals to judge a constant offset.</summary>
    public const int MinimumPoints = 3;

    /// <summary>Smallest tolerance between mean dU and ±N, metres (EGM96 absolute accuracy, <see cref="GeoidModel.Egm96AccuracyMetres"/>).</summary>
    public const double UndulationToleranceMetres = GeoidModel.Egm96AccuracyMetres;

    /// <summary>Below this |N| (m) an undulation match cannot be told from an ordinary offset.</summary>
    public const double SmallestTellingUndulationMetres = 3.0;

    public string Id => "height-reference";

    public CheckResult Evaluate(CheckContext context)
    {
        var input = context.Input;
        if (!input.HasVerticalComparison)
            return new CheckResult(Id, CheckStatus.Pass, "horizontal-only test: heights were not compared");

        var unstated = new List<string>();
        if (!input.MarksFrame.HeightsStated) unstated.Add("marks");
        if (!input.FixesFrame.HeightsStated) unstated.Add("fixes");

        var up = context.Columns.Up;
        if (up.Length < MinimumPoints)
            return Unstated(unstated) ?? new CheckResult(Id, CheckStatus.Pass, "too few vertical residuals to look for a constant height offset");

        var mean = up.Average();
        var sd = Math.Sqrt(up.Sum(v => (v - mean) * (v - mean)) / (up.Length - 1));
        var undulation = MeanUndulationMetres(context.Columns);
        var tolerance = Math.Max(UndulationToleranceMetres, 3 * sd / Math.Sqrt(up.Length));
        var nearConstant = sd < ConstantOffsetSpreadRatio * Math.Abs(mean);

        if (nearConstant && Math.Abs(undulation) >= SmallestTellingUndulationMetres)
        {
            if (Math.Abs(mean - undulation) <= tolerance)
                return Fail(mean, sd, undulation,
                    "the fixes' heights are ellipsoidal and the marks' orthometric, one side mislabelled (marks declared \"ellipsoidal\" but holding H, or fixes declared \"orthometric\" but holding h)");
            if (Math.Abs(mean + undulation) <= tolerance)
                return Fail(mean, sd, undulation,
                    "the fixes' heights are orthometric and the marks' ellipsoidal, one side mislabelled (fixes declared \"ellipsoidal\" but holding H, or marks declared \"orthometric\" but holding h)");
        }
        if (nearConstant && Math.Abs(mean) >= GeoidLikeOffsetMetres)
        {
            return new CheckResult(Id, CheckStatus.Fail,
                Format($"fixes sit {mean:+0.00;-0.00} m from the marks in height with only {sd:F2} m spread: geoid-sized, though not the local EGM96 undulation ({undulation:+0.00;-0.00} m). Check the height reference and geoid model of both sides"),
                mean, undulation, "m");
        }
        if (nearConstant && mean >= AntennaHeightMinimumMetres && mean <= AntennaHeightMaximumMetres)
        {
            return new CheckResult(Id, CheckStatus.Warn,
                Format($"fixes sit {mean:+0.00} m above the marks with only {sd:F2} m spread: the size of a pole or tripod antenna height (1.5–2.5 m, common practice). Check that the antenna height was applied to the fixes"),
                mean, AntennaHeightMinimumMetres, "m");
        }
        return Unstated(unstated)
               ?? new CheckResult(Id, CheckStatus.Pass,
                   Format($"no constant height offset matching the local geoid undulation ({undulation:+0.00;-0.00} m) or an antenna height (mean dU {mean:F3} m, SD {sd:F3} m)"),
                   mean, undulation, "m");
    }

    /// <summary>
    /// Mean EGM96 undulation at the marks of the residuals with heights, one term per residual in residual order. The
    /// grid is read once per mark (2,000 marks, not 400,000 fixes); a residual whose mark position differs from the one
    /// read for its mark is read on its own.
    /// </summary>
    private static double MeanUndulationMetres(ResidualColumns columns)
    {
        var groups = columns.Groups;
        var read = new (double Latitude, double Longitude, double Undulation)?[groups.Count];
        // Enumerable.Average starts from the first term, not from +0; −0 + x is x for every x, so this is the same sum.
        var sum = -0.0;
        foreach (var row in columns.UpRows)
        {
            var (latitude, longitude) = columns.MarkLatLonOf(row);
            ref var atMark = ref read[groups.GroupOf[row]];
            if (atMark is not { } m || m.Latitude != latitude || m.Longitude != longitude)
                atMark = (latitude, longitude, Egm96.Grid.UndulationMetres(latitude, longitude));
            sum += atMark.Value.Undulation;
        }
        return sum / columns.UpRows.Length;
    }

    private CheckResult Fail(double mean, double sd, double undulation, string cause) =>
        new(Id, CheckStatus.Fail,
            Format($"mean dU {mean:+0.00;-0.00} m (spread {sd:F2} m) matches {(mean * undulation > 0 ? "+" : "−")}N, the local EGM96 geoid undulation N = {undulation:+0.00;-0.00} m at the marks: {cause}. Fix: state \"heights\" (and \"geoid\") correctly on both sides"),
            mean, undulation, "m");

    private CheckResult? Unstated(List<string> sides) => sides.Count == 0
        ? null
        : new CheckResult(Id, CheckStatus.Warn,
            $"\"heights\" was not stated for the {string.Join(" and ", sides)}, so h was taken as ellipsoidal; state it to rule out an ellipsoidal/orthometric mix");
}
