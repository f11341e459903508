package series

import (
	"errors"
	"math/big"
	"testing"
)

// eps = delta/(2 + delta) and delta = 2 eps/(1 - eps) (eps = 1 - 2/q,
// delta = q - 2): closed forms and the round trip.
func TestEpsDelta(t *testing.T) {
	const prec, n = 256, 20
	id := elemTVar(n, prec)
	t.Run("EpsToDelta(eps) = delta/(2+delta) = sum (-1)^(k-1) delta^k/2^k", func(t *testing.T) {
		got, err := EpsToDelta(id)
		if err != nil {
			t.Fatal(err)
		}
		want := newZero(n, prec)
		for k := 1; k < n; k++ {
			want.c[k].SetMantExp(big.NewFloat(float64(1-2*((k-1)%2))), -k)
		}
		elemTAssertClose(t, "eps(delta)", got, want, prec-4)
	})
	t.Run("DeltaToEps(delta) = 2 eps/(1-eps) = sum 2 eps^k", func(t *testing.T) {
		got, err := DeltaToEps(id)
		if err != nil {
			t.Fatal(err)
		}
		want := newZero(n, prec)
		for k := 1; k < n; k++ {
			want.c[k].SetInt64(2)
		}
		elemTAssertClose(t, "delta(eps)", got, want, prec-4)
	})
	t.Run("q = 2/(1-eps) in eps becomes 2 + delta", func(t *testing.T) {
		q, _ := Inv(elemTFromStrings(t, prec, "0.5", "-0.5", "0", "0", "0", "0", "0", "0"))
		got, err := EpsToDelta(q)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "q(delta)", got, elemTFromStrings(t, prec, "2", "1", "0", "0", "0", "0", "0", "0"), prec-8)
	})
	t.Run("round trip", func(t *testing.T) {
		s := elemTFromStrings(t, prec, "0.25", "1", "-3", "0.5", "2", "0", "7", "-1", "0.125", "1", "1", "1")
		d, err := EpsToDelta(s)
		if err != nil {
			t.Fatal(err)
		}
		back, err := DeltaToEps(d)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "DeltaToEps(EpsToDelta(s))", back, s, prec-16)
	})
}

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

	if _, err := Mobius(p, a, b, c, new(big.Float)); !errors.Is(err, ErrDomain) {
		t.Errorf("Mobius with d = 0: err = %v", err)
	}
	if _, err := Mobius(p, big.NewFloat(2), big.NewFloat(1), big.NewFloat(4), big.NewFloat(2)); !errors.Is(err, ErrDomain) {
		t.Errorf("Mobius with ad - bc = 0: err = %v", err)
	}
	if _, err := Mobius(p, nil, b, c, d); err == nil {
		t.Error("Mobius with nil coefficient: no error")
	}
	if _, err := Affine(nil, a, b); err == nil {
		t.Error("Affine(nil): no error")
	}
}
