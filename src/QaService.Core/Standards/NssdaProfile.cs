namespace QaService.Core.Standards;

/// <summary>
/// FGDC-STD-007.3-1998 (NSSDA) as a selectable profile: the contract's nssda95 figures judged against spec.horizontal
/// and spec.vertical (both "required accuracy at 95 % confidence", metres) and the §3.2.3 reporting sentence.
/// </summary>
public static class NssdaProfile
{
    public static StandardResult Evaluate(StandardInput input)
    {
        var figures = new List<StandardFigure>();
        if (input.Horizontal is { } h)
            figures.Add(AccuracyStandards.Figure("Accuracy_r", "horizontal", h.Nssda95, input.RequiredHorizontalMetres, true,
                $"NSSDA horizontal accuracy at 95 % ({h.NssdaMethod}), FGDC-STD-007.3-1998 appendix 3-A"));
        if (input.Vertical is { } v)
            figures.Add(AccuracyStandards.Figure("Accuracy_z", "vertical", v.Nssda95, input.RequiredVerticalMetres, true,
                "NSSDA vertical accuracy at 95 % = 1.9600·RMSE_z, appendix 3-A"));
        return new StandardResult(AccuracyStandards.NssdaId, "National Standard for Spatial Data Accuracy", "FGDC-STD-007.3-1998",
            Nssda.MinimumCheckPoints, figures, NssdaStatement.Compose(input.Horizontal, input.Vertical, input.Unit),
            ["The standard sets no thresholds; the spec's figures are the agency's (§3.1).",
             "Section numbers and the statement's wording from memory (check-values.md §1, status M)."]);
    }
}
