package conformal

import (
	"math/big"
	"testing"
)

// Near the ends h_n is summed from its Taylor series (nearEnd); just
// outside that band the bracketing root finder still works. Where both
// work they must agree: here at eps = 2e-3 and x = 2e-3, where the root
// finder is used, against the series summed at the same point. An
// independent check of the root finder itself is the mpmath golden file
// (golden_test.go).
func TestDimensionNearEndAgreesWithRoot(t *testing.T) {
	const prec = 200
	for _, n := range []int{1, 2, 3} {
		for _, end := range []End{AroundTwo, AroundInf} {
			tpt := big.NewFloat(2e-3)
			var q QPoint
			if end == AroundTwo {
				// q = 2/(1 - eps)
				d := new(big.Float).SetPrec(prec).Sub(big.NewFloat(1), tpt)
				q = QPoint{Q: new(big.Float).SetPrec(prec).Quo(big.NewFloat(2), d)}
			} else {
				q = QPoint{Q: new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), tpt)}
			}
			root, err := dimensionExact(q, n, prec)
			if err != nil {
				t.Fatal(err)
			}
			tt := q.Eps(prec)
			if end == AroundInf {
				tt = q.X(prec)
			}
			sum, err := dimensionNearEnd(end, n, tt, prec)
			if err != nil {
				t.Fatal(err)
			}
			d := new(big.Float).Sub(root, sum)
			if d.Sign() != 0 && d.MantExp(nil) > -150 {
				t.Errorf("n=%d end=%v: root %s, series %s", n, end, root.Text('g', 40), sum.Text('g', 40))
			}
		}
	}
}

// Edge points of the advertised range: q = 2 + 1e-15, 2 + 1e-30, 1e30,
// 1e300. The limits are h_n -> 2n+2 at q = 2 and 2n+1 at q = infinity
// (PHYSICS sec. 4); the leading corrections are h_1 = 4 - (5/6) eps^2
// (eps-series, closed form found by PSLQ and checked against mpmath in
// golden_test.go) and h_n = 2n+1 + (2/q)(2n^2+n+1)/(2n^2+n-1) (MS 2016,
// arXiv:1604.07818).
func TestDimensionEdges(t *testing.T) {
	cases := []struct {
		q      string
		n      int
		want   float64
		within float64
	}{
		{"2.000000000000001", 1, 4, 1e-29},
		{"2.000000000000000000000000000001", 2, 6, 1e-50},
		{"1e30", 1, 3 + 4e-30, 1e-45},
		{"1e300", 3, 7, 1e-299},
	}
	for _, c := range cases {
		q, err := ParseQ(c.q, 256)
		if err != nil {
			t.Fatal(err)
		}
		v, err := Dimension(q, c.n, 30)
		if err != nil {
			t.Fatalf("q = %s: %v", c.q, err)
		}
		f, _ := v.Value.Float64()
		if d := f - c.want; d > c.within+1e-15*c.want || d < -c.within-1e-15*c.want {
			t.Errorf("h_%d(%s) = %s, want %g", c.n, c.q, v.Value.Text('g', 30), c.want)
		}
		for _, fn := range []func(QPoint, int) (*Value, error){B, S0} {
			w, err := fn(q, 30)
			if err != nil {
				t.Errorf("q = %s: %v", c.q, err)
				continue
			}
			if w.Err == nil || w.Err.Sign() <= 0 || w.Err.IsInf() {
				t.Errorf("q = %s %s: error %v", c.q, w.Quantity, w.Err)
			}
		}
	}
}

// The zero value QPoint{} and a q below 2 are refused with an error, not a
// panic, by every entry point that takes a point.
func TestBadPoints(t *testing.T) {
	for _, q := range []QPoint{{}, {Q: big.NewFloat(1.5)}} {
		if _, err := Dimension(q, 1, 20); err == nil {
			t.Errorf("Dimension(%v): no error", q)
		}
		if _, err := B(q, 20); err == nil {
			t.Errorf("B(%v): no error", q)
		}
		if _, err := S0(q, 20); err == nil {
			t.Errorf("S0(%v): no error", q)
		}
		if _, err := Resum(QuantityS0, q, 0, 4, 20); err == nil {
			t.Errorf("Resum(%v): no error", q)
		}
		_ = q.String()
		_ = q.IsTwo()
	}
}
