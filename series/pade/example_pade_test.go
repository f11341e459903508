package pade_test

import (
	"fmt"
	"math/big"
	"qbridge/series/pade"
	"qbridge/series/scalar"

	"qbridge/series"
)

// expSeries returns the Taylor series of exp at 0 (c_k = 1/k!).
func expSeries(n int, prec uint) *series.Series {
	c := make([]*big.Float, n)
	f := new(big.Float).SetPrec(prec).SetInt64(1)
	for k := range c {
		if k > 0 {
			f.Quo(f, big.NewFloat(float64(k)))
		}
		c[k] = new(big.Float).Set(f)
	}
	s, _ := series.FromBig(prec, c)
	return s
}

// sqrtSeries returns the Taylor series of sqrt(1+x) around x0.
func sqrtSeries(n int, x0 float64, prec uint) *series.Series {
	c := make([]*big.Float, n)
	base := new(big.Float).SetPrec(prec).SetFloat64(1 + x0)
	v := new(big.Float).SetPrec(prec).Sqrt(base)
	for k := range c {
		c[k] = new(big.Float).Set(v)
		v.Mul(v, big.NewFloat(0.5-float64(k)))
		v.Quo(v, big.NewFloat(float64(k+1)))
		v.Quo(v, base)
	}
	s, _ := series.FromBig(prec, c)
	return s
}

func ExampleNewPade() {
	p, err := pade.NewPade(expSeries(5, 128), 2, 2)
	if err != nil {
		fmt.Println(err)
		return
	}
	for k := range p.P {
		fmt.Printf("P[%d] = %.6f   Q[%d] = %.6f\n", k, p.P[k], k, p.Q[k])
	}
	v, _ := p.Eval(big.NewFloat(1))
	fmt.Printf("[2/2](1) = %.10f (19/7)\n", v)
	poles, _ := p.Poles()
	fmt.Printf("%d poles, |pole| = %.6f (sqrt 12)\n", len(poles), scalar.CAbs(poles[0], 64))
	// Output:
	// P[0] = 1.000000   Q[0] = 1.000000
	// P[1] = 0.500000   Q[1] = -0.500000
	// P[2] = 0.083333   Q[2] = 0.083333
	// [2/2](1) = 2.7142857143 (19/7)
	// 2 poles, |pole| = 3.464102 (sqrt 12)
}

func ExamplePadeTable() {
	// log(1+x) = x - x^2/2 + x^3/3 - ..., summed at x = 1 where the
	// partial sums converge only like 1/n.
	const prec = 128
	c := make([]*big.Float, 21)
	for k := range c {
		c[k] = new(big.Float).SetPrec(prec)
		if k > 0 {
			c[k].Quo(big.NewFloat(1), big.NewFloat(float64(k)))
			if k%2 == 0 {
				c[k].Neg(c[k])
			}
		}
	}
	s, _ := series.FromBig(prec, c)
	r, err := pade.PadeTable(s, big.NewFloat(1), pade.PadeTableOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("log 2 ~ %.12f from [%d/%d], %d entries compared\n", r.Value, r.L, r.M, r.Used)
	fmt.Println("error estimate below 1e-10:", r.Err.Cmp(big.NewFloat(1e-10)) < 0)
	// Output:
	// log 2 ~ 0.693147180560 from [10/10], 3 entries compared
	// error estimate below 1e-10: true
}

func ExampleTwoPointPade() {
	// sqrt(1+x) known by 6 Taylor terms at x = 0 and 6 at x = 1.
	const prec = 128
	sa, sb := sqrtSeries(6, 0, prec), sqrtSeries(6, 1, prec)
	tp, err := pade.TwoPointPade(sa, big.NewFloat(0), 6, sb, big.NewFloat(1), 6, 6, 5)
	if err != nil {
		fmt.Println(err)
		return
	}
	v, _ := tp.Eval(big.NewFloat(0.5))
	fmt.Printf("two-point [6/5] at 0.5: %.10f\n", v)
	fmt.Printf("sqrt(1.5):              %.10f\n", new(big.Float).SetPrec(prec).Sqrt(big.NewFloat(1.5)))
	// Output:
	// two-point [6/5] at 0.5: 1.2247448714
	// sqrt(1.5):              1.2247448714
}
