package scalar

import (
	"errors"
	"fmt"
	"math"
	"math/big"
)

// checkComplex rejects a complex number with a nil or infinite part.
func checkComplex(name string, z Complex) error {
	if z.Re == nil || z.Im == nil {
		return fmt.Errorf("series: %s: nil real or imaginary part", name)
	}
	if z.Re.IsInf() || z.Im.IsInf() {
		return fmt.Errorf("%w: %s of an infinite argument", ErrDomain, name)
	}
	return nil
}

// cExpOf is the exponent of the larger part of z.
func cExpOf(z Complex) int {
	return max(expOf(z.Re), expOf(z.Im))
}

// conj returns the complex conjugate of z at prec bits.
func conj(z Complex, prec uint) Complex {
	return NewComplex(z.Re, new(big.Float).Neg(z.Im), prec)
}

// CLogGamma returns the principal branch of log Gamma(z) at prec bits: the
// branch that is real on the positive real axis, continuous in the plane cut
// along the negative real axis, and on the cut equal to its limit from above
// (so Im log Gamma(x) = -pi ceil(-x) for x < 0, the convention of mpmath's
// loggamma). It returns ErrPole at z = 0, -1, -2, ...
//
// For Re z >= 1/2 the argument is shifted by the recurrence to Stirling's
// series (DLMF 5.11.1), the branch of the logarithm of the product fixed by
// summing the arguments of the factors; for Re z < 1/2 the reflection
// formula is used with log sin(pi z) written as
// -i pi z + log(1 - e^(2 pi i z)) + i pi/2 - log 2 (Im z > 0), analytic in the
// upper half plane, which keeps the branch right; Im z < 0 is done by
// conjugation.
func CLogGamma(z Complex, prec uint) (Complex, error) {
	if err := CheckPrec(prec); err != nil {
		return Complex{}, err
	}
	if err := checkComplex("CLogGamma", z); err != nil {
		return Complex{}, err
	}
	if z.Im.Sign() == 0 {
		if isGammaPole(z.Re) {
			return Complex{}, fmt.Errorf("%w: log Gamma at %s", ErrPole, z.Re.Text('g', 10))
		}
		re, err := BigLogGamma(z.Re, prec)
		if err != nil {
			return Complex{}, err
		}
		im := new(big.Float).SetPrec(prec)
		if z.Re.Sign() < 0 {
			// -pi ceil(-x): each factor x+j < 0 of the recurrence adds arg = pi.
			c, _ := new(big.Float).Neg(z.Re).Int(nil)
			c.Add(c, big.NewInt(1))
			p := Pi(prec + Guard)
			p.Mul(p, new(big.Float).SetInt(c))
			im.Neg(p)
		}
		return Complex{re, im}, nil
	}
	if z.Re.MantExp(nil) > 40 || z.Im.MantExp(nil) > 40 {
		return Complex{}, fmt.Errorf("%w: CLogGamma argument beyond 2^40", ErrDomain)
	}
	// The result can be as large as |z log z|: carry those bits too, so
	// that both parts are accurate relative to the size of the result.
	zf := math.Hypot(toF64(z.Re), toF64(z.Im))
	extra := uint(math.Log2(zf*math.Log(zf+2)+2)) + 4
	v, err := clgammaUpper(z, prec+Guard+extra)
	if err != nil {
		return Complex{}, err
	}
	return NewComplex(v.Re, v.Im, prec), nil
}

func toF64(x *big.Float) float64 {
	f, _ := x.Float64()
	return f
}

// clgammaUpper returns log Gamma(z) for Im z != 0 at about wp bits.
func clgammaUpper(z Complex, wp uint) (Complex, error) {
	if z.Im.Sign() < 0 {
		v, err := clgammaUpper(conj(z, wp), wp)
		if err != nil {
			return Complex{}, err
		}
		return conj(v, wp), nil
	}
	if z.Re.Cmp(big.NewFloat(0.5)) >= 0 {
		return clgammaRight(z, wp)
	}
	// Reflection, Im z > 0: log Gamma(z) = log pi - log Gamma(1-z) - L(z),
	// L(z) = pi y - log 2 + log u + i (pi/2 - pi x), u = 1 - e^(2 pi i z).
	p := wp
	for try := 0; ; try++ {
		x := z.Re
		y := z.Im
		_, f := splitNearestInt(x, p)
		ang := Pi(p + 8)
		ang.Mul(ang, f)
		ang.SetMantExp(ang, 1)
		sn, cs := BigSinCos(ang, p)
		r := Pi(p + 8)
		r.Mul(r, y)
		r.SetMantExp(r, 1)
		r.Neg(r)
		m := BigExp(r, p) // e^(-2 pi y)
		u := NewComplex(nil, nil, p)
		u.Re.Mul(m, cs)
		u.Re.Sub(big.NewFloat(1), u.Re)
		u.Im.Mul(m, sn)
		u.Im.Neg(u.Im)
		// 1 - e^(2 pi i z) cancels near the poles: add the bits lost there.
		if lost := -cExpOf(u); lost > 0 && try == 0 {
			p = wp + uint(lost) + 8
			continue
		}
		lu, err := CLog(u, p)
		if err != nil {
			return Complex{}, fmt.Errorf("%w: log Gamma at a pole", ErrPole)
		}
		one := NewComplex(big.NewFloat(1), nil, p)
		w := CSub(one, z, p)
		w.Re = addIntExact(new(big.Float).Neg(z.Re), 1, p)
		lg1, err := clgammaUpper(w, p)
		if err != nil {
			return Complex{}, err
		}
		piP := Pi(p)
		lre := new(big.Float).SetPrec(p).Mul(piP, y)
		lre.Sub(lre, Ln2(p))
		lre.Add(lre, lu.Re)
		lim := new(big.Float).SetPrec(p).Mul(piP, x)
		half := new(big.Float).SetPrec(p).SetMantExp(piP, -1)
		lim.Sub(half, lim)
		lim.Add(lim, lu.Im)
		out := NewComplex(logPi(p), nil, p)
		out.Re.Sub(out.Re, lg1.Re)
		out.Re.Sub(out.Re, lre)
		out.Im.Sub(out.Im, lg1.Im)
		out.Im.Sub(out.Im, lim)
		return out, nil
	}
}

// clgammaRight returns log Gamma(z) for Re z >= 1/2, Im z > 0 by the
// recurrence and Stirling's series.
func clgammaRight(z Complex, wp uint) (Complex, error) {
	minArg := stirlingMinArg(wp)
	for try := 0; try < 6; try, minArg = try+1, 2*minArg {
		n := 0
		if toF64(z.Re) < minArg && toF64(z.Im) < 2*minArg {
			n = int(math.Ceil(minArg - toF64(z.Re)))
		}
		w := NewComplex(nil, z.Im, wp)
		w.Re.Add(z.Re, new(big.Float).SetInt64(int64(n)))
		s, err := cStirling(w, wp)
		if errors.Is(err, errNoConvergence) {
			continue
		}
		if err != nil {
			return Complex{}, err
		}
		if n == 0 {
			return s, nil
		}
		// log prod (z+j) = sum log(z+j): one log of the product, its
		// imaginary part moved by the multiple of 2 pi that the float64 sum of
		// the arguments of the factors selects.
		prod := NewComplex(z.Re, z.Im, wp)
		fac := NewComplex(nil, z.Im, wp)
		argSum := math.Atan2(toF64(z.Im), toF64(z.Re))
		for j := 1; j < n; j++ {
			fac.Re.Add(z.Re, new(big.Float).SetInt64(int64(j)))
			prod = CMul(prod, fac, wp)
			argSum += math.Atan2(toF64(z.Im), toF64(fac.Re))
		}
		lp, err := CLog(prod, wp)
		if err != nil {
			return Complex{}, err
		}
		k := math.Round((argSum - toF64(lp.Im)) / (2 * math.Pi))
		if k != 0 {
			tp := Pi(wp)
			tp.SetMantExp(tp, 1)
			tp.Mul(tp, big.NewFloat(k))
			lp.Im.Add(lp.Im, tp)
		}
		return CSub(s, lp, wp), nil
	}
	return Complex{}, errNoConvergence
}

// cStirling returns Stirling's series for log Gamma(w), |w| large,
// Re w > 0 (DLMF 5.11.1).
func cStirling(w Complex, wp uint) (Complex, error) {
	lw, err := CLog(w, wp)
	if err != nil {
		return Complex{}, err
	}
	wm := NewComplex(w.Re, w.Im, wp)
	wm.Re.Sub(wm.Re, big.NewFloat(0.5))
	s := CMul(wm, lw, wp)
	s = CSub(s, w, wp)
	s.Re.Add(s.Re, halfLog2Pi(wp))
	winv, err := CDiv(NewComplex(big.NewFloat(1), nil, wp), w, wp)
	if err != nil {
		return Complex{}, err
	}
	winv2 := CMul(winv, winv, wp)
	pw := winv
	ref := cExpOf(s)
	bern := bernoulliEvenFloat(int(wp)/6+8, wp)
	prevExp := math.MaxInt32
	for m := 1; ; m++ {
		if m > len(bern) {
			if m > 4*int(wp)+100 {
				return Complex{}, errNoConvergence
			}
			bern = bernoulliEvenFloat(2*len(bern), wp)
		}
		c := new(big.Float).SetPrec(wp).Quo(bern[m-1], new(big.Float).SetInt64(int64(2*m*(2*m-1))))
		term := CScale(pw, c, wp)
		s = CAdd(s, term, wp)
		e := cExpOf(term)
		if e < ref-int(wp)-4 {
			return s, nil
		}
		if m > 2 && e > prevExp {
			return Complex{}, errNoConvergence
		}
		prevExp = e
		pw = CMul(pw, winv2, wp)
	}
}

// CGamma returns Gamma(z) at prec bits as exp(CLogGamma(z)), with extra
// working bits for the size of log Gamma(z). It returns ErrPole at
// z = 0, -1, -2, ...; real z is delegated to BigGamma.
func CGamma(z Complex, prec uint) (Complex, error) {
	if err := CheckPrec(prec); err != nil {
		return Complex{}, err
	}
	if err := checkComplex("CGamma", z); err != nil {
		return Complex{}, err
	}
	if z.Im.Sign() == 0 {
		g, err := BigGamma(z.Re, prec)
		if err != nil {
			return Complex{}, err
		}
		return NewComplex(g, nil, prec), nil
	}
	wp := prec + Guard
	lg, err := CLogGamma(z, wp)
	if err != nil {
		return Complex{}, err
	}
	if e := cExpOf(lg); e > Guard/2 {
		wp += uint(e)
		if lg, err = CLogGamma(z, wp); err != nil {
			return Complex{}, err
		}
	}
	return CExp(lg, prec), nil
}
