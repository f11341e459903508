package expansion

import (
	"errors"
	"fmt"
	"math/big"
	"sort"

	"qbridge/series"
	"qbridge/series/pade"
	"qbridge/series/scalar"
)

// twoPointSet is the q-independent part of pade.ResumTwoPoint for the
// series at x = 0 and x = 1/2 of one function: the scan over total orders,
// splits and [L/M] entries, each approximant built and checked for poles
// once. The pole check of ResumTwoPoint looks at the hull of a, b and the
// evaluation point, which for every q >= 2 (0 <= x <= 1/2) is the segment
// [0, 1/2] itself: the admissible entries do not depend on q, only their
// values do. At then repeats ResumTwoPoint's selection (median of the
// highest order, largest deviation of all admissible entries) at one x; a
// test holds it to the same bits as ResumTwoPoint.
type twoPointSet struct {
	// ok are the pole-free approximants, in scan order.
	ok []*pade.TwoPoint
	// scanned counts every entry tried.
	scanned int
	prec    uint
}

// newTwoPointSet scans the entries exactly as pade.ResumTwoPoint does with
// zero options, for sa in powers of x - a and sb in powers of x - b, with
// a = 0 and b = 1/2.
func newTwoPointSet(sa *series.Series, a *big.Float, sb *series.Series, b *big.Float) (*twoPointSet, error) {
	if sa == nil || sb == nil || a == nil || b == nil || a.Cmp(b) == 0 {
		return nil, errors.New("two-point set: nil series or equal expansion points")
	}
	prec := max(sa.Prec(), sb.Prec())
	// The defaults of pade.TwoPointOptions.
	n0 := sa.Len() + sb.Len()
	orders, diag := 2, 1
	minK := max(n0/4, 1)
	margin := new(big.Float).SetPrec(prec).Sub(b, a)
	margin.Abs(margin)
	margin.Quo(margin, big.NewFloat(100))
	dtol := new(big.Float).SetMantExp(big.NewFloat(1), -int(prec/4))
	lo, hi := a, b
	if lo.Cmp(hi) > 0 {
		lo, hi = hi, lo
	}
	// As in ResumTwoPoint: the window of the top orders steps down until
	// it holds two pole-free entries.
	// (ResumTwoPoint counts an entry once its value at x is computed; this
	// set counts pole-free entries before any x is known, so the two can
	// step down differently only when an evaluation of a pole-free entry
	// fails, which at() then reports.)
	set := &twoPointSet{prec: prec}
	for top := n0; top >= 2 && top >= 2*minK; top-- {
		set = scanTwoPoint(sa, a, sb, b, top, orders, diag, minK, margin, dtol, lo, hi, prec)
		if len(set.ok) >= 2 {
			break
		}
	}
	return set, nil
}

// scanTwoPoint scans the total orders top down to top - orders + 1.
func scanTwoPoint(sa *series.Series, a *big.Float, sb *series.Series, b *big.Float, top, orders, diag, minK int, margin, dtol, lo, hi *big.Float, prec uint) *twoPointSet {
	set := &twoPointSet{prec: prec}
	for n := top; n > top-orders && n >= 2; n-- {
		for k1 := minK; k1 <= n-minK; k1++ {
			k2 := n - k1
			if k1 > sa.Len() || k2 > sb.Len() {
				continue
			}
			for m := 0; m < n; m++ {
				l := n - 1 - m
				if l-m > diag || m-l > diag {
					continue
				}
				set.scanned++
				tp, err := pade.TwoPointPade(sa, a, k1, sb, b, k2, l, m)
				if err != nil {
					continue
				}
				near, err := tp.PolesNear(lo, hi, margin, dtol)
				if err != nil || len(near) > 0 {
					continue
				}
				set.ok = append(set.ok, tp)
			}
		}
	}
	return set
}

// at evaluates the set at x (0 <= x <= 1/2) and selects as ResumTwoPoint.
func (s *twoPointSet) at(x *big.Float) (*pade.Resummed, error) {
	type entry struct {
		tp *pade.TwoPoint
		v  *big.Float
	}
	var ok []entry
	top := -1
	for _, tp := range s.ok {
		v, err := tp.Eval(x)
		if err != nil {
			continue
		}
		ok = append(ok, entry{tp, v})
		top = max(top, tp.K1+tp.K2)
	}
	if len(ok) < 2 {
		return nil, fmt.Errorf("two-point Pade: only %d pole-free approximants; no error estimate possible", len(ok))
	}
	var best []entry
	for _, e := range ok {
		if e.tp.K1+e.tp.K2 == top {
			best = append(best, e)
		}
	}
	sort.SliceStable(best, func(i, j int) bool { return best[i].v.Cmp(best[j].v) < 0 })
	med := best[(len(best)-1)/2]
	spread := new(big.Float).SetPrec(s.prec).Abs(med.v)
	spread.SetMantExp(spread, -int(s.prec)+8)
	d := new(big.Float).SetPrec(s.prec)
	for _, e := range ok {
		d.Sub(e.v, med.v)
		scalar.RaiseAbs(spread, d)
	}
	return &pade.Resummed{
		Value: new(big.Float).SetPrec(s.prec).Set(med.v), Err: spread,
		L: med.tp.L, M: med.tp.M, K1: med.tp.K1, K2: med.tp.K2, Used: len(ok),
		Method: fmt.Sprintf("two-point Pade at x = %.6g: median of %d pole-free entries with K1+K2 = %d; error = max deviation of all %d pole-free entries scanned",
			x, len(best), top, len(ok)),
	}, nil
}
