// Package pade builds rational approximants of truncated power series:
// the [L/M] Pade approximant with its poles, zeros and Froissart doublets,
// the Pade table with a pole-free selection and a spread-based error
// estimate, and the two-point Pade approximant that matches series around
// two points at once.
//
// Approximants inherit the precision of their series. It may import
// series, series/scalar and series/algebra; it must not depend on the
// physics packages.
package pade
