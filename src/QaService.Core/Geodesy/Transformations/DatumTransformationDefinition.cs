using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// One EPSG datum transformation between two geodetic frames, as the generated <see cref="HelmertTable"/>
/// lists it: it may be applied forward (source → target) or reversed.
/// </summary>
/// <param name="EpsgCode">EPSG transformation code, e.g. 8970; 0 for the service's own frame equivalences.</param>
/// <param name="Name">EPSG name, e.g. "ITRF2014 to NAD83(2011) (1)".</param>
/// <param name="MethodCode">EPSG method code (1032/1033/1053/1056/9603/9606/9607…); 0 for an equivalence.</param>
/// <param name="SourceDatum">EPSG datum code of the source frame, e.g. "EPSG:1165".</param>
/// <param name="TargetDatum">EPSG datum code of the target frame.</param>
/// <param name="AccuracyMetres">Accuracy EPSG states for the transformation, metres.</param>
/// <param name="Parameters">The Helmert parameters.</param>
/// <param name="Area">EPSG area of use of the transformation; null when none is stated (the service's own entries).</param>
public sealed record DatumTransformationDefinition(
    int EpsgCode, string Name, int MethodCode, string SourceDatum, string TargetDatum, double AccuracyMetres, HelmertParameters Parameters,
    AreaOfUse? Area = null);
