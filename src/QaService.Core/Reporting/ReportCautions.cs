namespace QaService.Core.Reporting;

/// <summary>The cautions every report carries, and those a given result adds.</summary>
public static class ReportCautions
{
    public static IReadOnlyList<string> Standing { get; } =
    [
        "This report is a statistical accuracy test of the submitted positions against the submitted check points. It is not a survey certification and does not replace one.",
        "Boundary, property-line and utility-locate decisions need a licensed surveyor and must follow local codes; before any excavation, follow the call-before-you-dig rules that apply where you work.",
        "The 95 % figures assume normally distributed errors without systematic offset; read them together with the checks below.",
        "The figures are only as good as the check points: they must be independent of the data tested and of clearly higher accuracy.",
    ];

    public static IReadOnlyList<string> For(Verdict verdict, int pairedCount, int minimumPoints)
    {
        var cautions = new List<string>(Standing);
        if (pairedCount < minimumPoints)
            cautions.Add($"Only {pairedCount} check points were tested; with fewer than {minimumPoints} the figures are indicative only.");
        if (verdict == Verdict.Inconclusive)
            cautions.Add("The verdict is inconclusive: do not cite these figures as a conformance claim.");
        return cautions;
    }
}
