package conformal

import (
	"errors"
	"fmt"
	"math/big"

	"qbridge/series"
	"qbridge/series/scalar"
)

// kernelComplex evaluates k_A(h) at complex h and complex Delta = 1/q from
// the product of Gamma functions as written (MS 2016, arXiv:1604.07818),
// without the pole cancellation used by the series solver.
func kernelComplex(h, delta scalar.Complex, prec uint) (scalar.Complex, error) {
	c := func(re float64) scalar.Complex { return scalar.ComplexFloat64(re, 0, prec) }
	halfH := scalar.CScale(h, bigFrac(1, 2, prec), prec)
	args := []struct {
		z   scalar.Complex
		num bool
	}{
		{scalar.CSub(c(1.5), delta, prec), true},
		{scalar.CSub(c(1), delta, prec), true},
		{scalar.CAdd(c(0.5), delta, prec), false},
		{delta, false},
		{scalar.CAdd(delta, halfH, prec), true},
		{scalar.CSub(scalar.CAdd(c(0.5), delta, prec), halfH, prec), true},
		{scalar.CSub(scalar.CSub(c(1.5), delta, prec), halfH, prec), false},
		{scalar.CAdd(scalar.CSub(c(1), delta, prec), halfH, prec), false},
	}
	// -(q - 1) = 1 - 1/Delta
	inv, err := scalar.CDiv(c(1), delta, prec)
	if err != nil {
		return scalar.Complex{}, err
	}
	out := scalar.CSub(c(1), inv, prec)
	for _, a := range args {
		g, err := scalar.CGamma(a.z, prec)
		if err != nil {
			return scalar.Complex{}, err
		}
		if a.num {
			out = scalar.CMul(out, g, prec)
		} else if out, err = scalar.CDiv(out, g, prec); err != nil {
			return scalar.Complex{}, err
		}
	}
	return out, nil
}

// dimensionComplex solves k_A(h) = 1 at complex s (eps or x) by the secant
// method started from the guess h0.
func dimensionComplex(end End, s, h0 scalar.Complex, prec uint) (scalar.Complex, error) {
	var delta scalar.Complex
	if end == AroundTwo {
		// Delta = (1 - eps)/2
		delta = scalar.CScale(scalar.CSub(scalar.ComplexFloat64(1, 0, prec), s, prec), bigFrac(1, 2, prec), prec)
	} else {
		delta = s
	}
	f := func(h scalar.Complex) (scalar.Complex, error) {
		k, err := kernelComplex(h, delta, prec)
		if err != nil {
			return k, err
		}
		return scalar.CSub(k, scalar.ComplexFloat64(1, 0, prec), prec), nil
	}
	step := new(big.Float).SetMantExp(big.NewFloat(1), -int(prec)/3)
	x0 := h0
	x1 := scalar.CAdd(h0, scalar.NewComplex(step, nil, prec), prec)
	f0, err := f(x0)
	if err != nil {
		return x0, err
	}
	for it := 0; it < 100; it++ {
		f1, err := f(x1)
		if err != nil {
			return x1, err
		}
		den := scalar.CSub(f1, f0, prec)
		if scalar.CAbs2(den, prec).Sign() == 0 {
			return x1, nil
		}
		d, err := scalar.CDiv(scalar.CMul(f1, scalar.CSub(x1, x0, prec), prec), den, prec)
		if err != nil {
			return x1, err
		}
		x0, f0 = x1, f1
		x1 = scalar.CSub(x1, d, prec)
		ad := scalar.CAbs(d, 64)
		if ad.Sign() == 0 || ad.MantExp(nil) < -int(prec)+12 {
			return x1, nil
		}
	}
	return x1, errors.New("expansion: complex secant iteration for k_A(h) = 1 did not converge")
}

// DimensionCauchy recomputes the Taylor coefficients of h_n around an end
// from the Cauchy integral c_k = (1/2 pi i) oint h(s) s^(-k-1) ds on the
// circle |s| = radius, discretised with the trapezoidal rule on `nodes`
// points (exact for polynomials of degree < nodes; the aliasing error is
// about c_(k+nodes) radius^nodes). At each node k_A(h) = 1 is solved by
// complex root finding, started from the series guess. It is an independent
// check of the pole cancellation behind DimensionSeries.
func DimensionCauchy(end End, n, order int, radius float64, nodes, digits int) ([]*big.Float, error) {
	if nodes <= order {
		return nil, fmt.Errorf("expansion: the Cauchy check needs more nodes (%d) than the order (%d)", nodes, order)
	}
	guess, err := DimensionSeries(end, n, order, digits)
	if err != nil {
		return nil, err
	}
	prec := bitsFor(digits, order)
	gs, err := series.FromBig(prec, guess.Values)
	if err != nil {
		return nil, err
	}
	r := new(big.Float).SetPrec(prec).SetFloat64(radius)
	sums := make([]scalar.Complex, order+1)
	for k := range sums {
		sums[k] = scalar.ComplexFloat64(0, 0, prec)
	}
	pi := scalar.Pi(prec)
	for j := 0; j < nodes; j++ {
		theta := new(big.Float).SetPrec(prec).Mul(pi, bigFrac(int64(2*j), int64(nodes), prec))
		sn, cs := scalar.BigSinCos(theta, prec)
		unit := scalar.NewComplex(cs, sn, prec) // e^(i theta)
		s := scalar.CScale(unit, r, prec)
		h0 := series.EvalComplex(gs, s)
		h, err := dimensionComplex(end, s, h0, prec)
		if err != nil {
			return nil, err
		}
		// accumulate h e^(-i k theta)
		conj := scalar.NewComplex(cs, new(big.Float).Neg(sn), prec)
		w := scalar.ComplexFloat64(1, 0, prec)
		for k := 0; k <= order; k++ {
			sums[k] = scalar.CAdd(sums[k], scalar.CMul(h, w, prec), prec)
			w = scalar.CMul(w, conj, prec)
		}
	}
	out := make([]*big.Float, order+1)
	rk := bigInt(int64(nodes), prec)
	for k := 0; k <= order; k++ {
		out[k] = new(big.Float).SetPrec(prec).Quo(sums[k].Re, rk)
		rk.Mul(rk, r)
	}
	return out, nil
}
