package numeric

import "math"

// CompSum is a running sum with Neumaier's compensation: the rounding error
// of every addition is kept and added back at the end, so a sum of n terms
// is accurate to a few ulps instead of n ulps. The 1/q expansion sums 10^6
// terms and multiplies by beta; plain summation there cost 1e-17 beta n.
type CompSum struct{ s, c float64 }

// Add adds x to the sum.
func (k *CompSum) Add(x float64) {
	t := k.s + x
	if math.Abs(k.s) >= math.Abs(x) {
		k.c += (k.s - t) + x
	} else {
		k.c += (x - t) + k.s
	}
	k.s = t
}

// Sum returns the compensated sum.
func (k *CompSum) Sum() float64 { return k.s + k.c }
