package expansion

import (
	"fmt"
	"math"

	"qbridge/expansion/conformal"
)

// conformalProvider serves h_n, b and S_0 from package conformal.
type conformalProvider struct {
	q    Quantity
	kind string // conformal.QuantityDims, QuantityB or QuantityS0
}

func init() {
	register(conformalProvider{Quantity{Name: HN, Aliases: []string{"dims"}, Unit: "1", Indexed: true, Exact: true,
		Summary: "operator dimensions, roots of k_A(h) = 1 (h_0 = 2 is the soft mode)"}, conformal.QuantityDims})
	register(conformalProvider{Quantity{Name: B, Unit: "1", Exact: true,
		Summary: "coefficient of the conformal two-point function, b^q pi = (1/2 - 1/q) tan(pi/q)"}, conformal.QuantityB})
	register(conformalProvider{Quantity{Name: S0, Aliases: []string{"s0"}, Unit: "1 (per Majorana fermion)", Exact: true,
		Summary: "zero-temperature entropy per Majorana fermion"}, conformal.QuantityS0})
}

func (p conformalProvider) Quantity() Quantity { return p.q }

func (p conformalProvider) check(r Request) error {
	if r.Set["beta"] {
		return fmt.Errorf("%w: --beta does not apply to %s (a zero-temperature quantity)", ErrInput, p.q.Name)
	}
	if !p.q.Indexed && r.Set["n"] {
		return fmt.Errorf("%w: --n does not apply to %s (only to the dimensions h_n)", ErrInput, p.q.Name)
	}
	return nil
}

func (p conformalProvider) Series(r Request) (*SeriesResult, error) {
	if err := p.check(r); err != nil {
		return nil, err
	}
	out := &SeriesResult{}
	switch p.kind {
	case conformal.QuantityDims:
		c, err := conformal.DimensionSeries(r.End, r.N, r.Order, r.Digits)
		if err != nil {
			return nil, err
		}
		out.Parts = []*conformal.Coefficients{c}
	case conformal.QuantityB:
		cs, err := conformal.BSeries(r.End, r.Order, r.Digits)
		if err != nil {
			return nil, err
		}
		out.Parts = cs
		if r.End == conformal.AroundInf {
			out.Notes = append(out.Notes, "b is not a power series in x = 1/q: log b = x log x + x R(x); printed are b^q and R(x) = log(b)/x - log(x)")
		}
	case conformal.QuantityS0:
		c, err := conformal.S0Series(r.End, r.Order, r.Digits)
		if err != nil {
			return nil, err
		}
		out.Parts = []*conformal.Coefficients{c}
	}
	return out, nil
}

func (p conformalProvider) Resum(q conformal.QPoint, r Request) (*Resummation, error) {
	if err := p.check(r); err != nil {
		return nil, err
	}
	n := max(r.N, 0)
	// High-order rational approximants solve ill-conditioned linear systems:
	// they need about one working digit per order (the two-point Pade at
	// order 40 fails at 21 digits and works at 30).
	digits := max(r.Digits, r.Order)
	cr, err := conformal.Resum(p.kind, q, n, r.Order, digits)
	if err != nil {
		return nil, err
	}
	out := &Resummation{
		Name: p.q.Named(n), Q: q, OrderEps: r.Order, OrderX: r.Order,
		Reference: &Reference{Value: cr.Exact.Value, Err: cr.Exact.Err, Kind: "exact", Method: cr.Exact.Method},
		Estimates: cr.Estimates,
	}
	if p.kind == conformal.QuantityB {
		out.Notes = append(out.Notes, "b is resummed through b^q, analytic at both ends")
	}
	if digits > r.Digits {
		out.Notes = append(out.Notes, fmt.Sprintf("worked at %d digits (raised from %d: the order-%d approximants need about one digit per order)", digits, r.Digits, r.Order))
	}
	switch p.kind {
	case conformal.QuantityDims:
		if pub, ok := conformal.PublishedDimension(q, n); ok {
			out.Published = &pub
		}
	case conformal.QuantityS0:
		pub := conformal.PublishedS0(q)
		out.Published = &pub
	}
	sortEstimates(out.Estimates)
	return out, nil
}

func (p conformalProvider) Exact(q conformal.QPoint, r Request) (*conformal.Value, error) {
	if err := p.check(r); err != nil {
		return nil, err
	}
	switch p.kind {
	case conformal.QuantityDims:
		return conformal.Dimension(q, r.N, r.Digits)
	case conformal.QuantityB:
		return conformal.B(q, r.Digits)
	}
	return conformal.S0(q, r.Digits)
}

// SeriesSeconds models the cost of the dimension series: Newton's
// iteration on series costs about order^3 (measured: 1.7 s at order 40 and
// 14 s at order 80 with 26 working digits; the digits matter less, about
// their square root). b and S_0 come from closed forms and are fast.
func (p conformalProvider) SeriesSeconds(r Request) float64 {
	if p.kind != conformal.QuantityDims {
		return 0.1
	}
	o := float64(r.Order) / 40
	return 1.7 * o * o * o * math.Sqrt(float64(max(r.Digits, 26))/26)
}
