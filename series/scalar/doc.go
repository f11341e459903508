// Package scalar is the bottom layer of qbridge's arbitrary-precision
// arithmetic: functions of single big.Float and Complex numbers. It holds
// the elementary functions (exp, log, pow, sin, cos, atan) on the hot path
// of the root finders, the constants (pi, log 2, Euler's gamma, zeta(3)),
// the real and complex Gamma family (Gamma, log Gamma, 1/Gamma, digamma,
// polygamma), Hurwitz and Riemann zeta, Bernoulli numbers, and the Taylor
// coefficients of log Gamma, Gamma, 1/Gamma and psi^(m) at a point
// (including the expansions around the poles of Gamma).
//
// Precision is always an explicit argument in bits (1 <= prec <= MaxPrec);
// results are correct to that precision after rounding. Constants are
// cached at the highest precision asked for so far, and the Taylor lists of
// log Gamma at points with short binary expansions (the integers and
// half-integers of the series engines) per point and precision, in this
// package only.
//
// It must not depend on the series type or on any other qbridge package:
// everything else builds on it.
package scalar
