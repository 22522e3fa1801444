#!/usr/bin/env python3
"""Independent reference for the report's attribute groups, their tests of difference and the receiver calibration.

Regenerate (Debian python3-scipy):
    /usr/bin/python3 tests/reference-data/make-group-reference.py > tests/reference-data/group-cases.json

An invented survey (Ostrava-Lipno water utility, marks LP-001 ...): marks and fixes are written as WGS 84 geocentric
x, y, z (EPSG:4978) so the residuals the service computes are fixed by plain vector algebra: the fix is the mark plus a
drawn east-north-up offset rotated to geocentric (the ENU basis at the mark's geodetic latitude/longitude, found here by
fixed-point iteration on the rounded mark coordinates; WGS 84 a = 6378137, 1/f = 298.257223563). The expected residuals
are recomputed from the rounded coordinates, so rounding does not enter.

Per group (featureClass, crew, receiver) with numpy: rmseE/N = sqrt(mean(d^2)), rmseR, NSSDA 95 % horizontal
(FGDC-STD-007.3-1998 appendix 3-A: 2.4477 * (rmseE + rmseN) / 2 when min/max >= 0.6; every group here is drawn circular
and the script asserts the ratio), vertical rmse and 1.9600 * rmse.
Tests of difference:
  equal spread of dH and dU: scipy.stats.levene(center='median') (Brown-Forsythe);
  equal means of dE, dN, dU: Welch (1951) by his published formula in numpy, tail from scipy.stats.f.sf; for two groups
  the script asserts F = t^2 and equal p with scipy.stats.ttest_ind(equal_var=False) as an independent check.
Calibration (per receiver, and per receiver and fix type; basis sigma and hdop):
  ratio = sqrt(sum dH^2 / sum pred^2), pred = sqrt(2) * sigmaH or HDOP * 15.7 / 1.959964 (UERE95 of the C/A budget).
Tolerances used by the tests: figures 1e-6 m, statistics and p-values 1e-7 relative (+1e-12 absolute), calibration
ratios 1e-5 relative (stored reports hold dH to 1 micrometre).
"""
import json
import math
import platform

import numpy as np
import scipy
from scipy import stats

SEED = 20261204
A = 6378137.0
F = 1 / 298.257223563
E2 = F * (2 - F)
UERE95 = 15.7
Z95 = 1.959964

# class -> (count, per-axis sigma of dE/dN, sigma of dU); valve tight spec fails, hydrant loose spec passes, pole has no class spec.
CLASSES = [("valve", 24, 0.060, 0.05), ("hydrant", 24, 0.150, 0.20), ("pole", 6, 0.100, 0.10)]
CREWS = ["north", "south"]
RECEIVERS = [("GX-10", "rtk-fixed", 0.020), ("GX-10", "rtk-float", 0.080), ("TR-3", "rtk-fixed", 0.050)]
SPEC = {"standard": "nssda", "horizontal": 0.40, "vertical": 0.60,
        "featureClasses": {"valve": {"horizontal": 0.10, "vertical": 0.15}, "hydrant": {"horizontal": 0.50}}}


def geocentric(lat, lon, h):
    n = A / math.sqrt(1 - E2 * math.sin(lat) ** 2)
    return np.array([(n + h) * math.cos(lat) * math.cos(lon), (n + h) * math.cos(lat) * math.sin(lon), (n * (1 - E2) + h) * math.sin(lat)])


def geodetic(xyz):
    x, y, z = xyz
    lon = math.atan2(y, x)
    p = math.hypot(x, y)
    lat = math.atan2(z, p * (1 - E2))
    for _ in range(50):
        n = A / math.sqrt(1 - E2 * math.sin(lat) ** 2)
        h = p / math.cos(lat) - n
        lat = math.atan2(z, p * (1 - E2 * n / (n + h)))
    return lat, lon


def enu_basis(lat, lon):
    east = np.array([-math.sin(lon), math.cos(lon), 0.0])
    north = np.array([-math.sin(lat) * math.cos(lon), -math.sin(lat) * math.sin(lon), math.cos(lat)])
    up = np.array([math.cos(lat) * math.cos(lon), math.cos(lat) * math.sin(lon), math.sin(lat)])
    return np.vstack([east, north, up])


def figures(de, dn, du):
    rmse_e, rmse_n = math.sqrt(np.mean(de ** 2)), math.sqrt(np.mean(dn ** 2))
    ratio = min(rmse_e, rmse_n) / max(rmse_e, rmse_n)
    assert ratio >= 0.6, ratio
    out = {"n": int(len(de)), "rmseE": rmse_e, "rmseN": rmse_n, "rmseR": math.hypot(rmse_e, rmse_n),
           "nssda95": 2.4477 * 0.5 * (rmse_e + rmse_n), "meanE": float(np.mean(de)), "meanN": float(np.mean(dn))}
    rmse_v = math.sqrt(np.mean(du ** 2))
    out.update({"verticalRmse": rmse_v, "verticalNssda95": 1.96 * rmse_v})
    return out


def welch(groups):
    k = len(groups)
    n = np.array([len(g) for g in groups], float)
    m = np.array([np.mean(g) for g in groups])
    v = np.array([np.var(g, ddof=1) for g in groups])
    w = n / v
    mw = np.sum(w * m) / np.sum(w)
    lam = np.sum((1 - w / np.sum(w)) ** 2 / (n - 1))
    f = np.sum(w * (m - mw) ** 2) / (k - 1) / (1 + 2 * (k - 2) * lam / (k * k - 1))
    df2 = (k * k - 1) / (3 * lam)
    p = stats.f.sf(f, k - 1, df2)
    if k == 2:
        t = stats.ttest_ind(groups[0], groups[1], equal_var=False)
        assert abs(t.statistic ** 2 - f) < 1e-9 * f and abs(t.pvalue - p) < 1e-12 + 1e-9 * p, (t, f, p)
    return {"statistic": float(f), "df1": k - 1, "df2": float(df2), "pValue": float(p)}


def levene(groups):
    r = stats.levene(*groups, center="median")
    k = len(groups)
    return {"statistic": float(r.statistic), "df1": k - 1, "df2": int(sum(len(g) for g in groups) - k), "pValue": float(r.pvalue)}


def main():
    rng = np.random.default_rng(SEED)
    lat0, lon0 = math.radians(49.8215), math.radians(18.1630)
    marks, fixes, rows = [], [], []
    index = 0
    for cls, count, sigma_h, sigma_v in CLASSES:
        for _ in range(count):
            index += 1
            mark_id = f"LP-{index:03d}"
            lat = lat0 + rng.uniform(-0.01, 0.01) * math.pi / 180
            lon = lon0 + rng.uniform(-0.015, 0.015) * math.pi / 180
            mark = np.round(geocentric(lat, lon, 250 + rng.uniform(0, 40)), 4)
            marks.append({"id": mark_id, "x": float(mark[0]), "y": float(mark[1]), "z": float(mark[2])})
            basis = enu_basis(*geodetic(mark))
            offset = np.array([rng.normal(0, sigma_h), rng.normal(0, sigma_h), rng.normal(0, sigma_v)])
            fix = np.round(mark + basis.T @ offset, 4)
            enu = basis @ (fix - mark)
            crew = CREWS[index % 2]
            receiver, quality, reported = RECEIVERS[index % 3]
            sigma = round(reported * rng.uniform(0.8, 1.2), 3)
            hdop = round(rng.uniform(0.7, 2.5), 1)
            fixes.append({"id": f"F-{index:03d}", "mark": mark_id, "x": float(fix[0]), "y": float(fix[1]), "z": float(fix[2]),
                          "featureClass": cls, "crew": crew, "receiver": receiver, "quality": quality, "sigmaH": sigma, "hdop": hdop})
            rows.append((cls, crew, receiver, quality, sigma, hdop, enu))

    groups = {}
    for attribute, key in (("featureClass", 0), ("crew", 1), ("receiver", 2)):
        values = list(dict.fromkeys(r[key] for r in rows))
        entries = []
        de = {v: np.array([r[6][0] for r in rows if r[key] == v]) for v in values}
        dn = {v: np.array([r[6][1] for r in rows if r[key] == v]) for v in values}
        du = {v: np.array([r[6][2] for r in rows if r[key] == v]) for v in values}
        dh = {v: np.hypot(de[v], dn[v]) for v in values}
        for v in values:
            entries.append({"value": v, **figures(de[v], dn[v], du[v])})
        groups[attribute] = {
            "groups": entries,
            "tests": {
                "equal-spread dH": levene([dh[v] for v in values]),
                "equal-means dE": welch([de[v] for v in values]),
                "equal-means dN": welch([dn[v] for v in values]),
                "equal-spread dU": levene([du[v] for v in values]),
                "equal-means dU": welch([du[v] for v in values]),
            },
        }

    calibration = []
    uere1 = UERE95 / Z95
    keys = sorted({(r[2], q, b) for r in rows for q in (None, r[3]) for b in ("hdop", "sigma")}, key=lambda k: (k[0], k[1] or "", k[2]))
    for receiver, quality, basis in keys:
        sel = [r for r in rows if r[2] == receiver and (quality is None or r[3] == quality)]
        obs = np.array([r[6][0] ** 2 + r[6][1] ** 2 for r in sel])
        pred = np.array([2 * r[4] ** 2 if basis == "sigma" else (r[5] * uere1) ** 2 for r in sel])
        calibration.append({"receiver": receiver, "quality": quality, "basis": basis, "pairs": len(sel),
                            "ratio": math.sqrt(obs.sum() / pred.sum())})

    print(json.dumps({
        "source": f"make-group-reference.py: numpy {np.__version__}, scipy {scipy.__version__}, python {platform.python_version()}, seed {SEED}",
        "request": {"title": "Lipno water network, attribute groups",
                    "marks": {"crs": "EPSG:4978", "heights": "ellipsoidal", "points": marks},
                    "fixes": {"crs": "EPSG:4978", "heights": "ellipsoidal", "points": fixes},
                    "spec": SPEC},
        "groups": groups,
        "calibration": {"uere95": UERE95, "entries": calibration},
    }, indent=1))


if __name__ == "__main__":
    main()
