#!/usr/bin/env python3
"""Writes src/QaService.Core/Geodesy/Vertical/egm96-15.grid.gz, the EGM96 15' geoid grid the service ships.

Source: PROJ's egm96_15.gtx (Debian proj-data 9.1.1, /usr/share/proj/egm96_15.gtx), itself NGA's EGM96 15-minute
geoid undulation grid (WGS 84, tide-free; public domain, US National Geospatial-Intelligence Agency).
Encoding (little-endian): magic "EGM96Q1\\0", int32 rows, int32 cols, float64 south latitude, west longitude,
latitude step, longitude step (degrees); then, row by row from the south and west to east, each undulation
rounded to whole millimetres and stored as the zigzag-varint difference from the previous value in the row
(the first from 0); the whole gzip-compressed. Rounding to 1 mm adds at most 0.5 mm to PROJ's float32 values.
Usage: python3 tools/geodesy/make-egm96-grid.py [/usr/share/proj/egm96_15.gtx]
"""
import array
import gzip
import os
import struct
import sys

SRC = sys.argv[1] if len(sys.argv) > 1 else "/usr/share/proj/egm96_15.gtx"
OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "src", "QaService.Core", "Geodesy", "Vertical", "egm96-15.grid.gz")

data = open(SRC, "rb").read()
lat0, lon0, dlat, dlon, rows, cols = struct.unpack(">4d2i", data[:40])
values = array.array("f")
values.frombytes(data[40:40 + 4 * rows * cols])
if sys.byteorder == "little":
    values.byteswap()

out = bytearray(b"EGM96Q1\0")
out += struct.pack("<2i4d", rows, cols, lat0, lon0, dlat, dlon)
for r in range(rows):
    prev = 0
    for v in values[r * cols:(r + 1) * cols]:
        mm = int(round(v * 1000.0))
        d = mm - prev
        prev = mm
        z = (d << 1) ^ (d >> 63)  # zigzag
        while z >= 0x80:
            out.append((z & 0x7F) | 0x80)
            z >>= 7
        out.append(z)
with gzip.GzipFile(OUT, "wb", compresslevel=9, mtime=0) as f:
    f.write(out)
print(f"{rows}x{cols} grid, {len(out)} bytes raw, {os.path.getsize(OUT)} bytes gzip -> {os.path.normpath(OUT)}")
