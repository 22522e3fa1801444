#!/usr/bin/env python3
"""Writes reference case 0 of assessment-cases.json as field files, for the multipart acceptance test:
the same marks and fixes as CSV, GeoJSON (RFC 7946), GPX 1.1 and NMEA 0183 (GGA with geoid separation,
GST, GSA, RMC). The expected figures stay those of assessment-cases.json (computed there with PROJ,
GeographicLib and numpy/scipy), so the files are tested against an answer made outside QaService.

NMEA: latitude/longitude as ddmm.mmmmmmmm (1e-8 minute = 0.02 mm); the fix's ellipsoidal height h is
split into an invented geoid separation N (45.0 to 47.3 m) and altitude above the geoid h - N, so the
reader must add them back. Checksums are the XOR of the characters between $ and * (NMEA 0183).
Talker ids rotate through GP GL GA GB GI GQ GN. Only the Python standard library is used.

Regenerate: /usr/bin/python3 tests/reference-data/make-field-files.py
"""
import json, os

here = os.path.dirname(os.path.abspath(__file__))
case = json.load(open(os.path.join(here, "assessment-cases.json")))["cases"][0]["request"]
out = os.path.join(here, "field-files")
os.makedirs(out, exist_ok=True)
marks, fixes = case["marks"]["points"], case["fixes"]["points"]


def write(name, text):
    with open(os.path.join(out, name), "w", newline="") as f:
        f.write(text)


# Marks: CSV with contract headers (UTM 33N metres), and GeoJSON with projected positions.
write("case0-marks.csv", "id,e,n,h\n" + "".join(f"{m['id']},{m['e']!r},{m['n']!r},{m['h']!r}\n" for m in marks))
write("case0-marks.geojson", json.dumps({"type": "FeatureCollection", "features": [
    {"type": "Feature", "geometry": {"type": "Point", "coordinates": [m["e"], m["n"], m["h"]]}, "properties": {"id": m["id"]}}
    for m in marks]}, indent=1))

# Fixes, CSV: semicolon delimiter, decimal comma, own headers (mapped in the options), CRLF line ends.
rows = ["Punkt;Marke;Breite;Laenge;Hoehe;Zeit"]
for i, f in enumerate(fixes):
    rows.append(";".join([f["id"], f["mark"], repr(f["lat"]).replace(".", ","), repr(f["lon"]).replace(".", ","),
                          repr(f["h"]).replace(".", ","), f"2026-05-26T09:{i:02d}:00Z"]))
write("case0-fixes.csv", "\r\n".join(rows) + "\r\n")

# Fixes, GeoJSON: [lon, lat, h] with properties id, mark, time.
write("case0-fixes.geojson", json.dumps({"type": "FeatureCollection", "features": [
    {"type": "Feature", "geometry": {"type": "Point", "coordinates": [f["lon"], f["lat"], f["h"]]},
     "properties": {"id": f["id"], "mark": f["mark"], "time": f"2026-05-26T09:{i:02d}:00Z"}}
    for i, f in enumerate(fixes)]}))

# Fixes, GPX 1.1: waypoints and a track (ele = ellipsoidal height, as the options state).
wpts = "".join(f'  <wpt lat="{f["lat"]!r}" lon="{f["lon"]!r}"><ele>{f["h"]!r}</ele><time>2026-05-26T09:{i:02d}:00Z</time><name>{f["id"]}</name><sat>14</sat><hdop>0.7</hdop></wpt>\n'
               for i, f in enumerate(fixes[:12]))
trkpts = "".join(f'      <trkpt lat="{f["lat"]!r}" lon="{f["lon"]!r}"><ele>{f["h"]!r}</ele><time>2026-05-26T09:{i + 12:02d}:00Z</time><name>{f["id"]}</name></trkpt>\n'
                 for i, f in enumerate(fixes[12:]))
write("case0-fixes.gpx", '<?xml version="1.0" encoding="UTF-8"?>\n'
      '<gpx version="1.1" creator="make-field-files.py" xmlns="http://www.topografix.com/GPX/1/1">\n'
      + wpts + "  <trk><name>walk</name><trkseg>\n" + trkpts + "  </trkseg></trk>\n</gpx>\n")


# Fixes, NMEA 0183.
def sentence(body):
    c = 0
    for ch in body:
        c ^= ord(ch)
    return f"${body}*{c:02X}\r\n"


def ddmm(value, degree_digits, pos, neg):
    hemi = pos if value >= 0 else neg
    v = abs(value)
    d = int(v)
    minutes = (v - d) * 60
    return f"{d:0{degree_digits}d}{minutes:011.8f}", hemi


talkers = ["GP", "GL", "GA", "GB", "GI", "GQ", "GN"]
lines = []
for i, f in enumerate(fixes):
    t = talkers[i % len(talkers)]
    hhmmss = f"09{i:02d}00.00"
    lat, ns = ddmm(f["lat"], 2, "N", "S")
    lon, ew = ddmm(f["lon"], 3, "E", "W")
    sep = 45.0 + 0.1 * i
    alt = f["h"] - sep
    lines.append(sentence(f"{t}RMC,{hhmmss},A,{lat},{ns},{lon},{ew},0.0,0.0,260526,,,R"))
    lines.append(sentence(f"{t}GGA,{hhmmss},{lat},{ns},{lon},{ew},4,18,0.7,{alt:.4f},M,{sep:.4f},M,1.0,0031"))
    lines.append(sentence(f"{t}GSA,A,3,02,05,07,09,13,15,18,20,,,,,1.3,0.7,1.1"))
    lines.append(sentence(f"{t}GST,{hhmmss},0.012,0.010,0.008,32.0,0.009,0.008,0.015"))
# One sentence before the first fix with no position yet (quality 0): not a fix.
write("case0-fixes.nmea", sentence("GNGGA,085959.00,,,,,0,00,99.99,,,,,,") + "".join(lines))
