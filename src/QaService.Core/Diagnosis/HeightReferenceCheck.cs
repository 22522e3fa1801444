using static QaService.Core.InvariantText;
using System.Globalization;
using QaService.Core.Reporting;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Signs of a height-reference blunder in the vertical residuals (common practice):
/// a large near-constant offset is the size of a geoid undulation (EGM96 spans about −107 m to +85 m;
/// most of the populated world is more than 10 m from zero), i.e. one side ellipsoidal, the other
/// orthometric; a near-constant offset of 1–2.5 m matches a survey pole or tripod antenna height that
/// was not applied. "Near-constant" means the spread of dU is under a quarter of its mean.
/// </summary>
public sealed class HeightReferenceCheck : IDataCheck
{
    /// <summary>|mean dU| from which an offset looks like a geoid undulation, metres (common practice).</summary>
    public const double GeoidLikeOffsetMetres = 10.0;

    /// <summary>Range of typical antenna (pole, tripod) heights, metres (common practice: 1.0–2.5 m poles).</summary>
    public const double AntennaHeightMinimumMetres = 1.0, AntennaHeightMaximumMetres = 2.5;

    /// <summary>Largest SD/|mean| for an offset to count as near-constant.</summary>
    public const double ConstantOffsetSpreadRatio = 0.25;

    /// <summary>Fewest vertical residuals to judge a constant offset.</summary>
    public const int MinimumPoints = 3;

    public string Id => "height-reference";

    public CheckResult Evaluate(CheckContext context)
    {
        var input = context.Input;
        if (!input.HasVerticalComparison)
            return new CheckResult(Id, CheckStatus.Pass, "horizontal-only test: heights were not compared");

        var unstated = new List<string>();
        if (!input.MarksFrame.HeightsStated) unstated.Add("marks");
        if (!input.FixesFrame.HeightsStated) unstated.Add("fixes");

        var up = context.Included.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
        if (up.Length < MinimumPoints)
            return Unstated(unstated) ?? new CheckResult(Id, CheckStatus.Pass, "too few vertical residuals to look for a constant height offset");

        var mean = up.Average();
        var sd = Math.Sqrt(up.Sum(v => (v - mean) * (v - mean)) / (up.Length - 1));
        var nearConstant = sd < ConstantOffsetSpreadRatio * Math.Abs(mean);
        if (nearConstant && Math.Abs(mean) >= GeoidLikeOffsetMetres)
        {
            return new CheckResult(Id, CheckStatus.Fail,
                Format($"fixes sit {mean:+0.00;-0.00} m from the marks in height with only {sd:F2} m spread: the size of a geoid undulation. One side's heights are probably ellipsoidal and the other's orthometric; state \"heights\" on both sides"),
                Math.Abs(mean), GeoidLikeOffsetMetres, "m");
        }
        if (nearConstant && Math.Abs(mean) >= AntennaHeightMinimumMetres && Math.Abs(mean) <= AntennaHeightMaximumMetres)
        {
            return new CheckResult(Id, CheckStatus.Warn,
                Format($"fixes sit {mean:+0.00;-0.00} m from the marks in height with only {sd:F2} m spread: the size of a pole or tripod antenna height. Check that the antenna height was applied"),
                Math.Abs(mean), AntennaHeightMinimumMetres, "m");
        }
        return Unstated(unstated)
               ?? new CheckResult(Id, CheckStatus.Pass, Format($"no constant height offset (mean dU {mean:F3} m, SD {sd:F3} m)"), Math.Abs(mean), GeoidLikeOffsetMetres, "m");
    }

    private CheckResult? Unstated(List<string> sides) => sides.Count == 0
        ? null
        : new CheckResult(Id, CheckStatus.Warn,
            $"\"heights\" was not stated for the {string.Join(" and ", sides)}, so h was taken as ellipsoidal; state it to rule out an ellipsoidal/orthometric mix");

}
