#!/usr/bin/env python3
"""Generate special_golden.json: reference values of the Gamma family and
Hurwitz zeta from mpmath at 80 significant digits, for the Go tests in
series/. Run from this directory: python3 gen_special.py

Taylor coefficients are built from mpmath's own psi / zeta / rgamma
(not numerical differentiation), so they are accurate to full precision:
  log Gamma(x0+t):  c0 = loggamma(x0), c1 = psi(0, x0),
                    ck = (-1)^k zeta(k, x0)/k                (k >= 2)
  1/Gamma(-3+t):    mpmath.taylor of rgamma at high precision with
                    the result rounded to 60 digits (rgamma is entire, so
                    mpmath's differentiation converges).
"""
import json
import mpmath
from mpmath import mp, mpf, mpc

DPS = 80
mp.dps = DPS


def s(x):
    return mpmath.nstr(x, DPS, strip_zeros=False, min_fixed=1, max_fixed=0)


def main():
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
    with open("special_golden.json", "w") as f:
        json.dump(out, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()
