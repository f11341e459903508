package dd

import (
	"math"
	"math/big"
)

// Float is the double-double number Hi + Lo, normalised so that
// Hi = fl(Hi + Lo).
type Float struct{ Hi, Lo float64 }

// New returns x as a Float.
func New(x float64) Float { return Float{x, 0} }

// FromBig returns the Float nearest x (to about 2^-106 relative).
func FromBig(x *big.Float) Float {
	hi, _ := x.Float64()
	if math.IsInf(hi, 0) || hi == 0 {
		return Float{hi, 0}
	}
	r := new(big.Float).SetPrec(x.Prec()+64).Sub(x, big.NewFloat(hi))
	lo, _ := r.Float64()
	return quickTwoSum(hi, lo)
}

// Big returns a as a big.Float of precision prec (exact for prec >= 107
// unless the two parts are far apart in exponent).
func (a Float) Big(prec uint) *big.Float {
	x := new(big.Float).SetPrec(prec).SetFloat64(a.Hi)
	return x.Add(x, new(big.Float).SetPrec(prec).SetFloat64(a.Lo))
}

// Float64 returns a rounded to float64.
func (a Float) Float64() float64 { return a.Hi + a.Lo }

// twoSum returns s = fl(a+b) and the exact error e = a + b - s.
func twoSum(a, b float64) (s, e float64) {
	s = a + b
	bb := s - a
	e = (a - (s - bb)) + (b - bb)
	return
}

// quickTwoSum is twoSum for |a| >= |b|.
func quickTwoSum(a, b float64) Float {
	s := a + b
	return Float{s, b - (s - a)}
}

// twoProd returns p = fl(a b) and the exact error a b - p.
func twoProd(a, b float64) (p, e float64) {
	p = a * b
	return p, math.FMA(a, b, -p)
}

// Add returns a + b (the accurate sum: relative error about 2^-106 even
// under cancellation).
func (a Float) Add(b Float) Float {
	s, e := twoSum(a.Hi, b.Hi)
	t, f := twoSum(a.Lo, b.Lo)
	e += t
	r := quickTwoSum(s, e)
	return quickTwoSum(r.Hi, r.Lo+f)
}

// AddFloat returns a + b.
func (a Float) AddFloat(b float64) Float {
	s, e := twoSum(a.Hi, b)
	return quickTwoSum(s, e+a.Lo)
}

// Neg returns -a.
func (a Float) Neg() Float { return Float{-a.Hi, -a.Lo} }

// Sub returns a - b.
func (a Float) Sub(b Float) Float { return a.Add(b.Neg()) }

// Mul returns a b.
func (a Float) Mul(b Float) Float {
	p, e := twoProd(a.Hi, b.Hi)
	e += a.Hi*b.Lo + a.Lo*b.Hi
	return quickTwoSum(p, e)
}

// MulFloat returns a b.
func (a Float) MulFloat(b float64) Float {
	p, e := twoProd(a.Hi, b)
	return quickTwoSum(p, e+a.Lo*b)
}

// Ldexp returns a 2^k (exact barring underflow).
func (a Float) Ldexp(k int) Float { return Float{math.Ldexp(a.Hi, k), math.Ldexp(a.Lo, k)} }

// Div returns a/b by three steps of long division.
func (a Float) Div(b Float) Float {
	q1 := a.Hi / b.Hi
	r := a.Sub(b.MulFloat(q1))
	q2 := r.Hi / b.Hi
	r = r.Sub(b.MulFloat(q2))
	q3 := r.Hi / b.Hi
	q := quickTwoSum(q1, q2)
	return q.AddFloat(q3)
}

// DivFloat returns a/b.
func (a Float) DivFloat(b float64) Float {
	q1 := a.Hi / b
	p, e := twoProd(q1, b)
	r := a.Sub(Float{p, e})
	return quickTwoSum(q1, r.Hi/b)
}

// Inv returns 1/a.
func (a Float) Inv() Float { return New(1).Div(a) }

// Sqrt returns the square root of a >= 0 (one Newton step from float64).
func (a Float) Sqrt() Float {
	if a.Hi <= 0 {
		return Float{math.Sqrt(a.Hi), 0}
	}
	x := math.Sqrt(a.Hi)
	// x + (a - x^2)/(2x)
	p, e := twoProd(x, x)
	r := a.Sub(Float{p, e})
	return quickTwoSum(x, r.Hi/(2*x))
}

// Abs returns |a|.
func (a Float) Abs() Float {
	if a.Hi < 0 {
		return a.Neg()
	}
	return a
}
