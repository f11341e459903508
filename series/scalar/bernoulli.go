package scalar

import (
	"fmt"
	"math/big"
	"sync"
)

// bernoulliCache holds the even Bernoulli numbers B_2, B_4, ..., computed
// together from the tangent numbers and extended on demand.
var bernoulliCache = struct {
	sync.Mutex
	even []*big.Rat // even[k-1] = B_{2k}
}{}

// bernoulliEven returns B_2, B_4, ..., B_{2m} (shared, read-only).
//
// The tangent numbers T_k (tan x = sum T_k x^(2k-1)/(2k-1)!) come from the
// integer recurrence of Brent and Harvey, "Fast computation of Bernoulli,
// Tangent and Secant numbers" (2011), Algorithm TangentNumbers, and then
// B_{2k} = (-1)^(k-1) 2k T_k / (4^k (4^k - 1)). Integer arithmetic only, so
// hundreds of Bernoulli numbers cost milliseconds.
func bernoulliEven(m int) []*big.Rat {
	bernoulliCache.Lock()
	defer bernoulliCache.Unlock()
	if len(bernoulliCache.even) >= m {
		return bernoulliCache.even[:m]
	}
	n := m
	if c := 2 * len(bernoulliCache.even); c > n {
		n = c
	}
	t := make([]*big.Int, n+1)
	t[1] = big.NewInt(1)
	for k := 2; k <= n; k++ {
		t[k] = new(big.Int).Mul(t[k-1], big.NewInt(int64(k-1)))
	}
	u := new(big.Int)
	for k := 2; k <= n; k++ {
		for j := k; j <= n; j++ {
			u.Mul(t[j-1], big.NewInt(int64(j-k)))
			t[j].Mul(t[j], big.NewInt(int64(j-k+2)))
			t[j].Add(t[j], u)
		}
	}
	even := make([]*big.Rat, n)
	for k := 1; k <= n; k++ {
		num := new(big.Int).Mul(t[k], big.NewInt(int64(2*k)))
		if k%2 == 0 {
			num.Neg(num)
		}
		four := new(big.Int).Lsh(big.NewInt(1), uint(2*k))
		den := new(big.Int).Sub(four, big.NewInt(1))
		den.Mul(den, four)
		even[k-1] = new(big.Rat).SetFrac(num, den)
	}
	bernoulliCache.even = even
	return even[:m]
}

// maxBernoulliIndex bounds the index accepted by Bernoulli, to keep a
// mistaken call from running for hours.
const maxBernoulliIndex = 100000

// Bernoulli returns the Bernoulli number B_n exactly, with the convention
// B_1 = -1/2 (DLMF 24.2.1). Results are cached; the even ones are computed in
// batches. It returns an error for n < 0 or n > 100000.
func Bernoulli(n int) (*big.Rat, error) {
	switch {
	case n < 0 || n > maxBernoulliIndex:
		return nil, fmt.Errorf("series: Bernoulli index %d outside [0, %d]", n, maxBernoulliIndex)
	case n == 0:
		return big.NewRat(1, 1), nil
	case n == 1:
		return big.NewRat(-1, 2), nil
	case n%2 == 1:
		return new(big.Rat), nil
	}
	b := bernoulliEven(n / 2)
	return new(big.Rat).Set(b[n/2-1]), nil
}

// bernoulliFloatCache holds B_{2k} as floats at the highest precision
// asked for so far; lower precisions are rounded from it.
var bernoulliFloatCache = struct {
	sync.Mutex
	prec uint
	v    []*big.Float
}{}

// bernoulliEvenFloat returns B_2, ..., B_{2m} rounded to at least prec bits
// (shared, read-only: callers must not modify the values).
func bernoulliEvenFloat(m int, prec uint) []*big.Float {
	bernoulliFloatCache.Lock()
	defer bernoulliFloatCache.Unlock()
	c := &bernoulliFloatCache
	if c.prec >= prec && len(c.v) >= m {
		return c.v[:m]
	}
	if c.prec < prec {
		c.prec, c.v = prec, nil
	}
	rats := bernoulliEven(m)
	for k := len(c.v); k < m; k++ {
		c.v = append(c.v, new(big.Float).SetPrec(c.prec).SetRat(rats[k]))
	}
	return c.v[:m]
}
