using System.Globalization;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>One plate's Euler pole as rotation rates about the geocentric X/Y/Z axes, arc-seconds per year.</summary>
public sealed record PlateRotation(string Plate, double RxArcSecondsPerYear, double RyArcSecondsPerYear, double RzArcSecondsPerYear);

/// <summary>
/// A published plate motion model: per plate, the rotation rate ω of the plate in the ITRF, so a point on it moves with
/// v = ω × X (position-vector convention; PROJ's <c>+proj=helmert +drx +dry +drz +convention=position_vector</c>
/// with <c>+t_epoch</c> = the epoch the coordinates are at and the target epoch as the point's time does the same).
/// Units: ω in arc-seconds/year (the papers give mas/yr; PROJ's data files arc-seconds/yr), X in metres, v in m/yr.
/// Valid for points on the plate's stable interior; deforming zones (plate boundaries) move otherwise — use
/// per-mark velocities there. The models' origin-rate term (a few tenths of mm/yr) is left out, as PROJ's plain
/// plate entries do.
/// </summary>
public sealed class PlateMotionModel
{
    private readonly Dictionary<string, PlateRotation> _plates;

    private PlateMotionModel(string id, string citation, IEnumerable<PlateRotation> plates)
    {
        Id = id;
        Citation = citation;
        _plates = plates.ToDictionary(p => p.Plate, StringComparer.OrdinalIgnoreCase);
    }

    /// <summary>Request name, e.g. "itrf2020-pmm".</summary>
    public string Id { get; }

    /// <summary>The paper and where the numbers were taken from.</summary>
    public string Citation { get; }

    /// <summary>Plate abbreviations the model has, e.g. EURA, NOAM.</summary>
    public IReadOnlyCollection<string> Plates => _plates.Keys;

    /// <summary>
    /// ITRF2014-PMM: Z. Altamimi, L. Métivier, P. Rebischung, H. Rouby, X. Collilieux (2017), "ITRF2014 plate motion
    /// model", Geophysical Journal International 209(3), 1906–1912, doi:10.1093/gji/ggx136. Rates as Debian proj-data
    /// 9.1.1 lists them in /usr/share/proj/ITRF2014 (which cites that doi); page range from memory.
    /// </summary>
    public static PlateMotionModel Itrf2014 { get; } = new("itrf2014-pmm",
        "ITRF2014-PMM, Altamimi et al. (2017), Geophys. J. Int. 209(3), doi:10.1093/gji/ggx136 (rates as in PROJ 9.1.1's ITRF2014 file)",
        [
            new("ANTA", -0.000248, -0.000324, 0.000675), new("ARAB", 0.001154, -0.000136, 0.001444),
            new("AUST", 0.001510, 0.001182, 0.001215), new("EURA", -0.000085, -0.000531, 0.000770),
            new("INDI", 0.001154, -0.000005, 0.001454), new("NAZC", -0.000333, -0.001544, 0.001623),
            new("NOAM", 0.000024, -0.000694, -0.000063), new("NUBI", 0.000099, -0.000614, 0.000733),
            new("PCFC", -0.000409, 0.001047, -0.002169), new("SOAM", -0.000270, -0.000301, -0.000140),
            new("SOMA", -0.000121, -0.000794, 0.000884),
        ]);

    /// <summary>
    /// ITRF2020-PMM: Z. Altamimi, L. Métivier, P. Rebischung, X. Collilieux, K. Chanard, J. Barnéoud (2023), "ITRF2020
    /// plate motion model", Geophysical Research Letters 50, e2023GL106373, doi:10.1029/2023GL106373 (not JGR Solid
    /// Earth). Rates as PROJ's data/ITRF2020 file (PROJ ≥ 9.2, OSGeo/PROJ on GitHub) lists them, citing that doi; the
    /// author list is from memory.
    /// </summary>
    public static PlateMotionModel Itrf2020 { get; } = new("itrf2020-pmm",
        "ITRF2020-PMM, Altamimi et al. (2023), Geophys. Res. Lett. 50, e2023GL106373, doi:10.1029/2023GL106373 (rates as in PROJ's ITRF2020 file)",
        [
            new("AMUR", -0.000131, -0.000551, 0.000837), new("ANTA", -0.000269, -0.000312, 0.000678),
            new("ARAB", 0.001129, -0.000146, 0.001438), new("AUST", 0.001487, 0.001175, 0.001223),
            new("CARB", 0.000207, -0.001422, 0.000726), new("EURA", -0.000085, -0.000519, 0.000753),
            new("INDI", 0.001137, 0.000013, 0.001444), new("NAZC", -0.000327, -0.001561, 0.001605),
            new("NOAM", 0.000045, -0.000666, -0.000098), new("NUBI", 0.000090, -0.000585, 0.000717),
            new("PCFC", -0.000404, 0.001021, -0.002154), new("SOAM", -0.000261, -0.000282, -0.000157),
            new("SOMA", -0.000081, -0.000719, 0.000864),
        ]);

    /// <summary>The models by request name.</summary>
    public static IReadOnlyList<PlateMotionModel> All { get; } = [Itrf2020, Itrf2014];

    /// <summary>Default when a plate is named without a model: the newer one.</summary>
    public static PlateMotionModel Default => Itrf2020;

    public static PlateMotionModel? Find(string? id) => All.FirstOrDefault(m => string.Equals(m.Id, id?.Trim(), StringComparison.OrdinalIgnoreCase));

    public PlateRotation? Plate(string? abbreviation) => abbreviation is null ? null : _plates.GetValueOrDefault(abbreviation.Trim());

    /// <summary>Velocity of a geocentric point riding the plate, v = ω × X, metres per year.</summary>
    public static (double Vx, double Vy, double Vz) Velocity(PlateRotation plate, double x, double y, double z)
    {
        var wx = plate.RxArcSecondsPerYear * HelmertMatrix.RadiansPerArcSecond;
        var wy = plate.RyArcSecondsPerYear * HelmertMatrix.RadiansPerArcSecond;
        var wz = plate.RzArcSecondsPerYear * HelmertMatrix.RadiansPerArcSecond;
        return (wy * z - wz * y, wz * x - wx * z, wx * y - wy * x);
    }

    /// <summary>The plate in words for reports.</summary>
    public string Describe(PlateRotation plate) => string.Create(CultureInfo.InvariantCulture,
        $"{Citation}, plate {plate.Plate} (ωx {plate.RxArcSecondsPerYear * 1000:0.###}, ωy {plate.RyArcSecondsPerYear * 1000:0.###}, ωz {plate.RzArcSecondsPerYear * 1000:0.###} mas/yr)");
}
