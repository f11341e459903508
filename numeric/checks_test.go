package numeric

import (
	"errors"
	"math"
	"testing"
)

// High-temperature series, PHYSICS sec. 6: log Z = (1/2) log 2 + b^2/(4q^2)
// - b^4/(48 q^2) + O(b^6); the remainder must scale like beta^6.
func TestHighTemperature(t *testing.T) {
	for _, q := range []float64{3, 4, 6} {
		for _, beta := range []float64{0.01, 0.05, 0.1} {
			s, err := Solve(Params{Q: q, Beta: beta, SkipCheck: true})
			if err != nil {
				t.Fatal(err)
			}
			series := 0.5*math.Ln2 + beta*beta/(4*q*q) - math.Pow(beta, 4)/(48*q*q)
			if d := math.Abs(s.LogZ - series); d > 0.01*math.Pow(beta, 6)+1e-15 {
				t.Errorf("q=%g beta=%g: log Z %.17g, series %.17g, diff %.2e", q, beta, s.LogZ, series, d)
			}
		}
	}
}

// Large q, Maldacena-Stanford arXiv:1604.07818 sec. 2.4 (PHYSICS sec. 5):
// log Z = (1/2) log 2 + (pi v/q^2)[tan(pi v/2) - pi v/4] + O(1/q^3),
// beta = pi v / cos(pi v/2); the difference must fall like 1/q^3.
func TestLargeQ(t *testing.T) {
	beta := 5.0
	// Solve beta = pi v/cos(pi v/2) for v in (0,1) by bisection.
	lo, hi := 0.0, 1.0
	for i := 0; i < 200; i++ {
		v := (lo + hi) / 2
		if math.Pi*v/math.Cos(math.Pi*v/2) < beta {
			lo = v
		} else {
			hi = v
		}
	}
	v := lo
	diff := map[float64]float64{}
	for _, q := range []float64{50, 100} {
		s, err := Solve(Params{Q: q, Beta: beta, SkipCheck: true})
		if err != nil {
			t.Fatal(err)
		}
		lz := 0.5*math.Ln2 + math.Pi*v/(q*q)*(math.Tan(math.Pi*v/2)-math.Pi*v/4)
		diff[q] = s.LogZ - lz
		if math.Abs(diff[q])*q*q*q > 20 {
			t.Errorf("q=%g: log Z %.12g vs large-q %.12g, diff*q^3 = %.3g", q, s.LogZ, lz, diff[q]*q*q*q)
		}
	}
	if r := diff[50] / diff[100]; r < 6 || r > 10 {
		t.Errorf("difference ratio q=50/q=100 is %.3g, want about 8 (1/q^3)", r)
	}
}

// E against -d log Z / d beta (PHYSICS sec. 2: E = -d log Z/d beta).
func TestEnergyDerivative(t *testing.T) {
	for _, c := range []struct{ q, beta float64 }{{4, 5}, {3, 50}, {4, 200}, {2.5, 20}} {
		s, err := Solve(Params{Q: c.q, Beta: c.beta})
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(s.Mismatch) > 1e-9 || math.Abs(s.Mismatch) > 3*s.MismatchErr+1e-12 {
			t.Errorf("q=%g beta=%g: E = %.15g, -dlogZ/dbeta = %.15g, mismatch %.2e ± %.1e", c.q, c.beta, s.E, s.DLogZ, s.Mismatch, s.MismatchErr)
		}
	}
}

// Fitted S_0 against Kitaev's exact formula (MS 2016 sec. 2.6) at q = 3, 4, 6.
func TestFittedS0(t *testing.T) {
	for _, q := range []float64{3, 4, 6} {
		lad, err := Ladder(LadderParams{Q: q, BetaMin: 50, BetaMax: 2000, Steps: 16})
		if err != nil {
			t.Fatal(err)
		}
		g, err := FitGround(q, lad)
		if err != nil {
			t.Fatal(err)
		}
		if d := math.Abs(g.S0 - g.S0Exact); d > 1e-6 || d > 3*g.S0Err {
			t.Errorf("q=%g: fitted S0 %.12g ± %.1e, exact %.12g", q, g.S0, g.S0Err, g.S0Exact)
		}
	}
}

// Published q = 4 values: E_0 = -0.0406 J = -0.05746 script-J (from memory,
// MS 2016 / Garcia-Garcia-Verbaarschot arXiv:1610.03816), S_0 = 0.2324 and
// alpha_S ~ 0.007 (Maldacena-Stanford arXiv:1604.07818).
func TestPublishedQ4(t *testing.T) {
	lad, err := Ladder(LadderParams{Q: 4, BetaMin: 50, BetaMax: 2000, Steps: 16})
	if err != nil {
		t.Fatal(err)
	}
	g, err := FitGround(4, lad)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(g.E0-(-0.05746)) > 0.5e-5 {
		t.Errorf("E0 = %.8g script-J, published -0.05746", g.E0)
	}
	if ej := g.E0 / math.Sqrt(2); math.Abs(ej-(-0.0406)) > 0.5e-4 {
		t.Errorf("E0 = %.6g J, published -0.0406 J", ej)
	}
	if math.Abs(g.S0-0.2324) > 0.5e-4 {
		t.Errorf("S0 = %.8g, published 0.2324", g.S0)
	}
	if math.Abs(g.AlphaS-0.007) > 0.5e-3 {
		t.Errorf("alpha_S = %.6g, published ~0.007", g.AlphaS)
	}
	// The exact S_0 at q = 4 rounds to the published 0.2324.
	if math.Abs(ExactS0(4)-0.2324) > 0.5e-4 {
		t.Errorf("exact S0(4) = %.8g", ExactS0(4))
	}
}

// h_1 at q = 4 is 3.77 (MS 2016; Polchinski-Rosenhaus arXiv:1601.06768), and
// k_A(h) = -(3/2) tan(pi(h - 1/2)/2)/(h - 1/2) at q = 4 (MS 2016).
func TestFirstDimension(t *testing.T) {
	if h := FirstDimension(4); math.Abs(h-3.77) > 0.005 {
		t.Errorf("h1(4) = %.6g, published 3.77", h)
	}
	for _, h := range []float64{2.5, 3.3, 4.2} {
		want := -1.5 * math.Tan(math.Pi*(h-0.5)/2) / (h - 0.5)
		if got := kA(4, h); math.Abs(got-want) > 1e-12*math.Max(1, math.Abs(want)) {
			t.Errorf("k_A(4, %g) = %.15g, closed form %.15g", h, got, want)
		}
	}
	if got := kA(4, 2); math.Abs(got-1) > 1e-13 { // soft mode: k_A(2) = 1 (MS 2016)
		t.Errorf("k_A(4, 2) = %.15g, want 1", got)
	}
}

// ExactS0 against mpmath: mpmath.quad(lambda x: pi*(0.5-x)*tan(pi*x), [0, 1/4]) at q = 4.
func TestExactS0(t *testing.T) {
	cases := []struct{ q, want float64 }{
		{4, 0.5*math.Ln2 - 0.11414974069457010},
		{2, 0}, // PHYSICS sec. 4: S_0(q=2) = 0
	}
	for _, c := range cases {
		if got := ExactS0(c.q); math.Abs(got-c.want) > 1e-14 {
			t.Errorf("S0(%g) = %.16g, want %.16g", c.q, got, c.want)
		}
	}
}

// Bad input is an error wrapping ErrInput, never a panic or NaN.
func TestBadInput(t *testing.T) {
	for _, p := range []Params{
		{Q: 1.5, Beta: 1}, {Q: math.NaN(), Beta: 1}, {Q: 4, Beta: 0}, {Q: 4, Beta: -1},
		{Q: 4, Beta: 1, Points: 1000}, {Q: 4, Beta: 1, Points: 32}, {Q: 4, Beta: 1, Tol: -1},
	} {
		if _, err := Solve(p); !errors.Is(err, ErrInput) {
			t.Errorf("Solve(%+v): error %v, want ErrInput", p, err)
		}
	}
}

// Non-convergence says what happened: an impossible tolerance fails with the residual.
func TestNoConvergence(t *testing.T) {
	_, err := Solve(Params{Q: 4, Beta: 10, Tol: 1e-30, SkipCheck: true})
	if err == nil {
		t.Fatal("tolerance 1e-30 converged")
	}
	t.Log(err)
}
