package dd

import (
	"math"
	"math/big"
	"sync"
)

// EulerGamma is Euler's constant (DLMF 5.2.3), from its decimal expansion
// (written from memory; the test checks it against the harmonic-number
// limit with its Euler-Maclaurin corrections, DLMF 2.10.8).
var EulerGamma = mustParse("0.57721566490153286060651209008240243104215933593992")

var (
	zetaOnce sync.Once
	zetaB    []*big.Rat // B_2 .. B_2*zetaTerms
)

const (
	zetaShift = 30 // terms summed directly
	zetaTerms = 15 // Bernoulli terms of the tail
)

// Zeta returns the Riemann zeta function at an integer s >= 2 (NaN
// otherwise): sum_{m < 30} m^-s plus the Euler-Maclaurin tail at 30 with 15
// Bernoulli terms (DLMF 2.10.1 applied to 25.2.1), whose first omitted term
// is below 1e-38 for every s >= 2.
func Zeta(s int) Float {
	if s < 2 {
		return Float{Hi: math.NaN()}
	}
	zetaOnce.Do(func() { zetaB = bernoulliEven(zetaTerms) })
	sum := Float{}
	for m := zetaShift - 1; m >= 1; m-- {
		sum = sum.Add(powInt(New(float64(m)), -s))
	}
	n := New(zetaShift)
	ns := powInt(n, -s) // N^-s
	sum = sum.Add(ns.MulFloat(zetaShift).DivFloat(float64(s - 1)))
	sum = sum.Add(ns.Ldexp(-1))
	// B_2j/(2j)! s (s+1) ... (s+2j-2) N^{-s-2j+1}
	rising := new(big.Rat).SetInt64(int64(s))
	fact := new(big.Rat).SetInt64(2)
	pw := ns.DivFloat(zetaShift) // N^{-s-1}
	for j := 1; j <= zetaTerms; j++ {
		c := new(big.Rat).Mul(zetaB[j-1], rising)
		c.Quo(c, fact)
		sum = sum.Add(FromBig(new(big.Float).SetPrec(200).SetRat(c)).Mul(pw))
		rising.Mul(rising, big.NewRat(int64((s+2*j-1)*(s+2*j)), 1))
		fact.Mul(fact, big.NewRat(int64((2*j+1)*(2*j+2)), 1))
		pw = pw.DivFloat(zetaShift * zetaShift)
	}
	return sum
}

// powInt returns x^k for an integer k by repeated squaring.
func powInt(x Float, k int) Float {
	if k < 0 {
		return powInt(x, -k).Inv()
	}
	r := New(1)
	for ; k > 0; k >>= 1 {
		if k&1 == 1 {
			r = r.Mul(x)
		}
		x = x.Mul(x)
	}
	return r
}
