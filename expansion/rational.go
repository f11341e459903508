package expansion

import (
	"errors"
	"fmt"
	"math"
	"math/big"

	"qbridge/expansion/conformal"
	"qbridge/expansion/energy"
	"qbridge/series/pade"
)

// Transforms of a Rational: how the quantity follows from R(x) = P(x)/Q(x).
const (
	// TransformNone: the quantity is R(x).
	TransformNone = "R"
	// TransformPow: the quantity is R(x)^x (b from b^q).
	TransformPow = "R^x"
	// TransformSquare: the quantity is x^2 R(x) (E_0, alpha_S from q^2 F).
	TransformSquare = "x^2 R"
	// TransformLinear: the quantity is x R(x) (alpha_G from q alpha_G).
	TransformLinear = "x R"
)

// Rational is one two-point Pade approximant written out: the quantity at
// q is T(R(x)), x = 1/q, R = P/Q with P and Q in powers of x (Q[0] = 1) and
// T the Transform. It is pole-free on 0 <= x <= 1/2 (2 <= q <= infinity).
type Rational struct {
	// Name is the quantity (h_1, b, S_0, E_0, alpha_S).
	Name string
	// Function is what R approximates (h_1, b^q, q^2 E_0, ...).
	Function string
	// Transform turns R into the quantity.
	Transform string
	// P and Q are the numerator and denominator in powers of x.
	P, Q []*big.Float
	// L, M are the degrees; K1, K2 the terms matched at x = 0 and x = 1/2.
	L, M, K1, K2 int
	// OrderEps and OrderX are the series orders it was built from.
	OrderEps, OrderX int
	// Check is the comparison with reference values, once CheckRational ran.
	Check *RationalCheck
}

// RationalCheck is the largest error of a Rational evaluated in float64
// (as the emitted code does) against reference values at the check points.
type RationalCheck struct {
	// Q are the points checked.
	Q []conformal.QPoint
	// Reference says what it was compared with ("exact", "direct", ...).
	Reference string
	// MaxErr is the largest |approximant - reference|, at MaxAt; MaxRefErr
	// is the largest error of the references themselves.
	MaxErr, MaxRefErr float64
	// MaxAt is where MaxErr occurs.
	MaxAt conformal.QPoint
}

// Rational picks the approximant to write out: of the pole-free entries of
// the highest total order, the one closest to the two-point estimate (the
// median of all entries) over 101 points of 0 <= x <= 1/2.
func (a *Approximant) Rational() (*Rational, error) {
	set := a.set
	if a.sets != nil {
		set = a.sets[0]
	}
	top := -1
	for _, tp := range set.ok {
		top = max(top, tp.K1+tp.K2)
	}
	var best *pade.TwoPoint
	bestDev := math.Inf(1)
	const npts = 101
	med := make([]*big.Float, npts)
	xs := make([]*big.Float, npts)
	for i := range xs {
		xs[i] = new(big.Float).SetPrec(set.prec).Quo(big.NewFloat(float64(i)), big.NewFloat(2*(npts-1)))
		r, err := set.at(xs[i])
		if err != nil {
			return nil, err
		}
		med[i] = r.Value
	}
	for _, tp := range set.ok {
		if tp.K1+tp.K2 != top {
			continue
		}
		dev := 0.0
		for i, x := range xs {
			v, err := tp.Eval(x)
			if err != nil {
				dev = math.Inf(1)
				break
			}
			d, _ := new(big.Float).Sub(v, med[i]).Float64()
			dev = math.Max(dev, math.Abs(d))
		}
		if dev < bestDev {
			best, bestDev = tp, dev
		}
	}
	if best == nil {
		return nil, errors.New("no pole-free two-point Pade approximant to write out")
	}
	if best.A.Sign() != 0 {
		return nil, errors.New("internal: two-point approximant not expanded at x = 0")
	}
	tr := TransformNone
	switch {
	case a.sets != nil && a.pow == 2:
		tr = TransformSquare
	case a.sets != nil && a.pow == 1:
		tr = TransformLinear
	case a.kind == conformal.QuantityB:
		tr = TransformPow
	}
	return &Rational{Name: a.Name, Function: a.Function, Transform: tr, P: best.P, Q: best.Q,
		L: best.L, M: best.M, K1: best.K1, K2: best.K2, OrderEps: a.OrderEps, OrderX: a.OrderX}, nil
}

// Eval64 evaluates the approximant at q in float64 arithmetic, exactly as
// the emitted code does: coefficients rounded to float64, Horner's rule in
// x = 1/q, then the transform. q = +Inf gives x = 0.
func (r *Rational) Eval64(q float64) float64 {
	x := 1 / q
	horner := func(c []*big.Float) float64 {
		s := 0.0
		for i := len(c) - 1; i >= 0; i-- {
			f, _ := c[i].Float64()
			s = s*x + f
		}
		return s
	}
	v := horner(r.P) / horner(r.Q)
	switch r.Transform {
	case TransformPow:
		return math.Pow(v, x)
	case TransformSquare:
		return x * x * v
	case TransformLinear:
		return x * v
	}
	return v
}

// CheckRational compares the float64 evaluation of r with reference values
// and records the largest error. For h_n, b and S_0 the reference is the
// exact value at 21 points evenly spaced in x = 1/q on [0, 1/2] (q = 2 ..
// infinity); for E_0 and alpha_S the exact values at q = 2 (E_0 = -2/(3 pi),
// alpha_S = 1/(24 pi): the semicircle, PHYSICS sec. 5), the limit 0 at
// q = infinity, and the direct solver at q = 3, 4 and 6 (seconds each).
func (a *Approximant) CheckRational(r *Rational, digits int, progress func(float64, string)) error {
	c := &RationalCheck{}
	var pts []conformal.QPoint
	var refs []float64
	var referr []float64
	if a.sets == nil {
		c.Reference = "exact"
		p, _, err := ParseName(a.Name)
		if err != nil {
			return err
		}
		ep := p.(ExactProvider)
		for i := 0; i <= 20; i++ {
			var q conformal.QPoint
			if i == 0 {
				q = conformal.QPoint{Inf: true}
			} else {
				q = conformal.QPoint{Q: new(big.Float).SetPrec(128).Quo(big.NewFloat(40), big.NewFloat(float64(i)))}
			}
			v, err := ep.Exact(q, Request{N: max(a.n, 0), Digits: digits})
			if err != nil {
				return err
			}
			f, _ := v.Value.Float64()
			e, _ := v.Err.Float64()
			pts, refs, referr = append(pts, q), append(refs, f), append(referr, e)
		}
	} else {
		c.Reference = "exact at q = 2 and infinity, direct solver at q = 3, 4, 6"
		// q = 2: E_0 = -2/(3 pi), alpha_S = 1/(24 pi) (the semicircle,
		// PHYSICS sec. 5), alpha_K = 24 pi^2 alpha_S = pi, alpha_G = 0;
		// q = infinity: 0, except alpha_K -> 3 (MS 2016 sec. 4).
		exact2, exactInf := -2/(3*math.Pi), 0.0
		switch a.kind {
		case energy.QuantityAlphaS:
			exact2 = 1 / (24 * math.Pi)
		case energy.QuantityAlphaK:
			exact2, exactInf = math.Pi, 3
		case energy.QuantityAlphaG:
			exact2 = 0
		}
		soft := a.kind == energy.QuantityAlphaG || a.kind == energy.QuantityAlphaK
		if soft {
			c.Reference = "exact at q = 2 and infinity, direct zero-temperature route at q = 3, 4, 6"
		}
		two := conformal.QPoint{Q: big.NewFloat(2)}
		pts, refs, referr = append(pts, two, conformal.QPoint{Inf: true}), append(refs, exact2, exactInf), append(referr, 0, 0)
		for i, q := range []float64{3, 4, 6} {
			if progress != nil {
				progress(float64(i)/3, fmt.Sprintf("direct solver at q = %g", q))
			}
			var v, e float64
			if soft {
				d, err := energy.DirectSoftMode(q, nil)
				if err != nil {
					return fmt.Errorf("checking the approximant: %w", err)
				}
				v, e = d.AlphaG, d.AlphaGErr
				if a.kind == energy.QuantityAlphaK {
					v, e = d.AlphaK, d.AlphaKErr
				}
			} else {
				d, err := energy.DirectGround(q, nil)
				if err != nil {
					return fmt.Errorf("checking the approximant: %w", err)
				}
				v, e = d.E0, d.E0Err
				if a.kind == energy.QuantityAlphaS {
					v, e = d.AlphaS, d.AlphaSErr
				}
			}
			pts, refs, referr = append(pts, conformal.QPoint{Q: big.NewFloat(q)}), append(refs, v), append(referr, e)
		}
	}
	for i, q := range pts {
		qf := math.Inf(1)
		if !q.Inf {
			qf = qFloat(q)
		}
		v := r.Eval64(qf)
		if !finite(v) {
			return fmt.Errorf("the approximant is not finite at q = %s", q)
		}
		if d := math.Abs(v - refs[i]); d >= c.MaxErr {
			c.MaxErr, c.MaxAt = d, q
		}
		c.MaxRefErr = math.Max(c.MaxRefErr, referr[i])
	}
	c.Q = pts
	r.Check = c
	return nil
}
