package scalar_test

import (
	"fmt"
	"math/big"

	"qbridge/series/scalar"
)

func ExampleBigGamma() {
	// Gamma(1/2) = sqrt(pi) (DLMF 5.4.6).
	g, err := scalar.BigGamma(big.NewFloat(0.5), 200)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(g.Text('f', 50))
	// Output: 1.77245385090551602729816748334114518279754945612239
}

func ExampleBigExp() {
	// e to 40 digits (DLMF 4.2.21).
	e := scalar.BigExp(big.NewFloat(1), 150)
	fmt.Println(e.Text('f', 40))
	// Output: 2.7182818284590452353602874713526624977572
}
