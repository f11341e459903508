// Package expansion is the one door through which the command line reaches
// every perturbative quantity of qbridge: the quantity vocabulary (canonical
// names such as h_1, b, S_0, E_0, alpha_S, alpha_G, alpha_K with their
// aliases, units and the flags that apply), the Provider interface that every quantity implements
// (series around q = 2 and q = infinity, resummation at one q with a
// reference value), and the registry that maps a name to its provider.
//
// The physics lives in the sub-packages: expansion/conformal (h_n, b, S_0:
// exact values and series) and expansion/energy (E_0, alpha_S and log Z as
// series at both ends, from the Schwinger-Dyson equations expanded at
// finite temperature). This package turns their results into one shape:
// big.Float coefficients and values, each with an error, a method string,
// and estimates listed in one order of methods (MethodOrder).
//
// Everything is computed in units script-J = 1; Units (units.go) converts
// results into units J = 1 (ConvertSeries, ConvertResummation,
// ConvertTable) and says where no conversion exists (series around
// q = infinity, whose J-unit factor sqrt(q/2^(q-1)) is essential there).
//
// It may import its sub-packages, numeric and the series tree; nothing in
// them imports it. The command line imports this package and formats what
// it returns, nothing else.
package expansion
