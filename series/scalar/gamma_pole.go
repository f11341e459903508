package scalar

import (
	"fmt"
	"math/big"
	"math/bits"
)

// maxPoleIndex bounds n in GammaPoleCoeffs and RGammaPoleCoeffs.
const maxPoleIndex = 1 << 16

func checkPoleArgs(n, length int, prec uint) error {
	if n < 0 || n > maxPoleIndex {
		return fmt.Errorf("%w: pole index %d outside [0, %d]", ErrDomain, n, maxPoleIndex)
	}
	return checkLength(length, prec)
}

// GammaPoleCoeffs returns the Taylor coefficients in t of t Gamma(-n+t), n >= 0, with
// the given length at prec bits: finite at t = 0 with value (-1)^n/n!
// (DLMF 5.2.1 residues). It uses Gamma(t-n) = Gamma(1+t) / prod_{j=0}^n (t-j),
// so t Gamma(-n+t) = Gamma(1+t) / prod_{j=1}^n (t-j), and lets callers
// cancel a pole of Gamma against a zero exactly.
func GammaPoleCoeffs(n, length int, prec uint) ([]*big.Float, error) {
	if err := checkPoleArgs(n, length, prec); err != nil {
		return nil, err
	}
	return poleSeries(n, length, prec, false)
}

// RGammaPoleCoeffs returns the Taylor coefficients in t of 1/Gamma(-n+t), n >= 0, with
// the given length at prec bits: zero constant term, and linear
// coefficient (-1)^n n!. It is t prod_{j=1}^n (t-j) times the series of
// 1/Gamma(1+t).
func RGammaPoleCoeffs(n, length int, prec uint) ([]*big.Float, error) {
	if err := checkPoleArgs(n, length, prec); err != nil {
		return nil, err
	}
	return poleSeries(n, length, prec, true)
}

// poleSeries multiplies (recip) or divides the series of 1/Gamma(1+t)
// (or Gamma(1+t)) by prod_{j=1}^n (t-j), tracking cancellation and raising
// the working precision until every coefficient is accurate.
func poleSeries(n, length int, prec uint, recip bool) ([]*big.Float, error) {
	one := new(big.Float).SetInt64(1)
	wp := prec + Guard
	for try := 0; ; try++ {
		base, err := gammaTaylor(one, length, wp, recip)
		if err != nil {
			return nil, err
		}
		var factor []*big.Float // the series multiplying base
		if recip {
			factor = risingPolyCoeffs(n, length, wp)
		} else {
			factor = inversePolyCoeffs(n, length, wp)
		}
		out := zeros(length, prec)
		maxLost := 0
		acc := new(big.Float).SetPrec(wp)
		t := new(big.Float).SetPrec(wp)
		for k := 0; k < length; k++ {
			acc.SetInt64(0)
			errExp := minExp
			for i := 0; i <= k; i++ {
				if factor[i].Sign() == 0 || base[k-i].Sign() == 0 {
					continue
				}
				t.Mul(factor[i], base[k-i])
				acc.Add(acc, t)
				errExp = max(errExp, expOf(t)+1)
			}
			if errExp != minExp {
				errExp += bits.Len(uint(k + 1))
			}
			if recip && k == 0 {
				continue // exactly zero
			}
			maxLost = max(maxLost, lostBits(errExp, acc, 1))
			out[k].Set(acc)
		}
		if maxLost <= int(wp-prec)-8 || try == 4 || wp >= MaxPrec {
			return out, nil
		}
		wp = min(prec+Guard+uint(maxLost)+16, MaxPrec)
	}
}

// risingPolyCoeffs returns the coefficients (up to t^(length-1)) of
// t prod_{j=1}^n (t-j), computed exactly as integers then rounded.
func risingPolyCoeffs(n, length int, wp uint) []*big.Float {
	p := make([]*big.Int, n+2)
	for i := range p {
		p[i] = new(big.Int)
	}
	p[1].SetInt64(1) // t
	t := new(big.Int)
	for j := 1; j <= n; j++ {
		// multiply by (t - j), from the top down
		for i := j + 1; i >= 1; i-- {
			t.Mul(p[i], big.NewInt(int64(j)))
			p[i].Sub(p[i-1], t)
		}
	}
	out := make([]*big.Float, length)
	for i := range out {
		out[i] = new(big.Float).SetPrec(wp)
		if i < len(p) {
			out[i].SetInt(p[i])
		}
	}
	return out
}

// inversePolyCoeffs returns the series of 1/prod_{j=1}^n (t-j)
// = (-1)^n/n! prod_j 1/(1 - t/j); all its coefficients have one sign.
func inversePolyCoeffs(n, length int, wp uint) []*big.Float {
	e := make([]*big.Float, length)
	for i := range e {
		e[i] = new(big.Float).SetPrec(wp)
	}
	e[0].SetInt64(1)
	t := new(big.Float).SetPrec(wp)
	for j := 1; j <= n; j++ {
		jf := new(big.Float).SetInt64(int64(j))
		for k := 1; k < length; k++ {
			t.Quo(e[k-1], jf)
			e[k].Add(e[k], t)
		}
	}
	s := factorialFloat(int64(n), wp)
	if n%2 == 1 {
		s.Neg(s)
	}
	for k := range e {
		e[k].Quo(e[k], s)
	}
	return e
}
