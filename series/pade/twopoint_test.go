package pade

import (
	"qbridge/series"

	"math/big"
	"testing"
)

// padeTestSqrt1p returns the Taylor series of sqrt(1+x) around x = x0 in
// powers of (x - x0): sqrt(1+x0) * binom(1/2, k) (1+x0)^-k.
func padeTestSqrt1p(n int, x0 float64, prec uint) *series.Series {
	cs := testZeros(n, prec)
	base := new(big.Float).SetPrec(prec).SetFloat64(1 + x0)
	c := new(big.Float).SetPrec(prec).Sqrt(base)
	for k := 0; k < n; k++ {
		cs[k].Set(c)
		// binom(1/2, k+1) = binom(1/2, k) (1/2 - k)/(k+1)
		c.Mul(c, big.NewFloat(0.5-float64(k)))
		c.Quo(c, new(big.Float).SetInt64(int64(k+1)))
		c.Quo(c, base)
	}
	return testSeries(prec, cs)
}

// padeTestRationalSeries returns the first n Taylor coefficients of
// p(u)/q(u) at u = 0 by the recurrence r_k = p_k - sum_{j>=1} q_j r_{k-j}
// (q_0 = 1).
func padeTestRationalSeries(p, q []*big.Float, n int, prec uint) []*big.Float {
	r := make([]*big.Float, n)
	t := new(big.Float).SetPrec(prec)
	for k := 0; k < n; k++ {
		r[k] = new(big.Float).SetPrec(prec)
		if k < len(p) {
			r[k].Set(p[k])
		}
		for j := 1; j < len(q) && j <= k; j++ {
			t.Mul(q[j], r[k-j])
			r[k].Sub(r[k], t)
		}
		r[k].Quo(r[k], q[0])
	}
	return r
}

// padeTestShift returns the coefficients of c(v + d) in powers of v.
func padeTestShift(c []*big.Float, d *big.Float, prec uint) []*big.Float {
	if len(c) == 0 {
		return nil
	}
	tab := twoPointShiftTable(new(big.Float).SetPrec(prec).Set(d), len(c)-1, prec)
	out := make([]*big.Float, len(c))
	t := new(big.Float).SetPrec(prec)
	for m := range out {
		out[m] = new(big.Float).SetPrec(prec)
		for j := m; j < len(c); j++ {
			t.Mul(c[j], tab[j][m])
			out[m].Add(out[m], t)
		}
	}
	return out
}

// sqrt(1+x) known by its Taylor series at x = 0 and at x = 1; the two-point
// approximant evaluated at x = 1/2 is compared with sqrt(3/2) (big.Float
// Sqrt), and its re-expansions at both points must reproduce K1 and K2
// coefficients of the input series.
func TestTwoPointPadeSqrt(t *testing.T) {
	const prec = 256
	sa := padeTestSqrt1p(20, 0, prec)
	sb := padeTestSqrt1p(20, 1, prec)
	a, b := big.NewFloat(0), big.NewFloat(1)
	want := new(big.Float).SetPrec(prec).Sqrt(big.NewFloat(1.5))
	for _, tc := range []struct {
		K1, K2, L, M int
		tol          float64
	}{
		{3, 3, 3, 2, 1e-5},
		{6, 6, 6, 5, 1e-9},
		{10, 10, 10, 9, 1e-15},
		{12, 8, 10, 9, 1e-14},
		{20, 0, 10, 9, 1e-6}, // one-point limit: ordinary Pade at 0
	} {
		tp, err := TwoPointPade(sa, a, tc.K1, sb, b, tc.K2, tc.L, tc.M)
		if err != nil {
			t.Fatalf("%+v: %v", tc, err)
		}
		v, err := tp.Eval(big.NewFloat(0.5))
		if err != nil {
			t.Fatalf("%+v: %v", tc, err)
		}
		if !padeTestClose(v, want, tc.tol) {
			t.Errorf("%+v: value %.20g, want %.20g", tc, v, want)
		}
		// Matching conditions, verified by re-expansion.
		ra := padeTestRationalSeries(tp.P, tp.Q, tc.K1, prec)
		for k := 0; k < tc.K1; k++ {
			if !padeTestClose(ra[k], sa.Coeff(k), 1e-60) {
				t.Errorf("%+v: coefficient %d at a = %g, want %g", tc, k, ra[k], sa.Coeff(k))
			}
		}
		d := new(big.Float).Sub(b, a)
		rb := padeTestRationalSeries(padeTestShift(tp.P, d, prec), padeTestShift(tp.Q, d, prec), tc.K2, prec)
		for k := 0; k < tc.K2; k++ {
			if !padeTestClose(rb[k], sb.Coeff(k), 1e-60) {
				t.Errorf("%+v: coefficient %d at b = %g, want %g", tc, k, rb[k], sb.Coeff(k))
			}
		}
		// The branch point at x = -1 is what the poles imitate: none in [0, 1].
		near, err := tp.PolesNear(a, b, big.NewFloat(0.01), nil)
		if err != nil || len(near) != 0 {
			t.Errorf("%+v: poles near [0, 1]: %v, %v", tc, near, err)
		}
		poles, err := tp.Poles()
		if err != nil || len(poles) != tc.M {
			t.Errorf("%+v: %d poles, %v", tc, len(poles), err)
		}
		for _, z := range poles {
			if z.Re.Sign() > 0 && z.Im.Sign() == 0 {
				t.Errorf("%+v: real pole at %g on the positive axis", tc, z.Re)
			}
		}
	}
}

// Two-point resummation of sqrt(1+x) between 0 and 1 at several points; the
// error estimate must bound the true error (reference: big.Float Sqrt).
func TestResumTwoPointSqrt(t *testing.T) {
	const prec = 200
	sa := padeTestSqrt1p(12, 0, prec)
	sb := padeTestSqrt1p(12, 1, prec)
	a, b := big.NewFloat(0), big.NewFloat(1)
	for _, x := range []float64{0.1, 0.5, 0.9, 1.3} {
		r, err := ResumTwoPoint(sa, a, sb, b, big.NewFloat(x), TwoPointOptions{})
		if err != nil {
			t.Fatalf("x=%g: %v", x, err)
		}
		want := new(big.Float).SetPrec(prec).Add(big.NewFloat(1), big.NewFloat(x))
		want.Sqrt(want)
		d := new(big.Float).SetPrec(prec).Sub(r.Value, want)
		d.Abs(d)
		if d.Cmp(r.Err) > 0 {
			t.Errorf("x=%g: true error %.3g exceeds estimate %.3g", x, d, r.Err)
		}
		if r.Err.Cmp(big.NewFloat(1e-12)) > 0 {
			t.Errorf("x=%g: estimate %.3g too large to be useful", x, r.Err)
		}
		if r.K1+r.K2 != 24 || r.Used < 2 {
			t.Errorf("x=%g: chose K1=%d K2=%d [%d/%d], used %d", x, r.K1, r.K2, r.L, r.M, r.Used)
		}
	}
}

func TestTwoPointPadeBadInput(t *testing.T) {
	sa := padeTestSqrt1p(6, 0, 64)
	sb := padeTestSqrt1p(6, 1, 64)
	a, b := big.NewFloat(0), big.NewFloat(1)
	for _, tc := range []struct {
		name         string
		sa, sb       *series.Series
		a, b         *big.Float
		K1, K2, L, M int
	}{
		{"nil series", nil, sb, a, b, 2, 2, 2, 1},
		{"nil point", sa, sb, nil, b, 2, 2, 2, 1},
		{"equal points", sa, sb, a, a, 2, 2, 2, 1},
		{"order mismatch", sa, sb, a, b, 2, 2, 2, 2},
		{"negative L", sa, sb, a, b, 2, 2, -1, 4},
		{"negative K", sa, sb, a, b, -1, 5, 2, 1},
		{"K1 too large", sa, sb, a, b, 7, 1, 4, 3},
	} {
		if r, err := TwoPointPade(tc.sa, tc.a, tc.K1, tc.sb, tc.b, tc.K2, tc.L, tc.M); err == nil {
			t.Errorf("%s: got %v, want error", tc.name, r)
		}
	}
	for _, o := range []TwoPointOptions{{N: 13}, {Orders: -1}, {N: 1}} {
		if r, err := ResumTwoPoint(sa, a, sb, b, big.NewFloat(0.5), o); err == nil {
			t.Errorf("options %+v: got %v, want error", o, r)
		}
	}
	if _, err := ResumTwoPoint(sa, a, sb, a, big.NewFloat(0.5), TwoPointOptions{}); err == nil {
		t.Error("ResumTwoPoint with a == b: want error")
	}
}
