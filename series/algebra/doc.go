// Package algebra holds the arbitrary-precision linear algebra of qbridge:
// all complex roots of a real polynomial (Aberth iteration from
// companion-matrix starts) and the solution of a dense linear system
// (Gaussian elimination with scaled partial pivoting).
//
// Precision is an explicit argument in bits. It may import series/scalar
// (for the Complex type) and gonum; it must not depend on the series type.
package algebra
