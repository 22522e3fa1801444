using QaService.Core.Geodesy.Catalog;

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
    Ellipsoid? SourceEllipsoid = null, Ellipsoid? TargetEllipsoid = null)
{
    /// <summary>EPSG code of the transformation; 0 for the service's equivalences and a user's own grid.</summary>
    public int OperationCode { get; init; }

    /// <summary>EPSG name of the transformation, e.g. "DHDN to ETRS89 (8)".</summary>
    public string OperationName { get; init; } = "";

    /// <summary>EPSG area of use; null when none is stated (valid everywhere the datums are).</summary>
    public AreaOfUse? Area { get; init; }

    /// <summary>The PROJ grid file the step reads, when it is one of <see cref="GridTable"/>'s.</summary>
    public GridTransformationDefinition? GridFile { get; init; }
}

/// <summary>The chosen datum path, or why there is none; <paramref name="ProblemIsOperationCode"/> when the user's operationCode is at fault.</summary>
public sealed record DatumRoute(IReadOnlyList<DatumEdge>? Path, string? Problem, bool ProblemIsOperationCode = false);

/// <summary>An NTv2 grid between two datums, with the ellipsoids of its latitude/longitude and EPSG's accuracy.</summary>
public sealed record GridShiftDefinition(string SourceDatum, string TargetDatum, NtV2Grid Grid, Ellipsoid SourceEllipsoid,
    Ellipsoid TargetEllipsoid, double AccuracyMetres, string? Source = null);

/// <summary>
/// The datum transformations known to the service as a graph whose nodes are EPSG datum codes, searched
/// for the path with the smallest summed accuracy (the way PROJ states the accuracy of a concatenated
/// operation: the sum of its steps'), ties broken by fewer steps. Given the points' box, only operations whose
/// EPSG area of use contains it are tried first, then those that intersect it, then all (as PROJ's
/// <c>--spatial-test intersects</c> prefers operations covering the area of interest); one operation serves the
/// whole batch (PROJ may pick one per point), and points outside its area are warned about by the caller. Datum ensembles (WGS 84, ETRS89)
/// may only start or end a path: EPSG's null transformations to WGS 84 hold only inside their area of use
/// (ETRS89 → WGS 84 in Europe), so a world-wide route through one would borrow an accuracy it does not have.
/// </summary>
public sealed class DatumGraph
{
    private readonly Dictionary<string, List<DatumEdge>> _edges = new(StringComparer.Ordinal);
    private readonly IReadOnlyList<DatumTransformationDefinition> _helmerts;
    private readonly IReadOnlyList<FrameEquivalence> _equivalences;
    private readonly IReadOnlyList<GridShiftDefinition> _grids;
    private readonly IReadOnlyList<GridTransformationDefinition> _gridFiles;

    /// <summary>EPSG datum ensembles: WGS 84 (EPSG:6326) and ETRS89 (EPSG:6258); endpoints only (see summary).</summary>
    private static readonly HashSet<string> EnsembleDatums = new(StringComparer.Ordinal) { "EPSG:6326", "EPSG:6258" };

    /// <summary>
    /// The frames a path may pass through (tools/geodesy/datum_scope.py HUBS and every ITRF): WGS 84 realisations,
    /// ITRF, ETRF, NAD83, NAD83(2011), NAD83(CSRS), GDA94, GDA2020. Every other datum (a national datum such as DHDN, or
    /// an intermediate frame such as "IG05/12 Intermediate") may only start or end a path: its transformations hold
    /// in one country, so a detour through it would borrow an accuracy the path does not have elsewhere.
    /// </summary>
    private static readonly HashSet<string> ThoroughfareDatums = new(
        new[] { 1166, 1152, 1153, 1154, 1155, 1156, 1309, 6656, 6896, 1061, 1165, 1322, 6647, 6648, 6649, 6650, 6651, 6652, 6653, 6654, 6655,
            1178, 1179, 1180, 1181, 1182, 1183, 1184, 1185, 1186, 1204, 1206, 6269, 1116, 6140, 6283, 1168 }
        .Select(c => InvariantText.Format($"EPSG:{c}")), StringComparer.Ordinal);

    /// <summary>True when a path may pass through the datum (not only start or end there).</summary>
    private static bool IsThoroughfare(string datum) => ThoroughfareDatums.Contains(datum);

    public DatumGraph(IEnumerable<DatumTransformationDefinition> helmerts, IEnumerable<FrameEquivalence> equivalences,
        IEnumerable<GridShiftDefinition> grids, IEnumerable<GridTransformationDefinition>? gridFiles = null)
    {
        _helmerts = helmerts.ToList();
        _gridFiles = (gridFiles ?? []).ToList();
        foreach (var g in _gridFiles)
        {
            Add(new DatumEdge(g.SourceDatum, g.TargetDatum, new GridFileShiftStep(g, reversed: false), StepDomain.Geographic, g.SourceEllipsoid, g.TargetEllipsoid)
                { OperationCode = g.EpsgCode, OperationName = g.Name, Area = g.Area, GridFile = g });
            Add(new DatumEdge(g.TargetDatum, g.SourceDatum, new GridFileShiftStep(g, reversed: true), StepDomain.Geographic, g.TargetEllipsoid, g.SourceEllipsoid)
                { OperationCode = g.EpsgCode, OperationName = g.Name, Area = g.Area, GridFile = g });
        }
        _equivalences = equivalences.ToList();
        _grids = grids.ToList();
        foreach (var h in _helmerts)
        {
            Add(new DatumEdge(h.SourceDatum, h.TargetDatum, new HelmertStep(h, reversed: false), StepDomain.Geocentric) { OperationCode = h.EpsgCode, OperationName = h.Name, Area = h.Area });
            Add(new DatumEdge(h.TargetDatum, h.SourceDatum, new HelmertStep(h, reversed: true), StepDomain.Geocentric) { OperationCode = h.EpsgCode, OperationName = h.Name, Area = h.Area });
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

    /// <summary>The EPSG Helmert table, the EPSG NTv2 operations whose grids PROJ's data package ships, and the service's frame equivalences.</summary>
    public static DatumGraph Default { get; } = new(HelmertTable.Transformations, FrameEquivalence.All, [], GridTable.Transformations);

    /// <summary>This graph with more grid shifts (e.g. a user's NTv2 file between two datums).</summary>
    public DatumGraph With(IEnumerable<GridShiftDefinition> grids) => new(_helmerts, _equivalences, _grids.Concat(grids), _gridFiles) { GridLocator = GridLocator };

    /// <summary>Finds a grid file's path, null when absent (tests replace it to simulate a machine without proj-data).</summary>
    public Func<string, string?> GridLocator { get; init; } = GridFiles.Find;

    /// <summary>True when an EPSG transformation of this code is an edge of the graph.</summary>
    public bool Knows(int operationCode) => _edges.Values.Any(list => list.Any(e => e.OperationCode == operationCode));

    /// <summary>The other operations EPSG gives between the same two datums (same direction), best accuracy first.</summary>
    public IReadOnlyList<DatumEdge> Alternatives(DatumEdge chosen) =>
        (_edges.GetValueOrDefault(chosen.FromDatum) ?? [])
        .Where(e => e.ToDatum == chosen.ToDatum && e.OperationCode != 0 && e.OperationCode != chosen.OperationCode)
        .OrderBy(e => e.Step.AccuracyMetres).ThenBy(e => e.OperationCode).ToList();

    /// <summary>
    /// The path the planner uses: through the operation <paramref name="operationCode"/> when given (either direction),
    /// else the cheapest whose areas fit <paramref name="pointsBox"/> best (see the class summary). A path that needs a
    /// grid file missing from <see cref="GridFiles.Directory"/> is refused with the file, its Debian package and the best
    /// path without it.
    /// </summary>
    public DatumRoute Route(string fromDatum, string toDatum, AreaOfUse? pointsBox = null, int? operationCode = null)
    {
        IReadOnlyList<DatumEdge>? path;
        if (operationCode is { } code)
        {
            if (!Knows(code))
                return new DatumRoute(null, InvariantText.Format($"EPSG:{code} is not a datum transformation the service knows (EPSG Helmert or NTv2 with a grid in proj-data between its datums)"), true);
            path = Through(fromDatum, toDatum, code);
            if (path is null)
                return new DatumRoute(null, InvariantText.Format($"EPSG:{code} does not join {fromDatum} and {toDatum}: no path through it exists"), true);
        }
        else
        {
            path = FindPath(fromDatum, toDatum, pointsBox);
            if (path is null)
                return new DatumRoute(null, null);
        }
        if (path.FirstOrDefault(e => e.GridFile is not null && GridLocator(e.GridFile.FileName) is null) is { } missing)
        {
            var without = FindPath(fromDatum, toDatum, pointsBox, e => e.GridFile is null || GridLocator(e.GridFile.FileName) is not null);
            var hint = without?.FirstOrDefault(e => e.OperationCode != 0) is { } other
                ? InvariantText.Format($"; or choose another operation with operationCode, e.g. {other.OperationCode} (EPSG:{other.OperationCode} \"{other.OperationName}\", {other.Step.AccuracyMetres:0.###} m)")
                : "";
            return new DatumRoute(null, InvariantText.Format($"EPSG:{missing.OperationCode} \"{missing.OperationName}\" needs the grid file {missing.GridFile!.FileName}, which is not in {GridFiles.Directory}: install the Debian package {missing.GridFile.Package} or set Geodesy:GridDirectory to a folder holding it{hint}"), operationCode is not null);
        }
        return new DatumRoute(path, null);
    }

    /// <summary>Edges of the cheapest path from one datum to another (area preference as in the class summary); empty when equal; null when unconnected.</summary>
    private IReadOnlyList<DatumEdge>? FindPath(string fromDatum, string toDatum, AreaOfUse? pointsBox = null, Func<DatumEdge, bool>? allowed = null)
    {
        allowed ??= _ => true;
        if (pointsBox is null)
            return Search(fromDatum, toDatum, allowed);
        return Search(fromDatum, toDatum, e => allowed(e) && (e.Area is null || e.Area.Contains(pointsBox)))
            ?? Search(fromDatum, toDatum, e => allowed(e) && (e.Area is null || e.Area.Intersects(pointsBox)))
            ?? Search(fromDatum, toDatum, allowed);
    }

    /// <summary>The cheapest path that uses the operation <paramref name="code"/> once, in whichever direction is cheaper.</summary>
    private IReadOnlyList<DatumEdge>? Through(string fromDatum, string toDatum, int code)
    {
        IReadOnlyList<DatumEdge>? best = null;
        foreach (var edge in _edges.Values.SelectMany(l => l).Where(e => e.OperationCode == code))
        {
            // The chosen operation's own ends obey the thoroughfare rule too (a user's pick is no licence for a detour).
            if ((edge.FromDatum != fromDatum && !IsThoroughfare(edge.FromDatum)) || (edge.ToDatum != toDatum && !IsThoroughfare(edge.ToDatum)))
                continue;
            bool Other(DatumEdge e) => e.OperationCode != code;
            var head = Search(fromDatum, edge.FromDatum, Other);
            var tail = Search(edge.ToDatum, toDatum, Other);
            if (head is null || tail is null)
                continue;
            var path = head.Append(edge).Concat(tail).ToList();
            // A path that visits a datum twice is a loop (possible when EPSG states accuracy 0 and sums tie): not a route.
            if (path.Select(e => e.ToDatum).Append(fromDatum).Distinct(StringComparer.Ordinal).Count() != path.Count + 1)
                continue;
            if (best is null || Better((path.Sum(e => e.Step.AccuracyMetres), path.Count), (best.Sum(e => e.Step.AccuracyMetres), best.Count)))
                best = path;
        }
        return best;
    }

    private IReadOnlyList<DatumEdge>? Search(string fromDatum, string toDatum, Func<DatumEdge, bool> allowed)
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
            if (best != fromDatum && (EnsembleDatums.Contains(best) || !IsThoroughfare(best)))
                continue;
            foreach (var edge in _edges.GetValueOrDefault(best) ?? [])
            {
                if (!allowed(edge))
                    continue;
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
