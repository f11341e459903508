package dd_test

import (
	"fmt"

	"qbridge/numeric/dd"
)

// One tenth is not a float64: in float64 0.1 * 3 - 0.3 leaves 5.6e-17, in
// double-double (each decimal rounded to 106 bits) only 3e-33.
func ExampleFloat_Mul() {
	tenth, _ := dd.Parse("0.1")
	three := dd.New(3)
	point3, _ := dd.Parse("0.3")
	fmt.Printf("%.2e\n", tenth.Mul(three).Sub(point3).Float64())
	a, b := 0.1, 3.0
	fmt.Printf("%.2e\n", a*b-0.3)
	// Output:
	// -3.08e-33
	// 5.55e-17
}

// Gamma(1/2) = sqrt(pi) (DLMF 5.4.6) to about 1e-30.
func ExampleRecipGamma() {
	g := dd.RecipGamma(dd.NewComplex(0.5, 0))
	fmt.Printf("%.2e\n", g.Re.Mul(dd.Pi.Sqrt()).AddFloat(-1).Float64())
	// Output:
	// -1.88e-30
}

// A real FFT and its unnormalised inverse: the round trip multiplies by n.
func ExampleFFT() {
	f, _ := dd.NewFFT(8)
	x := []dd.Float{dd.New(1), dd.New(2), dd.New(0), dd.New(-1), dd.New(0.5), dd.New(0), dd.New(0), dd.New(3)}
	c := make([]dd.Complex, 5)
	f.Coefficients(c, x)
	fmt.Println(c[0].Re.Float64(), c[4].Re.Float64())
	back := make([]dd.Float, 8)
	f.Sequence(back, c)
	fmt.Println(back[1].Float64() / 8)
	// Output:
	// 5.5 -2.5
	// 2
}
