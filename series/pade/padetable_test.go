package pade

import (
	"qbridge/series"

	"qbridge/series/scalar"

	"math/big"
	"strings"
	"testing"
)

// log(1+x) at x = 1 from its Taylor series: the partial sums converge like
// 1/n, the diagonal Pade approximants geometrically (log(1+x)/x is a
// Stieltjes function; Baker & Graves-Morris, Ch. 5). The reference is
// Ln2 (bigfloat); the reported error must bound the true error.
func TestPadeTableLog2(t *testing.T) {
	const prec = 256
	ln2 := scalar.Ln2(prec)
	for _, tc := range []struct {
		n      int     // series length
		maxErr float64 // the estimate must also be this small (useful)
	}{
		{11, 1e-5},
		{21, 1e-10},
		{41, 1e-20},
	} {
		s := padeTestLog1p(tc.n, prec)
		r, err := PadeTable(s, big.NewFloat(1), PadeTableOptions{})
		if err != nil {
			t.Fatalf("n=%d: %v", tc.n, err)
		}
		trueErr := new(big.Float).SetPrec(prec).Sub(r.Value, ln2)
		trueErr.Abs(trueErr)
		if trueErr.Cmp(r.Err) > 0 {
			t.Errorf("n=%d: true error %.3g exceeds estimate %.3g", tc.n, trueErr, r.Err)
		}
		if r.Err.Cmp(big.NewFloat(tc.maxErr)) > 0 {
			t.Errorf("n=%d: error estimate %.3g, want below %g", tc.n, r.Err, tc.maxErr)
		}
		if r.L+r.M != tc.n-1 || r.Used != 3 || !strings.Contains(r.Method, "Pade") {
			t.Errorf("n=%d: chose [%d/%d], used %d, method %q", tc.n, r.L, r.M, r.Used, r.Method)
		}
		if len(r.Entries) == 0 {
			t.Errorf("n=%d: no table entries", tc.n)
		}
		// The partial sum of the same series is far worse: error ~ 1/(2n).
		psum := new(big.Float).SetPrec(prec)
		for k := 0; k < tc.n; k++ {
			psum.Add(psum, s.Coeff(k))
		}
		psum.Sub(psum, ln2)
		if psum.Abs(psum).Cmp(new(big.Float).Mul(trueErr, big.NewFloat(1e3))) < 0 {
			t.Errorf("n=%d: Pade error %.3g not much better than partial sum %.3g", tc.n, trueErr, psum)
		}
	}
}

// A [1/2] rational function with 1e-30 noise on its coefficients, resummed
// with far too many poles allowed: the near-diagonal entries carry Froissart
// doublets, which must be ignored, not mistaken for poles of the function.
// Reference: the exact value (1+2x)/(1-3x+x^2) at x = 1/4 = 1.5/0.3125 = 4.8.
func TestPadeTableIgnoresDoublets(t *testing.T) {
	const prec = 256
	s := padeTestRational(16, prec, 1e-30)
	x := new(big.Float).SetPrec(prec).SetFloat64(0.25)
	r, err := PadeTable(s, x, PadeTableOptions{DoubletTol: big.NewFloat(1e-10)})
	if err != nil {
		t.Fatal(err)
	}
	want := new(big.Float).SetPrec(prec).Quo(big.NewFloat(24), big.NewFloat(5))
	d := new(big.Float).SetPrec(prec).Sub(r.Value, want)
	if d.Abs(d).Cmp(big.NewFloat(1e-25)) > 0 {
		t.Errorf("value %.30g (off by %.3g), want 4.8 to 1e-25", r.Value, d)
	}
	// The series given is that of 4.8 plus the noise polynomial; that sum is
	// what the error estimate refers to (it cannot see the input noise).
	clean := padeTestRational(16, prec, 0)
	noisy := new(big.Float).SetPrec(prec).Set(want)
	pw := new(big.Float).SetPrec(prec).SetInt64(1)
	for k := 0; k < 16; k++ {
		nk := new(big.Float).SetPrec(prec).Sub(s.Coeff(k), clean.Coeff(k))
		noisy.Add(noisy, nk.Mul(nk, pw))
		pw.Mul(pw, x)
	}
	d.Sub(r.Value, noisy)
	if d.Abs(d).Cmp(r.Err) > 0 {
		t.Errorf("true error %.3g exceeds estimate %.3g", d, r.Err)
	}
	if r.L+r.M != 15 {
		t.Errorf("chose [%d/%d], want an order-15 entry", r.L, r.M)
	}
	// The chosen entry really has doublets: more poles than the function.
	p, err := NewPade(s, r.L, r.M)
	if err != nil {
		t.Fatal(err)
	}
	if len(p.Doublets(big.NewFloat(1e-10))) == 0 {
		t.Errorf("[%d/%d] shows no Froissart doublet", r.L, r.M)
	}
}

// The true pole of 1/(1-x) at x = 1 lies between 0 and x = 2: every entry
// with a pole is rejected and the table reports why.
func TestPadeTablePoleInRegion(t *testing.T) {
	s, _ := series.FromFloat64(128, 1, 1, 1, 1, 1, 1)
	r, err := PadeTable(s, big.NewFloat(2), PadeTableOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if r.M != 0 {
		t.Errorf("chose [%d/%d], but only M = 0 is pole-free on [0, 2]", r.L, r.M)
	}
	rejected := 0
	for _, e := range r.Entries {
		if !e.OK && strings.Contains(e.Reason, "pole") {
			rejected++
		}
	}
	if rejected == 0 {
		t.Error("no entry rejected for a pole")
	}
}

func TestPadeTableBadInput(t *testing.T) {
	s := padeTestLog1p(10, 64)
	one := big.NewFloat(1)
	for _, tc := range []struct {
		name string
		s    *series.Series
		x    *big.Float
		o    PadeTableOptions
	}{
		{"nil series", nil, one, PadeTableOptions{}},
		{"nil x", s, nil, PadeTableOptions{}},
		{"N too large", s, one, PadeTableOptions{N: 10}},
		{"N negative", s, one, PadeTableOptions{N: -1}},
		{"Best 1", s, one, PadeTableOptions{Best: 1}},
		{"negative margin", s, one, PadeTableOptions{PoleMargin: big.NewFloat(-1)}},
		{"one coefficient", padeTestLog1p(1, 64), one, PadeTableOptions{}},
	} {
		if r, err := PadeTable(tc.s, tc.x, tc.o); err == nil {
			t.Errorf("%s: got %v, want error", tc.name, r)
		}
	}
}
