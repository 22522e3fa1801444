#!/usr/bin/env python3
"""Independent reference 95 % error ellipses for ErrorEllipse (QaService reporting tests).

Regenerate (Debian python3-scipy):
    /usr/bin/python3 tests/reference-data/make-ellipse-reference.py > tests/reference-data/error-ellipse-numpy.tsv

For each case it draws correlated residuals (dE, dN), forms the second-moment matrix about zero
M = (1/n) sum [dE dN]^T [dE dN], takes eigenvalues and eigenvectors with numpy.linalg.eigh, scales the
square roots of the eigenvalues by k = sqrt(scipy.stats.chi2.ppf(0.95, 2)), and gives the major axis
direction as an azimuth (degrees clockwise from north, folded into [0, 180)) from the eigenvector
(east, north) of the largest eigenvalue via atan2(east, north). A different method from the C# code,
which uses the closed-form angle 0.5 * atan2(2 M12, M11 - M22).
"""
import math
import platform
import sys

import numpy as np
import scipy
from scipy import stats

SEED = 20260601
CASES = 60
P = 0.95


def main():
    rng = np.random.default_rng(SEED)
    k = math.sqrt(stats.chi2.ppf(P, 2))
    print(f"# Reference 95 % error ellipses: scipy {scipy.__version__}, numpy {np.__version__}, python {platform.python_version()}")
    print(f"# Made by tests/reference-data/make-ellipse-reference.py (seed {SEED}); k = sqrt(chi2.ppf(0.95, 2)) = {k:.15g}")
    print("# Columns: meanSquareE meanSquareN meanProductEN (m^2), semiMajor semiMinor (m), azimuthDeg (major axis, clockwise from north)")
    print("meanSquareE\tmeanSquareN\tmeanProductEN\tsemiMajor\tsemiMinor\tazimuthDeg")
    for _ in range(CASES):
        n = int(rng.integers(5, 40))
        s_e, s_n = rng.uniform(0.005, 0.2, 2)
        rho = rng.uniform(-0.95, 0.95)
        cov = [[s_e * s_e, rho * s_e * s_n], [rho * s_e * s_n, s_n * s_n]]
        xy = rng.multivariate_normal([rng.normal(0, 0.02), rng.normal(0, 0.02)], cov, size=n)
        m = xy.T @ xy / n
        values, vectors = np.linalg.eigh(m)
        major_vec = vectors[:, 1]
        azimuth = math.degrees(math.atan2(major_vec[0], major_vec[1])) % 180.0
        print(f"{m[0,0]:.17g}\t{m[1,1]:.17g}\t{m[0,1]:.17g}\t{k*math.sqrt(values[1]):.17g}\t{k*math.sqrt(max(values[0],0)):.17g}\t{azimuth:.15g}")


if __name__ == "__main__":
    sys.exit(main())
