package scalar

import "math/big"

// RaiseAbs sets dst = max(dst, |v|).
func RaiseAbs(dst, v *big.Float) {
	if CmpAbs(v, dst) > 0 {
		dst.Abs(v)
	}
}

// CmpAbs compares |a| and |b|.
func CmpAbs(a, b *big.Float) int {
	neg := func(x *big.Float) bool { return x.Signbit() }
	switch {
	case !neg(a) && !neg(b):
		return a.Cmp(b)
	case neg(a) && neg(b):
		return b.Cmp(a)
	}
	return new(big.Float).Abs(a).Cmp(new(big.Float).Abs(b))
}
