using System.Globalization;
using QaService.Core.Reporting;
using QaService.Core.Standards;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Enough check points for the standard: NSSDA asks for at least 20 (FGDC-STD-007.3-1998 §3.2.2;
/// check-values.md status M, corroborated by ASPRS Ed.2's "from 20 to 30"). With fewer the report is
/// inconclusive. ASPRS Edition 2 (2023) asks for at least 30 (its change list, V2). Repeat occupations of one mark count as separate check points here, as each is an
/// independent test of the collection method; the distribution check looks at distinct marks.
/// </summary>
public sealed class MinPointsCheck : IDataCheck
{
    public string Id => "min-points";

    public CheckResult Evaluate(CheckContext context)
    {
        var n = context.Included.Count;
        var standard = context.Input.Spec?.Standard ?? AccuracyStandards.NssdaId;
        var minimum = AccuracyStandards.MinimumPoints(standard);
        var name = standard == AccuracyStandards.AsprsId ? "ASPRS Edition 2" : standard == AccuracyStandards.NmasId ? "NMAS testing" : "NSSDA";
        var message = n >= minimum
            ? string.Create(CultureInfo.InvariantCulture, $"{n} paired check points; {name} asks for at least {minimum}")
            : string.Create(CultureInfo.InvariantCulture, $"only {n} paired check points; {name} asks for at least {minimum}, so the figures cannot support a conformance claim. Add {minimum - n} well-distributed check point(s)");
        return new CheckResult(Id, n >= minimum ? CheckStatus.Pass : CheckStatus.Fail, message, n, minimum, "points");
    }
}
