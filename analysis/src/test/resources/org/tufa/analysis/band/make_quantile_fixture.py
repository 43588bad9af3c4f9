#!/usr/bin/python3
"""Fixture for QuantilesTest / LoadBandTest: type-7 (linear) quantiles and Tukey fences from NumPy.

Rerun from the repository root:
    /usr/bin/python3 analysis/src/test/resources/org/tufa/analysis/band/make_quantile_fixture.py

Writes, beside this script:
  quantile-sample.csv    one value per line: 997 seeded draws (normal + a few large outliers), 17 significant digits
  quantile-expected.csv  name,value lines computed by numpy.quantile(..., method="linear") (NumPy's default,
                         Hyndman & Fan 1996 type 7) and the in-band counts for the iqr and tukey bands.
"""
import os
import numpy as np

here = os.path.dirname(os.path.abspath(__file__))
rng = np.random.default_rng(20310701)
x = np.concatenate([rng.normal(3.5, 1.2, 990), rng.uniform(15, 40, 7)])
rng.shuffle(x)

q = np.quantile(x, [0.1, 0.25, 0.5, 0.75, 0.9], method="linear")
q1, q3 = q[1], q[3]
iqr = q3 - q1
low, high = q1 - 1.5 * iqr, q3 + 1.5 * iqr

with open(os.path.join(here, "quantile-sample.csv"), "w") as f:
    for v in x:
        f.write(repr(float(v)) + "\n")

rows = [
    ("numpy_version", np.__version__),
    ("n", len(x)),
    ("p10", q[0]), ("q1", q1), ("median", q[2]), ("q3", q3), ("p90", q[4]),
    ("tukey_low", low), ("tukey_high", high),
    ("iqr_in_band", int(np.sum((x >= q1) & (x <= q3)))),
    ("tukey_in_band", int(np.sum((x >= low) & (x <= high)))),
    ("tukey_above", int(np.sum(x > high))),
    ("tukey_below", int(np.sum(x < low))),
]
with open(os.path.join(here, "quantile-expected.csv"), "w") as f:
    for name, value in rows:
        text = repr(float(value)) if isinstance(value, (float, np.floating)) else str(value)
        f.write(f"{name},{text}\n")
