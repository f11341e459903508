package energy

import (
	"errors"
	"math"
	"strings"
	"testing"

	"qbridge/numeric"
)

// The conformal data handed to the direct solver's fits: h_1(4) = 3.77
// (Maldacena-Stanford arXiv:1604.07818; Polchinski-Rosenhaus
// arXiv:1601.06768), h_1 = 4 at q = 2 (free fermion bilinear, PHYSICS
// sec. 4); S_0(4) against mpmath 1.3.0,
// log(2)/2 - quad(lambda x: pi*(0.5-x)*tan(pi*x), [0, 1/4]), which rounds to
// the published 0.2324 (MS 2016), and S_0(2) = 0 (PHYSICS sec. 4).
func TestConformalDataPublished(t *testing.T) {
	c4, err := ConformalData(4)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(c4.H1-3.77) > 0.005 {
		t.Errorf("h_1(4) = %.6g, published 3.77", c4.H1)
	}
	if want := 0.5*math.Ln2 - 0.11414974069457010; math.Abs(c4.S0Exact-want) > 1e-14 {
		t.Errorf("S_0(4) = %.16g, mpmath %.16g", c4.S0Exact, want)
	}
	if math.Abs(c4.S0Exact-0.2324) > 0.5e-4 {
		t.Errorf("S_0(4) = %.8g, published 0.2324", c4.S0Exact)
	}
	c2, err := ConformalData(2)
	if err != nil {
		t.Fatal(err)
	}
	if c2.H1 != 4 || math.Abs(c2.S0Exact) > 1e-16 {
		t.Errorf("q = 2: h_1 = %.17g, S_0 = %.3g; want 4 and 0", c2.H1, c2.S0Exact)
	}
	for _, q := range []float64{1.5, math.NaN(), math.Inf(1)} {
		if _, err := ConformalData(q); !errors.Is(err, ErrInput) {
			t.Errorf("q = %g: %v, want ErrInput", q, err)
		}
	}
}

// DirectGround and Ground on the default ladder are one cached solve: the
// same numbers, the same *numeric.Ground, a progress report of completion
// on the cached call; the fitted S_0 matches the exact one (Kitaev; MS 2016
// sec. 2.6) within its error. Bad input is ErrInput of both packages.
func TestGroundCached(t *testing.T) {
	d, err := DirectGround(4, nil)
	if err != nil {
		t.Fatal(err)
	}
	var last float64
	g, err := Ground(numeric.GroundLadder(4, 0, func(f float64, _ string) { last = f }))
	if err != nil {
		t.Fatal(err)
	}
	g2, err := Ground(numeric.GroundLadder(4, 0, nil))
	if err != nil {
		t.Fatal(err)
	}
	if g != g2 || last != 1 {
		t.Errorf("second call solved again (same result %v, last progress %g)", g == g2, last)
	}
	// The direct values are the ladder's or the T = 0 route's, whichever
	// states the smaller error; the two agree within their combined errors.
	if d.Ladder != g || d.E0Err > g.E0Err || d.AlphaSErr > g.AlphaSErr {
		t.Errorf("DirectGround does not use the cached ladder or is less accurate: E0 %.15g ± %.1e alpha %.12g ± %.1e, Ground %.15g ± %.1e %.12g ± %.1e",
			d.E0, d.E0Err, d.AlphaS, d.AlphaSErr, g.E0, g.E0Err, g.AlphaS, g.AlphaSErr)
	}
	if math.Abs(d.E0-g.E0) > d.E0Err+g.E0Err || math.Abs(d.AlphaS-g.AlphaS) > d.AlphaSErr+g.AlphaSErr {
		t.Errorf("routes disagree: E0 %.15g vs %.15g, alpha %.12g vs %.12g", d.E0, g.E0, d.AlphaS, g.AlphaS)
	}
	if !strings.HasPrefix(d.AlphaSMethod, DirectZeroTMethod) {
		t.Errorf("alpha_S(4) not from the T = 0 route: %s", d.AlphaSMethod)
	}
	if dd := math.Abs(g.S0 - g.S0Exact); dd > 3*g.S0Err || dd > 1e-9 {
		t.Errorf("fitted S_0 %.13g ± %.1e, exact %.13g", g.S0, g.S0Err, g.S0Exact)
	}
	if len(g.Ladder) != numeric.GroundSteps || g.Ladder[0].Levels != nil {
		t.Errorf("cached ladder: %d solutions, levels kept %v", len(g.Ladder), g.Ladder[0].Levels != nil)
	}
	for _, q := range []float64{1, math.NaN()} {
		_, err := DirectGround(q, nil)
		if !errors.Is(err, ErrInput) || !errors.Is(err, numeric.ErrInput) {
			t.Errorf("q = %g: %v, want ErrInput", q, err)
		}
	}
}
