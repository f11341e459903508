// Package energy computes the ground-state energy E_0, the Schwarzian
// coefficient alpha_S and log Z of the large-N SYK model as power series at
// the two solvable ends, q = 2 and q = infinity, with an error bar on every
// coefficient, and resums them.
//
// Around q = 2 the Schwinger-Dyson equations are expanded in delta = q - 2 at
// finite beta (DeltaExpand): at q = 2 the linearised equations are diagonal
// in Matsubara frequency, so every order is an algebraic solve per frequency
// with a source built pointwise in imaginary time by truncated power-series
// arithmetic. Around q = infinity (InvQExpand) G = (1/2) sgn(tau)[1 + g_1/q +
// g_2/q^2 + ...] where g_1 solves Liouville's equation and every further g_k
// a linear equation with the Liouville fluctuation operator, solved with its
// two known zero modes; the non-local part of the source is a product in
// frequency space.
//
// Both run on nested uniform grids and are Richardson-extrapolated in the
// grid spacing. GroundSeries fits the low-temperature form
// log Z = -beta E_0 + S_0 + 2 pi^2 alpha_S/beta + ... order by order over a
// ladder of temperatures; the fitted S_0 coefficients are held against the
// exact zero-temperature entropy (ExactS0Eps, ExactS0InvQ), a test of the
// whole chain. DirectGround and Ground run the direct Schwinger-Dyson solver
// of package numeric on its default low-temperature ladder, with h_1 and the
// exact S_0 from package expansion/conformal, once per q and ladder in a
// process. The float64 machinery (grids, Richardson extrapolation, fits) is
// package numeric's. alpha_K and alpha_G follow from alpha_S by exact
// factors (SoftSeries, with conformal.SoftFactorSeries) and, directly, from
// the zero-temperature route (SoftModeZeroT, cached per q by
// DirectSoftMode). Units are script-J = 1 throughout.
package energy
