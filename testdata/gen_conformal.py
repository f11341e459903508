#!/usr/bin/env python3
"""Write conformal_golden.json: conformal data computed with mpmath alone.

Contents, for q in 2.5, 3, 4, 6, 10, 100:
  dims:     h_n(q), n = 1..5, the root of k_A(h) = 1 between the pole at
            2n+1+2/q and the zero at 2n+3-2/q (mpmath.findroot, anderson);
  s0:       S_0(q) by mpmath.quad of the entropy integral;
  b:        b(q) from its closed form;
  clausen2: Cl_2(theta) (mpmath.clsin) at theta = 0.5, pi/2 (given to 64 digits), 3;
  taylor_dims: the first 7 Taylor coefficients of h_n, n = 1..3, around
            q = 2 (in eps = 1 - 2/q) and around q = infinity (in x = 1/q),
            by mpmath.taylor of the implicit root (numerical differentiation,
            avoiding the singular point).
with
  k_A(h) = -(q-1) G(3/2-D) G(1-D) / (G(1/2+D) G(D))
           * G(D+h/2) G(1/2+D-h/2) / (G(3/2-D-h/2) G(1-D+h/2)),  D = 1/q
  b^q pi = (1/2 - 1/q) tan(pi/q)
  S_0 = log(2)/2 - int_0^{1/q} pi (1/2 - x) tan(pi x) dx
(the formulas of Maldacena and Stanford 2016, arXiv:1604.07818, as quoted
in the project's physics brief, section 4).

Precision: dims, s0, b and clausen2 are computed at mp.dps = 50 and written
with 40 significant digits. The Taylor coefficients are computed at
mp.dps = 120 with two step sizes (1e-25 and 1e-28), which must agree to
1e-20 * max(1, |c|) before anything is written; they are written with 20
significant digits, values below 1e-22 written as 0.

Run from the repository root (OUTDIR defaults to this script's directory):

    python3 testdata/gen_conformal.py [OUTDIR]

It writes OUTDIR/conformal_golden.json and prints one line on stderr.
It takes a minute or two.
"""
import goldenio

import mpmath as mp

NAME = "conformal_golden.json"


def kA(h, q):
    D = 1 / q
    pre = -(q - 1) * mp.gamma(1.5 - D) * mp.gamma(1 - D) / (mp.gamma(0.5 + D) * mp.gamma(D))
    return pre * mp.gamma(D + h / 2) * mp.gamma(0.5 + D - h / 2) / (mp.gamma(1.5 - D - h / 2) * mp.gamma(1 - D + h / 2))


def root(q, n):
    """h_n(q): between the pole at 2n+1+2/q and the zero at 2n+3-2/q."""
    lo = 2 * n + 1 + 2 / q
    hi = 2 * n + 3 - 2 / q
    w = hi - lo
    a, b = lo + w * mp.mpf('1e-30'), hi - w * mp.mpf('1e-30')
    return mp.findroot(lambda h: kA(h, q) - 1, (a, b), solver='anderson')


def h_of_eps(n):
    # h_n as a function of eps; q = 2/(1-eps). For eps > 0 the root lies
    # between 2n+2-eps and 2n+2+eps; for eps < 0 (the analytic
    # continuation, q < 2) between 2n+2+eps and 2n+2-eps.
    def f(eps):
        if abs(eps) < mp.mpf('1e-60'):
            eps = mp.mpf('1e-60')  # mpmath evaluates the value itself next to 0; the shift is far below the digits kept
        q = 2 / (1 - eps)
        a, b = sorted([2 * n + 2 - eps, 2 * n + 2 + eps])
        w = b - a
        return mp.findroot(lambda h: kA(h, q) - 1, (a + w * mp.mpf('1e-40'), b - w * mp.mpf('1e-40')), solver='anderson')
    return f


def h_of_x(n):
    # h_n as a function of x = 1/q near 0 (n >= 1): h = 2n+1 + x w(x) with
    # w(0) = 2(2n^2+n+1)/(2n^2+n-1) in (2, 14/3], so for small |x| the root
    # lies between the pole at 2n+1+2x and 2n+1+6x (either sign of x).
    def f(x):
        if abs(x) < mp.mpf('1e-60'):
            x = mp.mpf('1e-60')
        q = 1 / x
        a, b = sorted([2 * n + 1 + 2 * x, 2 * n + 1 + 6 * x])
        w = b - a
        return mp.findroot(lambda h: kA(h, q) - 1, (a + w * mp.mpf('1e-40'), b - w * mp.mpf('1e-40')), solver='anderson')
    return f


def s0(q):
    return mp.log(2) / 2 - mp.quad(lambda x: mp.pi * (mp.mpf(1) / 2 - x) * mp.tan(mp.pi * x), [0, 1 / q])


def b(q):
    return ((mp.mpf(1) / 2 - 1 / q) * mp.tan(mp.pi / q) / mp.pi) ** (1 / q)


def compute():
    out = {"source": "mpmath %s, testdata/gen_conformal.py" % mp.__version__, "dps": 40}
    mp.mp.dps = 50
    qs = ["2.5", "3", "4", "6", "10", "100"]
    out["dims"] = []
    for qs_ in qs:
        q = mp.mpf(qs_)
        for n in range(1, 6):
            out["dims"].append({"q": qs_, "n": n, "h": mp.nstr(root(q, n), 40)})
    out["s0"] = [{"q": qs_, "value": mp.nstr(s0(mp.mpf(qs_)), 40)} for qs_ in qs]
    out["b"] = [{"q": qs_, "value": mp.nstr(b(mp.mpf(qs_)), 40)} for qs_ in qs]
    out["clausen2"] = [{"theta": t, "value": mp.nstr(mp.clsin(2, mp.mpf(t)), 40)} for t in ["0.5", "1.5707963267948966192313216916397514420985846996875529104874722961", "3"]]
    # Taylor coefficients of the implicit root: numerical differentiation at
    # high precision, agreeing between two step choices to the digits kept.
    mp.mp.dps = 120
    K = 6
    out["taylor_dims"] = []
    for end, maker in (("2", h_of_eps), ("inf", h_of_x)):
        for n in (1, 2, 3):
            c1 = mp.taylor(maker(n), 0, K, singular=True, h=mp.mpf('1e-25'))
            c2 = mp.taylor(maker(n), 0, K, singular=True, h=mp.mpf('1e-28'))
            coeffs = []
            for a, bb in zip(c1, c2):
                if abs(a - bb) > mp.mpf('1e-20') * max(1, abs(a)):
                    raise SystemExit("taylor coefficients unstable: %s vs %s" % (a, bb))
                coeffs.append(mp.nstr(mp.chop(bb, mp.mpf('1e-22')), 20))
            out["taylor_dims"].append({"around": end, "n": n, "coefficients": coeffs, "digits": 20})
    return out


if __name__ == "__main__":
    goldenio.main(NAME, compute)
