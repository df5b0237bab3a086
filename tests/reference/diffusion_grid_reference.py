"""Reference for RunWatch's diffusion solver: the same grid system assembled and solved with scipy.sparse.

Usage: diffusion_grid_reference.py LABELS_BIN WIRES_CSV NX NY H ORIGIN_X ORIGIN_Y LAMBDA BORDER METHOD
LABELS_BIN: NX*NY little-endian int32, row-major from the lower-left cell: -1 free, -2 outside, >= 0 wire index.
WIRES_CSV: one "x,y,r" line per wire (centre and footprint radius, same length unit as H).
LAMBDA: capture length or "inf". BORDER: absorbing | saturated | reflecting | periodic.
METHOD: "direct" (scipy.sparse.linalg.spsolve, SuperLU) or "cg" (scipy.sparse.linalg.cg, no preconditioner,
rtol 1e-11), timed in-process (assembly and solve timed separately; interpreter start and file reading are not).
Prints JSON {"capture": [...], "desorbed": x, "outflow": x, "free_area": x, "assemble_s": t, "solve_s": t, "solve_cpu_s": t,
"iterations": n}.

Independent of RunWatch's C# code: the matrix is built here from the labels and the wire circles. Equation per
free cell c (5-point Laplacian times h^2): (4 + h^2/lambda^2) u_c - sum of free neighbours = h^2; an outside
neighbour is 0 (absorbing), lambda^2 (saturated, moved to the right side) or absent from the 4 (reflecting); a
sink neighbour of wire w adds (1/theta - 1) to the diagonal, theta = where the wire's circle crosses the segment
between the two cell centres (fraction of h, at least 0.1, 1 if it does not cross), and carries u_c/theta into w.
"""
import json
import math
import sys
import time

import numpy as np
import scipy.sparse as sp
import scipy.sparse.linalg as spla

MIN_THETA = 0.1


def theta(cx, cy, dx, dy, wire, wires, h, box):
    px, py, r = wires[wire]
    ox, oy = cx - px, cy - py
    if box is not None:
        ox -= box[0] * round(ox / box[0])
        oy -= box[1] * round(oy / box[1])
    half = ox * dx + oy * dy
    c = ox * ox + oy * oy - r * r
    disc = half * half - c
    if disc < 0:
        return 1.0
    t = -half - math.sqrt(disc)
    if not (t > 0) or t > h:
        return 1.0
    return max(t / h, MIN_THETA)


def main(argv):
    nx, ny = int(argv[3]), int(argv[4])
    h, x0, y0 = float(argv[5]), float(argv[6]), float(argv[7])
    lam = float(argv[8])
    border, method = argv[9], argv[10]
    labels = np.fromfile(argv[1], dtype="<i4").reshape(ny, nx)
    wires = np.loadtxt(argv[2], delimiter=",", ndmin=2)
    periodic = border == "periodic"
    box = (nx * h, ny * h) if periodic else None
    s = 0.0 if math.isinf(lam) else h * h / (lam * lam)
    sat = lam * lam if border == "saturated" else 0.0

    start = time.perf_counter()
    free = labels == -1
    n = int(free.sum())
    index = -np.ones((ny, nx), dtype=np.int64)
    index[free] = np.arange(n)
    diag = np.full(n, s)
    rhs = np.full(n, h * h)
    outside_faces = np.zeros(n)
    rows, cols = [], []
    face_k, face_w, face_weight = [], [], []
    fy, fx = np.nonzero(free)
    fk = index[fy, fx]
    for dx, dy in ((-1, 0), (1, 0), (0, -1), (0, 1)):
        jx, jy = fx + dx, fy + dy
        if periodic:
            jx, jy = jx % nx, jy % ny
            inside = np.ones(n, dtype=bool)
        else:
            inside = (jx >= 0) & (jx < nx) & (jy >= 0) & (jy < ny)
        label = np.full(n, -2, dtype=np.int64)
        label[inside] = labels[jy[inside], jx[inside]]
        nb_free = label == -1
        diag[nb_free] += 1
        rows.append(fk[nb_free])
        cols.append(index[jy[nb_free], jx[nb_free]])
        out = label == -2
        outside_faces[out] += 1
        if border != "reflecting":
            diag[out] += 1
            rhs[out] += sat
        for k, ix, iy, w in zip(fk[label >= 0], fx[label >= 0], fy[label >= 0], label[label >= 0]):
            cx, cy = x0 + (ix + 0.5) * h, y0 + (iy + 0.5) * h
            weight = 1.0 / theta(cx, cy, dx, dy, int(w), wires, h, box)
            diag[k] += weight
            face_k.append(k)
            face_w.append(int(w))
            face_weight.append(weight)
    rows = np.concatenate(rows + [np.arange(n)])
    cols = np.concatenate(cols + [np.arange(n)])
    vals = np.concatenate([-np.ones(len(rows) - n), diag])
    a = sp.csr_matrix((vals, (rows, cols)), shape=(n, n))
    assemble = time.perf_counter() - start

    start = time.perf_counter()
    cpu_start = time.process_time()
    iterations = 0
    if method == "direct":
        u = spla.spsolve(a.tocsc(), rhs)
    else:
        def count(_):
            nonlocal iterations
            iterations += 1
        u, info = spla.cg(a, rhs, tol=1e-11, atol=0.0, maxiter=100000, callback=count)
        if info != 0:
            raise SystemExit(f"cg did not converge: info {info}")
    solve = time.perf_counter() - start
    solve_cpu = time.process_time() - cpu_start

    capture = np.zeros(len(wires))
    np.add.at(capture, np.array(face_w, dtype=np.int64), np.array(face_weight) * u[np.array(face_k, dtype=np.int64)])
    outflow = 0.0
    if border in ("absorbing", "saturated"):
        outflow = float(np.sum(outside_faces * (u - sat)))
    json.dump({"capture": capture.tolist(), "desorbed": float(s * u.sum()), "outflow": outflow,
               "free_area": n * h * h, "assemble_s": assemble, "solve_s": solve, "solve_cpu_s": solve_cpu, "iterations": iterations}, sys.stdout)


if __name__ == "__main__":
    main(sys.argv)
