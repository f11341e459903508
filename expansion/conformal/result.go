package conformal

import (
	"math/big"
)

// Value is an exactly defined quantity evaluated numerically, with an error
// estimate and a description of how it was obtained.
type Value struct {
	// Quantity names what was evaluated: "h_n" (n the index), "b" or "S_0".
	Quantity string
	// Q is the point q at which the quantity was evaluated.
	Q QPoint
	// N is the dimension index n of h_n; -1 where it does not apply.
	N int
	// Value is the result, from the more precise of the two runs.
	Value *big.Float
	// Err is the estimated absolute error of Value: the difference between
	// the two runs plus a few units in the last place.
	Err *big.Float
	// Method says in words how Value was computed and at which two
	// precisions (in bits) it was run.
	Method string
}

// Coefficients is the Taylor series of a quantity around one end of the q
// axis, every coefficient with an error estimate.
type Coefficients struct {
	// Quantity names the function expanded, e.g. "h_n" (n the index), "b",
	// "b^q" or "S_0".
	Quantity string
	// End is the end of the q axis expanded around, which fixes the
	// variable: eps = 1 - 2/q or x = 1/q.
	End End
	// N is the dimension index n of h_n; -1 where it does not apply.
	N int
	// Values holds the coefficients, from the more precise of the two runs:
	// Values[k] multiplies the k-th power of the expansion variable,
	// k = 0..order.
	Values []*big.Float
	// Errors holds the estimated absolute error of each coefficient:
	// Errors[k] is the difference between the two runs for Values[k] plus a
	// few units in the last place of the lower precision (of the larger of
	// Values[k] and its neighbours, so that a vanishing coefficient states
	// the rounding of the terms it is summed from).
	Errors []*big.Float
	// Radius estimates the radius of convergence in the expansion variable
	// (RadiusErr its uncertainty); nil when the coefficients do not allow it.
	Radius, RadiusErr *big.Float
	// RadiusMethod says in words how Radius was estimated; empty when
	// Radius is nil.
	RadiusMethod string
	// Method says in words how the coefficients were computed and at which
	// two precisions (in bits) they were run.
	Method string
	// Prec is the precision in bits of the more precise of the two runs.
	Prec uint
}

// pairErrors returns the values of the more precise run and, as error, the
// difference of the two runs plus a few units in the last place of the
// lower precision, taken of the larger of the coefficient and its two
// neighbours.
func pairErrors(lo, hi []*big.Float, precLo uint) (vals, errs []*big.Float) {
	vals = make([]*big.Float, len(hi))
	errs = make([]*big.Float, len(hi))
	for i := range hi {
		vals[i] = hi[i]
		d := new(big.Float).SetPrec(64).Sub(hi[i], lo[i])
		d.Abs(d)
		// The rounding floor is relative to the larger of the coefficient
		// and its neighbours: a coefficient that vanishes (or nearly) is
		// summed from terms of its neighbours' size, and its rounding
		// noise is of their size, not of its own.
		ulp := new(big.Float).SetPrec(64).Abs(hi[i])
		for _, j := range []int{i - 1, i + 1} {
			if j >= 0 && j < len(hi) && new(big.Float).Abs(hi[j]).Cmp(ulp) > 0 {
				ulp.Abs(hi[j])
			}
		}
		if ulp.Sign() == 0 {
			ulp.SetInt64(1)
		}
		ulp.SetMantExp(ulp, -int(precLo)+4)
		errs[i] = d.Add(d, ulp)
	}
	return vals, errs
}
