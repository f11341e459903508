package series

import (
	"qbridge/series/scalar"

	"fmt"
	"math/big"
)

// elemComposeTrunc returns the first n coefficients of f(g(t)) at prec bits;
// g[0] is ignored (taken as zero). It runs Horner's rule
// f_0 + g (f_1 + g (f_2 + ...)) keeping, at the step that adds f_k, only the
// n-k coefficients that can still reach t^(n-1): about n^3/6 products.
func elemComposeTrunc(f, g []*big.Float, n int, prec uint) []*big.Float {
	nf := n
	if len(f) < nf {
		nf = len(f)
	}
	acc := elemZeros(1, prec)
	if nf > 0 {
		acc[0].Set(f[nf-1])
	}
	t := new(big.Float).SetPrec(prec)
	for k := nf - 2; k >= 0; k-- {
		m := n - k
		next := elemZeros(m, prec)
		next[0].Set(f[k])
		// next[j] = sum_{i>=1} g[i] acc[j-i]
		for i := 1; i < m && i < len(g); i++ {
			if g[i].Sign() == 0 {
				continue
			}
			for j := i; j < m && j-i < len(acc); j++ {
				if acc[j-i].Sign() == 0 {
					continue
				}
				t.Mul(g[i], acc[j-i])
				next[j].Add(next[j], t)
			}
		}
		acc = next
	}
	return elemCopyAt(acc, n, prec)
}

// Compose returns the series f(g(t)) = sum_k f_k g(t)^k. It needs g(0) = 0
// (otherwise every coefficient of f(g) would depend on all of f, which a
// truncated series does not know) and returns an error wrapping ErrDomain if
// not. The result has the shorter length and larger precision of f and g.
func Compose(f, g *Series) (*Series, error) {
	if err := elemCheck("Compose", f, g); err != nil {
		return nil, err
	}
	if g.c[0].Sign() != 0 {
		return nil, fmt.Errorf("series: Compose: inner series has nonzero constant term %s: %w",
			g.c[0].Text('g', 10), scalar.ErrDomain)
	}
	n := minLen(f, g)
	prec := maxPrec(f, g)
	wp := elemWorkPrec(prec, n)
	return elemRound(elemComposeTrunc(f.c, g.c, n, wp), prec), nil
}

// Revert returns the compositional inverse g of f: the series with g(0) = 0
// and f(g(t)) = g(f(t)) = t, of the length and precision of f. It needs
// f(0) = 0, f'(0) != 0 and at least two coefficients, and returns an error
// otherwise.
//
// It uses Lagrange inversion (e.g. Stanley, Enumerative Combinatorics 2,
// sec. 5.4; reference from memory): with h(t) = t/f(t), the coefficient of
// t^k in g is [t^(k-1)] h(t)^k / k. Cost: about n^3/2 multiplications.
func Revert(f *Series) (*Series, error) {
	if err := elemCheck("Revert", f); err != nil {
		return nil, err
	}
	n := len(f.c)
	if n < 2 {
		return nil, fmt.Errorf("series: Revert: need at least 2 coefficients to see f'(0), got %d", n)
	}
	if f.c[0].Sign() != 0 {
		return nil, fmt.Errorf("series: Revert: f(0) = %s is not zero: %w", f.c[0].Text('g', 10), scalar.ErrDomain)
	}
	if f.c[1].Sign() == 0 {
		return nil, fmt.Errorf("series: Revert: f'(0) = 0, f is not invertible as a power series: %w", scalar.ErrDomain)
	}
	wp := elemWorkPrec(f.prec, n) + scalar.Guard // powers of h can cancel
	one := []*big.Float{new(big.Float).SetPrec(wp).SetInt64(1)}
	h := elemDivTrunc(one, f.c[1:], n-1, wp) // t/f(t) = 1/(f_1 + f_2 t + ...)
	g := elemZeros(n, wp)
	pw := elemCopyAt(h, n-1, wp)
	k := new(big.Float)
	for m := 1; m < n; m++ {
		if m > 1 {
			pw = elemMulTrunc(pw, h, n-1, wp)
		}
		k.SetInt64(int64(m))
		g[m].Quo(pw[m-1], k)
	}
	return elemRound(g, f.prec), nil
}
