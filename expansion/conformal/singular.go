package conformal

import (
	"fmt"
	"math"
	"math/big"
	"math/cmplx"
	"sort"
	"sync"

	"qbridge/series/scalar"
)

// Singularity is one singular point of a quantity's analytic continuation
// from an end of the q axis, in the complex plane of the expansion variable
// s (eps = 1 - 2/q around q = 2, x = 1/q around q = infinity). Its modulus
// is a radius of convergence of the series at that end when no other
// singularity is nearer.
type Singularity struct {
	// S is the point in the expansion variable; SErr bounds the error of
	// its real and imaginary parts.
	S    scalar.Complex
	SErr *big.Float
	// Modulus is |S|, with its error ModulusErr.
	Modulus, ModulusErr *big.Float
	// Q is the point in q, 2/(1 - eps) or 1/x, with the error QErr of its
	// parts; QInf reports q = infinity (eps = 1 or x = 0), where Q and QErr
	// are not set.
	Q    scalar.Complex
	QErr *big.Float
	QInf bool
	// H is the common value h* of the two colliding levels of k_A(h) = 1,
	// with its error HErr (dimensions only; HErr is nil for b and S_0).
	H    scalar.Complex
	HErr *big.Float
	// Levels says which roots of k_A(h) = 1 meet there (dimensions), or
	// what the closed form does there (b, S_0).
	Levels string
	// Kind names the type: "square-root branch point", "simple pole",
	// "logarithmic branch point", ...
	Kind string
	// Form is the local form of the function that defines Coefficient.
	Form string
	// Coefficient multiplies the singular term of Form; CoefficientErr is
	// the error of its parts.
	Coefficient    scalar.Complex
	CoefficientErr *big.Float
	// Check says how the type was confirmed.
	Check string
}

// SingularityMap lists the nearest singularities of one analytic function
// around one end, nearest first.
type SingularityMap struct {
	// Quantity names the function: "h_n" with the index, "b", "b^q", "S_0"
	// or "log(b)/x - log(x)", as in Coefficients.Quantity.
	Quantity string
	// End is the end of the q axis, which fixes the variable.
	End End
	// N is the dimension index n of h_n; -1 where it does not apply.
	N int
	// Singularities holds the nearest ones found, by increasing modulus
	// (conjugate pairs upper one first).
	Singularities []Singularity
	// SearchRadius is the radius in the expansion variable of the region
	// searched (dimensions); nil for closed forms, whose singularities are
	// known everywhere.
	SearchRadius *big.Float
	// Method says how the singularities were found and refined.
	Method string
	// Notes add what the search left out and why.
	Notes []string
}

// MaxSingularities is the largest number of singularities a caller may ask
// for in one map.
const MaxSingularities = 40

// bigJet holds k_A and the derivatives of L = log k_A at a complex point.
type bigJet struct {
	k, lh, ld, lhh, lhd scalar.Complex
}

// cf returns the real number v as a complex at prec bits.
func cf(v float64, prec uint) scalar.Complex { return scalar.ComplexFloat64(v, 0, prec) }

// cSize is max(|Re z|, |Im z|) as a float64 (0 for z = 0).
func cSize(z scalar.Complex) float64 {
	a, _ := new(big.Float).Abs(z.Re).Float64()
	b, _ := new(big.Float).Abs(z.Im).Float64()
	return math.Max(a, b)
}

// cDist is max(|Re(a - b)|, |Im(a - b)|) as a big.Float at 64 bits.
func cDist(a, b scalar.Complex) *big.Float {
	d := scalar.CSub(a, b, 64)
	x := new(big.Float).Abs(d.Re)
	y := new(big.Float).Abs(d.Im)
	if y.Cmp(x) > 0 {
		return y
	}
	return x
}

// fromC128 converts a complex128 to prec bits.
func fromC128(z complex128, prec uint) scalar.Complex {
	return scalar.ComplexFloat64(real(z), imag(z), prec)
}

// conjC returns the complex conjugate.
func conjC(z scalar.Complex, prec uint) scalar.Complex {
	return scalar.NewComplex(z.Re, new(big.Float).Neg(z.Im), prec)
}

// refineCollision polishes a solution of k_A(h, D) = 1, L_h(h, D) = 0 by
// Newton's method on the 2x2 system in complex arithmetic at prec bits; the
// Jacobian is [[k L_h, k L_D], [L_hh, L_hD]] (quadratic convergence at a
// simple square-root branch point, where L_D and L_hh do not vanish).
func refineCollision(h, d scalar.Complex, prec uint) (scalar.Complex, scalar.Complex, bigJet, error) {
	var last float64 = math.Inf(1)
	tol := math.Ldexp(1, -int(prec)+8)
	for it := 0; it < 80; it++ {
		j, err := kernelJetBig(h, d, prec, true)
		if err != nil {
			return h, d, j, err
		}
		f1 := scalar.CSub(j.k, cf(1, prec), prec)
		f2 := j.lh
		det := scalar.CMul(j.k, scalar.CSub(scalar.CMul(j.lh, j.lhd, prec), scalar.CMul(j.ld, j.lhh, prec), prec), prec)
		nh := scalar.CSub(scalar.CMul(f1, j.lhd, prec), scalar.CMul(scalar.CMul(j.k, j.ld, prec), f2, prec), prec)
		nd := scalar.CSub(scalar.CMul(scalar.CMul(j.k, j.lh, prec), f2, prec), scalar.CMul(j.lhh, f1, prec), prec)
		dh, err := scalar.CDiv(nh, det, prec)
		if err != nil {
			return h, d, j, fmt.Errorf("expansion: singular Jacobian refining a collision of levels")
		}
		dd, err := scalar.CDiv(nd, det, prec)
		if err != nil {
			return h, d, j, err
		}
		h = scalar.CSub(h, dh, prec)
		d = scalar.CSub(d, dd, prec)
		size := cSize(dh) + cSize(dd)
		if size <= tol*(1+cSize(h)) || (size >= last && size < math.Sqrt(tol)) {
			j, err = kernelJetBig(h, d, prec, true)
			return h, d, j, err
		}
		last = size
	}
	return h, d, bigJet{}, fmt.Errorf("expansion: Newton's method on the collision system did not converge")
}

// sOfDeltaBig and deltaOfBig map between s and Delta at prec bits.
func sOfDeltaBig(end End, d scalar.Complex, prec uint) scalar.Complex {
	if end == AroundTwo {
		return scalar.CSub(cf(1, prec), scalar.CScale(d, big.NewFloat(2), prec), prec)
	}
	return scalar.NewComplex(d.Re, d.Im, prec)
}

func deltaOfBig(end End, s scalar.Complex, prec uint) scalar.Complex {
	if end == AroundTwo {
		return scalar.CScale(scalar.CSub(cf(1, prec), s, prec), big.NewFloat(0.5), prec)
	}
	return scalar.NewComplex(s.Re, s.Im, prec)
}

// qOf returns q at the point s of the end; ok is false at q = infinity.
func qOf(end End, s scalar.Complex, prec uint) (scalar.Complex, bool) {
	var den scalar.Complex
	num := cf(1, prec)
	if end == AroundTwo {
		den = scalar.CSub(cf(1, prec), s, prec) // q = 2/(1 - eps)
		num = cf(2, prec)
	} else {
		den = s
	}
	q, err := scalar.CDiv(num, den, prec)
	return q, err == nil
}

// refined is a collision polished at one precision.
type refined struct {
	h, s, c, a scalar.Complex // a = c sqrt(-s*)
	j          bigJet
}

// refineAt polishes the scanned collision col at prec bits, starting from
// (h0, d0), and fixes the sign of c to the one found by the scan.
func refineAt(end End, col collision, h0, d0 scalar.Complex, prec uint) (*refined, error) {
	h, d, j, err := refineCollision(h0, d0, prec)
	if err != nil {
		return nil, err
	}
	// c^2 = -2 L_D D'(s) / L_hh: near the point L ~ L_D dD + L_hh dh^2/2 = 0.
	dds := cf(real(dDelta(end)), prec)
	num := scalar.CScale(scalar.CMul(j.ld, dds, prec), big.NewFloat(-2), prec)
	c2, err := scalar.CDiv(num, j.lhh, prec)
	if err != nil {
		return nil, fmt.Errorf("expansion: L_hh vanishes at the collision: not a simple square-root branch point")
	}
	c := scalar.CSqrt(c2, prec)
	// orient c like the scan did (the sign of the branch h_n is on)
	if c128 := c.Complex128(); cmplx.Abs(c128-col.c) > cmplx.Abs(c128+col.c) {
		c = scalar.NewComplex(new(big.Float).Neg(c.Re), new(big.Float).Neg(c.Im), prec)
	}
	s := sOfDeltaBig(end, d, prec)
	ms := scalar.NewComplex(new(big.Float).Neg(s.Re), new(big.Float).Neg(s.Im), prec)
	a := scalar.CMul(c, scalar.CSqrt(ms, prec), prec)
	return &refined{h: h, s: s, c: c, a: a, j: j}, nil
}

// errOf is |a - b| (max norm) plus a few units in the last place of a at
// precLo bits.
func errOf(a, b scalar.Complex, precLo uint) *big.Float {
	e := cDist(a, b)
	ulp := math.Ldexp(cSize(a)+1e-300, -int(precLo)+4)
	return e.Add(e, big.NewFloat(ulp))
}

// scanCache holds the coarse searches, by end and level.
var scanCache = struct {
	sync.Mutex
	m map[[2]int]*scanResult
}{m: map[[2]int]*scanResult{}}

func cachedScan(end End, n int) (*scanResult, error) {
	key := [2]int{int(end), n}
	scanCache.Lock()
	r, ok := scanCache.m[key]
	scanCache.Unlock()
	if ok {
		return r, nil
	}
	r, err := scanCollisions(end, n)
	if err != nil {
		return nil, err
	}
	scanCache.Lock()
	scanCache.m[key] = r
	scanCache.Unlock()
	return r, nil
}

// mapCache holds refined maps, by end, level, count and digits. An entry
// is created when its computation starts and its ready channel closed when
// it ends, so that a second caller (the radius of a series whose map was
// started in parallel) waits instead of computing again; failures are
// removed.
var mapCache = struct {
	sync.Mutex
	m map[[4]int]*mapEntry
}{m: map[[4]int]*mapEntry{}}

type mapEntry struct {
	ready chan struct{}
	m     *SingularityMap
	err   error
}

// DimensionSingularities returns the count singularities of h_n(s) nearest
// to the expansion point of the end, found exactly: the points where two
// roots of k_A(h) = 1 collide, k_A = 1 and dk_A/dh = 0 together, and which
// h_n reaches when continued along the straight ray from s = 0. A coarse
// search in complex128 arithmetic (singularscan.go) continues h_n along a
// fan of rays and starts Newton's method on the 2x2 system wherever
// |dh_n/ds| peaks; each point is then polished by Newton's method at two
// working precisions (digits and about 1.5 times as many bits), whose
// difference is the stated error, and its square-root type is checked by
// solving k_A = 1 next to it. The region searched is |s| < 2 in eps and
// |s| < 1 in x.
func DimensionSingularities(end End, n, count, digits int) (*SingularityMap, error) {
	if err := checkN(n); err != nil {
		return nil, err
	}
	if err := checkDigits(digits); err != nil {
		return nil, err
	}
	if count < 1 || count > MaxSingularities {
		return nil, fmt.Errorf("expansion: count must be between 1 and %d (got %d)", MaxSingularities, count)
	}
	key := [4]int{int(end), n, count, digits}
	mapCache.Lock()
	e, ok := mapCache.m[key]
	if !ok {
		e = &mapEntry{ready: make(chan struct{})}
		mapCache.m[key] = e
	}
	mapCache.Unlock()
	if ok {
		<-e.ready
		return e.m, e.err
	}
	defer close(e.ready)
	e.m, e.err = dimensionSingularities(end, n, count, digits)
	if e.err != nil {
		mapCache.Lock()
		delete(mapCache.m, key)
		mapCache.Unlock()
	}
	return e.m, e.err
}

// dimensionSingularities computes the map of DimensionSingularities.
func dimensionSingularities(end End, n, count, digits int) (*SingularityMap, error) {
	sc, err := cachedScan(end, n)
	if err != nil {
		return nil, err
	}
	p1 := bitsFor(digits, 0)
	p2 := secondPrec(p1)
	m := &SingularityMap{
		Quantity: fmt.Sprintf("h_%d", n), End: end, N: n,
		SearchRadius: big.NewFloat(sc.rmax),
		Method: fmt.Sprintf("collisions of two roots of k_A(h) = 1 (k_A = 1 and dk_A/dh = 0), searched by continuing h_%d along %d rays in the upper half %s-plane to |%s| = %g and Newton's method in complex128 where |dh/d%s| peaks; kept where h_%d continued along the straight ray from %s = 0 reaches the point; polished by complex Newton's method at %d and %d bits (error: their difference)",
			n, scanRays, end.Variable(), end.Variable(), sc.rmax, end.Variable(), n, end.Variable(), p1, p2),
		Notes: append([]string(nil), sc.notes...),
	}
	// expand conjugates in complex128 to order them before refining
	type item struct {
		col  collision
		conj bool
	}
	var items []item
	for _, c := range sc.found {
		items = append(items, item{c, false})
		if math.Abs(imag(c.s)) > 1e-12 {
			items = append(items, item{c, true})
		}
	}
	sort.SliceStable(items, func(a, b int) bool {
		ra, rb := cmplx.Abs(items[a].col.s), cmplx.Abs(items[b].col.s)
		if math.Abs(ra-rb) > 1e-9*ra {
			return ra < rb
		}
		return !items[a].conj && items[b].conj
	})
	if len(items) > count {
		items = items[:count]
	} else if len(items) < count {
		m.Notes = append(m.Notes, fmt.Sprintf("only %d singularities of h_%d found within |%s| < %g", len(items), n, end.Variable(), sc.rmax))
	}
	done := map[int]*Singularity{} // refined upper points, by index into sc.found
	for _, it := range items {
		idx := -1
		for i := range sc.found {
			if sc.found[i] == it.col {
				idx = i
			}
		}
		up, ok := done[idx]
		if !ok {
			up, err = refineSingularity(end, n, it.col, p1, p2)
			if err != nil {
				return nil, err
			}
			done[idx] = up
		}
		if it.conj {
			m.Singularities = append(m.Singularities, conjSingularity(up, p2))
		} else {
			m.Singularities = append(m.Singularities, *up)
		}
	}
	return m, nil
}

// refineSingularity polishes one scanned collision at p1 and p2 bits and
// checks its type at p2.
func refineSingularity(end End, n int, col collision, p1, p2 uint) (*Singularity, error) {
	lo, err := refineAt(end, col, fromC128(col.h, p1), fromC128(deltaOf(end, col.s), p1), p1)
	if err != nil {
		return nil, fmt.Errorf("h_%d: %w", n, err)
	}
	dlo := deltaOfBig(end, lo.s, p2)
	hi, err := refineAt(end, col, scalar.NewComplex(lo.h.Re, lo.h.Im, p2), dlo, p2)
	if err != nil {
		return nil, fmt.Errorf("h_%d: %w", n, err)
	}
	sg := &Singularity{
		S: hi.s, SErr: errOf(hi.s, lo.s, p1),
		H: hi.h, HErr: errOf(hi.h, lo.h, p1),
		Coefficient: hi.c, CoefficientErr: errOf(hi.c, lo.c, p1),
		Levels: col.levels,
		Kind:   "square-root branch point",
		Form: fmt.Sprintf("h_%d = h* + c (s - s*)^(1/2) + O(s - s*), with (s - s*)^(1/2) = (-s*)^(1/2) (1 - s/s*)^(1/2) (principal roots), s = %s, on the branch of h_%d continued along the ray from s = 0",
			n, end.Variable(), n),
	}
	sg.Modulus = scalar.CAbs(hi.s, p2)
	ml := scalar.CAbs(lo.s, p1)
	sg.ModulusErr = new(big.Float).SetPrec(64).Sub(sg.Modulus, ml)
	sg.ModulusErr.Abs(sg.ModulusErr)
	sg.ModulusErr.Add(sg.ModulusErr, big.NewFloat(math.Ldexp(1, -int(p1)+4)))
	if q, ok := qOf(end, hi.s, p2); ok {
		ql, _ := qOf(end, lo.s, p1)
		sg.Q, sg.QErr = q, errOf(q, ql, p1)
	} else {
		sg.QInf = true
	}
	// type: the two roots beside the point are h* +- c (s - s*)^(1/2), with
	// a relative deviation that falls like |s - s*|^(1/2)
	dev1, err1 := checkSquareRoot(end, hi, 1e-8)
	dev2, err2 := checkSquareRoot(end, hi, 1e-12)
	switch {
	case err1 != nil || err2 != nil:
		sg.Kind = "branch point (square-root type not confirmed)"
		sg.Check = fmt.Sprintf("solving k_A = 1 beside the point failed (%v, %v)", err1, err2)
	case dev2 > 1e-3 || dev1 < 20*dev2 || dev1 > 500*dev2:
		sg.Kind = "branch point (square-root type not confirmed)"
		sg.Check = fmt.Sprintf("the roots of k_A = 1 at s = s*(1 - d) deviate from h* +- c (s - s*)^(1/2) by %.1e (d = 1e-8) and %.1e (d = 1e-12), not falling like d^(1/2)", dev1, dev2)
	default:
		sg.Check = fmt.Sprintf("the two roots of k_A = 1 at s = s*(1 - d) are h* +- c (s - s*)^(1/2) to a relative %.1e at d = 1e-8 and %.1e at d = 1e-12 (falling like d^(1/2))", dev1, dev2)
	}
	return sg, nil
}

// conjSingularity returns the mirror image of s under complex
// conjugation (h_n is real on the real axis).
func conjSingularity(s *Singularity, prec uint) Singularity {
	out := *s
	out.S = conjC(s.S, prec)
	out.H = conjC(s.H, prec)
	out.Coefficient = conjC(s.Coefficient, prec)
	if !s.QInf {
		out.Q = conjC(s.Q, prec)
	}
	return out
}
