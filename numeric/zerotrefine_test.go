package numeric

import (
	"math"
	"testing"
)

// The double-double refinement of the eps-series solve: the solution must
// not depend on the grid's tilt or step (both change every transform and,
// in float64, move E_0's eps^8 coefficient by about 1e-12; the spectral
// accuracy of the log grid leaves only the rounding to float64), its
// residuals must reach the double-double floor, and order 0 must be the
// q = 2 semicircle's E_0 = -2/(3 pi) (PHYSICS sec. 5) and B = 1/pi.
func TestExtendedEpsSeriesGridIndependent(t *testing.T) {
	const order = 8
	main, err := SolveZeroTEps(EpsSeriesParams{Order: order, Extended: true})
	if err != nil {
		t.Fatal(err)
	}
	for j, r := range main.RefinedResidual {
		if !(r < 1e-28) {
			t.Errorf("order %d: double-double residual %.3g, want < 1e-28", j, r)
		}
	}
	if d := math.Abs(main.E0[0] + 2/(3*math.Pi)); d > 1e-16 {
		t.Errorf("E_0(q = 2) = %.17g, exact %.17g", main.E0[0], -2/(3*math.Pi))
	}
	if d := math.Abs(main.B[0] - 1/math.Pi); d > 1e-17 {
		t.Errorf("B(q = 2) = %.17g, exact 1/pi", main.B[0])
	}
	for _, v := range []ZeroTParams{{Tilt: 0.2}, {Step: 0.0625}} {
		s, err := SolveZeroTEps(EpsSeriesParams{Order: order, Extended: true, Grid: v})
		if err != nil {
			t.Fatal(err)
		}
		for j := range s.E0 {
			if d := math.Abs(s.E0[j] - main.E0[j]); d > 4e-16*math.Max(math.Abs(main.E0[j]), 1e-3) {
				t.Errorf("grid %+v: E_0 eps^%d differs by %.3g from the default grid's", v, j, d)
			}
		}
	}
}
