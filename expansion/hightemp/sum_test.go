package hightemp

import (
	"math"
	"math/big"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"qbridge/numeric"
)

// semicircleLogZ is the q = 2 free energy (1/2) int rho(E) log(2 cosh(beta E/2)) dE
// (PHYSICS.md sec. 5) by Gauss-Legendre quadrature in E = 2 sin(theta),
// where the integrand is smooth.
func semicircleLogZ(beta float64) float64 {
	f := func(th float64) float64 {
		e := 2 * math.Sin(th)
		rho := 2 * math.Cos(th) * 2 * math.Cos(th) / (2 * math.Pi) // rho dE = sqrt(4-E^2)/(2 pi) 2 cos(th) dth
		x := beta * e / 2
		lc := math.Abs(x) + math.Log1p(math.Exp(-2*math.Abs(x))) // log(2 cosh x)
		return 0.5 * rho * lc
	}
	return quad.Fixed(f, -math.Pi/2, math.Pi/2, 200, nil, 0)
}

func TestSumCoversSemicircle(t *testing.T) {
	c, err := Solve(big.NewRat(2, 1), 30)
	if err != nil {
		t.Fatal(err)
	}
	for _, beta := range []float64{0.3, 1, 1.3, 1.5, 2, 3, 5} {
		got, err := Evaluate(LogZ, c, big.NewFloat(beta), 200)
		if err != nil {
			t.Fatal(err)
		}
		exact := semicircleLogZ(beta)
		for _, s := range []Sum{got.Partial, got.Pade} {
			v, _ := s.Value.Float64()
			trueErr := math.Abs(v - exact)
			if s.Err == nil {
				t.Logf("beta=%g %s: %.15g, error not estimated (%s); true %.2g", beta, s.Method, v, s.Reason, trueErr)
				continue
			}
			e, _ := s.Err.Float64()
			t.Logf("beta=%g %s: %.15g +- %.2g, true %.2g", beta, s.Method, v, e, trueErr)
			// the quadrature is good to ~1e-15; allow that much on top
			if trueErr > e+4e-15 {
				t.Errorf("beta=%g: stated %.3g does not cover true %.3g (%s)", beta, e, trueErr, s.Method)
			}
		}
	}
}

// TestSumAgreesWithDirectSolver holds the summed series at q = 4 against
// the direct Schwinger-Dyson solver (package numeric, its own error bar)
// for beta script-J <= 1.
func TestSumAgreesWithDirectSolver(t *testing.T) {
	if testing.Short() {
		t.Skip("direct solves")
	}
	c, err := Solve(big.NewRat(4, 1), 30)
	if err != nil {
		t.Fatal(err)
	}
	for _, beta := range []float64{0.5, 1} {
		sol, err := numeric.Solve(numeric.Params{Q: 4, Beta: beta, SkipCheck: true})
		if err != nil {
			t.Fatal(err)
		}
		got, err := Evaluate(LogZ, c, big.NewFloat(beta), 200)
		if err != nil {
			t.Fatal(err)
		}
		best := got.Best()
		v, _ := best.Value.Float64()
		e, _ := best.Err.Float64()
		diff := math.Abs(v - sol.LogZ)
		t.Logf("beta=%g: series %.15f +- %.2g, direct %.15f +- %.2g, difference %.2g", beta, v, e, sol.LogZ, sol.LogZErr, diff)
		if diff > 1e-10 || diff > 2*(e+sol.LogZErr)+1e-15 {
			t.Errorf("beta=%g: series and direct solver differ by %.3g (errors %.2g, %.2g)", beta, diff, e, sol.LogZErr)
		}
		en, err := Evaluate(Energy, c, big.NewFloat(beta), 200)
		if err != nil {
			t.Fatal(err)
		}
		ev, _ := en.Best().Value.Float64()
		if d := math.Abs(ev - sol.E); d > 1e-9 {
			t.Errorf("beta=%g: energy series %.12g vs direct %.12g", beta, ev, sol.E)
		}
		ent, err := Evaluate(Entropy, c, big.NewFloat(beta), 200)
		if err != nil {
			t.Fatal(err)
		}
		if sv, _ := ent.Best().Value.Float64(); math.Abs(sv-sol.S) > 1e-9 {
			t.Errorf("beta=%g: entropy series %.12g vs direct %.12g", beta, sv, sol.S)
		}
		// C = -beta^2 dE/dbeta, by a central difference of the direct solver's E
		const h = 1e-3
		var es [2]float64
		for i, b := range []float64{beta - h, beta + h} {
			s2, err := numeric.Solve(numeric.Params{Q: 4, Beta: b, SkipCheck: true})
			if err != nil {
				t.Fatal(err)
			}
			es[i] = s2.E
		}
		heatDirect := -beta * beta * (es[1] - es[0]) / (2 * h)
		ht, err := Evaluate(Heat, c, big.NewFloat(beta), 200)
		if err != nil {
			t.Fatal(err)
		}
		if hv, _ := ht.Best().Value.Float64(); math.Abs(hv-heatDirect) > 1e-6 {
			t.Errorf("beta=%g: heat series %.10g vs direct difference quotient %.10g", beta, hv, heatDirect)
		}
	}
}

// The direct solver's -d log Z/d beta (a six-point difference of its log Z)
// and its stated error, against the exact energy from the series at q = 4
// (Pade in t, error below 1e-20 here).
func TestSolverDerivativeErrorCovers(t *testing.T) {
	if testing.Short() {
		t.Skip("direct solves")
	}
	c, err := Solve(big.NewRat(4, 1), 30)
	if err != nil {
		t.Fatal(err)
	}
	for _, beta := range []float64{0.5, 1, 2} {
		sol, err := numeric.Solve(numeric.Params{Q: 4, Beta: beta})
		if err != nil {
			t.Fatal(err)
		}
		en, err := Evaluate(Energy, c, big.NewFloat(beta), 200)
		if err != nil {
			t.Fatal(err)
		}
		best := en.Best()
		exact, _ := best.Value.Float64()
		e, _ := best.Err.Float64()
		for _, v := range []struct {
			name     string
			val, err float64
		}{{"E", sol.E, sol.EErr}, {"-dlogZ/dbeta", sol.DLogZ, sol.DLogZErr}} {
			d := math.Abs(v.val - exact)
			t.Logf("beta=%g %s: %.16g +- %.2g, exact %.16g +- %.1g, true error %.2g", beta, v.name, v.val, v.err, exact, e, d)
			if d > v.err+e+1e-17 {
				t.Errorf("beta=%g: %s = %.16g +- %.2g does not cover the exact %.16g (off by %.3g)", beta, v.name, v.val, v.err, exact, d)
			}
		}
	}
}
