package expansion

import (
	"errors"
	"fmt"
	"math/big"

	"qbridge/series"
)

// kernelComplex evaluates k_A(h) at complex h and complex Delta = 1/q from
// the product of Gamma functions as written (MS 2016, arXiv:1604.07818),
// without the pole cancellation used by the series solver.
func kernelComplex(h, delta series.Complex, prec uint) (series.Complex, error) {
	c := func(re float64) series.Complex { return series.ComplexFloat64(re, 0, prec) }
	halfH := series.CScale(h, bigFrac(1, 2, prec), prec)
	args := []struct {
		z   series.Complex
		num bool
	}{
		{series.CSub(c(1.5), delta, prec), true},
		{series.CSub(c(1), delta, prec), true},
		{series.CAdd(c(0.5), delta, prec), false},
		{delta, false},
		{series.CAdd(delta, halfH, prec), true},
		{series.CSub(series.CAdd(c(0.5), delta, prec), halfH, prec), true},
		{series.CSub(series.CSub(c(1.5), delta, prec), halfH, prec), false},
		{series.CAdd(series.CSub(c(1), delta, prec), halfH, prec), false},
	}
	// -(q - 1) = 1 - 1/Delta
	inv, err := series.CDiv(c(1), delta, prec)
	if err != nil {
		return series.Complex{}, err
	}
	out := series.CSub(c(1), inv, prec)
	for _, a := range args {
		g, err := series.CGamma(a.z, prec)
		if err != nil {
			return series.Complex{}, err
		}
		if a.num {
			out = series.CMul(out, g, prec)
		} else if out, err = series.CDiv(out, g, prec); err != nil {
			return series.Complex{}, err
		}
	}
	return out, nil
}

// dimensionComplex solves k_A(h) = 1 at complex s (eps or x) by the secant
// method started from the guess h0.
func dimensionComplex(end End, s, h0 series.Complex, prec uint) (series.Complex, error) {
	var delta series.Complex
	if end == AroundTwo {
		// Delta = (1 - eps)/2
		delta = series.CScale(series.CSub(series.ComplexFloat64(1, 0, prec), s, prec), bigFrac(1, 2, prec), prec)
	} else {
		delta = s
	}
	f := func(h series.Complex) (series.Complex, error) {
		k, err := kernelComplex(h, delta, prec)
		if err != nil {
			return k, err
		}
		return series.CSub(k, series.ComplexFloat64(1, 0, prec), prec), nil
	}
	step := new(big.Float).SetMantExp(big.NewFloat(1), -int(prec)/3)
	x0 := h0
	x1 := series.CAdd(h0, series.NewComplex(step, nil, prec), prec)
	f0, err := f(x0)
	if err != nil {
		return x0, err
	}
	for it := 0; it < 100; it++ {
		f1, err := f(x1)
		if err != nil {
			return x1, err
		}
		den := series.CSub(f1, f0, prec)
		if series.CAbs2(den, prec).Sign() == 0 {
			return x1, nil
		}
		d, err := series.CDiv(series.CMul(f1, series.CSub(x1, x0, prec), prec), den, prec)
		if err != nil {
			return x1, err
		}
		x0, f0 = x1, f1
		x1 = series.CSub(x1, d, prec)
		ad := series.CAbs(d, 64)
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
	sums := make([]series.Complex, order+1)
	for k := range sums {
		sums[k] = series.ComplexFloat64(0, 0, prec)
	}
	pi := series.Pi(prec)
	for j := 0; j < nodes; j++ {
		theta := new(big.Float).SetPrec(prec).Mul(pi, bigFrac(int64(2*j), int64(nodes), prec))
		sn, cs := series.BigSinCos(theta, prec)
		unit := series.NewComplex(cs, sn, prec) // e^(i theta)
		s := series.CScale(unit, r, prec)
		h0 := series.EvalComplex(gs, s)
		h, err := dimensionComplex(end, s, h0, prec)
		if err != nil {
			return nil, err
		}
		// accumulate h e^(-i k theta)
		conj := series.NewComplex(cs, new(big.Float).Neg(sn), prec)
		w := series.ComplexFloat64(1, 0, prec)
		for k := 0; k <= order; k++ {
			sums[k] = series.CAdd(sums[k], series.CMul(h, w, prec), prec)
			w = series.CMul(w, conj, prec)
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
