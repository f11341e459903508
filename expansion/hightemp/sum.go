package hightemp

import (
	"fmt"
	"math/big"
	"strings"

	"qbridge/series"
	"qbridge/series/pade"
)

// Sum is a high-temperature quantity summed at one beta.
type Sum struct {
	// Value and Err are the estimate and its error; Err is nil when not
	// estimated, and Reason says why.
	Value, Err *big.Float
	// Method says how the value was obtained.
	Method, Reason string
	// Diverges marks a partial sum taken beyond the radius of convergence:
	// Value is then the sum of the terms, not an estimate of the quantity.
	Diverges bool
}

// Summed holds the two ways of summing a quantity at one beta.
type Summed struct {
	// Partial is the partial sum through the highest order, with a
	// geometric tail bound from the radius.
	Partial Sum
	// Pade is the Pade table in t = beta^2 of the same coefficients.
	Pade Sum
	// Radius is the nearest singularity of log Z in t.
	Radius RadiusEstimate
}

// Best returns the sum with the smaller stated error; when neither has
// one, the Pade value unless it failed, since a partial sum without an
// error is one taken at or beyond the radius.
func (s *Summed) Best() Sum {
	switch {
	case s.Pade.Err == nil && s.Partial.Err == nil:
		if s.Pade.Value != nil {
			return s.Pade
		}
		return s.Partial
	case s.Pade.Err == nil:
		return s.Partial
	case s.Partial.Err == nil || s.Pade.Err.Cmp(s.Partial.Err) < 0:
		return s.Pade
	}
	return s.Partial
}

// Summable reports whether kind is a function of beta (the cumulants and
// moments are numbers, not summed).
func Summable(kind Kind) bool {
	return kind == LogZ || kind == Energy || kind == Entropy || kind == Heat
}

// Evaluate sums kind at beta (beta script-J, > 0) from the coefficients c,
// in prec bits. The quantity is a series in t = beta^2 (times beta for
// the energy): f = beta^s (f_0 + sum_k f_k t^k). The partial sum's error is
// twice the geometric tail |f_K t^K| rho/(1-rho), rho = t/|t_c| from the
// radius; at or beyond the radius, or without one, it is not estimated.
// The Pade table's error is its spread (series/pade.PadeTable).
func Evaluate(kind Kind, c *Coefficients, beta *big.Float, prec uint) (*Summed, error) {
	if !Summable(kind) {
		return nil, fmt.Errorf("%w: %s is not a function of beta", ErrInput, kind)
	}
	if beta == nil || beta.Sign() <= 0 || beta.IsInf() {
		return nil, fmt.Errorf("%w: beta must be positive and finite", ErrInput)
	}
	K := c.Order()
	odd := kind == Energy
	terms := Derive(kind, c)
	// coefs returns f_k in t at precision p (for the energy f_k multiplies
	// beta t^k, k = 0..K-1). They are exact rationals, so any precision
	// can be had.
	coefs := func(p uint) []*big.Float {
		f := make([]*big.Float, K+1)
		for i := range f {
			f[i] = new(big.Float).SetPrec(p)
		}
		for _, term := range terms {
			k := term.Power / 2
			if odd {
				k = (term.Power - 1) / 2
			}
			if term.HalfLog2 {
				f[k].Set(HalfLog2(p))
				continue
			}
			f[k].SetRat(term.Value)
		}
		if odd {
			f = f[:K]
		}
		return f
	}
	t := new(big.Float).SetPrec(prec).Mul(beta, beta)
	out := &Summed{Radius: Radius(c.A, prec)}
	pre := big.NewFloat(1).SetPrec(prec)
	if odd {
		pre.Set(beta)
	}
	out.Partial = partialSum(coefs(prec), t, pre, out.Radius, prec)
	out.Pade = padeSum(coefs, beta, pre, prec)
	limitPadeError(&out.Pade, t, out.Radius)
	return out, nil
}

func partialSum(f []*big.Float, t, pre *big.Float, r RadiusEstimate, prec uint) Sum {
	sum := new(big.Float).SetPrec(prec)
	for k := len(f) - 1; k >= 0; k-- {
		sum.Mul(sum, t)
		sum.Add(sum, f[k])
	}
	sum.Mul(sum, pre)
	K := len(f) - 1
	out := Sum{Value: sum, Method: fmt.Sprintf("partial sum through t^%d (t = beta^2), exact coefficients", K)}
	if r.T == nil {
		out.Reason = "tail not estimated, since the radius is not: " + strings.TrimPrefix(r.Reason, "not estimated: ")
		return out
	}
	// the radius is known to |T| -+ TErr
	lo := new(big.Float).SetPrec(prec).Abs(r.T)
	hi := new(big.Float).SetPrec(prec).Add(lo, r.TErr)
	lo.Sub(lo, r.TErr)
	if t.Cmp(hi) > 0 {
		out.Diverges = true
		out.Reason = fmt.Sprintf("diverges: beta^2 = %s lies beyond the radius |t_c| = %s +- %s", t.Text('g', 6), new(big.Float).Abs(r.T).Text('g', 6), r.TErr.Text('e', 1))
		return out
	}
	rho := new(big.Float).SetPrec(prec).Quo(t, lo)
	if lo.Sign() <= 0 || rho.Cmp(big.NewFloat(1)) >= 0 {
		out.Reason = fmt.Sprintf("tail not estimated: beta^2 = %s is not safely inside the radius |t_c| = %s +- %s", t.Text('g', 6), new(big.Float).Abs(r.T).Text('g', 6), r.TErr.Text('e', 1))
		return out
	}
	last := new(big.Float).SetPrec(prec).Abs(f[K])
	for range K {
		last.Mul(last, t)
	}
	last.Mul(last, new(big.Float).Abs(pre))
	tail := new(big.Float).SetPrec(prec).Quo(rho, new(big.Float).SetPrec(prec).Sub(big.NewFloat(1), rho))
	tail.Mul(tail, last)
	tail.Mul(tail, big.NewFloat(2))
	floor := new(big.Float).SetMantExp(new(big.Float).Abs(sum), -int(prec)+8)
	if tail.Cmp(floor) < 0 {
		tail = floor
	}
	out.Err = tail
	out.Method += "; error twice the geometric tail |f_K t^K| rho/(1 - rho), rho = t/|t_c|"
	return out
}

// padeGuard is the working precision the Pade table gets beyond the
// requested one, per coefficient: the Hankel systems lose about a bit per
// order (at order 60 and 84 bits the value lost 47 bits), so the table
// runs at prec + padeGuard*len + 32 bits and the selected entry is
// rebuilt 64 bits higher still; the change is the rounding error.
const padeGuard = 2

func padeSum(coefs func(p uint) []*big.Float, beta, pre *big.Float, prec uint) Sum {
	f := coefs(prec)
	wp := prec + padeGuard*uint(len(f)) + 32
	t := new(big.Float).SetPrec(wp).Mul(beta, beta)
	s, err := series.FromBig(wp, coefs(wp))
	if err != nil {
		return Sum{Reason: "Pade table not built: " + err.Error()}
	}
	r, err := pade.PadeTable(s, t, pade.PadeTableOptions{})
	if err != nil {
		return Sum{Reason: "no Pade entry in t is free of poles between 0 and beta^2 (" + err.Error() + ")"}
	}
	e := new(big.Float).SetPrec(prec).Set(r.Err)
	spread := "the spread of the highest admissible entry and the next"
	if r.Used > 2 {
		spread = fmt.Sprintf("the spread of the %d highest admissible entries", r.Used)
	}
	// The spread of neighbouring entries can understate far outside the
	// radius; the table four orders lower must agree within the error too.
	lower := ""
	if n := s.Len() - 4; n >= 8 {
		if short, err := s.Truncate(n); err == nil {
			if r2, err := pade.PadeTable(short, t, pade.PadeTableOptions{}); err == nil {
				d := new(big.Float).SetPrec(prec).Sub(r.Value, r2.Value)
				if d.Abs(d).Cmp(e) > 0 {
					e = d
				}
				lower = fmt.Sprintf(" and the change from the table through t^%d", n-1)
			}
		}
	}
	// rounding: the same entry 64 bits higher
	rounding := ""
	if hi, err := series.FromBig(wp+64, coefs(wp+64)); err == nil {
		if p, err := pade.NewPade(hi, r.L, r.M); err == nil {
			if v, err := p.Eval(new(big.Float).SetPrec(wp+64).Mul(beta, beta)); err == nil {
				d := new(big.Float).SetPrec(prec).Sub(v, r.Value)
				e.Add(e, d.Abs(d))
				rounding = fmt.Sprintf(", plus the rounding error (the entry rebuilt at %d bits against %d)", wp+64, wp)
			}
		}
	}
	v := new(big.Float).SetPrec(prec).Mul(r.Value, pre)
	e.Mul(e, new(big.Float).Abs(pre))
	// the value is returned in prec bits
	if floor := new(big.Float).SetMantExp(new(big.Float).Abs(v), -int(prec)+8); e.Cmp(floor) < 0 {
		e = floor
	}
	return Sum{Value: v, Err: e, Method: fmt.Sprintf("Pade [%d/%d] in t = beta^2 of the exact coefficients at %d bits; error the larger of %s%s%s", r.L, r.M, wp, spread, lower, rounding)}
}

// padeReach is how far beyond the nearest singularity, in units of |t_c|,
// the Pade error is stated: out to 10 |t_c| it covered the true error in
// every test (q = 2 against quadrature to beta = 5, the eps and 1/q
// coefficients against the grid series to beta = 3); at 57 |t_c|
// (beta = 10 at large q) it did not.
const padeReach = 10

// limitPadeError withdraws the Pade error beyond padeReach |t_c|, and
// beyond t = 1 when no radius is known.
func limitPadeError(s *Sum, t *big.Float, r RadiusEstimate) {
	if s.Err == nil {
		return
	}
	limit := big.NewFloat(1)
	what := "t = 1 (no radius estimate)"
	if r.T != nil {
		limit = new(big.Float).Abs(r.T)
		limit.Mul(limit, big.NewFloat(padeReach))
		what = fmt.Sprintf("%d times |t_c| = %s", padeReach, limit.Text('g', 4))
	}
	if t.Cmp(limit) > 0 {
		s.Err = nil
		s.Reason = fmt.Sprintf("error not estimated: beta^2 = %s lies beyond %s, where the spread of the table was not seen to cover the true error", t.Text('g', 4), what)
	}
}
