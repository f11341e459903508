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

// Pade is the [L/M] Pade approximant P(t)/Q(t) of a power series f(t):
// deg P <= L, deg Q <= M, Q(0) = 1 and f Q - P = O(t^(L+M+1)).
//
// When the linear system for Q is singular at the working precision (the
// series lies in a degenerate block of the Pade table, e.g. it is a rational
// function of lower type), NewPade lowers M until the system is regular;
// MRequested keeps the degree that was asked for, and M the one used.
type Pade struct {
	// P and Q are the numerator and denominator coefficients, lowest power
	// first; len(P) = L+1, len(Q) = M+1 and Q[0] = 1.
	P, Q []*big.Float
	// L and M are the numerator and denominator degrees actually used.
	L, M int
	// MRequested is the denominator degree asked for.
	MRequested int
	prec       uint
}

// Doublet is a Froissart doublet: a pole and a zero of a rational
// approximant so close together that they nearly cancel. Such pairs come from
// noise in the coefficients or from asking for more poles than the function
// has, and carry no information about the function.
type Doublet struct {
	// Pole is the pole (a root of the denominator) and Zero the root of the
	// numerator paired with it.
	Pole, Zero scalar.Complex
	// Distance is |Pole - Zero|.
	Distance *big.Float
}

// NewPade returns the [L/M] Pade approximant of s (a series in t around
// t = 0). It needs L, M >= 0 and s.Len() >= L+M+1. The coefficients are
// computed at s.Prec()+32 bits and stored at s.Prec().
func NewPade(s *series.Series, L, M int) (*Pade, error) {
	if s == nil {
		return nil, errors.New("series: NewPade: nil series")
	}
	if L < 0 || M < 0 {
		return nil, fmt.Errorf("series: NewPade: degrees must be non-negative (got L=%d, M=%d)", L, M)
	}
	if s.Len() < L+M+1 {
		return nil, fmt.Errorf("series: NewPade: [%d/%d] needs %d coefficients, series has %d", L, M, L+M+1, s.Len())
	}
	prec := s.Prec()
	wp := prec + scalar.Guard
	c := func(k int) *big.Float {
		if k < 0 {
			return new(big.Float)
		}
		return s.Coeff(k)
	}
	for m := M; m >= 0; m-- {
		q, err := padeDenominator(c, L, m, wp)
		if errors.Is(err, algebra.ErrSingular) {
			continue
		}
		if err != nil {
			return nil, err
		}
		p := make([]*big.Float, L+1)
		t := new(big.Float).SetPrec(wp)
		for i := 0; i <= L; i++ {
			acc := new(big.Float).SetPrec(wp)
			for j := 0; j <= m && j <= i; j++ {
				t.Mul(q[j], c(i-j))
				acc.Add(acc, t)
			}
			p[i] = acc.SetPrec(prec)
		}
		for j := range q {
			q[j].SetPrec(prec)
		}
		return &Pade{P: p, Q: q, L: L, M: m, MRequested: M, prec: prec}, nil
	}
	// Unreachable: m = 0 never solves a system.
	return nil, fmt.Errorf("series: NewPade: [%d/%d] has no solution", L, M)
}

// padeDenominator solves sum_{j=1..m} q_j c(k-j) = -c(k), k = L+1..L+m, and
// returns q with q[0] = 1.
func padeDenominator(c func(int) *big.Float, L, m int, wp uint) ([]*big.Float, error) {
	q := make([]*big.Float, m+1)
	q[0] = new(big.Float).SetPrec(wp).SetInt64(1)
	if m == 0 {
		return q, nil
	}
	a := make([][]*big.Float, m)
	b := make([]*big.Float, m)
	for i := 0; i < m; i++ {
		k := L + 1 + i
		a[i] = make([]*big.Float, m)
		for j := 0; j < m; j++ {
			a[i][j] = c(k - j - 1)
		}
		b[i] = new(big.Float).Neg(c(k))
	}
	x, err := algebra.SolveLinear(a, b, wp)
	if err != nil {
		return nil, err
	}
	copy(q[1:], x)
	return q, nil
}

// Prec is the precision of the coefficients in bits.
func (r *Pade) Prec() uint { return r.prec }

// Eval returns P(x)/Q(x) at the approximant's precision, or ErrPole when
// Q(x) vanishes to within the rounding of its evaluation.
func (r *Pade) Eval(x *big.Float) (*big.Float, error) {
	if x == nil || x.IsInf() {
		return nil, errors.New("series: Pade.Eval: argument is nil or infinite")
	}
	return padeRatio(r.P, r.Q, x, r.prec)
}

// EvalComplex returns P(z)/Q(z), or ErrPole at a pole.
func (r *Pade) EvalComplex(z scalar.Complex) (scalar.Complex, error) {
	if z.Re == nil || z.Im == nil {
		return scalar.Complex{}, errors.New("series: Pade.EvalComplex: argument has a nil part")
	}
	return padeRatioComplex(r.P, r.Q, z, r.prec)
}

// Poles returns the zeros of Q (all complex roots, with multiplicity).
func (r *Pade) Poles() ([]scalar.Complex, error) { return algebra.PolyRoots(r.Q, r.prec) }

// Zeros returns the zeros of P. The zero approximant has none (and an error).
func (r *Pade) Zeros() ([]scalar.Complex, error) { return algebra.PolyRoots(r.P, r.prec) }

// Doublets returns the Froissart doublets closer than tol; see FindDoublets.
// It returns nil if the roots cannot be computed.
func (r *Pade) Doublets(tol *big.Float) []Doublet {
	d, err := r.FindDoublets(tol)
	if err != nil {
		return nil
	}
	return d
}

// FindDoublets pairs poles with zeros closer than tol, closest pairs first,
// each pole and zero used at most once.
func (r *Pade) FindDoublets(tol *big.Float) ([]Doublet, error) {
	poles, err := r.Poles()
	if err != nil {
		return nil, err
	}
	return padeDoubletsOf(poles, r.P, tol, r.prec)
}

// PolesNear returns the poles at distance <= margin from the real segment
// between x0 and x1 (in either order), leaving out those that belong to a
// Froissart doublet closer than doubletTol (nil doubletTol: none left out).
// These are the poles that make the approximant unusable on the segment.
func (r *Pade) PolesNear(x0, x1, margin, doubletTol *big.Float) ([]scalar.Complex, error) {
	return padePolesNear(r.Q, r.P, nil, x0, x1, margin, doubletTol, r.prec)
}

// PoleFree reports whether no pole other than Froissart doublets lies within
// margin of the real segment [x0, x1]; see PolesNear.
func (r *Pade) PoleFree(x0, x1, margin, doubletTol *big.Float) (bool, error) {
	p, err := r.PolesNear(x0, x1, margin, doubletTol)
	if err != nil {
		return false, err
	}
	return len(p) == 0, nil
}

// padePolesNear is PolesNear for P/Q in powers of (x - shift) (shift nil: 0).
func padePolesNear(q, p []*big.Float, shift, x0, x1, margin, doubletTol *big.Float, prec uint) ([]scalar.Complex, error) {
	if x0 == nil || x1 == nil || margin == nil {
		return nil, errors.New("series: pole search needs a segment and a margin")
	}
	if margin.Sign() < 0 {
		return nil, fmt.Errorf("series: pole search margin must be non-negative (got %g)", margin)
	}
	poles, err := algebra.PolyRoots(q, prec)
	if err != nil {
		return nil, err
	}
	lo, hi := x0, x1
	if lo.Cmp(hi) > 0 {
		lo, hi = hi, lo
	}
	var near []scalar.Complex
	for _, z := range poles {
		zx := z
		if shift != nil {
			zx = scalar.NewComplex(new(big.Float).SetPrec(prec).Add(z.Re, shift), z.Im, prec)
		}
		if padeSegmentDist(zx, lo, hi, prec).Cmp(margin) <= 0 {
			near = append(near, z)
		}
	}
	if len(near) == 0 || doubletTol == nil {
		return padeShiftAll(near, shift, prec), nil
	}
	dbl, err := padeDoubletsOf(near, p, doubletTol, prec)
	if err != nil {
		return nil, err
	}
	var out []scalar.Complex
	for _, z := range near {
		spurious := false
		for _, d := range dbl {
			if d.Pole.Re.Cmp(z.Re) == 0 && d.Pole.Im.Cmp(z.Im) == 0 {
				spurious = true
				break
			}
		}
		if !spurious {
			out = append(out, z)
		}
	}
	return padeShiftAll(out, shift, prec), nil
}

// padeShiftAll adds the real shift to every point.
func padeShiftAll(z []scalar.Complex, shift *big.Float, prec uint) []scalar.Complex {
	if shift == nil {
		return z
	}
	out := make([]scalar.Complex, len(z))
	for i, v := range z {
		out[i] = scalar.NewComplex(new(big.Float).SetPrec(prec).Add(v.Re, shift), v.Im, prec)
	}
	return out
}

// padeDoubletsOf matches the given poles with the zeros of the polynomial p.
func padeDoubletsOf(poles []scalar.Complex, p []*big.Float, tol *big.Float, prec uint) ([]Doublet, error) {
	if tol == nil || tol.Sign() <= 0 || len(poles) == 0 {
		return nil, nil
	}
	zeros, err := algebra.PolyRoots(p, prec)
	if err != nil {
		// A zero numerator has no zeros to pair with.
		if padeAllZero(p) {
			return nil, nil
		}
		return nil, err
	}
	type pair struct {
		i, j int
		d    *big.Float
	}
	var pairs []pair
	for i, z := range poles {
		for j, w := range zeros {
			d := scalar.CAbs(scalar.CSub(z, w, prec), prec)
			if d.Cmp(tol) < 0 {
				pairs = append(pairs, pair{i, j, d})
			}
		}
	}
	sort.Slice(pairs, func(a, b int) bool { return pairs[a].d.Cmp(pairs[b].d) < 0 })
	usedP := make([]bool, len(poles))
	usedZ := make([]bool, len(zeros))
	var out []Doublet
	for _, pr := range pairs {
		if usedP[pr.i] || usedZ[pr.j] {
			continue
		}
		usedP[pr.i], usedZ[pr.j] = true, true
		out = append(out, Doublet{Pole: poles[pr.i], Zero: zeros[pr.j], Distance: pr.d})
	}
	return out, nil
}

func padeAllZero(p []*big.Float) bool {
	for _, v := range p {
		if v.Sign() != 0 {
			return false
		}
	}
	return true
}

// padeSegmentDist is the distance from z to the real segment [lo, hi].
func padeSegmentDist(z scalar.Complex, lo, hi *big.Float, prec uint) *big.Float {
	dx := new(big.Float).SetPrec(prec)
	switch {
	case z.Re.Cmp(lo) < 0:
		dx.Sub(lo, z.Re)
	case z.Re.Cmp(hi) > 0:
		dx.Sub(z.Re, hi)
	}
	dx.Mul(dx, dx)
	dy := new(big.Float).SetPrec(prec).Mul(z.Im, z.Im)
	dx.Add(dx, dy)
	return dx.Sqrt(dx)
}

// padeHorner returns sum c[k] x^k and the rounding scale sum |c[k]| |x|^k.
func padeHorner(c []*big.Float, x *big.Float, wp uint) (val, scale *big.Float) {
	val = new(big.Float).SetPrec(wp)
	scale = new(big.Float).SetPrec(wp)
	ax := new(big.Float).SetPrec(wp).Abs(x)
	t := new(big.Float).SetPrec(wp)
	for k := len(c) - 1; k >= 0; k-- {
		val.Mul(val, x)
		val.Add(val, c[k])
		scale.Mul(scale, ax)
		scale.Add(scale, t.Abs(c[k]))
	}
	return val, scale
}

// padeRatio evaluates p(x)/q(x) at prec bits, ErrPole when q(x) is zero to
// within the rounding of its evaluation at prec bits.
func padeRatio(p, q []*big.Float, x *big.Float, prec uint) (*big.Float, error) {
	wp := prec + scalar.Guard
	pv, _ := padeHorner(p, x, wp)
	qv, qs := padeHorner(q, x, wp)
	if qv.Sign() == 0 || qv.MantExp(nil) < qs.MantExp(nil)-int(prec)+8 {
		return nil, fmt.Errorf("%w (x = %.6g)", scalar.ErrPole, x)
	}
	return pv.Quo(pv, qv).SetPrec(prec), nil
}

// padeRatioComplex is padeRatio for a complex argument.
func padeRatioComplex(p, q []*big.Float, z scalar.Complex, prec uint) (scalar.Complex, error) {
	wp := prec + scalar.Guard
	horner := func(c []*big.Float) (scalar.Complex, *big.Float) {
		v := scalar.NewComplex(nil, nil, wp)
		s := new(big.Float).SetPrec(wp)
		az := scalar.CAbs(z, wp)
		for k := len(c) - 1; k >= 0; k-- {
			v = scalar.CMul(v, z, wp)
			v.Re.Add(v.Re, c[k])
			s.Mul(s, az)
			s.Add(s, new(big.Float).Abs(c[k]))
		}
		return v, s
	}
	pv, _ := horner(p)
	qv, qs := horner(q)
	aq := scalar.CAbs(qv, 64)
	if aq.Sign() == 0 || aq.MantExp(nil) < qs.MantExp(nil)-int(prec)+8 {
		return scalar.Complex{}, fmt.Errorf("%w (z = %.6g%+.6gi)", scalar.ErrPole, z.Re, z.Im)
	}
	return scalar.CDiv(pv, qv, prec)
}
