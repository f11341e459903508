package pslq

import (
	"qbridge/series/scalar"

	"errors"
	"fmt"
	"math"
	"math/big"
)

// ErrNoRelation is returned when no integer relation within the requested
// coefficient bound exists (or can be resolved at the working precision).
var ErrNoRelation = errors.New("series: no integer relation found")

// Relation is an integer relation sum_i Coeffs[i] x[i] = 0.
type Relation struct {
	// Coeffs are the integer coefficients; the first non-zero one is positive.
	Coeffs []*big.Int
	// Residual is sum_i Coeffs[i] x[i] evaluated at the full precision of x.
	Residual *big.Float
	// Digits is the number of decimal digits to which the relation holds,
	// -log10(|Residual| / sum_i |Coeffs[i] x[i]|), capped at the precision
	// of x when the residual vanishes.
	Digits int
}

// PSLQ looks for integers m, not all zero, with sum_i m[i] x[i] = 0, by the
// PSLQ algorithm of Ferguson, Bailey and Arno (Math. Comp. 68 (1999) 351),
// at prec bits. x is rounded to prec bits; a relation is accepted when the
// reduced vector has an entry below 2^-(4 prec/5) (relative to |x|), which
// leaves prec/5 bits of headroom for the size of the coefficients. If some
// x[i] is exactly zero the unit vector e_i is returned.
//
// maxCoeff bounds the largest |m[i]| sought (nil: only the precision bounds
// it). PSLQ proves along the way that every relation has Euclidean norm at
// least 1/max_j |H_jj|; once that exceeds sqrt(n) maxCoeff, or the
// 2^(prec/5) the precision can resolve, the search stops with ErrNoRelation.
func PSLQ(x []*big.Float, prec uint, maxCoeff *big.Int) ([]*big.Int, error) {
	n := len(x)
	if n < 2 {
		return nil, fmt.Errorf("series: PSLQ needs at least 2 numbers, got %d", n)
	}
	if prec == 0 || prec > scalar.MaxPrec {
		return nil, fmt.Errorf("%w (got %d)", scalar.ErrPrec, prec)
	}
	if maxCoeff != nil && maxCoeff.Sign() <= 0 {
		return nil, fmt.Errorf("series: PSLQ: coefficient bound must be positive (got %v)", maxCoeff)
	}
	for i, v := range x {
		if v == nil || v.IsInf() {
			return nil, fmt.Errorf("series: PSLQ: x[%d] is nil or infinite", i)
		}
	}
	for i, v := range x {
		if v.Sign() == 0 {
			m := make([]*big.Int, n)
			for j := range m {
				m[j] = new(big.Int)
			}
			m[i].SetInt64(1)
			return m, nil
		}
	}
	st := pslqInit(x, prec)
	return st.run(maxCoeff)
}

// pslqState holds the PSLQ iteration: y = x B (normalized), H lower
// trapezoidal n by n-1, and the integer matrices A = B^-1.
type pslqState struct {
	n      int
	prec   uint
	y      []*big.Float
	h      [][]*big.Float
	a, b   [][]*big.Int
	gamma  *big.Float
	tmp    *big.Float
	tmpInt *big.Int
}

func pslqInit(x []*big.Float, prec uint) *pslqState {
	n := len(x)
	wp := prec
	st := &pslqState{n: n, prec: wp, tmp: new(big.Float).SetPrec(wp), tmpInt: new(big.Int)}
	// gamma > sqrt(4/3); the usual choice is 2/sqrt(3).
	st.gamma = new(big.Float).SetPrec(wp).Sqrt(new(big.Float).SetPrec(wp).Quo(big.NewFloat(4), big.NewFloat(3)))
	// s[j] = sqrt(sum_{k >= j} x_k^2), then normalize so |y| = 1.
	s := make([]*big.Float, n)
	acc := new(big.Float).SetPrec(wp)
	t := new(big.Float).SetPrec(wp)
	for k := n - 1; k >= 0; k-- {
		acc.Add(acc, t.Mul(x[k], x[k]))
		s[k] = new(big.Float).SetPrec(wp).Sqrt(acc)
	}
	s0 := new(big.Float).SetPrec(wp).Set(s[0])
	st.y = make([]*big.Float, n)
	for k := range x {
		st.y[k] = new(big.Float).SetPrec(wp).Quo(new(big.Float).SetPrec(wp).Set(x[k]), s0)
		s[k].Quo(s[k], s0)
	}
	st.h = make([][]*big.Float, n)
	for i := 0; i < n; i++ {
		st.h[i] = make([]*big.Float, n-1)
		for j := 0; j < n-1; j++ {
			v := new(big.Float).SetPrec(wp)
			switch {
			case i == j:
				v.Quo(s[j+1], s[j])
			case i > j:
				v.Mul(st.y[i], st.y[j])
				v.Quo(v, t.Mul(s[j], s[j+1]))
				v.Neg(v)
			}
			st.h[i][j] = v
		}
	}
	st.a = pslqIdentity(n)
	st.b = pslqIdentity(n)
	for i := 1; i < n; i++ {
		st.reduceRow(i, i-1)
	}
	return st
}

func pslqIdentity(n int) [][]*big.Int {
	m := make([][]*big.Int, n)
	for i := range m {
		m[i] = make([]*big.Int, n)
		for j := range m[i] {
			m[i][j] = new(big.Int)
		}
		m[i][i].SetInt64(1)
	}
	return m
}

// reduceRow applies Hermite reduction to row i against rows jmax..0.
func (st *pslqState) reduceRow(i, jmax int) {
	for j := jmax; j >= 0; j-- {
		if st.h[j][j].Sign() == 0 {
			continue
		}
		st.tmp.Quo(st.h[i][j], st.h[j][j])
		t := pslqRound(st.tmp)
		if t.Sign() == 0 {
			continue
		}
		tf := new(big.Float).SetPrec(st.prec).SetInt(t)
		st.y[j].Add(st.y[j], st.tmp.Mul(tf, st.y[i]))
		for k := 0; k <= j; k++ {
			st.h[i][k].Sub(st.h[i][k], st.tmp.Mul(tf, st.h[j][k]))
		}
		for k := 0; k < st.n; k++ {
			st.a[i][k].Sub(st.a[i][k], st.tmpInt.Mul(t, st.a[j][k]))
			st.b[k][j].Add(st.b[k][j], st.tmpInt.Mul(t, st.b[k][i]))
		}
	}
}

// pslqRound returns the integer nearest to f.
func pslqRound(f *big.Float) *big.Int {
	r := new(big.Float).SetPrec(f.Prec() + 2)
	if f.Sign() >= 0 {
		r.Add(f, big.NewFloat(0.5))
	} else {
		r.Sub(f, big.NewFloat(0.5))
	}
	i, _ := r.Int(nil)
	return i
}

func (st *pslqState) run(maxCoeff *big.Int) ([]*big.Int, error) {
	n, wp := st.n, st.prec
	tol := new(big.Float).SetMantExp(big.NewFloat(1), -int(4*wp/5))
	// Largest relation norm the precision can resolve, and the one asked for.
	limit := new(big.Float).SetMantExp(big.NewFloat(1), int(wp/5))
	if maxCoeff != nil {
		mc := new(big.Float).SetInt(maxCoeff)
		mc.Mul(mc, big.NewFloat(math.Sqrt(float64(n))))
		if mc.Cmp(limit) < 0 {
			limit = mc
		}
	}
	maxIter := 1000*n*n + 50*int(wp)
	gpow := make([]*big.Float, n-1)
	g := new(big.Float).SetPrec(wp).SetInt64(1)
	for i := range gpow {
		g.Mul(g, st.gamma)
		gpow[i] = new(big.Float).SetPrec(wp).Set(g)
	}
	t0 := new(big.Float).SetPrec(wp)
	t1 := new(big.Float).SetPrec(wp)
	t2 := new(big.Float).SetPrec(wp)
	t3 := new(big.Float).SetPrec(wp)
	t4 := new(big.Float).SetPrec(wp)
	best := new(big.Float).SetPrec(wp)
	for it := 0; it < maxIter; it++ {
		// Exchange step: the row maximizing gamma^(i+1) |H_ii|.
		m := 0
		best.SetInt64(-1)
		for i := 0; i < n-1; i++ {
			t0.Mul(gpow[i], st.h[i][i])
			t0.Abs(t0)
			if t0.Cmp(best) > 0 {
				best.Set(t0)
				m = i
			}
		}
		st.y[m], st.y[m+1] = st.y[m+1], st.y[m]
		st.a[m], st.a[m+1] = st.a[m+1], st.a[m]
		st.h[m], st.h[m+1] = st.h[m+1], st.h[m]
		for k := 0; k < n; k++ {
			st.b[k][m], st.b[k][m+1] = st.b[k][m+1], st.b[k][m]
		}
		// Corner step: restore the lower-trapezoidal shape of H.
		if m < n-2 {
			t0.Mul(st.h[m][m], st.h[m][m])
			t0.Add(t0, t1.Mul(st.h[m][m+1], st.h[m][m+1]))
			t0.Sqrt(t0)
			if t0.Sign() != 0 {
				t1.Quo(st.h[m][m], t0)
				t2.Quo(st.h[m][m+1], t0)
				for i := m; i < n; i++ {
					t3.Set(st.h[i][m])
					t4.Set(st.h[i][m+1])
					st.h[i][m].Mul(t1, t3)
					st.h[i][m].Add(st.h[i][m], t0.Mul(t2, t4))
					st.h[i][m+1].Mul(t1, t4)
					st.h[i][m+1].Sub(st.h[i][m+1], t0.Mul(t2, t3))
				}
			}
		}
		for i := m + 1; i < n; i++ {
			jmax := i - 1
			if m+1 < jmax {
				jmax = m + 1
			}
			st.reduceRow(i, jmax)
		}
		// A relation shows up as a tiny entry of y; its column of B is it.
		for j := 0; j < n; j++ {
			if t0.Abs(st.y[j]).Cmp(tol) < 0 {
				rel := st.column(j)
				if maxCoeff != nil && pslqMaxAbs(rel).Cmp(maxCoeff) > 0 {
					return nil, fmt.Errorf("%w: the relation found has coefficients above %v", ErrNoRelation, maxCoeff)
				}
				return rel, nil
			}
		}
		// Lower bound on the norm of any relation.
		best.SetInt64(0)
		for j := 0; j < n-1; j++ {
			if t0.Abs(st.h[j][j]).Cmp(best) > 0 {
				best.Set(t0)
			}
		}
		if best.Sign() == 0 {
			return nil, fmt.Errorf("%w: PSLQ broke down (zero diagonal)", scalar.ErrNoConvergence)
		}
		t0.Quo(big.NewFloat(1), best)
		if t0.Cmp(limit) > 0 {
			return nil, fmt.Errorf("%w: every relation has norm above %.3g (coefficient bound or %d-bit precision)", ErrNoRelation, limit, wp)
		}
	}
	return nil, fmt.Errorf("%w: PSLQ after %d iterations", scalar.ErrNoConvergence, maxIter)
}

// column returns column j of B with the first non-zero entry made positive.
func (st *pslqState) column(j int) []*big.Int {
	rel := make([]*big.Int, st.n)
	for i := range rel {
		rel[i] = new(big.Int).Set(st.b[i][j])
	}
	for _, v := range rel {
		if v.Sign() != 0 {
			if v.Sign() < 0 {
				for _, w := range rel {
					w.Neg(w)
				}
			}
			break
		}
	}
	return rel
}

func pslqMaxAbs(v []*big.Int) *big.Int {
	m := new(big.Int)
	for _, x := range v {
		if x.CmpAbs(m) > 0 {
			m.Abs(x)
		}
	}
	return m
}

// FindRelation looks for an integer relation among x using only findDigits
// decimal digits, then checks it on the full precision of x: the relation
// is accepted only if it holds there to findDigits+10 digits, relative to
// sum |m_i x_i|. A chance relation among the first findDigits digits fails
// that check. Every x[i] must carry at least findDigits+10 digits. The
// result is ErrNoRelation (wrapped) when PSLQ finds nothing with
// coefficients up to maxCoeff or the check fails.
func FindRelation(x []*big.Float, findDigits int, maxCoeff int64) (*Relation, error) {
	if len(x) < 2 {
		return nil, fmt.Errorf("series: FindRelation needs at least 2 numbers, got %d", len(x))
	}
	if findDigits < 1 || maxCoeff < 1 {
		return nil, fmt.Errorf("series: FindRelation needs findDigits >= 1 and maxCoeff >= 1 (got %d, %d)", findDigits, maxCoeff)
	}
	full := uint(math.MaxUint)
	for i, v := range x {
		if v == nil || v.IsInf() {
			return nil, fmt.Errorf("series: FindRelation: x[%d] is nil or infinite", i)
		}
		if v.Prec() < full {
			full = v.Prec()
		}
	}
	checkDigits := findDigits + 10
	need := pslqDigitsToBits(checkDigits)
	if full < need {
		return nil, fmt.Errorf("series: FindRelation: x carries %d bits but checking %d digits needs %d", full, checkDigits, need)
	}
	rel, err := PSLQ(x, pslqDigitsToBits(findDigits), big.NewInt(maxCoeff))
	if err != nil {
		if errors.Is(err, ErrNoRelation) {
			return nil, err
		}
		return nil, fmt.Errorf("%w: %w", ErrNoRelation, err)
	}
	wp := full + scalar.Guard
	res := new(big.Float).SetPrec(wp)
	scale := new(big.Float).SetPrec(wp)
	t := new(big.Float).SetPrec(wp)
	for i, m := range rel {
		t.SetInt(m)
		t.Mul(t, x[i])
		res.Add(res, t)
		scale.Add(scale, t.Abs(t))
	}
	digits := int(float64(full) * math.Log10(2))
	if res.Sign() != 0 && scale.Sign() != 0 {
		r := new(big.Float).Quo(res, scale)
		mant := new(big.Float)
		e := r.MantExp(mant)
		mf, _ := mant.Float64()
		d := -(math.Log10(math.Abs(mf)) + float64(e)*math.Log10(2))
		if d < float64(digits) {
			digits = int(math.Floor(d))
		}
	}
	out := &Relation{Coeffs: rel, Residual: res.SetPrec(full), Digits: digits}
	if digits < checkDigits {
		return nil, fmt.Errorf("%w: %v holds to %d digits in the full precision, fewer than %d", ErrNoRelation, rel, digits, checkDigits)
	}
	return out, nil
}

// pslqDigitsToBits is the number of bits carrying d decimal digits.
func pslqDigitsToBits(d int) uint {
	return uint(math.Ceil(float64(d) * math.Log2(10)))
}
