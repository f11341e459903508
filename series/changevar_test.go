package series

import (
	"qbridge/series/scalar"

	"errors"
	"math/big"
	"testing"
)

// eps = delta/(2 + delta) and delta = 2 eps/(1 - eps) (eps = 1 - 2/q,
// delta = q - 2): closed forms and the round trip.
// With b != 0, Mobius re-expands the polynomial: compare with building
// P(t(u)) from t(u) = (a u + b)/(c u + d) by series arithmetic (Div, Mul).
func TestMobiusAffineReexpansion(t *testing.T) {
	const prec, n = 256, 10
	p := elemTFromStrings(t, prec, "1", "2", "3", "-1", "0.5")
	pad, _ := p.Truncate(n)
	u := elemTVar(n, prec)
	horner := func(tu *Series) *Series { // P(tu) by Horner in series arithmetic
		acc := newZero(n, prec)
		for k := p.Len() - 1; k >= 0; k-- {
			acc = AddConst(Mul(acc, tu), p.c[k])
		}
		return acc
	}
	a, b, c, d := big.NewFloat(1), big.NewFloat(1), big.NewFloat(-1), big.NewFloat(2)
	num := AddConst(Scale(u, a), b)
	den := AddConst(Scale(u, c), d)
	tu, _ := Div(num, den)
	got, err := Mobius(pad, a, b, c, d)
	if err != nil {
		t.Fatal(err)
	}
	elemTAssertClose(t, "Mobius b != 0", got, horner(tu), prec-16)

	a2, b2 := big.NewFloat(-0.75), big.NewFloat(3)
	got, err = Affine(pad, a2, b2)
	if err != nil {
		t.Fatal(err)
	}
	elemTAssertClose(t, "Affine", got, horner(AddConst(Scale(u, b2), a2)), prec-16)

	if _, err := Mobius(p, a, b, c, new(big.Float)); !errors.Is(err, scalar.ErrDomain) {
		t.Errorf("Mobius with d = 0: err = %v", err)
	}
	if _, err := Mobius(p, big.NewFloat(2), big.NewFloat(1), big.NewFloat(4), big.NewFloat(2)); !errors.Is(err, scalar.ErrDomain) {
		t.Errorf("Mobius with ad - bc = 0: err = %v", err)
	}
	if _, err := Mobius(p, nil, b, c, d); err == nil {
		t.Error("Mobius with nil coefficient: no error")
	}
	if _, err := Affine(nil, a, b); err == nil {
		t.Error("Affine(nil): no error")
	}
}
