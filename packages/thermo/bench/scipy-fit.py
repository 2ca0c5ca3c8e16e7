"""The NRTL bubble-point fits of bench/run.ts (30 points, b12 and b21) and bench/joint-fit.ts (three 30-point data
sets, energies linear in T: b(T) = b + bT*(T - 298.15 K)), done with scipy.optimize.least_squares (MINPACK LM).
The start vector says which: two values fit b12, b21; four fit b12, b21, b12T, b21T.

Same points, same weights, same objective: residuals (Tcalc - T)/sigmaT and (ycalc - y)/sigmaY, each point's
bubble temperature at its own x1 and P under modified Raoult's law with NRTL; ln(P/Pa) = a - b/(T/K + c).
Reads a JSON problem (one line) on stdin, prints a JSON result (median wall time of the fits, excluding start-up).
With "rounds": true it then waits: each further line on stdin runs `repeats` fits again and prints one JSON line,
so a caller can pair its own measurements with scipy's taken at the same moment (bench/joint-fit.ts).
"""
import json
import sys
import time

import numpy as np
from scipy.optimize import least_squares

R = 8.314462618


def nrtl(theta, alpha, x1, T):
    b12, b21, b12T, b21T = (*theta, 0.0, 0.0) if len(theta) == 2 else theta
    x2 = 1.0 - x1
    t12 = (b12 + b12T * (T - 298.15)) / (R * T)
    t21 = (b21 + b21T * (T - 298.15)) / (R * T)
    G12 = np.exp(-alpha * t12)
    G21 = np.exp(-alpha * t21)
    S1 = x1 + x2 * G21
    S2 = x2 + x1 * G12
    lg1 = x2 * x2 * (t21 * (G21 / S1) ** 2 + t12 * G12 / S2 ** 2)
    lg2 = x1 * x1 * (t12 * (G12 / S2) ** 2 + t21 * G21 / S1 ** 2)
    return lg1, lg2


def bubble(theta, prob):
    (a1, bb1, c1), (a2, bb2, c2) = prob["vp"]
    x1, lnP, T = prob["x1"], prob["lnP"], prob["T0"].copy()
    for _ in range(100):
        lg1, lg2 = nrtl(theta, prob["alpha"], x1, T)
        k1 = x1 * np.exp(lg1 + a1 - bb1 / (T + c1))
        k2 = (1 - x1) * np.exp(lg2 + a2 - bb2 / (T + c2))
        S = k1 + k2
        # Newton with the vapour-pressure slope only (the usual hand-written version)
        fp = (k1 * bb1 / (T + c1) ** 2 + k2 * bb2 / (T + c2) ** 2) / S
        dT = -(np.log(S) - lnP) / fp
        T = T + dT
        if np.max(np.abs(dT)) < 1e-9:
            break
    lg1, lg2 = nrtl(theta, prob["alpha"], x1, T)
    k1 = x1 * np.exp(lg1 + a1 - bb1 / (T + c1))
    k2 = (1 - x1) * np.exp(lg2 + a2 - bb2 / (T + c2))
    return T, k1 / (k1 + k2)


def main():
    raw = json.loads(sys.stdin.readline())
    pts = raw["points"]
    prob = {
        "x1": np.array([p["x1"] for p in pts]),
        "lnP": np.array([p["lnP"] for p in pts]),
        "T": np.array([p["T"] for p in pts]),
        "y1": np.array([p["y1"] for p in pts]),
        "vp": raw["vp"],
        "alpha": raw["alpha"],
    }
    prob["T0"] = prob["T"].copy()
    wT, wY = 1.0 / raw["sigmaT"], 1.0 / raw["sigmaY"]

    def residuals(theta):
        T, y = bubble(theta, prob)
        return np.concatenate([(T - prob["T"]) * wT, (y - prob["y1"]) * wY])

    def measure():
        times, cpu, sol = [], [], None
        for _ in range(raw["repeats"]):
            t0, c0 = time.perf_counter(), time.process_time()
            sol = least_squares(residuals, np.array(raw["start"], dtype=float), method="lm", xtol=1e-12, ftol=1e-12,
                                gtol=1e-12)
            times.append((time.perf_counter() - t0) * 1000)
            cpu.append((time.process_time() - c0) * 1000)
        times.sort()
        cpu.sort()
        print(json.dumps({
            "medianMs": times[len(times) // 2],
            "cpuMs": cpu[len(cpu) // 2],
            "params": sol.x.tolist(),
            "cost": float(np.sum(sol.fun ** 2)),
            "nfev": int(sol.nfev),
            "success": bool(sol.success),
        }), flush=True)

    measure()
    if raw.get("rounds"):
        for _ in sys.stdin:
            measure()


if __name__ == "__main__":
    main()
