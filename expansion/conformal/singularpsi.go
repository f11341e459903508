package conformal

import (
	"fmt"
	"math"
	"math/big"

	"qbridge/series/scalar"
)

// complexPsi returns the digamma and trigamma functions psi(z), psi'(z) at
// complex z to about prec bits. The recurrences psi(z) = psi(z+m) -
// sum_{j<m} 1/(z+j) and psi'(z) = psi'(z+m) + sum_{j<m} 1/(z+j)^2 shift
// the argument to Re w >= 0.12 prec + 8, where the asymptotic series
//
//	psi(w)  ~ log w - 1/(2w) - sum_{k>=1} B_2k / (2k w^2k)   (DLMF 5.11.2)
//	psi'(w) ~ 1/w + 1/(2w^2) + sum_{k>=1} B_2k / w^(2k+1)    (DLMF 5.15.8)
//
// are summed until their terms fall below 2^-prec (the smallest term is
// about exp(-2 pi |w|)); psi' only when wantTri. It returns an error at the
// poles z = 0, -1, -2, ...
func complexPsi(z scalar.Complex, prec uint, wantTri bool) (psi, tri scalar.Complex, err error) {
	if z.Im.Sign() == 0 && z.Re.Sign() <= 0 && z.Re.IsInt() {
		return psi, tri, fmt.Errorf("%w: digamma at the pole %s", scalar.ErrPole, z.Re.Text('g', 10))
	}
	wp := prec + 32
	minRe := math.Ceil(0.12*float64(wp)) + 8
	w := scalar.NewComplex(z.Re, z.Im, wp)
	one := scalar.ComplexFloat64(1, 0, wp)
	psi = scalar.ComplexFloat64(0, 0, wp)
	tri = scalar.ComplexFloat64(0, 0, wp)
	for steps := 0; ; steps++ {
		re, _ := w.Re.Float64()
		if re >= minRe {
			break
		}
		if steps > 1<<16 {
			return psi, tri, fmt.Errorf("expansion: digamma argument %s too far left", z.Re.Text('g', 10))
		}
		inv, err := scalar.CDiv(one, w, wp)
		if err != nil {
			return psi, tri, err
		}
		psi = scalar.CSub(psi, inv, wp)
		if wantTri {
			tri = scalar.CAdd(tri, scalar.CMul(inv, inv, wp), wp)
		}
		w = scalar.CAdd(w, one, wp)
	}
	lw, err := scalar.CLog(w, wp)
	if err != nil {
		return psi, tri, err
	}
	winv, err := scalar.CDiv(one, w, wp)
	if err != nil {
		return psi, tri, err
	}
	winv2 := scalar.CMul(winv, winv, wp)
	half := big.NewFloat(0.5)
	psi = scalar.CAdd(psi, scalar.CSub(lw, scalar.CScale(winv, half, wp), wp), wp)
	tri = scalar.CAdd(tri, scalar.CAdd(winv, scalar.CScale(winv2, half, wp), wp), wp)
	pw := winv2 // w^-2k
	limit := -int(wp) - 4
	for k := 1; k < 100000; k++ {
		b, err := scalar.Bernoulli(2 * k)
		if err != nil {
			return psi, tri, err
		}
		bf := new(big.Float).SetPrec(wp).SetRat(b)
		tp := scalar.CScale(pw, new(big.Float).SetPrec(wp).Quo(bf, bigInt(int64(2*k), wp)), wp)
		psi = scalar.CSub(psi, tp, wp)
		done := cExp(tp) < limit+cExp(psi)
		if wantTri {
			tt := scalar.CScale(scalar.CMul(pw, winv, wp), bf, wp)
			tri = scalar.CAdd(tri, tt, wp)
			done = done && cExp(tt) < limit+cExp(tri)
		}
		if done {
			return psi, tri, nil
		}
		pw = scalar.CMul(pw, winv2, wp)
	}
	return psi, tri, fmt.Errorf("expansion: digamma series did not converge")
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
