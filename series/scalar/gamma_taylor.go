package scalar

import (
	"fmt"
	"math/big"
	"math/bits"
)

// checkTaylorArgs validates the common arguments of the Taylor routines.
func checkTaylorArgs(name string, x0 *big.Float, n int, prec uint) error {
	if err := checkLength(n, prec); err != nil {
		return err
	}
	return checkReal(name, x0)
}

// lgammaTaylorHigh returns the Taylor coefficients c_k, k = 2..n-1, of
// log|Gamma(x0+t)| at prec bits (entries 0 and 1 are nil); x0 is not a pole.
//
// For x0 > 0, c_k = (-1)^k zeta(k, x0)/k (DLMF 5.7.3 shifted to x0). For
// x0 < 0 the reflection log|Gamma(x)| = log pi - log|sin pi x| - log Gamma(1-x)
// gives c_k = -pi^k P_{k-1}(cot pi x0)/k! - zeta(k, 1-x0)/k, where
// P_m(cot u) = d^m/du^m cot u; the two parts can cancel, so the working
// precision is raised until every coefficient is accurate.
func lgammaTaylorHigh(x0 *big.Float, n int, prec uint) ([]*big.Float, error) {
	out := make([]*big.Float, n)
	if n <= 2 {
		return out, nil
	}
	if x0.Sign() > 0 {
		z, err := hurwitzZetaInts(x0, n-1, prec+4)
		if err != nil {
			return nil, err
		}
		for k := 2; k < n; k++ {
			c := new(big.Float).SetPrec(prec).Quo(z[k], new(big.Float).SetInt64(int64(k)))
			if k%2 == 1 {
				c.Neg(c)
			}
			out[k] = c
		}
		return out, nil
	}
	wp := prec + Guard
	for try := 0; ; try++ {
		y := addIntExact(new(big.Float).Neg(x0), 1, wp)
		z, err := hurwitzZetaInts(y, n-1, wp)
		if err != nil {
			return nil, err
		}
		_, f := splitNearestInt(x0, wp)
		sn, cs := sinCosPi(f, wp)
		cot := new(big.Float).SetPrec(wp).Quo(cs, sn)
		cd := cotDerivatives(cot, n-2, wp)
		fact := new(big.Float).SetPrec(wp).SetInt64(1)
		a := new(big.Float).SetPrec(wp)
		b := new(big.Float).SetPrec(wp)
		maxLost := 0
		for k := 2; k < n; k++ {
			fact.Mul(fact, new(big.Float).SetInt64(int64(k)))
			a.Quo(cd[k-1], fact)
			b.Quo(z[k], new(big.Float).SetInt64(int64(k)))
			c := new(big.Float).SetPrec(wp).Add(a, b)
			c.Neg(c)
			lost := max(expOf(a), expOf(b)) - expOf(c)
			if c.Sign() == 0 {
				lost = int(wp)
			}
			maxLost = max(maxLost, lost)
			out[k] = c
		}
		if maxLost <= int(wp-prec)-8 || try == 4 || wp >= MaxPrec {
			for k := 2; k < n; k++ {
				out[k].SetPrec(prec)
			}
			return out, nil
		}
		wp = min(prec+Guard+uint(maxLost)+16, MaxPrec)
	}
}

// LogGammaTaylor returns the first n Taylor coefficients of log|Gamma| at
// x0: c_0 = log|Gamma(x0)|, c_1 = psi(x0), c_k = (-1)^k zeta(k, x0)/k for
// k >= 2 (DLMF 5.7.3, 25.11.12), each accurate to prec bits. Negative
// non-integer x0 is handled by the reflection formula. It returns ErrPole at
// x0 = 0, -1, -2, ... (see GammaPoleCoeffs there).
func LogGammaTaylor(x0 *big.Float, n int, prec uint) ([]*big.Float, error) {
	if err := checkTaylorArgs("LogGammaTaylor", x0, n, prec); err != nil {
		return nil, err
	}
	if isGammaPole(x0) {
		return nil, fmt.Errorf("%w: log Gamma series at %s", ErrPole, x0.Text('g', 10))
	}
	if out := memoGet(x0, n, prec); out != nil {
		return out, nil
	}
	out, err := lgammaTaylorHigh(x0, n, prec)
	if err != nil {
		return nil, err
	}
	if out[0], err = BigLogGamma(x0, prec); err != nil {
		return nil, err
	}
	if n > 1 {
		if out[1], err = BigDigamma(x0, prec); err != nil {
			return nil, err
		}
	}
	memoPut(x0, out, prec)
	return out, nil
}

// DigammaTaylor returns the first n Taylor coefficients of psi at x0:
// psi(x0), then psi^(k)(x0)/k! = (-1)^(k+1) zeta(k+1, x0) for k >= 1, each
// accurate to prec bits. It returns ErrPole at x0 = 0, -1, -2, ...
func DigammaTaylor(x0 *big.Float, n int, prec uint) ([]*big.Float, error) {
	return PolygammaTaylor(0, x0, n, prec)
}

// PolygammaTaylor returns the first n Taylor coefficients of psi^(m) at
// x0 for m >= 0: psi^(m+k)(x0)/k! = (m+k+1)!/k! c_{m+k+1} with c the log
// Gamma coefficients. It returns ErrPole at x0 = 0, -1, -2, ...
func PolygammaTaylor(m int, x0 *big.Float, n int, prec uint) ([]*big.Float, error) {
	if m < 0 || m > maxPolygammaOrder {
		return nil, fmt.Errorf("%w: polygamma order %d outside [0, %d]", ErrDomain, m, maxPolygammaOrder)
	}
	if err := checkTaylorArgs("polygamma series", x0, n, prec); err != nil {
		return nil, err
	}
	if isGammaPole(x0) {
		return nil, fmt.Errorf("%w: polygamma series at %s", ErrPole, x0.Text('g', 10))
	}
	c, err := lgammaTaylorHigh(x0, m+n+1, prec+4)
	if err != nil {
		return nil, err
	}
	out := make([]*big.Float, n)
	f := new(big.Int)
	for k := 0; k < n; k++ {
		if m+k == 0 {
			if out[0], err = BigDigamma(x0, prec); err != nil {
				return nil, err
			}
			continue
		}
		f.MulRange(int64(k+1), int64(m+k+1))
		v := new(big.Float).SetPrec(prec + 4).SetInt(f)
		out[k] = v.Mul(v, c[m+k+1]).SetPrec(prec)
	}
	return out, nil
}

// specialExpSeries returns the Taylor coefficients of f = f0 exp(g - g_0)
// from those of g, by the recurrence k f_k = sum_{j=1}^k j g_j f_{k-j} that
// follows from f' = g' f, and for each coefficient an estimate of the bits
// lost to cancellation (relative error about 2^(lost-wp)). The general Exp
// of a series can replace it; this one also tracks the lost bits, which the
// callers need to choose their working precision.
func specialExpSeries(g []*big.Float, f0 *big.Float, wp uint) ([]*big.Float, []int) {
	n := len(g)
	f := make([]*big.Float, n)
	lost := make([]int, n)
	f[0] = new(big.Float).SetPrec(wp).Set(f0)
	t := new(big.Float).SetPrec(wp)
	for k := 1; k < n; k++ {
		acc := new(big.Float).SetPrec(wp)
		errExp := minExp
		for j := 1; j <= k; j++ {
			if g[j].Sign() == 0 || f[k-j].Sign() == 0 {
				continue
			}
			t.Mul(g[j], f[k-j])
			t.Mul(t, new(big.Float).SetInt64(int64(j)))
			acc.Add(acc, t)
			errExp = max(errExp, expOf(t)+max(lost[k-j], 1))
		}
		errExp += bits.Len(uint(k))
		f[k] = acc.Quo(acc, new(big.Float).SetInt64(int64(k)))
		lost[k] = lostBits(errExp, acc, k)
	}
	return f, lost
}

// minExp is below the exponent of any nonzero float we handle.
const minExp = -1 << 40

// lostBits converts the exponent of an error bound on k*v (or on v when
// k == 1) into bits lost relative to v; all bits when v is zero.
func lostBits(errExp int, v *big.Float, k int) int {
	if errExp == minExp {
		return 0
	}
	if v.Sign() == 0 {
		return 1 << 30
	}
	l := errExp - (expOf(v) + bits.Len(uint(k)) - 1)
	return max(l, 0)
}

// GammaTaylor returns the first n Taylor coefficients of Gamma at x0,
// each accurate to prec bits; ErrPole at x0 = 0, -1, -2, ...
func GammaTaylor(x0 *big.Float, n int, prec uint) ([]*big.Float, error) {
	return gammaTaylor(x0, n, prec, false)
}

// RGammaTaylor returns the first n Taylor coefficients of the entire
// function 1/Gamma at x0, each accurate to prec bits.
func RGammaTaylor(x0 *big.Float, n int, prec uint) ([]*big.Float, error) {
	return gammaTaylor(x0, n, prec, true)
}

// gammaTaylor returns the first n Taylor coefficients of Gamma (recip
// false) or 1/Gamma (recip true) at x0, each accurate to prec bits: the
// exponential of the log Gamma series, with the working precision raised
// until the recurrence has lost no more than the Guard bits (1/Gamma is
// entire, so its coefficients are far smaller than the terms that form
// them). At a pole, 1/Gamma comes from RGammaPoleCoeffs and Gamma is an
// error.
func gammaTaylor(x0 *big.Float, n int, prec uint, recip bool) ([]*big.Float, error) {
	if err := checkTaylorArgs("Gamma series", x0, n, prec); err != nil {
		return nil, err
	}
	if isGammaPole(x0) {
		if !recip {
			return nil, fmt.Errorf("%w: Gamma series at %s", ErrPole, x0.Text('g', 10))
		}
		m, _ := x0.Int64()
		s, err := RGammaPoleCoeffs(int(-m), n, prec)
		if err != nil {
			return nil, err
		}
		return s, nil
	}
	wp := prec + Guard
	for try := 0; ; try++ {
		c, err := lgammaTaylorHigh(x0, n, wp)
		if err != nil {
			return nil, err
		}
		f0, err := gammaReal(x0, wp)
		if err != nil {
			return nil, err
		}
		if n > 1 {
			c[1], _, err = psiReal(x0, wp)
			if err != nil {
				return nil, err
			}
		}
		c[0] = new(big.Float)
		if recip {
			f0.Quo(big.NewFloat(1), f0)
			for k := 1; k < n; k++ {
				c[k].Neg(c[k])
			}
		}
		f, lost := specialExpSeries(c, f0, wp)
		maxLost := 0
		for _, l := range lost {
			maxLost = max(maxLost, l)
		}
		if maxLost <= int(wp-prec)-8 || try == 4 || wp >= MaxPrec {
			for k := range f {
				f[k].SetPrec(prec)
			}
			return f, nil
		}
		wp = min(prec+Guard+uint(maxLost)+16, MaxPrec)
	}
}
