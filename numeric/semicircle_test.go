package numeric

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// composite returns int f over [breaks[0], breaks[len-1]] by order-point
// Gauss-Legendre (gonum's quad.Legendre) on panels equally spaced between
// consecutive breakpoints.
func composite(f func(float64) float64, breaks []float64, panels, order int) float64 {
	x, w := make([]float64, order), make([]float64, order)
	sum := 0.0
	for i := 0; i+1 < len(breaks); i++ {
		d := (breaks[i+1] - breaks[i]) / float64(panels)
		for p := 0; p < panels; p++ {
			lo := breaks[i] + float64(p)*d
			quad.Legendre{}.FixedLocations(x, w, lo, lo+d)
			for j := range x {
				sum += w[j] * f(x[j])
			}
		}
	}
	return sum
}

// semicircleThermo is the exact q = 2 thermodynamics: free fermions with the
// Wigner semicircle rho(e) = sqrt(4 - e^2)/(2 pi) (textbook; PHYSICS sec. 5),
// log Z = (1/2) int rho log(2 cosh(beta e/2)) de, E = -(1/4) int rho e tanh(beta e/2) de,
// by Gauss-Legendre after e = 2 sin(theta), with panels graded near e = 0.
func semicircleThermo(beta float64) (logZ, e float64) {
	w := func(th float64) float64 { return 2 / math.Pi * math.Cos(th) * math.Cos(th) }
	f := func(th float64) float64 {
		x := math.Abs(beta * math.Sin(th))
		return w(th) * (x + math.Log1p(math.Exp(-2*x)))
	}
	fe := func(th float64) float64 {
		en := 2 * math.Sin(th)
		return w(th) * (-en / 4 * math.Tanh(beta*en/2))
	}
	br := []float64{-math.Pi / 2, -0.3, -0.03, -0.003, 0, 0.003, 0.03, 0.3, math.Pi / 2}
	return 0.5 * composite(f, br, 40, 20), composite(fe, br, 40, 20)
}

// q = 2 against the exact semicircle solution, to 1e-10.
func TestSemicircleThermo(t *testing.T) {
	for _, beta := range []float64{0.5, 1, 10, 100, 300} {
		lz, e := semicircleThermo(beta)
		s, err := Solve(Params{Q: 2, Beta: beta, SkipCheck: true})
		if err != nil {
			t.Fatal(err)
		}
		// log Z is extensive in beta: compare it per unit beta beyond beta = 1.
		scale := math.Max(1, beta/10)
		if d := math.Abs(s.LogZ - lz); d > 1e-10*scale || d > 3*s.LogZErr+1e-13 {
			t.Errorf("beta %g: log Z %.15g, exact %.15g (diff %.2e, estimate %.1e)", beta, s.LogZ, lz, d, s.LogZErr)
		}
		if d := math.Abs(s.E - e); d > 1e-11 || d > 3*s.EErr+1e-14 {
			t.Errorf("beta %g: E %.15g, exact %.15g (diff %.2e, estimate %.1e)", beta, s.E, e, d, s.EErr)
		}
	}
}

// q = 2 low temperature: E_0 = -2/(3 pi), S_0 = 0 and alpha = 1/(24 pi)
// (semicircle: C = pi T/6; PHYSICS sec. 5).
func TestSemicircleGround(t *testing.T) {
	g := defaultGround(t, 2)
	cases := []struct {
		name            string
		got, err, exact float64
		tol             float64
	}{
		{"E0", g.E0, g.E0Err, -2 / (3 * math.Pi), 1e-13},
		{"S0", g.S0, g.S0Err, 0, 1e-9},
		{"alpha", g.AlphaS, g.AlphaSErr, 1 / (24 * math.Pi), 1e-8},
	}
	for _, c := range cases {
		if d := math.Abs(c.got - c.exact); d > c.tol || d > 3*c.err+1e-15 {
			t.Errorf("q=2 %s = %.14g ± %.1e, exact %.14g", c.name, c.got, c.err, c.exact)
		}
	}
}
