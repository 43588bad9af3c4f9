#!/usr/bin/python3
"""Fixture for StageContrastsTest: the within (fixed day effects) estimate of fan stage offsets, from NumPy.

Rerun from the repository root:
    /usr/bin/python3 analysis/src/test/resources/org/tufa/analysis/features/make_stage_contrast_fixture.py

The model is response = c1 v + c2 v^2 + offset(stage) + level(day) + noise. The reference here fits it the long
way, by ordinary least squares with one indicator column per day (numpy.linalg.lstsq), not by removing day
means, so the test checks the within estimator against the full dummy-variable regression (Frisch-Waugh-Lovell).

Writes, beside this script:
  stage-contrast-sample.csv    v,y,stage,day per sample (seeded draws, 17 significant digits)
  stage-contrast-expected.csv  name,value lines: c1, c2, offset1, offset2 and numpy_version
"""
import os
import numpy as np

here = os.path.dirname(os.path.abspath(__file__))
rng = np.random.default_rng(20310702)
days, per_day = 30, 40
day = np.repeat(np.arange(days), per_day)
v = rng.uniform(0.05, 1.0, days * per_day)
# A staged fan: low below 40 % open, high above 70 %, medium between, with some overlap from noise.
stage = np.where(v + rng.normal(0, 0.08, v.size) < 0.4, 0, np.where(v + rng.normal(0, 0.08, v.size) > 0.7, 2, 1))
level = rng.normal(0, 0.05, days)[day]
y = 0.1 + 0.7 * v - 0.15 * v * v + np.array([0.0, -0.05, -0.11])[stage] + level + rng.normal(0, 0.02, v.size)

x = np.zeros((v.size, 4 + days))
x[:, 0] = v
x[:, 1] = v * v
x[:, 2] = stage == 1
x[:, 3] = stage == 2
x[np.arange(v.size), 4 + day] = 1.0
beta = np.linalg.lstsq(x, y, rcond=None)[0]

with open(os.path.join(here, "stage-contrast-sample.csv"), "w") as f:
    for i in range(v.size):
        f.write("%r,%r,%d,%d\n" % (float(v[i]), float(y[i]), int(stage[i]), int(day[i])))
with open(os.path.join(here, "stage-contrast-expected.csv"), "w") as f:
    f.write("numpy_version,%s\n" % np.__version__)
    for name, value in zip(["c1", "c2", "offset1", "offset2"], beta[:4]):
        f.write("%s,%r\n" % (name, float(value)))
