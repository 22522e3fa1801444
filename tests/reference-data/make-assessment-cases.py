#!/usr/bin/env python3
"""Builds end-to-end assessment cases with an answer computed outside QaService.

Each case has marks in WGS 84 / UTM zone 33N (EPSG:32633) and fixes in WGS 84 lat/lon/h (EPSG:4979).
Residuals are designed in east-north-up at each mark; the fix positions are made from them by
GeographicLib's CartConvert (local cartesian, reverse: `CartConvert -r -l lat0 lon0 h0`), the marks'
latitude/longitude by PROJ's cs2cs (EPSG:32633 -> EPSG:4979). The expected figures are computed here
from the designed residuals with numpy/scipy, following api-v1's definitions:
  RMSE about zero, SD with n-1, NSSDA (FGDC-STD-007.3-1998 App. 3-A) with the 0.6 ratio switch,
  exact radii of N(0, second-moment matrix) by scipy.integrate.quad + scipy.optimize.brentq,
  percentiles by numpy.percentile(method="linear") (type 7).

Regenerate (needs Debian proj-bin, geographiclib-tools, python3-scipy):
  /usr/bin/python3 tests/reference-data/make-assessment-cases.py > tests/reference-data/assessment-cases.json
"""
import json, math, subprocess, datetime
import numpy as np, scipy
from scipy import integrate, optimize


def run(cmd, text):
    return subprocess.run(cmd, input=text, capture_output=True, text=True, check=True).stdout


def tool_version(cmd):
    p = subprocess.run(cmd, capture_output=True, text=True)
    return (p.stdout + p.stderr).strip().splitlines()[0]


def prob_inside(r, s1, s2):
    """P(|X| <= r), X ~ N(0, diag(s1^2, s2^2)); polar integral of the density."""
    if s2 == 0:
        return math.erf(r / (s1 * math.sqrt(2)))
    g = lambda t: math.cos(t) ** 2 / s1 ** 2 + math.sin(t) ** 2 / s2 ** 2
    f = lambda t: (1 - math.exp(-r * r * g(t) / 2)) / g(t)
    val, _ = integrate.quad(f, 0, 2 * math.pi, epsabs=1e-14, epsrel=1e-13, limit=200)
    return val / (2 * math.pi * s1 * s2)


def radius(p, s1, s2):
    if s1 == 0 and s2 == 0:
        return 0.0
    s1, s2 = max(s1, s2), min(s1, s2)
    return optimize.brentq(lambda r: prob_inside(r, s1, s2) - p, 0, 10 * s1, xtol=1e-15, rtol=1e-14)


def figures(dE, dN, dU):
    n = len(dE)
    rmseE, rmseN = math.sqrt(np.mean(dE ** 2)), math.sqrt(np.mean(dN ** 2))
    ratio = min(rmseE, rmseN) / max(rmseE, rmseN)
    if ratio >= 0.6:
        nssda, method = 2.4477 * 0.5 * (rmseE + rmseN), "approx"
    else:
        nssda, method = radius(0.95, rmseE, rmseN), "exact"
    m = np.array([[np.mean(dE * dE), np.mean(dE * dN)], [np.mean(dE * dN), np.mean(dN * dN)]])
    ev = np.linalg.eigvalsh(m)
    s1, s2 = math.sqrt(max(ev[1], 0)), math.sqrt(max(ev[0], 0))
    dH = np.hypot(dE, dN)
    drms = math.hypot(rmseE, rmseN)
    h = dict(n=n, meanE=float(np.mean(dE)), meanN=float(np.mean(dN)), sdE=float(np.std(dE, ddof=1)), sdN=float(np.std(dN, ddof=1)),
             rmseE=rmseE, rmseN=rmseN, rmseR=drms, nssda95=nssda, nssdaMethod=method,
             cep50=radius(0.5, s1, s2), r95=radius(0.95, s1, s2), ce90=radius(0.9, s1, s2), drms=drms, twoDrms=2 * drms,
             p50=float(np.percentile(dH, 50, method="linear")), p90=float(np.percentile(dH, 90, method="linear")),
             p95=float(np.percentile(dH, 95, method="linear")))
    rmseU = math.sqrt(np.mean(dU ** 2))
    v = dict(n=n, mean=float(np.mean(dU)), sd=float(np.std(dU, ddof=1)), rmse=rmseU, nssda95=1.9600 * rmseU, le90=1.6449 * rmseU,
             p95=float(np.percentile(np.abs(dU), 95, method="linear")))
    return h, v


def make_case(name, n, sigmas, rho, seed, spec):
    rng = np.random.default_rng(seed)
    e = 500000 + rng.uniform(-250000, 250000, n)    # across the zone, up to ~3.4 deg from the central meridian
    nn = 5200000 + rng.uniform(0, 400000, n)
    h = rng.uniform(150, 900, n)
    sE, sN, sU = sigmas
    cov = [[sE * sE, rho * sE * sN], [rho * sE * sN, sN * sN]]
    dEN = rng.multivariate_normal([0, 0], cov, n)
    dU = rng.normal(0, sU, n)
    dE, dN = np.round(dEN[:, 0], 4), np.round(dEN[:, 1], 4)
    dU = np.round(dU, 4)
    marks_ll = run(["cs2cs", "-f", "%.12f", "EPSG:32633", "EPSG:4979"],
                   "\n".join(f"{a:.4f} {b:.4f} {c:.4f}" for a, b, c in zip(e, nn, h))).split("\n")
    marks, fixes = [], []
    for i in range(n):
        lat0, lon0, h0 = (float(x) for x in marks_ll[i].split())
        out = run(["CartConvert", "-r", "-l", repr(lat0), repr(lon0), repr(h0), "-p", "10"], f"{dE[i]!r} {dN[i]!r} {dU[i]!r}\n").split()
        marks.append({"id": f"CP-{i + 1:02d}", "e": round(float(e[i]), 4), "n": round(float(nn[i]), 4), "h": round(float(h[i]), 4)})
        fixes.append({"id": f"F-{i + 1:04d}", "mark": f"CP-{i + 1:02d}", "lat": float(out[0]), "lon": float(out[1]), "h": float(out[2])})
    hz, vt = figures(dE, dN, dU)
    request = {"title": f"reference case {name}",
               "marks": {"crs": "EPSG:32633", "heights": "ellipsoidal", "points": marks},
               "fixes": {"crs": "EPSG:4979", "heights": "ellipsoidal", "points": fixes},
               "spec": spec}
    designed = [{"mark": f"CP-{i + 1:02d}", "fix": f"F-{i + 1:04d}", "dE": float(dE[i]), "dN": float(dN[i]), "dU": float(dU[i])} for i in range(n)]
    return {"name": name, "request": request, "designedResiduals": designed, "expected": {"horizontal": hz, "vertical": vt}}


cases = [
    make_case("24 points, per-axis ratio >= 0.6 (approx branch)", 24, (0.30, 0.25, 0.40), 0.3, 11, {"standard": "nssda", "horizontal": 1.0, "vertical": 1.0}),
    make_case("24 points, per-axis ratio < 0.6 (exact branch)", 24, (0.50, 0.12, 0.20), -0.2, 12, {"standard": "nssda", "horizontal": 0.5, "vertical": 1.0}),
    make_case("12 points (below the NSSDA minimum)", 12, (0.05, 0.05, 0.08), 0.0, 13, {"standard": "nssda", "horizontal": 1.0}),
]
print(json.dumps({
    "generatedBy": "tests/reference-data/make-assessment-cases.py",
    "generatedOn": datetime.date.today().isoformat(),
    "tools": {"proj": tool_version(["cs2cs"]), "geographiclib": tool_version(["CartConvert", "--version"]),
              "numpy": np.__version__, "scipy": scipy.__version__},
    "cases": cases}, indent=1))
