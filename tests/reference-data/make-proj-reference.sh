#!/usr/bin/env bash
# Regenerates the geodesy reference data used by tests/QaService.Core.Tests/Geodesy.
#
#   cd <repo root> && bash tests/reference-data/make-proj-reference.sh
#
# Needs: PROJ (cs2cs; Debian package proj-bin), GeographicLib tools (TransverseMercatorProj;
# Debian package geographiclib-tools) and python3 (standard library only).
# The random points are drawn with a fixed seed, so re-running with the same tool versions
# reproduces the files byte for byte apart from the "# generated" date line.
set -euo pipefail

here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
command -v cs2cs >/dev/null || { echo "cs2cs (proj-bin) not found" >&2; exit 1; }
command -v TransverseMercatorProj >/dev/null || { echo "TransverseMercatorProj (geographiclib-tools) not found" >&2; exit 1; }

PROJ_VERSION="$(cs2cs 2>&1 | head -n 1 || true)"
GEOGRAPHICLIB_VERSION="$(TransverseMercatorProj --version 2>&1 | head -n 1)"
export PROJ_VERSION GEOGRAPHICLIB_VERSION
GENERATED="$(date -u +%Y-%m-%dT%H:%MZ)"
export GENERATED
export OUT_DIR="$here"

python3 - <<'PY'
import os, random, subprocess

out_dir = os.environ["OUT_DIR"]
proj_version = os.environ["PROJ_VERSION"]
glib_version = os.environ["GEOGRAPHICLIB_VERSION"]
generated = os.environ["GENERATED"]
regen = "bash tests/reference-data/make-proj-reference.sh"
rng = random.Random(20261201)

def run(cmd, lines):
    """Pipe whitespace-separated input lines through a tool; return its stdout lines."""
    res = subprocess.run(cmd, input="\n".join(lines) + "\n", capture_output=True, text=True, check=True)
    out = res.stdout.splitlines()
    if len(out) != len(lines):
        raise SystemExit(f"{cmd}: {len(lines)} lines in, {len(out)} out")
    return out

def header(f, title, cmd, columns):
    f.write(f"# {title}\n")
    f.write(f"# PROJ: {proj_version}\n")
    f.write(f"# GeographicLib: {glib_version}\n")
    f.write(f"# generated: {generated} by: {regen}\n")
    f.write(f"# tool command: {cmd}\n")
    f.write("# random points: python3 random.Random(20261201); angles written with 9 decimals (1e-9 deg), lengths with 6 (1e-6 m)\n")
    f.write("\t".join(columns) + "\n")

def wrap(lon):
    """Longitude reduced to [-180, 180)."""
    return (lon + 180.0) % 360.0 - 180.0

# ---------------------------------------------------------------- UTM / transverse Mercator
# Zones 1, 6, 11, ..., 56 and 3, 30, 60 (antimeridian both sides), each north and south.
zones = sorted(set(list(range(1, 61, 5)) + [3, 30, 31, 60]))
tm_rows = []
for zone in zones:
    cm = -183 + 6 * zone
    for south in (False, True):
        pts = []
        # Random: 40 anywhere within 12 deg of the CM, 20 inside the zone proper.
        for i in range(60):
            dlon = rng.uniform(-12.0, 12.0) if i < 40 else rng.uniform(-3.0, 3.0)
            lat = rng.uniform(0.0, 84.0)
            pts.append((-lat if south else lat, dlon))
        # Fixed edge cases: CM on the equator, zone edges, 12 deg out, near 84 deg.
        for lat in (0.0, 84.0, 80.0, 45.0):
            for dlon in (0.0, 3.0, -3.0, 12.0, -12.0):
                pts.append((-lat if south else lat, dlon))
        epsg = (32700 if south else 32600) + zone
        lines = [f"{lat:.9f} {wrap(cm + dlon):.9f}" for lat, dlon in pts]
        out = run(["cs2cs", "-f", "%.6f", "EPSG:4326", f"EPSG:{epsg}"], lines)
        for line, o in zip(lines, out):
            lat_s, lon_s = line.split()
            e, n = o.split()[:2]
            tm_rows.append((lat_s, lon_s, str(zone), "S" if south else "N", e, n))

with open(os.path.join(out_dir, "tm-utm-proj.tsv"), "w") as f:
    header(f, "WGS 84 geographic -> UTM, reference values from PROJ cs2cs (EPSG:4326 input is lat lon)",
           "printf 'LAT LON\\n' | cs2cs -f %.6f EPSG:4326 EPSG:326ZZ (north) / EPSG:327ZZ (south)",
           ["lat_deg", "lon_deg", "zone", "hemisphere", "easting_m", "northing_m"])
    for r in tm_rows:
        f.write("\t".join(r) + "\n")

# ---------------------------------------------------------------- geocentric
geo_pts = []
for i in range(2200):
    u = rng.random()
    if i % 10 == 0:
        lat = rng.choice((-1.0, 1.0)) * rng.uniform(89.0, 90.0)   # near the poles
    else:
        lat = rng.uniform(-90.0, 90.0)
    lon = rng.uniform(-180.0, 180.0)
    if u < 0.5:
        h = rng.uniform(-500.0, 9000.0)                           # terrain
    elif u < 0.8:
        h = 10 ** rng.uniform(4.0, 7.30103)                       # 10 km .. 20 000 km
    else:
        h = rng.uniform(-500.0, 20_000_000.0)
    geo_pts.append((lat, lon, h))
for lat in (90.0, -90.0, 0.0, 45.0, -45.0, 89.999999):
    for lon in (0.0, 90.0, -90.0, 179.999999, -180.0):
        for h in (-10_000.0, -500.0, 0.0, 1000.0, 20_000_000.0, 100_000_000.0):
            geo_pts.append((lat, lon, h))
lines = [f"{lat:.9f} {lon:.9f} {h:.6f}" for lat, lon, h in geo_pts]
out = run(["cs2cs", "-f", "%.6f", "EPSG:4979", "EPSG:4978"], lines)
with open(os.path.join(out_dir, "geocentric-proj.tsv"), "w") as f:
    header(f, "WGS 84 geodetic (lat, lon, ellipsoidal h) -> geocentric ECEF, reference values from PROJ cs2cs",
           "printf 'LAT LON H\\n' | cs2cs -f %.6f EPSG:4979 EPSG:4978",
           ["lat_deg", "lon_deg", "h_m", "x_m", "y_m", "z_m"])
    for line, o in zip(lines, out):
        x, y, z = o.split()[:3]
        f.write("\t".join(line.split() + [x, y, z]) + "\n")

# ---------------------------------------------------------------- exact TM far from the CM
exact_pts = []
for dlon in (0.5, 3.0, 6.0, 9.0, 12.0, 15.0, 20.0, 25.0, 30.0, 35.0, 40.0, 50.0, 60.0, 70.0):
    for lat in (0.0, 1.0, 10.0, 30.0, 45.0, 60.0, 75.0, 84.0, -30.0, -84.0):
        exact_pts.append((lat, dlon if lat >= 0 else -dlon))
lines = [f"{lat:.9f} {dlon:.9f}" for lat, dlon in exact_pts]
out = run(["TransverseMercatorProj", "-k", "0.9996", "-l", "0", "-p", "9"], lines)
with open(os.path.join(out_dir, "tm-exact-geographiclib.tsv"), "w") as f:
    header(f, "WGS 84 exact transverse Mercator (Lee/Karney, elliptic functions), k0 = 0.9996, lon0 = 0, no false origin",
           "printf 'LAT LON\\n' | TransverseMercatorProj -k 0.9996 -l 0 -p 9",
           ["lat_deg", "lon_deg", "x_m", "y_m"])
    for line, o in zip(lines, out):
        x, y = o.split()[:2]
        f.write("\t".join(line.split() + [x, y]) + "\n")

print(f"tm-utm-proj.tsv: {len(tm_rows)} rows; geocentric-proj.tsv: {len(geo_pts)} rows; tm-exact-geographiclib.tsv: {len(exact_pts)} rows")
PY
