package hightemp

import "math/big"

// ratVec is a vector of rationals over one common positive denominator:
// value i is num[i]/den. Sums of products then run on big.Int alone, and
// the greatest common divisor is taken once per vector (normalize), not
// once per operation as big.Rat would.
type ratVec struct {
	num []*big.Int
	den *big.Int
}

func zeroVec(n int) ratVec {
	v := ratVec{num: make([]*big.Int, n), den: big.NewInt(1)}
	for i := range v.num {
		v.num[i] = new(big.Int)
	}
	return v
}

// constVec is the length-1 vector holding r.
func constVec(r *big.Rat) ratVec {
	return ratVec{num: []*big.Int{new(big.Int).Set(r.Num())}, den: new(big.Int).Set(r.Denom())}
}

// at returns value i as a new big.Rat (zero beyond the end).
func (v ratVec) at(i int) *big.Rat {
	if i >= len(v.num) {
		return new(big.Rat)
	}
	return new(big.Rat).SetFrac(v.num[i], v.den)
}

// convolve returns the coefficient vector of the product of the
// polynomials a and b.
func convolve(a, b ratVec) ratVec {
	out := zeroVec(len(a.num) + len(b.num) - 1)
	t := new(big.Int)
	for i, x := range a.num {
		if x.Sign() == 0 {
			continue
		}
		for j, y := range b.num {
			if y.Sign() == 0 {
				continue
			}
			out.num[i+j].Add(out.num[i+j], t.Mul(x, y))
		}
	}
	out.den.Mul(a.den, b.den)
	return out
}

// scale multiplies v in place by n/d (d != 0).
func (v *ratVec) scale(n, d *big.Int) {
	for _, x := range v.num {
		x.Mul(x, n)
	}
	v.den.Mul(v.den, d)
	if v.den.Sign() < 0 {
		v.den.Neg(v.den)
		for _, x := range v.num {
			x.Neg(x)
		}
	}
}

// addInto adds x to acc in place over the least common denominator;
// acc grows to x's length if it is shorter.
func (acc *ratVec) addInto(x ratVec) {
	for len(acc.num) < len(x.num) {
		acc.num = append(acc.num, new(big.Int))
	}
	g := new(big.Int).GCD(nil, nil, acc.den, x.den)
	fa := new(big.Int).Quo(x.den, g) // acc's numerators are scaled by x.den/g
	fx := new(big.Int).Quo(acc.den, g)
	if fa.Cmp(bigOne) != 0 {
		for _, n := range acc.num {
			n.Mul(n, fa)
		}
		acc.den.Mul(acc.den, fa)
	}
	t := new(big.Int)
	for i, n := range x.num {
		if n.Sign() != 0 {
			acc.num[i].Add(acc.num[i], t.Mul(n, fx))
		}
	}
}

// normalize divides numerators and denominator by their common divisor.
func (v *ratVec) normalize() {
	g := new(big.Int).Set(v.den)
	for _, n := range v.num {
		if g.Cmp(bigOne) == 0 {
			return
		}
		if n.Sign() != 0 {
			g.GCD(nil, nil, g, new(big.Int).Abs(n))
		}
	}
	if g.Cmp(bigOne) == 0 {
		return
	}
	for _, n := range v.num {
		n.Quo(n, g)
	}
	v.den.Quo(v.den, g)
}

var bigOne = big.NewInt(1)
