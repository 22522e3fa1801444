#!/usr/bin/python3
"""Writes epsg-catalog.tsv, the CRS catalog embedded in QaService.Core, from the EPSG Geodetic
Parameter Dataset as shipped in Debian's PROJ database (package proj-data, /usr/share/proj/proj.db).

Usage:  /usr/bin/python3 make-epsg-catalog.py [/usr/share/proj/proj.db] > epsg-catalog.tsv

Selection: every non-deprecated EPSG geodetic CRS (geographic 2D/3D, geocentric) on the datums
datum_scope.datums() selects, and every non-deprecated EPSG projected CRS based on one of them whose conversion method
is in METHODS (the methods QaService.Core implements). Angles are written in decimal degrees
(sexagesimal DMS and grads converted), lengths in metres (US survey foot exactly 1200/3937 m),
scale factors unitless; floats as Python repr (shortest round-trip text).

Record types (tab-separated, first column):
  D  datum code, name, ellipsoid name, a (m), 1/f, frame reference epoch (decimal year or empty),
     ensemble accuracy (m or empty)
  A  extent code, south, north, west, east (degrees; west > east crosses the antimeridian), name
  U  unit code, name, metres per unit
  M  method code, name
  P  parameter code, name
  C  code, kind (geog2d|geog3d|geocen|proj), name, datum code, base CRS code, method code,
     parameters (code=value;…), unit code, axes (abbrev:orientation;…), extent code
"""
import os
import sqlite3
import sys
from fractions import Fraction

# Datums in scope: the hubs (WGS 84, ITRF, ETRS89/ETRF, NAD83, GDA) and every datum proj.db links to one of them
# by a Helmert the service implements or an NTv2 grid in the PROJ data folder; see tools/geodesy/datum_scope.py.
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "..", "..", "tools", "geodesy"))
import datum_scope  # noqa: E402

# Conversion methods implemented in src/QaService.Core/Geodesy/Projections (and TransverseMercator.cs).
METHODS = [9807, 9801, 9802, 9804, 9805, 1024, 9809, 9810, 9829, 9820, 9822, 9812, 9815]

# Axis orientations whose values are the projection's own x (first) and y (second) unchanged.
# Westing/southing axes (e.g. EPSG CS 1031 "X west") would need a sign flip and are left out.
KINDS = {"geographic 2D": "geog2d", "geographic 3D": "geog3d", "geocentric": "geocen"}
EXACT_METRES = {9001: Fraction(1), 9002: Fraction(3048, 10000), 9003: Fraction(1200, 3937)}


def dms_to_degrees(value):
    """EPSG unit 9110 'sexagesimal DMS' (DDD.MMSSsss…) to decimal degrees, read from its decimal text."""
    text = repr(abs(value))
    if "e" in text:
        text = f"{abs(value):.12f}"
    whole, _, frac = text.partition(".")
    frac = (frac + "0000")
    minutes = int(frac[0:2])
    seconds = Fraction(int(frac[2:4]))
    rest = frac[4:].rstrip("0")
    if rest:
        seconds += Fraction(int(rest), 10 ** len(rest))
    degrees = int(whole) + Fraction(minutes, 60) + seconds / 3600
    return float(-degrees if value < 0 else degrees)


def angle_to_degrees(value, uom):
    if uom in (9102, 9122):
        return float(value)
    if uom == 9110:
        return dms_to_degrees(value)
    if uom == 9105:
        return float(Fraction(value) * Fraction(9, 10))
    if uom == 9101:
        import math
        return math.degrees(value)
    raise ValueError(f"angle unit {uom}")


def main():
    path = sys.argv[1] if len(sys.argv) > 1 else "/usr/share/proj/proj.db"
    db = sqlite3.connect(path)
    q = db.execute
    meta = dict(q("select key, value from metadata"))
    units = {int(c): (n, t, f) for c, n, t, f in q(
        "select code, name, type, conv_factor from unit_of_measure where auth_name='EPSG'")}

    def metres_per(uom):
        return float(EXACT_METRES.get(uom, Fraction(units[uom][2])))

    def length_to_metres(value, uom):
        return float(Fraction(value) * EXACT_METRES[uom]) if uom in EXACT_METRES else value * units[uom][2]

    def convert(value, uom):
        kind = units[uom][1]
        if kind == "angle":
            return angle_to_degrees(value, uom)
        if kind == "length":
            return length_to_metres(value, uom)
        if uom == 9202:  # parts per million
            return 1 + value * 1e-6
        return float(value)

    def axes(cs_code):
        return list(q("select abbrev, orientation, uom_code from axis where coordinate_system_auth_name='EPSG' "
                      "and coordinate_system_code=? order by coordinate_system_order", (cs_code,)))

    def extent_of(table, code):
        row = q("select u.extent_code from usage u where u.object_table_name=? and u.object_auth_name='EPSG' "
                "and u.object_code=? order by cast(u.code as integer) limit 1", (table, code)).fetchone()
        return int(row[0])

    DATUMS = datum_scope.datums(q)
    datum_rows = {}
    for code in DATUMS:
        name, ell, a, rf, b, uom, epoch, acc, dep = q(
            "select d.name, e.name, e.semi_major_axis, e.inv_flattening, e.semi_minor_axis, e.uom_code, d.frame_reference_epoch, "
            "d.ensemble_accuracy, d.deprecated from geodetic_datum d join ellipsoid e on e.auth_name=d.ellipsoid_auth_name "
            "and e.code=d.ellipsoid_code where d.auth_name='EPSG' and d.code=?", (code,)).fetchone()
        # Axes in metres (e.g. Clarke 1858 is given in Clarke's feet); 1/f from b where EPSG defines the ellipsoid by a and b.
        a, b = length_to_metres(a, int(uom)), (None if b is None else length_to_metres(b, int(uom)))
        rf = rf if rf else a / (a - b)
        assert not dep and rf, code
        datum_rows[code] = f"D\t{code}\t{name}\t{ell}\t{a!r}\t{rf!r}\t{'' if epoch is None else repr(epoch)}\t{'' if acc is None else repr(acc)}"

    crs_rows, extents, used_units, used_methods, used_params = [], set(), set(), set(), set()
    marks = ",".join("?" * len(DATUMS))
    for code, name, kind, cs, datum in q(
            f"select code, name, type, coordinate_system_code, datum_code from geodetic_crs where auth_name='EPSG' "
            f"and deprecated=0 and datum_auth_name='EPSG' and datum_code in ({marks}) order by code", DATUMS):
        if kind not in KINDS:
            continue
        ax = axes(cs)
        ext = extent_of("geodetic_crs", code)
        extents.add(ext)
        unit = 9001
        used_units.add(unit)
        axis_text = ";".join(f"{a}:{o}" for a, o, _ in ax)
        crs_rows.append((int(code), f"C\t{code}\t{KINDS[kind]}\t{name}\t{datum}\t\t\t\t{unit}\t{axis_text}\t{ext}"))

    skipped = []
    for row in q(f"""select p.code, p.name, p.coordinate_system_code, g.code, g.datum_code, c.method_code,
            c.param1_code, c.param1_value, c.param1_uom_code, c.param2_code, c.param2_value, c.param2_uom_code,
            c.param3_code, c.param3_value, c.param3_uom_code, c.param4_code, c.param4_value, c.param4_uom_code,
            c.param5_code, c.param5_value, c.param5_uom_code, c.param6_code, c.param6_value, c.param6_uom_code,
            c.param7_code, c.param7_value, c.param7_uom_code
            from projected_crs p join geodetic_crs g on g.auth_name=p.geodetic_crs_auth_name and g.code=p.geodetic_crs_code
            join conversion c on c.auth_name=p.conversion_auth_name and c.code=p.conversion_code
            where p.auth_name='EPSG' and p.deprecated=0 and g.datum_auth_name='EPSG' and g.datum_code in ({marks})
            order by p.code""", DATUMS):
        code, name, cs, base, datum, method = row[:6]
        if int(method) not in METHODS:
            continue
        ax = axes(cs)
        orientations = [o.lower() for _, o, _ in ax]
        if len(ax) != 2 or "west" in orientations or "south" in orientations or ax[0][2] != ax[1][2]:
            skipped.append(f"{code} {name}: axes {ax}")
            continue
        params = []
        for i in range(7):
            pcode, value, uom = row[6 + 3 * i: 9 + 3 * i]
            if pcode is None:
                continue
            params.append(f"{pcode}={convert(value, int(uom))!r}")
            used_params.add(int(pcode))
        unit = int(ax[0][2])
        used_units.add(unit)
        used_methods.add(int(method))
        ext = extent_of("projected_crs", code)
        extents.add(ext)
        axis_text = ";".join(f"{a}:{o}" for a, o, _ in ax)
        crs_rows.append((int(code), f"C\t{code}\tproj\t{name}\t{datum}\t{base}\t{method}\t{';'.join(params)}\t{unit}\t{axis_text}\t{ext}"))

    print("# QaService CRS catalog, generated by src/QaService.Core/Geodesy/Catalog/make-epsg-catalog.py")
    print(f"# Source: EPSG Geodetic Parameter Dataset {meta['EPSG.VERSION']} ({meta['EPSG.DATE']}), as shipped in "
          f"PROJ {meta['PROJ.VERSION']} proj.db (Debian proj-data {meta['PROJ_DATA.VERSION']}).")
    print("# Attribution: EPSG Geodetic Parameter Dataset, IOGP (International Association of Oil & Gas Producers).")
    print("# Terms of use: https://epsg.org/terms-of-use.html — the dataset may be used, copied and distributed provided")
    print("# the IOGP copyright and this attribution are kept; this file is a subset whose values were unit-converted")
    print("# (angles to decimal degrees, lengths to metres) and is not the authoritative EPSG dataset.")
    print(f"# Counts: {len(crs_rows)} CRSs; {len(skipped)} projected CRSs skipped for westing/southing or mixed-unit axes.")
    print("# Columns per record type are described in the generator's docstring.")
    for code in DATUMS:
        print(datum_rows[code])
    for ext in sorted(extents):
        s, n, w, e, name = q("select south_lat, north_lat, west_lon, east_lon, name from extent where auth_name='EPSG' and code=?", (ext,)).fetchone()
        print(f"A\t{ext}\t{s!r}\t{n!r}\t{w!r}\t{e!r}\t{name}")
    for unit in sorted(used_units):
        print(f"U\t{unit}\t{units[unit][0]}\t{metres_per(unit)!r}")
    for method in sorted(used_methods):
        print(f"M\t{method}\t{q('select name from conversion_method where auth_name=? and code=?', ('EPSG', method)).fetchone()[0]}")
    for param in sorted(used_params):
        print(f"P\t{param}\t{q('select name from conversion_param where auth_name=? and code=?', ('EPSG', param)).fetchone()[0]}")
    for _, line in sorted(crs_rows):
        print(line)
    for s in skipped:
        print(f"skipped {s}", file=sys.stderr)


if __name__ == "__main__":
    main()
