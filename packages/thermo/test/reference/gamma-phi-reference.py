"""Independent reference numbers for Ebullio's γ–φ (Tsonopoulos virial) solvers.

Run with a Python that has chemicals 1.5.2 and scipy: python3 gamma-phi-reference.py
Pure second virial coefficients come from chemicals.virial.BVirial_Tsonopoulos_extended (chemicals 1.5.2);
the cross coefficient uses Tsonopoulos' combining rules; the bubble point is solved with scipy.optimize.brentq.
System: 1-propanol (1) / water (2), NRTL b12 = 500.40, b21 = 1636.57 cal/mol, alpha = 0.5081 and Antoine
constants from Smith, Van Ness & Abbott, 7th ed., Tables 12.5 and B.2; critical data from chemicals 1.5.2.
"""
from math import exp, log, sqrt
from scipy.optimize import brentq
from chemicals.virial import BVirial_Tsonopoulos_extended as BT

R = 8.314462618
comp = [
    dict(Tc=536.8, Pc=5169000.0, omega=0.624, Vc=218.0, a=0.0878, b=0.00908 + 0.0006957 * (1e5 * 1.55**2 * (5169000.0 / 101325) / 536.8**2)),
    dict(Tc=647.096, Pc=22064000.0, omega=0.3443, Vc=55.948037267100005, a=-0.0109, b=0.0),
]
ant = [(16.1154, 3483.67, 205.807), (16.3872, 3885.70, 230.170)]
b12, b21, al = 500.40 * 4.184, 1636.57 * 4.184, 0.5081


def psat(i, T):
    A, B, C = ant[i]
    return 1000 * exp(A - B / (T - 273.15 + C))


def gammas(x1, T):
    x2 = 1 - x1
    t12, t21 = b12 / (R * T), b21 / (R * T)
    G12, G21 = exp(-al * t12), exp(-al * t21)
    l1 = x2**2 * (t21 * (G21 / (x1 + x2 * G21)) ** 2 + t12 * G12 / (x2 + x1 * G12) ** 2)
    l2 = x1**2 * (t12 * (G12 / (x2 + x1 * G12)) ** 2 + t21 * G21 / (x1 + x2 * G21) ** 2)
    return exp(l1), exp(l2)


def Bs(T):
    c1, c2 = comp
    B11 = BT(T, c1['Tc'], c1['Pc'], c1['omega'], a=c1['a'], b=c1['b']) * 1e6
    B22 = BT(T, c2['Tc'], c2['Pc'], c2['omega'], a=c2['a'], b=c2['b']) * 1e6
    Tc12 = sqrt(c1['Tc'] * c2['Tc'])
    Pc12 = 4 * Tc12 * (c1['Pc'] * c1['Vc'] / c1['Tc'] + c2['Pc'] * c2['Vc'] / c2['Tc']) / (c1['Vc'] ** (1 / 3) + c2['Vc'] ** (1 / 3)) ** 3
    w12 = (c1['omega'] + c2['omega']) / 2
    B12 = BT(T, Tc12, Pc12, w12) * 1e6
    return B11, B22, B12


def Phis(T, P, y1):
    B11, B22, B12 = Bs(T)
    d = 2 * B12 - B11 - B22
    y2 = 1 - y1
    ph1 = exp(1e-6 * P * (B11 + y2 * y2 * d) / (R * T))
    ph2 = exp(1e-6 * P * (B22 + y1 * y1 * d) / (R * T))
    s1 = exp(1e-6 * B11 * psat(0, T) / (R * T))
    s2 = exp(1e-6 * B22 * psat(1, T) / (R * T))
    return ph1 / s1, ph2 / s2, ph1, ph2


def bubble_T(P, x1):
    state = {'y1': 0.5}

    def f(T):
        g1, g2 = gammas(x1, T)
        y1 = state['y1']
        for _ in range(200):
            P1, P2, _, _ = Phis(T, P, y1)
            k1, k2 = x1 * g1 * psat(0, T) / P1, (1 - x1) * g2 * psat(1, T) / P2
            yn = k1 / (k1 + k2)
            if abs(yn - y1) < 1e-15:
                break
            y1 = yn
        state['y1'] = y1
        return log((k1 + k2) / P)

    T = brentq(f, 300, 450, xtol=1e-12)
    f(T)
    return T, state['y1']


if __name__ == '__main__':
    for T in (330.0, 370.0):
        print('B', T, Bs(T))
    for P, x1 in ((101325.0, 0.1), (101325.0, 0.5), (101325.0, 0.9), (1000000.0, 0.3)):
        T, y1 = bubble_T(P, x1)
        print('bubbleT', P, x1, repr(T), repr(y1), Phis(T, P, y1)[2:])
