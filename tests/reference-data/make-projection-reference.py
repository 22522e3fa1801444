#!/usr/bin/python3
"""Writes projections-proj.tsv: forward and inverse map projections of catalog CRSs by PROJ's cs2cs.

Usage (from the repository root):  /usr/bin/python3 tests/reference-data/make-projection-reference.py
Needs Debian proj-bin (cs2cs, PROJ 9.1.1). Deterministic (fixed seed).

For each chosen projected CRS of src/QaService.Core/Geodesy/Catalog/epsg-catalog.tsv, points are drawn
in the CRS's EPSG area of use widened by 1 degree on every side (zone edges and a little beyond), plus the
box's corners. cs2cs runs between the CRS and its own base geographic CRS (same datum, so PROJ applies the
projection only: no datum shift enters) with authority axis order: geographic input/output is lat, lon;
projected values are reordered to (e, n) from the CRS's axis order and are in the CRS's unit.
  fwd rows: lat, lon are the input (exact decimals); e, n are cs2cs's output (%.10f).
  inv rows: e, n are the input (rounded to 1e-4 unit); lat, lon are cs2cs's output (%.10f degrees).
"""
import random
import subprocess

CATALOG = "src/QaService.Core/Geodesy/Catalog/epsg-catalog.tsv"
OUT = "tests/reference-data/projections-proj.tsv"
POINTS_PER_CRS = 55      # per direction, plus 4 corners in each direction
WIDEN_DEGREES = 1.0

# How many CRSs to sample per method, plus CRSs always included (EPSG codes) to cover the cases the
# brief names: UTM north/south and zone 1/60, State Plane in US survey feet and international feet,
# LAEA/LCC Europe, Web Mercator, polar CRSs, Alaska zone 1 (Hotine).
PER_METHOD = {9807: 14, 9802: 12, 9801: 5, 9822: 5, 9820: 9, 9804: 2, 9805: 1, 1024: 1,
              9809: 2, 9810: 6, 9829: 8, 9812: 6, 9815: 2, 1078: 3, 9835: 1}
ALWAYS = [32601, 32660, 32633, 32733, 32760, 25832, 26910, 6339, 28355, 7855, 2227, 2263, 2240, 6423,
          3035, 3034, 3857, 3413, 3031, 3995, 26931, 3338, 6350, 2246, 3395, 3032]


def load_catalog():
    extents, crss = {}, {}
    for line in open(CATALOG, encoding="utf-8"):
        f = line.rstrip("\n").split("\t")
        if f[0] == "A":
            extents[f[1]] = tuple(float(x) for x in f[2:6])
        elif f[0] == "C" and f[2] == "proj":
            crss[int(f[1])] = {"name": f[3], "base": f[5], "method": int(f[6]), "unit": f[8],
                               "axes": [a.split(":") for a in f[9].split(";")], "extent": f[10]}
    return extents, crss


def cs2cs(src, dst, lines):
    out = subprocess.run(["cs2cs", "-f", "%.10f", f"EPSG:{src}", f"EPSG:{dst}"], input="\n".join(lines) + "\n",
                         capture_output=True, text=True, check=True).stdout.splitlines()
    assert len(out) == len(lines), (src, dst)
    return [o.split()[:2] for o in out]


def sample(rng, box, n, method):
    s, nth, w, e = box
    s, nth = max(-89.5, s - WIDEN_DEGREES), min(89.5, nth + WIDEN_DEGREES)
    if method in (9804, 9805, 1024):
        s, nth = max(s, -85.0), min(nth, 85.0)
    if e < w:
        e += 360.0
    w, e = w - WIDEN_DEGREES, e + WIDEN_DEGREES
    if e - w > 360:
        w, e = -180.0, 180.0
    pts = [(s, w), (s, e), (nth, w), (nth, e)]
    pts += [(rng.uniform(s, nth), rng.uniform(w, e)) for _ in range(n)]
    return [(round(lat, 9), round(((lon + 180) % 360) - 180, 9)) for lat, lon in pts]


def main():
    rng = random.Random(20260401)
    extents, crss = load_catalog()
    chosen = [c for c in ALWAYS if c in crss]
    for method, count in PER_METHOD.items():
        pool = sorted(c for c, d in crss.items() if d["method"] == method and c not in chosen)
        have = sum(1 for c in chosen if crss[c]["method"] == method)
        chosen += rng.sample(pool, min(len(pool), max(0, count - have)))
    rows = []
    for code in sorted(chosen):
        d = crss[code]
        # northing first: EPSG:3034/3035 ("north" axis first), UPS EPSG:32661/32761 (axis "N" first)
        swap = d["axes"][0][1] == "north" or d["axes"][0][0] == "N"
        fwd_in = sample(rng, extents[d["extent"]], POINTS_PER_CRS, d["method"])
        res = cs2cs(d["base"], code, [f"{lat:.9f} {lon:.9f}" for lat, lon in fwd_in])
        for (lat, lon), r in zip(fwd_in, res):
            if "*" in r[0] or "inf" in r[0].lower():
                continue
            e, n = (r[1], r[0]) if swap else (r[0], r[1])
            rows.append(f"fwd\t{code}\t{lat:.9f}\t{lon:.9f}\t{e}\t{n}")
        inv_src = sample(rng, extents[d["extent"]], POINTS_PER_CRS, d["method"])
        grid = cs2cs(d["base"], code, [f"{lat:.9f} {lon:.9f}" for lat, lon in inv_src])
        grid = [(round(float(a), 4), round(float(b), 4)) for a, b in grid if "*" not in a and "inf" not in a.lower()]
        res = cs2cs(code, d["base"], [f"{a:.4f} {b:.4f}" for a, b in grid])
        for (a, b), r in zip(grid, res):
            if "*" in r[0]:
                continue
            e, n = (b, a) if swap else (a, b)
            rows.append(f"inv\t{code}\t{r[0]}\t{r[1]}\t{e:.4f}\t{n:.4f}")
    version = subprocess.run(["cs2cs"], capture_output=True, text=True).stderr.splitlines()[0]
    with open(OUT, "w", encoding="utf-8") as out:
        out.write("# Map projections by PROJ cs2cs between each CRS and its base geographic CRS (same datum: projection only).\n")
        out.write(f"# Tool: {version}; generated by tests/reference-data/make-projection-reference.py (seed 20260401).\n")
        out.write("# e, n in the CRS's linear unit (see epsg-catalog.tsv); lat, lon in degrees. fwd: lat/lon in, e/n out; inv: e/n in, lat/lon out.\n")
        out.write(f"# {len(rows)} rows over {len(chosen)} CRSs: {' '.join(str(c) for c in sorted(chosen))}\n")
        out.write("dir\tepsg\tlat\tlon\te\tn\n")
        out.write("\n".join(rows) + "\n")
    print(f"{len(rows)} rows, {len(chosen)} CRSs")


if __name__ == "__main__":
    main()
