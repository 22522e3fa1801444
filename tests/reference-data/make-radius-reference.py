#!/usr/bin/env python3
"""Independent reference radii for CircularErrorRadius (QaService statistics tests).

Regenerate (Debian python3-scipy):
    /usr/bin/python3 tests/reference-data/make-radius-reference.py > tests/reference-data/circular-radius-scipy.tsv

Rows: 200 random cases (label random-NNN), a few near-degenerate shapes (edge-*), and the synthetic 20-point
check-point vector of the shared check-values.md section 1 (synthetic20-*: its second-moment matrix about zero,
and its independent-axes NSSDA case; ratio-below-0.6-r95: RMSE 0.030/0.012 m).
For each case (sigmaE, sigmaN, rho, p) it builds the covariance / second-moment matrix
M = [[sigmaE^2, rho*sigmaE*sigmaN], [rho*sigmaE*sigmaN, sigmaN^2]], takes its principal standard deviations
with numpy.linalg.eigvalsh, and solves P(|X| <= r) = p for X ~ N(0, M) with scipy.optimize.brentq.

The probability is computed by a different formula from the C# code (which integrates over the polar
angle): conditioning on the major-axis component x,
    P(r) = 2 * integral_0^r  phi(x / s1) / s1 * erf( sqrt(r^2 - x^2) / (s2 * sqrt 2) ) dx,
with x = r sin t to remove the square-root endpoint singularity, integrated by scipy.integrate.quad
(epsrel 2e-14). phi is scipy.stats.norm.pdf; erf is scipy.special.erf.
Expected accuracy of the tabulated radius: about 1e-11 relative (quadrature 2e-14, brentq rtol 1e-13); quad may
print an IntegrationWarning about roundoff at that tolerance on stderr, which does not affect the 1e-7 test tolerance.
"""
import math
import platform
import sys

import numpy as np
import scipy
from scipy import integrate, optimize, special, stats

SEED = 20260526
SYNTHETIC_DE = [0.012, -0.020, 0.031, -0.008, 0.015, -0.027, 0.004, 0.022, -0.013, 0.009,
                -0.031, 0.018, 0.006, -0.016, 0.025, -0.005, 0.011, -0.022, 0.028, -0.010]
SYNTHETIC_DN = [-0.015, 0.010, 0.021, -0.030, 0.005, 0.017, -0.022, 0.008, 0.026, -0.012,
                0.003, -0.019, 0.024, 0.014, -0.006, -0.025, 0.019, 0.002, -0.011, 0.020]
CASES = 200


def probability(r, s1, s2):
    """P(|X| <= r) for principal standard deviations s1 >= s2 > 0."""
    def integrand(t):
        x = r * math.sin(t)
        return r * math.cos(t) * stats.norm.pdf(x / s1) / s1 * special.erf(r * math.cos(t) / (s2 * math.sqrt(2.0)))
    # erf falls from 1 to 0 where r cos t ~ s2: a layer of width ~ s2/r next to t = pi/2 that quad must be told
    # about, or it misses it for thin ellipses (the error is then ~ s2^2 / (2 r^2) relative in the radius).
    breaks = sorted(math.acos(c) for c in (64 * s2 / r, 8 * s2 / r, s2 / r, s2 / (8 * r)) if c < 1.0)
    value, _ = integrate.quad(integrand, 0.0, math.pi / 2.0, epsabs=0.0, epsrel=2e-14, limit=1000,
                              points=breaks or None)
    return 2.0 * value


def radius(p, s1, s2):
    lower = s1 * math.sqrt(2.0) * special.erfinv(p)          # one-dimensional bound
    upper = s1 * math.sqrt(-2.0 * math.log1p(-p))            # circular bound with the major sigma
    return optimize.brentq(lambda r: probability(r, s1, s2) - p, lower * 0.999, upper * 1.001,
                           xtol=1e-300, rtol=1e-13, maxiter=500)


def main():
    rng = np.random.default_rng(SEED)
    cases = []  # (label, sigmaE, sigmaN, rho, p)
    fixed_p = [0.5, 0.9, 0.95]
    for i in range(CASES):
        sigma_e = float(10.0 ** rng.uniform(-3.0, 0.5))
        sigma_n = float(10.0 ** rng.uniform(-3.0, 0.5))
        rho = float(rng.uniform(-0.99, 0.99))
        p = fixed_p[i % 3] if i % 2 == 0 else float(rng.uniform(0.01, 0.999))
        cases.append((f"random-{i:03d}", sigma_e, sigma_n, rho, p))
    # a few near-degenerate shapes: very thin ellipses, near-perfect correlation, nearly circular
    cases += [("edge-thin", 1.0, 1e-6, 0.0, 0.95), ("edge-thin-correlated", 2.0, 1e-4, 0.3, 0.5),
              ("edge-thin-north", 1e-3, 1.0, 0.0, 0.9), ("edge-correlated", 1.0, 1.0, 0.999, 0.95),
              ("edge-anticorrelated", 0.5, 0.5, -0.999, 0.5), ("edge-near-circular", 1.0, 0.999, 0.0, 0.95)]
    # the synthetic 20-point vector: second-moment matrix about zero, (1/n) sum [dE dN]^T [dE dN]
    de, dn = np.array(SYNTHETIC_DE), np.array(SYNTHETIC_DN)
    rmse_e, rmse_n = math.sqrt(np.mean(de * de)), math.sqrt(np.mean(dn * dn))
    rho20 = float(np.mean(de * dn)) / (rmse_e * rmse_n)
    cases += [("synthetic20-cep50", rmse_e, rmse_n, rho20, 0.5), ("synthetic20-ce90", rmse_e, rmse_n, rho20, 0.9),
              ("synthetic20-r95", rmse_e, rmse_n, rho20, 0.95),
              ("synthetic20-independent-r95", rmse_e, rmse_n, 0.0, 0.95),
              ("ratio-below-0.6-r95", 0.030, 0.012, 0.0, 0.95)]

    print(f"# Reference exact circular-error radii: scipy {scipy.__version__}, numpy {np.__version__}, "
          f"python {platform.python_version()}")
    print(f"# Made by tests/reference-data/make-radius-reference.py (seed {SEED}); see its docstring for the method.")
    print("# Columns: label, sigmaE sigmaN rho (input), meanSquareE meanSquareN meanProductEN (second-moment matrix, m^2),")
    print("# sigmaMajor sigmaMinor (numpy eigvalsh), p, radius (m, scipy brentq on scipy quad probability).")
    print("label\tsigmaE\tsigmaN\trho\tmeanSquareE\tmeanSquareN\tmeanProductEN\tsigmaMajor\tsigmaMinor\tp\tradius")
    for label, sigma_e, sigma_n, rho, p in cases:
        mse, msn, msen = sigma_e ** 2, sigma_n ** 2, rho * sigma_e * sigma_n
        eig = np.linalg.eigvalsh(np.array([[mse, msen], [msen, msn]]))
        s1, s2 = math.sqrt(max(eig[1], 0.0)), math.sqrt(max(eig[0], 0.0))
        r = radius(p, s1, s2)
        print("\t".join([label] + [repr(v) for v in (sigma_e, sigma_n, rho, mse, msn, msen, s1, s2, p, r)]))


if __name__ == "__main__":
    sys.exit(main())
