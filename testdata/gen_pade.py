#!/usr/bin/env python3
"""Write pade_golden.json: [L/M] Pade approximants from mpmath.pade.

The Taylor coefficients of exp(x) (1/k!) and log(1+x) ((-1)^(k+1)/k) are
formed at mp.dps = 80; mpmath.pade returns the numerator coefficients p and
the denominator coefficients q (q[0] = 1), written with 50 significant
digits, for (L, M) in (1,1), (2,2), (3,2), (2,3), (4,4), (6,5), (8,8).

Run from the repository root (OUTDIR defaults to this script's directory):

    python3 testdata/gen_pade.py [OUTDIR]

It writes OUTDIR/pade_golden.json and prints one line on stderr.
"""
import goldenio

import mpmath

NAME = "pade_golden.json"
DPS = 80


def taylor(name, n):
    if name == "exp":
        return [1 / mpmath.factorial(k) for k in range(n)]
    if name == "log1p":
        return [mpmath.mpf(0)] + [mpmath.mpf((-1) ** (k + 1)) / k for k in range(1, n)]
    raise ValueError(name)


def compute():
    mpmath.mp.dps = DPS
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
    return {
        "source": "mpmath %s mpmath.pade at mp.dps = %d, printed to 50 digits" % (mpmath.__version__, DPS),
        "cases": cases,
    }


if __name__ == "__main__":
    goldenio.main(NAME, compute)
