#!/usr/bin/python3
"""Writes the label-spreading fixtures for LabelSpreadingTest with scikit-learn 1.2.1 (Debian python3-sklearn).

Rerun from the repository root:
    /usr/bin/python3 analysis/src/test/resources/org/tufa/analysis/cluster/make_label_spreading_fixtures.py

Per case, spreading_<name>.csv beside this script: input columns x0..x{d-1}, the given label y (-1 unlabelled),
then scikit-learn's LabelSpreading label_distributions_ p0..p{c-1} and transduction_ (label); and
spreading_<name>_params.csv: kernel, gamma, n_neighbors, alpha, max_iter, tol, classes, n_iter (n_iter_).
Floats written with repr() (round-trip exact). The data are drawn from fixed seeds with continuous coordinates, so
no two distances are equal and the kNN graph does not depend on how ties are broken.
"""
import os
import warnings
import numpy as np
import sklearn
from sklearn.semi_supervised import LabelSpreading
from sklearn.exceptions import ConvergenceWarning

assert sklearn.__version__ == "1.2.1", sklearn.__version__
HERE = os.path.dirname(os.path.abspath(__file__))


def blobs(seed, n_per, centers, spread):
    rng = np.random.default_rng(seed)
    xs, ts = [], []
    for k, c in enumerate(centers):
        xs.append(rng.normal(c, spread, size=(n_per, len(c))))
        ts += [k] * n_per
    return np.vstack(xs), np.array(ts)


def given(truth, share, seed):
    rng = np.random.default_rng(seed)
    y = np.full(len(truth), -1)
    for k in np.unique(truth):
        idx = np.flatnonzero(truth == k)
        pick = rng.choice(idx, size=max(1, int(round(share * len(idx)))), replace=False)
        y[pick] = k
    return y


def write(name, x, y, model, classes):
    dist = model.label_distributions_
    with open(os.path.join(HERE, "spreading_%s.csv" % name), "w") as f:
        d, c = x.shape[1], dist.shape[1]
        f.write(",".join(["x%d" % j for j in range(d)] + ["y"] + ["p%d" % j for j in range(c)] + ["label"]) + "\n")
        for i in range(len(x)):
            f.write(",".join([repr(float(v)) for v in x[i]] + [str(int(y[i]))] + [repr(float(v)) for v in dist[i]]
                             + [str(int(model.transduction_[i]))]) + "\n")
    with open(os.path.join(HERE, "spreading_%s_params.csv" % name), "w") as f:
        f.write("kernel,gamma,n_neighbors,alpha,max_iter,tol,classes,n_iter\n")
        f.write("%s,%r,%d,%r,%d,%r,%d,%d\n" % (model.kernel, float(model.gamma), model.n_neighbors,
                                              float(model.alpha), model.max_iter, float(model.tol), classes,
                                              model.n_iter_))


def case(name, x, truth, share, seed, **params):
    y = given(truth, share, seed)
    model = LabelSpreading(**params)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", ConvergenceWarning)  # the max_iter cases stop on purpose
        model.fit(x, y)
    assert list(model.classes_) == list(range(len(np.unique(truth)))), model.classes_
    write(name, x, y, model, len(model.classes_))
    print(name, x.shape, "iterations", model.n_iter_)


# Three 2-D blobs of 60, a tenth labelled: scikit-learn's defaults (rbf, gamma 20, alpha 0.2, 30 iterations).
x, t = blobs(11, 60, [(0.0, 0.0), (1.2, 0.3), (0.4, 1.1)], 0.25)
case("blobs2d_rbf", x, t, 0.1, 12)
case("blobs2d_knn", x, t, 0.1, 12, kernel="knn", n_neighbors=7)
# Four 3-D blobs of 100, 3 % labelled: a wider RBF, alpha near 1, until convergence; and kNN with k = 12.
x, t = blobs(21, 100, [(0, 0, 0), (1.5, 0, 0.5), (0, 1.5, 1), (1.4, 1.6, -0.2)], 0.45)
case("blobs3d_rbf", x, t, 0.03, 22, kernel="rbf", gamma=2.0, alpha=0.9, max_iter=1000, tol=1e-6)
case("blobs3d_knn", x, t, 0.03, 22, kernel="knn", n_neighbors=12, alpha=0.99, max_iter=1000, tol=1e-6)
# Two interleaved half circles (1-D manifolds) of 150 each, two labels per class: kNN follows the manifold; a
# short run (max_iter 5) stops before convergence.
rng = np.random.default_rng(31)
a = np.linspace(0, np.pi, 150)
x = np.vstack([np.c_[np.cos(a), np.sin(a)], np.c_[1 - np.cos(a), 0.5 - np.sin(a)]]) + rng.normal(0, 0.05, (300, 2))
t = np.array([0] * 150 + [1] * 150)
case("moons_knn", x, t, 0.014, 32, kernel="knn", n_neighbors=7, alpha=0.95, max_iter=200, tol=1e-5)
case("moons_knn_short", x, t, 0.014, 32, kernel="knn", n_neighbors=7, alpha=0.95, max_iter=5, tol=1e-5)
