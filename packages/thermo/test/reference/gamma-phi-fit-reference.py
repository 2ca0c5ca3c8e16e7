"""Independent reference optimum for Ebullio's isothermal (bubble-pressure) fit, ideal and virial vapour.

Run with a Python that has chemicals 1.5.2 and scipy: python3 gamma-phi-fit-reference.py
Same objective as fitBinary's 'bubble-pressure': minimise sum[((P_calc - P)/sigmaP)^2 + ((y_calc - y)/sigmaY)^2],
sigmaP = 100 Pa, sigmaY = 0.005, NRTL with alpha = 0.5081 held, parameters b12, b21 (J/mol). The bubble pressure is
solved by substitution with the virial vapour of gamma-phi-reference.py (chemicals 1.5.2 Tsonopoulos B, Tsonopoulos
cross rules); scipy.optimize.least_squares (method 'lm', xtol = ftol = gtol = 1e-15) finds the optimum.
The data are an invented isothermal set (1-propanol (1) / water (2) at 363.15 K) generated from the same system
with b12 = 2100, b21 = 6850 J/mol plus a deterministic scatter; they are frozen in the test beside the results.
"""
import importlib.util
import json
import os
from math import exp

import numpy as np
from scipy.optimize import least_squares

here = os.path.dirname(os.path.abspath(__file__))
spec = importlib.util.spec_from_file_location('gpref', os.path.join(here, 'gamma-phi-reference.py'))
ref = importlib.util.module_from_spec(spec)
spec.loader.exec_module(ref)

R = ref.R
AL = 0.5081
T = 363.15
DATA = [
    (0.04, 97113.9, 0.29975),
    (0.1108, 108442.8, 0.38319),
    (0.1815, 110271.1, 0.39731),
    (0.2523, 111309.0, 0.41200),
    (0.3231, 111979.6, 0.42479),
    (0.3938, 112202.1, 0.43321),
    (0.4646, 112537.0, 0.45115),
    (0.5354, 112179.7, 0.48006),
    (0.6062, 110891.3, 0.50730),
    (0.6769, 109178.3, 0.53696),
    (0.7477, 106108.3, 0.58506),
    (0.8185, 101211.0, 0.65139),
    (0.8892, 94553.1, 0.73553),
    (0.96, 84433.8, 0.87163),
]


def gammas(x1, T, b12, b21):
    x2 = 1 - x1
    t12, t21 = b12 / (R * T), b21 / (R * T)
    G12, G21 = exp(-AL * t12), exp(-AL * t21)
    l1 = x2**2 * (t21 * (G21 / (x1 + x2 * G21)) ** 2 + t12 * G12 / (x2 + x1 * G12) ** 2)
    l2 = x1**2 * (t12 * (G12 / (x2 + x1 * G12)) ** 2 + t21 * G21 / (x1 + x2 * G21) ** 2)
    return exp(l1), exp(l2)


def bubble_P(x1, b12, b21, virial):
    g1, g2 = gammas(x1, T, b12, b21)
    a1, a2 = x1 * g1 * ref.psat(0, T), (1 - x1) * g2 * ref.psat(1, T)
    P, y1 = a1 + a2, a1 / (a1 + a2)
    if not virial:
        return P, y1
    for _ in range(500):
        F1, F2, _, _ = ref.Phis(T, P, y1)
        Pn = a1 / F1 + a2 / F2
        yn = a1 / F1 / Pn
        if abs(Pn - P) < 1e-12 * Pn and abs(yn - y1) < 1e-15:
            return Pn, yn
        P, y1 = Pn, yn
    raise RuntimeError('no convergence')


def residuals(p, virial):
    out = []
    for x1, P, y1 in DATA:
        Pc, yc = bubble_P(x1, p[0], p[1], virial)
        out += [(Pc - P) / 100.0, (yc - y1) / 0.005]
    return np.array(out)


if __name__ == '__main__':
    result = {}
    for virial in (False, True):
        r = least_squares(residuals, [2000.0, 6000.0], args=(virial,), method='lm', xtol=1e-15, ftol=1e-15, gtol=1e-15)
        result['virial' if virial else 'ideal'] = {'b12': r.x[0], 'b21': r.x[1], 'objective': float(np.sum(r.fun**2))}
    print(json.dumps(result, indent=2))
