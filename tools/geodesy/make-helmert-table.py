#!/usr/bin/env python3
"""Writes src/QaService.Core/Geodesy/Transformations/HelmertTable.g.cs from the EPSG data in PROJ's proj.db.

Source: EPSG Geodetic Parameter Dataset as shipped in Debian's proj-data 9.1.1 (/usr/share/proj/proj.db,
metadata EPSG.VERSION / EPSG.DATE printed into the output). EPSG terms of use (https://epsg.org/terms-of-use.html):
the dataset may be used and redistributed provided the EPSG attribution is kept and the data is not altered;
the parameters are copied verbatim, only converted to one set of units (metre, arc-second, ppm, per year).

Selection: every non-deprecated Helmert transformation (EPSG methods 1031/1032/1033/1035/1053/1056/9603/9606/9607)
between two of the datums datum_scope.datums() selects, each with its EPSG area of use. Time-specific method 1065 is
left out: it is only valid for coordinates at its one epoch, which fixes in general are not.
With --grids, writes GridTable.g.cs instead: every non-deprecated EPSG NTv2 operation (method 9615) between two
selected datums whose grid file is in the PROJ data folder (file name as found there, read at run time).
Usage: python3 tools/geodesy/make-helmert-table.py [proj.db] [grid folder] [--grids] > out.cs
"""
import os
import sqlite3
import sys

DB = sys.argv[1] if len(sys.argv) > 1 else "/usr/share/proj/proj.db"

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import datum_scope  # noqa: E402

GRID_FOLDER = sys.argv[2] if len(sys.argv) > 2 else "/usr/share/proj"
METHODS = datum_scope.HELMERT_METHODS

# Factor from the EPSG unit to the table's unit (metre, arc-second, ppm; rates per year). Exact by definition.
LENGTH = {9001: 1.0, 1025: 1e-3, 1033: 1e-2}
ANGLE = {9104: 1.0, 1031: 1e-3, 9101: 648000.0 / 3.141592653589793, 9109: 648000.0 / 3.141592653589793 * 1e-6,
         9113: 0.324}  # centesimal second: 1e-4 gon = 0.9e-4 degree = 0.324 arc-second
SCALE = {9202: 1.0, 1028: 1e-3, 9201: 1e6}  # 9201 unity: a scale difference given as a plain ratio
LENGTH_RATE = {1042: 1.0, 1027: 1e-3, 1034: 1e-2}
ANGLE_RATE = {1043: 1.0, 1032: 1e-3}
SCALE_RATE = {1041: 1.0, 1030: 1e-3}


def conv(value, unit, table, what, code):
    if value is None:
        return 0.0
    if unit is None:
        unit = next(iter(table))
    if int(unit) not in table:
        raise SystemExit(f"EPSG:{code}: unknown {what} unit EPSG:{unit}")
    return float(value) * table[int(unit)]


def lit(x):
    r = repr(float(x))
    return r if ("e" in r or "." in r) else r + ".0"


con = sqlite3.connect(DB)
meta = dict(con.execute("select key, value from metadata"))
DATUMS = datum_scope.datums(con.execute, GRID_FOLDER)
codes = ",".join(str(c) for c in DATUMS)


def area(table, code):
    """The EPSG extent of an operation as C# (first usage, as the catalog does for CRSs)."""
    s_, n_, w_, e_, name_ = con.execute(
        "select e.south_lat, e.north_lat, e.west_lon, e.east_lon, e.name from usage u join extent e on "
        "e.auth_name=u.extent_auth_name and e.code=u.extent_code where u.object_table_name=? and u.object_auth_name='EPSG' "
        "and u.object_code=? order by cast(u.code as integer) limit 1", (table, code)).fetchone()
    return f'new AreaOfUse("{name_}", {lit(s_)}, {lit(n_)}, {lit(w_)}, {lit(e_)})'


def ellipsoid(datum):
    name_, a_, rf_, b_, uom = con.execute(
        "select e.name, e.semi_major_axis, e.inv_flattening, e.semi_minor_axis, e.uom_code from geodetic_datum d join ellipsoid e "
        "on e.auth_name=d.ellipsoid_auth_name and e.code=d.ellipsoid_code where d.auth_name='EPSG' and d.code=?", (datum,)).fetchone()
    factor = con.execute("select conv_factor from unit_of_measure where auth_name='EPSG' and code=?", (uom,)).fetchone()[0]
    a_ = a_ * factor
    rf_ = rf_ if rf_ else a_ / (a_ - b_ * factor)
    return f'new Ellipsoid("{name_}", {lit(a_)}, {lit(rf_)})'


if "--grids" in sys.argv:
    present, _ = datum_scope.grid_links(con.execute, GRID_FOLDER)
    chosen = {c: (f, inv) for c, s_, t_, f, inv in present if s_ in DATUMS and t_ in DATUMS}
    lines = []
    for code, name, sd, td, acc in con.execute(
            "select g.code, g.name, gs.datum_code, gt.datum_code, g.accuracy from grid_transformation g "
            "join geodetic_crs gs on gs.auth_name=g.source_crs_auth_name and gs.code=g.source_crs_code "
            "join geodetic_crs gt on gt.auth_name=g.target_crs_auth_name and gt.code=g.target_crs_code "
            "where g.auth_name='EPSG' order by cast(g.code as integer)"):
        if int(code) not in chosen:
            continue
        file, inverse = chosen[int(code)]
        lines.append(
            f'        new(EpsgCode: {code}, Name: "{name}", SourceDatum: "EPSG:{sd}", TargetDatum: "EPSG:{td}", AccuracyMetres: {lit(acc)},\n'
            f'            FileName: "{file}", FileIsInverse: {"true" if inverse else "false"}, Package: "{datum_scope.GRID_PACKAGE}",\n'
            f'            SourceEllipsoid: {ellipsoid(sd)}, TargetEllipsoid: {ellipsoid(td)},\n'
            f'            Area: {area("grid_transformation", code)}),')
    print(f"""// <auto-generated>
// Made by tools/geodesy/make-helmert-table.py --grids from proj.db of PROJ {meta.get('PROJ.VERSION')} (proj-data {meta.get('PROJ_DATA.VERSION')}).
// Data: EPSG Geodetic Parameter Dataset {meta.get('EPSG.VERSION')} ({meta.get('EPSG.DATE')}), (c) IOGP, https://epsg.org —
// used under the EPSG terms of use (https://epsg.org/terms-of-use.html). Grid files are PROJ's (Debian package
// proj-data), read at run time from the configured grid folder. Regenerate, do not edit.
// </auto-generated>
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>EPSG NTv2 grid transformations between the service's datums whose grid file Debian's proj-data ships (generated).</summary>
public static class GridTable
{{
    /// <summary>Every such transformation, in EPSG code order.</summary>
    public static IReadOnlyList<GridTransformationDefinition> Transformations {{ get; }} =
    [
{chr(10).join(lines)}
    ];
}}""")
    sys.exit(0)
rows = con.execute(f"""
select h.code, h.name, h.method_code, gs.datum_code, gt.datum_code, h.accuracy,
       h.tx, h.ty, h.tz, h.translation_uom_code, h.rx, h.ry, h.rz, h.rotation_uom_code,
       h.scale_difference, h.scale_difference_uom_code,
       h.rate_tx, h.rate_ty, h.rate_tz, h.rate_translation_uom_code,
       h.rate_rx, h.rate_ry, h.rate_rz, h.rate_rotation_uom_code,
       h.rate_scale_difference, h.rate_scale_difference_uom_code, h.epoch
from helmert_transformation_table h
join geodetic_crs gs on gs.auth_name = h.source_crs_auth_name and gs.code = h.source_crs_code
join geodetic_crs gt on gt.auth_name = h.target_crs_auth_name and gt.code = h.target_crs_code
where h.auth_name = 'EPSG' and h.deprecated = 0 and h.accuracy is not null
  and gs.datum_code in ({codes}) and gt.datum_code in ({codes}) and gs.datum_code <> gt.datum_code
order by cast(h.code as integer)""").fetchall()

seen = set()
entries = []
for r in rows:
    (code, name, method, sd, td, acc, tx, ty, tz, tu, rx, ry, rz, ru, ds, su,
     dtx, dty, dtz, dtu, drx, dry, drz, dru, dds, dsu, epoch) = r
    method = int(method)
    if method not in METHODS:
        continue
    key = (code,)
    if key in seen:
        continue
    seen.add(key)
    convention, dynamic = METHODS[method]
    t = [conv(v, tu, LENGTH, "translation", code) for v in (tx, ty, tz)]
    rot = [conv(v, ru, ANGLE, "rotation", code) for v in (rx, ry, rz)]
    s = conv(ds, su, SCALE, "scale", code)
    if dynamic:
        dt = [conv(v, dtu, LENGTH_RATE, "translation rate", code) for v in (dtx, dty, dtz)]
        dr = [conv(v, dru, ANGLE_RATE, "rotation rate", code) for v in (drx, dry, drz)]
        dsr = conv(dds, dsu, SCALE_RATE, "scale rate", code)
        ep = lit(epoch)
    else:
        dt, dr, dsr, ep = [0.0] * 3, [0.0] * 3, 0.0, "null"
    entries.append(
        f'        new(EpsgCode: {code}, Name: "{name}", MethodCode: {method}, SourceDatum: "EPSG:{sd}", TargetDatum: "EPSG:{td}",\n'
        f'            AccuracyMetres: {lit(acc)}, new HelmertParameters(HelmertConvention.{convention},\n'
        f'                {", ".join(lit(v) for v in t)}, {", ".join(lit(v) for v in rot)}, {lit(s)},\n'
        f'                {", ".join(lit(v) for v in dt)}, {", ".join(lit(v) for v in dr)}, {lit(dsr)}, {ep}),\n'
        f'            {area("helmert_transformation", code)}),')

print(f"""// <auto-generated>
// Made by tools/geodesy/make-helmert-table.py from proj.db of PROJ {meta.get('PROJ.VERSION')} (proj-data {meta.get('PROJ_DATA.VERSION')}).
// Data: EPSG Geodetic Parameter Dataset {meta.get('EPSG.VERSION')} ({meta.get('EPSG.DATE')}), (c) IOGP, https://epsg.org —
// used under the EPSG terms of use (https://epsg.org/terms-of-use.html); parameters copied unaltered, only
// converted to metres, arc-seconds and parts per million (rates per year). Regenerate, do not edit.
// </auto-generated>
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>EPSG Helmert transformations between the datums this service routes between (generated).</summary>
public static partial class HelmertTable
{{
    /// <summary>EPSG dataset version the table was taken from.</summary>
    public const string EpsgVersion = "{meta.get('EPSG.VERSION')}";

    /// <summary>Every non-deprecated EPSG Helmert transformation between two supported datums, in EPSG code order.</summary>
    public static IReadOnlyList<DatumTransformationDefinition> Transformations {{ get; }} =
    [
{chr(10).join(entries)}
    ];
}}""")
