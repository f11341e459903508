package conformal

import (
	"fmt"
	"math/big"

	"qbridge/series"
	"qbridge/series/scalar"
)

// The exact factors that turn the Schwarzian coefficient alpha_S into the
// soft-mode coefficients alpha_K and alpha_G (PHYSICS.md sec. 7;
// Maldacena-Stanford 2016, arXiv:1604.07818; Kitaev-Suh 2018,
// arXiv:1711.08467):
//
//	alpha_K = F_K alpha_S,  F_K = 6 q^2 alpha_0,  alpha_0 = 2 pi q/((q-1)(q-2) tan(pi/q)),
//	alpha_G = F_G alpha_S,  F_G = F_K/(-q k_A'(2)),
//
// with the closed form k_A'(2) = (1/2)[q - 2q/(q-2) - q/(q-1) - 2 pi/sin(2 pi/q)]
// (kernelderiv.go).
//
// Around q = 2, with q = 2/(1 - eps): pi/q = pi/2 - pi eps/2, so
// 1/tan(pi/q) = tan(pi eps/2), and q/((q-1)(q-2)) = (1-eps)/(eps(1+eps)).
// The zero of 1/tan(pi/q) cancels the pole of 1/(q-2): alpha_0 is analytic
// at q = 2, with alpha_0(2) = pi^2, and
//
//	F_K = 48 pi tan(pi eps/2)/(eps (1 - eps^2)) = 24 pi^2 T(eps/2)/(1 - eps^2),
//	T(u) = tan(pi u)/(pi u),  F_K(q = 2) = 24 pi^2.
//
// The slope, with 2 pi/q = pi - pi eps, is
// k_A'(2) = 2 eps/(1 - eps^2) - 1/eps - pi/sin(pi eps): a simple pole -2/eps
// at q = 2 (where the pole of k_A at h = 1 + 2/q reaches h = 2). So
// -q k_A'(2) = (2/(1-eps)) D(eps)/eps with
// D = 1 + pi eps/sin(pi eps) - 2 eps^2/(1 - eps^2), D(0) = 2, and
//
//	F_G = 12 pi^2 eps T(eps/2)/((1 + eps) D(eps)),  F_G = 6 pi^2 eps + O(eps^2):
//
// analytic too, with a simple zero. Both alpha_K and alpha_G are therefore
// power series in eps when alpha_S is one: alpha_K -> 24 pi^2/(24 pi) = pi
// and alpha_G -> 0 at q = 2 (the semicircle's G(tau) has no 1/tau^2
// correction: G = 1/(pi J tau) - 1/(4 pi J^3 tau^3) + ... at T = 0).
//
// Around q = infinity, with x = 1/q, F_K ~ 12/x^2 and F_G ~ 8/x; the
// power series are those of
//
//	x^2 F_K = 12 C(x)/((1-x)(1-2x)),  C(x) = pi x/tan(pi x),
//	x F_G   = 2 x^2 F_K/K(x),  K(x) = 1/(1-x) + 2/(1-2x) + (1/S(2x) - 1)/x,
//
// S(u) = sin(pi u)/(pi u), K = -2 x k_A'(2), K(0) = 3. Their constant
// terms 12 and 8 with alpha_S = x^2/4 + O(x^3) give the large-q limits
// alpha_K -> 3 and alpha_G -> 2/q (MS 2016 sec. 4; PHYSICS.md sec. 7).

// Names of the factor series (Coefficients.Quantity).
const (
	// FactorK names F_K = alpha_K/alpha_S around q = 2 (x^2 F_K around infinity).
	FactorK = "F_K"
	// FactorG names F_G = alpha_G/alpha_S around q = 2 (x F_G around infinity).
	FactorG = "F_G"
)

// SoftFactorSeries returns the Taylor coefficients, through the given
// order, of the exact factors alpha_K/alpha_S and alpha_G/alpha_S: around
// q = 2 of F_K and F_G in eps (F_G's constant term is an exact zero),
// around q = infinity of x^2 F_K and x F_G in x = 1/q (see the comment
// above). The coefficients are computed with series arithmetic at two
// working precisions, their difference being the error.
func SoftFactorSeries(end End, order, digits int) (fk, fg *Coefficients, err error) {
	method := "series arithmetic on the closed forms of 6 q^2 alpha_0 and -q k_A'(2)"
	for i := range 2 {
		which := i
		c, err := twoPrecision([]string{FactorK, FactorG}[i], end, order, digits, method, func(order int, prec uint) ([]*big.Float, error) {
			k, g, err := softFactorSeries(end, order+1, prec)
			if err != nil {
				return nil, err
			}
			if which == 0 {
				return k.Coeffs(), nil
			}
			return g.Coeffs(), nil
		})
		if err != nil {
			return nil, nil, err
		}
		if i == 0 {
			fk = c
		} else {
			fg = c
		}
	}
	if end == AroundTwo {
		fg.Values[0].SetInt64(0)
		fg.Errors[0].SetInt64(0) // a zero by construction (the factor eps)
	}
	return fk, fg, nil
}

// softFactorSeries returns the n-term series of the two factors around end
// at prec bits.
func softFactorSeries(end End, n int, prec uint) (fk, fg *series.Series, err error) {
	pi := scalar.Pi(prec)
	pi2 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	one := bigInt(1, prec)
	// geometric returns 1/(1 - a t) to n terms.
	geometric := func(a int64) (*series.Series, error) {
		s, err := affineVar(n, prec, one, bigInt(-a, prec))
		if err != nil {
			return nil, err
		}
		return series.Inv(s)
	}
	if end == AroundTwo {
		t, err := tanOverArg(n, prec) // T(u)
		if err != nil {
			return nil, nil, err
		}
		t = rescale(t, bigFrac(1, 2, prec)) // T(eps/2)
		e, err := series.Variable(n, prec, nil)
		if err != nil {
			return nil, nil, err
		}
		e2 := series.Mul(e, e)
		oneMinusE2 := series.AddConst(series.Neg(e2), one)
		fk, err = series.Div(t, oneMinusE2)
		if err != nil {
			return nil, nil, err
		}
		fk = series.Scale(fk, new(big.Float).SetPrec(prec).Mul(pi2, bigInt(24, prec)))
		// D = 1 + pi eps/sin(pi eps) - 2 eps^2/(1 - eps^2).
		sa, err := sinOverArg(n, prec)
		if err != nil {
			return nil, nil, err
		}
		inv, err := series.Inv(sa)
		if err != nil {
			return nil, nil, err
		}
		r, err := series.Div(series.Scale(e2, bigInt(2, prec)), oneMinusE2)
		if err != nil {
			return nil, nil, err
		}
		d := series.AddConst(series.Sub(inv, r), one)
		onePlusE, err := affineVar(n, prec, one, one)
		if err != nil {
			return nil, nil, err
		}
		num := series.Scale(series.Mul(e, t), new(big.Float).SetPrec(prec).Mul(pi2, bigInt(12, prec)))
		g, err := series.Div(num, series.Mul(onePlusE, d))
		if err != nil {
			return nil, nil, err
		}
		return fk, g, nil
	}
	c, err := argCotArg(n, prec) // C(x) = pi x/tan(pi x)
	if err != nil {
		return nil, nil, err
	}
	g1, err := geometric(1)
	if err != nil {
		return nil, nil, err
	}
	g2, err := geometric(2)
	if err != nil {
		return nil, nil, err
	}
	fk = series.Scale(series.Mul(c, series.Mul(g1, g2)), bigInt(12, prec))
	// (1/S(2x) - 1)/x from n+1 terms.
	s2, err := sinOverArg(n+1, prec)
	if err != nil {
		return nil, nil, err
	}
	s2 = rescale(s2, bigInt(2, prec))
	inv, err := series.Inv(s2)
	if err != nil {
		return nil, nil, err
	}
	inv = series.AddConst(inv, bigInt(-1, prec))
	if err := inv.SetCoeff(0, new(big.Float)); err != nil { // 1/S(0) - 1 = 0 exactly
		return nil, nil, err
	}
	w, err := shiftDown(inv)
	if err != nil {
		return nil, nil, err
	}
	k := series.Add(series.Add(g1, series.Scale(g2, bigInt(2, prec))), w)
	fg, err = series.Div(series.Scale(fk, bigInt(2, prec)), k)
	if err != nil {
		return nil, nil, err
	}
	return fk, fg, nil
}

// sinOverArg returns the series of sin(pi u)/(pi u) in u, of length n.
func sinOverArg(n int, prec uint) (*series.Series, error) {
	u, err := series.Variable(n+1, prec, nil)
	if err != nil {
		return nil, err
	}
	s, err := series.Sin(series.Scale(u, scalar.Pi(prec)))
	if err != nil {
		return nil, err
	}
	if err := s.SetCoeff(0, new(big.Float)); err != nil { // sin(0) = 0
		return nil, err
	}
	s, err = shiftDown(s)
	if err != nil {
		return nil, fmt.Errorf("sin(pi u)/(pi u): %w", err)
	}
	inv := new(big.Float).SetPrec(prec).Quo(bigInt(1, prec), scalar.Pi(prec))
	s = series.Scale(s, inv)
	if err := s.SetCoeff(0, bigInt(1, prec)); err != nil { // exactly 1, not pi/pi rounded
		return nil, err
	}
	return s, nil
}
