package series

import (
	"qbridge/series/scalar"

	"errors"
	"math/big"
	"testing"
)

// Compose(f, Revert(f)) = t and Compose(Revert(f), f) = t.
func TestComposeRevertIdentity(t *testing.T) {
	const prec = 256
	cases := []struct {
		name string
		f    []string
	}{
		{"dense", []string{"0", "2", "-1", "0.5", "3", "0.25", "-0.125", "1", "1", "-1", "0.3", "0.7"}},
		{"odd", []string{"0", "1", "0", "-0.5", "0", "0.2", "0", "-0.1", "0"}},
		{"negative slope", []string{"0", "-0.3", "1", "1", "1", "1"}},
		{"length 2", []string{"0", "4"}},
	}
	for _, c := range cases {
		f := elemTFromStrings(t, prec, c.f...)
		g, err := Revert(f)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		id := elemTVar(f.Len(), prec)
		fg, err := Compose(f, g)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		elemTAssertClose(t, c.name+": f(g(t))", fg, id, prec-40)
		gf, err := Compose(g, f)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		elemTAssertClose(t, c.name+": g(f(t))", gf, id, prec-40)
	}
}

// Known compositions and reversions with closed-form coefficients (DLMF
// equation numbers from memory, not re-read at the source).
func TestComposeRevertKnown(t *testing.T) {
	const prec, n = 256, 25
	x := elemTVar(n, prec)
	t.Run("Lambert W = Revert(t e^t): (-k)^(k-1)/k! (DLMF 4.13.5)", func(t *testing.T) {
		e, _ := Exp(x)
		w, err := Revert(Mul(x, e))
		if err != nil {
			t.Fatal(err)
		}
		want := newZero(n, prec)
		for k := 1; k < n; k++ {
			num := new(big.Int).Exp(big.NewInt(int64(-k)), big.NewInt(int64(k-1)), nil)
			want.c[k].SetRat(new(big.Rat).SetFrac(num, elemTFactorial(int64(k))))
		}
		elemTAssertClose(t, "W", w, want, prec-16)
	})
	t.Run("Revert(sin t) = asin t: C(2j,j)/(4^j (2j+1)) (DLMF 4.24.1)", func(t *testing.T) {
		s, _ := Sin(x)
		as, err := Revert(s)
		if err != nil {
			t.Fatal(err)
		}
		want := newZero(n, prec)
		for j := 0; 2*j+1 < n; j++ {
			r := new(big.Rat).SetInt(new(big.Int).Binomial(int64(2*j), int64(j)))
			r.Quo(r, new(big.Rat).SetInt(new(big.Int).Lsh(big.NewInt(int64(2*j+1)), uint(2*j))))
			want.c[2*j+1].SetRat(r)
		}
		elemTAssertClose(t, "asin", as, want, prec-16)
	})
	t.Run("exp(log(1+t)) via Compose = 1+t", func(t *testing.T) {
		e, _ := Exp(x)
		l, _ := Log(AddConst(x, big.NewFloat(1)))
		got, err := Compose(e, l)
		if err != nil {
			t.Fatal(err)
		}
		want := AddConst(x, big.NewFloat(1))
		elemTAssertClose(t, "exp o log1p", got, want, prec-16)
	})
	t.Run("Compose(f, c t) scales coefficients", func(t *testing.T) {
		f := elemTFromStrings(t, prec, "1", "2", "3", "4", "5")
		g := Scale(elemTVar(5, prec), big.NewFloat(-2))
		got, err := Compose(f, g)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "f(-2t)", got, elemTFromStrings(t, prec, "1", "-4", "12", "-32", "80"), prec-4)
	})
}

// Compose and Revert reject inputs for which the result is not a power
// series determined by the truncated inputs.
func TestComposeRevertErrors(t *testing.T) {
	const prec = 64
	f := elemTFromStrings(t, prec, "1", "2", "3")
	g1 := elemTFromStrings(t, prec, "0.5", "1", "0")
	if _, err := Compose(f, g1); !errors.Is(err, scalar.ErrDomain) {
		t.Errorf("Compose with g(0) != 0: err = %v", err)
	}
	if _, err := Compose(nil, g1); err == nil {
		t.Error("Compose(nil, g): no error")
	}
	for name, in := range map[string][]string{
		"f(0) != 0":  {"1", "1", "0"},
		"f'(0) = 0":  {"0", "0", "1"},
		"length one": {"0"},
	} {
		if _, err := Revert(elemTFromStrings(t, prec, in...)); err == nil {
			t.Errorf("Revert with %s: no error", name)
		}
	}
}
