#!/usr/bin/env python3
"""Differential sweep of every EPSG datum transformation QaService carries (HelmertTable.g.cs, GridTable.g.cs)
against PROJ, each over its own EPSG area of use.

    cd <repo root> && python3 tests/reference-data/make-datum-sweep.py > tests/reference-data/datum-sweep-proj.tsv

Needs PROJ (projinfo, cct; Debian proj-bin, proj-data). For each operation code: a geographic CRS on its source
datum and one on its target datum (the ones EPSG names on the operation when they are geographic 2D, else 3D ones),
`projinfo -s SRC -t DST --spatial-test intersects -o PROJ` lists the candidates (a superseded operation, which
that listing hides, is taken from `projinfo -k operation` when the CRSs are the operation's own), the candidate with this code is
pinned (its pipeline goes into the file), and `cct` runs it on 4 points inside the area of use (fixed fractions
of the box), height 0, time 2020.0. A grid PROJ names by its CDN .tif is replaced by the Debian proj-data file the
table names (PROJ 9.1.1 finds BETA2007.gsb itself, but not CHENYX06a.gsb for "CHENyx06a" on a case-sensitive
file system). Points cct cannot carry (outside a grid) are left out.
Columns: code, lat, lon (source, degrees), lat, lon (target, degrees, PROJ).
"""
import re
import sqlite3
import subprocess
import sys

DB = "/usr/share/proj/proj.db"
con = sqlite3.connect(DB)
FRACTIONS = [(0.5, 0.5), (0.25, 0.3), (0.7, 0.75), (0.35, 0.8)]
TIME = 2020.0


def table_codes(path, with_file=False):
    text = open(path).read()
    rows = re.findall(r'new\(EpsgCode: (\d+),.*?SourceDatum: "EPSG:(\d+)", TargetDatum: "EPSG:(\d+)"(.*?)AreaOfUse\("[^"]*", ([-\d.e]+), ([-\d.e]+), ([-\d.e]+), ([-\d.e]+)\)', text, re.S)
    out = []
    for code, sd, td, body, s, n, w, e in rows:
        f = re.search(r'FileName: "([^"]+)"', body)
        out.append((int(code), int(sd), int(td), float(s), float(n), float(w), float(e), f.group(1) if f else None))
    return out


def geographic(datum, preferred):
    row = con.execute("select type from geodetic_crs where auth_name='EPSG' and code=?", (preferred,)).fetchone()
    if row and row[0] in ("geographic 2D",):
        return preferred
    # An operation EPSG defines between geocentric CRSs (time-dependent ones) is listed by projinfo between 3D CRSs.
    for kind in ("geographic 3D", "geographic 2D") if row and row[0] != "geographic 2D" else ("geographic 2D", "geographic 3D"):
        row = con.execute("select code from geodetic_crs where auth_name='EPSG' and datum_auth_name='EPSG' and datum_code=? "
                          "and type=? and deprecated=0 order by cast(code as integer) limit 1", (datum, kind)).fetchone()
        if row:
            return int(row[0])
    return None


def single_operation(head, name):
    """True when projinfo's unnamed candidate is only this operation wrapped in CRS conversions (no second datum step)."""
    steps = head[len("unknown id, "):].split(", ")[0].split(" + ")
    others = [s for s in steps if s not in (name, "Inverse of " + name)]
    return len(others) < len(steps) and all("onversion" in s for s in others)


def name_of(code):
    for table in ("helmert_transformation_table", "grid_transformation"):
        row = con.execute(f"select name from {table} where auth_name='EPSG' and code=?", (code,)).fetchone()
        if row:
            return row[0]
    raise KeyError(code)


def operation_crs(code):
    for table in ("helmert_transformation_table", "grid_transformation"):
        row = con.execute(f"select source_crs_code, target_crs_code from {table} where auth_name='EPSG' and code=?", (code,)).fetchone()
        if row:
            return int(row[0]), int(row[1])
    raise KeyError(code)


def pinned_pipeline(src, dst, code, own_crs):
    head, pipe = pinned_pipeline_listed(src, dst, code, [])
    if pipe or (src, dst) != own_crs:
        return head, pipe
    # projinfo hides operations EPSG marks as superseded from -s/-t listings; they are still valid EPSG operations,
    # so between the operation's own geographic CRSs its pipeline is taken from `projinfo -k operation EPSG:code`.
    out = subprocess.run(["projinfo", "-k", "operation", f"EPSG:{code}", "-o", "PROJ", "-q", "--single-line"], capture_output=True, text=True).stdout.strip()
    return (f"EPSG:{code} (projinfo -k operation; superseded, not listed by -s/-t)", out) if out.startswith("+proj=") else (None, None)


def pinned_pipeline_listed(src, dst, code, extra):
    out = subprocess.run(["projinfo", "-s", f"EPSG:{src}", "-t", f"EPSG:{dst}", "--spatial-test", "intersects", "-o", "PROJ"] + extra,
                         capture_output=True, text=True).stdout
    for block in out.split("-------------------------------------"):
        lines = [l for l in block.strip().splitlines() if l.strip()]
        if len(lines) < 3 or not lines[0].startswith("Operation No."):
            continue
        head = lines[1]
        # By code, or (a concatenation of CRS conversions and the operation, which projinfo names "unknown id") by EPSG name.
        if re.match(rf"^(INVERSE\()?(DERIVED_FROM\()?EPSG\)*:{code},", head) or (
                head.startswith("unknown id, ") and single_operation(head, name_of(code))):
            i = lines.index("PROJ string:")
            return head, " ".join(l.strip() for l in lines[i + 1:] if not l.startswith("Grid "))
    return None, None


def main():
    version = subprocess.run("projinfo 2>&1 | head -1", shell=True, capture_output=True, text=True).stdout.strip()
    meta = dict(con.execute("select key, value from metadata"))
    print(f"# Datum transformations of HelmertTable.g.cs and GridTable.g.cs run by PROJ ({version}; proj.db EPSG {meta['EPSG.VERSION']}),"
          f" pinned per code from projinfo --spatial-test intersects; generated by tests/reference-data/make-datum-sweep.py")
    print("# op\tcode\tsource CRS\ttarget CRS\tprojinfo header\tpipeline  |  pt\tcode\tlat\tlon\tlat PROJ\tlon PROJ")
    ops = table_codes("src/QaService.Core/Geodesy/Transformations/HelmertTable.g.cs") + \
        table_codes("src/QaService.Core/Geodesy/Transformations/GridTable.g.cs")
    only = {int(c) for c in sys.argv[1].split(",")} if len(sys.argv) > 1 else None  # re-run a few codes: make-datum-sweep.py 1101,1102
    missing = []
    for code, sd, td, s, n, w, e, grid in ops:
        if only is not None and code not in only:
            continue
        osrc, odst = operation_crs(code)
        src, dst = geographic(sd, osrc), geographic(td, odst)
        if src is None or dst is None:
            missing.append((code, "no geographic CRS"))
            continue
        head, pipe = pinned_pipeline(src, dst, code, (osrc, odst))
        if pipe is None:
            missing.append((code, f"not among projinfo's candidates for EPSG:{src} -> EPSG:{dst}"))
            continue
        if grid:
            pipe = re.sub(r"\+grids=\S+", f"+grids={grid}", pipe)
        if e < w:
            e += 360
        pts = []
        for fy, fx in FRACTIONS:
            lon = w + (e - w) * fx
            pts.append((s + (n - s) * fy, lon - 360 if lon > 180 else lon))
        text = "".join(f"{lat!r} {lon!r} 0 {TIME}\n" for lat, lon in pts)
        run = subprocess.run(["cct", "-d", "12"] + pipe.split(), input=text, capture_output=True, text=True)
        lines = run.stdout.strip().splitlines()
        if run.returncode != 0 or len(lines) != len(pts):
            missing.append((code, f"cct failed: {run.stderr.strip()[:200]}"))
            continue
        print(f"op\t{code}\tEPSG:{src}\tEPSG:{dst}\t{head}\t{pipe}")
        for (lat, lon), line in zip(pts, lines):
            p = line.split()
            if any(x in ("inf", "-inf", "nan") or abs(float(x)) > 1e9 for x in p[:2]):
                continue
            print(f"pt\t{code}\t{lat!r}\t{lon!r}\t{p[0]}\t{p[1]}")
    for code, why in missing:
        print(f"# not swept: EPSG:{code}: {why}")
        print(f"not swept EPSG:{code}: {why}", file=sys.stderr)


if __name__ == "__main__":
    main()
