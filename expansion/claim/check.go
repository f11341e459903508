package claim

import (
	"errors"
	"fmt"
	"math/big"

	"qbridge/expansion/conformal"
)

// OrderCheck is the comparison at one power t^K of the expansion variable.
type OrderCheck struct {
	// K is the power.
	K int
	// Diff is the coefficient of t^K in LHS - RHS.
	Diff *big.Float
	// Err is its propagated error bound; zero only for an exact zero (no
	// inexact input and no rounding reaches this coefficient).
	Err *big.Float
	// Agrees reports |Diff| <= max(3 Err, tol).
	Agrees bool
}

// Sigma returns |Diff|/Err, the size of the difference in standard errors;
// ok is false when Err is zero.
func (o OrderCheck) Sigma() (s *big.Float, ok bool) {
	if o.Err == nil || o.Err.Sign() == 0 {
		return nil, false
	}
	s = new(big.Float).Abs(o.Diff)
	return s.Quo(s, o.Err), true
}

// Result is a claim compared order by order around one end.
type Result struct {
	// Claim is the claim as written.
	Claim string
	// End is the end expanded around.
	End conformal.End
	// Order is the highest power compared.
	Order int
	// Tol is the absolute tolerance of the comparison (zero: none).
	Tol *big.Float
	// Orders are the comparisons from the lowest power of the difference
	// (0, or the lowest negative power with a coefficient that is not an
	// exact zero) to Order.
	Orders []OrderCheck
	// LHS, RHS and Diff are the expanded sides and their difference.
	LHS, RHS, Diff *Laurent
	// Notes say how the quantities were expanded.
	Notes []string
}

// Holds reports that every compared order agrees.
func (r *Result) Holds() bool { return r.FirstDisagreement() == nil }

// FirstDisagreement returns the lowest order that does not agree, nil when
// all agree.
func (r *Result) FirstDisagreement() *OrderCheck {
	for i := range r.Orders {
		if !r.Orders[i].Agrees {
			return &r.Orders[i]
		}
	}
	return nil
}

// HoldsTo returns the highest K such that every order up to K agrees; ok is
// false when the lowest order already disagrees.
func (r *Result) HoldsTo() (k int, ok bool) {
	f := r.FirstDisagreement()
	switch {
	case f == nil:
		return r.Order, true
	case f == &r.Orders[0]:
		return 0, false
	}
	return f.K - 1, true
}

// dryExtra is how much further the exact dry run expands to tell a
// vanishing divisor from a short one.
const dryExtra = 40

// maxAttempts bounds how often Check expands further when negative powers
// (a q around q = infinity, a division by a vanishing series) cost orders.
const maxAttempts = 6

// Check expands both sides of c around end, every input through as many
// orders as the difference needs to be known through t^order, and compares
// the difference with zero order by order: a coefficient agrees when
// |difference| <= max(3 error, tol) (tol nil: 0).
func (e *Evaluator) Check(c *Claim, end conformal.End, order int, tol *big.Float) (*Result, error) {
	if tol == nil {
		tol = new(big.Float)
	}
	if tol.Sign() < 0 || tol.IsInf() {
		return nil, errAt(0, "the tolerance must be a finite number >= 0")
	}
	extra, err := e.deficit(c, end, order)
	if err != nil {
		return nil, err
	}
	hi := max(order, 0) + extra
	for attempt := 0; ; attempt++ {
		if hi > conformal.MaxOrder {
			return nil, errAt(0, "the claim needs its inputs to order %d around q = %s, above the supported %d", hi, end, conformal.MaxOrder)
		}
		l, r, d, err := e.sides(c, end, hi)
		switch {
		case errors.Is(err, errShort):
			// A divisor that vanishes also when every quantity is replaced
			// by an exact series and everything is expanded much further
			// is zero: say so now rather than expand the quantities again.
			var se *shortError
			if errors.As(err, &se) {
				dry := &Evaluator{Digits: 20, dry: true}
				_, _, _, derr := dry.sides(c, end, hi+dryExtra)
				if errors.Is(derr, errShort) {
					return nil, errAt(se.col, "%s (through order %d, and through %d with the quantities replaced by exact series)", se.msg, hi, hi+dryExtra)
				}
			}
			hi += 2
		case err != nil:
			return nil, err
		case d.Hi() >= order:
			return e.result(c, end, order, tol, l, r, d)
		default:
			hi += order - d.Hi()
		}
		if attempt == maxAttempts {
			var se *shortError
			if errors.As(err, &se) {
				return nil, errAt(se.col, "%s (through order %d)", se.msg, hi)
			}
			return nil, errAt(0, "the claim's negative powers cost more orders than %d expansions could supply", maxAttempts)
		}
	}
}

// sides expands both sides and their difference with inputs through t^hi.
func (e *Evaluator) sides(c *Claim, end conformal.End, hi int) (l, r, d *Laurent, err error) {
	if l, err = e.expand(c.LHS, end, hi); err != nil {
		return nil, nil, nil, err
	}
	if r, err = e.expand(c.RHS, end, hi); err != nil {
		return nil, nil, nil, err
	}
	d, err = add(l, r, true)
	return l, r, d, err
}

// deficit estimates how many orders the claim's negative powers cost, from
// a dry run with every quantity replaced by a generic exact series (so that
// expensive quantities are expanded once, to the right order). A divisor
// that vanishes to every order even then, expanded dryExtra orders
// further, is zero, and is reported.
func (e *Evaluator) deficit(c *Claim, end conformal.End, order int) (int, error) {
	dry := &Evaluator{Digits: 20, dry: true}
	base := max(order, 0)
	d := 0
	for range 8 {
		_, _, diff, err := dry.sides(c, end, base+d)
		switch {
		case errors.Is(err, errShort):
			if d >= dryExtra {
				var se *shortError
				if errors.As(err, &se) {
					return 0, errAt(se.col, "%s (through order %d, with the quantities replaced by generic exact series)", se.msg, base+d)
				}
				return d, nil
			}
			d = min(2*d+2, dryExtra)
		case err != nil || diff.Hi() >= order:
			return d, nil
		default:
			d += order - diff.Hi()
		}
	}
	return d, nil
}

// result compares the difference order by order.
func (e *Evaluator) result(c *Claim, end conformal.End, order int, tol *big.Float, l, r, d *Laurent) (*Result, error) {
	res := &Result{Claim: c.Text, End: end, Order: order, Tol: tol, LHS: l, RHS: r, Diff: d}
	three := big.NewFloat(3)
	for k := min(d.Lo, 0); k <= order; k++ {
		v, er := d.Coeff(k)
		if k < 0 && len(res.Orders) == 0 && v.Sign() == 0 && er.Sign() == 0 {
			continue // exact zeros below t^0
		}
		bound := new(big.Float).Mul(er, three)
		if bound.Cmp(tol) < 0 {
			bound.Set(tol)
		}
		res.Orders = append(res.Orders, OrderCheck{K: k, Diff: v, Err: er, Agrees: new(big.Float).Abs(v).Cmp(bound) <= 0})
	}
	if len(res.Orders) == 0 {
		return nil, errAt(0, "nothing to compare: the claim's order %d is below the lowest power %d of LHS - RHS", order, min(d.Lo, 0))
	}
	seen := map[string]bool{}
	for _, q := range c.Quantities {
		if s, ok := e.series[seriesKey{q.Name(), end}]; ok && !seen[q.Name()] {
			seen[q.Name()] = true
			res.Notes = append(res.Notes, fmt.Sprintf("%s around q = %s: %s", q.Name(), end, s.Method))
		}
	}
	return res, nil
}

// Verdict says in words whether the claim holds: "holds to order K" or
// "first fails at order k: difference d +- e (s sigma)".
func (r *Result) Verdict(digits int) string {
	f := r.FirstDisagreement()
	if f == nil {
		return fmt.Sprintf("holds to order %d", r.Order)
	}
	return fmt.Sprintf("first fails at order %d: difference %s", f.K, f.DiffText(digits))
}

// DiffText prints the difference with its error and sigma: "d +- e (s
// sigma)", or "d (exact)" when the error is zero.
func (o OrderCheck) DiffText(digits int) string {
	s, ok := o.Sigma()
	if !ok {
		return o.Diff.Text('g', digits) + " (exact)"
	}
	return fmt.Sprintf("%s +- %s (%s sigma)", o.Diff.Text('g', DiffDigits(o.Diff, o.Err, digits)), o.Err.Text('e', 1), SigmaText(s))
}

// DiffDigits is the number of significant digits worth printing for a
// value d with error e: those above the error plus one, at most max.
func DiffDigits(d, e *big.Float, maxDigits int) int {
	if e == nil || e.Sign() == 0 || d.Sign() == 0 {
		return maxDigits
	}
	n := d.MantExp(nil) - e.MantExp(nil) // binary orders of magnitude
	digits := int(float64(n)*0.30103) + 2
	return min(max(digits, 2), maxDigits)
}

// SigmaText prints a number of standard errors: two decimals below 1000,
// e-notation above.
func SigmaText(s *big.Float) string {
	f, _ := s.Float64()
	if f < 1000 {
		return fmt.Sprintf("%.2f", f)
	}
	return s.Text('e', 1)
}
