package energy

import (
	"math"
	"testing"
)

// Resummed E_0 and alpha_S at q = 4 against the direct solver (numeric.Ladder
// and numeric.FitGround): every resummation from both ends and the two-point
// Pade must agree within the combined error bars (3 sigma). Published q = 4
// values for orientation: E_0 = -0.0406 J = -0.05746 script-J, alpha_S ~ 0.007
// (Maldacena-Stanford arXiv:1604.07818; PHYSICS sec. 8, E_0 from memory).
func TestResumAgainstDirectSolverQ4(t *testing.T) {
	ge, err := EpsGround(GroundParams{Order: 6})
	if err != nil {
		t.Fatal(err)
	}
	gi, err := InvQGround(GroundParams{Order: 5})
	if err != nil {
		t.Fatal(err)
	}
	d, err := DirectGround(4, nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		qty          string
		direct, derr float64
		published    float64
		pubTol       float64
	}{
		{QuantityE0, d.E0, d.E0Err, -0.05746, 1e-5},
		{QuantityAlphaS, d.AlphaS, d.AlphaSErr, 0.007, 5e-4},
	} {
		r, err := ResumGround(c.qty, 4, ge, gi)
		if err != nil {
			t.Fatal(err)
		}
		for _, e := range r.Estimates {
			if e.Method != MethodPadeEps && e.Method != MethodPadeInvQ && e.Method != MethodTwoPoint {
				continue
			}
			if math.IsNaN(e.Value) {
				t.Errorf("%s %s: not available (%s)", c.qty, e.Method, e.Detail)
				continue
			}
			comb := math.Hypot(e.Err, c.derr)
			if dd := math.Abs(e.Value - c.direct); dd > 3*comb {
				t.Errorf("%s %s: %.10g ± %.1e, direct %.10g ± %.1e: %.1f combined sigma", c.qty, e.Method, e.Value, e.Err, c.direct, c.derr, dd/comb)
			}
			if math.Abs(e.Value-c.published) > c.pubTol {
				t.Errorf("%s %s: %.6g far from the published %.4g", c.qty, e.Method, e.Value, c.published)
			}
			t.Logf("%s %-14s %.10g ± %.1e (direct %.10g ± %.1e)", c.qty, e.Method, e.Value, e.Err, c.direct, c.derr)
		}
	}
}
