package energy

import (
	"fmt"
	"math"

	"qbridge/expansion/conformal"
	"qbridge/numeric"
)

// ZeroTEps holds alpha_G, alpha_S and E_0 as eps-series from the
// zero-temperature route (EpsZeroT), each coefficient with an error.
type ZeroTEps struct {
	AlphaG, AlphaS, E0 Coeffs
	Method             string
	Ground             *numeric.ZeroTEpsGround
}

// zeroTEpsDims is how many h_n enter the correction exponents.
const zeroTEpsDims = 3

// EpsZeroT solves the zero-temperature equations as series in eps to the
// given order (numeric.SolveZeroTEpsGround, with the eps-series of h_1..h_3
// from package conformal) and returns alpha_G and E_0 to that order and
// alpha_S = alpha_G / F_G to one order less (F_G = alpha_G/alpha_S, the
// exact factor of conformal.SoftFactorSeries, starts at 6 pi^2 eps, and
// alpha_G's constant term is an exact zero: q = 2 has no 1/tau correction).
// The alpha_S errors are the alpha_G errors propagated through the series
// division (first order, sum_j |(eps/F_G)_j| err_(k-j)).
func EpsZeroT(order int, progress func(float64, string)) (*ZeroTEps, error) {
	if order < 1 || order > numeric.MaxEpsSeriesOrder {
		return nil, fmt.Errorf("%w: the zero-temperature eps-series takes orders 1..%d, got %d", ErrInput, numeric.MaxEpsSeriesOrder, order)
	}
	k := order + 1
	var dims [][]float64
	for n := 1; n <= zeroTEpsDims; n++ {
		c, err := conformal.DimensionSeries(conformal.AroundTwo, n, order, softFactorDigits)
		if err != nil {
			return nil, err
		}
		v := make([]float64, k)
		for i := range v {
			v[i], _ = c.Values[i].Float64()
		}
		dims = append(dims, v)
	}
	g, err := numeric.SolveZeroTEpsGround(numeric.EpsSeriesParams{Order: order, Grid: numeric.ZeroTParams{Progress: progress}}, dims)
	if err != nil {
		return nil, err
	}
	out := &ZeroTEps{Ground: g,
		AlphaG: Coeffs{Values: append([]float64(nil), g.AlphaG...), Errors: append([]float64(nil), g.AlphaGErr...)},
		E0:     Coeffs{Values: append([]float64(nil), g.E0...), Errors: append([]float64(nil), g.E0Err...)}}
	// alpha_G(q = 2) = 0 exactly; the fit's value is a check.
	if math.Abs(g.AlphaG[0]) > 5*g.AlphaGErr[0]+1e-12 {
		return nil, fmt.Errorf("energy: the zero-temperature fit gives alpha_G(q = 2) = %.3g +- %.2g, not the exact zero: the fits are unreliable", g.AlphaG[0], g.AlphaGErr[0])
	}
	out.AlphaG.Values[0], out.AlphaG.Errors[0] = 0, 0
	_, fg, err := conformal.SoftFactorSeries(conformal.AroundTwo, order, softFactorDigits)
	if err != nil {
		return nil, err
	}
	// f = F_G/eps, u = alpha_G/eps, alpha_S = u/f through order-1.
	n := order
	f := make([]float64, n)
	for j := range f {
		f[j], _ = fg.Values[j+1].Float64()
	}
	inv := fsInv(f, n)
	out.AlphaS = Coeffs{Values: make([]float64, n), Errors: make([]float64, n)}
	for j := 0; j < n; j++ {
		v, e := 0.0, 0.0
		for i := 0; i <= j; i++ {
			v += inv[i] * g.AlphaG[j-i+1]
			e += math.Abs(inv[i]) * g.AlphaGErr[j-i+1]
		}
		out.AlphaS.Values[j] = v
		out.AlphaS.Errors[j] = e + math.Abs(v)*0x1p-50
	}
	out.Method = g.Method + "; alpha_S = alpha_G / F_G with F_G = 6 q^2 alpha_0/(-q k_A'(2)) as an exact series"
	return out, nil
}
