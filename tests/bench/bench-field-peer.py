#!/usr/bin/env python3
# SPDX-License-Identifier: GPL-3.0-or-later
# The peer of the 2-D solver's benchmark: the same linear system solved by
# scipy's sparse direct solver (SuperLU through scipy.sparse.linalg.spsolve,
# COLAMD ordering).  Reads the system bench-field wrote:
#   line 1: "nx ny\n", then float64 arrays diagonal, east, north, rhs (n each)
# and prints one line: "peer-ms <CPU ms of the factorisation and solve>
# residual <relative residual> temperature-sum <sum of the solution>".
# Prints "peer-skip <reason>" when scipy is missing (python3-scipy).
import sys
import time

try:
    import numpy as np
    import scipy.sparse as sp
    import scipy.sparse.linalg as spla
except ImportError as e:  # the bench script installs python3-scipy
    print("peer-skip python3-scipy is not installed (%s)" % e)
    sys.exit(0)

with open(sys.argv[1], "rb") as f:
    nx, ny = (int(v) for v in f.readline().split())
    n = nx * ny
    data = np.frombuffer(f.read(), dtype="<f8")
diag, east, north, rhs = (data[k * n:(k + 1) * n] for k in range(4))
offsets = [0, 1, -1, nx, -nx]
bands = [diag, -east[:-1], -east[:-1], -north[:-nx], -north[:-nx]]
a = sp.diags(bands, offsets, shape=(n, n), format="csc")
t0 = time.process_time()
x = spla.spsolve(a, rhs)
ms = (time.process_time() - t0) * 1000.0
residual = np.linalg.norm(a @ x - rhs) / np.linalg.norm(rhs)
print("peer-ms %.3f residual %.3g temperature-sum %.9g" % (ms, residual, float(np.sum(x))))
