package energy

import (
	"errors"
	"fmt"
	"math"
	"testing"
)

// The conversion factors of the relations, where both sides are known
// (Maldacena-Stanford 2016, arXiv:1604.07818, large q; PHYSICS sec. 7):
// with alpha_G = 2/q, alpha_K = -q k_A'(2) alpha_G must tend to 3 and
// alpha_S = alpha_K/(6 q^2 alpha_0) to 1/(4 q^2), both like 1/q; and at
// q = 4, k_A'(2) = -pi - 2/3 (the MS closed form of k_A) and
// alpha_0 = 8 pi/6 exactly.
func TestSoftModeFactors(t *testing.T) {
	var prevK, prevS float64
	for i, q := range []float64{1e4, 1e5, 1e6} {
		ks, a0, err := softModeFactors(q)
		if err != nil {
			t.Fatal(err)
		}
		ak := -q * ks * (2 / q)
		as := ak / (6 * q * q * a0) * 4 * q * q
		if math.Abs(ak-3) > 20/q || math.Abs(as-1) > 20/q {
			t.Errorf("q=%g: alpha_K = %.12g (want 3), 4 q^2 alpha_S = %.12g (want 1) with alpha_G = 2/q", q, ak, as)
		}
		dk, ds := (ak-3)*q, (as-1)*q
		if i > 0 && (math.Abs(dk-prevK) > 1e-3*math.Abs(prevK) || math.Abs(ds-prevS) > 1e-3*math.Abs(prevS)) {
			t.Errorf("q=%g: q (alpha_K - 3) = %.8g, q (4 q^2 alpha_S - 1) = %.8g; at the previous q %.8g, %.8g: not a 1/q approach", q, dk, ds, prevK, prevS)
		}
		prevK, prevS = dk, ds
	}
	ks, a0, err := softModeFactors(4)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(ks+math.Pi+2.0/3) > 1e-14 || math.Abs(a0-4*math.Pi/3) > 1e-14 {
		t.Errorf("q=4: k_A'(2) = %.17g (want -pi - 2/3), alpha_0 = %.17g (want 4 pi/3)", ks, a0)
	}
}

// Large q, zero-temperature route: alpha_G -> 2/q (from e^g = 1/(1 +
// script-J |tau|)^2, MS 2016 sec. 2.4), alpha_K -> 3, alpha_S -> 1/(4 q^2)
// and E_0 -> -1/q^2 (PHYSICS sec. 5), each with a correction that halves
// from q = 50 to q = 100 (order 1/q).
func TestSoftModeLargeQ(t *testing.T) {
	dev := map[float64][4]float64{}
	for _, q := range []float64{50, 100} {
		r, err := SoftModeZeroT(q, nil)
		if err != nil {
			t.Fatal(err)
		}
		d := [4]float64{q*r.AlphaG/2 - 1, r.AlphaK/3 - 1, 4*q*q*r.AlphaS - 1, -q*q*r.E0 - 1}
		t.Logf("q=%g: q alpha_G/2 - 1 = %.6g, alpha_K/3 - 1 = %.6g, 4 q^2 alpha_S - 1 = %.6g, -q^2 E_0 - 1 = %.6g", q, d[0], d[1], d[2], d[3])
		for i, v := range d {
			if math.Abs(v) > 8/q {
				t.Errorf("q=%g: relative deviation %d from the large-q limit is %.3g, above 8/q", q, i, v)
			}
		}
		dev[q] = d
	}
	for i := range dev[50] {
		if r := dev[50][i] / dev[100][i]; r < 1.6 || r > 2.4 {
			t.Errorf("deviation %d: ratio q=50/q=100 is %.3g, want about 2 (1/q)", i, r)
		}
	}
}

// The targets of the zero-temperature route: alpha_S to 1e-10 at q = 4
// and to 1e-9 at q = 3, 6, 8, 10, and the published q = 4 numbers
// alpha_S ~ 0.007 and alpha_K ~ 2.852 (Maldacena-Stanford 2016; the second
// from memory).
func TestSoftModeZeroTTargets(t *testing.T) {
	for _, c := range []struct{ q, target float64 }{{3, 1e-9}, {4, 1e-10}, {6, 1e-9}, {8, 1e-9}, {10, 1e-9}} {
		r, err := SoftModeZeroT(c.q, nil)
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("q=%g: alpha_G = %.13f +- %.1e, alpha_K = %.12f +- %.1e, alpha_S = %.14f +- %.1e, E_0 = %.15f +- %.1e",
			c.q, r.AlphaG, r.AlphaGErr, r.AlphaK, r.AlphaKErr, r.AlphaS, r.AlphaSErr, r.E0, r.E0Err)
		if !(r.AlphaSErr > 0) || r.AlphaSErr > c.target {
			t.Errorf("q=%g: alpha_S error %.2g, target %.0e", c.q, r.AlphaSErr, c.target)
		}
		if c.q == 4 && (math.Abs(r.AlphaS-0.007) > 0.5e-3 || math.Abs(r.AlphaK-2.852) > 0.5e-3) {
			t.Errorf("q=4: alpha_S = %.6g (published ~0.007), alpha_K = %.6g (published 2.852)", r.AlphaS, r.AlphaK)
		}
	}
}

// Both routes at q = 3, 4, 6, 8, 10 agree within their combined errors,
// the finite-temperature one with an error of at most 2e-9 (5e-10 at
// q = 4). About ten seconds per q: skipped with -short.
func TestSoftModeRoutesAgree(t *testing.T) {
	if testing.Short() {
		t.Skip("a finite-temperature precision ladder per q (about 10 s each)")
	}
	for _, q := range []float64{3, 4, 6, 8, 10} {
		s, err := SoftMode(q, nil)
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("q=%g: alpha_S T = 0 %.14f +- %.1e, finite T %.14f +- %.1e, agreement %.2f; E_0 %.16f +- %.1e and %.16f +- %.1e",
			q, s.ZeroT.AlphaS, s.ZeroT.AlphaSErr, s.FiniteT.AlphaS, s.FiniteT.AlphaSErr, s.Agreement, s.ZeroT.E0, s.ZeroT.E0Err, s.FiniteT.E0, s.FiniteT.E0Err)
		if s.Agreement > 1 {
			t.Errorf("q=%g: routes differ by %.2f combined errors", q, s.Agreement)
		}
		lim := 2e-9
		if q == 4 {
			lim = 5e-10
		}
		if s.FiniteT.AlphaSErr > lim {
			t.Errorf("q=%g: finite-temperature alpha_S error %.2g above %.0e", q, s.FiniteT.AlphaSErr, lim)
		}
		if d := math.Abs(s.ZeroT.E0 - s.FiniteT.E0); d > s.ZeroT.E0Err+s.FiniteT.E0Err {
			t.Errorf("q=%g: E_0 by the two routes differs by %.2g", q, d)
		}
	}
}

// Bad input is an error wrapping ErrInput.
func TestSoftModeBadInput(t *testing.T) {
	for _, q := range []float64{2, 1.5, math.NaN(), math.Inf(1)} {
		if _, err := SoftModeZeroT(q, nil); !errors.Is(err, ErrInput) {
			t.Errorf("q=%g: %v, want ErrInput", q, err)
		}
		if _, err := SoftMode(q, nil); !errors.Is(err, ErrInput) {
			t.Errorf("q=%g: %v, want ErrInput", q, err)
		}
	}
}

// The zero-temperature route at q = 4: alpha_G from the conformal limit of
// G(tau), alpha_S through alpha_K = -q k_A'(2) alpha_G and
// alpha_S = alpha_K/(6 q^2 alpha_0).
func ExampleSoftModeZeroT() {
	r, err := SoftModeZeroT(4, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("alpha_G = %.9f, alpha_K = %.8f, alpha_S = %.11f, error below 1e-10: %v\n", r.AlphaG, r.AlphaK, r.AlphaS, r.AlphaSErr < 1e-10)
	// Output: alpha_G = 0.187245852, alpha_K = 2.85232305, alpha_S = 0.00709314551, error below 1e-10: true
}
