"""Independent reference optimum for Ebullio's joint fit over isothermal and isobaric data sets (fitJoint).

Run with a Python that has scipy: python3 joint-fit-reference.py
Same objective as fitJoint: isothermal rows ((P_calc - P)/sigmaP, (y_calc - y)/sigmaY) with each point's bubble
pressure at its own T, isobaric rows ((T_calc - T)/sigmaT, (y_calc - y)/sigmaY) with each point's bubble temperature
at its own P; sigmaP = 100 Pa, sigmaT = 0.1 K, sigmaY = 0.005; modified Raoult's law (ideal vapour); NRTL with
alpha = 0.5081 held and energies linear in T, b(T) = b + bT*(T - 298.15 K), tau = b(T)/(R*T); parameters b12, b21
(J/mol), b12T, b21T (J/(mol K)). Antoine ln(P/kPa) = A - B/(t/degC + C), constants of 1-propanol (1) and water (2)
as in the test. The bubble temperature is found by scipy.optimize.brentq; scipy.optimize.least_squares (method 'lm',
xtol = ftol = gtol = 1e-15) finds the optimum from b12 = 2000, b21 = 6000, b12T = b21T = 0.
The data are invented (generated from b12 = 2100, b21 = 6850 J/mol, b12T = -8, b21T = 12 J/(mol K) plus a
deterministic scatter); they are frozen in test/reference/fitting.joint-mixed.test.ts beside the result.
"""
import json
from math import exp, log

import numpy as np
import scipy
from scipy.optimize import brentq, least_squares

R = 8.314462618
AL = 0.5081
ANTOINE = [(16.1154, 3483.67, 205.807), (16.3872, 3885.7, 230.17)]
ISO = {
    333.15: [(0.04, 28478.9, 0.31699), (0.1236, 30349.5, 0.36582), (0.2073, 30575.4, 0.37575), (0.2909, 30602.3, 0.3808),
             (0.3745, 30743.3, 0.39446), (0.4582, 30771.5, 0.42487), (0.5418, 30399.0, 0.44903), (0.6255, 30012.5, 0.4897),
             (0.7091, 28964.4, 0.54402), (0.7927, 27634.4, 0.60472), (0.8764, 25522.2, 0.70988), (0.96, 22268.4, 0.87477)],
    363.15: [(0.04, 98408.2, 0.30476), (0.1236, 106681.5, 0.37133), (0.2073, 107494.3, 0.38454), (0.2909, 108195.6, 0.38826),
             (0.3745, 108631.6, 0.41105), (0.4582, 108840.0, 0.4386), (0.5418, 107982.0, 0.4658), (0.6255, 106357.1, 0.5152),
             (0.7091, 103371.8, 0.56655), (0.7927, 98737.6, 0.63505), (0.8764, 92188.7, 0.74248), (0.96, 82464.7, 0.88987)],
}
BAR_P = 250000.0
BAR = [(0.04, 390.373, 0.29074), (0.1236, 387.575, 0.37256), (0.2073, 387.119, 0.38313), (0.2909, 387.068, 0.39183),
       (0.3745, 386.699, 0.41949), (0.4582, 386.793, 0.44227), (0.5418, 386.928, 0.47771), (0.6255, 387.321, 0.52871),
       (0.7091, 388.29, 0.57895), (0.7927, 389.391, 0.65769), (0.8764, 391.512, 0.76156), (0.96, 394.302, 0.90118)]


def psat(i, T):
    A, B, C = ANTOINE[i]
    return 1000.0 * exp(A - B / (T - 273.15 + C))


def gammas(x1, T, p):
    b12, b21, b12T, b21T = p
    x2 = 1 - x1
    t12 = (b12 + b12T * (T - 298.15)) / (R * T)
    t21 = (b21 + b21T * (T - 298.15)) / (R * T)
    G12, G21 = exp(-AL * t12), exp(-AL * t21)
    l1 = x2**2 * (t21 * (G21 / (x1 + x2 * G21)) ** 2 + t12 * G12 / (x2 + x1 * G12) ** 2)
    l2 = x1**2 * (t12 * (G12 / (x2 + x1 * G12)) ** 2 + t21 * G21 / (x1 + x2 * G21) ** 2)
    return exp(l1), exp(l2)


def bubble_P(x1, T, p):
    g1, g2 = gammas(x1, T, p)
    a1, a2 = x1 * g1 * psat(0, T), (1 - x1) * g2 * psat(1, T)
    return a1 + a2, a1 / (a1 + a2)


def bubble_T(x1, P, p):
    T = brentq(lambda T: log(bubble_P(x1, T, p)[0] / P), 300.0, 480.0, xtol=1e-13, rtol=1e-15)
    return T, bubble_P(x1, T, p)[1]


def residuals(p):
    out = []
    for T, rows in ISO.items():
        for x1, P, y1 in rows:
            Pc, yc = bubble_P(x1, T, p)
            out += [(Pc - P) / 100.0, (yc - y1) / 0.005]
    for x1, T, y1 in BAR:
        Tc, yc = bubble_T(x1, BAR_P, p)
        out += [(Tc - T) / 0.1, (yc - y1) / 0.005]
    return np.array(out)


if __name__ == '__main__':
    r = least_squares(residuals, [2000.0, 6000.0, 0.0, 0.0], method='lm', xtol=1e-15, ftol=1e-15, gtol=1e-15)
    print(json.dumps({'scipy': scipy.__version__, 'params': r.x.tolist(), 'objective': float(np.sum(r.fun**2)),
                      'success': bool(r.success)}, indent=2))
