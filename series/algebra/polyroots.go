package algebra

import (
	"qbridge/series/scalar"

	"errors"
	"fmt"
	"math"
	"math/big"
	"math/cmplx"

	"gonum.org/v1/gonum/mat"
)

// PolyRoots returns all complex roots of sum_k coeffs[k] x^k at prec bits,
// each root repeated by its multiplicity. Exactly zero leading coefficients
// are dropped (a polynomial of degree 0 has no roots); an all-zero
// polynomial is an error.
//
// Starting points are the eigenvalues of the companion matrix in float64
// (gonum), or points on a circle of the roots' geometric-mean radius when
// the coefficients do not fit in float64. The Aberth-Ehrlich iteration then
// refines all roots together at prec + 32 bits. A root counts as converged
// when its Newton correction is below 2^-prec of its size, or when |p(z)| is
// at the rounding level of evaluating p at z (then z is an exact root of a
// polynomial whose coefficients differ from the given ones in the last bits,
// which is as well as a multiple root can be resolved at prec bits).
func PolyRoots(coeffs []*big.Float, prec uint) ([]scalar.Complex, error) {
	if prec == 0 || prec > scalar.MaxPrec {
		return nil, fmt.Errorf("%w (got %d)", scalar.ErrPrec, prec)
	}
	for i, c := range coeffs {
		if c == nil || c.IsInf() {
			return nil, fmt.Errorf("series: PolyRoots: coefficient %d is nil or infinite", i)
		}
	}
	deg := len(coeffs) - 1
	for deg >= 0 && coeffs[deg].Sign() == 0 {
		deg--
	}
	if deg < 0 {
		return nil, errors.New("series: PolyRoots: the zero polynomial has no defined roots")
	}
	wp := prec + scalar.Guard
	// Exact roots at zero are split off: they would only slow Aberth down.
	low := 0
	for coeffs[low].Sign() == 0 {
		low++
	}
	roots := make([]scalar.Complex, 0, deg)
	for i := 0; i < low; i++ {
		roots = append(roots, scalar.NewComplex(nil, nil, prec))
	}
	c := make([]*big.Float, deg-low+1)
	for k := range c {
		c[k] = new(big.Float).SetPrec(wp).Set(coeffs[low+k])
	}
	n := len(c) - 1
	switch n {
	case 0:
		return roots, nil
	case 1:
		r := new(big.Float).SetPrec(wp).Quo(c[0], c[1])
		r.Neg(r)
		return append(roots, scalar.NewComplex(r, nil, prec)), nil
	}
	z := polyStartPoints(c, wp)
	if err := polyAberth(c, z, prec, wp); err != nil {
		return nil, err
	}
	for _, r := range z {
		roots = append(roots, scalar.NewComplex(r.Re, r.Im, prec))
	}
	return roots, nil
}

// polyStartPoints returns n distinct starting points for the roots of the
// degree-n polynomial c (c[n] != 0, c[0] != 0).
func polyStartPoints(c []*big.Float, wp uint) []scalar.Complex {
	n := len(c) - 1
	z := make([]scalar.Complex, n)
	if vals, ok := polyCompanionEigen(c); ok {
		for i, v := range vals {
			z[i] = scalar.ComplexFloat64(real(v), imag(v), wp)
		}
		polySeparate(z, vals, wp)
		return z
	}
	// Circle of radius |c0/cn|^(1/n), the geometric mean of the root moduli,
	// with an offset angle so that no start point sits on the real axis.
	e0 := c[0].MantExp(nil)
	en := c[n].MantExp(nil)
	r0, _ := new(big.Float).SetMantExp(new(big.Float).Quo(c[0], c[n]), en-e0).Float64()
	logr := (math.Log(math.Abs(r0)) + float64(e0-en)*math.Ln2) / float64(n)
	for k := range z {
		th := 2*math.Pi*float64(k)/float64(n) + 0.4
		re := new(big.Float).SetPrec(wp).SetFloat64(math.Cos(th))
		im := new(big.Float).SetPrec(wp).SetFloat64(math.Sin(th))
		// radius = 2^(logr/ln2): kept as mantissa and exponent to avoid overflow.
		ex := int(math.Floor(logr / math.Ln2))
		m := math.Exp(logr - float64(ex)*math.Ln2)
		re.Mul(re, big.NewFloat(m))
		im.Mul(im, big.NewFloat(m))
		re.SetMantExp(re, ex)
		im.SetMantExp(im, ex)
		z[k] = scalar.Complex{Re: re, Im: im}
	}
	return z
}

// polyCompanionEigen returns the float64 eigenvalues of the companion matrix
// of c, or ok = false when the monic coefficients are not finite float64s or
// the eigen solver fails.
func polyCompanionEigen(c []*big.Float) ([]complex128, bool) {
	n := len(c) - 1
	cm := mat.NewDense(n, n, nil)
	q := new(big.Float)
	for k := 0; k < n; k++ {
		q.Quo(c[k], c[n])
		v, _ := q.Float64()
		if math.IsInf(v, 0) || math.IsNaN(v) || (v == 0 && q.Sign() != 0) {
			return nil, false
		}
		cm.Set(k, n-1, -v)
		if k > 0 {
			cm.Set(k, k-1, 1)
		}
	}
	var eig mat.Eigen
	if !eig.Factorize(cm, mat.EigenNone) {
		return nil, false
	}
	vals := eig.Values(nil)
	for _, v := range vals {
		if cmplx.IsNaN(v) || cmplx.IsInf(v) {
			return nil, false
		}
	}
	return vals, true
}

// polySeparate nudges coincident start points apart: Aberth needs them
// distinct, and float64 eigenvalues of a multiple root can coincide exactly.
func polySeparate(z []scalar.Complex, vals []complex128, wp uint) {
	for i := range vals {
		for j := 0; j < i; j++ {
			if vals[i] == vals[j] {
				d := 1e-6 * (1 + cmplx.Abs(vals[i]))
				th := 1 + float64(i)
				z[i] = scalar.ComplexFloat64(real(vals[i])+d*math.Cos(th), imag(vals[i])+d*math.Sin(th), wp)
				vals[i] = z[i].Complex128()
				break
			}
		}
	}
}

// polyEval sets val = p(z) and der = p'(z) by Horner's rule, and returns the
// rounding-error scale sum_k |c_k| |z|^k alongside.
func polyEval(c []*big.Float, z scalar.Complex, wp uint) (val, der scalar.Complex, scale *big.Float) {
	n := len(c) - 1
	val = scalar.NewComplex(c[n], nil, wp)
	der = scalar.NewComplex(nil, nil, wp)
	az := scalar.CAbs(z, wp)
	scale = new(big.Float).SetPrec(wp).Abs(c[n])
	for k := n - 1; k >= 0; k-- {
		der = scalar.CAdd(scalar.CMul(der, z, wp), val, wp)
		val = scalar.CMul(val, z, wp)
		val.Re.Add(val.Re, c[k])
		scale.Mul(scale, az)
		scale.Add(scale, new(big.Float).Abs(c[k]))
	}
	return val, der, scale
}

// polyAberth refines the approximations z of the roots of c in place by the
// Aberth-Ehrlich iteration (Gauss-Seidel form: each new root is used at once).
func polyAberth(c []*big.Float, z []scalar.Complex, prec, wp uint) error {
	n := len(z)
	done := make([]bool, n)
	one := scalar.NewComplex(big.NewFloat(1), nil, wp)
	maxIter := 100 + int(prec)
	// A root is taken as exact once |p(z)| <= 2^-(prec) * 4n * scale.
	resExp := -int(prec) + 2 + polyBitsLen(n)
	for it := 0; it < maxIter; it++ {
		all := true
		for k := 0; k < n; k++ {
			if done[k] {
				continue
			}
			val, der, scale := polyEval(c, z[k], wp)
			if val.Re.Sign() == 0 && val.Im.Sign() == 0 {
				done[k] = true
				continue
			}
			if r := scalar.CAbs(val, 64); r.MantExp(nil) <= scale.MantExp(nil)+resExp {
				done[k] = true
				continue
			}
			all = false
			s := scalar.NewComplex(nil, nil, wp)
			for j := 0; j < n; j++ {
				if j == k {
					continue
				}
				inv, err := scalar.CDiv(one, scalar.CSub(z[k], z[j], wp), wp)
				if err != nil {
					// Two approximations collided; push this one off.
					z[k] = scalar.CAdd(z[k], polyNudge(z[k], wp), wp)
					continue
				}
				s = scalar.CAdd(s, inv, wp)
			}
			nw, err := scalar.CDiv(val, der, wp)
			if err != nil {
				z[k] = scalar.CAdd(z[k], polyNudge(z[k], wp), wp)
				continue
			}
			den := scalar.CSub(one, scalar.CMul(nw, s, wp), wp)
			w, err := scalar.CDiv(nw, den, wp)
			if err != nil {
				w = nw
			}
			z[k] = scalar.CSub(z[k], w, wp)
			// Correction below 2^-prec of |z|: converged to full precision.
			aw, az := scalar.CAbs(w, 64), scalar.CAbs(z[k], 64)
			if az.Sign() != 0 && aw.MantExp(nil) < az.MantExp(nil)-int(prec)-2 {
				done[k] = true
			}
		}
		if all {
			return nil
		}
	}
	return fmt.Errorf("%w: PolyRoots, degree %d at %d bits after %d Aberth steps", scalar.ErrNoConvergence, n, prec, maxIter)
}

// polyNudge returns a small offset relative to |z| used to separate
// colliding approximations.
func polyNudge(z scalar.Complex, wp uint) scalar.Complex {
	a := scalar.CAbs(z, 64)
	d := new(big.Float).SetPrec(wp).SetFloat64(1e-10)
	if a.Sign() != 0 {
		d.Mul(d, a)
	}
	return scalar.NewComplex(d, d, wp)
}

// polyBitsLen is the number of bits of n > 0.
func polyBitsLen(n int) int {
	b := 0
	for ; n > 0; n >>= 1 {
		b++
	}
	return b
}
