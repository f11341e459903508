package special

import (
	"encoding/json"
	"errors"
	"math/big"
	"os"
	"testing"

	"qbridge/series"
	"qbridge/series/scalar"
)

// parseBig parses a decimal string at prec bits; it fails the test on error.
func parseBig(t testing.TB, s string, prec uint) *big.Float {
	t.Helper()
	v, _, err := big.ParseFloat(s, 10, prec, big.ToNearestEven)
	if err != nil {
		t.Fatalf("parse %q: %v", s, err)
	}
	return v
}

// closeTo reports whether got agrees with want to bits relative bits (or
// absolutely, when want is zero).
func closeTo(got, want *big.Float, bits int) bool {
	if got == nil || want == nil {
		return false
	}
	d := new(big.Float).SetPrec(got.Prec()+64).Sub(got, want)
	if d.Sign() == 0 {
		return true
	}
	if want.Sign() == 0 {
		return d.MantExp(nil) <= -bits
	}
	return d.MantExp(nil)-want.MantExp(nil) <= -bits
}

// lgTaylorGolden is the log Gamma Taylor part of special_golden.json,
// written by testdata/gen_special.py (mpmath 1.3.0 at 80 digits).
type lgTaylorGolden struct {
	LGTaylor []struct {
		X0 string   `json:"x0"`
		C  []string `json:"c"`
	} `json:"loggamma_taylor"`
}

func loadGolden(t *testing.T) *lgTaylorGolden {
	t.Helper()
	b, err := os.ReadFile("../../testdata/special_golden.json")
	if err != nil {
		t.Fatalf("golden file: %v (regenerate with testdata/gen_special.py)", err)
	}
	var g lgTaylorGolden
	if err := json.Unmarshal(b, &g); err != nil {
		t.Fatal(err)
	}
	return &g
}

func TestGammaSeriesIdentities(t *testing.T) {
	const prec = 340 // 100 digits
	for _, x0 := range []string{"0.25", "3.5", "-1.5"} {
		s, err := series.Variable(20, prec, parseBig(t, x0, prec))
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
		// |Gamma| = exp(log|Gamma|) (exact identity exp(log f) = f).
		es, err := series.Exp(lg)
		if err != nil {
			t.Fatal(err)
		}
		e := es.Coeffs()
		prod := series.Mul(g, rg) // Gamma * (1/Gamma) = 1
		for k := 0; k < 20; k++ {
			ak := new(big.Float).Set(g.Coeff(k)) // the series of |Gamma| = sign(Gamma(x0)) Gamma
			if g.Coeff(0).Sign() < 0 {
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
			d := new(big.Float).SetPrec(prec).Sub(prod.Coeff(k), want)
			if d.Sign() != 0 && d.MantExp(nil) > g.Coeff(k).MantExp(nil)+rg.Coeff(0).MantExp(nil)-320 {
				t.Errorf("x0=%s: (Gamma/Gamma)_%d = %s", x0, k, prod.Coeff(k).Text('g', 10))
			}
		}
	}
}

func TestDigammaAndPolygammaSeries(t *testing.T) {
	// Coefficient k of psi^(m)(x0+t) is psi^(m+k)(x0)/k! (Taylor), checked
	// against scalar.BigPolygamma; and Digamma(s) is the derivative of LogGamma(s).
	const prec = 200
	x0 := parseBig(t, "1.7", prec)
	s, _ := series.Variable(8, prec, x0)
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
			v, err := scalar.BigPolygamma(m+k, x0, prec)
			if err != nil {
				t.Fatal(err)
			}
			v.Quo(v, fact)
			if !closeTo(ps.Coeff(k), v, 190) {
				t.Errorf("psi^(%d) series coefficient %d = %s, want %s", m, k, ps.Coeff(k).Text('g', 20), v.Text('g', 20))
			}
		}
	}
	d, err := Digamma(s)
	if err != nil {
		t.Fatal(err)
	}
	lg, _ := LogGamma(s)
	for k := 0; k < 7; k++ {
		want := new(big.Float).SetPrec(prec).Mul(lg.Coeff(k+1), big.NewFloat(float64(k+1)))
		if !closeTo(d.Coeff(k), want, 190) {
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
	s, _ := series.FromFloat64(prec, 0.5, 1, 1, 0)
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
	if !closeTo(lg.Coeff(2), want2, 190) || !closeTo(lg.Coeff(3), want3, 190) {
		t.Errorf("composition: got %s, %s", lg.Coeff(2).Text('g', 20), lg.Coeff(3).Text('g', 20))
	}
}

func TestGammaSeriesBadInput(t *testing.T) {
	s, _ := series.Variable(4, 64, big.NewFloat(-3))
	if _, err := Gamma(s); !errors.Is(err, scalar.ErrPole) {
		t.Errorf("Gamma series at a pole: err = %v", err)
	}
	if _, err := LogGamma(s); !errors.Is(err, scalar.ErrPole) {
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
	if err != nil || r.Coeff(0).Sign() != 0 || !closeTo(r.Coeff(1), big.NewFloat(-6), 60) {
		t.Errorf("RGamma series at -3: %v, %v; want 0 - 6 t + ...", r, err)
	}
}
