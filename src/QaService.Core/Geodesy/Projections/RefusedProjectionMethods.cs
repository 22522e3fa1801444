namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// EPSG projection methods used by projected CRSs in the EPSG dataset (PROJ 9.1.1 proj.db, EPSG v10.076) that the
/// service does not implement, each with the reason, so a CRS using one is refused with words a user can act on.
/// Counts are of non-deprecated EPSG projected CRSs using the method.
/// </summary>
public static class RefusedProjectionMethods
{
    private const string NoOutsideCheck = "PROJ 9.1.1 does not implement it either, so there is nothing outside the service to test it against";
    private const string NotYet = "not implemented yet";

    /// <summary>EPSG method code → (EPSG name, WKT names seen in the wild, why it is refused).</summary>
    public static IReadOnlyDictionary<int, (string Name, string[] WktNames, string Reason)> All { get; } = new Dictionary<int, (string, string[], string)>
    {
        [9819] = ("Krovak", ["Krovak"], $"{NotYet} (oblique conformal conic on the Gauss sphere; 3 EPSG CRSs, S-JTSK)"),
        [1041] = ("Krovak (North Orientated)", ["Krovak North Orientated"], $"{NotYet} (3 EPSG CRSs, S-JTSK)"),
        [1042] = ("Krovak Modified", ["Krovak Modified"], $"{NotYet} (adds a 5th-order polynomial correction; 2 EPSG CRSs)"),
        [1043] = ("Krovak Modified (North Orientated)", ["Krovak Modified North Orientated"], $"{NotYet} (2 EPSG CRSs)"),
        [9818] = ("American Polyconic", ["American Polyconic", "Polyconic"], $"{NotYet} (4 EPSG CRSs)"),
        [9803] = ("Lambert Conic Conformal (2SP Belgium)", ["Lambert Conic Conformal 2SP Belgium", "Lambert_Conformal_Conic_2SP_Belgium"], $"{NotYet} (1 EPSG CRS, Belge 1972 / Belgian Lambert 72)"),
        [9830] = ("Polar Stereographic (variant C)", ["Polar Stereographic variant C"], NoOutsideCheck),
        [9813] = ("Laborde Oblique Mercator", ["Laborde Oblique Mercator"], $"{NotYet} (2 EPSG CRSs, Madagascar)"),
        [9828] = ("Bonne (South Orientated)", ["Bonne South Orientated"], $"{NotYet} (2 EPSG CRSs, Portugal)"),
        [9811] = ("New Zealand Map Grid", ["New Zealand Map Grid"], $"{NotYet} (1 EPSG CRS, superseded by NZTM)"),
        [9816] = ("Tunisia Mining Grid", ["Tunisia Mining Grid"], $"{NotYet} (a grid of named cells, not a map projection; 1 EPSG CRS)"),
        [9817] = ("Lambert Conic Near-Conformal", ["Lambert Conic Near Conformal"], $"{NotYet} (1 EPSG CRS)"),
        [9831] = ("Guam Projection", ["Guam Projection"], $"{NotYet} (1 EPSG CRS)"),
        [9832] = ("Modified Azimuthal Equidistant", ["Modified Azimuthal Equidistant"], $"{NotYet} (1 EPSG CRS)"),
        [9833] = ("Hyperbolic Cassini-Soldner", ["Hyperbolic Cassini-Soldner"], $"{NotYet} (1 EPSG CRS, Vanua Levu)"),
        [1111] = ("Transverse Mercator 3D", ["Transverse Mercator 3D"], $"{NotYet} (a 3D projected CRS with ellipsoidal height; 1 EPSG CRS)"),
    };
}
