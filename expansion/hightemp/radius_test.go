package hightemp

import (
	"math"
	"math/big"
	"testing"
)

// The ratio method's stated error must cover the true distance to the
// singularity where that is known exactly:
//   - q = 2: log cosh(beta E/2) is singular at beta E = i pi, nearest for the
//     semicircle edge E = 2 script-J, so t_c = -pi^2/4;
//   - q = infinity (the 1/q^2 part): beta script-J = 2y/cos y stops being
//     invertible where cos y + y sin y = 0, y = i s with s tanh s = 1, so
//     t_c = -4 s^2/cosh^2 s.
func TestRadiusCoversExact(t *testing.T) {
	s := 1.2
	for range 50 { // Newton on s tanh s = 1
		f := s*math.Tanh(s) - 1
		df := math.Tanh(s) + s/(math.Cosh(s)*math.Cosh(s))
		s -= f / df
	}
	largeQ := -4 * s * s / (math.Cosh(s) * math.Cosh(s))
	q2 := -math.Pi * math.Pi / 4
	semi := func(K int) []*big.Rat { return semicircleCoefficients(K) }
	big2 := func(K int) []*big.Rat { return largeQCoefficients(K) }
	cases := []struct {
		name  string
		coefs func(int) []*big.Rat
		exact float64
	}{{"q=2", semi, q2}, {"q=inf", big2, largeQ}}
	for _, c := range cases {
		for _, K := range []int{12, 20, 30} {
			r := Radius(c.coefs(K), 256)
			if r.T == nil {
				t.Fatalf("%s K=%d: %s", c.name, K, r.Reason)
			}
			v, _ := r.T.Float64()
			e, _ := r.TErr.Float64()
			trueErr := math.Abs(v - c.exact)
			t.Logf("%s K=%d: t_c = %.12f +- %.2g (exact %.12f, true error %.2g)", c.name, K, v, e, c.exact, trueErr)
			if trueErr > e {
				t.Errorf("%s K=%d: stated error %.3g does not cover the true error %.3g", c.name, K, e, trueErr)
			}
			if e > 0.05*math.Abs(c.exact) && K >= 30 {
				t.Errorf("%s K=%d: error %.3g is useless", c.name, K, e)
			}
		}
	}
}

func TestRadiusRefuses(t *testing.T) {
	a := make([]*big.Rat, 12)
	for k := range a {
		a[k] = big.NewRat(int64(k%3)-1, int64(k+1))
	}
	if r := Radius(a, 128); r.T != nil || r.Reason == "" {
		t.Errorf("irregular signs gave a radius %v", r.T)
	}
	if r := Radius(a[:4], 128); r.T != nil || r.Reason == "" {
		t.Errorf("four coefficients gave a radius")
	}
}

// Where no exact point is known, the estimate from 30 coefficients must
// hold against the one from 60, whose own error is far smaller.
func TestRadiusStableInOrder(t *testing.T) {
	if testing.Short() {
		t.Skip("order-60 solves")
	}
	for _, q := range []int64{3, 4, 6} {
		lo, err := Solve(big.NewRat(q, 1), 30)
		if err != nil {
			t.Fatal(err)
		}
		hi, err := Solve(big.NewRat(q, 1), 60)
		if err != nil {
			t.Fatal(err)
		}
		a, b := Radius(lo.A, 256), Radius(hi.A, 256)
		if a.T == nil || b.T == nil {
			t.Fatalf("q = %d: no radius (%s / %s)", q, a.Reason, b.Reason)
		}
		d := new(big.Float).Sub(a.T, b.T)
		d.Abs(d)
		if d.Cmp(new(big.Float).Add(a.TErr, b.TErr)) > 0 {
			t.Errorf("q = %d: t_c(30) = %s +- %s, t_c(60) = %s +- %s", q, a.T.Text('g', 15), a.TErr.Text('g', 2), b.T.Text('g', 15), b.TErr.Text('g', 2))
		}
	}
}
