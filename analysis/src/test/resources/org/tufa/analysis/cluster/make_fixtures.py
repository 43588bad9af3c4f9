#!/usr/bin/python3
"""Writes the reference fixtures for org.tufa.analysis.cluster tests with scikit-learn 1.2.1 (Debian python3-sklearn).

Rerun from the repository root:
    /usr/bin/python3 analysis/src/test/resources/org/tufa/analysis/cluster/make_fixtures.py

Outputs (beside this script), all CSV with a header row, floats written with repr() (round-trip exact),
infinity as "Infinity":
  optics_<name>.csv          input columns x0..x{d-1}, then per sample: core, reach, pred, position (in the
                             ordering), threshold (cluster_optics_dbscan label at the given eps), xi (cluster_optics_xi
                             leaf label), truth (generating blob, -1 for noise or unknown)
  optics_<name>_clusters.csv the xi clusters [start, end] (ordering positions, inclusive) in scikit-learn's order
  optics_<name>_params.csv   min_samples, threshold eps, xi, min_cluster_size
  iris.csv, pca_iris_<mode>.csv  iris features and PCA results (ratio, explained variance, components, mean, scale)
  ari_example.csv            two labellings and scikit-learn's adjusted_rand_score of them
The OPTICS sets: line_minpts2/3 (the worked 1-D example), grid (2-D grids and noise), blobs2d, operating3d, and two
with heavy ties at larger sizes, lattice3d (1,500 lattice points, duplicates) and walk1d (a rounded 1-D walk).
Reruns on another BLAS build may change optics_operating3d.csv (multivariate_normal) and the PCA files in the last
digits; keep the committed ones unless the data change on purpose.

Predecessor correction: scikit-learn 1.2.1's _correct_predecessor indexes `ordering` with a predecessor that is
already a sample index (scikit-learn issue #26324, fixed by pull request #26459 in release 1.3). We replace it by
the fixed version, which is Algorithm 2 of Schubert & Gertz, "Improving the cluster structure extracted from
OPTICS plots", LWDA 2018: the end point is kept when its predecessor lies inside the cluster.
"""
import os
import numpy as np
import sklearn
from sklearn.cluster import OPTICS, cluster_optics_dbscan, cluster_optics_xi
import sklearn.cluster._optics as optics_module
from sklearn.datasets import load_iris
from sklearn.decomposition import PCA
from sklearn.preprocessing import StandardScaler

assert sklearn.__version__ == "1.2.1", sklearn.__version__
HERE = os.path.dirname(os.path.abspath(__file__))


def fixed_correct_predecessor(reachability_plot, predecessor_plot, ordering, s, e):
    # Schubert & Gertz 2018, Algorithm 2, as in scikit-learn >= 1.3 (PR #26459).
    while s < e:
        if reachability_plot[s] > reachability_plot[e]:
            return s, e
        p_e = predecessor_plot[e]
        for i in range(s, e):
            if p_e == ordering[i]:
                return s, e
        e -= 1
    return None, None


optics_module._correct_predecessor = fixed_correct_predecessor


def fmt(v):
    v = float(v)
    if np.isinf(v):
        return "Infinity" if v > 0 else "-Infinity"
    return repr(v)


def write_csv(name, header, rows):
    with open(os.path.join(HERE, name), "w") as f:
        f.write(",".join(header) + "\n")
        for row in rows:
            f.write(",".join(row) + "\n")


def optics_fixture(name, X, min_samples, eps, xi, min_cluster_size, truth=None):
    model = OPTICS(min_samples=min_samples, max_eps=np.inf, metric="minkowski", p=2, cluster_method="xi",
                   xi=xi, min_cluster_size=min_cluster_size).fit(X)
    n, d = X.shape
    position = np.empty(n, dtype=int)
    position[model.ordering_] = np.arange(n)
    threshold = cluster_optics_dbscan(reachability=model.reachability_, core_distances=model.core_distances_,
                                      ordering=model.ordering_, eps=eps)
    xi_labels, clusters = cluster_optics_xi(reachability=model.reachability_, predecessor=model.predecessor_,
                                            ordering=model.ordering_, min_samples=min_samples,
                                            min_cluster_size=min_cluster_size, xi=xi)
    if truth is None:
        truth = np.full(n, -1)
    header = ["x%d" % j for j in range(d)] + ["core", "reach", "pred", "position", "threshold", "xi", "truth"]
    rows = []
    for i in range(n):
        rows.append([fmt(v) for v in X[i]] + [fmt(model.core_distances_[i]), fmt(model.reachability_[i]),
                                              str(model.predecessor_[i]), str(position[i]), str(threshold[i]),
                                              str(xi_labels[i]), str(truth[i])])
    write_csv("optics_%s.csv" % name, header, rows)
    write_csv("optics_%s_clusters.csv" % name, ["start", "end"], [[str(s), str(e)] for s, e in clusters])
    write_csv("optics_%s_params.csv" % name, ["min_samples", "eps", "xi", "min_cluster_size"],
              [[str(min_samples), fmt(eps), fmt(xi), str(min_cluster_size)]])
    print(name, "n=%d" % n, "threshold clusters:", len(set(threshold) - {-1}),
          "xi clusters:", len(clusters), "xi leaf labels:", len(set(xi_labels) - {-1}))


def main():
    # The 1-D worked set of the field notes (section 5).
    x1 = np.array([[0.0], [1.0], [2.0], [10.0], [11.0], [12.0], [30.0]])
    optics_fixture("line_minpts2", x1, 2, 3.0, 0.05, 2)
    optics_fixture("line_minpts3", x1, 3, 3.0, 0.05, 3)

    # 2-D grid example of the field notes: 5x5 grid (spacing 0.1) at the origin, 3x3 grid at (2, 2), two noise
    # points.
    g = [[0.1 * i, 0.1 * j] for i in range(5) for j in range(5)]
    g += [[2.0 + 0.1 * i, 2.0 + 0.1 * j] for i in range(3) for j in range(3)]
    g += [[5.0, 0.0], [0.0, 5.0]]
    optics_fixture("grid", np.array(g), 4, 0.5, 0.05, 4)

    # 2-D blobs with uniform noise, ~2000 points.
    rng = np.random.default_rng(20240601)
    blobs = [rng.normal([0, 0], 0.5, (900, 2)), rng.normal([4, 4], 0.3, (500, 2)),
             rng.normal([-4, 3], 0.8, (450, 2)), rng.uniform(-8, 8, (150, 2))]
    xb = np.vstack(blobs)
    tb = np.concatenate([np.full(len(b), k if k < 3 else -1) for k, b in enumerate(blobs)])
    perm = rng.permutation(len(xb))
    optics_fixture("blobs2d", xb[perm], 10, 0.5, 0.05, 20, tb[perm])

    # 3-D "operating data": one dense normal blob, two small fault blobs, scattered noise (standardised-like scale).
    normal = rng.multivariate_normal([0, 0, 0], [[1.0, 0.6, 0.2], [0.6, 1.0, 0.1], [0.2, 0.1, 0.5]], 1600)
    fault1 = rng.normal([4.0, -3.0, 1.0], 0.25, (120, 3))
    fault2 = rng.normal([-3.5, 3.5, -2.0], 0.2, (60, 3))
    noise = rng.uniform(-7, 7, (70, 3))
    parts = [normal, fault1, fault2, noise]
    xo = np.vstack(parts)
    to = np.concatenate([np.full(len(b), k if k < 3 else -1) for k, b in enumerate(parts)])
    perm = rng.permutation(len(xo))
    optics_fixture("operating3d", xo[perm], 20, 0.6, 0.05, 40, to[perm])

    # Ties at larger sizes, as in smoothed and rounded operating data: a 3-D lattice (spacing 0.5) with many
    # duplicates and exact distance ties, and a 1-D walk rounded to 0.1 that holds still half of the time.
    lattice = rng.integers(0, 8, (1500, 3)) * 0.5
    optics_fixture("lattice3d", lattice, 10, 0.6, 0.05, 30)
    steps = np.where(rng.random(1200) < 0.5, 0.0, rng.normal(0, 0.15, 1200))
    walk = np.round(np.cumsum(steps), 1).reshape(-1, 1)
    optics_fixture("walk1d", walk, 20, 0.25, 0.05, 40)

    # PCA on iris (Fisher 1936, as shipped by scikit-learn).
    iris = load_iris().data
    write_csv("iris.csv", ["sepal_length", "sepal_width", "petal_length", "petal_width"],
              [[fmt(v) for v in row] for row in iris])
    for mode, data in (("standardised", StandardScaler().fit_transform(iris)), ("centred", iris)):
        pca = PCA().fit(data)
        header = ["ratio", "explained_variance"] + ["component_x%d" % j for j in range(data.shape[1])]
        rows = [[fmt(pca.explained_variance_ratio_[c]), fmt(pca.explained_variance_[c])]
                + [fmt(v) for v in pca.components_[c]] for c in range(len(pca.components_))]
        write_csv("pca_iris_%s.csv" % mode, header, rows)
    a = [0, 0, 0, 1, 1, 1, 2, 2, 2, 2, -1, -1]
    b = [1, 1, 0, 0, 0, 0, 2, 2, 3, 3, 3, -1]
    from sklearn.metrics import adjusted_rand_score
    write_csv("ari_example.csv", ["a", "b", "ari"], [[str(u), str(v), fmt(adjusted_rand_score(a, b))]
                                                   for u, v in zip(a, b)])
    scaler = StandardScaler().fit(iris)
    write_csv("pca_iris_scaler.csv", ["mean", "scale"],
              [[fmt(m), fmt(s)] for m, s in zip(scaler.mean_, scaler.scale_)])


if __name__ == "__main__":
    main()
