package conformal

import (
	"errors"
	"math"
	"math/big"
	"testing"
)

// k_A from Gamma functions against the q = 4 closed form
// -(3/2) tan(pi(h-1/2)/2)/(h-1/2) (Maldacena-Stanford 2016, arXiv:1604.07818),
// and k_A(2) = 1 (the soft mode h_0 = 2, MS 2016) at several q.
func TestKernelA(t *testing.T) {
	q4 := mustQ(t, "4")
	for _, h := range []float64{0.3, 1.7, 2.6, 3.1, 4.4} {
		hb := big.NewFloat(h)
		v, err := KernelA(q4, hb, 30)
		if err != nil {
			t.Fatal(err)
		}
		want := kernelQ4(hb, 200)
		d := new(big.Float).Sub(v.Value, want)
		if f, _ := d.Float64(); math.Abs(f) > 1e-28 {
			t.Errorf("q=4 h=%g: k_A = %s, closed form %s", h, v.Value.Text('g', 30), want.Text('g', 30))
		}
	}
	for _, qs := range []string{"2.5", "3", "6", "10", "137.5"} {
		v, err := KernelA(mustQ(t, qs), big.NewFloat(2), 30)
		if err != nil {
			t.Fatal(err)
		}
		if f, _ := new(big.Float).Sub(v.Value, big.NewFloat(1)).Float64(); math.Abs(f) > 1e-28 {
			t.Errorf("q=%s: k_A(2) - 1 = %.2e", qs, f)
		}
	}
}

// k_A'(2): the closed form against the digamma form and against a
// five-point central difference of k_A (step 1e-6, truncation ~1e-24);
// at q = 4 against -pi - 2/3, the derivative of the MS closed form
// -(3/2) tan(pi u/2)/u at u = 3/2 (pi/2 sec^2(3pi/4)/u - tan(3pi/4)/u^2 =
// 2pi/3 + 4/9, times -3/2); and the large-q limit -3/2, the slope of
// k_A = 2/(h(h-1)) at h = 2 (MS 2016 sec. 3), approached like 1/q.
func TestKernelASlopeAtTwo(t *testing.T) {
	two := big.NewFloat(2)
	for _, qs := range []string{"2.5", "3", "4", "6", "8", "10", "100"} {
		q := mustQ(t, qs)
		c, err := KernelASlopeAtTwo(q, 30)
		if err != nil {
			t.Fatal(err)
		}
		dg, err := KernelASlope(q, two, 30)
		if err != nil {
			t.Fatal(err)
		}
		if f, _ := new(big.Float).Sub(c.Value, dg.Value).Float64(); math.Abs(f) > 1e-27 {
			t.Errorf("q=%s: closed form %s, digamma form %s", qs, c.Value.Text('g', 30), dg.Value.Text('g', 30))
		}
		hstep := bigFrac(1, 1000000, 200)
		var ks [4]*big.Float
		for i, o := range []int64{-2, -1, 1, 2} {
			h := new(big.Float).SetPrec(200).Mul(hstep, bigInt(o, 200))
			h.Add(h, two)
			v, err := KernelA(q, h, 40)
			if err != nil {
				t.Fatal(err)
			}
			ks[i] = v.Value
		}
		f := func(x *big.Float) float64 { v, _ := x.Float64(); return v }
		// (8(k_1 - k_-1) - (k_2 - k_-2)) / (12 h), evaluated in big.Float.
		d := new(big.Float).SetPrec(200).Sub(ks[2], ks[1])
		d.Mul(d, big.NewFloat(8))
		d.Sub(d, new(big.Float).SetPrec(200).Sub(ks[3], ks[0]))
		d.Quo(d, new(big.Float).SetPrec(200).Mul(hstep, big.NewFloat(12)))
		if diff := math.Abs(f(d) - f(c.Value)); diff > 1e-18*math.Max(1, math.Abs(f(c.Value))) {
			t.Errorf("q=%s: finite difference %.20g, closed form %.20g", qs, f(d), f(c.Value))
		}
	}
	c, err := KernelASlopeAtTwo(mustQ(t, "4"), 30)
	if err != nil {
		t.Fatal(err)
	}
	if f, _ := c.Value.Float64(); math.Abs(f-(-math.Pi-2.0/3)) > 1e-15 {
		t.Errorf("q=4: k_A'(2) = %.17g, want -pi - 2/3", f)
	}
	inf, err := KernelASlopeAtTwo(QPoint{Inf: true}, 30)
	if err != nil {
		t.Fatal(err)
	}
	if f, _ := inf.Value.Float64(); f != -1.5 {
		t.Errorf("q=inf: k_A'(2) = %g, want -3/2", f)
	}
	var prev float64
	for i, qs := range []string{"1e4", "1e5", "1e6"} {
		v, err := KernelASlopeAtTwo(mustQ(t, qs), 30)
		if err != nil {
			t.Fatal(err)
		}
		f, _ := v.Value.Float64()
		q, _ := new(big.Float).SetString(qs)
		qf, _ := q.Float64()
		dev := (f + 1.5) * qf
		if math.Abs(f+1.5) > 10/qf {
			t.Errorf("q=%s: k_A'(2) = %.17g, not within 10/q of -3/2", qs, f)
		}
		if i > 0 && math.Abs(dev-prev) > 1e-3*math.Abs(prev) {
			t.Errorf("q=%s: q (k_A'(2) + 3/2) = %.10g, at the previous q %.10g: not a 1/q approach", qs, dev, prev)
		}
		prev = dev
	}
	// Digamma form at q = infinity: slope of 2/(h(h-1)) at h = 3.3.
	v, err := KernelASlope(QPoint{Inf: true}, big.NewFloat(3.3), 30)
	if err != nil {
		t.Fatal(err)
	}
	if f, _ := v.Value.Float64(); math.Abs(f-(-2*(2*3.3-1)/math.Pow(3.3*2.3, 2))) > 1e-15 {
		t.Errorf("q=inf: k_A'(3.3) = %.17g", f)
	}
	if _, err := KernelASlopeAtTwo(mustQ(t, "2"), 30); !errors.Is(err, ErrNoSlope) {
		t.Errorf("q=2: %v, want ErrNoSlope", err)
	}
}
