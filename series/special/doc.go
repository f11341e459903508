// Package special holds functions of a truncated power series built from
// the special functions of package scalar: log Gamma, Gamma, 1/Gamma,
// digamma and polygamma of a series, and the expansions of Gamma and
// 1/Gamma around their poles.
//
// Every function has one shape, F(s) = the Taylor expansion of F at s(0)
// (from package scalar) composed with s - s(0) (series.ComposeTaylor), so
// length and precision come from the argument.
//
// It may import the series and scalar packages; nothing below it may
// import it.
package special
