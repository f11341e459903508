package conformal

import (
	"errors"
	"fmt"
	"math"
	"math/big"

	"qbridge/series"
)

// dimensionSeries returns the coefficients h_n,0..h_n,order at prec bits.
func dimensionSeries(end End, n, order int, prec uint) ([]*big.Float, error) {
	h, _, err := dimensionSeriesFrom(end, n, order, prec, nil, true)
	return h, err
}

// dimensionSeriesFrom is dimensionSeries that also returns the root series
// y of the kernel equation, and, given the y of a run at a lower precision
// (seed), refines it by one Newton step instead of solving afresh. Without
// verify a fresh solve skips the final Newton step that only confirms
// convergence: for a run that a refinement at a higher precision follows,
// whose difference from this run is the stated error and so checks it.
func dimensionSeriesFrom(end End, n, order int, prec uint, seed []*big.Float, verify bool) ([]*big.Float, []*big.Float, error) {
	length := order + 3 // two spare terms: pole cancellation divides by s
	s, err := series.Variable(length, prec, nil)
	if err != nil {
		return nil, nil, err
	}
	f := formAt(end, n, s)
	eq, err := kernelEquation(f, prec)
	if err != nil {
		return nil, nil, err
	}
	var y *series.Series
	if seed != nil && len(seed) == length-1 {
		var step *big.Float
		y, step, err = eq.seriesRootFrom(seed)
		// The refinement is one Newton step: it leaves about the square of
		// the seed's error only if that error (the step) is well inside
		// Newton's quadratic regime; otherwise the root is solved afresh,
		// to convergence.
		if err == nil && !refinable(y, step, seed) {
			y = nil
		}
	}
	if y == nil && err == nil {
		var y0 *big.Float
		y0, _, err = kernelRoot(eq, f, end, n, nil, fmt.Sprintf("h_%d at the %s end", n, end))
		if err != nil {
			return nil, nil, err
		}
		// a run that no refinement follows confirms its own convergence
		y, _, err = eq.seriesRoot(y0, length-1, verify || seed != nil)
	}
	if err != nil {
		return nil, nil, fmt.Errorf("h_%d at the %s end: %w", n, end, err)
	}
	h := series.AddConst(series.Mul(f.scale, y), f.base)
	if h.Len() < order+1 {
		return nil, nil, errors.New("expansion: internal error: dimension series came out short")
	}
	return h.Coeffs()[:order+1], y.Coeffs(), nil
}

// refinable reports whether one Newton step from seed (of size step,
// giving y) has left an error far below the step: the step must be below
// 2^-(p/2) of the root's scale, p the seed's precision.
func refinable(y *series.Series, step *big.Float, seed []*big.Float) bool {
	if step.Sign() == 0 {
		return true
	}
	scale := max(maxAbs(y).MantExp(nil), 1)
	return step.MantExp(nil) < scale-int(seed[0].Prec())/2
}

// DimensionSeries returns the Taylor coefficients h_n,0 .. h_n,order of
// h_n to the given order around one end: in eps = 1 - 2/q around q = 2, in
// x = 1/q around q = infinity. The kernel equation k_A(h) = 1 is rewritten
// so that the colliding pole and zero cancel analytically and is solved for
// the whole series by Newton's iteration on series. Digits sets the working
// precision; each coefficient's error is the difference between runs at two
// precisions, the second refining the first's root by one Newton step at
// the higher precision (its size is the first's error).
func DimensionSeries(end End, n, order, digits int) (*Coefficients, error) {
	if err := checkN(n); err != nil {
		return nil, err
	}
	// The singularity map that gives the radius does not depend on the
	// series: it runs on the other core meanwhile (estimateRadius then
	// waits for it through the map cache). Bad input is refused first.
	if err := checkOrder(order); err != nil {
		return nil, err
	}
	if err := checkDigits(digits); err != nil {
		return nil, err
	}
	go DimensionSingularities(end, n, 1, radiusDigits)
	var seed []*big.Float
	c, err := twoPrecision(fmt.Sprintf("h_%d", n), end, order, digits,
		"Newton iteration on series for k_A(h) = 1 with the colliding pole and zero cancelled",
		func(order int, prec uint) ([]*big.Float, error) {
			h, y, err := dimensionSeriesFrom(end, n, order, prec, seed, false)
			seed = y
			return h, err
		})
	if err != nil {
		return nil, err
	}
	c.N = n
	return c, nil
}

// coarsePrec is the precision of the sign scan and bisection that bracket
// a root before Newton's method polishes it.
const coarsePrec = 96

// coarseEquation returns the kernel equation at coarsePrec bits, at the
// expansion point (s0 == nil) or at the fixed value s0.
func coarseEquation(end End, n int, s0 *big.Float) (*logEquation, error) {
	var s *series.Series
	var err error
	if s0 == nil {
		s, err = series.Variable(3, coarsePrec, nil)
	} else {
		s, err = series.FromBig(coarsePrec, []*big.Float{s0})
	}
	if err != nil {
		return nil, err
	}
	return kernelEquation(formAt(end, n, s), coarsePrec)
}

// nearEnd is the distance in eps (or x) from an end below which h_n is
// summed from its Taylor series there: the bracketing scan works in
// coarse precision and cannot resolve roots that close to the end's
// degenerate limit, while the series converges fast (radius about 1).
const nearEnd = 1e-3

// dimensionExact returns h_n(q) at prec bits.
func dimensionExact(q QPoint, n int, prec uint) (*big.Float, error) {
	h, _, err := dimensionRoot(q, n, prec, nil)
	return h, err
}

// rootSeed is a root found at a lower precision, with the constant C of
// Newton's quadratic convergence measured there: it lets the run at the
// second precision start from it and stop after one evaluation.
type rootSeed struct {
	y, c *big.Float
	// h is the root of the two-Gamma route (nil when it was not taken)
	h *big.Float
}

// dimensionTwoGamma finds h_n(q), n >= 1, at a finite q > 2 with the
// two-Gamma form of k_A (twoGammaKernel): a float64 bracket, then Newton
// with the precision rising with the accuracy; from seed (a root at a
// lower precision) one step suffices. ok is false where the float64
// bracket cannot resolve the root, and the general route is taken.
func dimensionTwoGamma(q QPoint, n int, prec uint, seed *rootSeed) (*big.Float, *rootSeed, bool) {
	k := newTwoGammaKernel(new(big.Float).SetPrec(prec + 16).Set(q.Q))
	var h0, lo, hi *big.Float
	acc := 40
	if seed != nil && seed.h != nil {
		h0 = seed.h
		acc = int(seed.h.Prec()) - 8
		w := new(big.Float).SetMantExp(big.NewFloat(1), max(h0.MantExp(nil), 1)-32)
		lo = new(big.Float).SetPrec(prec).Sub(h0, w)
		hi = new(big.Float).SetPrec(prec).Add(h0, w)
	} else {
		l, u, ok := k.bracket(n)
		if !ok {
			return nil, nil, false
		}
		h0 = new(big.Float).SetPrec(prec).SetFloat64(0.5 * (l + u))
		w := u - l
		lo = new(big.Float).SetPrec(prec).SetFloat64(l - w)
		hi = new(big.Float).SetPrec(prec).SetFloat64(u + w)
	}
	h, err := k.root(h0, lo, hi, acc, prec)
	if err != nil {
		return nil, nil, false
	}
	return h, &rootSeed{h: h}, true
}

// dimensionRoot returns h_n(q) at prec bits and the seed for a run at a
// higher precision; with seed, the root is refined from it (and found
// afresh if the refinement leaves a window of 2^-32 around it).
func dimensionRoot(q QPoint, n int, prec uint, seed *rootSeed) (*big.Float, *rootSeed, error) {
	if !q.Inf && !q.IsTwo() {
		lim := big.NewFloat(nearEnd)
		if t := q.Eps(prec); t.Cmp(lim) < 0 {
			h, err := dimensionNearEnd(AroundTwo, n, t, prec)
			return h, nil, err
		}
		if t := q.X(prec); t.Cmp(lim) < 0 {
			h, err := dimensionNearEnd(AroundInf, n, t, prec)
			return h, nil, err
		}
	}
	if !q.Inf && !q.IsTwo() && n >= 1 {
		if h, sd, ok := dimensionTwoGamma(q, n, prec, seed); ok {
			return h, sd, nil
		}
	}
	return dimensionFourGammaSeeded(q, n, prec, seed)
}

// dimensionFourGamma solves the four-Gamma equation of k_A (the route
// that also gives the series) for h_n(q) at prec bits.
func dimensionFourGamma(q QPoint, n int, prec uint) (*big.Float, error) {
	h, _, err := dimensionFourGammaSeeded(q, n, prec, nil)
	return h, err
}

func dimensionFourGammaSeeded(q QPoint, n int, prec uint, seed *rootSeed) (*big.Float, *rootSeed, error) {
	var s *series.Series
	var end End
	var err error
	switch {
	case q.Inf:
		end = AroundInf
		s, err = series.Variable(3, prec, nil)
	case q.IsTwo():
		end = AroundTwo
		s, err = series.Variable(3, prec, nil)
	default:
		end = AroundTwo
		s, err = series.FromBig(prec, []*big.Float{q.Eps(prec)})
	}
	if err != nil {
		return nil, nil, err
	}
	f := formAt(end, n, s)
	eq, err := kernelEquation(f, prec)
	if err != nil {
		return nil, nil, err
	}
	var s0 *big.Float
	if s.Len() == 1 {
		s0 = s.Coeff(0)
	}
	var y, c *big.Float
	if seed != nil && seed.c != nil {
		y = new(big.Float).SetPrec(prec).Set(seed.y)
		w := new(big.Float).SetMantExp(big.NewFloat(1), max(y.MantExp(nil), 1)-32)
		lo := new(big.Float).SetPrec(prec).Sub(y, w)
		hi := new(big.Float).SetPrec(prec).Add(y, w)
		if y, c, err = eq.newtonScalarC(y, lo, hi, seed.c); err != nil || eq.signAt(y) < 0 {
			y = nil
		}
	}
	if y == nil {
		if y, c, err = kernelRoot(eq, f, end, n, s0, fmt.Sprintf("h_%d at q = %s", n, q)); err != nil {
			return nil, nil, err
		}
	}
	h := new(big.Float).SetPrec(prec).Mul(f.scale.Coeff(0), y)
	return h.Add(h, f.base), &rootSeed{y: y, c: c}, nil
}

// Dimension returns h_n(q), the n-th solution of k_A(h) = 1 (n = 0 is the
// soft mode h = 2), found by bracketing between the pole and the zero of
// k_A and polishing by Newton's method at full precision. q = 2 and
// q = infinity are the limits. The error is the difference between runs at
// two precisions.
func Dimension(q QPoint, n, digits int) (*Value, error) {
	if err := checkN(n); err != nil {
		return nil, err
	}
	// the run at the higher precision starts from the root of the lower one
	var seed *rootSeed
	v, err := exactValue(fmt.Sprintf("h_%d", n), q, digits, "root of k_A(h) = 1 between its pole and zero: for n >= 1 in the two-Gamma form of k_A (reflection and duplication), bracketed in float64 and polished by Newton's method with rising precision, the higher precision started from the lower one's root; otherwise bisection and Newton on the four-Gamma form (within 1e-3 of an end in eps or x: the Taylor series there, summed below the working precision)",
		func(q QPoint, prec uint) (*big.Float, error) {
			h, sd, err := dimensionRoot(q, n, prec, seed)
			seed = sd
			return h, err
		})
	if err != nil {
		return nil, err
	}
	v.N = n
	return v, nil
}

// dimensionNearEnd sums the Taylor series of h_n around end at t (|t| <
// nearEnd), to an order whose next term is below 2^-prec for a radius of
// convergence no smaller than 1/2 (the nearest singularities of h_n lie
// near |eps| = 1 and |x| = 1/3..1/2).
func dimensionNearEnd(end End, n int, t *big.Float, prec uint) (*big.Float, error) {
	tf, _ := t.Float64()
	order := 2
	if tf > 0 {
		order = int(math.Ceil(float64(prec)*math.Ln2/(-math.Log(2*tf)))) + 2
	}
	order = min(max(order, 2), MaxOrder)
	c, err := dimensionSeries(end, n, order, prec)
	if err != nil {
		return nil, err
	}
	acc := new(big.Float).SetPrec(prec)
	for k := len(c) - 1; k >= 0; k-- {
		acc.Mul(acc, t)
		acc.Add(acc, c[k])
	}
	return acc, nil
}

// kernelRoot brackets the root of the kernel equation eq (form f) with the
// coarse equation at the expansion point (s0 == nil) or at s0, polishes it,
// and checks that it is a root of k_A = +1 (not -1). what names the root
// in error messages.
func kernelRoot(eq *logEquation, f *kernelForm, end End, n int, s0 *big.Float, what string) (y, c *big.Float, err error) {
	coarse, err := coarseEquation(end, n, s0)
	if err != nil {
		return nil, nil, err
	}
	y, c, err = eq.scalarRootC(f.samples, coarse)
	if err != nil {
		return nil, nil, fmt.Errorf("%s: %w", what, err)
	}
	if eq.signAt(y) < 0 {
		return nil, nil, fmt.Errorf("%s: k_A = -1 rather than +1 at the root: no dimension there", what)
	}
	return y, c, nil
}
