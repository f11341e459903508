package scalar

import (
	"math/big"
	"testing"
)

// TestLogGammaTaylorMemo checks that memoized lists are the computed ones
// (first call, longer call, shorter call after it) and that changing a
// returned coefficient does not reach the memo. The reference is
// c_2 = zeta(2, 1/2)/2 = (2^2 - 1) zeta(2)/2 = pi^2/4 (DLMF 25.11.11,
// 25.6.1).
func TestLogGammaTaylorMemo(t *testing.T) {
	prec := uint(200)
	x0 := big.NewFloat(0.5)
	short, err := LogGammaTaylor(x0, 4, prec)
	if err != nil {
		t.Fatal(err)
	}
	long, err := LogGammaTaylor(x0, 30, prec)
	if err != nil {
		t.Fatal(err)
	}
	want := new(big.Float).SetPrec(prec).Mul(Pi(prec), Pi(prec))
	want.Quo(want, big.NewFloat(4))
	for _, c := range [][]*big.Float{short, long} {
		d := new(big.Float).Sub(c[2], want)
		if d.Abs(d).Cmp(new(big.Float).SetMantExp(big.NewFloat(1), -195)) > 0 {
			t.Fatalf("c_2 = %s, want pi^2/4", c[2].Text('g', 30))
		}
	}
	for k := range short {
		if short[k].Cmp(long[k]) != 0 {
			t.Fatalf("coefficient %d differs between the lists of length 4 and 30", k)
		}
	}
	long[3].SetInt64(12345)
	again, err := LogGammaTaylor(x0, 10, prec)
	if err != nil {
		t.Fatal(err)
	}
	if again[3].Cmp(long[3]) == 0 {
		t.Fatal("a change to a returned coefficient reached the memo")
	}
	if again[3].Cmp(short[3]) != 0 {
		t.Fatal("memoized coefficient 3 differs from the computed one")
	}
}
