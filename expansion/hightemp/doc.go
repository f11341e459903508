// Package hightemp solves the large-N Schwinger-Dyson equations exactly in
// powers of script-J^2, at high temperature, with exact rational arithmetic.
//
// At order t^k, t = (beta script-J)^2, the two-point function on the thermal
// circle (beta = 1) is a polynomial in tau of degree 2k, antiperiodic. Two
// bases make the two operations of the equations cheap:
//
//   - monomials tau^n, where the pointwise products that build
//     Sigma = (t/q) (2G)^(q-1) are polynomial products (the power by
//     J. C. P. Miller's recurrence, so q can be any rational number);
//   - the antiperiodic Euler functions e_n = E_n(tau)/(2 n!), whose
//     Matsubara transforms are (-i w)^-(n+1), so the convolutions of
//     G = G_0 + G_0 * Sigma * G are index sums: e_a * e_b = e_(a+b+1).
//
// Both changes of basis are Toeplitz sums with the Taylor coefficients of
// e^z + 1 and 1/(e^z + 1). The energy comes from the slope at tau = 0+,
// E = G'(0+)/q, and log Z/N = (1/2) log 2 + sum_k a_k t^k with
// a_k = -[tau^1](2G)_k / (4 q k), so nothing is integrated numerically.
//
// Every coefficient a_k is a polynomial in u = 1/q with rational
// coefficients, starting at u^2 and of degree at most k+1 (the recursion
// adds at most one power of u per order and the factors q j - k of the
// power recurrence one power of q). SymbolicLogZ obtains it exactly by
// solving at k+1 integer values of q and interpolating, and checks the
// result at two further values.
//
// From the a_k follow energy, entropy, specific heat, the cumulants of the
// many-body spectral density per fermion, kappa_2k/N = (2k)! a_k, and the
// moments of the density whose cumulants those are (Derived). Radius
// estimates the nearest singularity in the complex t plane from the
// coefficients. Units are script-J = 1 throughout.
package hightemp
