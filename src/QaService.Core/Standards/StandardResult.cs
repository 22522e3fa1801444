namespace QaService.Core.Standards;

/// <summary>One figure a standard reports, with its requirement when the spec gives one.</summary>
/// <param name="Name">Figure id as the standard names it, e.g. <c>RMSE_H</c>, <c>CE90</c>, <c>share over tolerance</c>.</param>
/// <param name="Axis"><c>horizontal</c>, <c>vertical</c> or <c>3d</c>.</param>
/// <param name="Value">The tested value, in <paramref name="Unit"/>.</param>
/// <param name="Unit"><c>m</c> or <c>share</c> (a fraction of the check points, 0–1).</param>
/// <param name="Required">The limit from the spec, same unit; null when none was given.</param>
/// <param name="Met">Value ≤ Required; null without a requirement.</param>
/// <param name="Judged">Whether the verdict rests on this figure (others are shown for information).</param>
/// <param name="Note">What the figure is, and its source.</param>
public sealed record StandardFigure(string Name, string Axis, double Value, string Unit, double? Required, bool? Met, bool Judged, string Note)
{
    /// <summary>Upper confidence bound of <see cref="Value"/> at the spec's confidence; null when no confidence was asked.</summary>
    public double? UpperBound { get; init; }

    /// <summary>UpperBound ≤ Required; null when not judged at a confidence.</summary>
    public bool? MetAtConfidence { get; init; }
}

/// <summary>
/// The selected standard's own figures and reporting statement (report block <c>standard</c>).
/// </summary>
/// <param name="Id">Request id: <c>nssda</c>, <c>asprs-2023</c>, <c>nmas-1947</c>, <c>nga-ce90</c>.</param>
/// <param name="Name">Full title of the standard.</param>
/// <param name="Edition">Edition or year, e.g. "FGDC-STD-007.3-1998", "Edition 2, Version 1.0 (August 2023)".</param>
/// <param name="MinimumPoints">Fewest check points the standard asks for.</param>
/// <param name="Figures">The figures, judged ones first.</param>
/// <param name="Statement">The standard's reporting sentence for these figures, in the unit of the marks' CRS.</param>
/// <param name="Notes">Scope limits and what is taken from memory rather than the standard's text.</param>
public sealed record StandardResult(string Id, string Name, string Edition, int MinimumPoints, IReadOnlyList<StandardFigure> Figures, string Statement, IReadOnlyList<string> Notes)
{
    /// <summary>All judged horizontal figures met; null when none had a requirement.</summary>
    public bool? HorizontalMet => Combine("horizontal");

    /// <summary>All judged vertical figures met; null when none had a requirement.</summary>
    public bool? VerticalMet => Combine("vertical");

    private bool? Combine(string axis)
    {
        var judged = Figures.Where(f => f.Judged && f.Axis == axis && f.Met is not null).ToList();
        return judged.Count == 0 ? null : judged.All(f => f.Met == true);
    }
}
