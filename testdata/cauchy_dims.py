#!/usr/bin/env python3
"""Check qbridge's Taylor coefficients of h_n(eps) by Cauchy integrals.

An outside reference for the series engine, by a different route: mpmath
alone (no qbridge code) solves k_A(h) = 1 for the exact root h_n at
N points eps_j = r exp(2 pi i j/N) on a circle inside the radius of
convergence, continuing the root around the circle from the real point
eps = r (where it is bracketed between the pole at 2n+1+2/q and the zero
at 2n+3-2/q), and takes the coefficients as the discrete Fourier sums

    c_k = (1/N) sum_j h_n(eps_j) exp(-2 pi i j k/N) / r^k.

Aliasing adds c_(k+N) r^N, of relative size (r/R)^N with R the radius of
convergence (0.9648 for h_1, the branch point where h_1 and h_2 collide);
with r = 0.6 and N = 160 that is below 1e-32, and the rounding error of
the roots (mp.dps = 50) grows by at most r^-40 = 7e8, to about 1e-41.

with (Maldacena and Stanford 2016, arXiv:1604.07818, as quoted in the
project's physics brief, section 4)
  k_A(h) = -(q-1) G(3/2-D) G(1-D) / (G(1/2+D) G(D))
           * G(D+h/2) G(1/2+D-h/2) / (G(3/2-D-h/2) G(1-D+h/2)),  D = 1/q,
  q = 2/(1 - eps).

Usage (from the repository root; the JSON is qbridge's own output):

    go run ./cmd/qbridge series h_1 --around 2 --order 40 --digits 40 \\
        --format json > /tmp/h1.json
    python3 testdata/cauchy_dims.py /tmp/h1.json [--tol 1e-25]

It prints, per coefficient, qbridge's value, the reference and their
difference, then the largest difference and the time mpmath took; exit
status 0 when every |difference| <= tol * max(1, |c_k|), 1 otherwise, and
0 with a message when mpmath is missing (the check is skipped).
"""
import json
import sys
import time

try:
    import mpmath as mp
except ImportError:
    print("cauchy_dims: skipped: python3 with mpmath not available")
    sys.exit(0)


# k_A and the bracketed real root are the golden-file script's, so that the
# two mpmath references share one transcription of the formula.
from gen_conformal import kA, root as real_root  # noqa: E402


def coefficients(n, order, r, npts):
    """The Taylor coefficients c_0..c_order of h_n(eps) by the Cauchy sums."""
    q_of = lambda eps: 2 / (1 - eps)
    vals = []
    h = real_root(q_of(mp.mpf(r)), n)
    for j in range(npts):
        eps = r * mp.expjpi(mp.mpf(2 * j) / npts)
        # Continue the root from the previous point; findroot's secant
        # steps converge to the branch through which the circle passes.
        h = mp.findroot(lambda y: kA(y, q_of(eps)) - 1, h, tol=mp.mpf(10) ** (-2 * mp.mp.dps + 10))
        vals.append(h)
    out = []
    for k in range(order + 1):
        s = mp.fsum(vals[j] * mp.expjpi(-mp.mpf(2 * j * k) / npts) for j in range(npts))
        out.append(mp.re(s / npts) / mp.mpf(r) ** k)
    return out


def main():
    args = sys.argv[1:]
    tol = mp.mpf("1e-25")
    if "--tol" in args:
        i = args.index("--tol")
        tol = mp.mpf(args[i + 1])
        del args[i : i + 2]
    if len(args) != 1:
        raise SystemExit("usage: python3 testdata/cauchy_dims.py QBRIDGE_JSON [--tol T]")
    with open(args[0], encoding="utf-8") as f:
        doc = json.load(f)
    if doc.get("variable") != "eps" or not str(doc.get("quantity", "")).startswith("h_"):
        raise SystemExit("cauchy_dims: expected qbridge series JSON of h_n around 2")
    n = int(doc["quantity"][2:])
    mp.mp.dps = 50
    ours = [mp.mpf(c) for c in doc["coefficients"]]
    t0 = time.perf_counter()
    ref = coefficients(n, len(ours) - 1, mp.mpf("0.6"), 160)
    elapsed = time.perf_counter() - t0
    worst = mp.mpf(0)
    ok = True
    for k, (a, b) in enumerate(zip(ours, ref)):
        d = abs(a - b)
        scaled = d / max(1, abs(b))
        worst = max(worst, scaled)
        flag = "" if scaled <= tol else "  <-- exceeds tolerance"
        ok = ok and scaled <= tol
        print("%3d  %s  %s  %s%s" % (k, mp.nstr(a, 25), mp.nstr(b, 25), mp.nstr(d, 3), flag))
    print("cauchy_dims: h_%d order %d: largest |difference|/max(1,|c_k|) = %s (tolerance %s); mpmath took %.2f s"
          % (n, len(ours) - 1, mp.nstr(worst, 3), mp.nstr(tol, 3), elapsed))
    sys.exit(0 if ok else 1)


if __name__ == "__main__":
    main()
