#!/usr/bin/python3
"""Writes towgs84-proj.tsv: CRSs given as WKT with a shift to WGS 84 (WKT1 TOWGS84, WKT2 BOUNDCRS), transformed by
PROJ's cs2cs to and from catalog CRSs reachable from WGS 84.

Usage (from the repository root):  /usr/bin/python3 tests/reference-data/make-towgs84-reference.py
Needs Debian proj-bin (cs2cs, PROJ 9.1.1), which applies TOWGS84 / a BOUNDCRS Helmert as
+proj=helmert +convention=position_vector (coordinate frame parameters with their own convention).

The datums are invented (not in the EPSG dataset), so the shift given with the WKT is the only way to WGS 84.
Records (tab-separated):
  wkt   name, WKT text (one line)
  row   from, to (EPSG:code or wkt:name), input 1, input 2, output 1, output 2 — each CRS's coordinates in the
        API's field order: geographic lat, lon (degrees); projected e, n (the CRS's unit). Inputs exact decimals,
        outputs cs2cs -d 10. Heights: none given (0 on the source ellipsoid, as the API and cs2cs take 2D input).
"""
import random
import subprocess

OUT = "tests/reference-data/towgs84-proj.tsv"
SEED = 20261204

WKTS = {
    # WKT1 as desktop GIS exports it: Bessel datum unknown to EPSG, 7-parameter TOWGS84 (position vector).
    "kestrel-geog": 'GEOGCS["Kestrel Bay local",DATUM["Kestrel_Bay_Datum_1962",SPHEROID["Bessel 1841",6377397.155,299.1528128],'
                    'TOWGS84[582,105,414,1.04,0.35,-3.08,8.3]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433],'
                    'AXIS["Latitude",NORTH],AXIS["Longitude",EAST]]',
    # The same datum under a Transverse Mercator grid in metres.
    "kestrel-grid": 'PROJCS["Kestrel Bay Grid",GEOGCS["Kestrel Bay local",DATUM["Kestrel_Bay_Datum_1962",SPHEROID["Bessel 1841",'
                    '6377397.155,299.1528128],TOWGS84[582,105,414,1.04,0.35,-3.08,8.3]],PRIMEM["Greenwich",0],'
                    'UNIT["degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["latitude_of_origin",0],'
                    'PARAMETER["central_meridian",9],PARAMETER["scale_factor",1],PARAMETER["false_easting",3500000],'
                    'PARAMETER["false_northing",0],UNIT["metre",1],AXIS["Easting",EAST],AXIS["Northing",NORTH]]',
    # International 1924 datum with a 3-parameter TOWGS84 and a Lambert grid in US survey feet.
    "marrow-lcc-ftus": 'PROJCS["Marrow Valley Grid (ftUS)",GEOGCS["Marrow Valley 1950",DATUM["Marrow_Valley_1950",'
                       'SPHEROID["International 1924",6378388,297],TOWGS84[-87,-98,-121,0,0,0,0]],PRIMEM["Greenwich",0],'
                       'UNIT["degree",0.0174532925199433]],PROJECTION["Lambert_Conformal_Conic_2SP"],'
                       'PARAMETER["standard_parallel_1",44],PARAMETER["standard_parallel_2",49],PARAMETER["latitude_of_origin",46.5],'
                       'PARAMETER["central_meridian",3],PARAMETER["false_easting",2000000],PARAMETER["false_northing",1000000],'
                       'UNIT["US survey foot",0.304800609601219],AXIS["Easting",EAST],AXIS["Northing",NORTH]]',
    # WKT2:2019 BOUNDCRS whose Helmert is in the coordinate frame convention (EPSG method 9607): signs differ from TOWGS84's.
    "heron-bound-cf": 'BOUNDCRS[SOURCECRS[GEOGCRS["Heron Point 1975",DATUM["Heron Point Datum 1975",ELLIPSOID["Clarke 1880 (RGS)",'
                      '6378249.145,293.465,LENGTHUNIT["metre",1]]],PRIMEM["Greenwich",0,ANGLEUNIT["degree",0.0174532925199433]],'
                      'CS[ellipsoidal,2],AXIS["geodetic latitude (Lat)",north,ORDER[1],ANGLEUNIT["degree",0.0174532925199433]],'
                      'AXIS["geodetic longitude (Lon)",east,ORDER[2],ANGLEUNIT["degree",0.0174532925199433]]]],'
                      'TARGETCRS[GEOGCRS["WGS 84",DATUM["World Geodetic System 1984",ELLIPSOID["WGS 84",6378137,298.257223563,'
                      'LENGTHUNIT["metre",1]]],PRIMEM["Greenwich",0,ANGLEUNIT["degree",0.0174532925199433]],CS[ellipsoidal,2],'
                      'AXIS["latitude",north,ORDER[1],ANGLEUNIT["degree",0.0174532925199433]],AXIS["longitude",east,ORDER[2],'
                      'ANGLEUNIT["degree",0.0174532925199433]],ID["EPSG",4326]]],'
                      'ABRIDGEDTRANSFORMATION["Heron Point 1975 to WGS 84",METHOD["Coordinate Frame rotation (geog2D domain)",ID["EPSG",9607]],'
                      'PARAMETER["X-axis translation",-160.4,ID["EPSG",8605]],PARAMETER["Y-axis translation",-21.3,ID["EPSG",8606]],'
                      'PARAMETER["Z-axis translation",-294.7,ID["EPSG",8607]],PARAMETER["X-axis rotation",-2.1,ID["EPSG",8608]],'
                      'PARAMETER["Y-axis rotation",0.9,ID["EPSG",8609]],PARAMETER["Z-axis rotation",-4.2,ID["EPSG",8610]],'
                      'PARAMETER["Scale difference",1.0000064,ID["EPSG",8611]]]]',
}

# (from, to, box of source points: south, north, west, east in degrees, or None to reuse the projected source of a case)
CASES = [
    ("wkt:kestrel-geog", "EPSG:4326", (44.0, 56.0, 3.0, 17.0)),
    ("EPSG:4326", "wkt:kestrel-geog", (44.0, 56.0, 3.0, 17.0)),
    ("wkt:kestrel-grid", "EPSG:4326", (46.0, 55.0, 5.0, 13.0)),
    ("EPSG:4326", "wkt:kestrel-grid", (46.0, 55.0, 5.0, 13.0)),
    ("wkt:kestrel-grid", "EPSG:32632", (46.0, 55.0, 5.0, 13.0)),
    ("EPSG:32632", "wkt:kestrel-grid", (46.0, 55.0, 5.0, 13.0)),
    ("wkt:marrow-lcc-ftus", "EPSG:4326", (42.0, 51.0, -4.0, 9.0)),
    ("EPSG:3857", "wkt:marrow-lcc-ftus", (42.0, 51.0, -4.0, 9.0)),
    ("wkt:heron-bound-cf", "EPSG:4326", (-35.0, -20.0, 15.0, 35.0)),
    ("EPSG:4326", "wkt:heron-bound-cf", (-35.0, -20.0, 15.0, 35.0)),
    ("wkt:heron-bound-cf", "wkt:kestrel-geog", (-35.0, -20.0, 15.0, 35.0)),
]
POINTS_PER_CASE = 60


def crs_text(name):
    return WKTS[name[4:]] if name.startswith("wkt:") else name


def run(src, dst, lines):
    out = subprocess.run(["cs2cs", "-d", "10", crs_text(src), crs_text(dst)], input="".join(lines), capture_output=True,
                         text=True, check=True).stdout.split("\n")
    return [o.split()[:2] for o in out if o.strip()]


def is_projected(name):
    return name.startswith("EPSG:") and name not in ("EPSG:4326",) or name in ("wkt:kestrel-grid", "wkt:marrow-lcc-ftus")


def main():
    rng = random.Random(SEED)
    version = subprocess.run(["cs2cs"], capture_output=True, text=True).stderr.splitlines()[0].strip()
    rows = []
    for src, dst, (s, n, w, e) in CASES:
        geo = [(round(rng.uniform(s, n), 6), round(rng.uniform(w, e), 6)) for _ in range(POINTS_PER_CASE)]
        geo += [(s, w), (s, e), (n, w), (n, e)]
        if is_projected(src):
            # Source points on the projected grid: place the geographic points with cs2cs first, round to 1e-3 unit.

            placed = run("EPSG:4326", src, [f"{a} {b}\n" for a, b in geo])
            inputs = [(round(float(x), 3), round(float(y), 3)) for x, y in placed]
        else:
            inputs = geo
        outputs = run(src, dst, [f"{a!r} {b!r}\n" for a, b in inputs])
        for (a, b), (c, d) in zip(inputs, outputs):
            rows.append(f"row\t{src}\t{dst}\t{a!r}\t{b!r}\t{c}\t{d}")
    with open(OUT, "w") as f:
        f.write("# CRSs given as WKT with a shift to WGS 84 (TOWGS84, BOUNDCRS), transformed by PROJ cs2cs -d 10.\n")
        f.write(f"# Tool: {version}; generated by tests/reference-data/make-towgs84-reference.py (seed {SEED}).\n")
        f.write("# Datums and places invented. Coordinates in the API's field order (lat, lon | e, n), CRS units.\n")
        for name, text in WKTS.items():
            f.write(f"wkt\t{name}\t{text}\n")
        f.write("\n".join(rows) + "\n")


if __name__ == "__main__":
    main()
