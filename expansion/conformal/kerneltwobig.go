package conformal

import (
	"math/big"

	"qbridge/series/scalar"
)

// kernelJetBig evaluates k_A(h, D) and L_h, L_D, L_hh, L_hD of L = log k_A
// at complex h and D to about prec bits, in the two-Gamma form of
// kerneltwo128.go,
//
//	k_A = K(D) Gamma(x)/Gamma(y) cos(a)/cos(b),  K(D) = -(1 - 1/D) (1/2 - D) (2/pi) Gamma(e)^2 sin(2 pi D),
//	x = h - 1 + 2D, y = h + 1 - 2D, e = 1 - 2D, a = pi (D + h/2), b = pi (D - h/2),
//
// (MS 2016, arXiv:1604.07818; PHYSICS.md section 4, by the reflection and
// duplication formulas): three Gamma functions, each with its digamma (and
// trigamma) from one shift, instead of eight Gamma and eight digamma
// functions. The derivatives are
//
//	L_h  = psi(x) - psi(y) - (pi/2)(tan a + tan b)
//	L_D  = 1/(D(D-1)) - 1/(1/2-D) - 4 psi(e) + 2 pi cot(2 pi D) + 2 psi(x) + 2 psi(y) - pi (tan a - tan b)
//	L_hh = psi'(x) - psi'(y) - (pi^2/4)(sec^2 a - sec^2 b)
//	L_hD = 2 psi'(x) + 2 psi'(y) - (pi^2/2)(sec^2 a + sec^2 b).
//
// With full false only k_A and L_h are computed.
func kernelJetBig(h, d scalar.Complex, prec uint, full bool) (bigJet, error) {
	wp := prec + 32
	var j bigJet
	one := cf(1, wp)
	two := big.NewFloat(2)
	d2 := scalar.CScale(d, two, wp)
	x := scalar.CAdd(scalar.CSub(h, one, wp), d2, wp)
	y := scalar.CSub(scalar.CAdd(h, one, wp), d2, wp)
	e := scalar.CSub(one, d2, wp)
	gx, err := gammaPartsBig(x, prec, full)
	if err != nil {
		return j, err
	}
	gy, err := gammaPartsBig(y, prec, full)
	if err != nil {
		return j, err
	}
	ge, err := gammaPartsBig(e, prec, false)
	if err != nil {
		return j, err
	}
	pi := scalar.Pi(wp)
	hh := scalar.CScale(h, big.NewFloat(0.5), wp)
	ta, err := newTrigParts(scalar.CScale(scalar.CAdd(d, hh, wp), pi, wp), wp)
	if err != nil {
		return j, err
	}
	tb, err := newTrigParts(scalar.CScale(scalar.CSub(d, hh, wp), pi, wp), wp)
	if err != nil {
		return j, err
	}
	tc, err := newTrigParts(scalar.CScale(d2, pi, wp), wp)
	if err != nil {
		return j, err
	}
	// exponent: 2 s(e) + s(x) - s(y) and the exponential factors of the
	// trigonometric functions (the sqrt(2 pi) of Gamma(x)/Gamma(y) cancel,
	// those of Gamma(e)^2 give the 2 pi in mult)
	ex := scalar.CAdd(scalar.CScale(ge.s, two, wp), scalar.CSub(gx.s, gy.s, wp), wp)
	ex = scalar.CAdd(ex, scalar.CSub(ta.e, tb.e, wp), wp)
	ex = scalar.CAdd(ex, tc.e, wp)
	// mult = -(1 - 1/D)(1/2 - D)(2/pi)(2 pi)(sinPart/2) (1+eps_a)/(1+eps_b) p_y/(p_x p_e^2)
	inv, err := scalar.CDiv(one, d, wp)
	if err != nil {
		return j, err
	}
	mult := scalar.CMul(scalar.CSub(inv, one, wp), scalar.CSub(cf(0.5, wp), d, wp), wp) // -(1 - 1/D)(1/2 - D)
	mult = scalar.CScale(mult, two, wp)
	mult = scalar.CMul(mult, tc.sinPart, wp)
	num := scalar.CMul(mult, scalar.CMul(ta.cosPart, gy.p, wp), wp)
	den := scalar.CMul(scalar.CMul(tb.cosPart, gx.p, wp), scalar.CMul(ge.p, ge.p, wp), wp)
	ratio, err := scalar.CDiv(num, den, wp)
	if err != nil {
		return j, err
	}
	j.k = scalar.CMul(scalar.CExp(ex, wp), ratio, wp)
	halfPi := new(big.Float).SetPrec(wp).Quo(pi, two)
	tsum := scalar.CAdd(ta.tan, tb.tan, wp)
	j.lh = scalar.CSub(scalar.CSub(gx.psi, gy.psi, wp), scalar.CScale(tsum, halfPi, wp), wp)
	if !full {
		return j, nil
	}
	// L_D
	dd1 := scalar.CMul(d, scalar.CSub(d, one, wp), wp)
	ld, err := scalar.CDiv(one, dd1, wp)
	if err != nil {
		return j, err
	}
	r, err := scalar.CDiv(one, scalar.CSub(cf(0.5, wp), d, wp), wp)
	if err != nil {
		return j, err
	}
	ld = scalar.CSub(ld, r, wp)
	ld = scalar.CSub(ld, scalar.CScale(ge.psi, big.NewFloat(4), wp), wp)
	ld = scalar.CAdd(ld, scalar.CScale(tc.cot, new(big.Float).SetPrec(wp).Mul(pi, two), wp), wp)
	ld = scalar.CAdd(ld, scalar.CScale(scalar.CAdd(gx.psi, gy.psi, wp), two, wp), wp)
	j.ld = scalar.CSub(ld, scalar.CScale(scalar.CSub(ta.tan, tb.tan, wp), pi, wp), wp)
	// second derivatives, sec^2 = 1 + tan^2
	sa := scalar.CAdd(one, scalar.CMul(ta.tan, ta.tan, wp), wp)
	sb := scalar.CAdd(one, scalar.CMul(tb.tan, tb.tan, wp), wp)
	pi2 := new(big.Float).SetPrec(wp).Mul(pi, pi)
	q4 := new(big.Float).SetPrec(wp).Quo(pi2, big.NewFloat(4))
	q2 := new(big.Float).SetPrec(wp).Quo(pi2, two)
	j.lhh = scalar.CSub(scalar.CSub(gx.tri, gy.tri, wp), scalar.CScale(scalar.CSub(sa, sb, wp), q4, wp), wp)
	j.lhd = scalar.CSub(scalar.CScale(scalar.CAdd(gx.tri, gy.tri, wp), two, wp), scalar.CScale(scalar.CAdd(sa, sb, wp), q2, wp), wp)
	return j, nil
}

// trigParts writes the trigonometric functions of c without overflow for
// any Im c: with eps = exp(2ic) for Im c >= 0 and exp(-2ic) otherwise
// (|eps| <= 1), cos c = exp(e) cosPart/2 and sin c = exp(e) sinPart/2.
type trigParts struct {
	e, cosPart, sinPart, tan, cot scalar.Complex
}

// newTrigParts returns the parts of c at prec bits.
func newTrigParts(c scalar.Complex, prec uint) (trigParts, error) {
	var t trigParts
	i := scalar.NewComplex(nil, big.NewFloat(1), prec)
	ic := scalar.CMul(i, c, prec)
	up := c.Im.Sign() >= 0
	if up {
		t.e = scalar.CScale(ic, big.NewFloat(-1), prec)
	} else {
		t.e = ic
	}
	// eps = exp(-2 e)
	eps := scalar.CExp(scalar.CScale(t.e, big.NewFloat(-2), prec), prec)
	one := cf(1, prec)
	p1 := scalar.CAdd(one, eps, prec)
	m1 := scalar.CSub(one, eps, prec)
	t.cosPart = p1
	// sin c = exp(e)(eps - 1)/(2i) (up) or exp(e)(1 - eps)/(2i), so
	// sinPart = -i (eps - 1) or -i (1 - eps)
	mi := scalar.NewComplex(nil, big.NewFloat(-1), prec)
	if up {
		t.sinPart = scalar.CMul(mi, scalar.CScale(m1, big.NewFloat(-1), prec), prec)
	} else {
		t.sinPart = scalar.CMul(mi, m1, prec)
	}
	// tan = sinPart/cosPart, cot = cosPart/sinPart
	q, err := scalar.CDiv(t.sinPart, p1, prec)
	if err != nil {
		return t, err
	}
	t.tan = q
	if t.cot, err = scalar.CDiv(p1, t.sinPart, prec); err != nil {
		return t, err
	}
	return t, nil
}
