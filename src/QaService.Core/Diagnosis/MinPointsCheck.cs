using System.Globalization;
using QaService.Core.Reporting;
using QaService.Core.Standards;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Enough check points for the standard: NSSDA asks for at least 20 (FGDC-STD-007.3-1998 §3.2.2;
/// check-values.md status M, corroborated by ASPRS Ed.2's "from 20 to 30"). With fewer the report is
/// inconclusive. Repeat occupations of one mark count as separate check points here, as each is an
/// independent test of the collection method; the distribution check looks at distinct marks.
/// </summary>
public sealed class MinPointsCheck : IDataCheck
{
    public string Id => "min-points";

    public CheckResult Evaluate(CheckContext context)
    {
        var n = context.Included.Count;
        var minimum = Nssda.MinimumCheckPoints;
        var message = n >= minimum
            ? string.Create(CultureInfo.InvariantCulture, $"{n} paired check points; NSSDA asks for at least {minimum}")
            : string.Create(CultureInfo.InvariantCulture, $"only {n} paired check points; NSSDA asks for at least {minimum}, so the figures cannot support a conformance claim");
        return new CheckResult(Id, n >= minimum ? CheckStatus.Pass : CheckStatus.Fail, message, n, minimum, "points");
    }
}
