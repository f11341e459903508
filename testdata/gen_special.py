#!/usr/bin/env python3
"""Write special_golden.json: reference values of the Gamma family and the
Hurwitz zeta function from mpmath, for the Go tests in series/.

Precision: every value is computed at mp.dps = 80 and written with 80
significant digits (trailing zeros kept, exponent notation outside [0.1, 1)).
Contents:
  gamma, loggamma (log|Gamma|), rgamma (1/Gamma) at real points;
  psi(m, x) for m = 0..4; Hurwitz zeta(s, a); Riemann zeta(s);
  complex log Gamma (principal branch, mpmath.loggamma);
  euler, zeta(3), pi;
  Taylor coefficients built from mpmath's own psi / zeta (not numerical
  differentiation), so they are accurate to full precision:
    log Gamma(x0+t):  c0 = loggamma(x0), c1 = psi(0, x0),
                      ck = (-1)^k zeta(k, x0)/k                (k >= 2)
  and of 1/Gamma(-3+t) by mpmath.taylor at 200 working digits (rgamma is
  entire, so the numerical differentiation converges), written to 80 digits.

Run from the repository root (OUTDIR defaults to this script's directory):

    python3 testdata/gen_special.py [OUTDIR]

It writes OUTDIR/special_golden.json and prints one line on stderr.
"""
import goldenio

import mpmath
from mpmath import mp, mpf, mpc

DPS = 80
NAME = "special_golden.json"


def s(x):
    return mpmath.nstr(x, DPS, strip_zeros=False, min_fixed=1, max_fixed=0)


def compute():
    mp.dps = DPS
    out = {"dps": DPS, "mpmath": mpmath.__version__}
    xs = ["0.5", "0.25", "1", "1.5", "2.75", "7.125", "33.3", "-0.5", "-2.25", "-7.9", "0.001", "123.456"]
    out["gamma"] = [{"x": x, "v": s(mpmath.gamma(mpf(x)))} for x in xs]
    out["loggamma"] = [{"x": x, "v": s(mpmath.log(abs(mpmath.gamma(mpf(x)))))} for x in xs]
    out["rgamma"] = [{"x": x, "v": s(mpmath.rgamma(mpf(x)))} for x in xs + ["-3", "0"]]
    out["psi"] = [{"m": m, "x": x, "v": s(mpmath.psi(m, mpf(x)))}
                  for m in range(5) for x in ["0.25", "1", "1.5", "9.75", "-0.5", "-3.2"]]
    zs = [("2", "1"), ("3", "1"), ("2.5", "0.3"), ("7", "0.01"), ("0.5", "1"), ("-1.5", "2"),
          ("20", "3.5"), ("1.0001", "1"), ("-4", "0.75")]
    out["zeta"] = [{"s": a, "a": b, "v": s(mpmath.zeta(mpf(a), mpf(b)))} for a, b in zs]
    out["riemann_zeta"] = [{"s": a, "v": s(mpmath.zeta(mpf(a)))} for a in ["3", "-3.5", "-7", "0", "0.25", "-2"]]
    tay = []
    for x0 in ["0.25", "0.5"]:
        x = mpf(x0)
        c = [mpmath.loggamma(x), mpmath.psi(0, x)]
        c += [(-1) ** k * mpmath.zeta(k, x) / k for k in range(2, 30)]
        tay.append({"x0": x0, "c": [s(v) for v in c]})
    out["loggamma_taylor"] = tay
    with mp.workdps(200):
        rc = mpmath.taylor(lambda t: mpmath.rgamma(-3 + t), 0, 15)
    out["rgamma_taylor_m3"] = [s(v) for v in rc]
    cz = [("0.3", "2"), ("-2.3", "0.1"), ("5", "-7"), ("-40.5", "3"), ("0.5", "100"), ("1", "0.001"),
          ("-2.5", "0"), ("12.25", "0"), ("-0.7", "-0.2")]
    out["cloggamma"] = []
    for re, im in cz:
        v = mpmath.loggamma(mpc(mpf(re), mpf(im)))
        out["cloggamma"].append({"re": re, "im": im, "vre": s(v.real), "vim": s(v.imag)})
    out["constants"] = {"euler": s(mpmath.euler), "zeta3": s(mpmath.zeta(3)), "pi": s(mpmath.pi)}
    return out


if __name__ == "__main__":
    goldenio.main(NAME, compute)
