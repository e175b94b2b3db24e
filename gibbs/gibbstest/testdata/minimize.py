#!/usr/bin/python3
"""Independent Gibbs-energy minimisation for hess's solver tests.

Reads a problem (the JSON of gibbstest.Encode), or a list of them, on
stdin; writes {"n": [...], "lambda": [...], "residual": r} (or a list) on stdout.

Method, independent of the Go solver: scipy.optimize.minimize (SLSQP) on
the amounts themselves, then the Karush-Kuhn-Tucker equations solved with
scipy.optimize.fsolve (element potentials, ln of each mixture phase's
amount, amounts of the present pure phases), with the pure phases' presence
corrected until every absent one is stable. Ideal gas, ideal solution and
pure phases; aqueous phases are not supported.
"""
import json
import sys

import numpy as np
from scipy.optimize import fsolve, minimize


def main():
    data = json.load(sys.stdin)
    if isinstance(data, list):
        json.dump([solve(p) for p in data], sys.stdout)
    else:
        json.dump(solve(data), sys.stdout)


def solve(prob):
    sp = prob["species"]
    kinds = prob["phases"]
    B = np.array(prob["B"], dtype=float)
    b = np.array(prob["b"], dtype=float)
    lnP = np.log(prob["pressureRatio"])
    s = len(sp)
    mu0 = np.array([x["mu0"] for x in sp])
    phase = [x["phase"] for x in sp]
    for k in kinds:
        if k not in ("gas", "pure", "solution"):
            raise SystemExit("unsupported phase kind " + k)
    mix = [j for j in range(s) if kinds[phase[j]] != "pure"]
    pure = [j for j in range(s) if kinds[phase[j]] == "pure"]
    g = mu0.copy()
    for j in mix:
        if kinds[phase[j]] == "gas":
            g[j] += lnP
    mphases = sorted({phase[j] for j in mix})

    # Keep independent rows only.
    rows = []
    for i in range(B.shape[0]):
        trial = B[rows + [i]]
        if np.linalg.matrix_rank(trial, tol=1e-10) == len(rows) + 1:
            rows.append(i)
    B, b = B[rows], b[rows]
    m = len(rows)

    # Species that no feasible point can make positive (linear programming).
    from scipy.optimize import linprog
    zero = np.zeros(s, dtype=bool)
    for j in range(s):
        c = np.zeros(s)
        c[j] = -1
        r = linprog(c, A_eq=B, b_eq=b, bounds=[(0, 1e6)] * s, method="highs")
        if r.status == 0 and -r.fun <= 1e-12:
            zero[j] = True

    def G(n):
        v = float(np.dot(n, g))
        for p in mphases:
            idx = [j for j in mix if phase[j] == p and not zero[j]]
            nn = n[idx]
            tot = nn.sum()
            v += float(np.sum(nn * np.log(nn / tot)))
        return v

    def dG(n):
        d = g.copy()
        for p in mphases:
            idx = [j for j in mix if phase[j] == p and not zero[j]]
            tot = n[idx].sum()
            d[idx] += np.log(n[idx] / tot)
        return d

    lo = np.where(zero, 0.0, 1e-14)
    hi = np.where(zero, 0.0, None)
    x0 = np.linalg.lstsq(B, b, rcond=None)[0]
    x0 = np.clip(x0, 1e-3, None)
    x0[zero] = 0
    res = minimize(G, x0, jac=dG, method="SLSQP",
                   constraints=[{"type": "eq", "fun": lambda n: B @ n - b, "jac": lambda n: B}],
                   bounds=list(zip(lo, hi)), options={"maxiter": 2000, "ftol": 1e-15})
    n = np.maximum(res.x, 0)

    present = [k for k in pure if n[k] > 1e-6 and not zero[k]]
    for _ in range(len(pure) + 3):
        live = [j for j in mix if not zero[j]]
        # Initial potentials: least squares of stationarity on major species.
        mu = dG(np.where(zero, 1.0, np.maximum(n, 1e-300)))
        major = [j for j in live if n[j] > 1e-6] + present
        lam0 = np.linalg.lstsq(B[:, major].T, mu[major], rcond=None)[0]
        lnN0 = [np.log(max(sum(n[j] for j in live if phase[j] == p), 1e-12)) for p in mphases]
        x0 = np.concatenate([lam0, lnN0, [max(n[k], 1e-3) for k in present]])

        def kkt(x):
            lam = x[:m]
            lnN = x[m:m + len(mphases)]
            npure = x[m + len(mphases):]
            amounts = np.zeros(s)
            eqs = []
            for pi, p in enumerate(mphases):
                idx = [j for j in live if phase[j] == p]
                lx = np.array([B[:, j] @ lam - g[j] for j in idx])
                amounts[idx] = np.exp(lnN[pi] + lx)
                eqs.append(np.sum(np.exp(lx)) - 1)
            for k, v in zip(present, npure):
                amounts[k] = v
                eqs.append(B[:, k] @ lam - g[k])
            return np.concatenate([(B @ amounts - b) / max(1.0, np.abs(b).max()), eqs]), amounts

        sol, info, ier, msg = fsolve(lambda x: kkt(x)[0], x0, full_output=True, xtol=1e-14)
        for _ in range(3):
            sol, info, ier, msg = fsolve(lambda x: kkt(x)[0], sol, full_output=True, xtol=1e-15)
        _, n = kkt(sol)
        lam = sol[:m]
        changed = False
        for k, v in zip(present, sol[m + len(mphases):]):
            if v < 0:
                present.remove(k)
                changed = True
                break
        if not changed:
            unstable = [k for k in pure if k not in present and not zero[k] and g[k] - B[:, k] @ lam < -1e-10]
            if unstable:
                present.append(min(unstable, key=lambda k: g[k] - B[:, k] @ lam))
                n[unstable[0]] = 1e-3
                changed = True
        if not changed:
            break
    n[zero] = 0
    full_lam = np.zeros(len(prob["B"]))
    full_lam[rows] = lam
    return {"n": [float(v) for v in n], "lambda": [float(v) for v in full_lam],
            "residual": float(np.abs(kkt(sol)[0]).max())}


main()
