#!/usr/bin/python3
"""Writes crs-wkt-projinfo.tsv: WKT1/WKT2 definitions of CRSs by PROJ's projinfo, their TOWGS84 values,
and sample projections by cs2cs, for the WKT reader tests.

Usage (from the repository root):  /usr/bin/python3 tests/reference-data/make-wkt-reference.py
Needs Debian proj-bin (projinfo, cs2cs; PROJ 9.1.1).

Rows (tab-separated, first column the record type):
  wkt      epsg  format (WKT1_GDAL | WKT2_2015 | WKT2_2019)  single-line WKT  (projinfo --boundcrs-to-wgs84
           for WKT1_GDAL and WKT2_2019, so CRSs with a known Helmert shift to WGS 84 carry TOWGS84 / BOUNDCRS)
  towgs84  epsg  the 7 values of +towgs84 in `projinfo --boundcrs-to-wgs84 -o PROJ` (position vector, as PROJ reads it)
  point    epsg  lon  lat  e  n   cs2cs from +proj=longlat on the CRS's ellipsoid to its PROJ string without
           +towgs84 (projection only, PROJ's default east/north axis order), metres, %.10f
"""
import random
import re
import sqlite3
import subprocess

OUT = "tests/reference-data/crs-wkt-projinfo.tsv"
# In the catalog (resolved by code; rebuilt from the definition when the test strips the CRS identifier)
# and outside it (built from the definition; datums with Helmert shifts to WGS 84).
PROJECTED = [32633, 32733, 2227, 2240, 3035, 3034, 3857, 6350, 3413, 26931,
             31467, 28992, 31370, 2056, 3346, 2100, 27700, 2154, 3067]
GEODETIC = [4326, 4979, 4978, 4269, 4314]
POINTS = 12


def run(args, stdin=None):
    return subprocess.run(args, input=stdin, capture_output=True, text=True, check=True).stdout


def main():
    rng = random.Random(7)
    db = sqlite3.connect("/usr/share/proj/proj.db")  # area of use of each CRS (EPSG extent), to place the points
    rows = []
    for code in PROJECTED + GEODETIC:
        for fmt, bound in (("WKT1_GDAL", True), ("WKT2_2015", False), ("WKT2_2019", True)):
            args = ["projinfo", f"EPSG:{code}", "-o", fmt, "-q", "--single-line"] + (["--boundcrs-to-wgs84"] if bound else [])
            text = subprocess.run(args, capture_output=True, text=True).stdout.strip()
            if text:  # projinfo 9.1.1 has no WKT1_GDAL for geographic 3D CRSs (EPSG:4979)
                rows.append(f"wkt\t{code}\t{fmt}\t{text}")
        proj = run(["projinfo", f"EPSG:{code}", "-o", "PROJ", "-q", "--boundcrs-to-wgs84"]).strip()
        m = re.search(r"\+towgs84=([-0-9.,e]+)", proj)
        if m:
            values = m.group(1).split(",")
            values += ["0"] * (7 - len(values))
            rows.append(f"towgs84\t{code}\t" + "\t".join(values))
        if code in GEODETIC:
            continue
        ellps = " ".join(t for t in proj.split() if t.split("=")[0] in ("+ellps", "+datum", "+a", "+b", "+rf"))
        target = " ".join(t for t in proj.split() if not t.startswith("+towgs84") and t != "+type=crs")
        s, n, w, e = db.execute("select e.south_lat, e.north_lat, e.west_lon, e.east_lon from usage u join extent e on "
                                "e.auth_name=u.extent_auth_name and e.code=u.extent_code where u.object_table_name='projected_crs' "
                                "and u.object_auth_name='EPSG' and u.object_code=? order by cast(u.code as integer) limit 1",
                                (str(code),)).fetchone()
        if e < w:
            e += 360
        pts = [(round(((rng.uniform(w, e) + 180) % 360) - 180, 8), round(rng.uniform(s, n), 8)) for _ in range(POINTS)]
        out = run(["cs2cs", "-f", "%.10f"] + f"+proj=longlat {ellps} +no_defs".split() + ["+to"] + target.split(),
                  "\n".join(f"{lon} {lat}" for lon, lat in pts) + "\n").splitlines()
        for (lon, lat), line in zip(pts, out):
            x, y = line.split()[:2]
            rows.append(f"point\t{code}\t{lon}\t{lat}\t{x}\t{y}")
    version = subprocess.run(["projinfo"], capture_output=True, text=True).stderr.splitlines()[0]
    with open(OUT, "w", encoding="utf-8") as f:
        f.write(f"# CRS WKT by projinfo and sample projections by cs2cs ({version}); made by tests/reference-data/make-wkt-reference.py.\n")
        f.write("# Record types: see the script's docstring. CRS definitions: EPSG Geodetic Parameter Dataset, IOGP (via PROJ's proj.db).\n")
        f.write("type\tepsg\tcolumns\n")
        f.write("\n".join(rows) + "\n")
    print(len(rows), "rows")


if __name__ == "__main__":
    main()
