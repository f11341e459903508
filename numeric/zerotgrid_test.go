package numeric

import (
	"math"
	"math/cmplx"
	"testing"
)

// logGammaC against handbook values: the real line (math.Lgamma), and the
// moduli on two vertical lines, |Gamma(1+iy)|^2 = pi y/sinh(pi y) and
// |Gamma(1/2+iy)|^2 = pi/cosh(pi y) (DLMF 5.4.3, 5.4.4).
func TestLogGammaC(t *testing.T) {
	for _, x := range []float64{0.1, 0.5, 1, 1.7, 3.2, 11.5, 30} {
		want, _ := math.Lgamma(x)
		if got := real(logGammaC(complex(x, 0))); math.Abs(got-want) > 5e-15*math.Max(1, math.Abs(want)) {
			t.Errorf("log Gamma(%g) = %.17g, want %.17g", x, got, want)
		}
	}
	for _, y := range []float64{0.3, 1, 4, 15, 40} {
		got := 2 * real(logGammaC(complex(1, y)))
		want := math.Log(math.Pi * y / math.Sinh(math.Pi*y))
		if d := math.Abs(got - want); d > 1e-14*math.Max(1, math.Abs(want)) {
			t.Errorf("log|Gamma(1+%gi)|^2 = %.17g, want %.17g", y, got, want)
		}
		got = 2 * real(logGammaC(complex(0.5, y)))
		want = math.Log(math.Pi / math.Cosh(math.Pi*y))
		if d := math.Abs(got - want); d > 1e-14*math.Max(1, math.Abs(want)) {
			t.Errorf("log|Gamma(1/2+%gi)|^2 = %.17g, want %.17g", y, got, want)
		}
	}
}

// mellinSine at points with closed forms: int_0^inf sin(t) t^{-1/2} dt =
// sqrt(pi/2) (Fresnel, DLMF 7.7.?; equivalently Gamma(1/2) cos(pi/4)),
// int sin(t)/t dt = pi/2 (the removable point s = -1, approached from
// nearby s as well), and Gamma(1+s) cos(pi s/2) on the real line.
func TestMellinSine(t *testing.T) {
	cases := []struct {
		s    complex128
		want complex128
	}{
		{-0.5, complex(math.Sqrt(math.Pi/2), 0)},
		{-1, complex(math.Pi/2, 0)},
		{-1 + 1e-9, complex(math.Pi/2, 0)},
		{-1.5, complex(math.Gamma(-0.5)*math.Cos(-0.75*math.Pi), 0)},
		{-0.2, complex(math.Gamma(0.8)*math.Cos(-0.1*math.Pi), 0)},
	}
	for _, c := range cases {
		if got := mellinSine(c.s); cmplx.Abs(got-c.want) > 1e-14*cmplx.Abs(c.want)+1e-9*boolF(real(c.s) != -1 && imag(c.s) == 0 && math.Abs(real(c.s)+1) < 1e-6) {
			t.Errorf("M(%v) = %v, want %v", c.s, got, c.want)
		}
	}
}

func boolF(b bool) float64 {
	if b {
		return 1
	}
	return 0
}

// The log-grid sine transform against closed forms (Gradshteyn-Ryzhik
// 3.893.1 and 3.723.3; DLMF 1.14): int sin(w t) e^{-t} dt = w/(1+w^2), and
// int sin(w t) t/(1+t^2) dt = (pi/2) e^{-w}, whose 1/t tail is the hard
// case of a power law. The second one is also run back from the frequency
// grid: the same call is the inverse direction. The transform is exact in
// the tilted variables up to round-off (the Mellin weights carry the
// float64 error of the complex Gamma function, a few 1e-15), so the errors
// are measured there, against the largest tilted value (about 1).
func TestLogGridSine(t *testing.T) {
	const p = -0.5
	// e^{-tau}: tilted ends tau^{0.5} -> 1e-20 and 0.
	g, err := NewLogGrid(1e-40, 0.05, 4096)
	if err != nil {
		t.Fatal(err)
	}
	check := func(name string, src []float64, want func(x float64) float64, at func(int) float64) {
		t.Helper()
		dst := make([]float64, len(src))
		if err := g.SineTransform(dst, src, p); err != nil {
			t.Fatal(err)
		}
		worst, top := 0.0, 0.0
		for j := range dst {
			x := at(j)
			w := want(x) * math.Pow(x, 1+p)
			worst = math.Max(worst, math.Abs(dst[j]-w))
			top = math.Max(top, math.Abs(w))
		}
		if worst > 1e-14*top {
			t.Errorf("%s: worst error %.3g in the tilted output (largest value %.3g)", name, worst, top)
		}
	}
	src := make([]float64, g.N())
	for k := range src {
		tk := g.Tau(k)
		src[k] = math.Exp(-tk) * math.Pow(tk, -p)
	}
	check("e^{-tau}", src, func(w float64) float64 { return w / (1 + w*w) }, g.Freq)
	// tau/(1+tau^2) on a grid centred at 1: tilted ends ~1e-20.
	if g, err = NewLogGrid(1e-40, 80*math.Ln10/4095, 4096); err != nil {
		t.Fatal(err)
	}
	for k := range src {
		tk := g.Tau(k)
		src[k] = tk / (1 + tk*tk) * math.Pow(tk, -p)
	}
	check("tau/(1+tau^2)", src, func(w float64) float64 { return math.Pi / 2 * math.Exp(-w) }, g.Freq)
	// Back: int sin(w t) e^{-w} dw = t/(1+t^2).
	for j := range src {
		w := g.Freq(j)
		src[j] = math.Exp(-w) * math.Pow(w, -p)
	}
	check("back to tau/(1+tau^2)", src, func(t float64) float64 { return t / (1 + t*t) }, g.Tau)
	if err := g.SineTransform(src, src, 0.1); err == nil {
		t.Error("tilt 0.1 accepted")
	}
	if _, err := NewLogGrid(0, 0.1, 64); err == nil {
		t.Error("tau_min 0 accepted")
	}
}
