package series

import (
	"qbridge/series/scalar"

	"errors"
	"math/big"
	"testing"
)

// Inv(a) * a = 1 and Div(a, b) * b = a (definition of the inverse).
func TestInverseIdentities(t *testing.T) {
	const prec = 300
	cases := []struct {
		name string
		a, b []string
	}{
		{"dense", []string{"1.5", "-2", "0.25", "3", "1", "-1", "0.5", "0.125"}, []string{"-0.7", "1", "1", "1", "2", "0", "3", "-4"}},
		{"sparse", []string{"2", "0", "0", "1", "0", "0", "0", "0", "1", "0"}, []string{"1", "0", "-1", "0", "0", "0", "0", "0", "0", "0"}},
		{"length 1", []string{"3"}, []string{"-0.5"}},
	}
	for _, c := range cases {
		a := elemTFromStrings(t, prec, c.a...)
		b := elemTFromStrings(t, prec, c.b...)
		ia, err := Inv(a)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		elemTAssertClose(t, c.name+": Inv(a)*a", Mul(ia, a), elemTOne(a.Len(), prec), prec-16)
		q, err := Div(a, b)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		elemTAssertClose(t, c.name+": Div(a,b)*b", Mul(q, b), a, prec-16)
	}
}

// Div takes the shorter length and the larger precision of its operands.
func TestDivShapeAndErrors(t *testing.T) {
	a := elemTFromStrings(t, 100, "1", "2", "3", "4")
	b := elemTFromStrings(t, 200, "1", "1")
	q, err := Div(a, b)
	if err != nil {
		t.Fatal(err)
	}
	if q.Len() != 2 || q.Prec() != 200 {
		t.Fatalf("Div shape: length %d prec %d, want 2, 200", q.Len(), q.Prec())
	}
	// (1 + 2t)/(1 + t) = 1 + t + O(t^2)
	if q.c[0].Cmp(big.NewFloat(1)) != 0 || q.c[1].Cmp(big.NewFloat(1)) != 0 {
		t.Fatalf("(1+2t)/(1+t) = %v, want [1, 1]", q)
	}
	zero := elemTFromStrings(t, 100, "0", "1")
	if _, err := Inv(zero); !errors.Is(err, scalar.ErrDomain) {
		t.Errorf("Inv with a(0)=0: err = %v, want ErrDomain", err)
	}
	if _, err := Div(a, zero); !errors.Is(err, scalar.ErrDomain) {
		t.Errorf("Div by b(0)=0: err = %v, want ErrDomain", err)
	}
	if _, err := Div(nil, a); err == nil {
		t.Error("Div(nil, a): no error")
	}
}
