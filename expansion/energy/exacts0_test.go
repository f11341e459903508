package energy

import (
	"math"
	"testing"
)

// Taylor coefficients of S_0 from mpmath 1.3.0:
// mpmath.taylor(lambda e: quad(lambda u: pi*u*cot(pi*u), [0, e/2]), 0, 7) and
// mpmath.taylor(lambda x: log(2)/2 - quad(lambda t: pi*(0.5-t)*tan(pi*t), [0, x]), 0, 7), 30 digits.
func TestExactS0Series(t *testing.T) {
	cases := []struct {
		name string
		f    func(int, uint) ([]float64, error)
		want []float64
	}{
		{"eps", func(n int, p uint) ([]float64, error) { return floats(ExactS0Eps(n, p)) }, mpmathS0Eps},
		{"1/q", func(n int, p uint) ([]float64, error) { return floats(ExactS0InvQ(n, p)) }, mpmathS0InvQ},
	}
	for _, c := range cases {
		got, err := c.f(len(c.want)-1, 128)
		if err != nil {
			t.Fatal(err)
		}
		for k, w := range c.want {
			if math.Abs(got[k]-w) > 1e-14*(1+math.Abs(w)) {
				t.Errorf("%s order %d: %.17g, mpmath %.17g", c.name, k, got[k], w)
			}
		}
	}
}

var (
	mpmathS0Eps  = []float64{0, 0.5, 0, -0.13707783890401886971, 0, -0.013529040421389227394, 0, -0.0022708550490724311154}
	mpmathS0InvQ = []float64{0.34657359027997265471, 0, -2.4674011002723396547, 3.2898681336964528729,
		-4.0587121264167682182, 6.4939394022668291491, -10.682102150836715967, 18.312175115720084515}
)
