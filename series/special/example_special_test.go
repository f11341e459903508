package special_test

import (
	"fmt"
	"math/big"

	"qbridge/series"
	"qbridge/series/special"
)

func ExampleLogGamma() {
	// log Gamma(1/4 + t) as a series in t: log Gamma(1/4), psi(1/4),
	// psi'(1/4)/2, ...
	x0 := big.NewFloat(0.25)
	t, _ := series.Variable(4, 128, x0)
	lg, err := special.LogGamma(t)
	if err != nil {
		fmt.Println(err)
		return
	}
	for k := 0; k < lg.Len(); k++ {
		fmt.Println(lg.Coeff(k).Text('f', 25))
	}
	// Output:
	// 1.2880225246980774573706104
	// -4.2274535333762654080895301
	// 8.5986645772535553696356596
	// -21.5546233229228200555563279
}

func ExampleGammaPoleSeries() {
	// t Gamma(-2 + t) = Gamma(1+t) / ((t-1)(t-2))
	//   = 1/2 + (3/4 - gamma/2) t + (gamma^2/4 + pi^2/24 - 3 gamma/4 + 7/8) t^2 + ...
	// The constant term is the residue of Gamma at -2.
	s, err := special.GammaPoleSeries(2, 3, 128)
	if err != nil {
		fmt.Println(err)
		return
	}
	for k := 0; k < s.Len(); k++ {
		fmt.Println(s.Coeff(k).Text('f', 20))
	}
	// Output:
	// 0.50000000000000000000
	// 0.46139216754923356970
	// 0.93661624898783663224
}
