#!/usr/bin/env python3
"""Writes src/QaService.Core/Geodesy/Transformations/HelmertTable.g.cs from the EPSG data in PROJ's proj.db.

Source: EPSG Geodetic Parameter Dataset as shipped in Debian's proj-data 9.1.1 (/usr/share/proj/proj.db,
metadata EPSG.VERSION / EPSG.DATE printed into the output). EPSG terms of use (https://epsg.org/terms-of-use.html):
the dataset may be used and redistributed provided the EPSG attribution is kept and the data is not altered;
the parameters are copied verbatim, only converted to one set of units (metre, arc-second, ppm, per year).

Selection: every non-deprecated Helmert transformation (EPSG methods 1031/1032/1033/1035/1053/1056/9603/9606/9607)
between two of the datums below. Time-specific method 1065 is left out: it is only valid for coordinates at its
one epoch, which fixes in general are not. Usage: python3 tools/geodesy/make-helmert-table.py [proj.db] > out.cs
"""
import sqlite3
import sys

DB = sys.argv[1] if len(sys.argv) > 1 else "/usr/share/proj/proj.db"

# EPSG datum codes this service routes between (checked against proj.db's geodetic_datum table).
DATUMS = {
    6326: "World Geodetic System 1984 ensemble",
    1156: "World Geodetic System 1984 (G1762)",
    1309: "World Geodetic System 1984 (G2139)",
    1061: "International Terrestrial Reference Frame 2008",
    1165: "International Terrestrial Reference Frame 2014",
    1322: "International Terrestrial Reference Frame 2020",
    1186: "European Terrestrial Reference Frame 2000",
    6258: "European Terrestrial Reference System 1989 ensemble",
    1116: "NAD83 (National Spatial Reference System 2011)",
    6269: "North American Datum 1983",
    6140: "NAD83 Canadian Spatial Reference System",
    6283: "Geocentric Datum of Australia 1994",
    1168: "Geocentric Datum of Australia 2020",
}

METHODS = {
    1031: ("PositionVector", False), 1035: ("PositionVector", False), 9603: ("PositionVector", False),
    1033: ("PositionVector", False), 9606: ("PositionVector", False),
    1032: ("CoordinateFrame", False), 9607: ("CoordinateFrame", False),
    1053: ("PositionVector", True), 1056: ("CoordinateFrame", True),
}

# Factor from the EPSG unit to the table's unit (metre, arc-second, ppm; rates per year). Exact by definition.
LENGTH = {9001: 1.0, 1025: 1e-3}
ANGLE = {9104: 1.0, 1031: 1e-3, 9101: 648000.0 / 3.141592653589793, 9109: 648000.0 / 3.141592653589793 * 1e-6}
SCALE = {9202: 1.0, 1028: 1e-3}
LENGTH_RATE = {1042: 1.0, 1027: 1e-3}
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
codes = ",".join(str(c) for c in DATUMS)
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
        f'                {", ".join(lit(v) for v in dt)}, {", ".join(lit(v) for v in dr)}, {lit(dsr)}, {ep})),')

print(f"""// <auto-generated>
// Made by tools/geodesy/make-helmert-table.py from proj.db of PROJ {meta.get('PROJ.VERSION')} (proj-data {meta.get('PROJ_DATA.VERSION')}).
// Data: EPSG Geodetic Parameter Dataset {meta.get('EPSG.VERSION')} ({meta.get('EPSG.DATE')}), (c) IOGP, https://epsg.org —
// used under the EPSG terms of use (https://epsg.org/terms-of-use.html); parameters copied unaltered, only
// converted to metres, arc-seconds and parts per million (rates per year). Regenerate, do not edit.
// </auto-generated>
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
