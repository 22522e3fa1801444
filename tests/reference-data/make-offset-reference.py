#!/usr/bin/env python3
"""Independent reference values for OffsetCircleProbability / OffsetErrorRadius (QaService statistics tests).

Regenerate (Debian python3-scipy):
    /usr/bin/python3 tests/reference-data/make-offset-reference.py > tests/reference-data/offset-circle-scipy.tsv

Each row is a bivariate normal error X ~ N(mu, Sigma) in east/north (sigmaE, sigmaN, rho, muE, muN) and either
  kind=prob   : P(|X| <= r) for the given r, or
  kind=radius : the r with P(|X| <= r) = p.
The probability is computed differently from the C# code (which integrates a closed radial integral over the polar
angle): here by scipy.integrate.dblquad of the density over the disk in Cartesian coordinates (x outer,
y in +-sqrt(r^2 - x^2)), epsabs 1e-13, epsrel 1e-12; for circular covariances also by the noncentral chi-square
CDF scipy.stats.ncx2.cdf(r^2/s^2, 2, |mu|^2/s^2) (Rice), and the two must agree to 1e-9 or the script stops.
Radii: scipy.optimize.brentq (xtol 1e-13) on the same probability. Rows with sigmaN = 0 are one-dimensional:
P = Phi((r - mu)/s) - Phi((-r - mu)/s) (scipy.stats.norm), used for LE90/LE95 with a bias.
Expected accuracy: about 1e-10 on P and radius.
"""
import math
import platform
import random
import sys

import numpy as np
import scipy
from scipy import integrate, optimize, stats


def prob(r, se, sn, rho, me, mn):
    if sn == 0.0:
        return stats.norm.cdf((r - me) / se) - stats.norm.cdf((-r - me) / se)
    cov = np.array([[se * se, rho * se * sn], [rho * se * sn, sn * sn]])
    dist = stats.multivariate_normal(mean=[me, mn], cov=cov)
    inv = np.linalg.inv(cov)
    det = np.linalg.det(cov)
    norm = 1.0 / (2 * math.pi * math.sqrt(det))

    def density(y, x):
        dx, dy = x - me, y - mn
        q = inv[0, 0] * dx * dx + 2 * inv[0, 1] * dx * dy + inv[1, 1] * dy * dy
        return norm * math.exp(-0.5 * q)

    value, _ = integrate.dblquad(density, -r, r, lambda x: -math.sqrt(max(r * r - x * x, 0.0)),
                                 lambda x: math.sqrt(max(r * r - x * x, 0.0)), epsabs=1e-13, epsrel=1e-12)
    if se == sn and rho == 0.0:
        rice = stats.ncx2.cdf(r * r / (se * se), 2, (me * me + mn * mn) / (se * se))
        if abs(rice - value) > 1e-9:
            sys.exit(f"dblquad {value} and ncx2 {rice} disagree for {(r, se, sn, rho, me, mn)}")
    return value


def radius(p, se, sn, rho, me, mn):
    hi = math.hypot(me, mn) + max(se, sn) * math.sqrt(-2 * math.log(1 - p)) + 1e-9
    return optimize.brentq(lambda r: prob(r, se, sn, rho, me, mn) - p, 0.0, hi, xtol=1e-13, rtol=1e-13)


def main():
    print(f"# make-offset-reference.py; python {platform.python_version()}, numpy {np.__version__}, scipy {scipy.__version__}")
    print("# kind\tsigmaE\tsigmaN\trho\tmuE\tmuN\targument\tvalue")
    rows = [
        # check-values.md section 5 cases (probabilities)
        ("prob", 1, 1, 0, 1, 0, 2.0), ("prob", 1, 1, 0, 2, 0, 2.0), ("prob", 1, 0.5, 0, 0, 0, 1.0),
        ("prob", 1, 1, 0.5, 0, 0, 1.5), ("prob", 1, 0.5, 0, 0.5, 0.5, 1.5),
    ]
    for mu in (0.5, 1.0, 2.0):
        for p in (0.5, 0.9, 0.95):
            rows.append(("radius", 1, 1, 0, mu, 0, p))
        for p in (0.9, 0.95):
            rows.append(("radius", 1, 0, 0, mu, 0, p))
    rng = random.Random(20260527)
    for _ in range(24):
        se = rng.uniform(0.005, 0.5)
        sn = se * rng.uniform(0.05, 1.0)
        rho = rng.uniform(-0.9, 0.9)
        me = rng.uniform(-1.5, 1.5) * se
        mn = rng.uniform(-1.5, 1.5) * se
        if rng.random() < 0.5:
            rows.append(("prob", se, sn, rho, me, mn, rng.uniform(0.3, 3.0) * se))
        else:
            rows.append(("radius", se, sn, rho, me, mn, rng.choice((0.5, 0.9, 0.95))))
    for kind, se, sn, rho, me, mn, arg in rows:
        value = prob(arg, se, sn, rho, me, mn) if kind == "prob" else radius(arg, se, sn, rho, me, mn)
        print(f"{kind}\t{se!r}\t{sn!r}\t{rho!r}\t{me!r}\t{mn!r}\t{arg!r}\t{value:.13g}")


if __name__ == "__main__":
    main()
