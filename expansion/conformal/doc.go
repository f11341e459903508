// Package conformal computes the conformal data of the large-N SYK model
// exactly and as series at both ends of the q axis: the operator
// dimensions h_n (roots of k_A(h) = 1), the coefficient b of the conformal
// two-point function and the zero-temperature entropy S_0. Exact values
// come from root finding at full precision (h_n) and from closed forms (b,
// S_0 through the Clausen function); series around q = 2 (in eps = 1 - 2/q)
// and q = infinity (in x = 1/q) come from Newton's iteration on whole
// series with the colliding pole and zero of k_A cancelled analytically.
// It also resums them (partial sums, Pade, two-point Pade), identifies
// closed forms of coefficients (PSLQ) and holds the published check values.
// The kernel slope k_A'(2) and the exact factor series that turn alpha_S
// into alpha_K and alpha_G (SoftFactorSeries) live here too.
//
// Every number carries an error estimate (the difference of two working
// precisions) and a method string. Precision is asked for in decimal
// digits at this level and converted to bits inside.
//
// It may import the series tree only; the command line reaches it through
// package expansion.
package conformal
