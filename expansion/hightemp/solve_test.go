package hightemp

import (
	"math/big"
	"testing"
)

func TestFirstCoefficients(t *testing.T) {
	for _, q := range []int64{2, 3, 4, 6} {
		c, err := Solve(big.NewRat(q, 1), 6)
		if err != nil {
			t.Fatal(err)
		}
		for k := 1; k <= 6; k++ {
			t.Logf("q=%d a_%d = %s", q, k, c.A[k].RatString())
		}
	}
}

func TestSymbolicSmall(t *testing.T) {
	s, err := SymbolicLogZ(8, nil)
	if err != nil {
		t.Fatal(err)
	}
	for k := 1; k <= 8; k++ {
		t.Logf("a_%d = %s", k, s.A[k])
	}
}
