using QaService.Core.Assessment;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;

namespace QaService.Core.Transform;

/// <summary>
/// A finished batch: the target coordinates in request order as parallel arrays (no object per point),
/// which of them carry a height, the operation text and its accuracy.
/// </summary>
public sealed record TransformResult(
    CoordinateReferenceSystem Source,
    CoordinateReferenceSystem Target,
    CoordinateBuffer Points,
    bool[] HasHeight,
    string Operation,
    double AccuracyMetres)
{
    /// <summary>Points outside an area of use of the source CRS, a datum step or the target CRS (request indexes).</summary>
    public IReadOnlyList<AreaWarning> Warnings { get; init; } = [];
}

/// <summary>Either a result or the input errors (JSON pointers) that stop it.</summary>
public sealed record TransformOutcome(TransformResult? Result, IReadOnlyList<InputError> Errors);
