package scalar

import (
	"math/big"
	"testing"
)

func TestBernoulliKnownValues(t *testing.T) {
	// DLMF Table 24.2.1 (B_n for n <= 20), from memory; also checked by
	// the mpmath golden file for larger n through zeta.
	cases := []struct {
		n    int
		want string
	}{
		{0, "1"}, {1, "-1/2"}, {2, "1/6"}, {3, "0"}, {4, "-1/30"}, {6, "1/42"},
		{8, "-1/30"}, {10, "5/66"}, {12, "-691/2730"}, {14, "7/6"},
		{16, "-3617/510"}, {18, "43867/798"}, {20, "-174611/330"},
		{30, "8615841276005/14322"}, // DLMF Table 24.2.1 continues to n = 60, from memory
	}
	for _, c := range cases {
		got, err := Bernoulli(c.n)
		if err != nil {
			t.Fatalf("B_%d: %v", c.n, err)
		}
		want, _ := new(big.Rat).SetString(c.want)
		if got.Cmp(want) != 0 {
			t.Errorf("B_%d = %s, want %s", c.n, got.RatString(), c.want)
		}
	}
}

func TestBernoulliRecurrence(t *testing.T) {
	// Exact check of the defining recurrence sum_{k=0}^{n-1} C(n,k) B_k = 0
	// for n >= 2 (DLMF 24.5.3), up to n = 120.
	for n := 2; n <= 120; n++ {
		sum := new(big.Rat)
		binom := big.NewInt(1)
		for k := 0; k < n; k++ {
			b, err := Bernoulli(k)
			if err != nil {
				t.Fatal(err)
			}
			sum.Add(sum, new(big.Rat).Mul(new(big.Rat).SetInt(binom), b))
			binom.Mul(binom, big.NewInt(int64(n-k)))
			binom.Quo(binom, big.NewInt(int64(k+1)))
		}
		if sum.Sign() != 0 {
			t.Fatalf("recurrence fails at n = %d: %s", n, sum.RatString())
		}
	}
}

func TestBernoulliBadIndex(t *testing.T) {
	for _, n := range []int{-1, -100, maxBernoulliIndex + 1} {
		if _, err := Bernoulli(n); err == nil {
			t.Errorf("Bernoulli(%d): want error", n)
		}
	}
}
