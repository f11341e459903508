package hightemp_test

import (
	"fmt"
	"math/big"

	"qbridge/expansion/hightemp"
)

// The first coefficients of log Z/N in (beta script-J)^2 at q = 4, exactly.
func ExampleSolve() {
	c, err := hightemp.Solve(big.NewRat(4, 1), 4)
	if err != nil {
		panic(err)
	}
	for k := 1; k <= 4; k++ {
		fmt.Printf("t^%d: %s\n", k, c.A[k].RatString())
	}
	// Output:
	// t^1: 1/64
	// t^2: -1/768
	// t^3: 11/46080
	// t^4: -599/10321920
}

// The same coefficients for every q at once, as polynomials in 1/q.
func ExampleSymbolicLogZ() {
	s, err := hightemp.SymbolicLogZ(4, nil)
	if err != nil {
		panic(err)
	}
	for k := 1; k <= 4; k++ {
		fmt.Printf("t^%d: %s\n", k, s.A[k])
	}
	// Output:
	// t^1: (1/4)/q^2
	// t^2: -(1/48)/q^2
	// t^3: (1/240)/q^2 - (1/720)/q^3
	// t^4: -(23/20160)/q^2 + (1/1120)/q^3 - (1/5760)/q^4
}

// The cumulants of the many-body spectral density per fermion at q = 4.
func ExampleDerive() {
	c, err := hightemp.Solve(big.NewRat(4, 1), 3)
	if err != nil {
		panic(err)
	}
	for _, t := range hightemp.Derive(hightemp.Cumulants, c) {
		fmt.Printf("kappa_%d/N = %s\n", t.Power, t.Value.RatString())
	}
	// Output:
	// kappa_2/N = 1/32
	// kappa_4/N = -1/32
	// kappa_6/N = 11/64
}
