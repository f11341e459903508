package series

import (
	"fmt"
	"math/big"
)

// ComposeTaylor returns sum_k taylor[k] (s - s(0))^k: the series of f(s(t))
// given the Taylor coefficients taylor[k] = f^(k)(s(0))/k! of f at s(0).
// This is the single mechanism behind every "function of a series" in this
// package. The result has the length and precision of s; taylor must have at
// least s.Len() entries.
func ComposeTaylor(taylor []*big.Float, s *Series) (*Series, error) {
	if s == nil || len(s.c) == 0 || s.prec == 0 {
		return nil, fmt.Errorf("series: ComposeTaylor of a nil or empty series")
	}
	n := len(s.c)
	if len(taylor) < n {
		return nil, fmt.Errorf("series: ComposeTaylor needs %d Taylor coefficients, got %d", n, len(taylor))
	}
	for k, c := range taylor[:n] {
		if c == nil || c.IsInf() {
			return nil, fmt.Errorf("series: ComposeTaylor: Taylor coefficient %d is nil or infinite", k)
		}
	}
	prec := s.prec
	out := newZero(n, prec)
	out.c[0].Set(taylor[0])
	if n == 1 {
		return out, nil
	}
	// Fast path: s = s0 + c1 t exactly (the usual case of a shifted variable).
	linear := true
	for k := 2; k < n; k++ {
		if s.c[k].Sign() != 0 {
			linear = false
			break
		}
	}
	if linear {
		pw := new(big.Float).SetPrec(prec).SetInt64(1)
		for k := 1; k < n; k++ {
			pw.Mul(pw, s.c[1])
			out.c[k].Mul(taylor[k], pw)
		}
		return out, nil
	}
	// Horner in u = s - s(0): (((a_{n-1} u + a_{n-2}) u + ...) u + a_0.
	// After the step that adds a_k the accumulator is still to be multiplied
	// by u^k, which has valuation k, so only its first n-k coefficients can
	// reach the result: the accumulator grows by one coefficient per step,
	// and the composition costs about n^3/6 products instead of n^3/2.
	u := s.c
	// two buffers of n coefficients, swapped each step, so the n^2/2
	// products of the composition allocate nothing once the mantissas have
	// grown to prec
	acc, next := newFloats(n, prec), newFloats(n, prec)
	acc[0].Set(taylor[n-1])
	t := new(big.Float).SetPrec(prec)
	w := new(fixedWork)
	l := 1
	for k := n - 2; k >= 0; k-- {
		mulByShifted(next[:l+1], acc[:l], u, t, w)
		acc, next = next, acc
		l++
		acc[0].Set(taylor[k])
	}
	out.c = acc
	return out, nil
}

func newFloats(n int, prec uint) []*big.Float {
	out := make([]*big.Float, n)
	for i := range out {
		out[i] = new(big.Float).SetPrec(prec)
	}
	return out
}

// mulByShifted writes into next the first len(next) = len(acc)+1
// coefficients of acc * (u - u(0)), whose constant term is zero; t is
// scratch space, and w that of the packed product.
func mulByShifted(next, acc, u []*big.Float, t *big.Float, w *fixedWork) {
	next[0].SetInt64(0)
	if len(next) > fixedMinLen && mulLowFixed(next[1:], acc, u[1:], t.Prec(), w) {
		return
	}
	for m := 1; m < len(next); m++ {
		sum := next[m]
		sum.SetInt64(0)
		for i := 0; i < m; i++ {
			if acc[i].Sign() == 0 || u[m-i].Sign() == 0 {
				continue
			}
			t.Mul(acc[i], u[m-i])
			sum.Add(sum, t)
		}
	}
}
