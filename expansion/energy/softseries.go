package energy

import (
	"fmt"
	"math"

	"qbridge/expansion/conformal"
)

// The soft-mode coefficients alpha_K and alpha_G as series at both ends:
// the fitted series of alpha_S times the exact series of the factors
// alpha_K/alpha_S = 6 q^2 alpha_0 and alpha_G/alpha_S = 6 q^2 alpha_0/(-q k_A'(2))
// (conformal.SoftFactorSeries; PHYSICS.md sec. 7). Both factors are
// analytic at q = 2 in eps (alpha_0(2) = pi^2; k_A'(2) has a simple pole
// there, so F_G has a simple zero), so alpha_K and alpha_G are power series
// in eps like alpha_S: alpha_K(2) = 24 pi^2 alpha_S(2) = pi, alpha_G(2) = 0.
// Around q = infinity the factors go like 12 q^2 and 8 q, and alpha_S like
// 1/(4 q^2): alpha_K = 3 + O(1/q), alpha_G = 2/q + O(1/q^2).

// Soft-mode quantities beyond alpha_S (ResumGround, SoftSeries).
const (
	QuantityAlphaG = "alpha_G"
	QuantityAlphaK = "alpha_K"
)

// softFactorDigits is the working precision of the factor series: a few
// digits beyond the float64 products they enter.
const softFactorDigits = 25

// SoftPower returns the power p of q that makes q^p F finite and non-zero
// at q = infinity, the function the two-point Pade approximates: 2 for E_0
// and alpha_S, 1 for alpha_G, 0 for alpha_K.
func SoftPower(quantity string) (int, error) {
	switch quantity {
	case QuantityE0, QuantityAlphaS:
		return 2, nil
	case QuantityAlphaG:
		return 1, nil
	case QuantityAlphaK:
		return 0, nil
	}
	return 0, fmt.Errorf("%w: unknown quantity %q", ErrInput, quantity)
}

// SoftAlphaSOrder returns the order of the alpha_S series that gives the
// series of quantity (QuantityAlphaK or QuantityAlphaG) to order around the
// end of variable (VarEps or VarX): around q = 2 alpha_K needs alpha_S to
// the same order and alpha_G to one order less (F_G = O(eps)); around
// q = infinity, where alpha_S starts at x^2, alpha_K needs two orders more
// and alpha_G one (F_G x = O(1)), and never less than 2.
func SoftAlphaSOrder(quantity, variable string, order int) (int, error) {
	if quantity != QuantityAlphaK && quantity != QuantityAlphaG {
		return 0, fmt.Errorf("%w: %q is not alpha_K or alpha_G", ErrInput, quantity)
	}
	g := 0
	if quantity == QuantityAlphaG {
		g = 1
	}
	switch variable {
	case VarEps:
		return max(order-g, 0), nil
	case VarX:
		return max(order+2-g, 2), nil
	}
	return 0, fmt.Errorf("%w: the soft-mode series are in eps or x, not %q", ErrInput, variable)
}

// SoftSeries returns the series of quantity (QuantityAlphaK or
// QuantityAlphaG) around the end of alphaS's variable (VarEps or VarX)
// from the series alphaS of alpha_S there: the product with the exact
// factor series, each coefficient's error the first-order propagation
// sum_j |f_j| err_{k-j} of the alpha_S errors plus the (negligible) factor
// errors times |alpha_S|. With alpha_S known to order n - 1 the result is
// known around q = 2 to order n - 1 (alpha_K) or n (alpha_G, whose
// constant term is an exact zero), and around q = infinity to order n - 3
// (alpha_K) or n - 2 (alpha_G, an exact zero at x^0); around q = infinity
// alpha_S's x^0 and x^1 coefficients must be zero.
func SoftSeries(quantity, variable string, alphaS Coeffs) (Coeffs, error) {
	if quantity != QuantityAlphaK && quantity != QuantityAlphaG {
		return Coeffs{}, fmt.Errorf("%w: %q is not alpha_K or alpha_G", ErrInput, quantity)
	}
	end := conformal.AroundTwo
	a := alphaS
	switch variable {
	case VarEps:
	case VarX:
		end = conformal.AroundInf
		if a.Len() < 3 {
			return Coeffs{}, fmt.Errorf("%w: the 1/q series of alpha_S needs order >= 2", ErrInput)
		}
		if a.Values[0] != 0 || a.Values[1] != 0 {
			return Coeffs{}, fmt.Errorf("energy: the 1/q series of alpha_S must start at x^2")
		}
		a = Coeffs{Values: a.Values[2:], Errors: a.Errors[2:]} // alpha_S/x^2
	default:
		return Coeffs{}, fmt.Errorf("%w: the soft-mode series are in eps or x, not %q", ErrInput, variable)
	}
	n := a.Len()
	if n == 0 {
		return Coeffs{}, fmt.Errorf("%w: empty alpha_S series", ErrInput)
	}
	fk, fg, err := conformal.SoftFactorSeries(end, n, softFactorDigits)
	if err != nil {
		return Coeffs{}, err
	}
	f := fk
	if quantity == QuantityAlphaG {
		f = fg
	}
	fv := make([]float64, len(f.Values))
	fe := make([]float64, len(f.Values))
	for i := range fv {
		fv[i], _ = f.Values[i].Float64()
		fe[i], _ = f.Errors[i].Float64()
		fe[i] += math.Abs(fv[i]) * 0x1p-52 // rounding to float64
	}
	// The product through order n-1, and for alpha_G around q = 2 one
	// order further: F_G's constant term vanishes, so a's unknown order n
	// does not enter its order n.
	m := n
	if quantity == QuantityAlphaG && end == conformal.AroundTwo {
		m = n + 1
	}
	out := Coeffs{Values: make([]float64, m), Errors: make([]float64, m)}
	for k := 0; k < m; k++ {
		v, e := 0.0, 0.0
		for j := 0; j <= k && j < len(fv); j++ {
			i := k - j
			if i >= n {
				continue // only reached with fv[j] = 0 exactly (alpha_G, j = 0)
			}
			v += fv[j] * a.Values[i]
			e += math.Abs(fv[j])*a.Errors[i] + fe[j]*math.Abs(a.Values[i])
		}
		out.Values[k], out.Errors[k] = v, e
	}
	if quantity == QuantityAlphaG && end == conformal.AroundInf {
		// alpha_G = x (x F_G)(alpha_S/x^2): shift by one, x^0 exactly zero.
		out.Values = append([]float64{0}, out.Values...)
		out.Errors = append([]float64{0}, out.Errors...)
	}
	return out, nil
}

// SoftSeriesFromAlphaG returns, around q = 2 in eps, the series of quantity
// (QuantityAlphaG or QuantityAlphaK) from a direct eps-series of alpha_G
// (whose constant term is an exact zero, as at q = 2): alpha_G itself, or
// alpha_K = -q k_A'(2) alpha_G = [F_K/(F_G/eps)] (alpha_G/eps), the factor
// a regular series built once from the exact factors so that the error
// propagation sum_j |r_j| err_(k-j) runs through one product, not through
// alpha_S and back. With alpha_G known to order n, alpha_K is known to
// order n - 1.
func SoftSeriesFromAlphaG(quantity string, alphaG Coeffs) (Coeffs, error) {
	n := alphaG.Len()
	switch {
	case quantity != QuantityAlphaK && quantity != QuantityAlphaG:
		return Coeffs{}, fmt.Errorf("%w: %q is not alpha_K or alpha_G", ErrInput, quantity)
	case n < 2:
		return Coeffs{}, fmt.Errorf("%w: the alpha_G series needs order >= 1", ErrInput)
	case alphaG.Values[0] != 0:
		return Coeffs{}, fmt.Errorf("energy: the eps-series of alpha_G must start at eps^1")
	}
	if quantity == QuantityAlphaG {
		return Coeffs{Values: append([]float64(nil), alphaG.Values...), Errors: append([]float64(nil), alphaG.Errors...)}, nil
	}
	m := n - 1 // alpha_G/eps has m terms, so has alpha_K
	fk, fg, err := conformal.SoftFactorSeries(conformal.AroundTwo, m, softFactorDigits)
	if err != nil {
		return Coeffs{}, err
	}
	// r = F_K / (F_G/eps) through order m-1, in float64 from the exact factors.
	f := make([]float64, m)
	kv := make([]float64, m)
	for j := 0; j < m; j++ {
		f[j], _ = fg.Values[j+1].Float64()
		kv[j], _ = fk.Values[j].Float64()
	}
	r := fsMul(kv, fsInv(f, m), m)
	out := Coeffs{Values: make([]float64, m), Errors: make([]float64, m)}
	for k := 0; k < m; k++ {
		v, e := 0.0, 0.0
		for j := 0; j <= k; j++ {
			v += r[j] * alphaG.Values[k-j+1]
			e += math.Abs(r[j]) * alphaG.Errors[k-j+1]
		}
		out.Values[k], out.Errors[k] = v, e+math.Abs(v)*0x1p-50
	}
	return out, nil
}

// MergeDirectAlphaG takes, per coefficient of c (the eps-series of
// quantity, QuantityAlphaG or QuantityAlphaK, from SoftSeries of alpha_S),
// the value from the direct alpha_G series (SoftSeriesFromAlphaG) where its
// error is the smaller, and returns the orders it took. An empty alphaG
// leaves c as it is. The length of c is kept.
func MergeDirectAlphaG(quantity string, c, alphaG Coeffs) (Coeffs, []int, error) {
	if alphaG.Len() < 2 {
		return c, nil, nil
	}
	d, err := SoftSeriesFromAlphaG(quantity, alphaG)
	if err != nil {
		return c, nil, err
	}
	out := Coeffs{Values: append([]float64(nil), c.Values...), Errors: append([]float64(nil), c.Errors...)}
	var took []int
	for k := 0; k < out.Len() && k < d.Len(); k++ {
		if d.Errors[k] < out.Errors[k] {
			out.Values[k], out.Errors[k] = d.Values[k], d.Errors[k]
			took = append(took, k)
		}
	}
	return out, took, nil
}
