package energy

import (
	"fmt"
	"math"
	"math/big"
	"math/rand/v2"

	"qbridge/series"
	"qbridge/series/pade"
)

// Estimate is one resummed value with its error bar and how it was obtained.
type Estimate struct {
	Method     string  // one of the Method constants
	Value, Err float64 // the value and its error bar (NaN when not available)
	Detail     string  // how it was obtained (orders, approximants used)
}

// Quantities that can be resummed.
const (
	QuantityE0     = "e0"
	QuantityAlphaS = "alpha"
)

// Method names of the resummations.
const (
	MethodPartialEps  = "eps partial sum"
	MethodPartialInvQ = "1/q partial sum"
	MethodPadeEps     = "eps Pade"
	MethodPadeInvQ    = "1/q Pade"
	MethodTwoPoint    = "two-point Pade"
)

// resumPrec is the working precision of the Pade tables (the coefficients
// are float64; the extra bits keep the linear algebra exact enough).
const resumPrec = 128

// Normalised returns the coefficients of q^2 F as a function of x = 1/q,
// finite at both ends, from the ground series of F around q = 2 (in eps)
// and around q = infinity (in x): around infinity the series in x (the x^0
// and x^1 coefficients of F vanish), around q = 2 the series in
// u = x - 1/2, from q^2 = 4/(1-eps)^2 and eps = -2u. It is
// NormalisedPower with p = 2.
func Normalised(eps, invq Coeffs) (atInf, atTwo Coeffs, err error) {
	return NormalisedPower(eps, invq, 2)
}

// NormalisedPower returns the coefficients of q^p F (p >= 0) as a function
// of x = 1/q from the series of F around q = 2 (in eps) and q = infinity
// (in x, whose x^0 .. x^(p-1) coefficients must vanish): around infinity
// the series in x, around q = 2 the series in u = x - 1/2, from
// q^p = 2^p (1-eps)^(-p) = 2^p sum_j C(p+j-1, j) eps^j and eps = -2u.
func NormalisedPower(eps, invq Coeffs, p int) (atInf, atTwo Coeffs, err error) {
	if p < 0 {
		return Coeffs{}, Coeffs{}, fmt.Errorf("%w: negative power %d", ErrInput, p)
	}
	if invq.Len() < p+1 {
		return Coeffs{}, Coeffs{}, fmt.Errorf("%w: the 1/q series needs order >= %d", ErrInput, p)
	}
	for k := 0; k < p; k++ {
		if invq.Values[k] != 0 {
			return Coeffs{}, Coeffs{}, fmt.Errorf("energy: the 1/q series of this quantity must start at x^%d", p)
		}
	}
	atInf = Coeffs{Values: invq.Values[p:], Errors: invq.Errors[p:]}
	n := eps.Len()
	pre := make([]float64, n) // 2^p (1-eps)^(-p)
	c := math.Ldexp(1, p)
	for j := range pre {
		pre[j] = c
		c *= float64(p+j) / float64(j+1)
	}
	v := fsMul(pre, eps.Values, n)
	e := fsMul(pre, eps.Errors, n) // non-negative weights: errors add
	atTwo = Coeffs{Values: make([]float64, n), Errors: make([]float64, n)}
	f := 1.0
	for j := 0; j < n; j++ {
		atTwo.Values[j] = v[j] * f
		atTwo.Errors[j] = e[j] * math.Abs(f)
		f *= -2
	}
	return atInf, atTwo, nil
}

// Resum evaluates F(q) from its normalised series (see Normalised): partial
// sums and Pade tables from each end, and the two-point Pade built on both.
// Each error bar adds the spread of the approximants (truncation) and the
// largest shift of the value when the coefficients move within their error
// bars (8 deterministic sign patterns). It is ResumPower with p = 2.
func Resum(q float64, atInf, atTwo Coeffs) ([]Estimate, error) {
	return ResumPower(q, 2, atInf, atTwo)
}

// ResumPower is Resum for the normalised series of q^p F (NormalisedPower):
// every estimate of q^p F is multiplied by x^p = q^(-p). At q = infinity
// the estimates are those of q^p F itself (F for p = 0).
func ResumPower(q float64, p int, atInf, atTwo Coeffs) ([]Estimate, error) {
	if math.IsNaN(q) || q < 2 {
		return nil, fmt.Errorf("%w: q must be a real number >= 2, got %g", ErrInput, q)
	}
	if p < 0 {
		return nil, fmt.Errorf("%w: negative power %d", ErrInput, p)
	}
	x := 0.0
	if !math.IsInf(q, 1) {
		x = 1 / q
	}
	xp := math.Pow(x, float64(p))
	scale := func(v float64) float64 {
		if x == 0 {
			return v // q^p F at q = infinity; the caller labels it
		}
		return v * xp
	}
	u := x - 0.5
	var out []Estimate
	// Partial sums.
	for _, c := range []struct {
		name string
		s    Coeffs
		t    float64
	}{{MethodPartialEps, atTwo, u}, {MethodPartialInvQ, atInf, x}} {
		v := 0.0
		tk := 1.0
		err := 0.0
		terms := make([]float64, c.s.Len())
		for k, a := range c.s.Values {
			terms[k] = a * tk
			v += terms[k]
			err += c.s.Errors[k] * math.Abs(tk)
			tk *= c.t
		}
		tail, how := tailBound(terms)
		est := Estimate{Method: c.name, Value: scale(v), Err: scale(tail + err),
			Detail: fmt.Sprintf("%d terms; error = %s + coefficient errors", c.s.Len(), how)}
		if math.IsNaN(tail) {
			est.Detail = fmt.Sprintf("%d terms; error not estimated: %s", c.s.Len(), how)
		}
		out = append(out, est)
	}
	// One-point Pade tables.
	for _, c := range []struct {
		name string
		s    Coeffs
		t    float64
	}{{MethodPadeEps, atTwo, u}, {MethodPadeInvQ, atInf, x}} {
		f := func(vals []float64) (*pade.Resummed, error) {
			s, err := series.FromFloat64(resumPrec, vals...)
			if err != nil {
				return nil, err
			}
			return pade.PadeTable(s, big.NewFloat(c.t), pade.PadeTableOptions{})
		}
		est, err := withCoefficientErrors(c.s, f)
		if err != nil {
			out = append(out, Estimate{Method: c.name, Value: math.NaN(), Err: math.NaN(), Detail: "not available: " + err.Error()})
			continue
		}
		est.Method = c.name
		est.Value, est.Err = scale(est.Value), scale(est.Err)
		out = append(out, est)
	}
	// Two-point Pade on x = 0 and x = 1/2.
	f := func(a, b []float64) (*pade.Resummed, error) {
		sa, err := series.FromFloat64(resumPrec, a...)
		if err != nil {
			return nil, err
		}
		sb, err := series.FromFloat64(resumPrec, b...)
		if err != nil {
			return nil, err
		}
		return pade.ResumTwoPoint(sa, big.NewFloat(0), sb, big.NewFloat(0.5), big.NewFloat(x), pade.TwoPointOptions{})
	}
	est, err := withCoefficientErrors2(atInf, atTwo, f)
	if err != nil {
		out = append(out, Estimate{Method: MethodTwoPoint, Value: math.NaN(), Err: math.NaN(), Detail: "not available: " + err.Error()})
	} else {
		est.Method = MethodTwoPoint
		est.Value, est.Err = scale(est.Value), scale(est.Err)
		out = append(out, est)
	}
	return out, nil
}

// coefficientSamples is the number of sign patterns used to propagate the
// coefficient error bars through a resummation.
const coefficientSamples = 8

func withCoefficientErrors(c Coeffs, f func([]float64) (*pade.Resummed, error)) (Estimate, error) {
	return withCoefficientErrors2(c, Coeffs{}, func(a, _ []float64) (*pade.Resummed, error) { return f(a) })
}

// withCoefficientErrors2 evaluates f on the central coefficients and on
// sign patterns c_k +- err_k (a fixed-seed generator: reproducible), and
// returns the central value with error = truncation spread + largest shift.
func withCoefficientErrors2(a, b Coeffs, f func(a, b []float64) (*pade.Resummed, error)) (Estimate, error) {
	r, err := f(a.Values, b.Values)
	if err != nil {
		return Estimate{}, err
	}
	v, _ := r.Value.Float64()
	trunc, _ := r.Err.Float64()
	rng := rand.New(rand.NewPCG(1, 2))
	shift := 0.0
	failed := 0
	for i := 0; i < coefficientSamples; i++ {
		rp, err := f(a.SignPerturbed(rng), b.SignPerturbed(rng))
		if err != nil {
			// A resummation that fails inside the coefficient error bars is
			// not robust there: its shift is unknown, so is the error.
			failed++
			continue
		}
		w, _ := rp.Value.Float64()
		shift = math.Max(shift, math.Abs(w-v))
	}
	switch {
	case failed == coefficientSamples:
		return Estimate{Value: v, Err: math.NaN(), Detail: fmt.Sprintf("%s; error not estimated: all %d resummations with the coefficients moved within their error bars failed", r.Method, coefficientSamples)}, nil
	case failed > 0:
		return Estimate{Value: v, Err: trunc + shift, Detail: fmt.Sprintf("%s; coefficient shift from %d of %d perturbed resummations (%d failed: the approximant is fragile there)", r.Method, coefficientSamples-failed, coefficientSamples, failed)}, nil
	}
	return Estimate{Value: v, Err: trunc + shift, Detail: r.Method}, nil
}

// Resummation is the resummed value of one quantity at one q.
type Resummation struct {
	Quantity string  // QuantityE0, QuantityAlphaS, QuantityAlphaG or QuantityAlphaK
	Q        float64 // interaction order
	// Power is p of the normalised function q^p F (SoftPower).
	Power int
	// AtInf and AtTwo are the normalised series q^p F in x = 1/q around
	// x = 0 and in x - 1/2 around q = 2 (see NormalisedPower).
	AtInf, AtTwo Coeffs
	Estimates    []Estimate // one per method
}

// ResumGround resums quantity (QuantityE0, QuantityAlphaS, QuantityAlphaG
// or QuantityAlphaK) at q from the ground series around q = 2 (variable
// eps, from EpsGround) and around q = infinity (from InvQGround). alpha_G
// and alpha_K are resummed from their own series (SoftSeries of the
// determined part of the alpha_S series), as q alpha_G and alpha_K.
func ResumGround(quantity string, q float64, eps, invq *GroundSeries) (*Resummation, error) {
	if eps == nil || invq == nil || eps.Variable != VarEps || invq.Variable != VarX {
		return nil, fmt.Errorf("energy: ResumGround needs an eps series and a 1/q series")
	}
	a, b, p, err := ResumSeries(quantity, eps, invq)
	if err != nil {
		return nil, err
	}
	inf, two, err := NormalisedPower(a, b, p)
	if err != nil {
		return nil, err
	}
	est, err := ResumPower(q, p, inf, two)
	if err != nil {
		return nil, err
	}
	return &Resummation{Quantity: quantity, Q: q, Power: p, AtInf: inf, AtTwo: two, Estimates: est}, nil
}

// ResumSeries returns the series a resummation of quantity uses around
// q = 2 (a, in eps) and q = infinity (b, in x), and the power p of its
// normalised function q^p F: the orders the fits determine (for alpha_G
// and alpha_K, SoftSeries of those of alpha_S, around q = 2 merged with the
// direct alpha_G series by MergeDirectAlphaG).
func ResumSeries(quantity string, eps, invq *GroundSeries) (a, b Coeffs, p int, err error) {
	switch quantity {
	case QuantityE0:
		a, b = eps.E0, invq.E0
	case QuantityAlphaS, QuantityAlphaG, QuantityAlphaK:
		a, b = eps.AlphaS, invq.AlphaS
	default:
		return a, b, 0, fmt.Errorf("%w: quantity must be %q, %q, %q or %q, got %q", ErrInput, QuantityE0, QuantityAlphaS, QuantityAlphaG, QuantityAlphaK, quantity)
	}
	a, b = resolved(a), resolved(b)
	if quantity == QuantityAlphaG || quantity == QuantityAlphaK {
		if a, err = SoftSeries(quantity, VarEps, a); err != nil {
			return a, b, 0, err
		}
		// As the series command: the direct alpha_G series of the
		// zero-temperature route where it is the more accurate.
		if a, _, err = MergeDirectAlphaG(quantity, a, eps.ZeroTAlphaG); err != nil {
			return a, b, 0, err
		}
		if b, err = SoftSeries(quantity, VarX, b); err != nil {
			return a, b, 0, err
		}
	}
	p, err = SoftPower(quantity)
	return a, b, p, err
}

// tailBound estimates the omitted tail of a partial sum from its last
// terms: with t_K the last two non-zero terms and their ratio r < 1, the
// tail is bounded by the geometric series |t_K| r/(1-r), and the last
// term itself is added (it is known only to the accuracy of the series).
// When the terms do not decrease the tail is not estimated (NaN).
func tailBound(terms []float64) (float64, string) {
	var nz []float64
	for _, x := range terms {
		if x != 0 {
			nz = append(nz, math.Abs(x))
		}
	}
	if len(nz) < 2 {
		return math.NaN(), "fewer than two non-zero terms"
	}
	last, prev := nz[len(nz)-1], nz[len(nz)-2]
	r := last / prev
	if r >= 0.9 {
		return math.NaN(), fmt.Sprintf("the terms do not decrease (ratio of the last two %.2g)", r)
	}
	return last + last*r/(1-r), "last term + geometric tail from the ratio of the last two terms"
}

// resolved returns the longest prefix of c whose coefficients the fits
// determine: it stops before the first coefficient whose error is at least
// its size (and above the float64 noise floor), since a resummation fed
// an undetermined coefficient is steered by noise.
func resolved(c Coeffs) Coeffs {
	n := c.Len()
	for k := 0; k < c.Len(); k++ {
		e, v := c.Errors[k], math.Abs(c.Values[k])
		if math.IsNaN(e) || math.IsInf(e, 0) || (e >= v && e > 1e-12) {
			n = k
			break
		}
	}
	return Coeffs{Values: c.Values[:n], Errors: c.Errors[:n]}
}
