package conformal

import (
	"errors"
	"math"
	"math/big"
	"testing"

	"qbridge/series"
	"qbridge/series/scalar"
)

// kernelQ4 is the q = 4 closed form k_A(h) = -(3/2) tan(pi(h - 1/2)/2)/(h - 1/2)
// (Maldacena-Stanford 2016, arXiv:1604.07818), independent of the Gamma code.
func kernelQ4(h *big.Float, prec uint) *big.Float {
	u := new(big.Float).SetPrec(prec).Sub(h, big.NewFloat(0.5))
	arg := new(big.Float).SetPrec(prec).Mul(u, scalar.Pi(prec))
	arg.Quo(arg, big.NewFloat(2))
	s, c := scalar.BigSinCos(arg, prec)
	k := new(big.Float).SetPrec(prec).Quo(s, c)
	k.Quo(k, u)
	return k.Mul(k, big.NewFloat(-1.5))
}

func TestDimensionQ4ClosedForm(t *testing.T) {
	q := mustQ(t, "4")
	for n := 0; n <= 12; n++ {
		v, err := Dimension(q, n, 50)
		if err != nil {
			t.Fatal(err)
		}
		k := kernelQ4(v.Value, 400)
		k.Sub(k, big.NewFloat(1))
		if f, _ := k.Float64(); math.Abs(f) > 1e-45 {
			t.Errorf("h_%d = %s: q=4 closed form k_A - 1 = %.2e", n, v.Value.Text('g', 30), f)
		}
		if e, _ := v.Err.Float64(); e > 1e-45 {
			t.Errorf("h_%d error estimate %.1e larger than expected at 50 digits", n, e)
		}
	}
}

// Published q = 4 dimensions (MS 2016 arXiv:1604.07818; Polchinski-Rosenhaus
// arXiv:1601.06768) to the two decimals printed.
func TestDimensionPublishedQ4(t *testing.T) {
	want := []float64{2, 3.77, 5.68, 7.63, 9.60, 11.59}
	for n, w := range want {
		v, err := Dimension(mustQ(t, "4"), n, 20)
		if err != nil {
			t.Fatal(err)
		}
		f, _ := v.Value.Float64()
		if math.Abs(f-w) > 0.005 {
			t.Errorf("h_%d(4) = %.5f, published %.2f", n, f, w)
		}
	}
}

// h_0 = 2 (the soft mode) must come out of the root finder at every q.
func TestSoftModeIsTwo(t *testing.T) {
	for _, q := range []string{"2", "2.000001", "2.5", "3", "4", "7.3", "1000000", "inf"} {
		v, err := Dimension(mustQ(t, q), 0, 40)
		if err != nil {
			t.Fatal(err)
		}
		if d := relDiff(v.Value, big.NewFloat(2)); d > 1e-38 {
			t.Errorf("h_0(q=%s) = %s, want 2", q, v.Value.Text('g', 45))
		}
	}
}

// Limits (PHYSICS.md section 4): h_n -> 2n+2 at q = 2 (free fermion
// bilinears) and h_n -> 2n+1 at q = infinity.
func TestDimensionLimits(t *testing.T) {
	for n := 1; n <= 8; n++ {
		v2, err := Dimension(mustQ(t, "2"), n, 30)
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(v2.Value, big.NewFloat(float64(2*n+2))) > 1e-28 {
			t.Errorf("h_%d(2) = %s, want %d", n, v2.Value.Text('g', 30), 2*n+2)
		}
		vi, err := Dimension(mustQ(t, "inf"), n, 30)
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(vi.Value, big.NewFloat(float64(2*n+1))) > 1e-28 {
			t.Errorf("h_%d(inf) = %s, want %d", n, vi.Value.Text('g', 30), 2*n+1)
		}
	}
}

// Large-q dimensions, MS 2016 (arXiv:1604.07818):
// h_n = 2n + 1 + (2/q)(2n^2+n+1)/(2n^2+n-1) + O(1/q^2): the first two
// coefficients of the 1/q series, and the exact value at q = 10^6.
func TestLargeQFormula(t *testing.T) {
	for n := 1; n <= 8; n++ {
		c, err := DimensionSeries(AroundInf, n, 3, 40)
		if err != nil {
			t.Fatal(err)
		}
		nn := float64(n)
		w := 2 * (2*nn*nn + nn + 1) / (2*nn*nn + nn - 1)
		if relDiff(c.Values[0], big.NewFloat(2*nn+1)) > 1e-38 {
			t.Errorf("n=%d: constant term %s, want %d", n, c.Values[0].Text('g', 20), 2*n+1)
		}
		exact := new(big.Float).SetPrec(300).Quo(big.NewFloat(2*(2*nn*nn+nn+1)), big.NewFloat(2*nn*nn+nn-1))
		if relDiff(c.Values[1], exact) > 1e-38 {
			t.Errorf("n=%d: 1/q coefficient %s, published %v", n, c.Values[1].Text('g', 40), w)
		}
		v, err := Dimension(mustQ(t, "1000000"), n, 30)
		if err != nil {
			t.Fatal(err)
		}
		f, _ := v.Value.Float64()
		if d := math.Abs(f - (2*nn + 1 + 2e-6*w/2)); d > 1e-10 {
			t.Errorf("n=%d: h(q=1e6) = %.15f differs from the O(1/q) formula by %.1e (expected O(1/q^2) = 1e-12)", n, f, d)
		}
	}
}

// The coefficients from Newton's iteration on series agree with a Cauchy
// integral of the complex roots of the unregularised k_A(h) = 1.
func TestDimensionCauchyCrossCheck(t *testing.T) {
	for _, c := range []struct {
		end    End
		n      int
		radius float64
	}{{AroundTwo, 1, 0.2}, {AroundTwo, 3, 0.2}, {AroundInf, 1, 0.08}, {AroundInf, 2, 0.08}} {
		order := 8
		ser, err := DimensionSeries(c.end, c.n, order, 30)
		if err != nil {
			t.Fatal(err)
		}
		cau, err := DimensionCauchy(c.end, c.n, order, c.radius, 64, 30)
		if err != nil {
			t.Fatal(err)
		}
		for k := 0; k <= order; k++ {
			d := new(big.Float).Sub(ser.Values[k], cau[k])
			d.Abs(d)
			// aliasing error ~ c_(k+64) r^64 / r^k (radius of convergence
			// about 0.5 in eps and 0.25 in x); tolerance scaled by r^-k.
			tol := 1e-20 * math.Pow(c.radius, -float64(k))
			if f, _ := d.Float64(); f > tol {
				t.Errorf("%s n=%d k=%d: series %s, Cauchy %s", c.end, c.n, k, ser.Values[k].Text('g', 25), cau[k].Text('g', 25))
			}
		}
	}
}

// Two working precisions agree, and the stated errors are small.
func TestDimensionSeriesErrors(t *testing.T) {
	c, err := DimensionSeries(AroundTwo, 2, 30, 40)
	if err != nil {
		t.Fatal(err)
	}
	for k, e := range c.Errors {
		// relative to max(|c_k|, 1): the odd coefficients vanish
		scale := new(big.Float).Abs(c.Values[k])
		if scale.Cmp(big.NewFloat(1)) < 0 {
			scale.SetInt64(1)
		}
		if f, _ := new(big.Float).Quo(e, scale).Float64(); f > 1e-35 {
			t.Errorf("k=%d: error %.1e at 40 digits", k, f)
		}
	}
	if c.Radius == nil {
		t.Error("no radius estimate")
	}
}

// The stated errors cover the true errors: every coefficient of
// DimensionSeries (the first precision's solve stops without a confirming
// Newton step, the second refines it once) against a solve at three times
// the precision that iterates until the correction is below its precision.
func TestDimensionSeriesErrorsCoverTruth(t *testing.T) {
	for _, end := range []End{AroundTwo, AroundInf} {
		for n := 1; n <= 4; n++ {
			c, err := DimensionSeries(end, n, 30, 30)
			if err != nil {
				t.Fatal(err)
			}
			ref, err := dimensionSeries(end, n, 30, 3*c.Prec)
			if err != nil {
				t.Fatal(err)
			}
			for k, v := range c.Values {
				d := new(big.Float).Sub(v, ref[k])
				d.Abs(d)
				if c.Errors[k].Sign() <= 0 || d.Cmp(c.Errors[k]) > 0 {
					t.Errorf("h_%d around %s, order %d: true error %.2g above the stated %.2g", n, end, k, d, c.Errors[k])
				}
			}
		}
	}
}

// The eps series summed at small eps reproduces the exact dimension.
func TestSeriesAgreesWithExact(t *testing.T) {
	for _, c := range []struct {
		end End
		q   string
	}{{AroundTwo, "2.2"}, {AroundInf, "40"}} {
		ser, err := DimensionSeries(c.end, 1, 30, 30)
		if err != nil {
			t.Fatal(err)
		}
		q := mustQ(t, c.q)
		at := q.Eps(200)
		if c.end == AroundInf {
			at = q.X(200)
		}
		s, _ := series.FromBig(200, ser.Values)
		sum := series.Eval(s, at)
		ex, err := Dimension(q, 1, 30)
		if err != nil {
			t.Fatal(err)
		}
		if d := relDiff(sum, ex.Value); d > 1e-20 {
			t.Errorf("around %s at q=%s: series %s, exact %s", c.end, c.q, sum.Text('g', 25), ex.Value.Text('g', 25))
		}
	}
}

func TestBadInput(t *testing.T) {
	if _, err := ParseQ("1.5", 64); err == nil {
		t.Error("q = 1.5 accepted")
	}
	if _, err := ParseQ("four", 64); err == nil {
		t.Error("q = four accepted")
	}
	if _, err := ParseQ("NaN", 64); err == nil {
		t.Error("q = NaN accepted")
	}
	q := mustQ(t, "4")
	if _, err := Dimension(q, -1, 20); err == nil {
		t.Error("n = -1 accepted")
	}
	if _, err := Dimension(q, 1, 2); err == nil {
		t.Error("digits = 2 accepted")
	}
	if _, err := DimensionSeries(AroundTwo, 1, -3, 20); err == nil {
		t.Error("order -3 accepted")
	}
	if _, err := DimensionSeries(AroundTwo, 1, MaxOrder+1, 20); err == nil {
		t.Error("order above the cap accepted")
	}
	if _, err := Resum("entropy", q, 1, 10, 20); err == nil {
		t.Error("unknown quantity accepted")
	}
	_ = errors.New
}
