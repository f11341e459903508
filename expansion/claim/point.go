package claim

import (
	"errors"
	"fmt"
	"math/big"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
	"qbridge/series/scalar"
)

// PointValue is a claim evaluated at one finite q: both sides with their
// errors and their difference. O() terms are left out, so the difference is
// the size of what the truncation drops at that q.
type PointValue struct {
	// Q is the point.
	Q *big.Float
	// LHS and RHS are the two sides, LHSErr and RHSErr their error bounds.
	LHS, LHSErr, RHS, RHSErr *big.Float
	// Diff is LHS - RHS; DiffErr the sum of the two error bounds.
	Diff, DiffErr *big.Float
	// Notes say how each quantity was evaluated at Q.
	Notes []string
}

type valueKey struct {
	name string
	q    string
}

// pointValue is a value with an absolute error bound (and, for a
// quantity, how it was obtained).
type pointValue struct {
	v, e   *big.Float
	method string
}

// defaultResumOrder is the series order At resums at when ResumOrder is 0.
const defaultResumOrder = 16

// At evaluates both sides of c at the finite point q >= 2: exact values of
// h_n, b and S_0 (expansion.ExactProvider), the two-point Pade resummation
// (expansion.MethodTwoPoint, with its error) of the others.
func (e *Evaluator) At(c *Claim, q *big.Float) (*PointValue, error) {
	if q == nil || q.IsInf() || q.Cmp(big.NewFloat(2)) < 0 {
		return nil, errAt(0, "claims are evaluated at finite q >= 2")
	}
	prec := e.prec()
	q = new(big.Float).SetPrec(prec).Set(q)
	var notes []string
	seen := map[string]bool{}
	eval := func(n Node) (*pointValue, error) {
		return e.value(n, q, func(name, text string) {
			if !seen[name] {
				seen[name] = true
				notes = append(notes, text)
			}
		})
	}
	l, err := eval(c.LHS)
	if err != nil {
		return nil, err
	}
	r, err := eval(c.RHS)
	if err != nil {
		return nil, err
	}
	d := new(big.Float).SetPrec(prec).Sub(l.v, r.v)
	de := new(big.Float).SetPrec(prec).Add(l.e, r.e)
	return &PointValue{Q: q, LHS: l.v, LHSErr: l.e, RHS: r.v, RHSErr: r.e, Diff: d, DiffErr: de, Notes: notes}, nil
}

// quantityAt returns a quantity at q, computed once per evaluator.
func (e *Evaluator) quantityAt(t *Quantity, q *big.Float) (*pointValue, error) {
	if e.values == nil {
		e.values = map[valueKey]*pointValue{}
	}
	key := valueKey{t.Name(), q.Text('g', 40)}
	if v, ok := e.values[key]; ok {
		return v, nil
	}
	qp := conformal.QPoint{Q: q}
	var out *pointValue
	if ep, ok := t.Provider.(expansion.ExactProvider); ok && t.Provider.Quantity().Exact {
		v, err := ep.Exact(qp, expansion.Request{N: t.N, Digits: e.Digits, Progress: e.Progress})
		if err != nil {
			return nil, fmt.Errorf("%s at q = %s: %w", t.Name(), qp, err)
		}
		out = &pointValue{v: v.Value, e: new(big.Float).Abs(v.Err), method: "exact: " + v.Method}
	} else {
		order := e.ResumOrder
		if order == 0 {
			order = defaultResumOrder
		}
		r, err := t.Provider.Resum(qp, expansion.Request{N: t.N, Order: order, Digits: e.Digits, Progress: e.Progress})
		if err != nil {
			return nil, fmt.Errorf("%s at q = %s: %w", t.Name(), qp, err)
		}
		for _, est := range r.Estimates {
			if est.Method != expansion.MethodTwoPoint {
				continue
			}
			if est.Value == nil || est.Err == nil {
				return nil, fmt.Errorf("%s at q = %s: the %s has no value with an error (%s)", t.Name(), qp, expansion.MethodTwoPoint, est.Detail)
			}
			out = &pointValue{v: est.Value, e: new(big.Float).Abs(est.Err), method: expansion.MethodTwoPoint + " of the series at both ends: " + est.Detail}
		}
		if out == nil {
			return nil, fmt.Errorf("%s at q = %s: no %s among the resummations", t.Name(), qp, expansion.MethodTwoPoint)
		}
	}
	e.values[key] = out
	return out, nil
}

// value evaluates a node at q with first-order error propagation.
func (e *Evaluator) value(n Node, q *big.Float, note func(name, text string)) (*pointValue, error) {
	prec := e.prec()
	exact := func(v *big.Float) *pointValue { return &pointValue{v: v, e: new(big.Float).SetPrec(prec)} }
	switch t := n.(type) {
	case *Number:
		v := new(big.Float).SetPrec(prec).SetRat(t.Value)
		return roundOff(v, v.Acc() != big.Exact), nil
	case *Pi:
		return roundOff(scalar.Pi(prec), true), nil
	case *Zeta:
		z, err := scalar.BigZeta(big.NewFloat(float64(t.N)), prec)
		if err != nil {
			return nil, errAt(t.At, "zeta(%d): %v", t.N, err)
		}
		return roundOff(z, true), nil
	case *Variable:
		one := new(big.Float).SetPrec(prec).SetInt64(1)
		switch t.Name {
		case "q":
			return exact(q), nil
		case "x":
			return roundOff(one.Quo(one, q), true), nil
		}
		x := new(big.Float).SetPrec(prec).Quo(big.NewFloat(2), q)
		return roundOff(one.Sub(one, x), true), nil
	case *HighTemp:
		v, err := highTempAt(t, q, prec)
		if err != nil {
			return nil, err
		}
		note(t.Text, fmt.Sprintf("%s at q = %s: %s", t.Text, q.Text('g', 10), v.method))
		return v, nil
	case *Quantity:
		v, err := e.quantityAt(t, q)
		if err != nil {
			return nil, err
		}
		note(t.Name(), fmt.Sprintf("%s at q = %s: %s", t.Name(), q.Text('g', 10), v.method))
		return v, nil
	case *Unary:
		x, err := e.value(t.X, q, note)
		if err != nil {
			return nil, err
		}
		return &pointValue{v: new(big.Float).Neg(x.v), e: x.e}, nil
	case *Binary:
		x, err := e.value(t.X, q, note)
		if err != nil {
			return nil, err
		}
		if t.Op == '^' {
			if r, ok := fold(t.Y); ok {
				out, err := x.pow(r, prec)
				return out, wrapAt(t.At, err)
			}
		}
		y, err := e.value(t.Y, q, note)
		if err != nil {
			return nil, err
		}
		var out *pointValue
		switch t.Op {
		case '+':
			out = x.add(y, false, prec)
		case '-':
			out = x.add(y, true, prec)
		case '*':
			out = x.mul(y, prec)
		case '/':
			out, err = x.div(y, prec)
		case '^':
			var l *pointValue
			if l, err = x.apply("log", prec); err == nil {
				out, err = l.mul(y, prec).apply("exp", prec)
			}
		}
		return out, wrapAt(t.At, err)
	case *Call:
		x, err := e.value(t.Arg, q, note)
		if err != nil {
			return nil, err
		}
		out, err := x.apply(t.Func, prec)
		return out, wrapAt(t.At, err)
	}
	return nil, errAt(n.Col(), "cannot evaluate %s", n)
}

// roundOff returns v with the rounding bound of its last bit when rounded.
func roundOff(v *big.Float, rounded bool) *pointValue {
	e := new(big.Float).SetPrec(v.Prec())
	if rounded {
		e.Abs(v).Mul(e, roundBound(v.Prec()))
	}
	return &pointValue{v: v, e: e}
}

// withRounding adds the rounding bound of |v| to e.
func withRounding(v, e *big.Float) *pointValue {
	r := new(big.Float).Abs(v)
	r.Mul(r, roundBound(v.Prec()))
	return &pointValue{v: v, e: r.Add(r, e)}
}

func (a *pointValue) add(b *pointValue, sub bool, prec uint) *pointValue {
	v := new(big.Float).SetPrec(prec)
	if sub {
		v.Sub(a.v, b.v)
	} else {
		v.Add(a.v, b.v)
	}
	return withRounding(v, new(big.Float).Add(a.e, b.e))
}

func (a *pointValue) mul(b *pointValue, prec uint) *pointValue {
	v := new(big.Float).SetPrec(prec).Mul(a.v, b.v)
	e := new(big.Float).SetPrec(prec).Mul(new(big.Float).Abs(a.v), b.e)
	e.Add(e, new(big.Float).Mul(a.e, new(big.Float).Abs(b.v)))
	e.Add(e, new(big.Float).Mul(a.e, b.e))
	return withRounding(v, e)
}

// distinct reports |v| > 3 e.
func (a *pointValue) distinct() bool {
	t := new(big.Float).Mul(a.e, big.NewFloat(3))
	return new(big.Float).Abs(a.v).Cmp(t) > 0
}

func (a *pointValue) div(b *pointValue, prec uint) (*pointValue, error) {
	if !b.distinct() {
		return nil, fmt.Errorf("division by %s +- %s, zero within its error", b.v.Text('g', 6), b.e.Text('g', 2))
	}
	v := new(big.Float).SetPrec(prec).Quo(a.v, b.v)
	e := new(big.Float).SetPrec(prec).Mul(new(big.Float).Abs(v), b.e)
	e.Add(e, a.e)
	e.Quo(e, new(big.Float).Abs(b.v))
	return withRounding(v, e), nil
}

// pow returns a^r for a rational r: repeated products for an integer, else
// a^r for a > 0.
func (a *pointValue) pow(r *big.Rat, prec uint) (*pointValue, error) {
	if r.IsInt() {
		if !r.Num().IsInt64() || abs(int(r.Num().Int64())) > maxIntPower {
			return nil, fmt.Errorf("integer powers are limited to |k| <= %d", maxIntPower)
		}
		k := int(r.Num().Int64())
		out := &pointValue{v: new(big.Float).SetPrec(prec).SetInt64(1), e: new(big.Float).SetPrec(prec)}
		for range abs(k) {
			out = out.mul(a, prec)
		}
		if k < 0 {
			one := &pointValue{v: new(big.Float).SetPrec(prec).SetInt64(1), e: new(big.Float).SetPrec(prec)}
			return one.div(out, prec)
		}
		return out, nil
	}
	if a.v.Sign() <= 0 || !a.distinct() {
		return nil, fmt.Errorf("power %s of %s +- %s: the base must be positive", r.RatString(), a.v.Text('g', 6), a.e.Text('g', 2))
	}
	p := new(big.Float).SetPrec(prec).SetRat(r)
	v, err := scalar.BigPow(a.v, p, prec)
	if err != nil {
		return nil, err
	}
	e := new(big.Float).SetPrec(prec).Mul(v, p)
	e.Quo(e, a.v)
	e.Abs(e).Mul(e, a.e)
	return withRounding(v, e), nil
}

// apply evaluates a function with error |F'(a)| da.
func (a *pointValue) apply(name string, prec uint) (*pointValue, error) {
	var v, d *big.Float
	var err error
	switch name {
	case "sqrt":
		return a.pow(big.NewRat(1, 2), prec)
	case "exp":
		v = scalar.BigExp(a.v, prec)
		d = v
	case "log":
		if a.v.Sign() <= 0 || !a.distinct() {
			return nil, fmt.Errorf("log of %s +- %s, which is not positive", a.v.Text('g', 6), a.e.Text('g', 2))
		}
		if v, err = scalar.BigLog(a.v, prec); err == nil {
			d = new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), a.v)
		}
	case "sin", "cos", "tan":
		s, c := scalar.BigSinCos(a.v, prec)
		switch name {
		case "sin":
			v, d = s, c
		case "cos":
			v, d = c, s
		default:
			if c.Sign() == 0 {
				return nil, errors.New("tan at a pole")
			}
			v = new(big.Float).SetPrec(prec).Quo(s, c)
			d = new(big.Float).SetPrec(prec).Mul(v, v)
			d.Add(d, big.NewFloat(1))
		}
	case "Gamma":
		if v, err = scalar.BigGamma(a.v, prec); err == nil {
			var psi *big.Float
			if psi, err = scalar.BigDigamma(a.v, prec); err == nil {
				d = new(big.Float).SetPrec(prec).Mul(v, psi)
			}
		}
	case "psi":
		if v, err = scalar.BigDigamma(a.v, prec); err == nil {
			d, err = scalar.BigPolygamma(1, a.v, prec)
		}
	default:
		return nil, fmt.Errorf("unknown function %q", name)
	}
	if err != nil {
		return nil, fmt.Errorf("%s(%s): %v", name, a.v.Text('g', 10), err)
	}
	e := new(big.Float).SetPrec(prec).Abs(d)
	return withRounding(v, e.Mul(e, a.e)), nil
}
