// Package numeric solves the large-N Schwinger-Dyson equations of the SYK
// model directly, at any real q >= 2 and inverse temperature beta (units
// script-J = 1, J^2 = 2^{q-1}/q), and extracts the low-temperature data
// E_0, S_0 and alpha_S from a ladder of solves.
//
// The solver works on the half interval [0, beta/2] with quarter-wave sine
// transforms, so G(beta - tau) = G(tau) holds exactly. The 1/w and 1/w^3
// tails of G and the jump of Sigma at tau = 0 are carried by models with
// closed-form transforms; the remainder iterates under Anderson acceleration
// with a damping weight that halves whenever the residual grows. Every solve
// runs on nested grids and is Richardson-extrapolated in the grid spacing;
// each number has an error estimate, and E is checked against
// -d log Z/d beta. Non-convergence and NaNs are errors, never numbers.
//
// A cold start solves on a coarse grid (a few points per unit of beta,
// walking up in beta) and refines by doubling the points at fixed beta: grids
// of the same beta share their Matsubara frequencies, so the coarse
// coefficients, zero-padded, start the finer grid within its discretisation
// error and it converges in a few iterations.
//
// Solve does one temperature, Ladder a geometric sequence of temperatures
// with continuation, FitGround the low-temperature fits (one expansion of
// log Z fitted to log Z and E jointly), SolveGround a ladder and its fits
// (GroundLadder gives the default ladder). The fits take what they need of
// the exact conformal data (h_1, and the exact S_0 for comparison) as
// ConformalData from the caller; this package does not compute it.
//
// At zero temperature SolveZeroT solves on a logarithmic grid in tau with
// Mellin-space sine transforms (LogGrid) and SolveZeroTGround extracts
// alpha_G and E_0. SolveZeroTEps runs the same map with every grid value a
// truncated power series in eps = 1 - 2/q around the free point q = 2, order
// by order, and SolveZeroTEpsGround fits all orders of G/G_c - 1 at once
// (FitAlphaGEps, with the exponents of EpsExponents carried as series) to
// give alpha_G and E_0 as eps-series; the eps-series of h_n come from the
// caller. With EpsSeriesParams.Extended the float64 iteration is refined in
// double-double arithmetic (sub-package dd; zerotseriesdd.go is the map,
// zerotkerneldd.go its Mellin weights, zerotrefine.go the refinement), which
// removes the tenfold-per-order growth of float64 round-off;
// SolveZeroTEpsGround always refines.
//
// The package is also the float64 toolkit of the perturbative expansions
// (package expansion/energy): the half-interval sine-transform grid
// HalfGrid (with exact transforms of the jumps at tau = 0, closed-form
// Matsubara tail sums), Richardson extrapolation in the grid spacing,
// FitLinear (weighted least squares with error estimates), MedianSpread
// (robust central value and spread) and Coeffs (numbers with error bars).
package numeric
