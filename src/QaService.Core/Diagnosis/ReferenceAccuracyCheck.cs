using QaService.Core.Assessment;
using static QaService.Core.InvariantText;
using System.Globalization;
using QaService.Core.Reporting;
using QaService.Core.Standards;

namespace QaService.Core.Diagnosis;

/// <summary>
/// The marks must be clearly better than what is tested: ASPRS Positional Accuracy Standards Ed.1
/// (2014) ask check points to be at least three times more accurate than the required accuracy
/// (check-values.md §2, status V). Each mark's declared <c>sigmaH</c> is read as a per-axis standard
/// deviation (circular), giving its own 95 % radius 2.4477·σ (FGDC-STD-007.3-1998 App. 3-A); vertical
/// 1.9600·σ. They are compared with the spec, or with the tested figure when there is no spec.
/// </summary>
public sealed class ReferenceAccuracyCheck : IDataCheck
{
    /// <summary>How many times better the marks must be (ASPRS Ed.1, 2014).</summary>
    public const double RequiredAccuracyRatio = 3.0;

    public string Id => "reference-accuracy";

    public CheckResult Evaluate(CheckContext context)
    {
        var marks = context.Columns.TestedMarks;
        if (marks.Count == 0)
            return new CheckResult(Id, CheckStatus.Warn, "no paired marks: their accuracy cannot be judged");

        var horizontalTarget = context.Input.Spec?.HorizontalMetres ?? context.Horizontal?.Nssda95;
        var verticalTarget = context.Input.Spec?.VerticalMetres ?? context.Vertical?.Nssda95;
        var worstH = marks.Where(m => m.SigmaHorizontalMetres is not null).Select(m => Nssda.HorizontalFactor * m.SigmaHorizontalMetres!.Value).DefaultIfEmpty(double.NaN).Max();
        var worstV = marks.Where(m => m.SigmaVerticalMetres is not null).Select(m => Nssda.VerticalFactor * m.SigmaVerticalMetres!.Value).DefaultIfEmpty(double.NaN).Max();
        var undeclared = marks.Count(m => m.SigmaHorizontalMetres is null);

        var problems = new List<string>();
        var ratio = 0.0;
        if (double.IsNaN(worstH))
            problems.Add("no mark declares sigmaH, so the marks' own accuracy is unknown");
        else if (horizontalTarget is { } ht && ht > 0)
        {
            ratio = Math.Max(ratio, worstH / ht);
            if (worstH * RequiredAccuracyRatio > ht)
                problems.Add(Format($"the weakest mark's horizontal 95 % radius ({worstH:F3} m) is not {RequiredAccuracyRatio:F0}× better than {ht:F3} m"));
        }
        if (!double.IsNaN(worstV) && verticalTarget is { } vt && vt > 0)
        {
            ratio = Math.Max(ratio, worstV / vt);
            if (worstV * RequiredAccuracyRatio > vt)
                problems.Add(Format($"the weakest mark's vertical 95 % accuracy ({worstV:F3} m) is not {RequiredAccuracyRatio:F0}× better than {vt:F3} m"));
        }
        if (!double.IsNaN(worstH) && undeclared > 0)
            problems.Add(Format($"{undeclared} paired mark(s) declare no sigmaH"));

        return problems.Count == 0
            ? new CheckResult(Id, CheckStatus.Pass, Format($"the marks are at least {RequiredAccuracyRatio:F0}× more accurate than the figure tested"), ratio, 1 / RequiredAccuracyRatio, "ratio")
            : new CheckResult(Id, CheckStatus.Warn, string.Join("; ", problems), double.IsNaN(worstH) ? null : ratio, 1 / RequiredAccuracyRatio, "ratio");
    }

}
