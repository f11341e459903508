package series

import (
	"math/big"
	"testing"
)

// Deriv(Integral(a, c)) = a exactly, and Integral(Deriv(a), a(0)) = a up
// to the dropped last term (fundamental theorem of calculus).
func TestCalculusRoundTrip(t *testing.T) {
	const prec = 200
	a := elemTFromStrings(t, prec, "1.25", "-3", "0.5", "7", "0", "-0.01", "2")
	c0 := big.NewFloat(-4)
	in := Integral(a, c0)
	if in.Len() != a.Len()+1 || in.c[0].Cmp(c0) != 0 {
		t.Fatalf("Integral: length %d, constant %s", in.Len(), in.c[0].Text('g', 10))
	}
	elemTAssertClose(t, "Deriv(Integral(a))", Deriv(in), a, prec-4)
	back := Integral(Deriv(a), a.c[0])
	want, _ := a.Truncate(a.Len())
	elemTAssertClose(t, "Integral(Deriv(a))", back, want, prec-4)
}

// Derivative of exp(t) is exp(t); integral of 1/(1+t) is log(1+t)
// (DLMF 4.6.1, number from memory).
func TestCalculusKnown(t *testing.T) {
	const prec, n = 128, 12
	e, _ := Exp(elemTVar(n, prec))
	want, _ := e.Truncate(n - 1)
	elemTAssertClose(t, "exp' = exp", Deriv(e), want, prec-4)

	inv, _ := Inv(AddConst(elemTVar(n, prec), big.NewFloat(1)))
	l, _ := Log(AddConst(elemTVar(n+1, prec), big.NewFloat(1)))
	elemTAssertClose(t, "int 1/(1+t) = log(1+t)", Integral(inv, nil), l, prec-4)

	one := elemTOne(1, prec)
	if d := Deriv(one); d.Len() != 1 || d.c[0].Sign() != 0 {
		t.Fatalf("Deriv of a constant: %v, want [0]", d)
	}
}
