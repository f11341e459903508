package numeric

import (
	"errors"
	"math"
	"math/big"
	"testing"

	"qbridge/expansion/conformal"
)

// conformalDims returns h_1..h_6 at q from package expansion/conformal.
func conformalDims(tb testing.TB, q float64) []float64 {
	tb.Helper()
	qp := conformal.QPoint{Q: new(big.Float).SetFloat64(q)}
	var d []float64
	for n := 1; n <= 6; n++ {
		h, err := conformal.Dimension(qp, n, 20)
		if err != nil {
			tb.Fatal(err)
		}
		f, _ := h.Value.Float64()
		d = append(d, f)
	}
	return d
}

// semicircleG is the exact zero-temperature G(tau) of the q = 2 model
// (free fermions with the semicircle density rho(E) = sqrt(4 - E^2)/(2 pi),
// PHYSICS sec. 5): G(tau) = int_0^2 rho(E) e^{-E tau} dE
// = (2/pi) int_0^{pi/2} cos^2(t) e^{-2 tau sin t} dt, by Simpson's rule on
// 200000 intervals with a compensated sum (the integrand is smooth; the
// error is far below 1e-15 for tau <= 100).
func semicircleG(tau float64) float64 {
	const n = 200000
	h := math.Pi / 2 / n
	f := func(t float64) float64 { c := math.Cos(t); return c * c * math.Exp(-2*tau*math.Sin(t)) }
	// Neumaier's compensated sum keeps the round-off at a few ulps.
	var s, c float64
	add := func(v float64) {
		t := s + v
		if math.Abs(s) >= math.Abs(v) {
			c += (s - t) + v
		} else {
			c += (v - t) + s
		}
		s = t
	}
	add(f(0))
	add(f(math.Pi / 2))
	for k := 1; k < n; k++ {
		w := 2.0
		if k%2 == 1 {
			w = 4
		}
		add(w * f(float64(k)*h))
	}
	return 2 / math.Pi * (s + c) * h / 3
}

// At q = 2 the zero-temperature solver must reproduce the semicircle
// solution: G(tau) pointwise to 5e-14 (the float64 complex Gamma function
// in the Mellin weights, a few 1e-15 per transform, sets this floor), E_0 = -2/(3 pi) (PHYSICS sec. 5), no h = 2
// correction (alpha_G = 0: the density of states is even and analytic at
// E = 0, so G/G_c - 1 has only even powers of 1/tau) and the first
// correction -1/(4 tau^2) (rho(E) = (1/pi)(1 - E^2/8 + ...) gives
// G = 1/(pi tau) - 1/(4 pi tau^3) + ...).
func TestZeroTSemicircle(t *testing.T) {
	g, err := SolveZeroTGround(ZeroTParams{Q: 2}, []float64{4, 6, 8, 10, 12})
	if err != nil {
		t.Fatal(err)
	}
	s := g.Solutions[0]
	for _, tau := range []float64{0.01, 0.3, 1, 4, 20, 100} {
		// nearest grid point
		k := int(math.Round(math.Log(tau/s.Params.TauMin) / s.Params.Step))
		tk := s.Tau[k]
		got := s.Ratio[k] * s.B * math.Pow(tk, -2/s.Params.Q)
		if want := semicircleG(tk); math.Abs(got-want) > 5e-14*want {
			t.Errorf("tau = %.6g: G = %.17g, semicircle %.17g", tk, got, want)
		}
	}
	if want := -2 / (3 * math.Pi); math.Abs(g.E0-want) > 1e-15 || math.Abs(g.E0-want) > g.E0Err+1e-16 {
		t.Errorf("E_0 = %.17g +- %.1e, exact -2/(3 pi) = %.17g", g.E0, g.E0Err, want)
	}
	if math.Abs(g.AlphaG) > g.AlphaGErr || g.AlphaGErr > 1e-10 {
		t.Errorf("alpha_G = %.3g +- %.1e, exact 0", g.AlphaG, g.AlphaGErr)
	}
	for _, f := range g.Fits {
		tol := 1e-8 // windows from tau = 30; from 100, where tau^-2 is smaller, 1e-7
		if f.TauMin > 50 {
			tol = 1e-7
		}
		if f.Accepted && f.TauMin < 200 && math.Abs(f.Coef[1]+0.25) > tol {
			t.Errorf("fit over tau %.3g..%.3g: tau^-2 coefficient %.12g, exact -1/4", f.TauMin, f.TauMax, f.Coef[1])
		}
	}
}

// The conformal amplitude against the transforms: the conformal
// self-energy's sine transform (weight M(2D-2)) inverted and transformed
// back (weight M(2D-1)) must return B, i.e.
// B^q = M(2D-1)/(2 pi J^2 M(2D-2)), which is b^q pi = (1/2 - 1/q) tan(pi/q)
// (Maldacena-Stanford arXiv:1604.07818) through Gamma(2D)/Gamma(2D-1) =
// 2D - 1 (DLMF 5.5.1).
func TestConformalAmplitude(t *testing.T) {
	for _, q := range []float64{2, 3, 4, 6.5, 10, 100} {
		d := 1 / q
		j2 := math.Pow(2, q-1) / q
		bq := real(mellinSine(complex(2*d-1, 0))) / (2 * math.Pi * j2 * real(mellinSine(complex(2*d-2, 0))))
		if b := ConformalAmplitude(q); math.Abs(math.Pow(b, q)/bq-1) > 1e-13 {
			t.Errorf("q=%g: B^q = %.17g, from the Mellin weights %.17g", q, math.Pow(b, q), bq)
		}
	}
	// Large q: G_c -> (1/2) tau^{-2/q} (PHYSICS sec. 5, e^g = 1/(1+tau)^2).
	if b := ConformalAmplitude(1e4); math.Abs(b-0.5) > 1e-3 {
		t.Errorf("q = 1e4: B = %.6g, want about 1/2", b)
	}
}

// The correction exponents at q = 4: the semigroup of 1 and h_n - 1 in
// increasing order, h_1 = 3.7735, h_2 = 5.6795 (MS 2016, PHYSICS sec. 4).
func TestSoftModeExponents(t *testing.T) {
	h1, h2 := 3.773536, 5.679459
	got, err := SoftModeExponents([]float64{h1, h2}, 5.6)
	if err != nil {
		t.Fatal(err)
	}
	want := []float64{1, 2, h1 - 1, 3, h1, 4, h2 - 1, h1 + 1, 5, 2*h1 - 2}
	if len(got) != len(want) {
		t.Fatalf("exponents %v, want %v", got, want)
	}
	for i := range want {
		if math.Abs(got[i]-want[i]) > 1e-12 {
			t.Errorf("exponent %d: %.6f, want %.6f", i, got[i], want[i])
		}
	}
	if _, err := SoftModeExponents([]float64{1.5}, 5); !errors.Is(err, ErrInput) {
		t.Errorf("dimension 1.5: %v, want ErrInput", err)
	}
}

// The fits of G/G_c - 1 recover a synthetic model with every q = 4
// exponent up to 16 (coefficients of order one) and round-off-sized noise:
// the combined alpha_G lies within its stated error (spread plus
// statistical) of the model's.
func TestFitAlphaGSynthetic(t *testing.T) {
	dims := []float64{3.773536, 5.679459, 7.631971}
	exps, err := SoftModeExponents(dims, 16)
	if err != nil {
		t.Fatal(err)
	}
	p := ZeroTParams{Q: 4}
	if err := p.fill(); err != nil {
		t.Fatal(err)
	}
	s := &ZeroTSolution{Params: p, B: 1}
	const alpha = 0.1872
	seed := uint64(12345)
	for x := math.Log(1); x < math.Log(1e9); x += p.Step {
		tau := math.Exp(x)
		d := 0.0
		for i, e := range exps {
			c := math.Pow(-0.7, float64(i)) * (1 + 0.1*float64(i%3))
			if i == 0 {
				c = -alpha
			}
			d += c * math.Pow(tau, -e)
		}
		seed = seed*6364136223846793005 + 1442695040888963407
		noise := (float64(seed>>11)/float64(1<<53) - 0.5) * 4e-16 * math.Pow(tau, p.Tilt)
		s.Tau = append(s.Tau, tau)
		s.Ratio = append(s.Ratio, 1+d+noise)
	}
	fits, _, err := FitAlphaG(s, dims)
	if err != nil {
		t.Fatal(err)
	}
	med, spread, stat, err := combineAlphaG(fits)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(med-alpha) > spread+stat || spread+stat > 1e-10 {
		t.Errorf("alpha_G %.15g +- %.1e (spread %.1e, stat %.1e), model %g", med, spread+stat, spread, stat, alpha)
	}
}

// The stated error of alpha_G covers the change under a much coarser solve
// (step 0.08, tilt 0.2, hand-over at 1e20), and E_0 at T = 0 agrees with
// the finite-temperature ladder's (defaultGround, an independent route)
// within the two errors.
func TestZeroTErrorCovers(t *testing.T) {
	dims := conformalDims(t, 4)
	g, err := SolveZeroTGround(ZeroTParams{Q: 4}, dims)
	if err != nil {
		t.Fatal(err)
	}
	coarse, err := SolveZeroT(ZeroTParams{Q: 4, Step: 0.08, Tilt: 0.2, TauPin: 1e20})
	if err != nil {
		t.Fatal(err)
	}
	fits, _, err := FitAlphaG(coarse, dims)
	if err != nil {
		t.Fatal(err)
	}
	var as []float64
	for _, f := range fits {
		if f.Accepted {
			as = append(as, f.AlphaG)
		}
	}
	a, _ := MedianSpread(as)
	if math.Abs(a-g.AlphaG) > g.AlphaGErr {
		t.Errorf("alpha_G %.14g +- %.1e; coarse solve %.14g", g.AlphaG, g.AlphaGErr, a)
	}
	if g.AlphaGErr > 1e-10 {
		t.Errorf("alpha_G error %.1e above 1e-10", g.AlphaGErr)
	}
	lad := defaultGround(t, 4)
	if d := math.Abs(g.E0 - lad.E0); d > g.E0Err+lad.E0Err {
		t.Errorf("E_0: T = 0 %.16g +- %.1e, ladder %.16g +- %.1e", g.E0, g.E0Err, lad.E0, lad.E0Err)
	}
}

// Bad input is an error wrapping ErrInput.
func TestZeroTBadInput(t *testing.T) {
	for _, p := range []ZeroTParams{
		{Q: 1.5}, {Q: math.NaN()}, {Q: math.Inf(1)}, {Q: 4, Step: 0.5}, {Q: 4, Step: -1},
		{Q: 4, TauMin: 1}, {Q: 4, TauPin: 1e5}, {Q: 4, Tilt: 0.9}, {Q: 4, Tol: 1e-30},
	} {
		if _, err := SolveZeroT(p); !errors.Is(err, ErrInput) {
			t.Errorf("SolveZeroT(%+v): %v, want ErrInput", p, err)
		}
	}
	if _, err := SolveZeroTGround(ZeroTParams{Q: 4}, nil); !errors.Is(err, ErrInput) {
		t.Errorf("no dimensions: %v, want ErrInput", err)
	}
}

// BenchmarkSolveZeroTQ4 is one zero-temperature solve at q = 4 with the
// default grid (8192 points).
func BenchmarkSolveZeroTQ4(b *testing.B) {
	for i := 0; i < b.N; i++ {
		if _, err := SolveZeroT(ZeroTParams{Q: 4}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSolveZeroTGroundQ4 is the whole zero-temperature extraction at
// q = 4: four solves and their fits.
func BenchmarkSolveZeroTGroundQ4(b *testing.B) {
	dims := conformalDims(b, 4)
	for i := 0; i < b.N; i++ {
		if _, err := SolveZeroTGround(ZeroTParams{Q: 4}, dims); err != nil {
			b.Fatal(err)
		}
	}
}
