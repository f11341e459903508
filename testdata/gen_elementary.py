#!/usr/bin/env python3
"""Write elementary_golden.json: Taylor coefficients at t = 0 of
compositions of elementary functions, for the series package's tests.

Each case is a function of t (the Go test builds the same composition);
its first N = 16 Taylor coefficients are computed by mpmath.taylor
(numerical differentiation at high working precision). Every case is
computed at 70 and at 90 working digits and the two must agree to 45
digits before anything is written, so the file does not depend on the
step-size choices inside mpmath.diff. Coefficients are written with 40
significant digits in exponent notation ("0" for an exact zero).

Run from the repository root (OUTDIR defaults to this script's directory):

    python3 testdata/gen_elementary.py [OUTDIR]

It writes OUTDIR/elementary_golden.json and prints one line on stderr.
"""
import goldenio

import mpmath

NAME = "elementary_golden.json"
N = 16  # coefficients per case

CASES = [
    # name, function of t; the Go test builds the same composition.
    ("exp(sin(t))", lambda t: mpmath.exp(mpmath.sin(t))),
    ("log(1+t+t^2/3)", lambda t: mpmath.log(1 + t + t**2 / 3)),
    ("tan(0.3+t)", lambda t: mpmath.tan(mpmath.mpf("0.3") + t)),
    ("sqrt(2+t-t^3)", lambda t: mpmath.sqrt(2 + t - t**3)),
    ("(1.5+t)^0.7", lambda t: (mpmath.mpf("1.5") + t) ** mpmath.mpf("0.7")),
    ("atan(0.5+2t+t^2)", lambda t: mpmath.atan(mpmath.mpf("0.5") + 2 * t + t**2)),
    ("cos(1+t-t^2)", lambda t: mpmath.cos(1 + t - t**2)),
]


def coefficients(f, dps):
    with mpmath.workdps(dps):
        return mpmath.taylor(f, 0, N - 1)


def compute():
    out = {"source": "mpmath %s taylor, 40 digits" % mpmath.__version__, "cases": []}
    for name, f in CASES:
        lo = coefficients(f, 70)
        hi = coefficients(f, 90)
        with mpmath.workdps(90):
            for k, (a, b) in enumerate(zip(lo, hi)):
                if abs(a - b) > mpmath.mpf(10) ** -45 * max(1, abs(b)):
                    raise SystemExit("%s: coefficient %d unstable: %s vs %s" % (name, k, a, b))
        with mpmath.workdps(90):
            coeffs = [mpmath.nstr(c, 40, min_fixed=-1, max_fixed=-1) if c != 0 else "0" for c in hi]
        out["cases"].append({"name": name, "coeffs": coeffs})
    return out


if __name__ == "__main__":
    goldenio.main(NAME, compute)
