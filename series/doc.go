// Package series is qbridge's arbitrary-precision engine: truncated power
// series with *big.Float coefficients, real and complex special functions
// (Gamma, log Gamma, polygamma, Hurwitz zeta) and their Taylor expansions,
// Pade and two-point Pade approximants, and integer-relation detection (PSLQ).
//
// Every Series carries its own length (number of coefficients) and working
// precision in bits; both are set explicitly when a series is made and never
// come from a global. Binary operations return a series whose length is the
// shorter of the two operands and whose precision is the larger.
//
// Functions of a series follow one shape: F(s) is the Taylor expansion of F
// at s(0) composed with the non-constant part s - s(0). So LogGamma(s) for a
// series s is the series of log Gamma(s(t)) in t, and callers can write
// implicit equations in series form directly.
//
// Errors (zero precision, negative length, a pole, a log of a non-positive
// number, too few coefficients for a Pade) are returned, never panicked.
package series
