package conformal

import (
	"fmt"
	"math/big"

	"qbridge/series"
	"qbridge/series/scalar"
)

// twoPrecision runs a coefficient computation at two working precisions
// and packages the result with per-coefficient errors (their difference).
func twoPrecision(quantity string, end End, order, digits int, method string,
	compute func(order int, prec uint) ([]*big.Float, error)) (*Coefficients, error) {
	if err := checkOrder(order); err != nil {
		return nil, err
	}
	if err := checkDigits(digits); err != nil {
		return nil, err
	}
	p1 := bitsFor(digits, order)
	p2 := secondPrec(p1)
	lo, err := compute(order, p1)
	if err != nil {
		return nil, err
	}
	hi, err := compute(order, p2)
	if err != nil {
		return nil, err
	}
	vals, errs := pairErrors(lo, hi, p1)
	c := &Coefficients{
		Quantity: quantity, End: end, N: -1, Values: vals, Errors: errs,
		Method: fmt.Sprintf("%s; errors from runs at %d and %d bits", method, p1, p2),
		Prec:   p2,
	}
	c.estimateRadius()
	return c, nil
}

// xTanOverX returns the series of tan(pi u)/(pi u) in u, of length n.
func tanOverArg(n int, prec uint) (*series.Series, error) {
	u, err := series.Variable(n+1, prec, nil)
	if err != nil {
		return nil, err
	}
	t, err := series.Tan(series.Scale(u, scalar.Pi(prec)))
	if err != nil {
		return nil, err
	}
	t, err = shiftDown(t) // tan(pi u)/u
	if err != nil {
		return nil, err
	}
	inv := new(big.Float).SetPrec(prec).Quo(bigInt(1, prec), scalar.Pi(prec))
	return series.Scale(t, inv), nil
}

// argCotArg returns the series of (pi u) cot(pi u) in u, of length n.
func argCotArg(n int, prec uint) (*series.Series, error) {
	t, err := tanOverArg(n, prec)
	if err != nil {
		return nil, err
	}
	return series.Inv(t)
}

// rescale returns sum c_k (r u)^k: the series in u of s(r u).
func rescale(s *series.Series, r *big.Float) *series.Series {
	c := s.Coeffs()
	pw := new(big.Float).SetPrec(s.Prec()).SetInt64(1)
	for k := range c {
		c[k].Mul(c[k], pw)
		pw.Mul(pw, r)
	}
	out, _ := series.FromBig(s.Prec(), c)
	return out
}

// affineVar returns the series c0 + c1 u of length n.
func affineVar(n int, prec uint, c0, c1 *big.Float) (*series.Series, error) {
	u, err := series.Variable(n, prec, nil)
	if err != nil {
		return nil, err
	}
	return series.AddConst(series.Scale(u, c1), c0), nil
}

// s0Series returns the coefficients of S_0 to the given order around an end.
//
// With a = 1/2 - 1/q the entropy integral (Kitaev; MS 2016 sec. 2.6,
// PHYSICS.md section 4) becomes S_0 = int_0^a pi u cot(pi u) du; around
// q = 2, a = eps/2. Around q = infinity S_0 = log 2 / 2 - int_0^x pi (1/2 - t) tan(pi t) dt.
func s0Series(end End, order int, prec uint) ([]*big.Float, error) {
	n := order + 1
	if end == AroundTwo {
		g, err := argCotArg(n, prec)
		if err != nil {
			return nil, err
		}
		S := series.Integral(g, nil) // in a
		S = rescale(S, bigFrac(1, 2, prec))
		return S.Coeffs()[:n], nil
	}
	t, err := tanOverArg(n, prec) // tan(pi x)/(pi x)
	if err != nil {
		return nil, err
	}
	w, err := affineVar(n, prec, bigFrac(1, 2, prec), bigInt(-1, prec)) // 1/2 - x
	if err != nil {
		return nil, err
	}
	pi := scalar.Pi(prec)
	pi2 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	// pi (1/2 - t) tan(pi t) = pi^2 t (1/2 - t) T(t): multiply by t via the
	// integral's shift: integrand/t is pi^2 (1/2 - t) T(t).
	g := series.Scale(series.Mul(w, t), pi2) // integrand / t
	c := g.Coeffs()
	out := make([]*big.Float, n)
	out[0] = new(big.Float).SetPrec(prec).Mul(scalar.Ln2(prec), bigFrac(1, 2, prec))
	for k := 2; k < n; k++ {
		// int_0^x t^(k-1) c_{k-2} dt = c_{k-2} x^k / k
		v := new(big.Float).SetPrec(prec).Quo(c[k-2], bigInt(int64(k), prec))
		out[k] = v.Neg(v)
	}
	out[1] = new(big.Float).SetPrec(prec)
	return out, nil
}

// S0Series returns the Taylor coefficients of the zero-temperature entropy
// S_0 to the given order: in eps around q = 2, in x = 1/q around infinity.
func S0Series(end End, order, digits int) (*Coefficients, error) {
	return twoPrecision("S_0", end, order, digits,
		"Taylor series of the entropy integral from the series of tan", func(order int, prec uint) ([]*big.Float, error) {
			return s0Series(end, order, prec)
		})
}

// bSeries returns, around q = 2, the coefficients of b in eps, and around
// q = infinity those of b^q (analytic at x = 0; b itself has x log x terms).
//
// With b^q pi = (1/2 - 1/q) tan(pi/q) (MS 2016, PHYSICS.md section 4):
// around q = 2, b^q = z cot(z)/pi^2 with z = pi eps/2, and
// log b = ((1 - eps)/2) log(z cot(z)/pi^2); around q = infinity
// b^q = x (1/2 - x) T(x) with T(x) = tan(pi x)/(pi x).
func bSeries(end End, order int, prec uint) ([]*big.Float, error) {
	n := order + 1
	pi := scalar.Pi(prec)
	pi2 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	if end == AroundTwo {
		g, err := argCotArg(n, prec) // (pi a) cot(pi a) in a; z = pi eps/2 means a = eps/2
		if err != nil {
			return nil, err
		}
		g = rescale(g, bigFrac(1, 2, prec))
		lg, err := series.Log(series.Scale(g, new(big.Float).SetPrec(prec).Quo(bigInt(1, prec), pi2)))
		if err != nil {
			return nil, err
		}
		w, err := affineVar(n, prec, bigFrac(1, 2, prec), bigFrac(-1, 2, prec)) // (1 - eps)/2
		if err != nil {
			return nil, err
		}
		b, err := series.Exp(series.Mul(w, lg))
		if err != nil {
			return nil, err
		}
		return b.Coeffs()[:n], nil
	}
	bq, err := bqOverX(n, prec)
	if err != nil {
		return nil, err
	}
	out := make([]*big.Float, n)
	out[0] = new(big.Float).SetPrec(prec)
	c := bq.Coeffs()
	for k := 1; k < n; k++ {
		out[k] = c[k-1]
	}
	return out, nil
}

// bqOverX returns the series of b^q / x = (1/2 - x) tan(pi x)/(pi x), length n.
func bqOverX(n int, prec uint) (*series.Series, error) {
	t, err := tanOverArg(n, prec)
	if err != nil {
		return nil, err
	}
	w, err := affineVar(n, prec, bigFrac(1, 2, prec), bigInt(-1, prec))
	if err != nil {
		return nil, err
	}
	return series.Mul(w, t), nil
}

// logBRegular returns the coefficients of log(b)/x - log(x) =
// log((1/2 - x) tan(pi x)/(pi x)), the analytic part of log b around
// q = infinity (log b = x log x + x * this).
func logBRegular(order int, prec uint) ([]*big.Float, error) {
	g, err := bqOverX(order+1, prec)
	if err != nil {
		return nil, err
	}
	l, err := series.Log(g)
	if err != nil {
		return nil, err
	}
	return l.Coeffs(), nil
}

// BSeries returns the series of the conformal coefficient b around an end.
// Around q = 2 it is b itself in eps. Around q = infinity b is not a power
// series in x = 1/q (log b = x log x + x R(x)), so two analytic series are
// returned: b^q, and R(x) = log(b)/x - log(x).
func BSeries(end End, order, digits int) ([]*Coefficients, error) {
	if end == AroundTwo {
		c, err := twoPrecision("b", end, order, digits, "exp(log b) with log b = ((1-eps)/2) log(z cot z / pi^2), z = pi eps/2",
			func(order int, prec uint) ([]*big.Float, error) { return bSeries(end, order, prec) })
		if err != nil {
			return nil, err
		}
		return []*Coefficients{c}, nil
	}
	bq, err := twoPrecision("b^q", end, order, digits, "b^q = x (1/2 - x) tan(pi x)/(pi x)",
		func(order int, prec uint) ([]*big.Float, error) { return bSeries(end, order, prec) })
	if err != nil {
		return nil, err
	}
	r, err := twoPrecision("log(b)/x - log(x)", end, order, digits, "log((1/2 - x) tan(pi x)/(pi x)); b = x^x exp(x R(x)) is not a power series in x",
		logBRegular)
	if err != nil {
		return nil, err
	}
	return []*Coefficients{bq, r}, nil
}

// S0Taylor returns the Taylor series of S_0 to the given order around an
// end (in eps around q = 2, in x around infinity) at prec bits, without the
// two-precision error estimate of S0Series: for callers that need the exact
// series as a reference inside their own computation.
func S0Taylor(end End, order int, prec uint) (*series.Series, error) {
	if err := checkOrder(order); err != nil {
		return nil, err
	}
	c, err := s0Series(end, order, prec)
	if err != nil {
		return nil, err
	}
	return series.FromBig(prec, c)
}
