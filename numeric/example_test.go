package numeric_test

import (
	"fmt"
	"math"
	"math/big"

	"qbridge/expansion/conformal"
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

// conformalAt returns h_1 and the exact S_0 at q from package
// expansion/conformal, the inputs of the low-temperature fits.
func conformalAt(q float64) (numeric.ConformalData, error) {
	qp := conformal.QPoint{Q: new(big.Float).SetFloat64(q)}
	h, err := conformal.Dimension(qp, 1, 20)
	if err != nil {
		return numeric.ConformalData{}, err
	}
	s, err := conformal.S0(qp, 20)
	if err != nil {
		return numeric.ConformalData{}, err
	}
	var c numeric.ConformalData
	c.H1, _ = h.Value.Float64()
	c.S0Exact, _ = s.Value.Float64()
	return c, nil
}

func ExampleFitGround() {
	lad, err := numeric.Ladder(numeric.LadderParams{Q: 4, BetaMin: 25, BetaMax: 2000, Steps: 20, PointsPerBeta: 64, Tol: 1e-14})
	if err != nil {
		fmt.Println(err)
		return
	}
	c, err := conformalAt(4)
	if err != nil {
		fmt.Println(err)
		return
	}
	g, err := numeric.FitGround(4, c, lad)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("E0 = %.11f, S0 = %.9f (exact %.9f), alpha_S = %.6f\n", g.E0, g.S0, g.S0Exact, g.AlphaS)
	// Output: E0 = -0.05745987854, S0 = 0.232423850 (exact 0.232423850), alpha_S = 0.007093
}

// SolveGround on the default ladder; at q = 2 (free fermions with the
// semicircle density) E_0 = -2/(3 pi) and alpha_S = 1/(24 pi) exactly.
func ExampleSolveGround() {
	c, err := conformalAt(2)
	if err != nil {
		fmt.Println(err)
		return
	}
	g, err := numeric.SolveGround(numeric.GroundLadder(2, 0, nil), c)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("E0 = %.12f (exact %.12f), alpha_S = %.8f (exact %.8f)\n", g.E0, -2/(3*math.Pi), g.AlphaS, 1/(24*math.Pi))
	// Output: E0 = -0.212206590789 (exact -0.212206590789), alpha_S = 0.01326291 (exact 0.01326291)
}
