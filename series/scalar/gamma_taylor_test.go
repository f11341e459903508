package scalar

import (
	"errors"
	"fmt"
	"math/big"
	"testing"
)

func TestLogGammaTaylorGolden(t *testing.T) {
	// Reference: mpmath loggamma, psi(0, x0) and (-1)^k zeta(k, x0)/k
	// (testdata/gen_special.py).
	g := loadGolden(t)
	const prec, bits = 256, 248
	for _, c := range g.LGTaylor {
		got, err := LogGammaTaylor(parseBig(t, c.X0, prec), len(c.C), prec)
		if err != nil {
			t.Fatal(err)
		}
		for k, w := range c.C {
			checkClose(t, fmt.Sprintf("c_%d at %s", k, c.X0), got[k], w, bits)
		}
	}
}

func TestLogGammaTaylorNegativePoint(t *testing.T) {
	// At x0 = -2.25 (reflection path) the series must agree with the
	// recurrence log|Gamma(x)| = log Gamma(x+3) - log|x (x+1) (x+2)|
	// (DLMF 5.5.1), expanded with the series at 0.75 and the exact
	// log-series of the three linear factors.
	const prec = 300
	x0 := parseBig(t, "-2.25", prec)
	n := 25
	got, err := LogGammaTaylor(x0, n, prec)
	if err != nil {
		t.Fatal(err)
	}
	base, err := LogGammaTaylor(parseBig(t, "0.75", prec), n, prec)
	if err != nil {
		t.Fatal(err)
	}
	for k := 1; k < n; k++ {
		want := new(big.Float).SetPrec(prec).Set(base[k])
		for j := 0; j < 3; j++ {
			// log|a + t| = log|a| + sum_k (-1)^(k+1) t^k / (k a^k)
			a := new(big.Float).SetPrec(prec).Add(x0, big.NewFloat(float64(j)))
			p := powIntFloat(a, int64(k), prec)
			p.Mul(p, big.NewFloat(float64(k)))
			term := new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), p)
			if k%2 == 0 {
				term.Neg(term)
			}
			want.Sub(want, term)
		}
		if !closeTo(got[k], want, 280) {
			t.Errorf("c_%d at -2.25: %s, want %s", k, got[k].Text('g', 30), want.Text('g', 30))
		}
	}
}

func TestGammaTaylorBadInput(t *testing.T) {
	if _, err := LogGammaTaylor(big.NewFloat(-2), 5, 64); !errors.Is(err, ErrPole) {
		t.Errorf("LogGammaTaylor at -2: err = %v, want ErrPole", err)
	}
	if _, err := LogGammaTaylor(big.NewFloat(0.5), -1, 64); !errors.Is(err, ErrLength) {
		t.Errorf("negative length: err = %v, want ErrLength", err)
	}
	if _, err := DigammaTaylor(big.NewFloat(0.5), 3, 0); !errors.Is(err, ErrPrec) {
		t.Errorf("zero precision: err = %v, want ErrPrec", err)
	}
	if _, err := GammaTaylor(big.NewFloat(-3), 4, 64); !errors.Is(err, ErrPole) {
		t.Errorf("GammaTaylor at a pole: err = %v", err)
	}
	// 1/Gamma is entire: its Taylor series at a pole is the pole series.
	r, err := RGammaTaylor(big.NewFloat(-3), 4, 64)
	if err != nil || r[0].Sign() != 0 || !closeTo(r[1], big.NewFloat(-6), 60) {
		t.Errorf("RGammaTaylor at -3: %v, %v; want 0 - 6 t + ...", r, err)
	}
}
