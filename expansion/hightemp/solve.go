package hightemp

import (
	"errors"
	"fmt"
	"math/big"
)

// MaxOrder is the highest power of t = (beta script-J)^2 that Solve and
// SymbolicLogZ accept. Time grows like order^4 at one q (see the
// benchmarks); beyond this the exact numbers outgrow any use.
const MaxOrder = 60

// ErrInput marks an argument outside what the expansion accepts.
var ErrInput = errors.New("invalid input")

// Coefficients are the exact high-temperature coefficients of log Z/N at
// one q: log Z/N = (1/2) log 2 + sum_{k>=1} A[k] t^k, t = (beta script-J)^2.
type Coefficients struct {
	// Q is the interaction order.
	Q *big.Rat
	// A[k] is the coefficient of t^k for k >= 1; A[0] is nil, since the
	// constant (1/2) log 2 is not rational.
	A []*big.Rat
	// Slope[k] is the coefficient of t^k of beta G'(0+), the slope of the
	// two-point function at tau = 0+ (so beta E = Slope/q); Slope[0] = 0.
	Slope []*big.Rat
}

// Order is the highest power of t held.
func (c *Coefficients) Order() int { return len(c.A) - 1 }

// Solve returns the coefficients of log Z/N to t^order at the rational
// interaction order q >= 2, exactly.
func Solve(q *big.Rat, order int) (*Coefficients, error) {
	if q == nil || q.Cmp(big.NewRat(2, 1)) < 0 {
		return nil, fmt.Errorf("%w: the high-temperature series needs q >= 2, got %v", ErrInput, q)
	}
	if order < 1 || order > MaxOrder {
		return nil, fmt.Errorf("%w: order %d outside 1..%d", ErrInput, order, MaxOrder)
	}
	return solve(q, order, newBasis(2*order)), nil
}

// solve runs the recursion at any q != 0: every step is a polynomial
// identity in q and 1/q, which is what lets SymbolicLogZ interpolate
// through values of q that are not physical.
//
// With beta = 1, Gf = 2G = 1 + O(t) on (0, 1) and P = Gf^(q-1):
//
//	Sigma_k = P_(k-1)/q                          (Sigma = (t/q) Gf^(q-1))
//	Gf_k    = sum_{j=1..k} e_0 * Sigma_j * Gf_(k-j)   (Gf = 1 + e_0 * Sigma * Gf)
//	P_m     = (1/m) sum_{j=1..m} (q j - m) Gf_j P_(m-j)   (Miller's recurrence)
//
// where * is the antiperiodic convolution, an index shift in the e_n:
// e_0 * e_a * e_b = e_(a+b+2). G' (0+) = Gf'(0+)/2, and
// E = G'(0+)/q = -d log Z/d beta gives a_k = -[tau^1]Gf_k/(4 q k).
func solve(q *big.Rat, order int, b *basis) *Coefficients {
	c, _ := solveFull(q, order, b)
	return c
}

// solveFull is solve that also returns (2G)_k in monomials.
func solveFull(q *big.Rat, order int, b *basis) (*Coefficients, []ratVec) {
	qn, qd := q.Num(), q.Denom()
	gfM := make([]ratVec, order+1) // Gf_k in monomials
	gfE := make([]ratVec, order+1) // Gf_k in Euler functions
	sigE := make([]ratVec, order+1)
	pw := make([]ratVec, order) // P_m in monomials
	gfM[0] = constVec(big.NewRat(1, 1))
	gfE[0] = constVec(big.NewRat(2, 1)) // 1 = 2 e_0 on (0, 1)
	pw[0] = constVec(big.NewRat(1, 1))
	out := &Coefficients{Q: new(big.Rat).Set(q), A: make([]*big.Rat, order+1), Slope: make([]*big.Rat, order+1)}
	out.Slope[0] = new(big.Rat)
	for k := 1; k <= order; k++ {
		if m := k - 1; m >= 1 {
			var acc ratVec
			for j := 1; j <= m; j++ {
				t := convolve(gfM[j], pw[m-j])
				// (q j - m) = (qn j - m qd)/qd
				f := new(big.Int).Sub(new(big.Int).Mul(qn, big.NewInt(int64(j))), new(big.Int).Mul(qd, big.NewInt(int64(m))))
				if f.Sign() == 0 {
					continue
				}
				t.scale(f, bigOne)
				if acc.num == nil {
					acc = t
				} else {
					acc.addInto(t)
				}
			}
			if acc.num == nil {
				acc = zeroVec(2*m + 1)
			}
			acc.scale(bigOne, new(big.Int).Mul(qd, big.NewInt(int64(m))))
			acc.normalize()
			pw[m] = acc
		}
		s := b.toEuler(pw[k-1])
		s.scale(qd, qn) // Sigma_k = P_(k-1)/q
		s.normalize()
		sigE[k] = s
		var acc ratVec
		for j := 1; j <= k; j++ {
			t := convolve(sigE[j], gfE[k-j])
			if acc.num == nil {
				acc = t
			} else {
				acc.addInto(t)
			}
		}
		shifted := ratVec{num: append([]*big.Int{new(big.Int), new(big.Int)}, acc.num...), den: acc.den}
		shifted.normalize()
		gfE[k] = shifted
		gfM[k] = b.toMonomial(shifted)
		slope := gfM[k].at(1)
		out.Slope[k] = new(big.Rat).Mul(slope, big.NewRat(1, 2))
		a := new(big.Rat).Quo(slope, new(big.Rat).Mul(q, big.NewRat(int64(-4*k), 1)))
		out.A[k] = a
	}
	return out, gfM
}
