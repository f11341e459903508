package numeric

import (
	"math"
	"math/big"
	"testing"

	"qbridge/numeric/dd"
)

// The double-double series operations against exact rational series:
// exp(t) = sum t^k/k!, log(1+t) = sum (-1)^(k+1) t^k/k (DLMF 4.2.19, 4.6.1),
// 1/(1 - t/3) = sum 3^-k t^k, and the product of the last two against its
// exact Cauchy product; each coefficient within 1e-30 of its size (or
// absolutely, for the rational coefficients below one).
func TestDDSeriesExact(t *testing.T) {
	const n = 25
	ratDD := func(r *big.Rat) dd.Float { return dd.FromBig(new(big.Float).SetPrec(200).SetRat(r)) }
	check := func(name string, got []dd.Float, want func(k int) *big.Rat) {
		for k := range got {
			w := want(k)
			d := got[k].Sub(ratDD(w)).Float64()
			wf, _ := w.Float64()
			if math.Abs(d) > 1e-30*math.Max(math.Abs(wf), 1e-20) {
				t.Errorf("%s: coefficient %d off by %.3g (value %.3g)", name, k, d, wf)
			}
		}
	}
	mk := func() []dd.Float { return make([]dd.Float, n) }
	a := mk()
	a[1] = dd.New(1)
	e := mk()
	ddExpInto(e, a)
	check("exp", e, func(k int) *big.Rat {
		return new(big.Rat).SetFrac(big.NewInt(1), new(big.Int).MulRange(1, int64(max(k, 1))))
	})
	a[0] = dd.New(1)
	l := mk()
	ddLogInto(l, a)
	check("log", l, func(k int) *big.Rat {
		if k == 0 {
			return new(big.Rat)
		}
		r := big.NewRat(1, int64(k))
		if k%2 == 0 {
			r.Neg(r)
		}
		return r
	})
	b := mk()
	b[0], b[1] = dd.New(1), dd.New(-1).DivFloat(3)
	inv := mk()
	ddInvInto(inv, b)
	pow3 := func(k int) *big.Rat {
		return new(big.Rat).SetFrac(big.NewInt(1), new(big.Int).Exp(big.NewInt(3), big.NewInt(int64(k)), nil))
	}
	check("inv", inv, pow3)
	p := mk()
	ddMulInto(p, l, inv)
	check("mul", p, func(k int) *big.Rat {
		s := new(big.Rat)
		for j := 1; j <= k; j++ {
			lj := big.NewRat(1, int64(j))
			if j%2 == 0 {
				lj.Neg(lj)
			}
			s.Add(s, lj.Mul(lj, pow3(k-j)))
		}
		return s
	})
}
