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

// Fitted S_0 against Kitaev's exact formula (MS 2016 sec. 2.6; the value
// from package expansion/conformal) at q = 3, 4, 6: the joint fit must hit
// it to 1e-9 and within three times its own error.
func TestFittedS0(t *testing.T) {
	for _, q := range []float64{3, 4, 6} {
		g := defaultGround(t, q)
		if d := math.Abs(g.S0 - g.S0Exact); d > 1e-9 || d > 3*g.S0Err {
			t.Errorf("q=%g: fitted S0 %.13g ± %.1e, exact %.13g", q, g.S0, g.S0Err, g.S0Exact)
		}
	}
}

// The joint fit recovers the coefficients of an exact model of log Z and E
// (synthetic data with the correction powers the fit uses, errors 1e-13).
func TestFitJointRecoversModel(t *testing.T) {
	h1 := conformalData(t, 4).H1
	exps := append([]float64{1}, correctionPowers(h1)[:4]...)
	coef := []float64{2 * math.Pi * math.Pi * 0.007, -0.3, 0.8, 2, -5}
	e0, s0 := -0.0574, 0.2324
	var lad []*Solution
	for i := 0; i < 20; i++ {
		beta := 30 * math.Pow(100, float64(i)/19)
		s := &Solution{Beta: beta}
		s.LogZ, s.E = -beta*e0+s0, e0
		for k, p := range exps {
			s.LogZ += coef[k] * math.Pow(beta, -p)
			s.E += p * coef[k] * math.Pow(beta, -p-1)
		}
		s.LogZErr, s.EErr = 1e-13*beta, 1e-15
		lad = append(lad, s)
	}
	f, err := fitJoint(lad, exps)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(f.E0-e0) > 1e-14 || math.Abs(f.S0-s0) > 1e-11 || math.Abs(f.AlphaS-0.007) > 1e-10 {
		t.Errorf("fit E0 %.16g S0 %.14g alphaS %.12g, model %g %g 0.007", f.E0, f.S0, f.AlphaS, e0, s0)
	}
	for k := range coef {
		if math.Abs(f.Coef[k]-coef[k]) > 1e-6*math.Max(1, math.Abs(coef[k])) {
			t.Errorf("c_%d = %.10g, model %g", k, f.Coef[k], coef[k])
		}
	}
}

// A level refined from a coarse grid by zero-padding its coefficients must
// land on the same discrete solution as a solve started on that grid.
func TestRefineMatchesDirect(t *testing.T) {
	const q, beta, m = 4.0, 300.0, 1 << 13
	direct, err := solveLevel(q, beta, m, 1e-14, nil, nil)
	if err != nil {
		t.Fatal(err)
	}
	refined, err := continuation(q, beta, 2*m, 1e-14, nil)
	if err != nil {
		t.Fatal(err)
	}
	if d := math.Abs(direct.LogZ - refined.LogZ); d > 1e-11 {
		t.Errorf("log Z direct %.16g, refined %.16g", direct.LogZ, refined.LogZ)
	}
	if d := math.Abs(direct.E - refined.E); d > 1e-14 {
		t.Errorf("E direct %.17g, refined %.17g", direct.E, refined.E)
	}
}

// Published q = 4 values: E_0 = -0.0406 J = -0.05746 script-J (from memory,
// MS 2016 / Garcia-Garcia-Verbaarschot arXiv:1610.03816), S_0 = 0.2324 and
// alpha_S ~ 0.007 (Maldacena-Stanford arXiv:1604.07818).
func TestPublishedQ4(t *testing.T) {
	g := defaultGround(t, 4)
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
