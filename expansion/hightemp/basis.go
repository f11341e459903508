package hightemp

import "math/big"

// basis holds what the changes between monomials tau^n and the Euler
// functions e_n = E_n(tau)/(2 n!) need up to degree n: factorials and the
// Taylor coefficients c_i of 1/(e^z + 1), the generating function
// sum_n e_n(tau) z^n = e^(tau z)/(e^z + 1).
type basis struct {
	fact []*big.Int // fact[i] = i!
	cNum []*big.Int // c_i = cNum[i]/cDen
	cDen *big.Int
}

func newBasis(n int) *basis {
	b := &basis{fact: make([]*big.Int, n+1)}
	b.fact[0] = big.NewInt(1)
	for i := 1; i <= n; i++ {
		b.fact[i] = new(big.Int).Mul(b.fact[i-1], big.NewInt(int64(i)))
	}
	// (e^z + 1) c(z) = 1: c_0 = 1/2, c_m = -(1/2) sum_{i=1}^m c_{m-i}/i!.
	c := make([]*big.Rat, n+1)
	c[0] = big.NewRat(1, 2)
	for m := 1; m <= n; m++ {
		s := new(big.Rat)
		for i := 1; i <= m; i++ {
			s.Add(s, new(big.Rat).Quo(c[m-i], new(big.Rat).SetInt(b.fact[i])))
		}
		c[m] = s.Mul(s, big.NewRat(-1, 2))
	}
	b.cDen = big.NewInt(1)
	for _, r := range c {
		g := new(big.Int).GCD(nil, nil, b.cDen, r.Denom())
		b.cDen.Mul(b.cDen, new(big.Int).Quo(r.Denom(), g))
	}
	b.cNum = make([]*big.Int, n+1)
	for i, r := range c {
		b.cNum[i] = new(big.Int).Mul(r.Num(), new(big.Int).Quo(b.cDen, r.Denom()))
	}
	return b
}

// toEuler rewrites a polynomial in tau on (0, 1) in the functions e_j.
// From tau^m/m! = 2 e_m + sum_{j<m} e_j/(m-j)! the coefficients are
// integer combinations: eps_j = 2 j! p_j + sum_{m>j} p_m m!/(m-j)!.
func (b *basis) toEuler(p ratVec) ratVec {
	n := len(p.num) - 1
	out := zeroVec(n + 1)
	out.den.Set(p.den)
	t := new(big.Int)
	fall := new(big.Int)
	for j := 0; j <= n; j++ {
		acc := out.num[j]
		if p.num[j].Sign() != 0 {
			acc.Add(acc, t.Mul(p.num[j], t.Mul(big.NewInt(2), b.fact[j])))
		}
		fall.Set(b.fact[j]) // m!/(m-j)! for m = j, j+1, ..., n
		for m := j + 1; m <= n; m++ {
			fall.Mul(fall, big.NewInt(int64(m)))
			fall.Quo(fall, big.NewInt(int64(m-j)))
			if p.num[m].Sign() != 0 {
				acc.Add(acc, t.Mul(p.num[m], fall))
			}
		}
	}
	out.normalize()
	return out
}

// toMonomial is the inverse of toEuler: from e_j = sum_{k<=j} c_(j-k) tau^k/k!
// the coefficient of tau^k is (1/k!) sum_{j>=k} eps_j c_(j-k).
func (b *basis) toMonomial(e ratVec) ratVec {
	n := len(e.num) - 1
	out := zeroVec(n + 1)
	out.den.Mul(e.den, b.cDen)
	out.den.Mul(out.den, b.fact[n])
	t := new(big.Int)
	for k := 0; k <= n; k++ {
		acc := out.num[k]
		for j := k; j <= n; j++ {
			if e.num[j].Sign() != 0 && b.cNum[j-k].Sign() != 0 {
				acc.Add(acc, t.Mul(e.num[j], b.cNum[j-k]))
			}
		}
		acc.Mul(acc, t.Quo(b.fact[n], b.fact[k]))
	}
	out.normalize()
	return out
}
