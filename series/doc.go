// Package series is the truncated power-series type of qbridge and its
// arithmetic: Series (big.Float coefficients with an explicit length and
// precision), sums, products, inverse and quotient, derivative and
// integral, evaluation, composition and reversion, the elementary functions
// of a series (exp, log, pow, sqrt, sin, cos, tan, atan) and ComposeTaylor,
// the one mechanism by which every function of a series is built.
//
// Every Series carries its own length (number of coefficients) and working
// precision in bits; both are set explicitly when a series is made and never
// come from a global. Binary operations return a series whose length is the
// shorter of the two operands and whose precision is the larger.
//
// Products of ten or more terms (Mul and the Horner steps of ComposeTaylor)
// go by Kronecker substitution: both factors in fixed point, packed into
// one big integer each and multiplied once. Each factor keeps at least
// prec + 8 bits in every non-zero coefficient (an exact change of variable
// t -> 2^r t first flattens geometric growth), so every coefficient is as
// accurate as the schoolbook sum.
//
// Functions of a series follow one shape: F(s) is the Taylor expansion of F
// at s(0) composed with the non-constant part s - s(0). So special.LogGamma(s)
// for a series s is the series of log Gamma(s(t)) in t, and callers can write
// implicit equations in series form directly.
//
// The tree below this package is layered, each layer importing only those
// beneath it:
//
//	series/scalar   arbitrary-precision real and complex numbers: elementary
//	                functions, constants, Gamma, psi, zeta and their Taylor
//	                coefficients (no series type)
//	series          this package: the series type and its arithmetic
//	series/special  Gamma/psi functions of a series, pole expansions
//	series/algebra  polynomial roots and linear solves (scalar only)
//	series/pade     Pade, Pade tables, two-point Pade, Froissart doublets
//	series/pslq     integer-relation detection (scalar only)
//
// This package may import series/scalar and the standard library only;
// nothing in the series tree imports the physics packages (expansion,
// numeric) or the command line.
//
// Errors (zero precision, negative length, a log of a non-positive number)
// are returned, never panicked.
package series
