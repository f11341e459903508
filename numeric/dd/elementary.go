package dd

import "math"

// Exp returns e^a (relative error about 1e-31 for results above 1e-290,
// where the low part of a double-double is still a normal number): a = k ln 2 + r, e^r from its Taylor series at
// r/2^10 and ten squarings of 1 + s kept as s (s <- 2s + s^2, so the 1 never
// swamps the small part), then the exact scaling by 2^k.
func Exp(a Float) Float {
	switch {
	case a.Hi > 709.78:
		return Float{math.Inf(1), 0}
	case a.Hi < -745.2:
		return Float{}
	case math.IsNaN(a.Hi):
		return a
	}
	k := math.Round(a.Hi / Ln2.Hi)
	// k ln 2 in three exact products' worth of precision.
	p1, e1 := twoProd(k, Ln2.Hi)
	p2, e2 := twoProd(k, Ln2.Lo)
	r := a.Sub(Float{p1, e1}).Sub(Float{p2, e2}).AddFloat(-k * ln2Tail)
	return expm1Small(r).AddFloat(1).Ldexp(int(k))
}

// expm1Small returns e^r - 1 for |r| <= 0.5: the Taylor series at r/2^10
// (10 terms: below 1e-38 there) and ten squarings of 1 + s kept as s,
// s <- 2s + s^2.
func expm1Small(r Float) Float {
	r = r.Ldexp(-10)
	s := r
	t := r
	for n := 2; n <= 10; n++ {
		t = t.Mul(r).DivFloat(float64(n))
		s = s.Add(t)
	}
	for i := 0; i < 10; i++ {
		s = s.MulFloat(2).Add(s.Mul(s))
	}
	return s
}

// Expm1 returns e^a - 1 without the cancellation of Exp(a) - 1 for small a.
func Expm1(a Float) Float {
	if math.Abs(a.Hi) > 0.5 {
		return Exp(a).AddFloat(-1)
	}
	return expm1Small(a)
}

// Log returns the natural logarithm of a > 0 (NaN for a < 0, -Inf for 0):
// one Newton step y + a e^{-y} - 1 from the float64 logarithm doubles its
// 53 bits.
func Log(a Float) Float {
	switch {
	case a.Hi < 0 || math.IsNaN(a.Hi):
		return Float{math.NaN(), 0}
	case a.Hi == 0:
		return Float{math.Inf(-1), 0}
	case math.IsInf(a.Hi, 1):
		return a
	}
	y := New(math.Log(a.Hi))
	return y.Add(a.Mul(Exp(y.Neg())).AddFloat(-1))
}

// SinCos returns sin a and cos a: a = n pi/2 + r with |r| <= pi/4, then
// the Taylor series of sin r and cos r (to r^31 and r^30: below 1e-33 of
// their size) and the quadrant's rotation. The reduction is accurate for
// |a| up to about 1e12 (beyond that the error of n pi/2 exceeds the result's
// last bit and sin and cos lose accuracy).
func SinCos(a Float) (sin, cos Float) {
	if math.IsNaN(a.Hi) || math.IsInf(a.Hi, 0) {
		return Float{math.NaN(), 0}, Float{math.NaN(), 0}
	}
	halfPi := Pi.Ldexp(-1)
	n := math.Round(a.Hi / halfPi.Hi)
	r := a.Sub(halfPi.MulFloat(n))
	r2 := r.Mul(r)
	s, c := r, New(1)
	ts, tc := r, New(1)
	for j := 1; j <= 15; j++ {
		ts = ts.Mul(r2).DivFloat(float64(-(2 * j) * (2*j + 1)))
		tc = tc.Mul(r2).DivFloat(float64(-(2*j - 1) * (2 * j)))
		s = s.Add(ts)
		c = c.Add(tc)
	}
	switch q := int64(n) & 3; q {
	case 0:
		return s, c
	case 1:
		return c, s.Neg()
	case 2:
		return s.Neg(), c.Neg()
	default:
		return c.Neg(), s
	}
}

// SinhCosh returns sinh a and cosh a (sinh from Expm1, so it keeps its
// relative accuracy for small a).
func SinhCosh(a Float) (sinh, cosh Float) {
	if math.Abs(a.Hi) < 0.5 {
		m := Expm1(a)
		// sinh = (m + m/(1+m))/2, cosh = 1 + m^2/(2(1+m))
		q := m.Div(m.AddFloat(1))
		return m.Add(q).Ldexp(-1), m.Mul(q).Ldexp(-1).AddFloat(1)
	}
	e := Exp(a)
	ie := e.Inv()
	return e.Sub(ie).Ldexp(-1), e.Add(ie).Ldexp(-1)
}

// Atan2 returns the angle of (x, y) in (-pi, pi]: the float64 angle and one
// Newton-like correction tan(phi - theta0) ~ phi - theta0, whose error is
// the cube of the float64 one.
func Atan2(y, x Float) Float {
	t0 := math.Atan2(y.Hi, x.Hi)
	th := New(t0)
	s, c := SinCos(th)
	num := y.Mul(c).Sub(x.Mul(s))
	den := x.Mul(c).Add(y.Mul(s))
	return th.Add(num.Div(den))
}
