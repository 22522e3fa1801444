using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// One EPSG NTv2 grid transformation (method 9615) whose grid file PROJ's data package ships, as the generated
/// <see cref="GridTable"/> lists it. The file is read at run time from <see cref="GridFiles.Directory"/>.
/// </summary>
/// <param name="EpsgCode">EPSG transformation code, e.g. 15948.</param>
/// <param name="Name">EPSG name, e.g. "DHDN to ETRS89 (8)".</param>
/// <param name="SourceDatum">EPSG datum code of the source frame, e.g. "EPSG:6314".</param>
/// <param name="TargetDatum">EPSG datum code of the target frame.</param>
/// <param name="AccuracyMetres">Accuracy EPSG states, metres.</param>
/// <param name="FileName">The grid file's name in PROJ's data folder (Debian's spelling, e.g. "BETA2007.gsb").</param>
/// <param name="FileIsInverse">True when the file shifts target → source (proj.db grid_alternatives.inverse_direction).</param>
/// <param name="Package">Debian package that ships the file.</param>
/// <param name="SourceEllipsoid">Ellipsoid of the source datum (the grid's input latitude/longitude).</param>
/// <param name="TargetEllipsoid">Ellipsoid of the target datum.</param>
/// <param name="Area">EPSG area of use.</param>
public sealed record GridTransformationDefinition(
    int EpsgCode, string Name, string SourceDatum, string TargetDatum, double AccuracyMetres, string FileName, bool FileIsInverse,
    string Package, Ellipsoid SourceEllipsoid, Ellipsoid TargetEllipsoid, AreaOfUse Area);
