#!/usr/bin/env python3
"""Independent reference radii for CircularErrorRadius (QaService statistics tests).

Regenerate (Debian python3-scipy):
    /usr/bin/python3 tests/reference-data/make-radius-reference.py > tests/reference-data/circular-radius-scipy.tsv

For each case (sigmaE, sigmaN, rho, p) it builds the covariance / second-moment matrix
M = [[sigmaE^2, rho*sigmaE*sigmaN], [rho*sigmaE*sigmaN, sigmaN^2]], takes its principal standard deviations
with numpy.linalg.eigvalsh, and solves P(|X| <= r) = p for X ~ N(0, M) with scipy.optimize.brentq.

The probability is computed by a different formula from the C# code (which integrates over the polar
angle): conditioning on the major-axis component x,
    P(r) = 2 * integral_0^r  phi(x / s1) / s1 * erf( sqrt(r^2 - x^2) / (s2 * sqrt 2) ) dx,
with x = r sin t to remove the square-root endpoint singularity, integrated by scipy.integrate.quad
(epsrel 2e-14). phi is scipy.stats.norm.pdf; erf is scipy.special.erf.
Expected accuracy of the tabulated radius: about 1e-11 relative (quadrature 2e-14, brentq rtol 1e-13).
"""
import math
import platform
import sys

import numpy as np
import scipy
from scipy import integrate, optimize, special, stats

SEED = 20260526
CASES = 200


def probability(r, s1, s2):
    """P(|X| <= r) for principal standard deviations s1 >= s2 > 0."""
    def integrand(t):
        x = r * math.sin(t)
        return r * math.cos(t) * stats.norm.pdf(x / s1) / s1 * special.erf(r * math.cos(t) / (s2 * math.sqrt(2.0)))
    value, _ = integrate.quad(integrand, 0.0, math.pi / 2.0, epsabs=0.0, epsrel=2e-14, limit=1000)
    return 2.0 * value


def radius(p, s1, s2):
    lower = s1 * math.sqrt(2.0) * special.erfinv(p)          # one-dimensional bound
    upper = s1 * math.sqrt(-2.0 * math.log1p(-p))            # circular bound with the major sigma
    return optimize.brentq(lambda r: probability(r, s1, s2) - p, lower * 0.999, upper * 1.001,
                           xtol=1e-300, rtol=1e-13, maxiter=500)


def main():
    rng = np.random.default_rng(SEED)
    cases = []
    fixed_p = [0.5, 0.9, 0.95]
    for i in range(CASES):
        sigma_e = float(10.0 ** rng.uniform(-3.0, 0.5))
        sigma_n = float(10.0 ** rng.uniform(-3.0, 0.5))
        rho = float(rng.uniform(-0.99, 0.99))
        p = fixed_p[i % 3] if i % 2 == 0 else float(rng.uniform(0.01, 0.999))
        cases.append((sigma_e, sigma_n, rho, p))
    # a few near-degenerate shapes: very thin ellipses and near-perfect correlation
    cases += [(1.0, 1e-6, 0.0, 0.95), (2.0, 1e-4, 0.3, 0.5), (1e-3, 1.0, 0.0, 0.9), (1.0, 1.0, 0.999, 0.95),
              (0.5, 0.5, -0.999, 0.5), (1.0, 0.999, 0.0, 0.95)]

    print(f"# Reference exact circular-error radii: scipy {scipy.__version__}, numpy {np.__version__}, "
          f"python {platform.python_version()}")
    print(f"# Made by tests/reference-data/make-radius-reference.py (seed {SEED}); see its docstring for the method.")
    print("# Columns: sigmaE sigmaN rho (input), meanSquareE meanSquareN meanProductEN (second-moment matrix, m^2),")
    print("# sigmaMajor sigmaMinor (numpy eigvalsh), p, radius (m, scipy brentq on scipy quad probability).")
    print("sigmaE\tsigmaN\trho\tmeanSquareE\tmeanSquareN\tmeanProductEN\tsigmaMajor\tsigmaMinor\tp\tradius")
    for sigma_e, sigma_n, rho, p in cases:
        mse, msn, msen = sigma_e ** 2, sigma_n ** 2, rho * sigma_e * sigma_n
        eig = np.linalg.eigvalsh(np.array([[mse, msen], [msen, msn]]))
        s1, s2 = math.sqrt(max(eig[1], 0.0)), math.sqrt(max(eig[0], 0.0))
        r = radius(p, s1, s2)
        print("\t".join(repr(v) for v in (sigma_e, sigma_n, rho, mse, msn, msen, s1, s2, p, r)))


if __name__ == "__main__":
    sys.exit(main())
