package series

import "math/big"

func minLen(a, b *Series) int {
	if len(a.c) < len(b.c) {
		return len(a.c)
	}
	return len(b.c)
}

func maxPrec(a, b *Series) uint {
	if a.prec > b.prec {
		return a.prec
	}
	return b.prec
}

// Add returns a + b.
func Add(a, b *Series) *Series {
	out := newZero(minLen(a, b), maxPrec(a, b))
	for i := range out.c {
		out.c[i].Add(a.c[i], b.c[i])
	}
	return out
}

// Sub returns a - b.
func Sub(a, b *Series) *Series {
	out := newZero(minLen(a, b), maxPrec(a, b))
	for i := range out.c {
		out.c[i].Sub(a.c[i], b.c[i])
	}
	return out
}

// Neg returns -a.
func Neg(a *Series) *Series {
	out := newZero(len(a.c), a.prec)
	for i := range out.c {
		out.c[i].Neg(a.c[i])
	}
	return out
}

// Scale returns x * a.
func Scale(a *Series, x *big.Float) *Series {
	out := newZero(len(a.c), a.prec)
	for i := range out.c {
		out.c[i].Mul(a.c[i], x)
	}
	return out
}

// AddConst returns a + x (x added to the constant term).
func AddConst(a *Series, x *big.Float) *Series {
	out := a.Copy()
	out.c[0].Add(out.c[0], x)
	return out
}

// Mul returns the truncated product a * b.
func Mul(a, b *Series) *Series {
	n := minLen(a, b)
	prec := maxPrec(a, b)
	out := newZero(n, prec)
	t := new(big.Float).SetPrec(prec)
	for k := 0; k < n; k++ {
		acc := out.c[k]
		for i := 0; i <= k; i++ {
			if a.c[i].Sign() == 0 || b.c[k-i].Sign() == 0 {
				continue
			}
			t.Mul(a.c[i], b.c[k-i])
			acc.Add(acc, t)
		}
	}
	return out
}
