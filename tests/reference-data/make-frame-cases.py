#!/usr/bin/env python3
"""Builds assessment cases across frames and height references, with positions made by PROJ.

Case "nad83-utm10-vs-itrf2014": marks in NAD83(2011) / UTM zone 10N (EPSG:6339, ellipsoidal h), fixes in
ITRF2014 (EPSG:7912) at epoch 2026.4. Residuals are designed in east-north-up at each mark (centimetres). The
fix is placed at mark + residual with PROJ's topocentric conversion (cct -I +proj=topocentric, GRS80) in
NAD83(2011), then carried to ITRF2014 at 2026.4 with cct and the pipeline projinfo prints for
EPSG:6319 -> EPSG:7912 (the inverse of EPSG:8970, time-dependent, coordinate frame convention).
Mark easting/northing by cs2cs EPSG:6319 -> EPSG:6339.
Case "egm96-orthometric-marks": marks in WGS 84 (EPSG:4979) with orthometric heights H on EGM96
(H = h - N, N by cct +proj=vgridshift +grids=egm96_15.gtx), fixes ellipsoidal; designed residuals as above.

Regenerate (Debian proj-bin, proj-data): python3 tests/reference-data/make-frame-cases.py > tests/reference-data/frame-cases.json
"""
import datetime
import json
import random
import subprocess

rng = random.Random(7)
EPOCH = 2026.4


def cct(args, rows, decimals=12):
    text = "\n".join(" ".join(repr(float(v)) for v in r) for r in rows) + "\n"
    out = subprocess.run(["cct", "-d", str(decimals)] + args, input=text, capture_output=True, text=True, check=True).stdout
    return [[float(x) for x in line.split()[:4]] for line in out.strip().splitlines()]


def enu_to_geodetic(lat0, lon0, h0, de, dn, du, ellps):
    # ENU at the mark -> geocentric (inverse topocentric) -> lat/lon/h on the same ellipsoid.
    xyz = cct(["-I", "+proj=topocentric", f"+lat_0={lat0!r}", f"+lon_0={lon0!r}", f"+h_0={h0!r}", f"+ellps={ellps}"], [(de, dn, du, 0)], 6)[0]
    geo = cct(["+proj=pipeline", "+step", "+inv", "+proj=cart", f"+ellps={ellps}", "+step", "+proj=unitconvert", "+xy_in=rad", "+xy_out=deg",
               "+step", "+proj=axisswap", "+order=2,1"], [(xyz[0], xyz[1], xyz[2], 0)], 12)[0]
    return geo[0], geo[1], geo[2]


def marks_around(lat, lon, n):
    return [(lat + rng.uniform(-0.15, 0.15), lon + rng.uniform(-0.2, 0.2), rng.uniform(20, 400)) for _ in range(n)]


def residuals(n):
    return [(round(rng.gauss(0, 0.03), 4), round(rng.gauss(0, 0.03), 4), round(rng.gauss(0, 0.05), 4)) for _ in range(n)]


cases = []
version = subprocess.run("projinfo 2>&1 | head -1", shell=True, capture_output=True, text=True).stdout.strip()

# Case 1: NAD83(2011) / UTM 10N marks, ITRF2014 fixes at 2026.4.
pipeline = subprocess.run(["projinfo", "-s", "EPSG:6319", "-t", "EPSG:7912", "-o", "PROJ", "-q", "--single-line"],
                          capture_output=True, text=True, check=True).stdout.strip()
marks = marks_around(45.52, -122.68, 24)
designed = residuals(24)
en = subprocess.run(["cs2cs", "-f", "%.6f", "EPSG:6319", "EPSG:6339"], input="".join(f"{a!r} {b!r}\n" for a, b, _ in marks),
                    capture_output=True, text=True, check=True).stdout.strip().splitlines()
mark_points, fix_points = [], []
for i, ((lat, lon, h), (de, dn, du), line) in enumerate(zip(marks, designed, en)):
    e, n = (float(v) for v in line.split()[:2])
    mark_points.append({"id": f"PX-{i + 1:02d}", "e": e, "n": n, "h": round(h, 4)})
    flat, flon, fh = enu_to_geodetic(lat, lon, round(h, 4), de, dn, du, "GRS80")
    itrf = cct(pipeline.split(), [(flat, flon, fh, EPOCH)], 12)[0]
    fix_points.append({"id": f"G-{i + 1:03d}", "mark": f"PX-{i + 1:02d}", "lat": itrf[0], "lon": itrf[1], "h": round(itrf[2], 6)})
cases.append({
    "name": "nad83-utm10-vs-itrf2014",
    "pipeline": pipeline,
    "request": {"title": "Riverside valve boxes, frame check", "marks": {"crs": "EPSG:6339", "heights": "ellipsoidal", "points": mark_points},
                "fixes": {"crs": "EPSG:7912", "heights": "ellipsoidal", "epoch": EPOCH, "points": fix_points},
                "spec": {"standard": "nssda", "horizontal": 0.5, "vertical": 1.0}},
    "designedResiduals": [{"fix": f["id"], "dE": d[0], "dN": d[1], "dU": d[2]} for f, d in zip(fix_points, designed)],
})

# Case 2: orthometric (EGM96) marks against ellipsoidal fixes, both WGS 84.
marks = marks_around(47.1, 11.4, 20)
designed = residuals(20)
undulation = cct(["+proj=pipeline", "+step", "+proj=unitconvert", "+xy_in=deg", "+xy_out=rad", "+step", "+proj=vgridshift",
                  "+grids=egm96_15.gtx", "+multiplier=1"], [(lon, lat, 0, 0) for lat, lon, _ in marks], 6)
mark_points, fix_points = [], []
for i, ((lat, lon, h), (de, dn, du), nrow) in enumerate(zip(marks, designed, undulation)):
    mark_points.append({"id": f"HM-{i + 1:02d}", "lat": lat, "lon": lon, "h": round(h - nrow[2], 4)})
    flat, flon, fh = enu_to_geodetic(lat, lon, h, de, dn, du, "WGS84")
    fix_points.append({"id": f"R-{i + 1:03d}", "mark": f"HM-{i + 1:02d}", "lat": flat, "lon": flon, "h": round(fh, 4)})
cases.append({
    "name": "egm96-orthometric-marks",
    "request": {"title": "Alpine hydrant survey, height check", "marks": {"crs": "EPSG:4979", "heights": "orthometric", "geoid": "egm96", "points": mark_points},
                "fixes": {"crs": "EPSG:4979", "heights": "ellipsoidal", "points": fix_points},
                "spec": {"standard": "nssda", "horizontal": 0.5, "vertical": 1.0}},
    "designedResiduals": [{"fix": f["id"], "dE": d[0], "dN": d[1], "dU": d[2]} for f, d in zip(fix_points, designed)],
})

print(json.dumps({"generated": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%dT%H:%MZ"),
                  "by": "tests/reference-data/make-frame-cases.py", "tools": version, "cases": cases}, indent=1))
