using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Assessment;

/// <summary>Says in words how marks and fixes were brought into one frame.</summary>
public static class FrameDescription
{
    public static Reporting.FrameSummary Describe(ValidatedAssessment input)
    {
        var marks = input.MarksFrame;
        var fixes = input.FixesFrame;
        var steps = new List<string>();
        foreach (var (side, frame) in new[] { ("marks", marks), ("fixes", fixes) })
        {
            if (frame.Crs.Kind == CrsKind.Projected)
                steps.Add($"{side}: inverse {frame.Crs.Projection!.MethodName} ({frame.Crs.Name}) to latitude/longitude");
            if (frame.Crs.Kind == CrsKind.Geocentric)
                steps.Add($"{side}: geocentric X/Y/Z to latitude/longitude/height");
        }
        steps.Add(input.FrameOperation ?? "fixes are in the marks' frame: no transformation");
        steps.Add("residuals: fix − mark as geocentric vectors, rotated into east-north-up at each mark (EPSG Guidance Note 7-2 §4.1.2)");
        if (marks.Heights == HeightReference.Orthometric && fixes.Heights == HeightReference.Orthometric)
            steps.Add($"heights: both orthometric on {marks.Geoid}, both turned into ellipsoidal heights with it (the geoid cancels between a fix and its mark)");

        return new Reporting.FrameSummary(
            $"{marks.Crs.Identifier} ({marks.Crs.Name})",
            $"{fixes.Crs.Identifier} ({fixes.Crs.Name})",
            $"marks {Heights(marks)}, fixes {Heights(fixes)}",
            string.Join("; ", steps));
    }

    private static string Heights(PointSetFrame frame) => frame.Heights switch
    {
        HeightReference.Orthometric => $"orthometric ({frame.Geoid})",
        HeightReference.None => "none",
        _ => frame.HeightsStated ? "ellipsoidal" : "ellipsoidal (not stated; default)",
    };
}
