package pade

import (
	"qbridge/series"

	"qbridge/series/scalar"

	"encoding/json"
	"errors"
	"math/big"
	"math/rand/v2"
	"os"
	"testing"
)

// padeTestExp returns the Taylor series of exp at 0, c_k = 1/k!.
func padeTestExp(n int, prec uint) *series.Series {
	cs := testZeros(n, prec)
	f := new(big.Float).SetPrec(prec).SetInt64(1)
	for k := 0; k < n; k++ {
		if k > 0 {
			f.Quo(f, new(big.Float).SetInt64(int64(k)))
		}
		cs[k].Set(f)
	}
	return testSeries(prec, cs)
}

// padeTestLog1p returns the Taylor series of log(1+x) at 0, c_k = (-1)^(k+1)/k.
func padeTestLog1p(n int, prec uint) *series.Series {
	cs := testZeros(n, prec)
	for k := 1; k < n; k++ {
		cs[k].Quo(big.NewFloat(1), new(big.Float).SetInt64(int64(k)))
		if k%2 == 0 {
			cs[k].Neg(cs[k])
		}
	}
	return testSeries(prec, cs)
}

// padeTestRational returns the Taylor series of (1+2x)/(1-3x+x^2): the
// coefficients obey c_k = 3 c_{k-1} - c_{k-2} for k >= 2 (exact integers),
// with c_0 = 1, c_1 = 2 + 3 = 5. noise > 0 adds uniform noise of that size.
func padeTestRational(n int, prec uint, noise float64) *series.Series {
	cs := testZeros(n, prec)
	rng := rand.New(rand.NewPCG(1, 2))
	t := new(big.Float).SetPrec(prec)
	for k := 0; k < n; k++ {
		switch k {
		case 0:
			cs[k].SetInt64(1)
		case 1:
			cs[k].SetInt64(5)
		default:
			cs[k].Mul(big.NewFloat(3), cs[k-1])
			cs[k].Sub(cs[k], cs[k-2])
		}
	}
	if noise > 0 {
		for k := 0; k < n; k++ {
			t.SetFloat64(noise * (2*rng.Float64() - 1))
			cs[k].Add(cs[k], t)
		}
	}
	return testSeries(prec, cs)
}

// padeTestClose reports |a - b| <= tol * max(1, |b|).
func padeTestClose(a, b *big.Float, tol float64) bool {
	d := new(big.Float).SetPrec(a.Prec()).Sub(a, b)
	d.Abs(d)
	scale := new(big.Float).Abs(b)
	if scale.Cmp(big.NewFloat(1)) < 0 {
		scale.SetInt64(1)
	}
	return d.Cmp(new(big.Float).Mul(scale, big.NewFloat(tol))) <= 0
}

func padeTestParse(t *testing.T, s string, prec uint) *big.Float {
	t.Helper()
	v, _, err := big.ParseFloat(s, 10, prec, big.ToNearestEven)
	if err != nil {
		t.Fatalf("parse %q: %v", s, err)
	}
	return v
}

// Exact identity: the [1/2] Pade of a [1/2] rational function is the function.
func TestNewPadeRationalExact(t *testing.T) {
	const prec = 200
	s := padeTestRational(12, prec, 0)
	tests := []struct {
		L, M, wantM int
	}{
		{1, 2, 2},
		{3, 3, 2}, // degenerate block: M is lowered to the true degree
		{5, 4, 2},
	}
	wantP := []float64{1, 2}
	wantQ := []float64{1, -3, 1}
	for _, tc := range tests {
		p, err := NewPade(s, tc.L, tc.M)
		if err != nil {
			t.Fatalf("[%d/%d]: %v", tc.L, tc.M, err)
		}
		if p.M != tc.wantM || p.MRequested != tc.M {
			t.Errorf("[%d/%d]: M = %d (requested %d), want %d", tc.L, tc.M, p.M, p.MRequested, tc.wantM)
		}
		for i, v := range p.P {
			w := 0.0
			if i < len(wantP) {
				w = wantP[i]
			}
			if !padeTestClose(v, big.NewFloat(w), 1e-50) {
				t.Errorf("[%d/%d]: P[%d] = %g, want %g", tc.L, tc.M, i, v, w)
			}
		}
		for i, v := range p.Q {
			if !padeTestClose(v, big.NewFloat(wantQ[i]), 1e-50) {
				t.Errorf("[%d/%d]: Q[%d] = %g, want %g", tc.L, tc.M, i, v, wantQ[i])
			}
		}
		// f(0.1) = 1.2/0.71 exactly.
		x := new(big.Float).SetPrec(prec).SetFloat64(0.1)
		x.Quo(big.NewFloat(1), big.NewFloat(10))
		got, err := p.Eval(x)
		if err != nil {
			t.Fatal(err)
		}
		num := new(big.Float).SetPrec(prec).Mul(x, big.NewFloat(2))
		num.Add(num, big.NewFloat(1))
		den := new(big.Float).SetPrec(prec).Mul(x, x)
		den.Sub(den, new(big.Float).SetPrec(prec).Mul(x, big.NewFloat(3)))
		den.Add(den, big.NewFloat(1))
		want := num.Quo(num, den)
		if !padeTestClose(got, want, 1e-50) {
			t.Errorf("[%d/%d](0.1) = %g, want %g", tc.L, tc.M, got, want)
		}
	}
}

// Closed form of the [L/M] Pade approximant of exp (Baker & Graves-Morris,
// "Pade Approximants", 2nd ed., Sec. 1.2; from memory):
// P(x) = sum_k (L+M-k)! L! / ((L+M)! k! (L-k)!) x^k,
// Q(x) = sum_k (L+M-k)! M! / ((L+M)! k! (M-k)!) (-x)^k.
func TestNewPadeExpClosedForm(t *testing.T) {
	const prec = 256
	fact := func(n int) *big.Int { return new(big.Int).MulRange(1, int64(n)) }
	coef := func(L, M, D, k int) *big.Float {
		num := new(big.Int).Mul(fact(L+M-k), fact(D))
		den := new(big.Int).Mul(fact(L+M), fact(k))
		den.Mul(den, fact(D-k))
		return new(big.Float).SetPrec(prec).Quo(new(big.Float).SetInt(num), new(big.Float).SetInt(den))
	}
	s := padeTestExp(30, prec)
	for _, lm := range [][2]int{{1, 1}, {2, 2}, {0, 3}, {3, 0}, {4, 2}, {5, 7}, {10, 10}} {
		L, M := lm[0], lm[1]
		p, err := NewPade(s, L, M)
		if err != nil {
			t.Fatalf("[%d/%d]: %v", L, M, err)
		}
		if p.L != L || p.M != M {
			t.Fatalf("[%d/%d]: got degrees [%d/%d]", L, M, p.L, p.M)
		}
		for k := 0; k <= L; k++ {
			if w := coef(L, M, L, k); !padeTestClose(p.P[k], w, 1e-60) {
				t.Errorf("[%d/%d] P[%d] = %g, want %g", L, M, k, p.P[k], w)
			}
		}
		for k := 0; k <= M; k++ {
			w := coef(L, M, M, k)
			if k%2 == 1 {
				w.Neg(w)
			}
			if !padeTestClose(p.Q[k], w, 1e-60) {
				t.Errorf("[%d/%d] Q[%d] = %g, want %g", L, M, k, p.Q[k], w)
			}
		}
	}
}

// [2/2] of exp has Q = 1 - x/2 + x^2/12, zero at x = 3 +- i sqrt(3)
// (quadratic formula); P = 1 + x/2 + x^2/12, zero at -3 +- i sqrt(3).
func TestPadeExpPolesZeros(t *testing.T) {
	const prec = 256
	p, err := NewPade(padeTestExp(5, prec), 2, 2)
	if err != nil {
		t.Fatal(err)
	}
	sqrt3 := new(big.Float).SetPrec(prec).Sqrt(big.NewFloat(3))
	for _, tc := range []struct {
		name  string
		roots func() ([]scalar.Complex, error)
		re    float64
	}{
		{"poles", p.Poles, 3},
		{"zeros", p.Zeros, -3},
	} {
		r, err := tc.roots()
		if err != nil || len(r) != 2 {
			t.Fatalf("%s: %v, %v", tc.name, r, err)
		}
		for _, z := range r {
			if !padeTestClose(z.Re, big.NewFloat(tc.re), 1e-70) ||
				!padeTestClose(new(big.Float).Abs(z.Im), sqrt3, 1e-70) {
				t.Errorf("%s: got %g%+gi, want %g +- i sqrt 3", tc.name, z.Re, z.Im, tc.re)
			}
		}
	}
	// e^x - [L/M](x) = (-1)^M L! M! / ((L+M)! (L+M+1)!) x^(L+M+1) + ...
	// (Baker & Graves-Morris, Sec. 1.2, from memory): x^5/720 for [2/2],
	// checked against BigExp at x = 1/100 to 2% (the next term is smaller
	// by a factor of order x).
	x := new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), big.NewFloat(100))
	v, err := p.Eval(x)
	if err != nil {
		t.Fatal(err)
	}
	diff := new(big.Float).SetPrec(prec).Sub(scalar.BigExp(x, prec), v)
	if got, _ := diff.Float64(); got < 0.98e-10/720 || got > 1.02e-10/720 {
		t.Errorf("e^0.01 - [2/2](0.01) = %g, want about %g", got, 1e-10/720)
	}
	// Complex evaluation at the real point agrees with Eval; at a pole it fails.
	cv, err := p.EvalComplex(scalar.NewComplex(x, nil, prec))
	if err != nil || !padeTestClose(cv.Re, v, 1e-70) || cv.Im.Sign() != 0 {
		t.Errorf("EvalComplex(0.1) = %v, %v", cv, err)
	}
	poles, _ := p.Poles()
	if _, err := p.EvalComplex(poles[0]); !errors.Is(err, scalar.ErrPole) {
		t.Errorf("EvalComplex at a pole: err = %v, want ErrPole", err)
	}
}

// Golden values from mpmath.pade (testdata/gen_pade.py, mpmath 1.3.0).
func TestPadeGoldenMpmath(t *testing.T) {
	raw, err := os.ReadFile("../../testdata/pade_golden.json")
	if err != nil {
		t.Fatal(err)
	}
	var golden struct {
		Cases []struct {
			Func string
			L, M int
			P, Q []string
		}
	}
	if err := json.Unmarshal(raw, &golden); err != nil {
		t.Fatal(err)
	}
	if len(golden.Cases) == 0 {
		t.Fatal("no golden cases")
	}
	const prec = 256
	for _, gc := range golden.Cases {
		var s *series.Series
		switch gc.Func {
		case "exp":
			s = padeTestExp(gc.L+gc.M+1, prec)
		case "log1p":
			s = padeTestLog1p(gc.L+gc.M+1, prec)
		default:
			t.Fatalf("unknown function %q", gc.Func)
		}
		p, err := NewPade(s, gc.L, gc.M)
		if err != nil {
			t.Fatalf("%s [%d/%d]: %v", gc.Func, gc.L, gc.M, err)
		}
		if len(p.P) != len(gc.P) || len(p.Q) != len(gc.Q) {
			t.Fatalf("%s [%d/%d]: lengths %d,%d want %d,%d", gc.Func, gc.L, gc.M, len(p.P), len(p.Q), len(gc.P), len(gc.Q))
		}
		for i := range gc.P {
			if w := padeTestParse(t, gc.P[i], prec); !padeTestClose(p.P[i], w, 1e-45) {
				t.Errorf("%s [%d/%d] P[%d] = %.50g, mpmath %s", gc.Func, gc.L, gc.M, i, p.P[i], gc.P[i])
			}
		}
		for i := range gc.Q {
			if w := padeTestParse(t, gc.Q[i], prec); !padeTestClose(p.Q[i], w, 1e-45) {
				t.Errorf("%s [%d/%d] Q[%d] = %.50g, mpmath %s", gc.Func, gc.L, gc.M, i, p.Q[i], gc.Q[i])
			}
		}
	}
}

// The same approximant at 64, 256 and 1024 bits agrees to the lower precision.
func TestPadePrecisionAgreement(t *testing.T) {
	var ref *Pade
	for _, prec := range []uint{1024, 256, 64} {
		p, err := NewPade(padeTestLog1p(13, prec), 6, 6)
		if err != nil {
			t.Fatal(err)
		}
		if p.Prec() != prec {
			t.Errorf("Prec = %d, want %d", p.Prec(), prec)
		}
		if ref == nil {
			ref = p
			continue
		}
		// The [6/6] system for log(1+x) has condition number near 2^20, so
		// coefficients rounded to prec bits move Q by about 2^(20-prec).
		tol := new(big.Float).SetMantExp(big.NewFloat(1), -int(prec)+24)
		tf, _ := tol.Float64()
		for i := range p.Q {
			if !padeTestClose(p.Q[i], ref.Q[i], tf) {
				t.Errorf("prec %d: Q[%d] = %g, 1024-bit %g", prec, i, p.Q[i], ref.Q[i])
			}
		}
	}
}

func TestNewPadeBadInput(t *testing.T) {
	s := padeTestExp(5, 64)
	for _, tc := range []struct {
		name string
		s    *series.Series
		L, M int
	}{
		{"nil series", nil, 1, 1},
		{"negative L", s, -1, 2},
		{"negative M", s, 2, -1},
		{"too few coefficients", s, 3, 2},
	} {
		if p, err := NewPade(tc.s, tc.L, tc.M); err == nil {
			t.Errorf("%s: got %v, want error", tc.name, p)
		}
	}
	p, err := NewPade(s, 2, 2)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := p.Eval(nil); err == nil {
		t.Error("Eval(nil): want error")
	}
	if _, err := p.PolesNear(nil, big.NewFloat(1), big.NewFloat(0.1), nil); err == nil {
		t.Error("PolesNear(nil, ...): want error")
	}
	if _, err := p.PolesNear(big.NewFloat(0), big.NewFloat(1), big.NewFloat(-1), nil); err == nil {
		t.Error("PolesNear with negative margin: want error")
	}
}

// 1/(1-x) has its pole at x = 1 exactly; the [0/1] approximant is exact.
func TestPadeEvalAtPole(t *testing.T) {
	s, _ := series.FromFloat64(128, 1, 1, 1, 1)
	p, err := NewPade(s, 0, 1)
	if err != nil {
		t.Fatal(err)
	}
	if v, err := p.Eval(big.NewFloat(1)); !errors.Is(err, scalar.ErrPole) {
		t.Errorf("Eval at the pole: %v, %v; want ErrPole", v, err)
	}
	free, err := p.PoleFree(big.NewFloat(0), big.NewFloat(0.9), big.NewFloat(0.01), nil)
	if err != nil || !free {
		t.Errorf("PoleFree on [0, 0.9] = %v, %v; want true", free, err)
	}
	free, err = p.PoleFree(big.NewFloat(0), big.NewFloat(2), big.NewFloat(0.01), nil)
	if err != nil || free {
		t.Errorf("PoleFree on [0, 2] = %v, %v; want false", free, err)
	}
}

// Froissart doublets (Froissart 1969; Gilewicz & Kryakin, J. Approx. Theory
// 2003): noise of size 1e-30 on the coefficients of a [1/2] rational
// function, approximated with M = 5, gives three spurious pole-zero pairs at
// distances near the noise level, while the true poles (3 +- sqrt 5)/2
// (quadratic formula) stay and are not paired.
func TestPadeFroissartDoublets(t *testing.T) {
	const prec = 256
	s := padeTestRational(11, prec, 1e-30)
	p, err := NewPade(s, 5, 5)
	if err != nil {
		t.Fatal(err)
	}
	if p.M != 5 {
		t.Fatalf("noisy system should be regular at 256 bits, got M = %d", p.M)
	}
	tol := big.NewFloat(1e-10)
	dbl, err := p.FindDoublets(tol)
	if err != nil {
		t.Fatal(err)
	}
	if len(dbl) != 3 {
		t.Errorf("found %d doublets, want 3: %v", len(dbl), dbl)
	}
	if len(p.Doublets(tol)) != len(dbl) {
		t.Error("Doublets and FindDoublets disagree")
	}
	sqrt5 := new(big.Float).SetPrec(prec).Sqrt(big.NewFloat(5))
	for _, sign := range []float64{-1, 1} {
		want := new(big.Float).SetPrec(prec).Mul(sqrt5, big.NewFloat(sign))
		want.Add(want, big.NewFloat(3))
		want.Quo(want, big.NewFloat(2))
		near, err := p.PolesNear(want, want, big.NewFloat(1e-20), tol)
		if err != nil || len(near) != 1 {
			t.Errorf("true pole %g: found %v, %v", want, near, err)
		}
	}
	// On [0, 0.3] only doublets can lie: the region counts as pole-free.
	free, err := p.PoleFree(big.NewFloat(0), big.NewFloat(0.3), big.NewFloat(0.01), tol)
	if err != nil || !free {
		t.Errorf("PoleFree [0, 0.3] = %v, %v", free, err)
	}
}

// testZeros returns n zero coefficients at prec bits.
func testZeros(n int, prec uint) []*big.Float {
	c := make([]*big.Float, n)
	for i := range c {
		c[i] = new(big.Float).SetPrec(prec)
	}
	return c
}

// testSeries wraps coefficients as a series; the inputs are always valid.
func testSeries(prec uint, c []*big.Float) *series.Series {
	s, err := series.FromBig(prec, c)
	if err != nil {
		panic(err) // test helper: a bad literal is a bug in the test
	}
	return s
}
