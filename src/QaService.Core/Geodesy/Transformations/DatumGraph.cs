namespace QaService.Core.Geodesy.Transformations;

/// <summary>Where a datum step works: on geocentric X/Y/Z, on latitude/longitude, or on nothing (an equivalence).</summary>
public enum StepDomain
{
    None,
    Geographic,
    Geocentric,
}

/// <summary>One usable direction of a datum transformation.</summary>
/// <param name="SourceEllipsoid">For a geographic-domain step, the ellipsoid its input latitude/longitude refer to.</param>
/// <param name="TargetEllipsoid">For a geographic-domain step, the ellipsoid of its output.</param>
public sealed record DatumEdge(string FromDatum, string ToDatum, IOperationStep Step, StepDomain Domain,
    Ellipsoid? SourceEllipsoid = null, Ellipsoid? TargetEllipsoid = null);

/// <summary>An NTv2 grid between two datums, with the ellipsoids of its latitude/longitude and EPSG's accuracy.</summary>
public sealed record GridShiftDefinition(string SourceDatum, string TargetDatum, NtV2Grid Grid, Ellipsoid SourceEllipsoid,
    Ellipsoid TargetEllipsoid, double AccuracyMetres, string? Source = null);

/// <summary>
/// The datum transformations known to the service as a graph whose nodes are EPSG datum codes, searched
/// for the path with the smallest summed accuracy (the way PROJ states the accuracy of a concatenated
/// operation: the sum of its steps'), ties broken by fewer steps. Area of use is not considered: unlike PROJ,
/// the service never picks a different operation per point. Because of that, datum ensembles (WGS 84, ETRS89)
/// may only start or end a path: EPSG's null transformations to WGS 84 hold only inside their area of use
/// (ETRS89 → WGS 84 in Europe), so a world-wide route through one would borrow an accuracy it does not have.
/// </summary>
public sealed class DatumGraph
{
    private readonly Dictionary<string, List<DatumEdge>> _edges = new(StringComparer.Ordinal);
    private readonly IReadOnlyList<DatumTransformationDefinition> _helmerts;
    private readonly IReadOnlyList<FrameEquivalence> _equivalences;
    private readonly IReadOnlyList<GridShiftDefinition> _grids;

    /// <summary>EPSG datum ensembles: WGS 84 (EPSG:6326) and ETRS89 (EPSG:6258); endpoints only (see summary).</summary>
    private static readonly HashSet<string> EnsembleDatums = new(StringComparer.Ordinal) { "EPSG:6326", "EPSG:6258" };

    public DatumGraph(IEnumerable<DatumTransformationDefinition> helmerts, IEnumerable<FrameEquivalence> equivalences,
        IEnumerable<GridShiftDefinition> grids)
    {
        _helmerts = helmerts.ToList();
        _equivalences = equivalences.ToList();
        _grids = grids.ToList();
        foreach (var h in _helmerts)
        {
            Add(new DatumEdge(h.SourceDatum, h.TargetDatum, new HelmertStep(h, reversed: false), StepDomain.Geocentric));
            Add(new DatumEdge(h.TargetDatum, h.SourceDatum, new HelmertStep(h, reversed: true), StepDomain.Geocentric));
        }
        foreach (var e in _equivalences)
        {
            var step = new FrameEquivalenceStep(e);
            Add(new DatumEdge(e.FromDatum, e.ToDatum, step, StepDomain.None));
            Add(new DatumEdge(e.ToDatum, e.FromDatum, step, StepDomain.None));
        }
        foreach (var g in _grids)
        {
            Add(new DatumEdge(g.SourceDatum, g.TargetDatum, new GridShiftStep(g.Grid, false, g.AccuracyMetres, g.Source), StepDomain.Geographic, g.SourceEllipsoid, g.TargetEllipsoid));
            Add(new DatumEdge(g.TargetDatum, g.SourceDatum, new GridShiftStep(g.Grid, true, g.AccuracyMetres, g.Source), StepDomain.Geographic, g.TargetEllipsoid, g.SourceEllipsoid));
        }
    }

    /// <summary>The EPSG Helmert table and the service's frame equivalences (no grids: the catalog's datums need none).</summary>
    public static DatumGraph Default { get; } = new(HelmertTable.Transformations, FrameEquivalence.All, []);

    /// <summary>This graph with more grid shifts (e.g. a user's NTv2 file between two datums).</summary>
    public DatumGraph With(IEnumerable<GridShiftDefinition> grids) => new(_helmerts, _equivalences, _grids.Concat(grids));

    /// <summary>Edges of the cheapest path from one datum to another; empty when equal; null when unconnected.</summary>
    public IReadOnlyList<DatumEdge>? FindPath(string fromDatum, string toDatum)
    {
        if (string.Equals(fromDatum, toDatum, StringComparison.Ordinal))
            return [];
        var cost = new Dictionary<string, (double Accuracy, int Steps)>(StringComparer.Ordinal) { [fromDatum] = (0, 0) };
        var via = new Dictionary<string, DatumEdge>(StringComparer.Ordinal);
        var done = new HashSet<string>(StringComparer.Ordinal);
        while (true)
        {
            string? best = null;
            foreach (var (node, c) in cost)
            {
                if (!done.Contains(node) && (best is null || Better(c, cost[best])))
                    best = node;
            }
            if (best is null)
                return null;
            if (best == toDatum)
                break;
            done.Add(best);
            if (best != fromDatum && EnsembleDatums.Contains(best))
                continue;
            foreach (var edge in _edges.GetValueOrDefault(best) ?? [])
            {
                var next = (cost[best].Accuracy + edge.Step.AccuracyMetres, cost[best].Steps + 1);
                if (!cost.TryGetValue(edge.ToDatum, out var known) || Better(next, known))
                {
                    cost[edge.ToDatum] = next;
                    via[edge.ToDatum] = edge;
                }
            }
        }
        var path = new List<DatumEdge>();
        for (var node = toDatum; node != fromDatum; node = via[node].FromDatum)
            path.Add(via[node]);
        path.Reverse();
        return path;
    }

    private static bool Better((double Accuracy, int Steps) a, (double Accuracy, int Steps) b) =>
        a.Accuracy < b.Accuracy - 1e-9 || (Math.Abs(a.Accuracy - b.Accuracy) <= 1e-9 && a.Steps < b.Steps);

    private void Add(DatumEdge edge)
    {
        if (!_edges.TryGetValue(edge.FromDatum, out var list))
            _edges[edge.FromDatum] = list = [];
        list.Add(edge);
    }
}
