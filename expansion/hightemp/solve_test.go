package hightemp

import (
	"math/big"
	"testing"
)

// The first three coefficients in closed form for every q:
// a_1 = 1/(4q^2) (PHYSICS.md sec. 5: kappa_2/N = Tr H^2 per fermion),
// a_2 = -1/(48 q^2) (kappa_4/N = 4! a_2 = -1/(2 q^2): the fourth moment is
// M_4 = (2 + eta) M_2^2 with the crossing-chord weight eta = 1 - 2q^2/N +
// O(1/N^2), Garcia-Garcia and Verbaarschot 2016, arXiv:1610.03816, written
// from memory; its large-q form is the t^2 term of Maldacena and Stanford
// 2016, arXiv:1604.07818, sec. 4) and a_3 = (3q - 1)/(720 q^3) (kappa_6/N = 3/q^2 - 1/q^3 from
// counting chord diagrams with one, two and three crossings, derived for
// this test and stated in reference_test.go).
func TestFirstCoefficients(t *testing.T) {
	for _, q := range []*big.Rat{big.NewRat(2, 1), big.NewRat(3, 1), big.NewRat(4, 1), big.NewRat(6, 1), big.NewRat(9, 2), big.NewRat(101, 7)} {
		c, err := Solve(q, 6)
		if err != nil {
			t.Fatal(err)
		}
		q2 := new(big.Rat).Mul(q, q)
		q3 := new(big.Rat).Mul(q2, q)
		want := []*big.Rat{
			new(big.Rat).Inv(new(big.Rat).Mul(big.NewRat(4, 1), q2)),
			new(big.Rat).Neg(new(big.Rat).Inv(new(big.Rat).Mul(big.NewRat(48, 1), q2))),
			new(big.Rat).Quo(new(big.Rat).Sub(new(big.Rat).Mul(big.NewRat(3, 1), q), big.NewRat(1, 1)), new(big.Rat).Mul(big.NewRat(720, 1), q3)),
		}
		for k, w := range want {
			if c.A[k+1].Cmp(w) != 0 {
				t.Errorf("q = %s: a_%d = %s, want %s", q.RatString(), k+1, c.A[k+1].RatString(), w.RatString())
			}
		}
	}
}

// The polynomials in 1/q, evaluated at q that are not interpolation nodes,
// equal the direct exact solves there.
func TestSymbolicSmall(t *testing.T) {
	const order = 8
	s, err := SymbolicLogZ(order, nil)
	if err != nil {
		t.Fatal(err)
	}
	nodes := map[string]bool{}
	for _, n := range s.Nodes {
		nodes[n.RatString()] = true
	}
	for _, q := range []*big.Rat{big.NewRat(7, 1), big.NewRat(5, 2), big.NewRat(64, 3)} {
		if nodes[q.RatString()] {
			t.Fatalf("q = %s is a node", q.RatString())
		}
		c, err := Solve(q, order)
		if err != nil {
			t.Fatal(err)
		}
		for k := 1; k <= order; k++ {
			if got := s.A[k].At(q); got.Cmp(c.A[k]) != 0 {
				t.Errorf("q = %s, a_%d: polynomial gives %s, solve %s", q.RatString(), k, got.RatString(), c.A[k].RatString())
			}
		}
	}
}
