"""Independent aqueous speciation for hess's tests.

Reads one JSON problem on stdin and solves, with scipy.optimize.fsolve, the
mass-action, mass-balance and charge-balance equations for the log10
molalities of the solutes; writes {"logActivity": {name: log10 a}, "logAw":
log10 a_w, "residual": max |f|} on stdout.

Problem:
  species:     [{"name", "z", "guess"}]     solutes; guess is a log10 molality
  model:       "ideal" or "davies"; A: the Debye-Hueckel A (log10, kg^0.5/mol^0.5)
  Mw:          kg/mol of water
  massAction:  [{"logK", "nu": {name: coef}, "water": coef}]
               sum nu log10 a + water log10 a_w = logK (gases held fixed are
               folded into logK by the caller)
  massBalance: [{"total", "coef": {name: coef}, "water": coef}]
               without "waterMol": sum coef m = total (mol/kg);
               with it: sum coef m kg_w + water n_w = total (mol), the
               amount of water n_w (kg_w = n_w Mw) one more unknown
  waterMol:    a guess of the water's amount, mol, to make it an unknown
               (water that reactions make or use changes the molalities)
  charge:      true to add sum z m = 0

Water's activity under Davies follows from the Gibbs-Duhem equation,
ln a_w = -Mw (sum m + ln10 sum m_i K_i), K_i = log g_i(I) - (1/I) int_0^I
log g_i(x) dx, the integral taken numerically (scipy.integrate.quad).
"""
import json
import math
import sys

import numpy as np
from scipy.integrate import quad
from scipy.optimize import fsolve


def main():
    p = json.load(sys.stdin)
    names = [s["name"] for s in p["species"]]
    z = np.array([s["z"] for s in p["species"]], dtype=float)
    idx = {n: i for i, n in enumerate(names)}
    A = p.get("A", 0.0)
    davies = p["model"] == "davies"
    Mw = p["Mw"]

    def log_gamma_ion(zi, I):
        if not davies or zi == 0 or I <= 0:
            return 0.0
        s = math.sqrt(I)
        return -A * zi * zi * (s / (1 + s) - 0.3 * I)

    water_unknown = "waterMol" in p
    k = len(names)

    def state(x):
        m = 10.0 ** x[:k]
        I = 0.5 * float(np.sum(m * z * z))
        lg = np.array([log_gamma_ion(zi, I) for zi in z])
        osm = 0.0
        if davies and I > 0:
            for i, zi in enumerate(z):
                if zi == 0:
                    continue
                integral, _ = quad(lambda t: log_gamma_ion(zi, t), 0, I, epsabs=1e-15, epsrel=1e-13)
                osm += m[i] * (lg[i] - integral / I)
        ln_aw = -Mw * (float(np.sum(m)) + math.log(10) * osm)
        return m, lg, ln_aw / math.log(10)

    def equations(x):
        m, lg, log_aw = state(x)
        loga = x[:k] + lg
        nw = math.exp(x[k]) if water_unknown else None
        f = []
        for r in p["massAction"]:
            s = sum(c * loga[idx[n]] for n, c in r["nu"].items()) + r.get("water", 0) * log_aw
            f.append(s - r["logK"])
        for b in p.get("massBalance") or []:
            s = sum(c * m[idx[n]] for n, c in b["coef"].items())
            if water_unknown:
                s = s * nw * Mw + b.get("water", 0) * nw
            f.append(s / b["total"] - 1)
        if p.get("charge"):
            scale = float(np.sum(m * np.abs(z)))
            f.append(float(np.sum(m * z)) / scale)
        return f

    x0 = [s["guess"] for s in p["species"]]
    if water_unknown:
        x0.append(math.log(p["waterMol"]))
    x0 = np.array(x0, dtype=float)
    x, info, ier, msg = fsolve(equations, x0, full_output=True, xtol=1e-14, maxfev=20000)
    res = max(abs(v) for v in equations(x))
    m, lg, log_aw = state(x)
    out = {"logActivity": {n: float(x[i] + lg[i]) for i, n in enumerate(names)},
           "waterMol": math.exp(x[k]) if water_unknown else None,
           "logAw": log_aw, "residual": res, "converged": bool(ier == 1), "message": msg}
    json.dump(out, sys.stdout)


if __name__ == "__main__":
    main()
