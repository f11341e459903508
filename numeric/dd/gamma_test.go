package dd

import (
	"math"
	"math/big"
	"testing"
)

// 1/Gamma against DLMF identities, each at double-double precision:
// 5.4.1 Gamma(n+1) = n!, 5.4.6 Gamma(1/2) = sqrt(pi), 5.4.3
// |Gamma(iy)|^2 = pi/(y sinh(pi y)), 5.4.4 |Gamma(1/2+iy)|^2 = pi/cosh(pi y),
// the recurrence 5.5.1 Gamma(z+1) = z Gamma(z) at complex z across the
// shift threshold, and the zeros at the non-positive integers.
func TestRecipGammaDLMF(t *testing.T) {
	fact := big.NewInt(1)
	for n := 1; n <= 30; n++ {
		fact.Mul(fact, big.NewInt(int64(n)))
		got := RecipGamma(NewComplex(float64(n+1), 0))
		want := new(big.Float).SetPrec(refPrec).Quo(big.NewFloat(1), new(big.Float).SetPrec(refPrec).SetInt(fact))
		if e := relErr(got.Re, want); e > 5e-30 || got.Im.Hi != 0 {
			t.Errorf("1/Gamma(%d): relative error %.3g, imaginary part %g", n+1, e, got.Im.Hi)
		}
	}
	half := RecipGamma(NewComplex(0.5, 0))
	if d := half.Re.Mul(Pi.Sqrt()).AddFloat(-1).Float64(); math.Abs(d) > 5e-30 {
		t.Errorf("Gamma(1/2) sqrt(pi)^-1 - 1 = %.3g", d)
	}
	for _, y := range []float64{0.1, 0.7, 1, 3.3, 10, 25, 60} {
		yy := New(y)
		sh, ch := SinhCosh(Pi.MulFloat(y))
		// 1/|Gamma(iy)|^2 = y sinh(pi y)/pi
		g := RecipGamma(Complex{Float{}, yy}).Abs2()
		if d := g.Div(yy.Mul(sh).Div(Pi)).AddFloat(-1).Float64(); math.Abs(d) > 1e-29 {
			t.Errorf("|Gamma(%g i)|^2: relative error %.3g", y, d)
		}
		g = RecipGamma(Complex{New(0.5), yy}).Abs2()
		if d := g.Div(ch.Div(Pi)).AddFloat(-1).Float64(); math.Abs(d) > 1e-29 {
			t.Errorf("|Gamma(1/2 + %g i)|^2: relative error %.3g", y, d)
		}
	}
	for _, z := range []Complex{NewComplex(-3.7, 0.4), NewComplex(0.3, -2), NewComplex(20.5, 3), NewComplex(21.2, 0.1), NewComplex(-1.05, 30), NewComplex(2, 63)} {
		lhs := RecipGamma(z) // 1/Gamma(z) = z/Gamma(z+1)
		rhs := z.Mul(RecipGamma(Complex{z.Re.AddFloat(1), z.Im}))
		d := lhs.Sub(rhs)
		if r := math.Sqrt(d.Abs2().Hi / rhs.Abs2().Hi); r > 1e-29 {
			t.Errorf("recurrence at %v: relative difference %.3g", z.Complex128(), r)
		}
	}
	for n := 0; n <= 5; n++ {
		if g := RecipGamma(NewComplex(float64(-n), 0)); g.Re.Hi != 0 || g.Im.Hi != 0 {
			t.Errorf("1/Gamma(%d) = %v, want 0", -n, g.Complex128())
		}
	}
}

// The Bernoulli numbers of the recurrence against DLMF Table 24.2.1.
func TestBernoulliEven(t *testing.T) {
	want := []*big.Rat{big.NewRat(1, 6), big.NewRat(-1, 30), big.NewRat(1, 42), big.NewRat(-1, 30),
		big.NewRat(5, 66), big.NewRat(-691, 2730), big.NewRat(7, 6), big.NewRat(-3617, 510)}
	got := bernoulliEven(len(want))
	for i := range want {
		if got[i].Cmp(want[i]) != 0 {
			t.Errorf("B_%d = %v, want %v", 2*i+2, got[i], want[i])
		}
	}
}
