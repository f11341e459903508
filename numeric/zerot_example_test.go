package numeric_test

import (
	"fmt"
	"math/big"

	"qbridge/expansion/conformal"
	"qbridge/numeric"
)

// The zero-temperature route at q = 4: alpha_G, the coefficient of
// -1/(script-J tau) in G/G_c - 1, fitted with the correction exponents of
// h_1..h_6 (from package expansion/conformal), and E_0 from the same
// solution.
func ExampleSolveZeroTGround() {
	qp := conformal.QPoint{Q: big.NewFloat(4)}
	var dims []float64
	for n := 1; n <= 6; n++ {
		h, err := conformal.Dimension(qp, n, 20)
		if err != nil {
			fmt.Println(err)
			return
		}
		f, _ := h.Value.Float64()
		dims = append(dims, f)
	}
	g, err := numeric.SolveZeroTGround(numeric.ZeroTParams{Q: 4}, dims)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("alpha_G = %.9f (error below 1e-10: %v), E_0 = %.13f\n", g.AlphaG, g.AlphaGErr < 1e-10, g.E0)
	// Output: alpha_G = 0.187245852 (error below 1e-10: true), E_0 = -0.0574598785351
}
