#!/usr/bin/python3
"""Writes the random-forest fixtures for CauseForestTest with scikit-learn 1.2.1 (Debian python3-sklearn).

Rerun from the repository root:
    /usr/bin/python3 analysis/src/test/resources/org/tufa/analysis/diagnose/make_forest_fixtures.py

Two open datasets bundled with scikit-learn: Fisher's iris (Fisher 1936, UCI Machine Learning Repository) and the
wine recognition data (Forina et al., UCI). Per dataset, forest_<name>.csv: the features x0..x{d-1}, the class y and
the fold (0..9) of a stratified 10-fold split with a fixed seed; forest_<name>_sklearn.csv: per fold the accuracy of
scikit-learn's RandomForestClassifier (100 trees, max_features sqrt, min_samples_leaf 5, random_state 0) trained on
the other folds. Floats written with repr() (round-trip exact).
"""
import os
import numpy as np
import sklearn
from sklearn.datasets import load_iris, load_wine
from sklearn.ensemble import RandomForestClassifier
from sklearn.model_selection import StratifiedKFold

assert sklearn.__version__ == "1.2.1", sklearn.__version__
here = os.path.dirname(os.path.abspath(__file__))

for name, loader in (("iris", load_iris), ("wine", load_wine)):
    data = loader()
    x, y = data.data, data.target
    fold = np.zeros(len(y), dtype=int)
    for k, (_, test) in enumerate(StratifiedKFold(n_splits=10, shuffle=True, random_state=2031).split(x, y)):
        fold[test] = k
    with open(os.path.join(here, "forest_%s.csv" % name), "w") as f:
        f.write(",".join(["x%d" % j for j in range(x.shape[1])] + ["y", "fold"]) + "\n")
        for i in range(len(y)):
            f.write(",".join([repr(float(v)) for v in x[i]] + [str(int(y[i])), str(int(fold[i]))]) + "\n")
    with open(os.path.join(here, "forest_%s_sklearn.csv" % name), "w") as f:
        f.write("fold,accuracy\n")
        for k in range(10):
            rf = RandomForestClassifier(n_estimators=100, max_features="sqrt", min_samples_leaf=5, random_state=0)
            rf.fit(x[fold != k], y[fold != k])
            f.write("%d,%r\n" % (k, float(rf.score(x[fold == k], y[fold == k]))))
