using QaService.Core.Statistics;

namespace QaService.Core.Reporting.Plots;

/// <summary>
/// What the report's plots draw beyond the report's own fields, derived once from the report in Core so that
/// renderers only lay out. All lengths metres.
/// </summary>
/// <param name="Ellipse">The 95 % error ellipse of the included residuals; null with no horizontal block.</param>
/// <param name="ModelCdf">P(dH ≤ r) of the fitted zero-mean normal (the second-moment matrix), on a radius grid from 0.</param>
/// <param name="SortedHorizontalErrors">dH of the included residuals, ascending (the empirical distribution).</param>
/// <param name="Plan">Each mark's position on a local plan: east/north of the marks' mean position, metres.</param>
/// <param name="Flags">Per residual (same order as the report's), the ids of checks that are not <c>pass</c> and name its fix or mark.</param>
public sealed record PlotData(
    ErrorEllipse? Ellipse,
    IReadOnlyList<CdfPoint> ModelCdf,
    IReadOnlyList<double> SortedHorizontalErrors,
    IReadOnlyList<PlanPosition> Plan,
    IReadOnlyList<IReadOnlyList<string>> Flags);

/// <summary>One point of a cumulative distribution.</summary>
/// <param name="RadiusMetres">Horizontal error radius, metres.</param>
/// <param name="Probability">P(dH ≤ radius), in [0, 1].</param>
public sealed record CdfPoint(double RadiusMetres, double Probability);

/// <summary>A mark on the local plan.</summary>
/// <param name="Mark">Mark id.</param>
/// <param name="EastMetres">East of the plan origin, metres.</param>
/// <param name="NorthMetres">North of the plan origin, metres.</param>
public sealed record PlanPosition(string Mark, double EastMetres, double NorthMetres);
