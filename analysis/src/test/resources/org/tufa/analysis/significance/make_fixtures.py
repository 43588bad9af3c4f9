#!/usr/bin/env python3
"""Writes the fixtures of the significance tests with Debian's statsmodels, SciPy and NumPy.

    /usr/bin/python3 analysis/src/test/resources/org/tufa/analysis/significance/make_fixtures.py

Versions used for the committed files: printed into each file's first line.
"""
import os
import numpy as np
import scipy
import scipy.stats as st
import statsmodels
from statsmodels.stats.multitest import multipletests

here = os.path.dirname(os.path.abspath(__file__))

# Benjamini and Hochberg (1995), section 4: the 15 p-values of the worked example.
p = np.array([0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.3240, 0.4262,
              0.5719, 0.6528, 0.7590, 1.0000])
reject, q, _, _ = multipletests(p, alpha=0.05, method="fdr_bh")
rng = np.random.default_rng(20261201)
p2 = np.round(rng.uniform(0, 1, 40) ** 3, 6)
reject2, q2, _, _ = multipletests(p2, alpha=0.10, method="fdr_bh")
with open(os.path.join(here, "bh.csv"), "w") as f:
    f.write(f"# statsmodels {statsmodels.__version__} multipletests(method='fdr_bh')\n")
    f.write("set,alpha,p,q,reject\n")
    for a, b, c in zip(p, q, reject):
        f.write(f"paper,0.05,{a!r},{b!r},{str(bool(c)).lower()}\n")
    for a, b, c in zip(p2, q2, reject2):
        f.write(f"random,0.10,{a!r},{b!r},{str(bool(c)).lower()}\n")

# Fisher's method.
cases = [[0.01, 0.2], [0.5, 0.5], [1e-6, 0.9, 0.3], [0.04, 0.04, 0.04, 0.04]]
with open(os.path.join(here, "fisher.csv"), "w") as f:
    f.write(f"# scipy {scipy.__version__} combine_pvalues(method='fisher')\n")
    f.write("p_values,combined\n")
    for c in cases:
        f.write(" ".join(repr(x) for x in c) + f",{st.combine_pvalues(c, method='fisher').pvalue!r}\n")

# Gumbel survival, and a quantile-matched fit on a large Gumbel sample.
with open(os.path.join(here, "gumbel.csv"), "w") as f:
    f.write(f"# scipy {scipy.__version__} gumbel_r.sf; numpy {np.__version__}\n")
    f.write("location,scale,x,survival\n")
    for loc, scale, x in [(3.0, 0.5, 3.0), (3.0, 0.5, 6.0), (2.2, 1.3, 0.0), (10.0, 2.0, 30.0)]:
        f.write(f"{loc!r},{scale!r},{x!r},{st.gumbel_r.sf(x, loc=loc, scale=scale)!r}\n")
sample = st.gumbel_r.rvs(loc=4.0, scale=0.8, size=5000, random_state=np.random.default_rng(7))
np.savetxt(os.path.join(here, "gumbel_sample.txt"), sample, fmt="%.17g",
           header=f"scipy {scipy.__version__} gumbel_r.rvs(loc=4.0, scale=0.8, size=5000, seed 7)")

# Poisson upper tail P(X >= k).
with open(os.path.join(here, "poisson.csv"), "w") as f:
    f.write(f"# scipy {scipy.__version__} poisson.sf(k - 1, lambda)\n")
    f.write("lambda,k,tail\n")
    for lam, k in [(0.25, 4), (1.0, 1), (3.5, 10), (0.01, 3), (12.0, 12)]:
        f.write(f"{lam!r},{k},{st.poisson.sf(k - 1, lam)!r}\n")

# Median and scaled MAD (the normal-consistent MAD, factor 1.4826).
x = np.round(rng.normal(0.3, 0.7, 31), 3)
with open(os.path.join(here, "mad.csv"), "w") as f:
    f.write(f"# scipy {scipy.__version__} median_abs_deviation(scale='normal') (factor 1/0.67449 = 1.482602)\n")
    f.write("values,median,mad_normal\n")
    f.write(" ".join(repr(float(v)) for v in x) + f",{float(np.median(x))!r},"
            f"{float(st.median_abs_deviation(x, scale='normal'))!r}\n")
print("fixtures written to", here)
