namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// Sign convention of the Helmert rotations (EPSG Guidance Note 7-2 (IOGP 373-7-2) §4.3.3). The same
/// three numbers rotate the other way in the other convention — the classic sign error.
/// </summary>
public enum HelmertConvention
{
    /// <summary>Position vector (EPSG methods 1033, 1037, 9606; time-dependent 1053): rotates the position vector (IERS, PROJ <c>+convention=position_vector</c>).</summary>
    PositionVector,

    /// <summary>Coordinate frame rotation (EPSG methods 1032, 1038, 9607; time-dependent 1056): rotates the axes (PROJ <c>+convention=coordinate_frame</c>).</summary>
    CoordinateFrame,
}
