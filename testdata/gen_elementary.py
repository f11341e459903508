#!/usr/bin/env python3
"""Golden Taylor coefficients for the series package's elementary functions.

Each case is a function of t whose Taylor coefficients at t = 0 are computed
by mpmath.taylor (numerical differentiation at high working precision) and
written with 40 significant digits to elementary_golden.json. Every case is
computed at two working precisions and must agree to 45 digits before it is
written, so the file does not depend on the step-size choices inside
mpmath.diff. Regenerate with:

    python3 gen_elementary.py > elementary_golden.json
"""
import json

import mpmath

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


def main():
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
    print(json.dumps(out, indent=1))


if __name__ == "__main__":
    main()
