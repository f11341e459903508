package claim

import "math/big"

// maxFoldPower bounds the integer exponents folded exactly.
const maxFoldPower = 64

// maxFoldBits bounds the size (numerator plus denominator bits) of a folded
// rational, so that nested powers of large literals stay cheap.
const maxFoldBits = 1 << 14

// small returns r, ok when r is within maxFoldBits.
func small(r *big.Rat) (*big.Rat, bool) {
	if r.Num().BitLen()+r.Denom().BitLen() > maxFoldBits {
		return nil, false
	}
	return r, true
}

// fold evaluates a node built from numbers with + - * / and integer powers
// exactly; ok is false for anything else (names, functions, a division by
// zero, a power too large to fold).
func fold(n Node) (*big.Rat, bool) {
	r, ok := foldAny(n)
	if !ok {
		return nil, false
	}
	return small(r)
}

func foldAny(n Node) (*big.Rat, bool) {
	switch t := n.(type) {
	case *Number:
		return new(big.Rat).Set(t.Value), true
	case *Unary:
		x, ok := fold(t.X)
		if !ok {
			return nil, false
		}
		return x.Neg(x), true
	case *Binary:
		x, ok := fold(t.X)
		if !ok {
			return nil, false
		}
		y, ok := fold(t.Y)
		if !ok {
			return nil, false
		}
		switch t.Op {
		case '+':
			return x.Add(x, y), true
		case '-':
			return x.Sub(x, y), true
		case '*':
			return x.Mul(x, y), true
		case '/':
			if y.Sign() == 0 {
				return nil, false
			}
			return x.Quo(x, y), true
		case '^':
			if !y.IsInt() || !y.Num().IsInt64() {
				return nil, false
			}
			k := y.Num().Int64()
			if k > maxFoldPower || k < -maxFoldPower || k < 0 && x.Sign() == 0 ||
				(x.Num().BitLen()+x.Denom().BitLen())*abs(int(k)) > maxFoldBits {
				return nil, false
			}
			return ratPow(x, int(k)), true
		}
	}
	return nil, false
}

// ratPow returns x^k exactly (x != 0 when k < 0).
func ratPow(x *big.Rat, k int) *big.Rat {
	out := big.NewRat(1, 1)
	for range abs(k) {
		out.Mul(out, x)
	}
	if k < 0 {
		out.Inv(out)
	}
	return out
}

func abs(k int) int {
	if k < 0 {
		return -k
	}
	return k
}
