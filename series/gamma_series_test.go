package series

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

func TestGammaSeriesIdentities(t *testing.T) {
	const prec = 340 // 100 digits
	for _, x0 := range []string{"0.25", "3.5", "-1.5"} {
		s, err := Variable(20, prec, parseBig(t, x0, prec))
		if err != nil {
			t.Fatal(err)
		}
		lg, err := LogGamma(s)
		if err != nil {
			t.Fatal(err)
		}
		g, err := Gamma(s)
		if err != nil {
			t.Fatal(err)
		}
		rg, err := RGamma(s)
		if err != nil {
			t.Fatal(err)
		}
		// |Gamma| = exp(log|Gamma|), with the series exponential by the
		// O(n^2) recurrence (exact identity exp(log f) = f).
		e, _ := specialExpSeries(lg.c, BigExp(lg.c[0], prec), prec)
		prod := Mul(g, rg) // Gamma * (1/Gamma) = 1
		for k := 0; k < 20; k++ {
			ak := new(big.Float).Set(g.c[k]) // the series of |Gamma| = sign(Gamma(x0)) Gamma
			if g.c[0].Sign() < 0 {
				ak.Neg(ak)
			}
			if !closeTo(e[k], ak, 320) {
				t.Errorf("x0=%s: exp(LogGamma)_%d = %s, |Gamma|_%d = %s", x0, k, e[k].Text('g', 25), k, ak.Text('g', 25))
			}
			want := new(big.Float)
			if k == 0 {
				want.SetInt64(1)
			}
			// absolute check, scaled by the size of the Gamma coefficients
			d := new(big.Float).SetPrec(prec).Sub(prod.c[k], want)
			if d.Sign() != 0 && d.MantExp(nil) > g.c[k].MantExp(nil)+rg.c[0].MantExp(nil)-320 {
				t.Errorf("x0=%s: (Gamma/Gamma)_%d = %s", x0, k, prod.c[k].Text('g', 10))
			}
		}
	}
}

func TestDigammaAndPolygammaSeries(t *testing.T) {
	// Coefficient k of psi^(m)(x0+t) is psi^(m+k)(x0)/k! (Taylor), checked
	// against BigPolygamma; and Digamma(s) is the derivative of LogGamma(s).
	const prec = 200
	x0 := parseBig(t, "1.7", prec)
	s, _ := Variable(8, prec, x0)
	for m := 0; m <= 2; m++ {
		ps, err := Polygamma(m, s)
		if err != nil {
			t.Fatal(err)
		}
		fact := big.NewFloat(1)
		for k := 0; k < 8; k++ {
			if k > 0 {
				fact.Mul(fact, big.NewFloat(float64(k)))
			}
			v, err := BigPolygamma(m+k, x0, prec)
			if err != nil {
				t.Fatal(err)
			}
			v.Quo(v, fact)
			if !closeTo(ps.c[k], v, 190) {
				t.Errorf("psi^(%d) series coefficient %d = %s, want %s", m, k, ps.c[k].Text('g', 20), v.Text('g', 20))
			}
		}
	}
	d, err := Digamma(s)
	if err != nil {
		t.Fatal(err)
	}
	lg, _ := LogGamma(s)
	for k := 0; k < 7; k++ {
		want := new(big.Float).SetPrec(prec).Mul(lg.c[k+1], big.NewFloat(float64(k+1)))
		if !closeTo(d.c[k], want, 190) {
			t.Errorf("Digamma_%d != (k+1) LogGamma_{k+1}", k)
		}
	}
}

func TestLogGammaSeriesComposition(t *testing.T) {
	// Non-linear argument: LogGamma(s) with s = 1/2 + t + t^2 against the
	// golden Taylor coefficients at 1/2 composed by hand (exact algebra):
	// c0 + c1 (t + t^2) + c2 (t + t^2)^2 + ... up to t^3.
	g := loadGolden(t)
	const prec = 200
	s, _ := FromFloat64(prec, 0.5, 1, 1, 0)
	lg, err := LogGamma(s)
	if err != nil {
		t.Fatal(err)
	}
	c := make([]*big.Float, 4)
	for k := range c {
		c[k] = parseBig(t, g.LGTaylor[1].C[k], prec)
	}
	// (t+t^2)^2 = t^2 + 2t^3, (t+t^2)^3 = t^3
	want3 := new(big.Float).SetPrec(prec).Mul(c[2], big.NewFloat(2))
	want3.Add(want3, c[3])
	want2 := new(big.Float).SetPrec(prec).Add(c[1], c[2])
	if !closeTo(lg.c[2], want2, 190) || !closeTo(lg.c[3], want3, 190) {
		t.Errorf("composition: got %s, %s", lg.c[2].Text('g', 20), lg.c[3].Text('g', 20))
	}
}

func TestGammaSeriesBadInput(t *testing.T) {
	if _, err := LogGammaTaylor(big.NewFloat(-2), 5, 64); !errors.Is(err, ErrPole) {
		t.Errorf("LogGammaTaylor at -2: err = %v, want ErrPole", err)
	}
	if _, err := LogGammaTaylor(big.NewFloat(0.5), -1, 64); !errors.Is(err, ErrLength) {
		t.Errorf("negative length: err = %v, want ErrLength", err)
	}
	if _, err := DigammaTaylor(big.NewFloat(0.5), 3, 0); !errors.Is(err, ErrPrec) {
		t.Errorf("zero precision: err = %v, want ErrPrec", err)
	}
	s, _ := Variable(4, 64, big.NewFloat(-3))
	if _, err := Gamma(s); !errors.Is(err, ErrPole) {
		t.Errorf("Gamma series at a pole: err = %v", err)
	}
	if _, err := LogGamma(s); !errors.Is(err, ErrPole) {
		t.Errorf("LogGamma series at a pole: err = %v", err)
	}
	if _, err := Polygamma(-1, s); err == nil {
		t.Error("Polygamma(-1): want error")
	}
	if _, err := LogGamma(nil); err == nil {
		t.Error("LogGamma(nil): want error")
	}
	// 1/Gamma is entire: its series at a pole is the pole series.
	r, err := RGamma(s)
	if err != nil || r.c[0].Sign() != 0 || !closeTo(r.c[1], big.NewFloat(-6), 60) {
		t.Errorf("RGamma series at -3: %v, %v; want 0 - 6 t + ...", r, err)
	}
}
