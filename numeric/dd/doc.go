// Package dd is double-double arithmetic: a real number held as the
// unevaluated sum Hi + Lo of two float64 values with |Lo| <= ulp(Hi)/2,
// about 106 bits (32 decimal digits) of significand at the speed of a few
// float64 operations, and the pieces the zero-temperature series solver
// needs at that precision: exp, log, sin and cos, complex arithmetic, the
// reciprocal Gamma function of a complex argument and a radix-2 FFT with
// the conventions of gonum's real FFT.
//
// The basic operations are the error-free transformations of Dekker and
// Knuth (two-sum, and two-product by fused multiply-add); see Muller et
// al., Handbook of Floating-Point Arithmetic (2nd ed., 2018), ch. 14. Every
// function is tested against math/big at 200 bits or against
// github.com/ALTree/bigfloat (exp and log), and the special functions
// against DLMF identities.
//
// Values are plain structs passed by value; nothing allocates except the
// FFT's set-up.
package dd
