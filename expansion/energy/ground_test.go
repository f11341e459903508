package energy

import (
	"math"
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
	for k := 0; k <= order; k++ {
		t.Logf("eps^%d: E0 %.12g ± %.1e  alpha %.10g ± %.1e  S0 %.10g ± %.1e (exact %.10g)", k,
			ge.E0.Values[k], ge.E0.Errors[k], ge.AlphaS.Values[k], ge.AlphaS.Errors[k], ge.S0.Values[k], ge.S0.Errors[k], ge.S0Exact[k])
	}
}
