using System.Globalization;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// An ordered list of steps from one CRS to another, applied in place to a batch (<see cref="CoordinateBuffer"/>).
/// Its accuracy is the sum of the steps' stated accuracies (PROJ's rule for concatenated operations).
/// </summary>
public sealed class CoordinateOperation(CoordinateReferenceSystem source, CoordinateReferenceSystem target, IReadOnlyList<IOperationStep> steps)
{
    public CoordinateReferenceSystem Source => source;

    public CoordinateReferenceSystem Target => target;

    public IReadOnlyList<IOperationStep> Steps => steps;

    /// <summary>Sum of the steps' accuracies, metres.</summary>
    public double AccuracyMetres => steps.Sum(s => s.AccuracyMetres);

    /// <summary>True when a step's accuracy is not stated (a shift given with the CRS): <see cref="AccuracyMetres"/> then sums only the others.</summary>
    public bool AccuracyUnknown => steps.Any(s => s.AccuracyUnknown);

    /// <summary>True when a step depends on the observation epoch (a time-dependent Helmert).</summary>
    public bool UsesEpoch => steps.Any(s => s.UsesEpoch);

    /// <summary>True when no datum step is needed (same frame, only conversions and projections).</summary>
    public bool IsDatumFree => steps.All(s => s is InverseProjectionStep or ForwardProjectionStep or GeographicToGeocentricStep or GeocentricToGeographicStep);

    /// <summary>Transforms every point of the buffer in place.</summary>
    public void Execute(CoordinateBuffer points)
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
        return $"{source.Identifier} ({source.Name}) → {target.Identifier} ({target.Name}): {text}; {summary}{epoch}";
    }
}
