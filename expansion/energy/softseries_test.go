package energy

import (
	"errors"
	"math"
	"testing"
)

// SoftSeries on exactly known alpha_S series: at q = 2 alpha_S = 1/(24 pi)
// (the semicircle, PHYSICS.md sec. 5) gives alpha_K = 24 pi^2/(24 pi) = pi
// and alpha_G = 0 + (6 pi^2/(24 pi)) eps = (pi/4) eps; at q = infinity
// alpha_S = x^2/4 (PHYSICS.md sec. 5) gives alpha_K = 3 and alpha_G = 2x,
// the large-q limits of Maldacena-Stanford 2016 (arXiv:1604.07818) sec. 4.
// Errors propagate linearly: an error e on alpha_S's constant term becomes
// 24 pi^2 e on alpha_K's.
func TestSoftSeriesLimits(t *testing.T) {
	pi := math.Pi
	e0 := 1e-9
	two := Coeffs{Values: []float64{1 / (24 * pi), 0}, Errors: []float64{e0, 0}}
	k, err := SoftSeries(QuantityAlphaK, VarEps, two)
	if err != nil {
		t.Fatal(err)
	}
	g, err := SoftSeries(QuantityAlphaG, VarEps, two)
	if err != nil {
		t.Fatal(err)
	}
	inf := Coeffs{Values: []float64{0, 0, 0.25}, Errors: []float64{0, 0, 0}}
	ki, err := SoftSeries(QuantityAlphaK, VarX, inf)
	if err != nil {
		t.Fatal(err)
	}
	gi, err := SoftSeries(QuantityAlphaG, VarX, inf)
	if err != nil {
		t.Fatal(err)
	}
	if k.Len() != 2 || g.Len() != 3 || ki.Len() != 1 || gi.Len() != 2 {
		t.Fatalf("lengths %d %d %d %d, want 2 3 1 2", k.Len(), g.Len(), ki.Len(), gi.Len())
	}
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"alpha_K(q=2)", k.Values[0], pi},
		{"alpha_G eps^1 at q=2", g.Values[1], pi / 4},
		{"alpha_K(q=inf)", ki.Values[0], 3},
		{"alpha_G x^1 at q=inf", gi.Values[1], 2},
	} {
		if math.Abs(c.got-c.want) > 1e-13*math.Abs(c.want) {
			t.Errorf("%s = %.17g, want %.17g", c.what, c.got, c.want)
		}
	}
	// The error: 24 pi^2 e0 plus the float64 rounding of the factor (2^-52 relative).
	if d := k.Errors[0] - 24*pi*pi*e0; d < 0 || d > 1e-15 {
		t.Errorf("alpha_K(q=2) error %.17g, want 24 pi^2 x %g plus rounding", k.Errors[0], e0)
	}
	if g.Values[0] != 0 || g.Errors[0] != 0 || gi.Values[0] != 0 || gi.Errors[0] != 0 {
		t.Errorf("alpha_G constant terms %g +- %g (eps), %g +- %g (x): want exact zeros", g.Values[0], g.Errors[0], gi.Values[0], gi.Errors[0])
	}
	if _, err := SoftSeries(QuantityAlphaK, VarX, Coeffs{Values: []float64{0.1, 0, 0.25}, Errors: []float64{0, 0, 0}}); err == nil {
		t.Error("a 1/q series of alpha_S with a constant term was accepted")
	}
	if _, err := SoftSeries(QuantityAlphaS, VarEps, two); !errors.Is(err, ErrInput) {
		t.Errorf("alpha_S as a soft-mode target: %v, want ErrInput", err)
	}
}

// At q = 4 (eps = 1/2) the product series summed equals the alpha_S series
// summed times the exact factor: F_K(4) = 6*16*(4 pi/3) = 128 pi and
// F_G(4) = 128 pi/(4 (pi + 2/3)), from alpha_0(4) = 4 pi/3 and
// k_A'(2) = -pi - 2/3 at q = 4 (MS 2016, the q = 4 kernel; PHYSICS.md sec. 4).
// The alpha_S input is a short polynomial padded with exact zeros, so the
// product is the factor series to 60 orders times it (truncation ~1e-15).
func TestSoftSeriesAtFour(t *testing.T) {
	n := 61
	a := Coeffs{Values: make([]float64, n), Errors: make([]float64, n)}
	a.Values[0], a.Values[1], a.Values[2] = 0.0132629, -0.0043, -0.0197
	sum := func(c Coeffs, x float64) float64 {
		s, p := 0.0, 1.0
		for _, v := range c.Values {
			s += v * p
			p *= x
		}
		return s
	}
	as := sum(a, 0.5)
	for _, c := range []struct {
		kind   string
		factor float64
	}{
		{QuantityAlphaK, 128 * math.Pi},
		{QuantityAlphaG, 128 * math.Pi / (4 * (math.Pi + 2.0/3))},
	} {
		s, err := SoftSeries(c.kind, VarEps, a)
		if err != nil {
			t.Fatal(err)
		}
		got, want := sum(s, 0.5), as*c.factor
		if math.Abs(got-want) > 1e-12*math.Abs(want) {
			t.Errorf("%s at q = 4: series sum %.15g, alpha_S(4) x factor %.15g", c.kind, got, want)
		}
	}
}

// The orders of alpha_S a soft-mode series of a given order needs.
func TestSoftAlphaSOrder(t *testing.T) {
	for _, c := range []struct {
		kind, v     string
		order, want int
	}{
		{QuantityAlphaK, VarEps, 5, 5}, {QuantityAlphaG, VarEps, 5, 4}, {QuantityAlphaG, VarEps, 0, 0},
		{QuantityAlphaK, VarX, 3, 5}, {QuantityAlphaG, VarX, 3, 4}, {QuantityAlphaG, VarX, 0, 2},
	} {
		got, err := SoftAlphaSOrder(c.kind, c.v, c.order)
		if err != nil || got != c.want {
			t.Errorf("%s in %s to order %d: alpha_S order %d (%v), want %d", c.kind, c.v, c.order, got, err, c.want)
		}
	}
}

// NormalisedPower with p = 2 is Normalised; with p = 0 around q = 2 the
// series in u = x - 1/2 of F itself, eps = -2u; ResumPower at q = infinity
// returns q^p F there.
func TestNormalisedPower(t *testing.T) {
	eps := Coeffs{Values: []float64{1, 2, 3}, Errors: []float64{0.1, 0.1, 0.1}}
	invq := Coeffs{Values: []float64{0, 0, 5, 6}, Errors: []float64{0, 0, 0.1, 0.1}}
	i2, t2, err := Normalised(eps, invq)
	if err != nil {
		t.Fatal(err)
	}
	// q^2 = 4/(1-eps)^2 = 4 + 8 eps + 12 eps^2: 4, 4*2 + 8, 4*3 + 8*2 + 12; times (-2)^j.
	want := []float64{4, -2 * 16, 4 * 40}
	for j, w := range want {
		if t2.Values[j] != w {
			t.Errorf("q^2 F around q = 2, u^%d: %g, want %g", j, t2.Values[j], w)
		}
	}
	if i2.Len() != 2 || i2.Values[0] != 5 {
		t.Errorf("q^2 F around infinity %v", i2.Values)
	}
	_, t0, err := NormalisedPower(eps, invq, 0)
	if err != nil {
		t.Fatal(err)
	}
	for j, w := range []float64{1, -4, 12} {
		if t0.Values[j] != w {
			t.Errorf("F around q = 2, u^%d: %g, want %g", j, t0.Values[j], w)
		}
	}
	if _, _, err := NormalisedPower(eps, Coeffs{Values: []float64{1, 0}, Errors: []float64{0, 0}}, 1); err == nil {
		t.Error("a 1/q series with a constant term was accepted for q F")
	}
}
