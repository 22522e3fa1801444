using System.Globalization;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// An ordered list of steps from one CRS to another, applied in place to a batch (<see cref="CoordinateBuffer"/>).
/// Its accuracy is the sum of the steps' stated accuracies (PROJ's rule for concatenated operations).
/// </summary>
public sealed class CoordinateOperation(CoordinateReferenceSystem source, CoordinateReferenceSystem target, IReadOnlyList<IOperationStep> steps)
{
    /// <summary>How many unchosen operations per datum pair <c>operation</c> names.</summary>
    private const int MaximumAlternativesListed = 5;

    public CoordinateReferenceSystem Source => source;

    public CoordinateReferenceSystem Target => target;

    public IReadOnlyList<IOperationStep> Steps => steps;

    /// <summary>The datum transformations of the path, in order (each with its EPSG code, name and area).</summary>
    public IReadOnlyList<DatumEdge> DatumEdges { get; init; } = [];

    /// <summary>For each EPSG datum step, the other EPSG operations between the same two datums (not chosen).</summary>
    public IReadOnlyDictionary<DatumEdge, IReadOnlyList<DatumEdge>> Alternatives { get; init; } = new Dictionary<DatumEdge, IReadOnlyList<DatumEdge>>();

    /// <summary>
    /// Which points lie outside an area of use: the source CRS's, each EPSG datum step's, the target CRS's. Tested on the
    /// points' latitude/longitude in the source datum (datum shifts move them by metres to hundreds of metres, far less than
    /// an area's edge is known to). Empty when every point is inside every area.
    /// </summary>
    public IReadOnlyList<AreaWarning> OutsideAreas(ReadOnlySpan<double> latitudesDegrees, ReadOnlySpan<double> longitudesDegrees)
    {
        var areas = new List<(string What, AreaOfUse Area)>();
        if (source.AreaOfUse is { } sourceArea)
            areas.Add(($"the source CRS {source.Identifier}", sourceArea));
        foreach (var edge in DatumEdges.Where(e => e.Area is not null))
            areas.Add(($"the operation EPSG:{edge.OperationCode} \"{edge.OperationName}\"", edge.Area!));
        if (target.AreaOfUse is { } targetArea)
            areas.Add(($"the target CRS {target.Identifier}", targetArea));
        var warnings = new List<AreaWarning>();
        foreach (var (what, area) in areas)
        {
            var outside = new List<int>();
            for (var i = 0; i < latitudesDegrees.Length; i++)
            {
                if (double.IsFinite(latitudesDegrees[i]) && area.DegreesOutside(latitudesDegrees[i], longitudesDegrees[i]) > 0)
                    outside.Add(i);
            }
            if (outside.Count > 0)
                warnings.Add(new AreaWarning("outside-area-of-use",
                    InvariantText.Format($"{outside.Count} of {latitudesDegrees.Length} points lie outside the area of use of {what} ({area.Name}: latitude {area.SouthDegrees}..{area.NorthDegrees}, longitude {area.WestDegrees}..{area.EastDegrees}); the result there is an extrapolation EPSG does not vouch for"),
                    outside));
        }
        return warnings;
    }

    /// <summary>Sum of the steps' accuracies, metres.</summary>
    public double AccuracyMetres => steps.Sum(s => s.AccuracyMetres);

    /// <summary>True when a step's accuracy is not stated (a shift given with the CRS): <see cref="AccuracyMetres"/> then sums only the others.</summary>
    public bool AccuracyUnknown => steps.Any(s => s.AccuracyUnknown);

    /// <summary>True when a step depends on the observation epoch (a time-dependent Helmert).</summary>
    public bool UsesEpoch => steps.Any(s => s.UsesEpoch);

    /// <summary>True when no datum step is needed (same frame, only conversions and projections).</summary>
    public bool IsDatumFree => steps.All(s => s is InverseProjectionStep or ForwardProjectionStep or GeographicToGeocentricStep or GeocentricToGeographicStep);

    /// <summary>
    /// Transforms every point of the buffer in place. Each point is carried on its own (no step reads another point), so
    /// a large batch is cut into ranges that run side by side, each through all the steps on its own copy: the same
    /// bits as one pass, whatever the scheduling.
    /// </summary>
    public void Execute(CoordinateBuffer points)
    {
        if (points.Count < 2 * ParallelWork.MinimumRange || steps.Count == 0)
        {
            ExecuteInPlace(points);
            return;
        }
        ParallelWork.ForRanges(points.Count, (start, end) =>
        {
            var range = points.Copy(start, end - start);
            ExecuteInPlace(range);
            range.CopyTo(points, start);
        });
    }

    private void ExecuteInPlace(CoordinateBuffer points)
    {
        foreach (var step in steps)
            step.Apply(points);
    }

    /// <summary>The steps in words, numbered, each with its accuracy, then the total and the epoch used.</summary>
    /// <param name="epochNote">How the observation epoch was chosen (used only when a step depends on it).</param>
    public string Describe(string? epochNote)
    {
        if (steps.Count == 0)
            return $"none: {source.Identifier} and {target.Identifier} are the same coordinates";
        var text = string.Join("; ", steps.Select((s, i) => string.Create(CultureInfo.InvariantCulture, $"{i + 1}. {s.Description}")));
        var summary = IsDatumFree
            ? (steps.Any(s => s is InverseProjectionStep or ForwardProjectionStep) ? "projection only, same datum" : "conversion only, same datum")
            : AccuracyUnknown
                ? string.Create(CultureInfo.InvariantCulture, $"accuracy unknown: a shift given with the CRS states none (the other steps' stated accuracies sum to {AccuracyMetres:0.###} m)")
                : string.Create(CultureInfo.InvariantCulture, $"accuracy {AccuracyMetres:0.###} m (sum of the steps' stated accuracies)");
        var epoch = UsesEpoch ? $"; observation epoch: {epochNote ?? "none given, so the time-dependent steps are evaluated at their reference epochs (as PROJ's cs2cs does)"}" : "";
        return $"{source.Identifier} ({source.Name}) → {target.Identifier} ({target.Name}): {text}; {summary}{epoch}{DescribeChoice()}";
    }

    /// <summary>Names the operations not chosen where EPSG offers several between a pair, and how to pick one.</summary>
    private string DescribeChoice()
    {
        var parts = Alternatives.Where(a => a.Value.Count > 0).Select(a =>
            InvariantText.Format($"between {a.Key.FromDatum} and {a.Key.ToDatum} EPSG:{a.Key.OperationCode} was chosen (best stated accuracy among those whose area covers the points) over ") +
            string.Join(", ", a.Value.Take(MaximumAlternativesListed).Select(e => InvariantText.Format($"EPSG:{e.OperationCode} \"{e.OperationName}\" ({e.Step.AccuracyMetres:0.###} m, {e.Area?.Name ?? "no stated area"})"))) +
            (a.Value.Count > MaximumAlternativesListed ? InvariantText.Format($" and {a.Value.Count - MaximumAlternativesListed} more") : "")).ToList();
        return parts.Count == 0 ? "" : "; " + string.Join("; ", parts) + "; another can be chosen with operationCode";
    }
}

/// <summary>Points (request indexes) outside an area of use, with the area named.</summary>
public sealed record AreaWarning(string Code, string Message, IReadOnlyList<int> PointIndexes);
