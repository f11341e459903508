package series_test

import (
	"fmt"
	"math/big"

	"qbridge/series"
)

// The Taylor coefficients of exp(t) are 1/k!.
func ExampleExp() {
	t, _ := series.Variable(6, 128, nil)
	e, _ := series.Exp(t)
	for k := 0; k < e.Len(); k++ {
		fmt.Printf("%.10f\n", e.Coeff(k))
	}
	// Output:
	// 1.0000000000
	// 1.0000000000
	// 0.5000000000
	// 0.1666666667
	// 0.0416666667
	// 0.0083333333
}

// exp(t) - 1 composed with log(1 + t) gives back t.
func ExampleCompose() {
	t, _ := series.Variable(6, 128, nil)
	e, _ := series.Exp(t)
	expm1 := series.AddConst(e, big.NewFloat(-1))
	onePlusT := series.AddConst(t, big.NewFloat(1))
	l, _ := series.Log(onePlusT)
	id, _ := series.Compose(expm1, l)
	for k := 0; k < id.Len(); k++ {
		fmt.Printf("%.20f\n", id.Coeff(k))
	}
	// Output:
	// 0.00000000000000000000
	// 1.00000000000000000000
	// 0.00000000000000000000
	// 0.00000000000000000000
	// 0.00000000000000000000
	// 0.00000000000000000000
}

// Reverting t e^t gives the Lambert W series t - t^2 + 3/2 t^3 - 8/3 t^4 + ...
func ExampleRevert() {
	t, _ := series.Variable(6, 128, nil)
	e, _ := series.Exp(t)
	w, _ := series.Revert(series.Mul(t, e))
	fmt.Println(w)
	// Output:
	// [0, 1, -1, 1.5, -2.666666667, 5.208333333]
}

// Summing the first 20 terms of exp(t) at t = 1 approximates e.
func ExampleEval() {
	t, _ := series.Variable(20, 128, nil)
	e, _ := series.Exp(t)
	fmt.Printf("%.15f\n", series.Eval(e, big.NewFloat(1)))
	// Output:
	// 2.718281828459045
}
