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

// The arithmetic below returns no error: a nil operand (or a nil scalar)
// gives a nil result, which every function that returns an error rejects,
// so a nil never turns into a panic or a silent number.

// Add returns a + b (nil if either is nil).
func Add(a, b *Series) *Series {
	if a == nil || b == nil {
		return nil
	}
	out := newZero(minLen(a, b), maxPrec(a, b))
	for i := range out.c {
		out.c[i].Add(a.c[i], b.c[i])
	}
	return out
}

// Sub returns a - b (nil if either is nil).
func Sub(a, b *Series) *Series {
	if a == nil || b == nil {
		return nil
	}
	out := newZero(minLen(a, b), maxPrec(a, b))
	for i := range out.c {
		out.c[i].Sub(a.c[i], b.c[i])
	}
	return out
}

// Neg returns -a (nil for nil).
func Neg(a *Series) *Series {
	if a == nil {
		return nil
	}
	out := newZero(len(a.c), a.prec)
	for i := range out.c {
		out.c[i].Neg(a.c[i])
	}
	return out
}

// Scale returns x * a (nil if a or x is nil).
func Scale(a *Series, x *big.Float) *Series {
	if a == nil || x == nil {
		return nil
	}
	out := newZero(len(a.c), a.prec)
	for i := range out.c {
		out.c[i].Mul(a.c[i], x)
	}
	return out
}

// AddConst returns a + x (x added to the constant term; nil if a or x is
// nil or a is empty).
func AddConst(a *Series, x *big.Float) *Series {
	if a == nil || x == nil || len(a.c) == 0 {
		return nil
	}
	out := a.Copy()
	out.c[0].Add(out.c[0], x)
	return out
}

// Mul returns the truncated product a * b (nil if either is nil).
func Mul(a, b *Series) *Series {
	if a == nil || b == nil {
		return nil
	}
	n := minLen(a, b)
	prec := maxPrec(a, b)
	out := newZero(n, prec)
	if n >= fixedMinLen && mulLowFixed(out.c, a.c, b.c, prec, nil) {
		return out
	}
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
