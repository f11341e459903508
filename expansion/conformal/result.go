package conformal

import (
	"math/big"
)

// Value is an exactly defined quantity evaluated numerically, with an error
// estimate and a description of how it was obtained.
type Value struct {
	Quantity string
	Q        QPoint
	N        int // dimension index; -1 where it does not apply
	Value    *big.Float
	Err      *big.Float
	Method   string
}

// Coefficients is the Taylor series of a quantity around one end of the q
// axis, every coefficient with an error estimate.
type Coefficients struct {
	Quantity string
	End      End
	N        int // dimension index; -1 where it does not apply
	Values   []*big.Float
	Errors   []*big.Float
	// Radius estimates the radius of convergence in the expansion variable
	// (RadiusErr its uncertainty); nil when the coefficients do not allow it.
	Radius, RadiusErr *big.Float
	RadiusMethod      string
	Method            string
	Prec              uint // bits of the more precise of the two runs
}

// pairErrors returns the values of the more precise run and, as error, the
// difference of the two runs plus a few units in the last place.
func pairErrors(lo, hi []*big.Float, precLo uint) (vals, errs []*big.Float) {
	vals = make([]*big.Float, len(hi))
	errs = make([]*big.Float, len(hi))
	for i := range hi {
		vals[i] = hi[i]
		d := new(big.Float).SetPrec(64).Sub(hi[i], lo[i])
		d.Abs(d)
		ulp := new(big.Float).SetPrec(64).Abs(hi[i])
		if ulp.Sign() == 0 {
			ulp.SetInt64(1)
		}
		ulp.SetMantExp(ulp, -int(precLo)+4)
		errs[i] = d.Add(d, ulp)
	}
	return vals, errs
}
