package numeric

import (
	"math"
	"math/rand/v2"
	"sort"
)

// Coeffs is a list of numbers with an error bar on each, such as the
// coefficients of a truncated power series (Values[k] multiplies t^k and
// Errors[k] is its uncertainty) or the parameters of a fit.
type Coeffs struct {
	// Values are the numbers.
	Values []float64
	// Errors are their uncertainties, same length as Values.
	Errors []float64
}

// Len is the number of coefficients.
func (c Coeffs) Len() int { return len(c.Values) }

// SignPerturbed returns the values each moved by its error with a random
// sign drawn from rng: one corner of the box the error bars span, the
// sample that coefficient-error propagation by resampling uses.
func (c Coeffs) SignPerturbed(rng *rand.Rand) []float64 {
	out := make([]float64, c.Len())
	for k := range out {
		s := 1.0
		if rng.IntN(2) == 0 {
			s = -1
		}
		out[k] = c.Values[k] + s*c.Errors[k]
	}
	return out
}

// MedianSpread returns the median of v and half its range, the robust
// central value and spread of a set of estimates (NaN, NaN for an empty v).
// v is not modified.
func MedianSpread(v []float64) (median, halfRange float64) {
	if len(v) == 0 {
		return math.NaN(), math.NaN()
	}
	s := append([]float64(nil), v...)
	sort.Float64s(s)
	med := s[len(s)/2]
	if len(s)%2 == 0 {
		med = (s[len(s)/2-1] + s[len(s)/2]) / 2
	}
	return med, (s[len(s)-1] - s[0]) / 2
}
