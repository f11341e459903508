package expansion

import (
	"errors"
	"math/big"
	"slices"

	"qbridge/expansion/conformal"
)

// ErrInput marks a request the provider cannot serve because of its
// parameters (a flag that does not apply, an order outside the supported
// range): the command line reports it as a usage error.
var ErrInput = errors.New("invalid request")

// Request carries what a command asks of a provider. Fields a quantity does
// not use must be left at their zero value (Set lists what was given), so
// that a provider can refuse a flag that does not apply instead of
// ignoring it.
type Request struct {
	// N is the dimension index (indexed quantities only).
	N int
	// End is the expansion point of a series.
	End conformal.End
	// Order is the highest power kept (series) or used at each end (resum).
	Order int
	// Digits is the working precision in decimal digits.
	Digits int
	// Beta is the inverse temperature beta*script-J (finite-temperature
	// quantities only).
	Beta float64
	// Set names the optional request fields the user gave ("n", "beta").
	Set map[string]bool
	// Progress, when not nil, receives the fraction done and a status.
	Progress func(frac float64, detail string)
}

// SeriesResult is a quantity's Taylor series around one end.
type SeriesResult struct {
	// Parts holds the series; the first is the quantity's own (or, where the
	// quantity is not a power series at that end, the analytic function
	// printed instead), further parts are analytic companions.
	Parts []*conformal.Coefficients
	// Check is a built-in test of the computation, when it has one.
	Check *SeriesCheck
	// Notes say how the series was obtained.
	Notes []string
}

// SeriesCheck compares computed coefficients with exactly known ones
// order by order (for E_0 and alpha_S: the fitted S_0 against its exact
// series, a test of the whole chain of solves and fits).
type SeriesCheck struct {
	// Name of the checked quantity.
	Name string
	// Fitted and FittedErr are the computed coefficients and their errors.
	Fitted, FittedErr []*big.Float
	// Exact are the exactly known coefficients.
	Exact []*big.Float
	// ExactErr, when not nil, are errors of Exact (an exact formula summed
	// numerically); a nil entry is exact or not estimated (ExactReason).
	ExactErr []*big.Float
	// ExactReason says, per coefficient, why ExactErr is nil (empty: exact).
	ExactReason []string
	// Against names the exact column and how it is obtained; empty means
	// "exact series".
	Against string
}

// Reference is the value resummations are compared with: exact where an
// exact value exists, else the direct solver's.
type Reference struct {
	// Value and Err are the reference and its error.
	Value, Err *big.Float
	// Kind is "exact" or "direct".
	Kind string
	// Method says how it was obtained.
	Method string
}

// Resummation is a quantity at one q from its series at both ends, with
// the reference value beside it.
type Resummation struct {
	// Name is the printed name (h_1, S_0, ...).
	Name string
	// Q is the point.
	Q conformal.QPoint
	// OrderEps and OrderX are the orders used around q = 2 and q = infinity.
	OrderEps, OrderX int
	// Reference is the exact or direct value.
	Reference *Reference
	// Estimates in MethodOrder.
	Estimates []conformal.Estimate
	// Published is a literature value at this q, when one is known.
	Published *conformal.Published
	// Notes say how the estimates were obtained.
	Notes []string
}

// Difference returns estimate minus reference, nil when either is missing.
func (r *Resummation) Difference(e conformal.Estimate) *big.Float {
	if e.Value == nil || r.Reference == nil || r.Reference.Value == nil {
		return nil
	}
	return new(big.Float).Sub(e.Value, r.Reference.Value)
}

// Method names, in the one order every resummation lists them.
const (
	// MethodPartialEps is the partial sum of the series in eps at eps(q).
	MethodPartialEps = "eps partial sum"
	// MethodPadeEps is the best pole-free Pade-table entry of the eps series.
	MethodPadeEps = "eps Pade"
	// MethodConfMapEps is the conformal-mapping resummation of the eps
	// series: the plane cut from its nearest singularities mapped onto the
	// unit disc, the series re-expanded there and Pade-resummed.
	MethodConfMapEps = "eps conformal map"
	// MethodPartialX is the partial sum of the series in x = 1/q.
	MethodPartialX = "1/q partial sum"
	// MethodPadeX is the best pole-free Pade-table entry of the x series.
	MethodPadeX = "1/q Pade"
	// MethodConfMapX is the conformal-mapping resummation of the x series.
	MethodConfMapX = "1/q conformal map"
	// MethodTwoPoint is the two-point Pade matching both series.
	MethodTwoPoint = "two-point Pade"
)

// MethodOrder is the order in which resummation methods are listed.
var MethodOrder = []string{MethodPartialEps, MethodPadeEps, MethodConfMapEps, MethodPartialX, MethodPadeX, MethodConfMapX, MethodTwoPoint}

// sortEstimates puts estimates into MethodOrder (unknown methods last, in
// their given order).
func sortEstimates(es []conformal.Estimate) {
	rank := func(m string) int {
		if i := slices.Index(MethodOrder, m); i >= 0 {
			return i
		}
		return len(MethodOrder)
	}
	slices.SortStableFunc(es, func(a, b conformal.Estimate) int { return rank(a.Method) - rank(b.Method) })
}

// Provider is what every quantity implements.
type Provider interface {
	// Quantity describes the quantity.
	Quantity() Quantity
	// Series returns the Taylor series around r.End to r.Order.
	Series(r Request) (*SeriesResult, error)
	// Resum evaluates the quantity at q from its series at both ends.
	Resum(q conformal.QPoint, r Request) (*Resummation, error)
}

var (
	registry []Provider
	byKey    = map[string]Provider{}
)

// register adds a provider under its name and aliases; called from init.
func register(p Provider) {
	registry = append(registry, p)
	q := p.Quantity()
	for _, k := range append([]string{q.Name}, q.Aliases...) {
		byKey[normalise(k)] = p
	}
}

// Providers returns every registered provider in vocabulary order.
func Providers() []Provider { return slices.Clone(registry) }

// ExactProvider is implemented by quantities with an exact value at every q.
type ExactProvider interface {
	// Provider is the quantity's series and resummation.
	Provider
	// Exact returns the value at q (index r.N for the dimensions) with its
	// error, from two working precisions.
	Exact(q conformal.QPoint, r Request) (*conformal.Value, error)
}

// Coster is implemented by providers whose work can run long: it estimates
// the wall time of a series request in seconds on one core of the
// reference machine (2 cores, 2026), so that commands can refuse or warn
// before starting.
type Coster interface {
	// SeriesSeconds estimates the time of Series(r).
	SeriesSeconds(r Request) float64
}
