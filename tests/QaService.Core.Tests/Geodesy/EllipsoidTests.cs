using QaService.Core.Geodesy;

namespace QaService.Core.Tests.Geodesy;

public sealed class EllipsoidTests
{
    [Fact]
    public void Wgs84_DerivedParameters_MatchNimaTr8350()
    {
        // Outside source: NIMA TR8350.2 (3rd ed., 2000) Table 3.3: b = 6356752.3142 m, e² = 6.69437999014e-3.
        Assert.Equal(6356752.3142, Ellipsoid.Wgs84.SemiMinorAxisMetres, 4);
        Assert.Equal(6.69437999014e-3, Ellipsoid.Wgs84.FirstEccentricitySquared, 14);
        Assert.Equal(1 / 298.257223563, Ellipsoid.Wgs84.Flattening, 1e-18);
    }

    [Fact]
    public void Grs80_DerivedParameters_MatchMoritz1980()
    {
        // Outside source: Moritz (1980), Geodetic Reference System 1980: b = 6356752.3141 m, e² = 0.00669438002290.
        Assert.Equal(6356752.3141, Ellipsoid.Grs80.SemiMinorAxisMetres, 4);
        Assert.Equal(0.00669438002290, Ellipsoid.Grs80.FirstEccentricitySquared, 14);
    }
}
