package energy

import "qbridge/series"

// floats returns the coefficients of s rounded to float64, passing err on.
func floats(s *series.Series, err error) ([]float64, error) {
	if err != nil {
		return nil, err
	}
	out := make([]float64, s.Len())
	for k := range out {
		out[k], _ = s.Coeff(k).Float64()
	}
	return out, nil
}
