package hightemp

import (
	"fmt"
	"math/big"
)

// RadiusEstimate is the nearest singularity of log Z/N in the complex
// t = (beta script-J)^2 plane, read off the exact coefficients.
type RadiusEstimate struct {
	// T is the singular point (negative when the coefficients alternate:
	// it then lies at imaginary beta) and TErr its error; both nil when
	// not estimated.
	T, TErr *big.Float
	// Beta = sqrt(|T|) is the beta script-J at which the series in t stops
	// converging, with its error BetaErr.
	Beta, BetaErr *big.Float
	// Method says how the estimate was made; Reason, when T is nil, why
	// there is none.
	Method, Reason string
}

// minRadiusTerms is the fewest coefficients a radius estimate uses.
const minRadiusTerms = 8

// Radius estimates the singularity nearest to t = 0 of sum_k a[k] t^k
// (a[0] is ignored) by the ratio method: r_k = a_k/a_(k+1) tends to the
// singular point t_c like t_c (1 + (1+gamma)/k + O(1/k^2)) for a branch
// point (t_c - t)^gamma, so Neville's extrapolation of r_k in 1/k to 1/k = 0
// removes the corrections order by order. Of extrapolations through m+1
// ratios it keeps the m whose value moves least, both against m-1 and
// against the same m one ratio earlier, and states four times that motion
// as the error (checked against the exact q = 2 and q = infinity points in
// the tests). Coefficients that do not keep one sign pattern mean complex
// singularities nearest, and no estimate.
func Radius(a []*big.Rat, prec uint) RadiusEstimate {
	K := len(a) - 1
	if K < minRadiusTerms {
		return RadiusEstimate{Reason: fmt.Sprintf("not estimated: %d coefficients, the ratio method needs at least %d", K, minRadiusTerms)}
	}
	// ratios r_k, k = 1 .. K-1, with h_k = 1/k
	n := K - 1
	rs := make([]*big.Float, n)
	hs := make([]*big.Float, n)
	for k := 1; k <= n; k++ {
		if a[k+1].Sign() == 0 || a[k].Sign() == 0 {
			return RadiusEstimate{Reason: fmt.Sprintf("not estimated: coefficient %d is zero, so the ratios do not settle", k)}
		}
		r := new(big.Rat).Quo(a[k], a[k+1])
		rs[k-1] = new(big.Float).SetPrec(prec).SetRat(r)
		hs[k-1] = new(big.Float).SetPrec(prec).Quo(big.NewFloat(1).SetPrec(prec), new(big.Float).SetPrec(prec).SetInt64(int64(k)))
	}
	sign := rs[n-1].Sign()
	for i := n / 2; i < n; i++ {
		if rs[i].Sign() != sign {
			return RadiusEstimate{Reason: "not estimated: the ratios of consecutive coefficients change sign, so the nearest singularities are a complex pair, which the ratio method does not locate"}
		}
	}
	maxM := min(10, n/3)
	var best, bestSpread *big.Float
	bestM := 0
	prev := neville(hs[n-1:], rs[n-1:], prec) // m = 0
	for m := 1; m <= maxM; m++ {
		v := neville(hs[n-1-m:], rs[n-1-m:], prec)
		vEarlier := neville(hs[n-2-m:n-1], rs[n-2-m:n-1], prec)
		s1 := new(big.Float).Sub(v, prev)
		s2 := new(big.Float).Sub(v, vEarlier)
		spread := new(big.Float).Abs(s1)
		if s2.Abs(s2).Cmp(spread) > 0 {
			spread = s2
		}
		if bestSpread == nil || spread.Cmp(bestSpread) < 0 {
			best, bestSpread, bestM = v, spread, m
		}
		prev = v
	}
	floor := new(big.Float).SetMantExp(new(big.Float).Abs(best), -int(prec)+8)
	errT := new(big.Float).SetPrec(prec).Mul(bestSpread, big.NewFloat(4))
	if errT.Cmp(floor) < 0 {
		errT = floor
	}
	beta := new(big.Float).SetPrec(prec).Sqrt(new(big.Float).Abs(best))
	betaErr := new(big.Float).SetPrec(prec).Quo(errT, new(big.Float).Mul(beta, big.NewFloat(2)))
	return RadiusEstimate{T: best, TErr: errT, Beta: beta, BetaErr: betaErr,
		Method: fmt.Sprintf("ratio method on %d exact coefficients: a_k/a_(k+1) extrapolated in 1/k through %d ratios (Neville); error 4x the larger change against one ratio fewer and one ratio earlier", K, bestM+1)}
}

// neville extrapolates the points (h_i, y_i) to h = 0 with the polynomial
// through all of them.
func neville(h, y []*big.Float, prec uint) *big.Float {
	p := make([]*big.Float, len(y))
	for i := range y {
		p[i] = new(big.Float).SetPrec(prec).Set(y[i])
	}
	for lvl := 1; lvl < len(y); lvl++ {
		for i := len(y) - 1; i >= lvl; i-- {
			// p_i = (h_(i-lvl) p_i - h_i p_(i-1)) / (h_(i-lvl) - h_i), evaluated at 0
			a := new(big.Float).SetPrec(prec).Mul(h[i-lvl], p[i])
			b := new(big.Float).SetPrec(prec).Mul(h[i], p[i-1])
			d := new(big.Float).SetPrec(prec).Sub(h[i-lvl], h[i])
			p[i] = a.Sub(a, b).Quo(a, d)
		}
	}
	return p[len(y)-1]
}
