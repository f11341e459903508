package numeric

import "math"

// Richardson extrapolates values v computed with grid spacings h, 2h, 4h,
// ... (finest first) to h = 0, assuming an error series
// c_1 h^powers[0] + c_2 h^powers[1] + ...: the k-th sweep of the table
// removes h^powers[k-1] (the last power repeats when v is longer than
// powers + 1). The error estimate is the size of the last correction
// applied to the finest entry; a single value is returned with a nominal
// relative error of 1e-3. v is not modified.
func Richardson(v, powers []float64) (val, err float64) {
	if len(v) == 0 {
		return math.NaN(), math.NaN()
	}
	if len(v) == 1 {
		return v[0], math.Abs(v[0]) * 1e-3
	}
	if len(powers) == 0 {
		return math.NaN(), math.NaN()
	}
	t := append([]float64(nil), v...)
	last := 0.0
	for k := 1; k < len(v); k++ {
		f := math.Pow(2, powers[min(k-1, len(powers)-1)])
		prev := t[0]
		for i := 0; i+k < len(v); i++ {
			t[i] += (t[i] - t[i+1]) / (f - 1)
		}
		last = t[0] - prev
	}
	return t[0], math.Abs(last)
}
