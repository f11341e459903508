package claim

import (
	"fmt"
	"math/big"

	"qbridge/series"
	"qbridge/series/special"
)

// powerSeries returns a as an ordinary power series (coefficients of
// t^0..t^Hi) and its errors; a pole (a leading power below 0 after exact
// zeros are dropped) is refused: what names the function.
func powerSeries(a *Laurent, what string) (v, e *series.Series, err error) {
	s, err := strip(a)
	if err != nil {
		// Zero to every order: the constant 0.
		if a.Hi() < 0 {
			return nil, nil, errShort
		}
		return align(&Laurent{Lo: 0, Val: truncate(a.Val, 1), Err: truncate(a.Err, 1)}, 0, a.Hi())
	}
	if s.Lo < 0 {
		return nil, nil, fmt.Errorf("%s of a series with a pole: its leading power is t^%d (%s of a Laurent series is not a power series)", what, s.Lo, what)
	}
	if s.Hi() < 0 {
		return nil, nil, errShort
	}
	return align(s, 0, s.Hi())
}

// propagate returns the error of F(a) to first order, |F'(a)| |da| on
// series of absolute values, plus the rounding of F(a).
func propagate(f, df, e *series.Series) *series.Series {
	out := series.Mul(absSeries(df), e)
	return addRounding(out, absSeries(f), f.Len())
}

// fromPower wraps a power series and its error as a Laurent series.
func fromPower(v, e *series.Series) *Laurent { return &Laurent{Lo: 0, Val: v, Err: e} }

// positiveLead checks that the constant term of a power series is positive
// and more than three times its error (log and non-integer powers).
func positiveLead(v, e *series.Series, what string) error {
	c, ce := v.Coeff(0), e.Coeff(0)
	three := new(big.Float).Mul(ce, big.NewFloat(3))
	switch {
	case c.Sign() == 0:
		return fmt.Errorf("%s of a series that vanishes at the expansion point (its constant term is 0)", what)
	case c.Sign() < 0:
		return fmt.Errorf("%s of a series whose leading term %s is not positive", what, c.Text('g', 6))
	case c.Cmp(three) <= 0:
		return fmt.Errorf("%s of a series whose leading term %s +- %s is not distinguishable from zero", what, c.Text('g', 6), ce.Text('g', 2))
	}
	return nil
}

// apply evaluates one of the functions of the claim language.
func apply(name string, a *Laurent) (*Laurent, error) {
	switch name {
	case "sqrt":
		return realPow(a, big.NewRat(1, 2))
	case "tan":
		// sin/cos as Laurent series: at a zero of cos (tan(pi/q) at q = 2)
		// the quotient has a pole that other factors may cancel.
		s, err := apply("sin", a)
		if err != nil {
			return nil, err
		}
		c, err := apply("cos", a)
		if err != nil {
			return nil, err
		}
		return div(s, c)
	}
	v, e, err := powerSeries(a, name)
	if err != nil {
		return nil, err
	}
	var f, df *series.Series
	switch name {
	case "exp":
		if f, err = series.Exp(v); err == nil {
			df = f
		}
	case "log":
		if err = positiveLead(v, e, "log"); err != nil {
			return nil, err
		}
		if f, err = series.Log(v); err == nil {
			df, err = series.Inv(v)
		}
	case "sin", "cos":
		var s, c *series.Series
		if s, c, err = series.SinCos(v); err == nil {
			f, df = s, c
			if name == "cos" {
				f, df = c, s // |d cos| = |sin| |da|
			}
		}
	case "Gamma":
		if f, err = special.Gamma(v); err == nil {
			var psi *series.Series
			if psi, err = special.Digamma(v); err == nil {
				df = series.Mul(f, psi)
			}
		}
	case "psi":
		if f, err = special.Digamma(v); err == nil {
			df, err = special.Polygamma(1, v)
		}
	default:
		return nil, fmt.Errorf("unknown function %q", name)
	}
	if err != nil {
		return nil, fmt.Errorf("%s(...) at the constant term %s: %v", name, v.Coeff(0).Text('g', 10), err)
	}
	return fromPower(f, propagate(f, df, e)), nil
}

// realPow returns a^r for a rational r that is not an integer:
// a = t^L A with A(0) > 0 and L r an integer, a^r = t^(L r) A^r, with
// error |r A^(r-1)| |dA|.
func realPow(a *Laurent, r *big.Rat) (*Laurent, error) {
	what := "power " + r.RatString()
	if r.Cmp(big.NewRat(1, 2)) == 0 {
		what = "sqrt"
	}
	s, err := strip(a)
	if err != nil {
		return nil, fmt.Errorf("%s of a series that %v", what, err)
	}
	lr := new(big.Rat).Mul(big.NewRat(int64(s.Lo), 1), r)
	if !lr.IsInt() {
		return nil, fmt.Errorf("%s of a series that starts at t^%d is not a Laurent series in t", what, s.Lo)
	}
	if err := positiveLead(s.Val, s.Err, what); err != nil {
		return nil, err
	}
	prec := s.Val.Prec()
	p := new(big.Float).SetPrec(prec).SetRat(r)
	f, err := series.Pow(s.Val, p)
	if err != nil {
		return nil, err
	}
	pm1 := new(big.Float).SetPrec(prec).Sub(p, big.NewFloat(1))
	g, err := series.Pow(s.Val, pm1)
	if err != nil {
		return nil, err
	}
	df := series.Scale(g, p)
	return &Laurent{Lo: int(lr.Num().Int64()), Val: f, Err: propagate(f, df, s.Err)}, nil
}
