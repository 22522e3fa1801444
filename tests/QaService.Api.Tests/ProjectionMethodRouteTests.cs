using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// CRSs given as WKT with the newly supported projection methods, end to end through POST /v1/transform and an
/// assessment, against PROJ 9.1.1 cs2cs (values in the comments); and methods that are refused: 400 naming the method
/// and the reason, with a pointer, never 500.
/// </summary>
public sealed class ProjectionMethodRouteTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    private readonly HttpClient client = host.Factory.CreateClient();

    /// <summary>projinfo EPSG:2046 -o WKT2_2019 (PROJ 9.1.1): Hartebeesthoek94 / Lo15, TM (South Orientated), axes westing, southing.</summary>
    private const string Lo15 = """PROJCRS["Hartebeesthoek94 / Lo15",BASEGEOGCRS["Hartebeesthoek94",DATUM["Hartebeesthoek94",ELLIPSOID["WGS 84",6378137,298.257223563,LENGTHUNIT["metre",1]]],PRIMEM["Greenwich",0,ANGLEUNIT["degree",0.0174532925199433]],ID["EPSG",4148]],CONVERSION["South African Survey Grid zone 15",METHOD["Transverse Mercator (South Orientated)",ID["EPSG",9808]],PARAMETER["Latitude of natural origin",0,ANGLEUNIT["degree",0.0174532925199433],ID["EPSG",8801]],PARAMETER["Longitude of natural origin",15,ANGLEUNIT["degree",0.0174532925199433],ID["EPSG",8802]],PARAMETER["Scale factor at natural origin",1,SCALEUNIT["unity",1],ID["EPSG",8805]],PARAMETER["False easting",0,LENGTHUNIT["metre",1],ID["EPSG",8806]],PARAMETER["False northing",0,LENGTHUNIT["metre",1],ID["EPSG",8807]]],CS[Cartesian,2],AXIS["westing (Y)",west,ORDER[1],LENGTHUNIT["metre",1]],AXIS["southing (X)",south,ORDER[2],LENGTHUNIT["metre",1]]]""";

    private const string Lo15Base = """GEOGCRS["Hartebeesthoek94",DATUM["Hartebeesthoek94",ELLIPSOID["WGS 84",6378137,298.257223563,LENGTHUNIT["metre",1]]],PRIMEM["Greenwich",0,ANGLEUNIT["degree",0.0174532925199433]],CS[ellipsoidal,2],AXIS["geodetic latitude (Lat)",north,ORDER[1],ANGLEUNIT["degree",0.0174532925199433]],AXIS["geodetic longitude (Lon)",east,ORDER[2],ANGLEUNIT["degree",0.0174532925199433]]]""";

    /// <summary>An oblique stereographic grid with its origin at the north pole (invented), on the WGS 84 datum.</summary>
    private const string PolarSterea = """PROJCS["Polar cap grid",GEOGCS["WGS 84",DATUM["WGS_1984",SPHEROID["WGS 84",6378137,298.257223563],AUTHORITY["EPSG","6326"]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],PROJECTION["Oblique_Stereographic"],PARAMETER["latitude_of_origin",90],PARAMETER["central_meridian",0],PARAMETER["scale_factor",0.994],PARAMETER["false_easting",2000000],PARAMETER["false_northing",2000000],UNIT["metre",1],AXIS["Easting",EAST],AXIS["Northing",NORTH]]""";

    /// <summary>A Krovak grid (EPSG 9819, refused), WKT1 as GDAL writes S-JTSK grids.</summary>
    private const string Krovak = """PROJCS["S-JTSK / Krovak",GEOGCS["S-JTSK",DATUM["System_Jednotne_Trigonometricke_Site_Katastralni",SPHEROID["Bessel 1841",6377397.155,299.1528128]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],PROJECTION["Krovak"],PARAMETER["latitude_of_center",49.5],PARAMETER["longitude_of_center",24.8333333333333],PARAMETER["azimuth",30.2881397527778],PARAMETER["pseudo_standard_parallel_1",78.5],PARAMETER["scale_factor",0.9999],PARAMETER["false_easting",0],PARAMETER["false_northing",0],UNIT["metre",1]]""";

    private async Task<(HttpStatusCode Status, JsonElement Body)> TransformAsync(string from, string to, JsonArray points)
    {
        var body = new JsonObject { ["from"] = from, ["to"] = to, ["points"] = points };
        var response = await client.PostAsync("/v1/transform", new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json"));
        return (response.StatusCode, JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement);
    }

    [Fact]
    public async Task South_orientated_tm_gives_westing_and_southing_as_cs2cs()
    {
        // PROJ 9.1.1: echo "-25.5 16.2" | cs2cs -d 6 EPSG:4148 EPSG:2046 → -120650.859018 2821986.465901 (Y west, X south)
        var (status, body) = await TransformAsync(Lo15Base, Lo15, [new JsonObject { ["lat"] = -25.5, ["lon"] = 16.2 }]);
        Assert.True(status == HttpStatusCode.OK, body.ToString());
        var p = body.GetProperty("points")[0];
        Assert.Equal(-120650.859018, p.GetProperty("e").GetDouble(), 0.001);
        Assert.Equal(2821986.465901, p.GetProperty("n").GetDouble(), 0.001);
        Assert.Contains("Transverse Mercator (South Orientated)", body.GetProperty("operation").GetString(), StringComparison.Ordinal);

        (status, body) = await TransformAsync(Lo15, Lo15Base, [new JsonObject { ["e"] = -120650.859018, ["n"] = 2821986.465901 }]);
        Assert.True(status == HttpStatusCode.OK, body.ToString());
        Assert.Equal(-25.5, body.GetProperty("points")[0].GetProperty("lat").GetDouble(), 1e-8);
        Assert.Equal(16.2, body.GetProperty("points")[0].GetProperty("lon").GetDouble(), 1e-8);
    }

    [Fact]
    public async Task Oblique_stereographic_with_its_origin_at_the_pole_carries_the_pole()
    {
        // PROJ 9.1.1: printf "10 80\n0 90\n" | cs2cs -d 6 +proj=longlat +datum=WGS84 +to +proj=sterea +lat_0=90 +lon_0=0 +k=0.994
        //   +x_0=2000000 +y_0=2000000 +datum=WGS84 → 2193261.936765 903957.091603; 2000000.000000 2000000.000000
        var (status, body) = await TransformAsync("EPSG:4326", PolarSterea, [new JsonObject { ["lat"] = 80.0, ["lon"] = 10.0 }, new JsonObject { ["lat"] = 90.0, ["lon"] = 0.0 }]);
        Assert.True(status == HttpStatusCode.OK, body.ToString());
        Assert.Equal(2193261.936765, body.GetProperty("points")[0].GetProperty("e").GetDouble(), 0.001);
        Assert.Equal(903957.091603, body.GetProperty("points")[0].GetProperty("n").GetDouble(), 0.001);
        Assert.Equal(2000000.0, body.GetProperty("points")[1].GetProperty("e").GetDouble(), 0.001);
        Assert.Equal(2000000.0, body.GetProperty("points")[1].GetProperty("n").GetDouble(), 0.001);
    }

    [Fact]
    public async Task An_unsupported_method_is_a_400_naming_it_and_why_in_transform_and_assessment()
    {
        var (status, body) = await TransformAsync("EPSG:4326", Krovak, [new JsonObject { ["lat"] = 50.0, ["lon"] = 15.0 }]);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        var error = body.GetProperty("errors").EnumerateArray().Single();
        Assert.Equal("/to", error.GetProperty("pointer").GetString());
        Assert.Contains("\"Krovak\" (EPSG:9819 Krovak) is not supported: not implemented yet", error.GetProperty("message").GetString(), StringComparison.Ordinal);

        var request = new JsonObject
        {
            ["title"] = "Brook Lane valves",
            ["marks"] = new JsonObject { ["crs"] = Krovak, ["heights"] = "none", ["points"] = new JsonArray(new JsonObject { ["id"] = "V-1", ["e"] = -740000.0, ["n"] = -1050000.0 }) },
            ["fixes"] = new JsonObject { ["crs"] = "EPSG:4326", ["heights"] = "none", ["points"] = new JsonArray(new JsonObject { ["id"] = "F-1", ["mark"] = "V-1", ["lat"] = 50.0, ["lon"] = 15.0 }) },
            ["spec"] = new JsonObject { ["standard"] = "nssda", ["horizontal"] = 0.5 },
        };
        var response = await client.PostJsonAsync(request);
        var text = await response.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var problem = JsonDocument.Parse(text).RootElement.GetProperty("errors").EnumerateArray().First();
        Assert.Equal("/marks/crs", problem.GetProperty("pointer").GetString());
        Assert.Contains("Krovak", problem.GetProperty("message").GetString(), StringComparison.Ordinal);
    }
}
