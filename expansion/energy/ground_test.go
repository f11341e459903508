package energy

import (
	"math"
	"strings"
	"testing"
)

// The low-temperature extraction of the q = 2 expansion, order by order:
// order 0 is the free fermion (PHYSICS sec. 5: E_0 = -2/(3 pi), S_0 = 0,
// alpha_S = 1/(24 pi)), and every S_0 coefficient must equal the exact
// zero-temperature entropy's (Kitaev; Maldacena-Stanford arXiv:1604.07818
// sec. 2.6) within its error bar, in delta and in eps.
func TestDeltaGroundS0AndFreeFermion(t *testing.T) {
	const order = 8
	g, err := DeltaGround(GroundParams{Order: order})
	if err != nil {
		t.Fatal(err)
	}
	ge, err := EpsGround(GroundParams{Order: order})
	if err != nil {
		t.Fatal(err)
	}
	for _, s := range []*GroundSeries{g, ge} {
		for k := 0; k <= order; k++ {
			d := math.Abs(s.S0.Values[k] - s.S0Exact[k])
			if d > 2*s.S0.Errors[k] || s.S0.Errors[k] > 1e-6 {
				t.Errorf("%s order %d: S_0 = %.12g ± %.1e, exact %.12g", s.Variable, k, s.S0.Values[k], s.S0.Errors[k], s.S0Exact[k])
			}
		}
	}
	free := []struct {
		name      string
		c         Coeffs
		want, tol float64
	}{
		{"E_0", g.E0, -2 / (3 * math.Pi), 1e-10},
		{"alpha_S", g.AlphaS, 1 / (24 * math.Pi), 1e-7},
	}
	for _, f := range free {
		if d := math.Abs(f.c.Values[0] - f.want); d > 2*f.c.Errors[0]+1e-13 || d > f.tol {
			t.Errorf("%s at q = 2: %.14g ± %.1e, exact %.14g", f.name, f.c.Values[0], f.c.Errors[0], f.want)
		}
	}
	// The zero-temperature eps-series (merged into ge where its error is
	// the smaller): order 0 is the free fermion again, alpha_S(2) =
	// 1/(24 pi) now to 1e-12 (the q = 2 specific heat C = pi T/(6J),
	// PHYSICS sec. 5, is 4 pi^2 alpha_S T), and the two independent routes
	// (T = 0 solve vs finite-T ladder) agree within their combined errors
	// at every order.
	z := ge.ZeroT
	if z == nil {
		t.Fatal("EpsGround did not run the zero-temperature route")
	}
	if d := math.Abs(z.E0.Values[0] + 2/(3*math.Pi)); d > z.E0.Errors[0] || d > 1e-14 {
		t.Errorf("T = 0 route E_0(2) = %.16g ± %.1e, exact %.16g", z.E0.Values[0], z.E0.Errors[0], -2/(3*math.Pi))
	}
	if d := math.Abs(z.AlphaS.Values[0] - 1/(24*math.Pi)); d > z.AlphaS.Errors[0] || d > 1e-12 {
		t.Errorf("T = 0 route alpha_S(2) = %.16g ± %.1e, exact %.16g (off by %.1e)", z.AlphaS.Values[0], z.AlphaS.Errors[0], 1/(24*math.Pi), d)
	}
	for k := 0; k <= order; k++ {
		for _, c := range []struct {
			name    string
			zt, lad Coeffs
		}{{"E_0", z.E0, ge.LadderE0}, {"alpha_S", z.AlphaS, ge.LadderAlphaS}} {
			if k >= c.zt.Len() {
				continue
			}
			d := math.Abs(c.zt.Values[k] - c.lad.Values[k])
			if d > 3*(c.zt.Errors[k]+c.lad.Errors[k]) {
				t.Errorf("%s eps^%d: T = 0 route %.12g ± %.1e vs ladder %.12g ± %.1e", c.name, k, c.zt.Values[k], c.zt.Errors[k], c.lad.Values[k], c.lad.Errors[k])
			}
		}
		if ge.E0.Errors[k] > ge.LadderE0.Errors[k] || ge.AlphaS.Errors[k] > ge.LadderAlphaS.Errors[k] {
			t.Errorf("eps^%d: the merged series has a larger error than the ladder's", k)
		}
	}
	for k := 0; k <= order; k++ {
		t.Logf("eps^%d: E0 %.14g ± %.1e (%s)  alpha %.12g ± %.1e (%s)  S0 %.10g ± %.1e (exact %.10g)", k,
			ge.E0.Values[k], ge.E0.Errors[k], ge.E0Route[k], ge.AlphaS.Values[k], ge.AlphaS.Errors[k], ge.AlphaSRoute[k], ge.S0.Values[k], ge.S0.Errors[k], ge.S0Exact[k])
	}
}

// Beyond the orders the ladder's fits reach (all 12 with the default
// ladder since its sums are compensated; order 10 before), the
// zero-temperature eps-series completes E_0 and alpha_S; the S_0 check
// keeps the fitted orders only; beyond that route's reach the order is
// refused and the error says why.
func TestEpsGroundBeyondLadder(t *testing.T) {
	const order = 12
	g, err := EpsGround(GroundParams{Order: order})
	if err != nil {
		t.Fatal(err)
	}
	if g.LadderOrders < 1 || g.LadderOrders > order+1 || g.S0.Len() != g.LadderOrders {
		t.Fatalf("ladder orders %d, S_0 has %d", g.LadderOrders, g.S0.Len())
	}
	for k := g.LadderOrders; k <= order; k++ {
		if g.E0Route[k] != RouteZeroT || g.AlphaSRoute[k] != RouteZeroT {
			t.Errorf("order %d: routes %q, %q", k, g.E0Route[k], g.AlphaSRoute[k])
		}
		for _, e := range []float64{g.E0.Errors[k], g.AlphaS.Errors[k]} {
			if !(e > 0) || math.IsInf(e, 0) {
				t.Errorf("order %d: error %g", k, e)
			}
		}
	}
	// The targets of the double-double zero-temperature route: alpha_S to 7
	// significant digits (error <= 1e-7 of the value or <= 1e-11) through
	// eps^10, E_0 to 1e-12 through eps^12, and alpha_S(q = 2) = 1/(24 pi)
	// (the free-fermion specific heat, PHYSICS.md) within its stated error
	// and 1e-12.
	for k := 0; k <= 10; k++ {
		v, e := g.AlphaS.Values[k], g.AlphaS.Errors[k]
		if !(e <= math.Max(1e-7*math.Abs(v), 1e-11)) {
			t.Errorf("alpha_S eps^%d = %.12g +- %.2g: fewer than 7 significant digits", k, v, e)
		}
	}
	for k := 0; k <= order; k++ {
		if !(g.E0.Errors[k] <= 1e-12) {
			t.Errorf("E_0 eps^%d = %.15g +- %.2g: error above 1e-12", k, g.E0.Values[k], g.E0.Errors[k])
		}
	}
	if d := math.Abs(g.AlphaS.Values[0] - 1/(24*math.Pi)); d > g.AlphaS.Errors[0] || d > 1e-12 {
		t.Errorf("alpha_S(q = 2) = %.17g +- %.2g, exact 1/(24 pi) = %.17g", g.AlphaS.Values[0], g.AlphaS.Errors[0], 1/(24*math.Pi))
	}
	// Stated vs true error: the partial sums at q = 2.5 (eps = 0.2) and
	// q = 3 (eps = 1/3) against the direct zero-temperature solves there
	// (SoftModeZeroT: E_0 and alpha_S, errors 1e-15 and 1e-12). The sum's
	// error is sum_k err_k eps^k plus a geometric tail from the last term
	// with ratio eps/0.95 (the radius is about 0.95 or more); it must cover
	// the difference.
	for _, q := range []float64{2.5, 3} {
		e := 1 - 2/q
		d, err := SoftModeZeroT(q, nil)
		if err != nil {
			t.Fatal(err)
		}
		for _, c := range []struct {
			name       string
			s          Coeffs
			want, werr float64
		}{{"E_0", g.E0, d.E0, d.E0Err}, {"alpha_S", g.AlphaS, d.AlphaS, d.AlphaSErr}} {
			v, se, p := 0.0, 0.0, 1.0
			for k := 0; k < c.s.Len(); k++ {
				v += c.s.Values[k] * p
				se += c.s.Errors[k] * p
				p *= e
			}
			last := math.Abs(c.s.Values[c.s.Len()-1]) * p / e
			se += last * e / 0.95 / (1 - e/0.95)
			if diff := math.Abs(v - c.want); diff > se+c.werr {
				t.Errorf("%s(q = %g): eps partial sum %.15g ± %.1e, direct %.15g ± %.1e (off by %.1e)", c.name, q, v, se, c.want, c.werr, diff)
			} else {
				t.Logf("%s(q = %g): partial sum %.15g ± %.1e, direct %.15g ± %.1e, off by %.1e", c.name, q, v, se, c.want, c.werr, diff)
			}
		}
	}
	// At the zero-temperature route's limit the ladder must either fit
	// every order itself or fail saying that the other route cannot help.
	g, err = EpsGround(GroundParams{Order: MaxZeroTEpsOrder})
	switch {
	case err == nil && g.LadderOrders != MaxZeroTEpsOrder+1:
		t.Errorf("order %d: no error, but the ladder fitted only %d orders", MaxZeroTEpsOrder, g.LadderOrders)
	case err != nil && !strings.Contains(err.Error(), "zero-temperature eps-series"):
		t.Errorf("order %d: %v", MaxZeroTEpsOrder, err)
	}
}
