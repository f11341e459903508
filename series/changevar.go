package series

import (
	"qbridge/series/scalar"

	"fmt"
	"math/big"
)

// elemTaylorShift returns the coefficients of P(a + v) in v, where P has
// coefficients p, at prec bits (repeated synthetic division, n^2/2 steps).
// This is an exact polynomial identity; a large |a| amplifies rounding.
func elemTaylorShift(p []*big.Float, a *big.Float, prec uint) []*big.Float {
	n := len(p)
	q := elemCopyAt(p, n, prec)
	if a.Sign() == 0 {
		return q
	}
	t := new(big.Float).SetPrec(prec)
	for i := 0; i < n-1; i++ {
		for j := n - 2; j >= i; j-- {
			t.Mul(a, q[j+1])
			q[j].Add(q[j], t)
		}
	}
	return q
}

// Mobius returns the series in u of s(t) under the change of variable
// t = (a u + b)/(c u + d), with the length and precision of s. It needs
// d != 0 (t finite at u = 0) and a d - b c != 0 (a true change of variable).
//
// When b = 0 the map fixes 0 and the result is an identity between
// truncated series: Compose(s, a u/(c u + d)), every coefficient exact
// given those of s. When b != 0 the expansion point moves to t = b/d and the
// result is the exact re-expansion of the truncated polynomial of s there:
// it is only as good as that polynomial is at t = b/d, and the missing
// higher terms of s contribute to every coefficient.
func Mobius(s *Series, a, b, c, d *big.Float) (*Series, error) {
	if err := elemCheck("Mobius", s); err != nil {
		return nil, err
	}
	if a == nil || b == nil || c == nil || d == nil {
		return nil, fmt.Errorf("series: Mobius: nil coefficient")
	}
	if a.IsInf() || b.IsInf() || c.IsInf() || d.IsInf() {
		return nil, fmt.Errorf("series: Mobius: coefficients must be finite")
	}
	if d.Sign() == 0 {
		return nil, fmt.Errorf("series: Mobius: d = 0 puts a pole of t(u) at u = 0: %w", scalar.ErrDomain)
	}
	n := len(s.c)
	wp := elemWorkPrec(s.prec, n) + scalar.Guard
	det := new(big.Float).SetPrec(wp).Mul(a, d)
	det.Sub(det, new(big.Float).SetPrec(wp).Mul(b, c))
	if det.Sign() == 0 {
		return nil, fmt.Errorf("series: Mobius: a d - b c = 0, t(u) is constant: %w", scalar.ErrDomain)
	}
	p := elemCopyAt(s.c, n, wp)
	if b.Sign() != 0 {
		t0 := new(big.Float).SetPrec(wp).Quo(b, d)
		p = elemTaylorShift(p, t0, wp)
	}
	// t(u) - b/d = alpha u / (1 - r u) with alpha = (a d - b c)/d^2, r = -c/d.
	alpha := new(big.Float).SetPrec(wp).Quo(det, d)
	alpha.Quo(alpha, d)
	r := new(big.Float).SetPrec(wp).Quo(c, d)
	r.Neg(r)
	g := elemZeros(n, wp)
	if n > 1 {
		g[1].Set(alpha)
		for j := 2; j < n; j++ {
			g[j].Mul(g[j-1], r)
		}
	}
	return elemRound(elemComposeTrunc(p, g, n, wp), s.prec), nil
}

// Affine returns the series in u of s(t) with t = a + b u, with the length
// and precision of s. For a = 0 it is the exact rescaling s_k b^k; for
// a != 0 it is the Taylor shift of the truncated polynomial to t = a (see
// Mobius: only as good as the polynomial is at t = a).
func Affine(s *Series, a, b *big.Float) (*Series, error) {
	if err := elemCheck("Affine", s); err != nil {
		return nil, err
	}
	if a == nil || b == nil {
		return nil, fmt.Errorf("series: Affine: nil coefficient")
	}
	if a.IsInf() || b.IsInf() {
		return nil, fmt.Errorf("series: Affine: coefficients must be finite")
	}
	n := len(s.c)
	wp := elemWorkPrec(s.prec, n) + scalar.Guard
	q := elemTaylorShift(s.c, a, wp)
	pw := new(big.Float).SetPrec(wp).SetInt64(1)
	for k := 1; k < n; k++ {
		pw.Mul(pw, b)
		q[k].Mul(q[k], pw)
	}
	return elemRound(q, s.prec), nil
}
