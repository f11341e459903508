#!/usr/bin/env python3
"""Generate pade_golden.json: Pade approximants from mpmath.pade.

Taylor coefficients of exp(x) (1/k!) and log(1+x) ((-1)^(k+1)/k) are
computed exactly as mpmath rationals at 80 working digits; mpmath.pade
returns the numerator and denominator coefficients (denominator q[0] = 1),
written with 50 significant digits. Run from this directory:

    python3 gen_pade.py > pade_golden.json
"""
import json

import mpmath

mpmath.mp.dps = 80


def taylor(name, n):
    if name == "exp":
        return [1 / mpmath.factorial(k) for k in range(n)]
    if name == "log1p":
        return [mpmath.mpf(0)] + [mpmath.mpf((-1) ** (k + 1)) / k for k in range(1, n)]
    raise ValueError(name)


cases = []
for name in ("exp", "log1p"):
    for L, M in ((1, 1), (2, 2), (3, 2), (2, 3), (4, 4), (6, 5), (8, 8)):
        a = taylor(name, L + M + 1)
        p, q = mpmath.pade(a, L, M)
        cases.append({
            "func": name,
            "L": L,
            "M": M,
            "p": [mpmath.nstr(v, 50) for v in p],
            "q": [mpmath.nstr(v, 50) for v in q],
        })

print(json.dumps({
    "source": "mpmath %s mpmath.pade at mp.dps = 80, printed to 50 digits" % mpmath.__version__,
    "cases": cases,
}, indent=1))
