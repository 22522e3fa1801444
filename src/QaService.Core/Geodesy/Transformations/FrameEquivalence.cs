namespace QaService.Core.Geodesy.Transformations;

/// <summary>A stated equivalence between two frames (no coordinate change) and how far it can be off, metres.</summary>
public sealed record FrameEquivalence(string FromDatum, string FromName, string ToDatum, string ToName, double AccuracyMetres, string Reason)
{
    /// <summary>
    /// The equivalences the service routes through. WGS 84 ensemble ≈ ITRF2014: the EPSG dataset gives the
    /// ensemble's accuracy as 2 m (proj.db geodetic_datum EPSG:6326 ensemble_accuracy); its recent realisations
    /// G1762/G2139 agree with ITRF2008/ITRF2014 at the centimetre level (EPSG:7666, EPSG:9757, 0.01 m).
    /// ETRS89 ensemble ≈ ETRF2000: EUREF's recommended realisation (EUREF TWG); ensemble accuracy 0.1 m (EPSG:6258).
    /// </summary>
    public static IReadOnlyList<FrameEquivalence> All { get; } =
    [
        new("EPSG:6326", "WGS 84 (ensemble)", "EPSG:1165", "ITRF2014", 2.0,
            "EPSG ensemble accuracy of WGS 84; its realisations G1762/G2139 match ITRF2008/2014 at the cm level"),
        new("EPSG:6258", "ETRS89 (ensemble)", "EPSG:1186", "ETRF2000", 0.1,
            "EUREF's recommended realisation of ETRS89; EPSG ensemble accuracy 0.1 m"),
    ];
}
