package hightemp

import (
	"fmt"
	"math/big"
)

// Ends of the q axis for EndSeries: the variables of the eps and 1/q series.
const (
	VarEps = "eps" // eps = 1 - 2/q, around q = 2
	VarX   = "x"   // x = 1/q, around q = infinity
)

// EndSeries returns, at one beta, the coefficients of log Z/N as a series
// in eps = 1 - 2/q (variable VarEps) or x = 1/q (VarX) through power
// maxPower: coefficient m is sum_k [var^m] a_k(q) t^k, t = beta^2 (plus
// (1/2) log 2 at m = 0), summed over the exact high-temperature orders that
// s holds. Each carries the error of truncating that sum in t: twice the
// geometric tail |T_K| rho/(1 - rho), rho the largest ratio |T_k/T_(k-1)|
// of the last three terms; where the terms do not fall it is not estimated.
// The same coefficients are also Pade-resummed in t (series/pade.PadeTable;
// error stated out to padeReach times the radius of log Z at the end,
// where every coefficient's series in t is singular) and the sum with the smaller stated error is returned.
// These are the numbers the finite-beta series of package energy compute by
// solving on grids: here they come from exact coefficients.
func (s *Symbolic) EndSeries(variable string, beta *big.Float, maxPower int, prec uint) ([]Sum, error) {
	if variable != VarEps && variable != VarX {
		return nil, fmt.Errorf("%w: variable %q is neither %s nor %s", ErrInput, variable, VarEps, VarX)
	}
	if beta == nil || beta.Sign() <= 0 || beta.IsInf() {
		return nil, fmt.Errorf("%w: beta must be positive and finite", ErrInput)
	}
	if maxPower < 0 {
		return nil, fmt.Errorf("%w: negative power %d", ErrInput, maxPower)
	}
	K := s.Order()
	t := new(big.Float).SetPrec(prec).Mul(beta, beta)
	// terms[m][k] = [var^m] a_k t^k
	terms := make([][]*big.Float, maxPower+1)
	coef := make([][]*big.Rat, maxPower+1) // [var^m] a_k
	for m := range terms {
		terms[m] = make([]*big.Float, K+1)
		coef[m] = make([]*big.Rat, K+1)
		for k := range terms[m] {
			terms[m][k] = new(big.Float).SetPrec(prec)
			coef[m][k] = new(big.Rat)
		}
	}
	tk := big.NewFloat(1).SetPrec(prec)
	for k := 1; k <= K; k++ {
		tk.Mul(tk, t)
		cs := s.A[k].C
		if variable == VarEps {
			cs = s.A[k].InEps()
		}
		for m := 0; m <= maxPower && m < len(cs); m++ {
			coef[m][k].Set(cs[m])
			terms[m][k].SetRat(cs[m])
			terms[m][k].Mul(terms[m][k], tk)
		}
	}
	// Every coefficient of var^m is singular where log Z is at the end
	// itself (its derivatives in q there): t_c of q = 2 (eps^0 part) or of
	// q = infinity (the 1/q^2 part).
	ref := 0
	if variable == VarX {
		ref = 2
	}
	rs := make([]*big.Rat, K+1)
	rs[0] = new(big.Rat)
	for k := 1; k <= K; k++ {
		cs := s.A[k].C
		if variable == VarEps {
			cs = s.A[k].InEps()
		}
		rs[k] = new(big.Rat)
		if ref < len(cs) {
			rs[k].Set(cs[ref])
		}
	}
	endRadius := Radius(rs, prec)
	out := make([]Sum, maxPower+1)
	for m := range out {
		sum := new(big.Float).SetPrec(prec)
		if m == 0 {
			sum.Set(HalfLog2(prec))
		}
		for k := K; k >= 1; k-- {
			sum.Add(sum, terms[m][k])
		}
		partial := Sum{Value: sum, Method: fmt.Sprintf("exact high-temperature coefficients through t^%d summed at beta = %s", K, beta.Text('g', 10))}
		partial.Err, partial.Reason, partial.Diverges = geometricTail(terms[m][1:], prec)
		if partial.Err != nil {
			floor := new(big.Float).SetMantExp(new(big.Float).Abs(sum), -int(prec)+8)
			if partial.Err.Cmp(floor) < 0 {
				partial.Err = floor
			}
		}
		out[m] = partial
		if partial.Reason == exactReason {
			continue
		}
		// the same coefficients as a series in t, Pade-resummed at t = beta^2
		coefs := func(p uint) []*big.Float {
			cs := make([]*big.Float, K+1)
			for k := range cs {
				cs[k] = new(big.Float).SetPrec(p)
				if k == 0 && m == 0 {
					cs[0].Set(HalfLog2(p))
				}
				if k > 0 {
					cs[k].SetRat(coef[m][k])
				}
			}
			return cs
		}
		pd := padeSum(coefs, beta, big.NewFloat(1).SetPrec(prec), prec)
		limitPadeError(&pd, t, endRadius)
		summed := Summed{Partial: partial, Pade: pd}
		out[m] = summed.Best()
	}
	return out, nil
}

const exactReason = "exact: no high-temperature order contributes"

// geometricTail bounds the rest of a series from its last terms, or says
// why it cannot (or that there is no rest: "exact"); diverges reports
// last terms that grow.
func geometricTail(terms []*big.Float, prec uint) (tail *big.Float, reason string, diverges bool) {
	n := len(terms)
	if n < 4 {
		return nil, "not estimated: fewer than four high-temperature orders", false
	}
	last := new(big.Float).Abs(terms[n-1])
	if last.Sign() == 0 {
		// a polynomial in t that ends early (a power of 1/q that only low orders reach)
		allZero := true
		for _, x := range terms[n-3:] {
			allZero = allZero && x.Sign() == 0
		}
		if allZero {
			return nil, exactReason, false
		}
		return nil, "not estimated: the last term vanishes but earlier ones do not", false
	}
	rho := new(big.Float).SetPrec(prec)
	for i := n - 3; i < n; i++ {
		if terms[i-1].Sign() == 0 {
			return nil, "not estimated: a zero among the last terms", false
		}
		r := new(big.Float).SetPrec(prec).Quo(terms[i], terms[i-1])
		r.Abs(r)
		if r.Cmp(rho) > 0 {
			rho = r
		}
	}
	if rho.Cmp(big.NewFloat(1)) >= 0 {
		return nil, fmt.Sprintf("diverges: the last terms grow (ratio %s): beta^2 is beyond the radius of the series in t", rho.Text('g', 3)), true
	}
	if rho.Cmp(big.NewFloat(0.9)) >= 0 {
		return nil, fmt.Sprintf("not estimated: the last terms fall by a factor %s only", new(big.Float).Quo(big.NewFloat(1), rho).Text('g', 3)), false
	}
	tail = new(big.Float).SetPrec(prec).Quo(rho, new(big.Float).SetPrec(prec).Sub(big.NewFloat(1), rho))
	tail.Mul(tail, last)
	tail.Mul(tail, big.NewFloat(2))
	return tail, "", false
}
