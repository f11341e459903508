package energy_test

import (
	"fmt"

	"qbridge/expansion/energy"
)

// Order 0 of the q = 2 expansion is the free (semicircle) model; the first
// eps-coefficient of E follows from perturbation theory in delta = q - 2.
func ExampleDeltaExpand() {
	f, err := energy.DeltaExpand(energy.DeltaParams{Beta: 10, Order: 2, Variable: energy.VarEps})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("log Z_0 = %.10f, E_0 = %.10f, E_1 = %.10f\n", f.LogZ.Values[0], f.E.Values[0], f.E.Values[1])
	// Output: log Z_0 = 2.1481698713, E_0 = -0.2096115177, E_1 = 0.3888569823
}

// The 1/q^2 coefficient of log Z at beta = 5 reproduces
// pi v [tan(pi v/2) - pi v/4] (Maldacena-Stanford arXiv:1604.07818).
func ExampleInvQExpand() {
	f, err := energy.InvQExpand(energy.InvQParams{Beta: 5, Order: 3})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("log Z_2 = %.9f, E_2 = %.9f\n", f.LogZ.Values[2], f.E.Values[2])
	// Output: log Z_2 = 3.246394273, E_2 = -0.895925570
}

func ExampleExactS0Eps() {
	s, err := energy.ExactS0Eps(3, 64)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(s.Coeff(1).Text('g', 10), s.Coeff(3).Text('g', 10))
	// Output: 0.5 -0.1370778389
}
