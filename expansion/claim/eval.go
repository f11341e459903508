package claim

import (
	"errors"
	"fmt"
	"hash/fnv"
	"math"
	"math/big"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
	"qbridge/series/scalar"
)

// Evaluator expands claims. It keeps the quantities' series and values it
// has computed, so that the claims of one file share them.
type Evaluator struct {
	// Digits is the working precision in decimal digits, passed to the
	// quantities and used for the arithmetic of the claim.
	Digits int
	// ResumOrder is the series order of the resummations At uses for
	// quantities without an exact value (0: 16).
	ResumOrder int
	// Progress, when not nil, receives the progress of long computations.
	Progress func(frac float64, detail string)

	series map[seriesKey]*conformal.Coefficients
	values map[valueKey]*pointValue
	// dry replaces every quantity by the exact series 1 + t + t^2 + ...
	dry bool
}

type seriesKey struct {
	name string
	end  conformal.End
}

// NewEvaluator returns an evaluator working at digits decimal digits.
func NewEvaluator(digits int) *Evaluator {
	return &Evaluator{Digits: digits}
}

// prec is the working precision in bits: the digits plus 32 guard bits.
func (e *Evaluator) prec() uint {
	return uint(math.Ceil(float64(e.Digits)*math.Log2(10))) + 32
}

// quantitySeries returns the coefficients of q around end through t^n,
// computing them (or more) once.
func (e *Evaluator) quantitySeries(q *Quantity, end conformal.End, n int) (*Laurent, error) {
	prec := e.prec()
	if e.dry {
		// A generic series, one per quantity: c_k = 1 + 1/(k + 2 + i).
		h := fnv.New32a()
		h.Write([]byte(q.Name()))
		i := int64(h.Sum32() % 997)
		c := zeros(n+1, prec)
		for k, x := range c {
			x.SetRat(big.NewRat(int64(k)+3+i, int64(k)+2+i))
		}
		return exactLaurent(0, c, prec)
	}
	if e.series == nil {
		e.series = map[seriesKey]*conformal.Coefficients{}
	}
	key := seriesKey{q.Name(), end}
	c, ok := e.series[key]
	if !ok || len(c.Values) < n+1 {
		order := n
		if end == conformal.AroundInf && order < 2 {
			order = 2 // the 1/q expansions of E_0 and alpha_S start at order 2
		}
		r, err := q.Provider.Series(expansion.Request{N: q.N, End: end, Order: order, Digits: e.Digits, Progress: e.Progress})
		if err != nil {
			return nil, fmt.Errorf("%s around q = %s to order %d (as far as the claim needs): %w", q.Name(), end, order, err)
		}
		if len(r.Parts) == 0 || len(r.Parts[0].Values) == 0 {
			return nil, fmt.Errorf("%s around q = %s: no coefficients", q.Name(), end)
		}
		c = r.Parts[0]
		e.series[key] = c
	}
	m := min(len(c.Values), n+1)
	vals, errs := zeros(m, prec), zeros(m, prec)
	for k := range m {
		v, er := c.Values[k], c.Errors[k]
		if v == nil || v.IsInf() || er != nil && er.IsInf() {
			return nil, fmt.Errorf("%s around q = %s: coefficient %d is not available", q.Name(), end, k)
		}
		vals[k].Set(v)
		if er != nil {
			errs[k].Abs(er)
		}
		if errs[k].Sign() == 0 && v.Sign() != 0 && !q.Provider.Quantity().Exact {
			return nil, fmt.Errorf("%s around q = %s: coefficient %d has no error estimate, so it cannot be compared", q.Name(), end, k)
		}
	}
	vs, err := newSeries(prec, vals)
	if err != nil {
		return nil, err
	}
	es, err := newSeries(prec, errs)
	if err != nil {
		return nil, err
	}
	return &Laurent{Lo: 0, Val: vs, Err: es}, nil
}

// variable returns q, eps or x around end, known through t^hi.
func variable(name string, end conformal.End, hi int, prec uint) (*Laurent, error) {
	hi = max(hi, 1)
	n := hi + 1
	c := zeros(n, prec)
	lo := 0
	switch {
	case end == conformal.AroundTwo && name == "eps", end == conformal.AroundInf && name == "x":
		c[1].SetInt64(1)
	case end == conformal.AroundTwo && name == "q": // q = 2/(1 - eps)
		for k := range c {
			c[k].SetInt64(2)
		}
	case end == conformal.AroundTwo && name == "x": // x = (1 - eps)/2
		c[0].SetFloat64(0.5)
		c[1].SetFloat64(-0.5)
	case end == conformal.AroundInf && name == "eps": // eps = 1 - 2x
		c[0].SetInt64(1)
		c[1].SetInt64(-2)
	case end == conformal.AroundInf && name == "q": // q = 1/x
		lo = -1
		c = append(c, new(big.Float).SetPrec(prec))
		c[0].SetInt64(1)
	default:
		return nil, fmt.Errorf("unknown variable %q", name)
	}
	return exactLaurent(lo, c, prec)
}

// rational returns the number r, with the rounding error of its binary
// value (zero when exact).
func rational(r *big.Rat, hi int, prec uint) (*Laurent, error) {
	v := new(big.Float).SetPrec(prec).SetRat(r)
	var e *big.Float
	if v.Acc() != big.Exact {
		e = new(big.Float).Abs(v)
		e.Mul(e, roundBound(prec))
	}
	return constant(v, e, hi, prec)
}

// rounded returns a constant computed to prec bits, with its rounding bound.
func rounded(v *big.Float, hi int, prec uint) (*Laurent, error) {
	e := new(big.Float).Abs(v)
	e.Mul(e, roundBound(prec))
	return constant(v, e, hi, prec)
}

// expand evaluates a node around end with every input known through t^hi.
func (e *Evaluator) expand(n Node, end conformal.End, hi int) (*Laurent, error) {
	prec := e.prec()
	switch t := n.(type) {
	case *Number:
		return rational(t.Value, hi, prec)
	case *Variable:
		return variable(t.Name, end, hi, prec)
	case *Pi:
		return rounded(scalar.Pi(prec), hi, prec)
	case *Zeta:
		z, err := scalar.BigZeta(big.NewFloat(float64(t.N)), prec)
		if err != nil {
			return nil, errAt(t.At, "zeta(%d): %v", t.N, err)
		}
		return rounded(z, hi, prec)
	case *Quantity:
		if q := (&Claim{Quantities: []*Quantity{t}}).withoutSeries(end); q != nil {
			return nil, errAt(t.At, "%s", noSeriesMsg(t, end))
		}
		return e.quantitySeries(t, end, hi)
	case *HighTemp:
		return highTempSeries(t, end, hi, prec)
	case *Unary:
		x, err := e.expand(t.X, end, hi)
		if err != nil {
			return nil, err
		}
		return neg(x), nil
	case *Binary:
		return e.binary(t, end, hi)
	case *Call:
		x, err := e.expand(t.Arg, end, hi)
		if err != nil {
			return nil, err
		}
		out, err := apply(t.Func, x)
		return out, wrapAt(t.At, err)
	}
	return nil, errAt(n.Col(), "cannot evaluate %s", n)
}

func (e *Evaluator) binary(t *Binary, end conformal.End, hi int) (*Laurent, error) {
	x, err := e.expand(t.X, end, hi)
	if err != nil {
		return nil, err
	}
	if t.Op == '^' {
		if r, ok := fold(t.Y); ok {
			if r.IsInt() {
				if !r.Num().IsInt64() || abs(int(r.Num().Int64())) > maxIntPower {
					return nil, errAt(t.At, "integer powers are limited to |k| <= %d", maxIntPower)
				}
				out, err := intPow(x, int(r.Num().Int64()), hi)
				return out, wrapAt(t.At, err)
			}
			out, err := realPow(x, r)
			return out, wrapAt(t.At, err)
		}
	}
	y, err := e.expand(t.Y, end, hi)
	if err != nil {
		return nil, err
	}
	var out *Laurent
	switch t.Op {
	case '+', '-':
		out, err = add(x, y, t.Op == '-')
	case '*':
		out = mul(x, y)
	case '/':
		out, err = div(x, y)
	case '^': // a^b = exp(b log a) for an exponent that is not a number
		var l *Laurent
		if l, err = apply("log", x); err == nil {
			out, err = apply("exp", mul(y, l))
		}
		if err != nil {
			err = fmt.Errorf("power with a non-constant exponent, a^b = exp(b log a): %v", err)
		}
	}
	return out, wrapAt(t.At, err)
}

// wrapAt turns an arithmetic fault into an *Error at col; errShort and
// errors that already are *Error pass unchanged.
func wrapAt(col int, err error) error {
	var ce *Error
	var se *shortError
	if errors.As(err, &se) && se.col == 0 {
		se.col = col
	}
	if err == nil || errors.Is(err, errShort) || errors.As(err, &ce) {
		return err
	}
	return errAt(col, "%v", err)
}
