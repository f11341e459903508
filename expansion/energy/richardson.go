package energy

import "math"

// richardson extrapolates values on grids with spacings h, 2h, 4h, ...
// (finest first) to h = 0, removing the error terms h^powers[0],
// h^powers[1], ... one by one. The error estimate is the size of the last
// correction applied to the finest entry plus the round-off floor.
func richardson(v []float64, powers []float64) (val, err float64) {
	if len(v) == 1 {
		return v[0], math.Abs(v[0]) * 1e-3
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
	floor := 0.0
	for _, x := range v {
		floor = math.Max(floor, math.Abs(x))
	}
	return t[0], math.Abs(last) + floor*0x1p-44
}
