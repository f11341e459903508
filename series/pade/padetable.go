package pade

import (
	"qbridge/series"
	"qbridge/series/scalar"

	"errors"
	"fmt"
	"math/big"
	"sort"
)

// PadeTableOptions controls PadeTable. The zero value asks for the defaults.
type PadeTableOptions struct {
	// N is the highest order L+M used; 0 means s.Len()-1.
	N int
	// Width is the largest |L-M| of the entries built and reported; 0 means
	// 2, and it is raised to Diag if smaller. Set it to N for the full
	// triangle.
	Width int
	// Diag is the largest |L-M| of the entries that enter the estimate; 0
	// means 1.
	Diag int
	// Best is how many of the highest-order admissible entries enter the
	// error estimate; 0 means 3. It must be at least 2.
	Best int
	// PoleMargin is the distance from the segment between the expansion
	// point and x within which a pole disqualifies an entry; nil means
	// |x|/100.
	PoleMargin *big.Float
	// DoubletTol is the pole-zero distance below which a pole counts as
	// half of a Froissart doublet and is ignored; nil means 2^-(prec/4),
	// prec being the series precision in bits.
	DoubletTol *big.Float
}

// PadeEntry is one approximant of a resummation table.
type PadeEntry struct {
	// L and M are the requested numerator and denominator degrees.
	L, M int
	// K1 and K2 are the numbers of matched terms at the two ends of a
	// two-point approximant (zero for one-point tables).
	K1, K2 int
	// Value is the approximant at the evaluation point (nil if not computed).
	Value *big.Float
	// OK is true when the entry is pole-free on the region and was evaluated.
	OK bool
	// Reason says why an entry is not OK, or notes a degenerate system.
	Reason string
}

// Resummed is the result of a Pade resummation.
type Resummed struct {
	// Value is the resummed value and Err the error estimate (see Method).
	Value, Err *big.Float
	// L, M (and K1, K2 for two-point) identify the entry that gave Value.
	L, M, K1, K2 int
	// Used is the number of entries that entered the estimate.
	Used int
	// Method says in words how Value and Err were obtained.
	Method string
	// Entries is the table of all approximants built, for display.
	Entries []PadeEntry
}

// PadeTable resums the series s (in t around t = 0) at t = x. It builds the
// [L/M] approximants with L+M <= N and |L-M| <= Width, and evaluates those
// with no pole within PoleMargin of the segment [0, x] other than Froissart
// doublets. Of the admissible entries with |L-M| <= Diag it ranks by order
// L+M (highest first, then closest to the diagonal) and takes the first
// Best. Value is the first of these; Err is the largest deviation of the
// others from it, but at least 2^-(prec-8) |Value|. For a convergent
// sequence this overestimates the error of the leading entry by the ratio of
// the errors at neighbouring orders, which is what makes it a usable bound.
// It measures the truncation of the series only: errors in the coefficients
// themselves move every entry alike and do not show in the spread.
func PadeTable(s *series.Series, x *big.Float, opts PadeTableOptions) (*Resummed, error) {
	if s == nil || x == nil || x.IsInf() {
		return nil, errors.New("series: PadeTable: nil series or nil/infinite point")
	}
	prec := s.Prec()
	o, err := padeTableDefaults(opts, s.Len(), x, prec)
	if err != nil {
		return nil, err
	}
	zero := new(big.Float).SetPrec(prec)
	var entries []PadeEntry
	for n := 0; n <= o.N; n++ {
		for L := n; L >= 0; L-- {
			M := n - L
			if padeAbsInt(L-M) > o.Width {
				continue
			}
			e := PadeEntry{L: L, M: M}
			p, err := NewPade(s, L, M)
			if err != nil {
				e.Reason = err.Error()
				entries = append(entries, e)
				continue
			}
			if p.M < M {
				e.Reason = fmt.Sprintf("degenerate system, M lowered to %d", p.M)
			}
			padeTableCheck(&e, p.Q, p.P, nil, zero, x, o, prec, func() (*big.Float, error) { return p.Eval(x) })
			entries = append(entries, e)
		}
	}
	r, err := padeSelect(entries, o.Diag, o.Best, prec)
	if err != nil {
		return nil, err
	}
	r.Method = fmt.Sprintf("Pade [%d/%d] of %d-term series at x = %.6g; error = max deviation of the %d highest-order pole-free entries with |L-M| <= %d",
		r.L, r.M, s.Len(), x, r.Used, o.Diag)
	return r, nil
}

// padeTableDefaults fills the zero fields of opts and checks them.
func padeTableDefaults(o PadeTableOptions, length int, x *big.Float, prec uint) (PadeTableOptions, error) {
	if o.N == 0 {
		o.N = length - 1
	}
	if o.N < 1 || o.N > length-1 {
		return o, fmt.Errorf("series: PadeTable: order N=%d needs 1 <= N <= %d (series length - 1)", o.N, length-1)
	}
	if o.Width == 0 {
		o.Width = 2
	}
	if o.Diag == 0 {
		o.Diag = 1
	}
	if o.Best == 0 {
		o.Best = 3
	}
	if o.Width < 0 || o.Diag < 0 || o.Best < 2 {
		return o, fmt.Errorf("series: PadeTable: need Width, Diag >= 0 and Best >= 2 (got %d, %d, %d)", o.Width, o.Diag, o.Best)
	}
	if o.Diag > o.Width {
		o.Width = o.Diag
	}
	if o.PoleMargin == nil {
		o.PoleMargin = new(big.Float).SetPrec(prec).Abs(x)
		o.PoleMargin.Quo(o.PoleMargin, big.NewFloat(100))
	}
	if o.DoubletTol == nil {
		o.DoubletTol = new(big.Float).SetMantExp(big.NewFloat(1), -int(prec/4))
	}
	if o.PoleMargin.Sign() < 0 || o.DoubletTol.Sign() < 0 {
		return o, errors.New("series: PadeTable: PoleMargin and DoubletTol must be non-negative")
	}
	return o, nil
}

// padeTableCheck marks e as OK and sets its value when q (in powers of
// x - shift) has no non-spurious pole near [x0, x1] and eval succeeds.
func padeTableCheck(e *PadeEntry, q, p []*big.Float, shift, x0, x1 *big.Float, o PadeTableOptions, prec uint, eval func() (*big.Float, error)) {
	near, err := padePolesNear(q, p, shift, x0, x1, o.PoleMargin, o.DoubletTol, prec)
	if err != nil {
		e.Reason = "pole search failed: " + err.Error()
		return
	}
	if len(near) > 0 {
		e.Reason = fmt.Sprintf("pole at %.6g%+.6gi in the region", near[0].Re, near[0].Im)
		return
	}
	v, err := eval()
	if err != nil {
		e.Reason = err.Error()
		return
	}
	e.Value, e.OK = v, true
}

// padeSelect ranks the OK entries with |L-M| <= diag by order (then by
// closeness to the diagonal) and estimates value and error from the top best.
func padeSelect(entries []PadeEntry, diag, best int, prec uint) (*Resummed, error) {
	var cand []PadeEntry
	for _, e := range entries {
		if e.OK && padeAbsInt(e.L-e.M) <= diag {
			cand = append(cand, e)
		}
	}
	sort.SliceStable(cand, func(i, j int) bool {
		oi, oj := cand[i].L+cand[i].M, cand[j].L+cand[j].M
		if oi != oj {
			return oi > oj
		}
		return padeAbsInt(cand[i].L-cand[i].M) < padeAbsInt(cand[j].L-cand[j].M)
	})
	if len(cand) < 2 {
		return nil, fmt.Errorf("series: only %d pole-free entries with |L-M| <= %d; no error estimate possible", len(cand), diag)
	}
	if len(cand) > best {
		cand = cand[:best]
	}
	v := cand[0].Value
	spread := new(big.Float).SetPrec(prec).Abs(v)
	spread.SetMantExp(spread, -int(prec)+8)
	d := new(big.Float).SetPrec(prec)
	for _, e := range cand[1:] {
		d.Sub(e.Value, v)
		scalar.RaiseAbs(spread, d)
	}
	return &Resummed{
		Value: new(big.Float).SetPrec(prec).Set(v), Err: spread,
		L: cand[0].L, M: cand[0].M, K1: cand[0].K1, K2: cand[0].K2,
		Used: len(cand), Entries: entries,
	}, nil
}

func padeAbsInt(n int) int {
	if n < 0 {
		return -n
	}
	return n
}
