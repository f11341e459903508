package claim

import (
	"fmt"
	"math/big"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

// DefaultOrder is the highest power compared when the claim has no O() term
// and no order is asked for.
const DefaultOrder = 6

// OrderTerm is what the O() terms of a claim say: the end they name (if
// any) and the power of its variable from which on the claim says nothing.
type OrderTerm struct {
	// Col is the column of the (first) O.
	Col int
	// Text is the O() term as written.
	Text string
	// End is the end the term names, valid when HasEnd.
	End conformal.End
	// HasEnd is false for O(1), which names no end.
	HasEnd bool
	// Power is k of O(t^k): coefficients of t^j, j < k, are claimed.
	Power int
}

// stripSide removes the O() terms of the top-level sum of one side into
// terms; any other O() is an error. A side with nothing left is the number
// 0 (col is where the side starts).
func stripSide(n Node, col int, terms *[]*BigO) (Node, error) {
	out := stripOrder(n, terms)
	var bad *BigO
	if out != nil {
		walk(out, func(m Node) {
			if o, ok := m.(*BigO); ok && bad == nil {
				bad = o
			}
		})
	}
	if bad != nil {
		return nil, errAt(bad.At, "O(...) must be a term of the sum on one side, not inside a product, power or function")
	}
	if out == nil {
		return &Number{At: col, Text: "0", Value: new(big.Rat)}, nil
	}
	return out, nil
}

func stripOrder(n Node, terms *[]*BigO) Node {
	switch t := n.(type) {
	case *BigO:
		*terms = append(*terms, t)
		return nil
	case *Unary:
		x := stripOrder(t.X, terms)
		if x == nil {
			return nil
		}
		return &Unary{At: t.At, X: x}
	case *Binary:
		if t.Op != '+' && t.Op != '-' {
			return n
		}
		x, y := stripOrder(t.X, terms), stripOrder(t.Y, terms)
		switch {
		case x == nil && y == nil:
			return nil
		case y == nil:
			return x
		case x == nil && t.Op == '-':
			return &Unary{At: t.At, X: y}
		case x == nil:
			return y
		}
		return &Binary{At: t.At, Op: t.Op, X: x, Y: y}
	}
	return n
}

// orderOf combines the O() terms: they must name one end; the lowest power
// wins.
func orderOf(terms []*BigO, text []rune) (*OrderTerm, error) {
	var out *OrderTerm
	for _, o := range terms {
		v, p, ok := monomial(o.Arg)
		if !ok {
			return nil, errAt(o.At, "O() takes a power of the expansion variable: O(eps^k) around q = 2, O(x^k) or O(1/q^k) around q = infinity")
		}
		t := &OrderTerm{Col: o.At, Text: sourceText(o, text)}
		switch v {
		case "eps":
			t.End, t.HasEnd, t.Power = conformal.AroundTwo, true, p
		case "x":
			t.End, t.HasEnd, t.Power = conformal.AroundInf, true, p
		case "q":
			t.End, t.HasEnd, t.Power = conformal.AroundInf, true, -p
		}
		if out == nil {
			out = t
			continue
		}
		if t.HasEnd && out.HasEnd && t.End != out.End {
			return nil, errAt(o.At, "%s is an order around q = %s, but %s at column %d is around q = %s", t.Text, t.End, out.Text, out.Col, out.End)
		}
		if t.HasEnd && !out.HasEnd {
			out.End, out.HasEnd = t.End, true
		}
		if t.Power < out.Power {
			out.Power, out.Text, out.Col = t.Power, t.Text, t.Col
		}
	}
	return out, nil
}

// sourceText returns "O(...)" as written: from the O to its closing
// parenthesis (the first ) that balances the O's own).
func sourceText(o *BigO, text []rune) string {
	start := o.At - 1
	depth := 0
	for i := start; i < len(text); i++ {
		switch text[i] {
		case '(':
			depth++
		case ')':
			depth--
			if depth == 0 {
				return string(text[start : i+1])
			}
		}
	}
	return string(text[start:])
}

// monomial reads c * v^p for a nonzero number c and one variable v ("" for
// a constant).
func monomial(n Node) (v string, p int, ok bool) {
	switch t := n.(type) {
	case *Number:
		return "", 0, t.Value.Sign() != 0
	case *Variable:
		return t.Name, 1, true
	case *Unary:
		return monomial(t.X)
	case *Binary:
		vx, px, okx := monomial(t.X)
		if !okx {
			return "", 0, false
		}
		if t.Op == '^' {
			k, ok := fold(t.Y)
			if !ok || !k.IsInt() || !k.Num().IsInt64() || abs(int(k.Num().Int64())) > maxFoldPower {
				return "", 0, false
			}
			return vx, px * int(k.Num().Int64()), true
		}
		vy, py, oky := monomial(t.Y)
		if !oky || vx != "" && vy != "" && vx != vy {
			return "", 0, false
		}
		if vx == "" {
			vx = vy
		}
		switch t.Op {
		case '*':
			return vx, px + py, true
		case '/':
			return vx, px - py, true
		}
	}
	return "", 0, false
}

// Plan is where and how far a claim is checked.
type Plan struct {
	// Ends are the ends to expand around.
	Ends []conformal.End
	// Order is the highest power of the expansion variable compared.
	Order int
	// Notes say how the ends and the order were chosen.
	Notes []string
}

// Plan decides the ends and the order: around (nil: from the claim) and
// order (negative: from the claim's O() term, else DefaultOrder). An order
// above the claim's O() term, or an end other than the one it names, is an
// *Error.
func (c *Claim) Plan(around *conformal.End, order int) (*Plan, error) {
	pl := &Plan{}
	o := c.Order
	switch {
	case o != nil && order >= 0:
		if order > o.Power-1 {
			return nil, errAt(o.Col, "--order %d conflicts with %s: the claim says nothing about order %d and above", order, o.Text, o.Power)
		}
		pl.Order = order
		if order < o.Power-1 {
			pl.Notes = append(pl.Notes, fmt.Sprintf("compared through order %d only (--order), below the claim's %s", order, o.Text))
		}
	case o != nil:
		pl.Order = o.Power - 1
	case order >= 0:
		pl.Order = order
		pl.Notes = append(pl.Notes, fmt.Sprintf("the claim has no O() term: compared through order %d (--order)", order))
	default:
		pl.Order = DefaultOrder
		pl.Notes = append(pl.Notes, fmt.Sprintf("the claim has no O() term: compared through order %d (the default; set another with --order)", DefaultOrder))
	}
	switch {
	case around != nil:
		if o != nil && o.HasEnd && o.End != *around {
			return nil, errAt(o.Col, "%s is an order around q = %s, but --around %s was asked for", o.Text, o.End, *around)
		}
		if q := c.withoutSeries(*around); q != nil {
			return nil, errAt(q.At, "%s", noSeriesMsg(q, *around))
		}
		pl.Ends = []conformal.End{*around}
	case o != nil && o.HasEnd:
		if q := c.withoutSeries(o.End); q != nil {
			return nil, errAt(q.At, "%s", noSeriesMsg(q, o.End))
		}
		pl.Ends = []conformal.End{o.End}
	case c.Variables["eps"] && !c.Variables["x"]:
		pl.Ends = []conformal.End{conformal.AroundTwo}
	case c.Variables["x"] && !c.Variables["eps"]:
		pl.Ends = []conformal.End{conformal.AroundInf}
	default:
		why := "names no expansion variable"
		if c.Variables["eps"] {
			why = "uses both eps and x"
		} else if c.Variables["q"] {
			why = "uses q only"
		}
		for _, e := range []conformal.End{conformal.AroundTwo, conformal.AroundInf} {
			if q := c.withoutSeries(e); q != nil {
				pl.Notes = append(pl.Notes, fmt.Sprintf("not checked around q = %s: %s", e, noSeriesMsg(q, e)))
				continue
			}
			pl.Ends = append(pl.Ends, e)
		}
		switch len(pl.Ends) {
		case 0:
			return nil, errAt(0, "the claim cannot be expanded around either end")
		case 1:
			pl.Notes = append(pl.Notes, fmt.Sprintf("the claim %s and no O() term names an end: checked around q = %s only", why, pl.Ends[0]))
		default:
			pl.Notes = append(pl.Notes, "the claim "+why+" and no O() term names an end: checked around both q = 2 and q = inf (choose one with --around)")
		}
	}
	return pl, nil
}

// withoutSeries returns the first quantity of the claim that has no power
// series around end (b around q = infinity), nil when there is none.
func (c *Claim) withoutSeries(end conformal.End) *Quantity {
	for _, q := range c.Quantities {
		if end == conformal.AroundInf && q.Provider.Quantity().Name == expansion.B {
			return q
		}
	}
	return nil
}

func noSeriesMsg(q *Quantity, end conformal.End) string {
	return fmt.Sprintf("%s is not a power series around q = %s (log b = x log x + x R(x), x = 1/q): check claims about b around q = 2", q.Text, end)
}
