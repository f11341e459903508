package energy

// The soft-mode coefficients alpha_G, alpha_K and alpha_S by two routes.
//
// Conventions (units script-J = 1; PHYSICS.md secs. 3, 4, 7; Maldacena and
// Stanford 2016, arXiv:1604.07818, secs. 3-4; Kitaev and Suh 2018,
// arXiv:1711.08467; the relations below are written from memory and checked
// by the tests, see softmode_test.go):
//
//   - alpha_G is the h = 2 correction to the zero-temperature conformal
//     two-point function, G(tau) = G_c(tau) [1 - alpha_G/(script-J |tau|) + ...],
//     G_c = b sgn(tau)/|J tau|^{2/q}, b^q pi = (1/2 - 1/q) tan(pi/q). The
//     further terms are |tau|^{1-h_n} (h_n > 2 the other roots of
//     k_A(h) = 1) and the products of all these modes.
//   - alpha_K is the first-order shift of the kernel eigenvalue of the
//     h = 2 modes at finite temperature, k(2, n) = 1 - alpha_K |n|/(beta script-J) + ...
//     The correction alpha_G perturbs the kernel, and first-order
//     perturbation theory of its h = 2 eigenvalue gives
//     alpha_K = -q k_A'(2) alpha_G, k_A'(2) = dk_A/dh at h = 2
//     (conformal.KernelASlopeAtTwo).
//   - alpha_S is the coefficient of the Schwarzian action
//     -(N alpha_S/script-J) int Sch(tan(pi f/beta), tau), so that
//     log Z = -beta E_0 + S_0 + 2 pi^2 alpha_S/(beta script-J) + ...; the
//     action follows from the eigenvalue shift with the normalisation
//     alpha_0 = 2 pi q/((q-1)(q-2) tan(pi/q)) of the h = 2 eigenfunctions:
//     alpha_S = alpha_K/(6 q^2 alpha_0).
//
// Checks of the chain: at large q, alpha_G -> 2/q (from
// e^g = 1/(1 + script-J |tau|)^2), k_A'(2) -> -3/2 (k_A -> 2/(h(h-1))),
// alpha_0 -> 2, hence alpha_K -> 3 and alpha_S -> 1/(4 q^2), the large-q
// log Z of PHYSICS.md sec. 5; at q = 4, k_A'(2) = -pi - 2/3 and
// alpha_0 = 4 pi/3, so alpha_S = (pi + 2/3) alpha_G/(32 pi), which the
// finite-temperature fit, a route that uses none of these relations,
// reproduces to its error (about 5e-10).

import (
	"fmt"
	"math"
	"math/big"

	"qbridge/expansion/conformal"
	"qbridge/numeric"
)

// SoftModeRoute is alpha_G, alpha_K and alpha_S by one route, each with its
// error and a method string. The route measures one of them; the other two
// follow through the exact relations (whose conversion factors are exact to
// far below the errors).
type SoftModeRoute struct {
	AlphaG, AlphaGErr float64 // coefficient of -1/(script-J |tau|) in G/G_c - 1, and its error
	AlphaK, AlphaKErr float64 // eigenvalue shift of the h = 2 modes, and its error
	AlphaS, AlphaSErr float64 // Schwarzian coefficient, and its error
	E0, E0Err         float64 // ground-state energy from the same computation, and its error
	// MethodG, MethodK and MethodS say how each number was obtained.
	MethodG, MethodK, MethodS string
}

// SoftModeResult is the soft-mode data at one q by the zero-temperature route
// (alpha_G measured) and the finite-temperature route (alpha_S measured),
// with the exact conversion factors and their agreement.
type SoftModeResult struct {
	Q       float64       // interaction order
	ZeroT   SoftModeRoute // from the T = 0 solution (numeric.SolveZeroTGround)
	FiniteT SoftModeRoute // from the low-temperature ladder (numeric.FitGround on numeric.PrecisionLadder)
	// KSlope is k_A'(2) (conformal.KernelASlopeAtTwo) and Alpha0 the
	// normalisation 2 pi q/((q-1)(q-2) tan(pi/q)), both exact to float64.
	KSlope, Alpha0 float64
	// Agreement is |alpha_S(T = 0) - alpha_S(finite T)| divided by the sum
	// of the two errors: at most 1 when the routes agree within their
	// combined errors.
	Agreement float64
}

// softModeDims is how many operator dimensions h_1.. the fits take.
const softModeDims = 6

// SoftModeConformalData returns the conformal data of the soft-mode fits:
// h_1 .. h_6 (conformal.Dimension) and the exact S_0, rounded to float64.
// It fails for q < 2 and q = infinity; at q = 2 the dimensions are the free
// fermion bilinears 4, 6, 8, ...
func SoftModeConformalData(q float64) (numeric.ConformalData, error) {
	c, err := ConformalData(q)
	if err != nil {
		return c, err
	}
	qp := conformal.QPoint{Q: new(big.Float).SetFloat64(q)}
	for n := 1; n <= softModeDims; n++ {
		h, err := conformal.Dimension(qp, n, conformalDigits)
		if err != nil {
			return c, fmt.Errorf("h_%d at q=%g: %w", n, q, err)
		}
		f, _ := h.Value.Float64()
		c.Dims = append(c.Dims, f)
	}
	return c, nil
}

// softModeFactors returns k_A'(2) and alpha_0 at q.
func softModeFactors(q float64) (kslope, alpha0 float64, err error) {
	qp := conformal.QPoint{Q: new(big.Float).SetFloat64(q)}
	k, err := conformal.KernelASlopeAtTwo(qp, conformalDigits)
	if err != nil {
		return 0, 0, err
	}
	kslope, _ = k.Value.Float64()
	alpha0 = 2 * math.Pi * q / ((q - 1) * (q - 2) * math.Tan(math.Pi/q))
	return kslope, alpha0, nil
}

func checkSoftModeQ(q float64) error {
	if math.IsNaN(q) || math.IsInf(q, 0) || q <= 2 {
		return fmt.Errorf("%w: the soft-mode coefficients need a finite q > 2 (k_A'(2) has a pole at q = 2, and the direct solvers need q > 2; alpha_0(2) = pi^2 is finite), got %g", ErrInput, q)
	}
	return nil
}

// softModeInputs checks q and returns what both routes need: the conformal
// data (h_n for the correction exponents), k_A'(2) and alpha_0.
func softModeInputs(q float64) (c numeric.ConformalData, kslope, alpha0 float64, err error) {
	if err = checkSoftModeQ(q); err != nil {
		return c, 0, 0, err
	}
	if c, err = SoftModeConformalData(q); err != nil {
		return c, 0, 0, err
	}
	kslope, alpha0, err = softModeFactors(q)
	return c, kslope, alpha0, err
}

// SoftModeZeroT is the zero-temperature route at q (2.5 <= q < infinity):
// numeric.SolveZeroTGround with h_1..h_6 from package expansion/conformal
// gives alpha_G (and E_0), and alpha_K = -q k_A'(2) alpha_G,
// alpha_S = alpha_K/(6 q^2 alpha_0). About a second on one core.
func SoftModeZeroT(q float64, progress func(float64, string)) (*SoftModeRoute, error) {
	c, ks, a0, err := softModeInputs(q)
	if err != nil {
		return nil, err
	}
	g, err := numeric.SolveZeroTGround(numeric.ZeroTParams{Q: q, Progress: progress}, c.Dims)
	if err != nil {
		return nil, fmt.Errorf("zero-temperature route at q=%g: %w", q, err)
	}
	kf := -q * ks
	sf := kf / (6 * q * q * a0)
	r := &SoftModeRoute{
		AlphaG: g.AlphaG, AlphaGErr: g.AlphaGErr,
		AlphaK: kf * g.AlphaG, AlphaKErr: kf * g.AlphaGErr,
		AlphaS: sf * g.AlphaG, AlphaSErr: sf * g.AlphaGErr,
		E0: g.E0, E0Err: g.E0Err,
		MethodG: g.Method,
	}
	r.MethodK = fmt.Sprintf("alpha_K = -q k_A'(2) alpha_G, k_A'(2) = %.15g (closed form), alpha_G from the T = 0 route", ks)
	r.MethodS = fmt.Sprintf("alpha_S = alpha_K/(6 q^2 alpha_0), alpha_0 = 2 pi q/((q-1)(q-2) tan(pi/q)) = %.15g, alpha_K from the T = 0 route", a0)
	return r, nil
}

// SoftModeFiniteT is the finite-temperature route at q (> 2): the ladder p
// (numeric.PrecisionLadder when p.Steps is 0), shared through the cache of Ground,
// refitted by numeric.FitGround with the correction exponents of h_1..h_6
// (SoftModeConformalData), gives alpha_S (and E_0); alpha_K = 6 q^2 alpha_0
// alpha_S and alpha_G = alpha_K/(-q k_A'(2)).
func SoftModeFiniteT(p numeric.LadderParams) (*SoftModeRoute, error) {
	q := p.Q
	if err := checkSoftModeQ(q); err != nil {
		return nil, err
	}
	if p.Steps == 0 {
		p = numeric.PrecisionLadder(q, p.Progress)
	}
	c, ks, a0, err := softModeInputs(q)
	if err != nil {
		return nil, err
	}
	lad, err := Ground(p)
	if err != nil {
		return nil, fmt.Errorf("finite-temperature route at q=%g: %w", q, err)
	}
	g, err := numeric.FitGround(q, c, lad.Ladder)
	if err != nil {
		return nil, fmt.Errorf("finite-temperature route at q=%g: %w", q, err)
	}
	kf := 6 * q * q * a0
	gf := kf / (-q * ks)
	r := &SoftModeRoute{
		AlphaS: g.AlphaS, AlphaSErr: g.AlphaSErr,
		AlphaK: kf * g.AlphaS, AlphaKErr: kf * g.AlphaSErr,
		AlphaG: gf * g.AlphaS, AlphaGErr: gf * g.AlphaSErr,
		E0: g.E0, E0Err: g.E0Err,
		MethodS: g.Method,
	}
	r.MethodK = fmt.Sprintf("alpha_K = 6 q^2 alpha_0 alpha_S, alpha_0 = %.15g, alpha_S from the finite-T route", a0)
	r.MethodG = fmt.Sprintf("alpha_G = alpha_K/(-q k_A'(2)), k_A'(2) = %.15g (closed form), alpha_K from the finite-T route", ks)
	return r, nil
}

// SoftMode runs both routes at q (2.5 <= q < infinity; see SoftModeZeroT and
// SoftModeFiniteT with numeric.PrecisionLadder) and reports their agreement. At
// q = 4 it takes about ten seconds on one core, nearly all of it the
// finite-temperature ladder.
func SoftMode(q float64, progress func(float64, string)) (*SoftModeResult, error) {
	if err := checkSoftModeQ(q); err != nil {
		return nil, err
	}
	sub := func(lo, hi float64, what string) func(float64, string) {
		if progress == nil {
			return nil
		}
		return func(f float64, d string) { progress(lo+(hi-lo)*f, what+": "+d) }
	}
	z, err := SoftModeZeroT(q, sub(0, 0.1, "T = 0"))
	if err != nil {
		return nil, err
	}
	f, err := SoftModeFiniteT(numeric.PrecisionLadder(q, sub(0.1, 1, "finite T")))
	if err != nil {
		return nil, err
	}
	ks, a0, err := softModeFactors(q)
	if err != nil {
		return nil, err
	}
	return &SoftModeResult{Q: q, ZeroT: *z, FiniteT: *f, KSlope: ks, Alpha0: a0,
		Agreement: math.Abs(z.AlphaS-f.AlphaS) / (z.AlphaSErr + f.AlphaSErr)}, nil
}
