package pade

import (
	"qbridge/series/algebra"

	"qbridge/series"

	"qbridge/series/scalar"

	"errors"
	"fmt"
	"math/big"
	"sort"
)

// TwoPoint is a two-point Pade approximant P/Q with deg P <= L, deg Q <= M
// whose Taylor expansion agrees with one series to K1 terms at x = A and with
// another to K2 terms at x = B, L+M+1 = K1+K2.
//
// P and Q are stored in powers of u = x - A with Q[0] = 1 (the approximant is
// finite at A, where the first series is given). The monomial basis in x - A
// is well conditioned as long as |B - A| is of order one, the case of the
// expansions at x = 0 and x = 1/2 this is made for.
type TwoPoint struct {
	// P and Q are the coefficients in powers of x - A, lowest first.
	P, Q []*big.Float
	// A and B are the two expansion points.
	A, B *big.Float
	// L, M are the degrees, K1, K2 the numbers of matched terms at A and B.
	L, M, K1, K2 int
	prec         uint
}

// TwoPointPade returns the two-point Pade approximant of degrees [L/M]
// matching sa (a series in x - a) to K1 terms and sb (a series in x - b) to
// K2 terms. It needs L, M, K1, K2 >= 0, K1+K2 = L+M+1, K1 <= sa.Len(),
// K2 <= sb.Len() and a != b. The linear system in the unknown coefficients
// of P and Q (basis x - a) is solved at the larger precision of the two
// series plus 32 guard bits; a singular system is reported with ErrSingular.
func TwoPointPade(sa *series.Series, a *big.Float, K1 int, sb *series.Series, b *big.Float, K2 int, L, M int) (*TwoPoint, error) {
	if sa == nil || sb == nil || a == nil || b == nil {
		return nil, errors.New("series: TwoPointPade: nil series or expansion point")
	}
	if a.IsInf() || b.IsInf() || a.Cmp(b) == 0 {
		return nil, errors.New("series: TwoPointPade: expansion points must be finite and distinct")
	}
	if L < 0 || M < 0 || K1 < 0 || K2 < 0 {
		return nil, fmt.Errorf("series: TwoPointPade: degrees and orders must be non-negative (L=%d M=%d K1=%d K2=%d)", L, M, K1, K2)
	}
	if K1+K2 != L+M+1 {
		return nil, fmt.Errorf("series: TwoPointPade: need K1+K2 = L+M+1 (got %d+%d vs %d+%d+1)", K1, K2, L, M)
	}
	if K1 > sa.Len() || K2 > sb.Len() {
		return nil, fmt.Errorf("series: TwoPointPade: K1=%d, K2=%d but the series have %d and %d coefficients", K1, K2, sa.Len(), sb.Len())
	}
	prec := sa.Prec()
	if sb.Prec() > prec {
		prec = sb.Prec()
	}
	wp := prec + scalar.Guard
	d := new(big.Float).SetPrec(wp).Sub(b, a)
	// shift[j][m] = C(j, m) d^(j-m): coefficient of v^m in (v + d)^j.
	deg := L
	if M > deg {
		deg = M
	}
	shift := twoPointShiftTable(d, deg, wp)
	n := L + M + 1
	sys := make([][]*big.Float, n)
	rhs := make([]*big.Float, n)
	row := 0
	// At a: coefficient of u^k in fa Q - P vanishes, k < K1.
	for k := 0; k < K1; k++ {
		r := twoPointRow(n, wp)
		if k <= L {
			r[k].SetInt64(-1)
		}
		for j := 1; j <= M && j <= k; j++ {
			r[L+j].Set(sa.Coeff(k - j))
		}
		sys[row], rhs[row] = r, new(big.Float).SetPrec(wp).Neg(sa.Coeff(k))
		row++
	}
	// At b: coefficient of v^k in fb(v) Q(v+d) - P(v+d) vanishes, k < K2.
	t := new(big.Float).SetPrec(wp)
	for k := 0; k < K2; k++ {
		r := twoPointRow(n, wp)
		for i := k; i <= L; i++ {
			r[i].Neg(shift[i][k])
		}
		for j := 1; j <= M; j++ {
			for m := 0; m <= k && m <= j; m++ {
				t.Mul(sb.Coeff(k-m), shift[j][m])
				r[L+j].Add(r[L+j], t)
			}
		}
		sys[row], rhs[row] = r, new(big.Float).SetPrec(wp).Neg(sb.Coeff(k))
		row++
	}
	x, err := algebra.SolveLinear(sys, rhs, wp)
	if err != nil {
		return nil, fmt.Errorf("series: TwoPointPade [%d/%d] with K1=%d, K2=%d: %w", L, M, K1, K2, err)
	}
	p := make([]*big.Float, L+1)
	q := make([]*big.Float, M+1)
	for i := range p {
		p[i] = x[i].SetPrec(prec)
	}
	q[0] = new(big.Float).SetPrec(prec).SetInt64(1)
	for j := 1; j <= M; j++ {
		q[j] = x[L+j].SetPrec(prec)
	}
	return &TwoPoint{
		P: p, Q: q,
		A: new(big.Float).SetPrec(prec).Set(a), B: new(big.Float).SetPrec(prec).Set(b),
		L: L, M: M, K1: K1, K2: K2, prec: prec,
	}, nil
}

func twoPointRow(n int, wp uint) []*big.Float {
	r := make([]*big.Float, n)
	for i := range r {
		r[i] = new(big.Float).SetPrec(wp)
	}
	return r
}

// twoPointShiftTable returns C(j, m) d^(j-m) for 0 <= m <= j <= deg.
func twoPointShiftTable(d *big.Float, deg int, wp uint) [][]*big.Float {
	tab := make([][]*big.Float, deg+1)
	for j := 0; j <= deg; j++ {
		tab[j] = make([]*big.Float, j+1)
		tab[j][j] = new(big.Float).SetPrec(wp).SetInt64(1)
		if j == 0 {
			continue
		}
		// (v+d)^j = (v+d)^(j-1) (v+d): Pascal's rule with a factor d.
		tab[j][0] = new(big.Float).SetPrec(wp).Mul(tab[j-1][0], d)
		for m := 1; m < j; m++ {
			v := new(big.Float).SetPrec(wp).Mul(tab[j-1][m], d)
			tab[j][m] = v.Add(v, tab[j-1][m-1])
		}
	}
	return tab
}

// Prec is the precision of the coefficients in bits.
func (r *TwoPoint) Prec() uint { return r.prec }

// Eval returns P(x)/Q(x), or ErrPole at a pole.
func (r *TwoPoint) Eval(x *big.Float) (*big.Float, error) {
	if x == nil || x.IsInf() {
		return nil, errors.New("series: TwoPoint.Eval: argument is nil or infinite")
	}
	u := new(big.Float).SetPrec(r.prec+scalar.Guard).Sub(x, r.A)
	return padeRatio(r.P, r.Q, u, r.prec)
}

// Poles returns the zeros of the denominator, in the variable x.
func (r *TwoPoint) Poles() ([]scalar.Complex, error) {
	z, err := algebra.PolyRoots(r.Q, r.prec)
	if err != nil {
		return nil, err
	}
	return padeShiftAll(z, r.A, r.prec), nil
}

// PolesNear returns the poles (in x) within margin of the real segment
// between x0 and x1, leaving out Froissart doublets closer than doubletTol.
func (r *TwoPoint) PolesNear(x0, x1, margin, doubletTol *big.Float) ([]scalar.Complex, error) {
	if x0 == nil || x1 == nil {
		return nil, errors.New("series: TwoPoint.PolesNear: nil segment end")
	}
	return padePolesNear(r.Q, r.P, r.A, x0, x1, margin, doubletTol, r.prec)
}

// TwoPointOptions controls ResumTwoPoint. The zero value asks for defaults.
type TwoPointOptions struct {
	// N is the highest total number of matched terms K1+K2; 0 means
	// sa.Len()+sb.Len().
	N int
	// Orders is how many total orders N, N-1, ... are scanned; 0 means 2.
	Orders int
	// Diag is the largest |L-M| of the [L/M] entries built; 0 means 1.
	Diag int
	// MinK is the least number of terms matched at each end; 0 means
	// max(1, N/4), which keeps both expansions in play.
	MinK int
	// PoleMargin is the distance from the segment spanned by a, b and x
	// within which a pole discards an entry; nil means |b-a|/100.
	PoleMargin *big.Float
	// DoubletTol is the pole-zero distance below which a pole counts as
	// half of a Froissart doublet and is ignored; nil means 2^-(prec/4),
	// prec being the larger series precision in bits.
	DoubletTol *big.Float
}

// ResumTwoPoint evaluates at x the two-point Pade approximants built from sa
// (series in x - a) and sb (series in x - b). For each of the highest
// opts.Orders total orders K1+K2 it tries every split with K1, K2 >= MinK
// (and within the series' lengths) and every [L/M] with L+M+1 = K1+K2 and
// |L-M| <= Diag, keeping those with no pole (other than doublets) near the
// segment spanned by a, b and x; when those orders keep fewer than two
// entries, the window of opts.Orders orders steps down one total order at a
// time until it keeps two. Value is the median of the kept entries of
// the highest order that has any; Err is the largest deviation of any kept
// entry of the scanned orders from Value (at least 2^-(prec-8) |Value|), a
// deliberately conservative spread.
func ResumTwoPoint(sa *series.Series, a *big.Float, sb *series.Series, b *big.Float, x *big.Float, opts TwoPointOptions) (*Resummed, error) {
	if sa == nil || sb == nil || a == nil || b == nil || x == nil {
		return nil, errors.New("series: ResumTwoPoint: nil argument")
	}
	if a.IsInf() || b.IsInf() || x.IsInf() || a.Cmp(b) == 0 {
		return nil, errors.New("series: ResumTwoPoint: points must be finite, a != b")
	}
	prec := sa.Prec()
	if sb.Prec() > prec {
		prec = sb.Prec()
	}
	o := opts
	maxN := sa.Len() + sb.Len()
	if o.N == 0 {
		o.N = maxN
	}
	if o.Orders == 0 {
		o.Orders = 2
	}
	if o.Diag == 0 {
		o.Diag = 1
	}
	if o.MinK == 0 {
		o.MinK = o.N / 4
		if o.MinK < 1 {
			o.MinK = 1
		}
	}
	if o.N < 2 || o.N > maxN || o.Orders < 1 || o.Diag < 0 || o.MinK < 0 {
		return nil, fmt.Errorf("series: ResumTwoPoint: bad options (N=%d of at most %d, Orders=%d, Diag=%d, MinK=%d)", o.N, maxN, o.Orders, o.Diag, o.MinK)
	}
	if o.PoleMargin == nil {
		o.PoleMargin = new(big.Float).SetPrec(prec).Sub(b, a)
		o.PoleMargin.Abs(o.PoleMargin)
		o.PoleMargin.Quo(o.PoleMargin, big.NewFloat(100))
	}
	if o.DoubletTol == nil {
		o.DoubletTol = new(big.Float).SetMantExp(big.NewFloat(1), -int(prec/4))
	}
	lo, hi := twoPointHull(a, b, x)
	tableOpts := PadeTableOptions{PoleMargin: o.PoleMargin, DoubletTol: o.DoubletTol}
	var entries []PadeEntry
	// The top o.Orders total orders first; where they hold fewer than two
	// pole-free entries, the window of o.Orders orders steps down one order
	// at a time (noisy high coefficients can put a pole near the segment
	// into every top entry).
	for top := o.N; top >= 2 && top >= 2*o.MinK; top-- {
		entries = twoPointScan(sa, a, sb, b, x, o, top, lo, hi, tableOpts, prec)
		if countOK(entries) >= 2 {
			break
		}
	}
	return twoPointSelect(entries, x, prec)
}

func countOK(entries []PadeEntry) int {
	n := 0
	for _, e := range entries {
		if e.OK {
			n++
		}
	}
	return n
}

// twoPointScan builds and checks the entries of total orders top down to
// top - o.Orders + 1.
func twoPointScan(sa *series.Series, a *big.Float, sb *series.Series, b *big.Float, x *big.Float, o TwoPointOptions, top int, lo, hi *big.Float, tableOpts PadeTableOptions, prec uint) []PadeEntry {
	var entries []PadeEntry
	for n := top; n > top-o.Orders && n >= 2; n-- {
		for K1 := o.MinK; K1 <= n-o.MinK; K1++ {
			K2 := n - K1
			if K1 > sa.Len() || K2 > sb.Len() {
				continue
			}
			for M := 0; M < n; M++ {
				L := n - 1 - M
				if padeAbsInt(L-M) > o.Diag {
					continue
				}
				e := PadeEntry{L: L, M: M, K1: K1, K2: K2}
				tp, err := TwoPointPade(sa, a, K1, sb, b, K2, L, M)
				if err != nil {
					e.Reason = err.Error()
					entries = append(entries, e)
					continue
				}
				padeTableCheck(&e, tp.Q, tp.P, tp.A, lo, hi, tableOpts, prec, func() (*big.Float, error) { return tp.Eval(x) })
				entries = append(entries, e)
			}
		}
	}
	return entries
}

// twoPointHull returns the smallest and largest of the three points.
func twoPointHull(a, b, x *big.Float) (lo, hi *big.Float) {
	lo, hi = a, a
	for _, v := range []*big.Float{b, x} {
		if v.Cmp(lo) < 0 {
			lo = v
		}
		if v.Cmp(hi) > 0 {
			hi = v
		}
	}
	return lo, hi
}

// twoPointSelect takes the median of the OK entries at the highest order
// that has any and the largest deviation of all OK entries from it.
func twoPointSelect(entries []PadeEntry, x *big.Float, prec uint) (*Resummed, error) {
	top := -1
	var ok []PadeEntry
	for _, e := range entries {
		if !e.OK {
			continue
		}
		ok = append(ok, e)
		if n := e.K1 + e.K2; n > top {
			top = n
		}
	}
	if len(ok) < 2 {
		return nil, fmt.Errorf("series: ResumTwoPoint: only %d pole-free approximants; no error estimate possible", len(ok))
	}
	var best []PadeEntry
	for _, e := range ok {
		if e.K1+e.K2 == top {
			best = append(best, e)
		}
	}
	sort.SliceStable(best, func(i, j int) bool { return best[i].Value.Cmp(best[j].Value) < 0 })
	med := best[(len(best)-1)/2]
	spread := new(big.Float).SetPrec(prec).Abs(med.Value)
	spread.SetMantExp(spread, -int(prec)+8)
	d := new(big.Float).SetPrec(prec)
	for _, e := range ok {
		d.Sub(e.Value, med.Value)
		scalar.RaiseAbs(spread, d)
	}
	return &Resummed{
		Value: new(big.Float).SetPrec(prec).Set(med.Value), Err: spread,
		L: med.L, M: med.M, K1: med.K1, K2: med.K2, Used: len(ok),
		Method: fmt.Sprintf("two-point Pade at x = %.6g: median of %d pole-free entries with K1+K2 = %d; error = max deviation of all %d pole-free entries scanned",
			x, len(best), top, len(ok)),
		Entries: entries,
	}, nil
}
