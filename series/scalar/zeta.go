package scalar

import (
	"errors"
	"fmt"
	"math"
	"math/big"
)

// powIntFloat returns v^k for k >= 0 by binary powering at prec bits.
func powIntFloat(v *big.Float, k int64, prec uint) *big.Float {
	r := new(big.Float).SetPrec(prec).SetInt64(1)
	b := new(big.Float).SetPrec(prec).Set(v)
	for ; k > 0; k >>= 1 {
		if k&1 == 1 {
			r.Mul(r, b)
		}
		if k > 1 {
			b.Mul(b, b)
		}
	}
	return r
}

// hurwitzPower returns v^-s for v > 0 at wp bits; integer s is done by
// powering, any other s as exp(-s log v) with extra bits for the size of
// s log v.
func hurwitzPower(v, s *big.Float, sInt int64, isInt bool, wp uint) (*big.Float, error) {
	if isInt {
		if sInt >= 0 {
			inv := new(big.Float).SetPrec(wp+8).Quo(big.NewFloat(1), v)
			return powIntFloat(inv, sInt, wp), nil
		}
		return powIntFloat(v, -sInt, wp), nil
	}
	sf, _ := s.Float64()
	vf, _ := v.Float64()
	extra := uint(math.Log2(math.Abs(sf*math.Log(vf))+2)) + 4
	lv, err := BigLog(v, wp+extra)
	if err != nil {
		return nil, err
	}
	lv.Mul(lv, s)
	lv.Neg(lv)
	return BigExp(lv, wp), nil
}

// hurwitzEulerMaclaurin returns zeta(s, a) for a > 0, s != 1, and the
// exponent of the largest part, by Euler-Maclaurin summation (DLMF 2.10.1
// applied to (a+j)^-s): N direct terms with a + N >= minArg, then
//
//	(a+N)^(1-s)/(s-1) + (a+N)^-s/2
//	  + sum_{m>=1} B_{2m}/(2m)! (s)_{2m-1} (a+N)^(1-s-2m)
//
// summed until the terms fall below the working precision. For s > 1 the
// direct sum stops early once the remaining tail, bounded by the integral
// (a+j)^(1-s)/(s-1), is negligible.
func hurwitzEulerMaclaurin(s, a *big.Float, wp uint) (*big.Float, int, error) {
	isInt := s.IsInt() && s.MantExp(nil) < 31
	var sInt int64
	if isInt {
		sInt, _ = s.Int64()
	}
	sf, _ := s.Float64()
	minArg := stirlingMinArg(wp) + math.Abs(sf)/4
	for try := 0; try < 6; try, minArg = try+1, 2*minArg {
		v, scale, err := hurwitzEMTry(s, a, sInt, isInt, minArg, wp)
		if errors.Is(err, errNoConvergence) {
			continue
		}
		return v, scale, err
	}
	return nil, 0, errNoConvergence
}

func hurwitzEMTry(s, a *big.Float, sInt int64, isInt bool, minArg float64, wp uint) (*big.Float, int, error) {
	one := big.NewFloat(1)
	sm1 := new(big.Float).SetPrec(wp).Sub(s, one)
	n := shiftCount(a, minArg)
	sum := new(big.Float).SetPrec(wp)
	scale := math.MinInt32
	v := new(big.Float).SetPrec(wp)
	bound := new(big.Float).SetPrec(wp)
	for j := 0; j < n; j++ {
		v.Add(a, new(big.Float).SetInt64(int64(j)))
		t, err := hurwitzPower(v, s, sInt, isInt, wp)
		if err != nil {
			return nil, 0, err
		}
		sum.Add(sum, t)
		if e := expOf(t); e > scale {
			scale = e
		}
		if sm1.Sign() > 0 && j > 0 {
			bound.Mul(t, v)
			bound.Quo(bound, sm1)
			if expOf(bound) < expOf(sum)-int(wp)-4 {
				return sum, scale, nil
			}
		}
	}
	w := new(big.Float).SetPrec(wp).Add(a, new(big.Float).SetInt64(int64(n)))
	ws, err := hurwitzPower(w, s, sInt, isInt, wp)
	if err != nil {
		return nil, 0, err
	}
	t := new(big.Float).SetPrec(wp).Mul(w, ws)
	t.Quo(t, sm1)
	if e := expOf(t); e > scale {
		scale = e
	}
	sum.Add(sum, t)
	t.SetMantExp(ws, -1)
	sum.Add(sum, t)
	// r_m = (s)_{2m-1} w^(1-s-2m) / (2m)!
	winv := new(big.Float).SetPrec(wp).Quo(one, w)
	winv2 := new(big.Float).SetPrec(wp).Mul(winv, winv)
	r := new(big.Float).SetPrec(wp).Mul(s, ws)
	r.Mul(r, winv)
	r.Quo(r, big.NewFloat(2))
	bern := bernoulliEvenFloat(int(wp)/6+8, wp)
	term := new(big.Float).SetPrec(wp)
	f := new(big.Float).SetPrec(wp)
	prevExp := math.MaxInt32
	for m := 1; r.Sign() != 0; m++ {
		if m > len(bern) {
			if m > 4*int(wp)+100 {
				return nil, 0, errNoConvergence
			}
			bern = bernoulliEvenFloat(2*len(bern), wp)
		}
		term.Mul(bern[m-1], r)
		sum.Add(sum, term)
		e := expOf(term)
		if e > scale {
			scale = e
		}
		if e < expOf(sum)-int(wp)-4 {
			break
		}
		if m > 2 && e > prevExp {
			return nil, 0, errNoConvergence
		}
		prevExp = e
		// (s)_{2m+1}/(s)_{2m-1} = (s+2m-1)(s+2m); (2m+2)!/(2m)! = (2m+1)(2m+2)
		f.Add(s, new(big.Float).SetInt64(int64(2*m-1)))
		r.Mul(r, f)
		f.Add(s, new(big.Float).SetInt64(int64(2*m)))
		r.Mul(r, f)
		r.Quo(r, new(big.Float).SetInt64(int64((2*m+1)*(2*m+2))))
		r.Mul(r, winv2)
	}
	return sum, scale, nil
}

// BigHurwitzZeta returns the Hurwitz zeta function
// zeta(s, a) = sum_{j>=0} (a+j)^-s (DLMF 25.11.1, continued analytically in
// s) for real s != 1 and a > 0, at prec bits, by Euler-Maclaurin summation.
// The shift N and the number of Bernoulli correction terms follow from
// prec; for s < 1, where the sum cancels against the tail, the working
// precision is raised until the result is accurate. It returns ErrPole for
// s = 1 and ErrDomain for a <= 0.
func BigHurwitzZeta(s, a *big.Float, prec uint) (*big.Float, error) {
	if err := CheckPrec(prec); err != nil {
		return nil, err
	}
	if err := checkReal("BigHurwitzZeta", s); err != nil {
		return nil, err
	}
	if err := checkReal("BigHurwitzZeta", a); err != nil {
		return nil, err
	}
	if s.Cmp(big.NewFloat(1)) == 0 {
		return nil, fmt.Errorf("%w: Hurwitz zeta at s = 1", ErrPole)
	}
	if a.Sign() <= 0 {
		return nil, fmt.Errorf("%w: Hurwitz zeta needs a > 0 (got %s)", ErrDomain, a.Text('g', 10))
	}
	if s.MantExp(nil) > 40 {
		return nil, fmt.Errorf("%w: Hurwitz zeta exponent |s| > 2^40", ErrDomain)
	}
	return zivRefine(prec, func(wp uint) (*big.Float, int, error) {
		return hurwitzEulerMaclaurin(s, a, wp)
	})
}

// BigZeta returns the Riemann zeta function zeta(s) at prec bits for real
// s != 1: zeta(s, 1) by Euler-Maclaurin for s >= 0, and the functional
// equation zeta(s) = 2^s pi^(s-1) sin(pi s/2) Gamma(1-s) zeta(1-s)
// (DLMF 25.4.1) for s < 0, exactly zero at the trivial zeros -2, -4, ...
// It returns ErrPole for s = 1 and ErrDomain when Gamma(1-s) overflows
// (s < -2^28).
func BigZeta(s *big.Float, prec uint) (*big.Float, error) {
	if err := CheckPrec(prec); err != nil {
		return nil, err
	}
	if err := checkReal("BigZeta", s); err != nil {
		return nil, err
	}
	if s.Sign() >= 0 {
		return BigHurwitzZeta(s, big.NewFloat(1), prec)
	}
	half := new(big.Float).SetPrec(s.Prec()+1).SetMantExp(s, -1)
	if half.IsInt() {
		return new(big.Float).SetPrec(prec), nil
	}
	wp := prec + Guard
	oneMinus := addIntExact(new(big.Float).Neg(s), 1, wp)
	z, err := BigHurwitzZeta(oneMinus, big.NewFloat(1), wp)
	if err != nil {
		return nil, err
	}
	g, err := gammaReal(oneMinus, wp)
	if err != nil {
		return nil, err
	}
	// sin(pi s/2) = sin(pi f) (-1)^n with s/2 = n + f.
	n, f := splitNearestInt(half, wp)
	sn, _ := sinCosPi(f, wp)
	if n.Bit(0) == 1 {
		sn.Neg(sn)
	}
	two := new(big.Float).SetPrec(wp).SetInt64(2)
	p2, err := BigPow(two, s, wp)
	if err != nil {
		return nil, err
	}
	sm1 := new(big.Float).SetPrec(wp).Sub(s, big.NewFloat(1))
	pp, err := BigPow(Pi(wp), sm1, wp)
	if err != nil {
		return nil, err
	}
	z.Mul(z, g)
	z.Mul(z, sn)
	z.Mul(z, p2)
	z.Mul(z, pp)
	return z.SetPrec(prec), nil
}

// hurwitzZetaInts returns zeta(k, a) for k = 2..kmax (entries 0 and 1 are
// nil) for a > 0, at prec bits. The powers (a+j)^-k of the direct sum are
// shared across k, and so are the Bernoulli coefficients of the
// Euler-Maclaurin tail; terms below the precision are skipped. This is the
// core of the Taylor series of log Gamma and the polygamma functions.
func hurwitzZetaInts(a *big.Float, kmax int, prec uint) ([]*big.Float, error) {
	if err := CheckPrec(prec); err != nil {
		return nil, err
	}
	if err := checkReal("hurwitzZetaInts", a); err != nil {
		return nil, err
	}
	if a.Sign() <= 0 {
		return nil, fmt.Errorf("%w: Hurwitz zeta needs a > 0 (got %s)", ErrDomain, a.Text('g', 10))
	}
	if kmax < 2 {
		return make([]*big.Float, kmax+1), nil
	}
	wp := prec + Guard
	minArg := stirlingMinArg(wp)
	for try := 0; try < 6; try, minArg = try+1, 2*minArg {
		out, err := hurwitzIntsTry(a, kmax, minArg, wp)
		if errors.Is(err, errNoConvergence) {
			continue
		}
		if err != nil {
			return nil, err
		}
		for k := 2; k <= kmax; k++ {
			out[k].SetPrec(prec)
		}
		return out, nil
	}
	return nil, errNoConvergence
}

func hurwitzIntsTry(a *big.Float, kmax int, minArg float64, wp uint) ([]*big.Float, error) {
	one := big.NewFloat(1)
	out := make([]*big.Float, kmax+1)
	lead := make([]int, kmax+1) // exponent of a^-k, the largest term
	for k := 2; k <= kmax; k++ {
		out[k] = new(big.Float).SetPrec(wp)
	}
	n := shiftCount(a, minArg)
	v := new(big.Float).SetPrec(wp)
	inv := new(big.Float).SetPrec(wp)
	pw := new(big.Float).SetPrec(wp)
	for j := 0; j < n; j++ {
		v.Add(a, new(big.Float).SetInt64(int64(j)))
		inv.Quo(one, v)
		pw.Mul(inv, inv)
		for k := 2; k <= kmax; k++ {
			if j == 0 {
				lead[k] = expOf(pw)
			} else if expOf(pw) < lead[k]-int(wp)-4 {
				break // later k are smaller still, relative to their sums
			}
			out[k].Add(out[k], pw)
			pw.Mul(pw, inv)
		}
	}
	w := new(big.Float).SetPrec(wp).Add(a, new(big.Float).SetInt64(int64(n)))
	winv := new(big.Float).SetPrec(wp).Quo(one, w)
	if n == 0 {
		p := new(big.Float).SetPrec(wp).Mul(winv, winv)
		for k := 2; k <= kmax; k++ {
			lead[k] = expOf(p)
			p.Mul(p, winv)
		}
	}
	winv2 := new(big.Float).SetPrec(wp).Mul(winv, winv)
	// q[m-1] = B_{2m}/(2m)! w^(1-2m), shared by all k.
	var q []*big.Float
	qpow := new(big.Float).SetPrec(wp).Set(winv)
	qfact := new(big.Float).SetPrec(wp).SetInt64(2)
	bern := bernoulliEvenFloat(int(wp)/6+8, wp)
	qget := func(m int) (*big.Float, error) {
		for len(q) < m {
			i := len(q) + 1
			if i > len(bern) {
				if i > 4*int(wp)+100 {
					return nil, errNoConvergence
				}
				bern = bernoulliEvenFloat(2*len(bern), wp)
			}
			if i > 1 {
				qpow.Mul(qpow, winv2)
				qfact.Mul(qfact, new(big.Float).SetInt64(int64((2*i-1)*(2*i))))
			}
			t := new(big.Float).SetPrec(wp).Mul(bern[i-1], qpow)
			q = append(q, t.Quo(t, qfact))
		}
		return q[m-1], nil
	}
	wk1 := new(big.Float).SetPrec(wp).Set(winv) // w^(1-k)
	wk := new(big.Float).SetPrec(wp)            // w^-k
	poch := new(big.Float).SetPrec(wp)
	term := new(big.Float).SetPrec(wp)
	for k := 2; k <= kmax; k++ {
		if expOf(wk1)+1 < lead[k]-int(wp)-4 {
			break // whole tail below the precision, for this and later k
		}
		wk.Mul(wk1, winv)
		term.Quo(wk1, new(big.Float).SetInt64(int64(k-1)))
		out[k].Add(out[k], term)
		term.SetMantExp(wk, -1)
		out[k].Add(out[k], term)
		poch.SetInt64(int64(k))
		prevExp := math.MaxInt32
		for m := 1; ; m++ {
			qm, err := qget(m)
			if err != nil {
				return nil, err
			}
			term.Mul(qm, poch)
			term.Mul(term, wk)
			out[k].Add(out[k], term)
			e := expOf(term)
			if e < expOf(out[k])-int(wp)-4 {
				break
			}
			if m > 2 && e > prevExp {
				return nil, errNoConvergence
			}
			prevExp = e
			poch.Mul(poch, new(big.Float).SetInt64(int64((k+2*m-1)*(k+2*m))))
		}
		wk1.Set(wk)
	}
	return out, nil
}
