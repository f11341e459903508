package conformal

import (
	"fmt"
	"math"
	"math/big"
	"sync"

	"qbridge/series/scalar"
)

// bigGammaParts is Gamma(z), psi(z) and psi'(z) at one complex z from one
// shift of the argument: Gamma(z) = sqrt(2 pi) exp(s)/p.
type bigGammaParts struct {
	s, p, psi, tri scalar.Complex
}

// gammaPartsBig evaluates Gamma, digamma and (with wantTri) trigamma at
// complex z to about prec bits. The recurrence shifts the argument to
// w = z + m with Re w >= 0.12 prec + 8, keeping the product p = prod_{j<m}
// (z+j) and its first two derivatives, so that sum 1/(z+j) = p'/p and sum
// 1/(z+j)^2 = (p'/p)^2 - p”/p cost no divisions; then
//
//	log Gamma(w) - log(2 pi)/2 ~ (w - 1/2) log w - w + sum B_2k/(2k(2k-1) w^(2k-1))  (DLMF 5.11.1)
//	psi(w)  ~ log w - 1/(2w) - sum B_2k / (2k w^2k)                                 (DLMF 5.11.2)
//	psi'(w) ~ 1/w + 1/(2w^2) + sum B_2k / w^(2k+1)                                  (DLMF 5.15.8)
//
// are summed until their terms fall below 2^-prec (the smallest term is
// about exp(-2 pi |w|)). One logarithm serves all three, and no reflection
// is needed (the recurrence works from any z that is not a pole). It
// returns an error at the poles z = 0, -1, -2, ...
func gammaPartsBig(z scalar.Complex, prec uint, wantTri bool) (bigGammaParts, error) {
	var g bigGammaParts
	if z.Im.Sign() == 0 && z.Re.Sign() <= 0 && z.Re.IsInt() {
		return g, fmt.Errorf("%w: Gamma at the pole %s", scalar.ErrPole, z.Re.Text('g', 10))
	}
	wp := prec + 32
	minRe := math.Ceil(0.12*float64(wp)) + 8
	re, _ := z.Re.Float64()
	if re < -1e4 {
		return g, fmt.Errorf("expansion: Gamma argument %s too far left", z.Re.Text('g', 10))
	}
	w := scalar.NewComplex(z.Re, z.Im, wp)
	one := cf(1, wp)
	p, dp, ddp := cf(1, wp), cf(0, wp), cf(0, wp)
	two := big.NewFloat(2)
	for shifted := false; ; shifted = true {
		if re, _ = w.Re.Float64(); re >= minRe {
			break
		}
		if wantTri {
			ddp = scalar.CAdd(scalar.CMul(ddp, w, wp), scalar.CScale(dp, two, wp), wp)
		}
		if shifted {
			dp = scalar.CAdd(scalar.CMul(dp, w, wp), p, wp)
			p = scalar.CMul(p, w, wp)
		} else {
			dp, p = p, scalar.NewComplex(w.Re, w.Im, wp)
		}
		w = scalar.CAdd(w, one, wp)
	}
	lw, err := scalar.CLog(w, wp)
	if err != nil {
		return g, err
	}
	iw, err := scalar.CDiv(one, w, wp)
	if err != nil {
		return g, err
	}
	iw2 := scalar.CMul(iw, iw, wp)
	half := big.NewFloat(0.5)
	wm := scalar.NewComplex(w.Re, w.Im, wp)
	wm.Re.Sub(wm.Re, half)
	g.s = scalar.CSub(scalar.CMul(wm, lw, wp), w, wp)
	g.psi = scalar.CSub(lw, scalar.CScale(iw, half, wp), wp)
	g.tri = scalar.CAdd(iw, scalar.CScale(iw2, half, wp), wp)
	bern, err := bernoulliFloats(wp)
	if err != nil {
		return g, err
	}
	pw := iw // w^-(2k-1)
	limit := -int(wp) - 4
	for k := 1; ; k++ {
		if k > len(bern) {
			return g, fmt.Errorf("expansion: Stirling series did not converge")
		}
		b := bern[k-1]
		ts := scalar.CScale(pw, b.stirling, wp)
		g.s = scalar.CAdd(g.s, ts, wp)
		pw2 := scalar.CMul(pw, iw, wp) // w^-2k
		tp := scalar.CScale(pw2, b.psi, wp)
		g.psi = scalar.CSub(g.psi, tp, wp)
		done := cExp(ts) < limit+cExp(g.s) && cExp(tp) < limit+cExp(g.psi)
		if wantTri {
			tt := scalar.CScale(scalar.CMul(pw2, iw, wp), b.b, wp)
			g.tri = scalar.CAdd(g.tri, tt, wp)
			done = done && cExp(tt) < limit+cExp(g.tri)
		}
		if done {
			break
		}
		pw = scalar.CMul(pw2, iw, wp)
	}
	g.p = p
	if dp.Re.Sign() != 0 || dp.Im.Sign() != 0 {
		r, err := scalar.CDiv(dp, p, wp) // sum 1/(z+j)
		if err != nil {
			return g, fmt.Errorf("%w: Gamma at a pole", scalar.ErrPole)
		}
		g.psi = scalar.CSub(g.psi, r, wp)
		if wantTri {
			r2, err := scalar.CDiv(ddp, p, wp)
			if err != nil {
				return g, err
			}
			g.tri = scalar.CAdd(g.tri, scalar.CSub(scalar.CMul(r, r, wp), r2, wp), wp)
		}
	}
	return g, nil
}

// bernCoef holds B_2k and the coefficients B_2k/(2k(2k-1)) and B_2k/(2k)
// of the Stirling and digamma series at one precision.
type bernCoef struct {
	b, stirling, psi *big.Float
}

// bernCache keeps the coefficients by precision (the refinement uses two).
var bernCache = struct {
	sync.Mutex
	m map[uint][]bernCoef
}{m: map[uint][]bernCoef{}}

// bernoulliFloats returns the series coefficients for k = 1, 2, ... at
// prec bits, enough for the smallest argument gammaPartsBig uses.
func bernoulliFloats(prec uint) ([]bernCoef, error) {
	bernCache.Lock()
	defer bernCache.Unlock()
	if c, ok := bernCache.m[prec]; ok {
		return c, nil
	}
	n := int(prec)/3 + 20
	c := make([]bernCoef, 0, n)
	for k := 1; k <= n; k++ {
		b, err := scalar.Bernoulli(2 * k)
		if err != nil {
			return nil, err
		}
		bf := new(big.Float).SetPrec(prec).SetRat(b)
		st := new(big.Float).SetPrec(prec).Quo(bf, bigInt(int64(2*k*(2*k-1)), prec))
		ps := new(big.Float).SetPrec(prec).Quo(bf, bigInt(int64(2*k), prec))
		c = append(c, bernCoef{b: bf, stirling: st, psi: ps})
	}
	bernCache.m[prec] = c
	return c, nil
}

// cExp is the binary exponent of the larger part of z (a very negative
// number for z = 0).
func cExp(z scalar.Complex) int {
	e := -1 << 30
	if z.Re.Sign() != 0 {
		e = z.Re.MantExp(nil)
	}
	if z.Im.Sign() != 0 {
		e = max(e, z.Im.MantExp(nil))
	}
	return e
}
