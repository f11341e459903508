package pslq_test

import (
	"fmt"
	"math/big"

	"qbridge/series/pslq"
	"qbridge/series/scalar"
)

func ExampleFindRelation() {
	// Machin: pi = 16 atan(1/5) - 4 atan(1/239), found from 30 digits and
	// confirmed on 60.
	const prec = 200
	one := new(big.Float).SetPrec(prec).SetInt64(1)
	x := []*big.Float{
		scalar.Pi(prec),
		scalar.BigAtan(new(big.Float).SetPrec(prec).Quo(one, big.NewFloat(5)), prec),
		scalar.BigAtan(new(big.Float).SetPrec(prec).Quo(one, big.NewFloat(239)), prec),
	}
	rel, err := pslq.FindRelation(x, 30, 1000)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(rel.Coeffs, "holds to at least 55 digits:", rel.Digits >= 55)
	// Output:
	// [1 -16 4] holds to at least 55 digits: true
}
