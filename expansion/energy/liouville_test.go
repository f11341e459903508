package energy

import (
	"math"
	"math/big"
	"testing"

	"qbridge/series/scalar"
)

// The leading large-q ground-state data (Maldacena-Stanford
// arXiv:1604.07818 sec. 2.4 and 4; PHYSICS.md sec. 5): E_0 = -1/q^2,
// S_0 = (1/2) log 2 - pi^2/(4 q^2), alpha_S = 1/(4 q^2); S_0 also against
// Kitaev's exact formula (ExactS0InvQ, coefficient of x^2).
func TestLiouvilleExpansionPublished(t *testing.T) {
	const prec = 200
	l, err := LiouvilleExpansion(10, prec)
	if err != nil {
		t.Fatal(err)
	}
	pi := scalar.Pi(prec)
	s0 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	s0.Quo(s0, big.NewFloat(-4))
	exact, err := ExactS0InvQ(2, prec)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want *big.Float
	}{
		{"E_0", l.E0, big.NewFloat(-1)},
		{"S_0", l.S0, s0},
		{"S_0 vs Kitaev", l.S0, exact.Coeff(2)},
		{"alpha_S", l.AlphaS, big.NewFloat(0.25)},
	} {
		d := new(big.Float).Sub(c.got, c.want)
		if d.Abs(d).Cmp(big.NewFloat(1e-55)) > 0 {
			t.Errorf("%s = %s, want %s", c.name, c.got.Text('g', 40), c.want.Text('g', 40))
		}
	}
	if len(l.Tail) != 9 {
		t.Errorf("%d tail coefficients, want 9", len(l.Tail))
	}
}

// closedLiouville returns log Z_2 and E_2 = -d log Z_2/d beta from the
// closed form (PHYSICS.md sec. 5), written in eta = 1 - v (liouvilleEta) so
// that no digits are lost at low temperature, where eta ~ 2/beta.
func closedLiouville(beta float64) (logZ, e float64) {
	eta := liouvilleEta(beta)
	v := 1 - eta
	s, c := math.Sincos(math.Pi * eta / 2)
	cot := c / s // tan(pi v/2)
	logZ = math.Pi*v*cot - math.Pi*math.Pi*v*v/4
	// d/d eta of log Z_2 and of beta = pi v / sin(pi eta/2), then the chain rule.
	dL := -math.Pi*cot - math.Pi*v*(math.Pi/2)/(s*s) + math.Pi*math.Pi*v/2
	db := -math.Pi/s - math.Pi*v*(math.Pi/2)*c/(s*s)
	return logZ, -dL / db
}

// The series summed at low temperature against the closed form itself
// (closedLiouville): the truncation error of 12 terms at beta = 200 is far
// below the float64 rounding of the closed form.
func TestLiouvilleExpansionSums(t *testing.T) {
	l, err := LiouvilleExpansion(12, 128)
	if err != nil {
		t.Fatal(err)
	}
	for _, beta := range []float64{200, 1000, 5000} {
		e0, _ := l.E0.Float64()
		s0, _ := l.S0.Float64()
		sum := -beta*e0 + s0
		for k, c := range l.Tail {
			cf, _ := c.Float64()
			sum += cf * math.Pow(beta, -float64(k+1))
		}
		want, _ := closedLiouville(beta)
		if d := math.Abs(sum - want); d > 1e-14*beta {
			t.Errorf("beta=%g: series %.17g, closed form %.17g (diff %.1e)", beta, sum, want, d)
		}
	}
}

func TestLiouvilleExpansionInput(t *testing.T) {
	for _, c := range []struct {
		terms int
		prec  uint
	}{{2, 128}, {-1, 128}, {5, 0}} {
		if _, err := LiouvilleExpansion(c.terms, c.prec); err == nil {
			t.Errorf("terms %d, prec %d: no error", c.terms, c.prec)
		}
	}
}
