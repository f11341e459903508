package series

import (
	"qbridge/series/scalar"

	"fmt"
	"math/big"
)

// The functions in this file map a series a(t) to the series of F(a(t)), with
// the length and precision of a, and share one signature:
//
//	func F(a *Series) (*Series, error)
//
// An error (wrapping ErrDomain) means a(0) lies outside the domain where F is
// analytic; Exp, Sin, Cos, SinCos and Atan fail only on a nil or empty
// series. Each result equals ComposeTaylor of F's Taylor coefficients at a(0)
// with a, but is computed in O(n^2) from the first-order differential
// equation F(a) satisfies ((e^a)' = a' e^a, a (log a)' = a', ...), matching
// coefficients of t^(k-1) (Knuth, TAOCP vol. 2, sec. 4.7; reference from
// memory). Work is carried out with guard bits and rounded once at the end;
// cancellation between coefficients of very different size can still cost
// accuracy, as in any floating-point series.

// elemScaledDeriv returns j*a[j] for j = 0..n-1 at prec bits (index 0 is 0):
// the coefficients that every recurrence below multiplies by.
func elemScaledDeriv(a []*big.Float, n int, prec uint) []*big.Float {
	d := elemZeros(n, prec)
	k := new(big.Float)
	for j := 1; j < n; j++ {
		k.SetInt64(int64(j))
		d[j].Mul(a[j], k)
	}
	return d
}

// Exp returns exp(a). From f' = a' f: k f_k = sum_{j=1..k} j a_j f_(k-j).
func Exp(a *Series) (*Series, error) {
	if err := elemCheck("Exp", a); err != nil {
		return nil, err
	}
	n := len(a.c)
	wp := elemWorkPrec(a.prec, n)
	da := elemScaledDeriv(a.c, n, wp)
	f := elemZeros(n, wp)
	e0, err := scalar.CheckedExp(a.c[0], wp)
	if err != nil {
		return nil, fmt.Errorf("series: Exp: %w", err)
	}
	f[0] = e0
	t := new(big.Float).SetPrec(wp)
	k := new(big.Float)
	for m := 1; m < n; m++ {
		acc := f[m]
		for j := 1; j <= m; j++ {
			if da[j].Sign() == 0 {
				continue
			}
			t.Mul(da[j], f[m-j])
			acc.Add(acc, t)
		}
		k.SetInt64(int64(m))
		acc.Quo(acc, k)
	}
	return elemRound(f, a.prec), nil
}

// Log returns log(a); a(0) must be positive. From a f' = a':
// a_0 k f_k = k a_k - sum_{j=1..k-1} (k-j) a_j f_(k-j).
func Log(a *Series) (*Series, error) {
	if err := elemCheck("Log", a); err != nil {
		return nil, err
	}
	if a.c[0].Sign() <= 0 {
		return nil, fmt.Errorf("series: Log: constant term %s is not positive: %w", a.c[0].Text('g', 10), scalar.ErrDomain)
	}
	n := len(a.c)
	wp := elemWorkPrec(a.prec, n)
	f := elemZeros(n, wp)
	l0, err := scalar.BigLog(a.c[0], wp)
	if err != nil {
		return nil, err
	}
	f[0] = l0
	df := elemZeros(n, wp) // df[i] = i f_i
	t := new(big.Float).SetPrec(wp)
	k := new(big.Float)
	for m := 1; m < n; m++ {
		acc := new(big.Float).SetPrec(wp).Set(a.c[m])
		k.SetInt64(int64(m))
		acc.Mul(acc, k)
		for j := 1; j < m; j++ {
			if a.c[j].Sign() == 0 {
				continue
			}
			t.Mul(a.c[j], df[m-j])
			acc.Sub(acc, t)
		}
		df[m].Quo(acc, a.c[0])
		f[m].Quo(df[m], k)
	}
	return elemRound(f, a.prec), nil
}

// Pow returns a^p for a real exponent p; a(0) must be positive (for an
// integer power of a series with a(0) <= 0 multiply with Mul instead).
// From a f' = p a' f (J. C. P. Miller's recurrence):
// a_0 k f_k = sum_{j=1..k} (p j - (k-j)) a_j f_(k-j).
func Pow(a *Series, p *big.Float) (*Series, error) {
	if err := elemCheck("Pow", a); err != nil {
		return nil, err
	}
	if p == nil || p.IsInf() {
		return nil, fmt.Errorf("series: Pow: exponent must be a finite number")
	}
	if a.c[0].Sign() <= 0 {
		return nil, fmt.Errorf("series: Pow: constant term %s is not positive: %w", a.c[0].Text('g', 10), scalar.ErrDomain)
	}
	n := len(a.c)
	wp := elemWorkPrec(a.prec, n)
	f := elemZeros(n, wp)
	f0, err := scalar.BigPow(a.c[0], p, wp)
	if err != nil {
		return nil, err
	}
	f[0] = f0
	t := new(big.Float).SetPrec(wp)
	w := new(big.Float).SetPrec(wp)
	kj := new(big.Float).SetPrec(wp)
	k := new(big.Float)
	for m := 1; m < n; m++ {
		acc := f[m]
		for j := 1; j <= m; j++ {
			if a.c[j].Sign() == 0 {
				continue
			}
			kj.SetInt64(int64(j))
			w.Mul(p, kj)
			kj.SetInt64(int64(m - j))
			w.Sub(w, kj)
			t.Mul(a.c[j], f[m-j])
			t.Mul(t, w)
			acc.Add(acc, t)
		}
		k.SetInt64(int64(m))
		acc.Quo(acc, k)
		acc.Quo(acc, a.c[0])
	}
	return elemRound(f, a.prec), nil
}

// Sqrt returns the square root of a with positive constant term; a(0) must
// be positive (a series with a(0) = 0 may or may not have a power-series
// root, so it is rejected). From f^2 = a:
// 2 f_0 f_k = a_k - sum_{j=1..k-1} f_j f_(k-j).
func Sqrt(a *Series) (*Series, error) {
	if err := elemCheck("Sqrt", a); err != nil {
		return nil, err
	}
	if a.c[0].Sign() <= 0 {
		return nil, fmt.Errorf("series: Sqrt: constant term %s is not positive: %w", a.c[0].Text('g', 10), scalar.ErrDomain)
	}
	n := len(a.c)
	wp := elemWorkPrec(a.prec, n)
	f := elemZeros(n, wp)
	f[0].Sqrt(new(big.Float).SetPrec(wp).Set(a.c[0]))
	twoF0 := new(big.Float).SetPrec(wp).Mul(f[0], big.NewFloat(2))
	t := new(big.Float).SetPrec(wp)
	for m := 1; m < n; m++ {
		acc := f[m]
		acc.Set(a.c[m])
		for j := 1; j < m; j++ {
			t.Mul(f[j], f[m-j])
			acc.Sub(acc, t)
		}
		acc.Quo(acc, twoF0)
	}
	return elemRound(f, a.prec), nil
}

// SinCos returns sin(a) and cos(a) together (they share one recurrence).
// From s' = a' c, c' = -a' s:
// k s_k = sum_{j=1..k} j a_j c_(k-j), k c_k = -sum_{j=1..k} j a_j s_(k-j).
func SinCos(a *Series) (sin, cos *Series, err error) {
	if err := elemCheck("SinCos", a); err != nil {
		return nil, nil, err
	}
	n := len(a.c)
	wp := elemWorkPrec(a.prec, n)
	s, c := elemSinCos(a.c, n, wp)
	return elemRound(s, a.prec), elemRound(c, a.prec), nil
}

func elemSinCos(a []*big.Float, n int, wp uint) (s, c []*big.Float) {
	da := elemScaledDeriv(a, n, wp)
	s = elemZeros(n, wp)
	c = elemZeros(n, wp)
	s[0], c[0] = scalar.BigSinCos(a[0], wp)
	t := new(big.Float).SetPrec(wp)
	k := new(big.Float)
	for m := 1; m < n; m++ {
		for j := 1; j <= m; j++ {
			if da[j].Sign() == 0 {
				continue
			}
			t.Mul(da[j], c[m-j])
			s[m].Add(s[m], t)
			t.Mul(da[j], s[m-j])
			c[m].Sub(c[m], t)
		}
		k.SetInt64(int64(m))
		s[m].Quo(s[m], k)
		c[m].Quo(c[m], k)
	}
	return s, c
}

// Sin returns sin(a). The error is non-nil only for a nil or empty series.
func Sin(a *Series) (*Series, error) {
	s, _, err := SinCos(a)
	return s, err
}

// Cos returns cos(a). The error is non-nil only for a nil or empty series.
func Cos(a *Series) (*Series, error) {
	_, c, err := SinCos(a)
	return c, err
}

// Tan returns tan(a). It returns an error wrapping ErrDomain when cos(a(0))
// is zero to within a few units in the last place of a's precision (a(0) is
// then a rounded odd multiple of pi/2, a pole of tan). From f' = a' (1 + f^2):
// k f_k = sum_{j=1..k} j a_j u_(k-j), u = 1 + f^2.
func Tan(a *Series) (*Series, error) {
	if err := elemCheck("Tan", a); err != nil {
		return nil, err
	}
	n := len(a.c)
	wp := elemWorkPrec(a.prec, n)
	s0, c0 := scalar.BigSinCos(a.c[0], wp)
	if c0.Sign() == 0 || c0.MantExp(nil) <= 2-int(a.prec) {
		return nil, fmt.Errorf("series: Tan: cos(a(0)) vanishes at a(0) = %s: %w", a.c[0].Text('g', 10), scalar.ErrDomain)
	}
	da := elemScaledDeriv(a.c, n, wp)
	f := elemZeros(n, wp)
	f[0].Quo(s0, c0)
	u := elemZeros(n, wp)
	t := new(big.Float).SetPrec(wp)
	k := new(big.Float)
	elemTanSquareTerm := func(m int) { // u_m = [m = 0] + sum_{i=0..m} f_i f_(m-i)
		if m == 0 {
			u[0].SetInt64(1)
		}
		for i := 0; i <= m; i++ {
			t.Mul(f[i], f[m-i])
			u[m].Add(u[m], t)
		}
	}
	elemTanSquareTerm(0)
	for m := 1; m < n; m++ {
		for j := 1; j <= m; j++ {
			if da[j].Sign() == 0 {
				continue
			}
			t.Mul(da[j], u[m-j])
			f[m].Add(f[m], t)
		}
		k.SetInt64(int64(m))
		f[m].Quo(f[m], k)
		elemTanSquareTerm(m)
	}
	return elemRound(f, a.prec), nil
}

// Atan returns atan(a), with atan(a(0)) in (-pi/2, pi/2). It is
// atan(a(0)) + integral of a'/(1 + a^2); the error is non-nil only for a nil
// or empty series.
func Atan(a *Series) (*Series, error) {
	if err := elemCheck("Atan", a); err != nil {
		return nil, err
	}
	n := len(a.c)
	wp := elemWorkPrec(a.prec, n)
	f := elemZeros(n, wp)
	f[0] = scalar.BigAtan(a.c[0], wp)
	if n == 1 {
		return elemRound(f, a.prec), nil
	}
	den := elemMulTrunc(a.c, a.c, n-1, wp)
	den[0].Add(den[0], big.NewFloat(1))
	da := elemScaledDeriv(a.c, n, wp)
	q := elemDivTrunc(da[1:], den, n-1, wp)
	k := new(big.Float)
	for m := 1; m < n; m++ {
		k.SetInt64(int64(m))
		f[m].Quo(q[m-1], k)
	}
	return elemRound(f, a.prec), nil
}
