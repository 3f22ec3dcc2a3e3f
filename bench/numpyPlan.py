#!/usr/bin/env python3
"""
Yardstick for the whole-process speed of `cellwright plan`: a plain numpy script doing comparable
per-cell work on the same design (bench/plan-bend-1e6.json by default) — lattice and device mask,
closed-form transformation tensors of the beam bend (eps' = K K^T / det K), principal values,
the isotropic reduction in a background of index n_b, 1D quantization into levels (k-means on a
sample of the distinct values, then every cell assigned), fill fractions per cell from the
Maxwell Garnett inverse for its level, the relative error, and a CSV build list of about the same
width written to --out. It is a yardstick only: nothing in the project imports it and no test
needs it (python3 with numpy).

Usage: python3 bench/numpyPlan.py [design.json] [--out DIR]
"""
import json
import math
import os
import re
import sys
import time

import numpy as np

UNITS = {"m": 1.0, "mm": 1e-3, "um": 1e-6, "nm": 1e-9, "cm": 1e-2, "Hz": 1.0, "GHz": 1e9, "MHz": 1e6, "deg": math.pi / 180, "rad": 1.0}


def quantity(v):
    if isinstance(v, (int, float)):
        return float(v)
    m = re.match(r"^\s*([-+0-9.eE]+)\s*([A-Za-z]+)\s*$", v)
    return float(m.group(1)) * UNITS[m.group(2)]


def main():
    args = sys.argv[1:]
    out_dir = "/tmp/numpy-plan-out"
    if "--out" in args:
        k = args.index("--out")
        out_dir = args[k + 1]
        del args[k:k + 2]
    path = args[0] if args else os.path.join(os.path.dirname(__file__), "plan-bend-1e6.json")
    with open(path) as fh:
        design = json.load(fh)
    t = design["transform"]
    a, b = quantity(t["innerRadius"]), quantity(t["outerRadius"])
    span, r0 = quantity(t["angle"]), quantity(t["referenceRadius"])
    pitch = quantity(design["grid"]["pitch"])
    nb = float(design["reduction"]["backgroundIndex"])
    tol = float(design["realization"]["tolerance"])
    t0 = time.process_time()

    # lattice over the bounding box, device mask (quarter ring)
    xs = np.arange(math.ceil(0 / pitch - 0.5), math.floor(b / pitch + 0.5) + 1) * pitch
    ys = xs.copy()
    X, Y = np.meshgrid(xs, ys)
    R = np.hypot(X, Y)
    TH = np.arctan2(Y, X)
    inside = (R >= a) & (R <= b) & (TH >= 0) & (TH <= span)
    jj, ii = np.nonzero(inside)
    x, y, r = X[inside], Y[inside], R[inside]
    n = x.size

    # closed-form K = dG/dx' of the beam bend; eps' = det K * K^-1 K^-T (vacuum background)
    nx, ny, q = x / r, y / r, r0 / r
    k00, k01, k10, k11 = nx, ny, -q * ny, q * nx
    det = k00 * k11 - k01 * k10
    ga, gb, gc = k00 * k00 + k01 * k01, k00 * k10 + k01 * k11, k10 * k10 + k11 * k11  # K K^T
    exx = gc / det
    eyy = ga / det
    exy = -gb / det
    ezz = det
    mean = 0.5 * (exx + eyy)
    half = np.hypot(0.5 * (exx - eyy), exy)
    lmin, lmax = mean - half, mean + half
    aniso = lmax / lmin

    # isotropic reduction for Ez in a background of index nb: n^2 = nb^2 * eps_zz * sqrt(lmin*lmax)
    target = nb * nb * ezz * np.sqrt(lmin * lmax)
    axis_deg = np.degrees(0.5 * np.arctan2(2 * exy, exx - eyy))

    # quantization: k-means (Lloyd) on a sample of distinct log values, as few levels as meet tol/2
    logt = np.log(target)
    sample = np.unique(logt)
    if sample.size > 4096:
        sample = sample[np.linspace(0, sample.size - 1, 4096).astype(int)]
    centres = None
    for k in range(1, 257):
        c = np.quantile(sample, (np.arange(k) + 0.5) / k)
        for _ in range(20):
            edges = 0.5 * (c[1:] + c[:-1])
            lab = np.searchsorted(edges, sample)
            sums = np.bincount(lab, sample, minlength=k)
            cnt = np.bincount(lab, minlength=k)
            c = np.where(cnt > 0, sums / np.maximum(cnt, 1), c)
        err = np.max(np.abs(np.expm1(sample - c[np.searchsorted(0.5 * (c[1:] + c[:-1]), sample)])))
        centres = c
        if err <= tol / 2:
            break
    edges = 0.5 * (centres[1:] + centres[:-1])
    level = np.searchsorted(edges, logt)
    centre = np.exp(centres)[level]
    qerr = np.abs(centre - target) / target

    # fill fraction per cell: Maxwell Garnett inverse, resin (eps 2.8) in air, spheres
    ei, eh = 2.8, 1.0
    beta = (centre - eh) / (centre + 2 * eh)
    fill = np.clip(beta * (ei + 2 * eh) / (ei - eh), 0, 1)
    achieved = eh * (1 + 2 * fill * (ei - eh) / (ei + 2 * eh)) / (1 - fill * (ei - eh) / (ei + 2 * eh))
    rel = np.abs(achieved - target) / target
    width = pitch * np.sqrt(fill / 3)
    loss = 0.02 * fill
    region = level + 1

    # CSV build list, one row per cell
    os.makedirs(out_dir, exist_ok=True)
    cols = [np.arange(1, n + 1), ii, jj, x, y, axis_deg, region, level + 1, target, np.ones(n), np.ones(n),
            achieved, np.ones(n), np.ones(n), rel, qerr, fill, width, loss, aniso]
    fmt = ["%d", "%d", "%d", "%.6g", "%.6g", "%.3g", "%d", "%d", "%.6g", "%.6g", "%.6g",
           "%.6g", "%.6g", "%.6g", "%.4g", "%.4g", "%.6g", "%.6g", "%.4g", "%.4g"]
    header = "cell,i,j,x_m,y_m,axis_deg,region,level,target_eps_z,target_mu_1,target_mu_2,achieved_eps_z,achieved_mu_1,achieved_mu_2,rel_error,quantization_error,fill_fraction,width_m,loss_tangent,anisotropy"
    with open(os.path.join(out_dir, "build-list.csv"), "w") as fh:
        np.savetxt(fh, np.column_stack(cols), fmt=",".join(fmt), header=header, comments="")
    cpu = time.process_time() - t0
    print(f"{n} cells, {centres.size} levels, build list {os.path.getsize(os.path.join(out_dir, 'build-list.csv')) / 1e6:.1f} MB, {cpu:.2f} s CPU in the script body")


if __name__ == "__main__":
    main()
