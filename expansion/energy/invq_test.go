package energy

import (
	"errors"
	"math"
	"testing"

	"qbridge/numeric"
)

// publishedLogZ2 is the 1/q^2 coefficient of log Z, Maldacena-Stanford
// arXiv:1604.07818 sec. 2.4 (PHYSICS sec. 5): pi v [tan(pi v/2) - pi v/4],
// beta = pi v/cos(pi v/2).
func publishedLogZ2(beta float64) float64 {
	v, _ := LiouvilleV(beta)
	return math.Pi * v * (math.Tan(math.Pi*v/2) - math.Pi*v/4)
}

// The O(1/q^2) terms at finite beta against the published formula; E_2 against
// -d/d beta of it (fourth-order difference); orders 0 and 1 are exact.
func TestInvQPublishedSecondOrder(t *testing.T) {
	for _, beta := range []float64{1, 5, 50} {
		f, err := InvQExpand(InvQParams{Beta: beta, Order: 4})
		if err != nil {
			t.Fatal(err)
		}
		want := publishedLogZ2(beta)
		if d := math.Abs(f.LogZ.Values[2] - want); d > 3*f.LogZ.Errors[2]+1e-12 || d > 1e-9*math.Max(1, want) {
			t.Errorf("beta=%g: log Z_2 = %.15g ± %.1e, published %.15g", beta, f.LogZ.Values[2], f.LogZ.Errors[2], want)
		}
		h := 1e-3 * beta
		dl := (8*(publishedLogZ2(beta+h)-publishedLogZ2(beta-h)) - (publishedLogZ2(beta+2*h) - publishedLogZ2(beta-2*h))) / (12 * h)
		if d := math.Abs(f.E.Values[2] + dl); d > 1e-9 {
			t.Errorf("beta=%g: E_2 = %.15g, -d log Z_2/d beta = %.15g", beta, f.E.Values[2], -dl)
		}
		if math.Abs(f.LogZ.Values[0]-0.5*math.Ln2) > 1e-15 || math.Abs(f.LogZ.Values[1]) > 1e-9 || f.E.Values[0] != 0 || f.E.Values[1] != 0 {
			t.Errorf("beta=%g: orders 0, 1: log Z %.3g %.3g, E %.3g %.3g; want (1/2) log 2, 0, 0, 0", beta, f.LogZ.Values[0], f.LogZ.Values[1], f.E.Values[0], f.E.Values[1])
		}
	}
}

// High temperature (PHYSICS sec. 6, exact): log Z = (1/2) log 2 + beta^2/(4q^2)
// - beta^4/(48 q^2) + O(beta^6): only the x^2 coefficient survives to O(beta^4).
func TestInvQHighTemperature(t *testing.T) {
	const beta = 0.1
	f, err := InvQExpand(InvQParams{Beta: beta, Order: 6, Points: 256})
	if err != nil {
		t.Fatal(err)
	}
	for k := 2; k <= 6; k++ {
		want := 0.0
		if k == 2 {
			want = beta*beta/4 - math.Pow(beta, 4)/48
		}
		if d := math.Abs(f.LogZ.Values[k] - want); d > 0.05*math.Pow(beta, 6) {
			t.Errorf("order %d: log Z_k = %.3g, high-T series %.3g (diff %.1e, beta^6 = %.0e)", k, f.LogZ.Values[k], want, d, math.Pow(beta, 6))
		}
	}
}

// The summed series against the direct solver (numeric.Solve) at large q:
// the difference must be of the size of the first omitted term.
func TestInvQAgainstDirectSolver(t *testing.T) {
	const beta, order = 5.0, 7
	f, err := InvQExpand(InvQParams{Beta: beta, Order: order})
	if err != nil {
		t.Fatal(err)
	}
	for _, q := range []float64{25, 50, 100} {
		s, err := numeric.Solve(numeric.Params{Q: q, Beta: beta, SkipCheck: true})
		if err != nil {
			t.Fatal(err)
		}
		x := 1 / q
		var lz, e, xk float64 = 0, 0, 1
		for k := 0; k <= order; k++ {
			lz += f.LogZ.Values[k] * xk
			e += f.E.Values[k] * xk
			xk *= x
		}
		// First omitted term: bounded by the last kept coefficient times x.
		tolZ := 10*math.Abs(f.LogZ.Values[order])*xk + s.LogZErr + 1e-12
		tolE := 10*math.Abs(f.E.Values[order])*xk + s.EErr + 1e-13
		if d := math.Abs(lz - s.LogZ); d > tolZ {
			t.Errorf("q=%g: series log Z %.15g, direct %.15g, diff %.1e > %.1e", q, lz, s.LogZ, d, tolZ)
		}
		if d := math.Abs(e - s.E); d > tolE {
			t.Errorf("q=%g: series E %.15g, direct %.15g, diff %.1e > %.1e", q, e, s.E, d, tolE)
		}
	}
}

// Low-temperature extraction around q = infinity: E_0 = -1/q^2 and
// alpha_S = 1/(4 q^2) (Maldacena-Stanford arXiv:1604.07818, PHYSICS sec. 5),
// and every S_0 coefficient equal to the exact series
// S_0 = (1/2) log 2 - int_0^x pi (1/2 - t) tan(pi t) dt (MS 2016 sec. 2.6).
func TestInvQGround(t *testing.T) {
	const order = 5
	g, err := InvQGround(GroundParams{Order: order})
	if err != nil {
		t.Fatal(err)
	}
	for k := 0; k <= order; k++ {
		d := math.Abs(g.S0.Values[k] - g.S0Exact[k])
		if d > 2*g.S0.Errors[k]+1e-14 || g.S0.Errors[k] > 1e-3*math.Abs(g.S0Exact[k])+1e-12 {
			t.Errorf("order %d: S_0 = %.10g ± %.1e, exact %.10g", k, g.S0.Values[k], g.S0.Errors[k], g.S0Exact[k])
		}
		t.Logf("x^%d: E0 %.10g ± %.1e  alpha %.8g ± %.1e  S0 %.8g ± %.1e (exact %.8g)", k,
			g.E0.Values[k], g.E0.Errors[k], g.AlphaS.Values[k], g.AlphaS.Errors[k], g.S0.Values[k], g.S0.Errors[k], g.S0Exact[k])
	}
	// The x^2 coefficients: the merged ones are the exact route, to 1e-12;
	// the ladder's own fits must cover the published values within their
	// stated errors.
	for _, c := range []struct {
		name              string
		got, err          float64
		ladder, ladErr    float64
		route             string
		want, tol, ladTol float64
	}{
		{"E_0", g.E0.Values[2], g.E0.Errors[2], g.LadderE0.Values[2], g.LadderE0.Errors[2], g.E0Route[2], -1, 1e-12, 1e-9},
		{"alpha_S", g.AlphaS.Values[2], g.AlphaS.Errors[2], g.LadderAlphaS.Values[2], g.LadderAlphaS.Errors[2], g.AlphaSRoute[2], 0.25, 1e-12, 1e-4},
	} {
		if d := math.Abs(c.got - c.want); d > c.err || d > c.tol || c.route != RouteLiouville || !(c.err > 0) {
			t.Errorf("%s x^2 coefficient %.17g ± %.1e (route %q), published %.12g", c.name, c.got, c.err, c.route, c.want)
		}
		if d := math.Abs(c.ladder - c.want); d > c.ladErr || d > c.ladTol {
			t.Errorf("%s x^2 coefficient of the ladder's fits %.12g ± %.1e, published %.12g", c.name, c.ladder, c.ladErr, c.want)
		}
		t.Logf("%s x^2: ladder %.12g ± %.1e (true error %.1e)", c.name, c.ladder, c.ladErr, c.ladder-c.want)
	}
	// The ladder's finite-beta data at order 2 against the closed form,
	// each within its stated error.
	for _, f := range g.Ladder {
		lz, e := closedLiouville(f.Beta)
		if d := math.Abs(f.E.Values[2] - e); d > f.E.Errors[2] {
			t.Errorf("beta=%g: E_2 = %.15g ± %.1e, closed form %.15g (diff %.1e)", f.Beta, f.E.Values[2], f.E.Errors[2], e, d)
		}
		if d := math.Abs(f.LogZ.Values[2] - lz); d > f.LogZ.Errors[2] {
			t.Errorf("beta=%g: log Z_2 = %.15g ± %.1e, closed form %.15g (diff %.1e)", f.Beta, f.LogZ.Values[2], f.LogZ.Errors[2], lz, d)
		}
	}
}

func TestInvQBadInput(t *testing.T) {
	for _, p := range []InvQParams{{Beta: -1, Order: 3}, {Beta: 10, Order: 1}, {Beta: 10, Order: 3, Points: 100}} {
		if _, err := InvQExpand(p); !errors.Is(err, ErrInput) {
			t.Errorf("%+v: got %v, want ErrInput", p, err)
		}
	}
	if _, err := InvQExpand(InvQParams{Beta: 10, Order: MaxInvQOrder + 1}); !errors.Is(err, ErrOrder) {
		t.Errorf("order above maximum: got %v, want ErrOrder", err)
	}
}
