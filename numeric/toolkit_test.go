package numeric

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// ToTime inverts ToFreq to round-off, and ToTimeJump inverts ToFreqJump.
func TestHalfGridRoundTrip(t *testing.T) {
	g, err := NewHalfGrid(7, 96)
	if err != nil {
		t.Fatal(err)
	}
	f := make([]float64, g.M())
	for k := range f {
		f[k] = math.Sin(0.3*g.Tau(k+1)) + 0.1*float64(k%5)
	}
	c, back := make([]float64, g.M()), make([]float64, g.M())
	for _, jump := range []bool{false, true} {
		if jump {
			err = g.ToFreqJump(c, f, 0.7, -1.3)
			if err == nil {
				err = g.ToTimeJump(back, c, 0.7, -1.3)
			}
		} else {
			err = g.ToFreq(c, f)
			if err == nil {
				err = g.ToTime(back, c)
			}
		}
		if err != nil {
			t.Fatal(err)
		}
		for k := range f {
			if d := math.Abs(back[k] - f[k]); d > 1e-14 {
				t.Fatalf("jump %v: point %d: %.17g back as %.17g", jump, k, f[k], back[k])
			}
		}
	}
	if err := g.ToFreq(c[:5], f); !errors.Is(err, ErrInput) {
		t.Errorf("short slice: %v, want ErrInput", err)
	}
	if _, err := NewHalfGrid(0, 8); !errors.Is(err, ErrInput) {
		t.Errorf("beta 0: %v, want ErrInput", err)
	}
}

// The sine coefficients of CoshRatio(a) are exactly 2w/(w^2 + a^2)
// (elementary integral). With the jumps v = 1, d = a^2 at 0+ carried by the
// two models, the discrete transform of CoshRatio(3) must converge to them
// like h^6 at fixed frequency (Euler-Maclaurin for r(tau) sin(w tau): with
// r(0+) = r”(0+) = 0 and r even about beta/2, the first term left is
// h^6 r””(0+)); the plain trapezoid transform only like h^2 (h^2 w r(0+)).
func TestHalfGridJumpTransformOrder(t *testing.T) {
	const beta, a = 10.0, 3.0
	maxErr := func(m int, jump bool) float64 {
		g, err := NewHalfGrid(beta, m)
		if err != nil {
			t.Fatal(err)
		}
		f, c := make([]float64, m), make([]float64, m)
		for k := range f {
			f[k] = CoshRatio(a, g.Tau(k+1), beta)
		}
		if jump {
			err = g.ToFreqJump(c, f, 1, a*a)
		} else {
			err = g.ToFreq(c, f)
		}
		if err != nil {
			t.Fatal(err)
		}
		e := 0.0
		for n := 0; n < 8; n++ { // the low frequencies, fixed as m grows
			e = math.Max(e, math.Abs(c[n]-CoshRatioFreq(a, g.Freq(n))))
		}
		return e
	}
	for _, c := range []struct {
		jump  bool
		order float64
	}{{true, 6}, {false, 2}} {
		e1, e2 := maxErr(256, c.jump), maxErr(512, c.jump)
		if r := math.Log2(e1 / e2); math.Abs(r-c.order) > 0.3 {
			t.Errorf("jump %v: errors %.2e, %.2e: order %.2f, want %g", c.jump, e1, e2, r, c.order)
		}
	}
	if e := maxErr(1024, true); e > 1e-9 {
		t.Errorf("jump transform error %.2e on 1024 points", e)
	}
}

// MatsubaraTails against the direct sums over w_n = (2n+1) pi/beta, with
// the remainders beyond n terms from the midpoint rule.
func TestMatsubaraTails(t *testing.T) {
	for _, c := range []struct{ beta, c float64 }{{10, 1}, {3, 0.4}, {200, 2}} {
		const n = 200000
		var s1, s2 float64
		for k := n - 1; k >= 0; k-- {
			w := float64(2*k+1) * math.Pi / c.beta
			d := w*w + c.c*c.c
			s1 += 2 / d
			s2 += 2 / (d * d)
		}
		// sum_{k>=n} 1/(2k+1)^p ~ int_{n-1/2}^inf dx/(2x+1)^p = 1/(2(p-1)(2n)^(p-1)).
		bp := c.beta / math.Pi
		s1 += 2 * bp * bp / (4 * n)
		s2 += 2 * bp * bp * bp * bp / (6 * 8 * n * n * n)
		g1, g2 := MatsubaraTails(c.beta, c.c)
		if math.Abs(g1-s1) > 1e-9*g1 || math.Abs(g2-s2) > 1e-12*g2 {
			t.Errorf("beta %g c %g: S1 %.15g (sum %.15g), S2 %.15g (sum %.15g)", c.beta, c.c, g1, s1, g2, s2)
		}
	}
}

// The trapezoid rule is exact for a straight line.
func TestTrapezoidLinear(t *testing.T) {
	g, err := NewHalfGrid(6, 12)
	if err != nil {
		t.Fatal(err)
	}
	f := make([]float64, g.M())
	for k := range f {
		f[k] = 2 - 0.5*g.Tau(k+1)
	}
	want := 2*3 - 0.25*9 // int_0^3 (2 - tau/2)
	if got := g.Trapezoid(2, f); math.Abs(got-want) > 1e-14 {
		t.Errorf("trapezoid %.17g, exact %.17g", got, want)
	}
}

// Richardson removes the given powers exactly: v(h) = A + B h^4 + C h^5 on
// h, 2h, 4h gives A to round-off.
func TestRichardsonExactSeries(t *testing.T) {
	const A, B, C, h = 1.25, -3.0, 7.0, 0.1
	v := make([]float64, 3)
	for i := range v {
		x := h * math.Pow(2, float64(i))
		v[i] = A + B*math.Pow(x, 4) + C*math.Pow(x, 5)
	}
	val, e := Richardson(v, []float64{4, 5, 6})
	if math.Abs(val-A) > 1e-14 || e > 1e-3 {
		t.Errorf("Richardson %.17g ± %.1e, exact %g", val, e, A)
	}
	if val, _ := Richardson(nil, []float64{4}); !math.IsNaN(val) {
		t.Errorf("empty input gave %g, want NaN", val)
	}
}

func TestMedianSpread(t *testing.T) {
	for _, c := range []struct {
		v         []float64
		med, half float64
	}{{[]float64{3, 1, 2}, 2, 1}, {[]float64{4, 1, 2, 3}, 2.5, 1.5}, {[]float64{5}, 5, 0}} {
		if m, h := MedianSpread(c.v); m != c.med || h != c.half {
			t.Errorf("%v: %g, %g; want %g, %g", c.v, m, h, c.med, c.half)
		}
	}
	if m, _ := MedianSpread(nil); !math.IsNaN(m) {
		t.Errorf("empty: %g, want NaN", m)
	}
}

// A straight line through exact data at x = 0, 1, 2, 3 with unit errors:
// the fit returns it with chi^2 = 0 and the textbook standard errors
// sqrt(Sxx/D) = sqrt(0.7), sqrt(S/D) = sqrt(0.2), D = S Sxx - Sx^2 = 20.
func TestFitLinearStraightLine(t *testing.T) {
	a := mat.NewDense(4, 2, []float64{1, 0, 1, 1, 1, 2, 1, 3})
	y := []float64{1, 3, 5, 7}
	f, err := FitLinear(a, y, []float64{1, 1, 1, 1})
	if err != nil {
		t.Fatal(err)
	}
	want := Coeffs{Values: []float64{1, 2}, Errors: []float64{math.Sqrt(0.7), math.Sqrt(0.2)}}
	for j := range want.Values {
		if math.Abs(f.Values[j]-want.Values[j]) > 1e-14 || math.Abs(f.Errors[j]-want.Errors[j]) > 1e-14 {
			t.Errorf("parameter %d: %.16g ± %.16g, want %g ± %.16g", j, f.Values[j], f.Errors[j], want.Values[j], want.Errors[j])
		}
	}
	if f.Chi2 > 1e-28 {
		t.Errorf("chi2 %g, want 0", f.Chi2)
	}
	if _, err := FitLinear(a, y, []float64{1, 0, 1, 1}); !errors.Is(err, ErrInput) {
		t.Errorf("zero error: %v, want ErrInput", err)
	}
	if _, err := FitLinear(mat.NewDense(2, 2, []float64{1, 0, 0, 1}), y[:2], []float64{1, 1}); !errors.Is(err, ErrInput) {
		t.Errorf("as many data as parameters: %v, want ErrInput", err)
	}
}
