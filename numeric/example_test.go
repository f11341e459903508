package numeric_test

import (
	"fmt"

	"qbridge/numeric"
)

// At q = 2 and beta = 1 the solution is the free semicircle one:
// log Z = 0.404584396859811 (quadrature of the exact density of states).
func ExampleSolve() {
	s, err := numeric.Solve(numeric.Params{Q: 2, Beta: 1})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("log Z = %.12f, E = %.12f, E + dlogZ/dbeta < 1e-10: %v\n", s.LogZ, s.E, s.Mismatch < 1e-10 && s.Mismatch > -1e-10)
	// Output: log Z = 0.404584396860, E = -0.108240186932, E + dlogZ/dbeta < 1e-10: true
}

func ExampleExactS0() {
	fmt.Printf("%.10f\n", numeric.ExactS0(4))
	// Output: 0.2324238496
}

func ExampleFitGround() {
	lad, err := numeric.Ladder(numeric.LadderParams{Q: 4, BetaMin: 50, BetaMax: 2000, Steps: 16})
	if err != nil {
		fmt.Println(err)
		return
	}
	g, err := numeric.FitGround(4, lad)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("E0 = %.8f, S0 = %.5f (exact %.5f), alpha_S = %.4f\n", g.E0, g.S0, g.S0Exact, g.AlphaS)
	// Output: E0 = -0.05745988, S0 = 0.23242 (exact 0.23242), alpha_S = 0.0071
}
