// Package claim checks analytic statements about the quantities of package
// expansion order by order. A claim is an equation in ordinary infix
// notation,
//
//	h_1 = 4 - (5/6)*eps^2 + O(eps^4)
//	alpha_S = 1/(4*q^2) + O(1/q^3)
//
// read by a small recursive-descent parser (Parse) that names the column of
// every fault. Both sides are expanded as truncated Laurent series around one
// end of the q axis (eps = 1 - 2/q around q = 2, x = 1/q around q =
// infinity), every coefficient with an absolute error bound propagated from
// the quantities' own errors through each operation (Laurent); the
// difference LHS - RHS is then compared with zero coefficient by coefficient
// (Evaluator.Check). Evaluator.At evaluates both sides at one finite q
// instead, from exact values where they exist and from the two-point Pade
// resummation otherwise.
//
// # Grammar
//
//	claim   = sum "=" sum
//	sum     = product { ("+" | "-") product }
//	product = unary { ("*" | "/") unary }
//	unary   = ("-" | "+") unary | power
//	power   = primary [ "^" unary ]          (right-associative: -x^2 = -(x^2))
//	primary = number | name | name "(" sum ")" | "(" sum ")"
//
// Numbers are integers or decimals (5, 0.25, 1e-3), read exactly as
// rationals, so 5/6 is the rational five sixths. Multiplication is always
// written with "*". Names are the variables q, eps and x (each usable around
// either end: around q = 2, q = 2/(1-eps) and x = (1-eps)/2; around q =
// infinity, q = 1/x and eps = 1 - 2x), the constant pi, the quantities of
// expansion.ParseName (h_1, h_2, ..., b, S_0, E_0, alpha_S and their
// aliases, without regard to case or underscores), and the functions sqrt,
// exp, log, sin, cos, tan, Gamma, psi (digamma), zeta(n) for an integer
// n >= 2, and the order term O(...).
//
// # The order term
//
// O(eps^k), O(x^k) or O(1/q^k) (also O(q^-k), and O(1) for the constant
// order) may stand as a term of the sum on either side. It names the end the
// claim is made at and the order it is made to: the coefficients of t^j with
// j < k are compared, t the expansion variable.
//
// # Errors
//
// Exact inputs (numbers, pi, zeta, the variables) carry no error beyond the
// rounding of the working precision; the coefficients of h_n, b and S_0
// carry the difference of two working precisions, those of E_0 and alpha_S
// the errors of their low-temperature fits. Sums add the error bounds;
// products use |d(fg)| <= |f||dg| + |df||g| + |df||dg| coefficient-wise on
// series of absolute values; quotients and functions propagate to first
// order through the derivative series (d(f/g) = (df - (f/g) dg)/g,
// dF(f) = F'(f) df). Every operation adds its own rounding bound.
//
// A fault of the claim (syntax, an unknown name, a division by a series that
// vanishes within its error, a log of a series whose leading term is not
// positive, a pole where a function needs a power series) is an *Error;
// a quantity that cannot be expanded as far as the claim needs returns the
// provider's error, which wraps expansion.ErrInput when the request was out
// of range.
package claim
