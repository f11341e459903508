package conformal

import (
	"math"
	"math/cmplx"
)

// k_A in complex128 in the form with two h-dependent Gamma functions, for
// the continuation of the coarse scan (most of its cost). The reflection
// and duplication formulas (DLMF 5.5.3, 5.5.5), as in kernelscalar.go,
// turn the eight Gamma functions of PHYSICS.md section 4 into
//
//	k_A(h, D) = K(D) Gamma(h-1+2D)/Gamma(h+1-2D) cos(pi(D+h/2))/cos(pi(D-h/2)),
//	K(D) = -(1 - 1/D) (1/2 - D) (2/pi) Gamma(1-2D)^2 sin(2 pi D),
//
// which at D = 1/4 is PHYSICS.md's -(3/2) tan(pi(h-1/2)/2)/(h-1/2). A step
// of the continuation then needs two Gamma functions and two exponentials
// per evaluation instead of four Gamma and four digamma functions.

// twoPre128 is the h-independent part of k_A at one D: K(D) = exp(lk) mult
// and dlog K/dD.
type twoPre128 struct {
	d, lk, mult, ld complex128
}

// twoPrefactor128 evaluates K(D) and its log-derivative
// 1/(D(D-1)) - 1/(1/2-D) - 4 psi(1-2D) + 2 pi cot(2 pi D).
func twoPrefactor128(d complex128) twoPre128 {
	s, p, ps := gammaParts128(1 - 2*d)
	pd := complex(math.Pi, 0) * 2 * d
	sn, cs := cmplx.Sin(pd), cmplx.Cos(pd)
	mult := -(1 - 1/d) * (0.5 - d) * complex(2/math.Pi, 0) * sn / (p * p)
	ld := 1/(d*(d-1)) - 1/(0.5-d) - 4*ps + complex(2*math.Pi, 0)*cs/sn
	return twoPre128{d: d, lk: 2 * s, mult: mult, ld: ld}
}

// cosParts128 writes cos(a) = exp(e) (1 + eps)/2 with |eps| <= 1 (no
// overflow for any Im a) and returns e, eps and tan(a).
func cosParts128(a complex128) (e, eps, tan complex128) {
	if imag(a) >= 0 {
		eps = cmplx.Exp(complex(0, 2) * a)
		return complex(0, -1) * a, eps, complex(0, 1) * (1 - eps) / (1 + eps)
	}
	eps = cmplx.Exp(complex(0, -2) * a)
	return complex(0, 1) * a, eps, complex(0, -1) * (1 - eps) / (1 + eps)
}

// twoJet128 evaluates k_A(h, D), L_h and L_D (L = log k_A) from the
// prefactor p at D.
func twoJet128(h complex128, p twoPre128) jet128 {
	d := p.d
	sx, px, psx := gammaParts128(h - 1 + 2*d)
	sy, py, psy := gammaParts128(h + 1 - 2*d)
	ea, epa, ta := cosParts128(complex(math.Pi, 0) * (d + h/2))
	eb, epb, tb := cosParts128(complex(math.Pi, 0) * (d - h/2))
	k := cmplx.Exp(p.lk+sx-sy+ea-eb) * p.mult * (py / px) * (1 + epa) / (1 + epb)
	hp := complex(math.Pi/2, 0)
	return jet128{
		k:  k,
		lh: psx - psy - hp*(ta+tb),
		ld: p.ld + 2*(psx+psy) - 2*hp*(ta-tb),
	}
}

// twoJetFull128 is twoJet128 with the second derivatives
// L_hh = psi'(x) - psi'(y) - (pi^2/4)(sec^2 a - sec^2 b) and
// L_hD = 2 psi'(x) + 2 psi'(y) - (pi^2/2)(sec^2 a + sec^2 b), for Newton's
// method on the collision system.
func twoJetFull128(h, d complex128) jet128 {
	j := twoJet128(h, twoPrefactor128(d))
	tx, ty := trigammaShift128(h-1+2*d), trigammaShift128(h+1-2*d)
	_, _, ta := cosParts128(complex(math.Pi, 0) * (d + h/2))
	_, _, tb := cosParts128(complex(math.Pi, 0) * (d - h/2))
	sa, sb := 1+ta*ta, 1+tb*tb
	q := complex(math.Pi*math.Pi/4, 0)
	j.lhh = tx - ty - q*(sa-sb)
	j.lhd = 2*(tx+ty) - 2*q*(sa+sb)
	return j
}
