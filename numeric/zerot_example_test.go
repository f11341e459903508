package numeric_test

import (
	"fmt"
	"math"
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

// The zero-temperature solve as a series in eps = 1 - 2/q around the free
// point q = 2, and alpha_G's eps-series from the joint fit of all orders
// with the eps-series of h_1..h_3 (package expansion/conformal): E_0 starts
// at the semicircle's -2/(3 pi), alpha_G at (pi/4) eps.
func ExampleSolveZeroTEpsGround() {
	const order = 4
	var dims [][]float64
	for n := 1; n <= 3; n++ {
		c, err := conformal.DimensionSeries(conformal.AroundTwo, n, order, 20)
		if err != nil {
			fmt.Println(err)
			return
		}
		v := make([]float64, order+1)
		for i := range v {
			v[i], _ = c.Values[i].Float64()
		}
		dims = append(dims, v)
	}
	g, err := numeric.SolveZeroTEpsGround(numeric.EpsSeriesParams{Order: order}, dims)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("eps^0: E_0 %.12f  |alpha_G| below 1e-9: %v\n", g.E0[0], math.Abs(g.AlphaG[0]) < 1e-9)
	for k := 1; k <= 2; k++ {
		fmt.Printf("eps^%d: E_0 %.12f  alpha_G %.9f\n", k, g.E0[k], g.AlphaG[k])
	}
	// Output:
	// eps^0: E_0 -0.212206590789  |alpha_G| below 1e-9: true
	// eps^1: E_0 0.390458183789  alpha_G 0.785398163
	// eps^2: E_0 -0.145854108383  alpha_G -1.039583069
}
