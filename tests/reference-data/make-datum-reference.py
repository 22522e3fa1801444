#!/usr/bin/env python3
"""Regenerates the datum-transformation reference data used by tests/QaService.Core.Tests/Geodesy/Transformations.

    cd <repo root> && python3 tests/reference-data/make-datum-reference.py

Needs PROJ (cct, projinfo; Debian proj-bin, proj-data). Writes:
  helmert-proj.tsv    7-parameter Helmert in both conventions (cct +proj=helmert, geocentric metres), forward and inverse
  datum-proj.tsv      EPSG time-dependent transformations between geographic 3D CRSs at observation epochs
                      (cct with x y z t input and the pipeline projinfo prints, pinned in the header)
  ntv2-proj.tsv       NTv2 grid shifts (cct +proj=hgridshift) on the grids Debian's proj-data ships
  geoid-proj.tsv      EGM96 undulation N from PROJ's vgridshift on egm96_15.gtx (N = h - H)
Random points use a fixed seed, so a re-run with the same PROJ reproduces the files except the date line.
cs2cs in PROJ 9.1 takes no epoch (it would evaluate a time-dependent shift at the reference epoch), so every
epoch case runs through cct with a 4th (time) column.
"""
import os
import random
import subprocess
import datetime

HERE = os.path.dirname(os.path.abspath(__file__))
PROJ_VERSION = subprocess.run(["cct", "--version"], capture_output=True, text=True).stdout.strip() or \
    subprocess.run("cct 2>&1 | head -1", shell=True, capture_output=True, text=True).stdout.strip()
GENERATED = datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%dT%H:%MZ")
rng = random.Random(20260526)


def cct(args, rows, decimals):
    text = "\n".join(" ".join(repr(v) for v in r) for r in rows) + "\n"
    out = subprocess.run(["cct", "-d", str(decimals)] + args, input=text, capture_output=True, text=True, check=True).stdout
    result = []
    for line in out.strip().splitlines():
        parts = line.split()
        result.append([float(p) for p in parts[:4]])
    assert len(result) == len(rows), (args, len(result), len(rows))
    return result


def header(f, what, extra=()):
    f.write(f"# {what}\n# generated {GENERATED} by tests/reference-data/make-datum-reference.py with {PROJ_VERSION}\n")
    for line in extra:
        f.write(f"# {line}\n")


def random_geodetic(n, lat=(-85, 85), lon=(-180, 180), h=(-100, 3000)):
    return [(rng.uniform(*lat), rng.uniform(*lon), rng.uniform(*h)) for _ in range(n)]


def to_cart(points):
    # lat lon h -> X Y Z on GRS80 with cct (so the inputs are exactly what PROJ sees)
    return [r[:3] for r in cct(["+proj=pipeline", "+step", "+proj=axisswap", "+order=2,1", "+step", "+proj=unitconvert",
                                "+xy_in=deg", "+xy_out=rad", "+step", "+proj=cart", "+ellps=GRS80"],
                               [(a, b, c, 0) for a, b, c in points], 6)]


# 1. Static Helmert, both conventions. Parameters invented but of the usual size; the 5" set shows the
#    convention's sign at metre level (a swapped convention moves points by 2 x 5" x 6.4e6 m ~ 300 m).
HELMERT_SETS = {
    "helmert-a": "+x=-87.1 +y=-98.2 +z=-121.3 +rx=0.59 +ry=-0.24 +rz=1.3 +s=3.2",
    "helmert-b": "+x=446.448 +y=-125.157 +z=542.06 +rx=0.15 +ry=0.247 +rz=0.842 +s=-20.489",
    "helmert-5s": "+x=0.5 +y=-0.4 +z=0.3 +rx=5 +ry=-5 +rz=5 +s=1.5",
}
with open(os.path.join(HERE, "helmert-proj.tsv"), "w") as f:
    header(f, "7-parameter Helmert (translations m, rotations arc-seconds, scale ppm) on geocentric metres",
           [f"{k}: +proj=helmert {v} +convention=<convention>" for k, v in HELMERT_SETS.items()])
    f.write("set\tconvention\tdirection\tx\ty\tz\tx_out\ty_out\tz_out\n")
    for name, params in HELMERT_SETS.items():
        for convention in ("position_vector", "coordinate_frame"):
            xyz = to_cart(random_geodetic(120))
            args = ["+proj=helmert"] + params.split() + [f"+convention={convention}"]
            for direction, extra in (("forward", []), ("inverse", ["-I"])):
                out = cct(extra + args, [(x, y, z, 0) for x, y, z in xyz], 6)
                for (x, y, z), o in zip(xyz, out):
                    f.write(f"{name}\t{convention}\t{direction}\t{x:.6f}\t{y:.6f}\t{z:.6f}\t{o[0]:.6f}\t{o[1]:.6f}\t{o[2]:.6f}\n")

# 2. EPSG time-dependent transformations between geographic 3D CRSs, pipelines from projinfo.
EPSG_CASES = [
    # (name, source CRS, target CRS, area (lat range, lon range))
    ("ITRF2014-ETRF2000", "EPSG:7912", "EPSG:7931", (35, 71), (-10, 32)),
    ("ITRF2020-ETRF2000", "EPSG:9989", "EPSG:7931", (35, 71), (-10, 32)),
    ("ITRF2008-ETRF2000", "EPSG:7911", "EPSG:7931", (35, 71), (-10, 32)),
    ("ITRF2014-NAD83(2011)", "EPSG:7912", "EPSG:6319", (20, 65), (-160, -65)),
    ("ITRF2008-NAD83(2011)", "EPSG:7911", "EPSG:6319", (20, 65), (-160, -65)),
    ("ITRF2014-ITRF2020", "EPSG:7912", "EPSG:9989", (-80, 80), (-180, 180)),
    ("ITRF2014-GDA2020", "EPSG:7912", "EPSG:7843", (-44, -10), (112, 154)),
]
EPOCHS = [2026.4, 2010.0, 2018.75, 2031.2]
with open(os.path.join(HERE, "datum-proj.tsv"), "w") as f:
    pipelines = {}
    for name, s, t, _, _ in EPSG_CASES:
        p = subprocess.run(["projinfo", "-s", s, "-t", t, "-o", "PROJ", "-q", "--single-line", "--spatial-test", "intersects"],
                           capture_output=True, text=True, check=True).stdout.strip().splitlines()[0]
        pipelines[name] = p
    header(f, "EPSG transformations between geographic 3D CRSs (lat lon degrees, h metres) at observation epochs (decimal years)",
           [f"{n}: {s} -> {t}: {pipelines[n]}" for n, s, t, _, _ in EPSG_CASES])
    f.write("case\tsource\ttarget\tepoch\tlat\tlon\th\tlat_out\tlon_out\th_out\n")
    for name, s, t, la, lo in EPSG_CASES:
        pts = random_geodetic(60 * len(EPOCHS), la, lo, (-50, 2500))
        rows = [(a, b, c, EPOCHS[i % len(EPOCHS)]) for i, (a, b, c) in enumerate(pts)]
        out = cct(pipelines[name].split(), rows, 10)
        for r, o in zip(rows, out):
            f.write(f"{name}\t{s}\t{t}\t{r[3]}\t{r[0]:.10f}\t{r[1]:.10f}\t{r[2]:.4f}\t{o[0]:.10f}\t{o[1]:.10f}\t{o[2]:.4f}\n")

# 3. NTv2 grid shifts with the grids of Debian's proj-data (lon lat in degrees).
GRIDS = [("ntf_r93.gsb", (41.5, 51.0), (-5.0, 9.5)), ("nzgd2kgrid0005.gsb", (-47.5, -34.5), (166.5, 178.5)),
         ("BETA2007.gsb", (47.5, 55.0), (6.0, 15.0)), ("CHENYX06.gsb", (45.9, 47.7), (5.97, 10.45))]
with open(os.path.join(HERE, "ntv2-proj.tsv"), "w") as f:
    header(f, "NTv2 grid shift (lon lat degrees), forward and inverse: cct +proj=hgridshift +grids=<grid> (inverse: +inv step)")
    f.write("grid\tdirection\tlon\tlat\tlon_out\tlat_out\n")
    for grid, la, lo in GRIDS:
        pts = [(rng.uniform(*lo), rng.uniform(*la)) for _ in range(150)]
        for direction, inv in (("forward", []), ("inverse", ["+inv"])):
            out = cct(["+proj=pipeline", "+step", "+proj=unitconvert", "+xy_in=deg", "+xy_out=rad",
                       "+step"] + inv + ["+proj=hgridshift", f"+grids={grid}",
                       "+step", "+proj=unitconvert", "+xy_in=rad", "+xy_out=deg"], [(a, b, 0, 0) for a, b in pts], 11)
            for (a, b), o in zip(pts, out):
                if abs(o[0]) > 1000:  # outside the grid: cct prints HUGE_VAL
                    continue
                f.write(f"{grid}\t{direction}\t{a:.9f}\t{b:.9f}\t{o[0]:.11f}\t{o[1]:.11f}\n")

# 4. EGM96 undulation from PROJ: vgridshift turns H (0 here) into h, so N = h_out.
with open(os.path.join(HERE, "geoid-proj.tsv"), "w") as f:
    header(f, "EGM96 geoid undulation N (metres) from PROJ: cct +proj=vgridshift +grids=egm96_15.gtx +multiplier=1 on H = 0")
    f.write("lat\tlon\tn\n")
    pts = [(rng.uniform(-90, 90), rng.uniform(-180, 180)) for _ in range(1500)]
    pts += [(90.0, 0.0), (-90.0, 45.0), (0.0, 180.0), (0.0, -180.0), (-33.2, 179.99), (12.0, -179.9)]
    out = cct(["+proj=pipeline", "+step", "+proj=unitconvert", "+xy_in=deg", "+xy_out=rad",
               "+step", "+proj=vgridshift", "+grids=egm96_15.gtx", "+multiplier=1"], [(b, a, 0, 0) for a, b in pts], 6)
    for (a, b), o in zip(pts, out):
        f.write(f"{a:.8f}\t{b:.8f}\t{o[2]:.6f}\n")
