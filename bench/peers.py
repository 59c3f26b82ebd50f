"""Peer runner for bench/suites/peers.ts: one task on a raw little-endian float64 matrix.

usage: peers.py TASK IN_PATH N D OUT_PATH RUNS [PARAM ...]
Prints one JSON line {"seconds": median wall time of RUNS timed runs after one warm-up,
"peak_mib": process max RSS, "version": ...} and writes the last result to OUT_PATH
(int32 labels, or float64 coordinates / int32 neighbour indices). Exit code 3 with a line
{"missing": name} when the peer library is not installed.
"""
import json
import resource
import statistics
import sys
import time

import numpy as np

task, in_path, n, d, out_path, runs = sys.argv[1:7]
n, d, runs = int(n), int(d), int(runs)
params = sys.argv[7:]
X = np.fromfile(in_path, dtype='<f8').reshape(n, d)


def need(module):
    try:
        return __import__(module)
    except ImportError:
        print(json.dumps({"missing": module}))
        sys.exit(3)


if task == 'kmeans':
    sk = need('sklearn')
    from sklearn.cluster import KMeans
    k, restarts, seed = int(params[0]), int(params[1]), int(params[2])
    version = 'scikit-learn ' + sk.__version__
    fn = lambda: KMeans(n_clusters=k, n_init=restarts, random_state=seed, tol=1e-4, max_iter=300).fit(X).labels_.astype('<i4')
elif task == 'pca':
    sk = need('sklearn')
    from sklearn.decomposition import PCA
    version = 'scikit-learn ' + sk.__version__
    fn = lambda: PCA(n_components=int(params[0]), svd_solver='full').fit_transform(X).astype('<f8')
elif task == 'tsne':
    sk = need('sklearn')
    from sklearn.manifold import TSNE
    iterations, perplexity = int(params[0]), float(params[1])
    version = 'scikit-learn ' + sk.__version__
    fn = lambda: TSNE(n_components=2, perplexity=perplexity, n_iter=iterations, init='pca', method='barnes_hut',
                      learning_rate='auto', random_state=1).fit_transform(X).astype('<f8')
elif task == 'ward':
    fc = need('fastcluster')
    from scipy.cluster.hierarchy import fcluster
    k = int(params[0])
    version = 'fastcluster ' + fc.__version__
    fn = lambda: (fcluster(fc.linkage_vector(X, method='ward'), k, criterion='maxclust') - 1).astype('<i4')
elif task == 'knn':
    pn = need('pynndescent')
    k = int(params[0])
    version = 'pynndescent ' + getattr(pn, '__version__', '?')
    fn = lambda: pn.NNDescent(X, n_neighbors=k + 1, random_state=1).neighbor_graph[0][:, 1:].astype('<i4')
else:
    raise SystemExit(f'unknown task {task}')

fn()  # warm-up (numba compilation, BLAS threads)
times = []
for _ in range(runs):
    t0 = time.perf_counter()
    result = fn()
    times.append(time.perf_counter() - t0)
np.ascontiguousarray(result).tofile(out_path)
print(json.dumps({"seconds": statistics.median(times), "peak_mib": resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024, "version": version}))
