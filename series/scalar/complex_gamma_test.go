package scalar

import (
	"errors"

	"math/big"
	"testing"
)

func TestCLogGammaGolden(t *testing.T) {
	// Reference: mpmath.loggamma (principal branch) at 80 digits
	// (testdata/gen_special.py); checked here at 60+ digits.
	g := loadGolden(t)
	const prec = 256
	for _, c := range g.CLogGamma {
		z := NewComplex(parseBig(t, c.Re, 512), parseBig(t, c.Im, 512), 512)
		v, err := CLogGamma(z, prec)
		if err != nil {
			t.Errorf("CLogGamma(%s+%si): %v", c.Re, c.Im, err)
			continue
		}
		// Both parts to 240 bits relative to |log Gamma(z)|.
		ref := parseBig(t, c.Vre, 300)
		if im := parseBig(t, c.Vim, 300); new(big.Float).Abs(im).Cmp(new(big.Float).Abs(ref)) > 0 {
			ref = im
		}
		for i, pair := range [][2]interface{}{{v.Re, c.Vre}, {v.Im, c.Vim}} {
			got := pair[0].(*big.Float)
			want := parseBig(t, pair[1].(string), 300)
			d := new(big.Float).SetPrec(400).Sub(got, want)
			if d.Sign() != 0 && d.MantExp(nil)-ref.MantExp(nil) > -240 {
				t.Errorf("CLogGamma(%s+%si) part %d = %s, want %s", c.Re, c.Im, i, got.Text('g', 40), pair[1])
			}
		}
	}
}

func TestCGammaIdentities(t *testing.T) {
	const prec = 200
	for _, zz := range [][2]float64{{0.3, 2}, {-3.7, 0.5}, {12, -4}, {0.5, 30}} {
		z := ComplexFloat64(zz[0], zz[1], prec)
		g, err := CGamma(z, prec)
		if err != nil {
			t.Fatal(err)
		}
		// DLMF 5.5.1: Gamma(z+1) = z Gamma(z).
		z1 := CAdd(z, ComplexFloat64(1, 0, prec), prec)
		g1, err := CGamma(z1, prec)
		if err != nil {
			t.Fatal(err)
		}
		want := CMul(z, g, prec)
		d := CAbs(CSub(g1, want, prec), prec)
		if d.Sign() != 0 && d.MantExp(nil)-CAbs(want, prec).MantExp(nil) > -190 {
			t.Errorf("Gamma(z+1) != z Gamma(z) at %v", zz)
		}
		// Schwarz reflection (DLMF 5.4.1 context): Gamma(conj z) = conj Gamma(z).
		gc, err := CGamma(conj(z, prec), prec)
		if err != nil {
			t.Fatal(err)
		}
		if gc.Re.Cmp(g.Re) != 0 || gc.Im.Cmp(new(big.Float).Neg(g.Im)) != 0 {
			t.Errorf("Gamma(conj z) != conj Gamma(z) at %v", zz)
		}
	}
	// DLMF 5.4.3: |Gamma(iy)|^2 = pi / (y sinh(pi y)), at y = 1.
	g, err := CGamma(ComplexFloat64(0, 1, prec), prec)
	if err != nil {
		t.Fatal(err)
	}
	pi := Pi(prec)
	e := BigExp(pi, prec)
	sinh := new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), e)
	sinh.Sub(e, sinh)
	sinh.Quo(sinh, big.NewFloat(2))
	want := new(big.Float).SetPrec(prec).Quo(pi, sinh)
	if !closeTo(CAbs2(g, prec), want, 190) {
		t.Errorf("|Gamma(i)|^2 = %s, want pi/sinh(pi) = %s", CAbs2(g, prec).Text('g', 30), want.Text('g', 30))
	}
}

func TestCLogGammaContinuityAcrossAxis(t *testing.T) {
	// Off the negative real axis the branch is continuous: crossing the
	// positive real axis (Im z = +-1e-30 at Re z = 2.5) changes nothing,
	// and just above the negative axis it tends to the value on the axis.
	const prec = 128
	for _, re := range []float64{2.5, -2.5} {
		up, err := CLogGamma(NewComplex(big.NewFloat(re), parseBig(t, "1e-30", prec), prec), prec)
		if err != nil {
			t.Fatal(err)
		}
		on, err := CLogGamma(ComplexFloat64(re, 0, prec), prec)
		if err != nil {
			t.Fatal(err)
		}
		d := new(big.Float).Sub(up.Im, on.Im)
		if d.Abs(d).Cmp(big.NewFloat(1e-25)) > 0 {
			t.Errorf("Re z = %g: Im log Gamma jumps from %s to %s", re, on.Im.Text('g', 10), up.Im.Text('g', 10))
		}
	}
}

func TestCLogGammaBadInput(t *testing.T) {
	for _, re := range []float64{0, -2} {
		if _, err := CLogGamma(ComplexFloat64(re, 0, 64), 64); !errors.Is(err, ErrPole) {
			t.Errorf("CLogGamma(%g): err = %v, want ErrPole", re, err)
		}
		if _, err := CGamma(ComplexFloat64(re, 0, 64), 64); !errors.Is(err, ErrPole) {
			t.Errorf("CGamma(%g): err = %v, want ErrPole", re, err)
		}
	}
	if _, err := CLogGamma(ComplexFloat64(1, 1, 64), 0); !errors.Is(err, ErrPrec) {
		t.Errorf("zero precision: err = %v", err)
	}
	if _, err := CLogGamma(Complex{}, 64); err == nil {
		t.Error("nil parts: want error")
	}
}
