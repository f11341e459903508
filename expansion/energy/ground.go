package energy

import (
	"errors"
	"fmt"
	"math"
	"math/big"
)

// GroundParams selects a low-temperature extraction: the finite-beta
// series on a geometric ladder of Steps temperatures from BetaMin to
// BetaMax, fitted order by order.
type GroundParams struct {
	Order            int     // highest order of the series
	BetaMin, BetaMax float64 // 0 means the defaults of each expansion
	Steps            int     // 0 means the default of each expansion
	// Progress, when not nil, receives the fraction done and a short status.
	Progress func(frac float64, detail string)
}

// GroundSeries holds E_0, S_0 and alpha_S as series in Variable, each
// coefficient with an error bar, the exact S_0 coefficients for comparison,
// and the finite-beta series they were fitted from.
type GroundSeries struct {
	Variable          string        // VarDelta, VarEps or VarX
	E0, S0, AlphaS    Coeffs        // the fitted series
	S0Exact           []float64     // exact S_0 coefficients (Kitaev's formula)
	Ladder            []*FiniteBeta // the finite-beta series, in increasing beta
	BetaMin, BetaMax  float64       // range of the ladder
	FitsPerOrder      []int         // accepted fits per order
	TotalFitsPerOrder []int         // fits tried per order
	// E0Route and AlphaSRoute say, per coefficient, which route gave it:
	// RouteLadder (the low-temperature fits) or RouteZeroT (the
	// zero-temperature eps-series, EpsZeroT), whichever states the smaller
	// error; ZeroTMethod describes the latter whenever it ran, and
	// ZeroTFailure says why it is missing when it ran and failed.
	E0Route, AlphaSRoute []string
	ZeroTMethod          string
	ZeroTFailure         string
	// LadderE0 and LadderAlphaS keep the ladder's own coefficients when
	// the zero-temperature route was merged in (not kept by the cache).
	LadderE0, LadderAlphaS Coeffs
	ZeroT                  *ZeroTEps
	// ZeroTAlphaG is alpha_G's eps-series from the zero-temperature route
	// when it ran (empty otherwise; kept by the cache): the alpha_G and
	// alpha_K series take it where it is the more accurate.
	ZeroTAlphaG Coeffs
	// LadderOrders is how many orders the ladder's fits reached (all of
	// them unless the fits failed and the zero-temperature route supplied
	// the rest; S_0 then has only the fitted orders).
	LadderOrders int
}

// Routes of a ground-series coefficient.
const (
	RouteLadder = "finite-T ladder"
	RouteZeroT  = "T = 0 eps-series"
	// RouteLiouville is the exact order-1/q^2 thermodynamics
	// (LiouvilleExpansion).
	RouteLiouville = "Liouville closed form"
)

// MaxZeroTEpsOrder is the highest order of the zero-temperature
// eps-series that EpsGround merges in: beyond it the float64 coefficients
// carry no digits the ladder lacks.
const MaxZeroTEpsOrder = 14

// S0Deviation returns, per order, (fitted - exact)/error of S_0: the
// built-in test of the whole chain (grid, Richardson, fits).
func (g *GroundSeries) S0Deviation() []float64 {
	out := make([]float64, g.S0.Len())
	for k := range out {
		out[k] = (g.S0.Values[k] - g.S0Exact[k]) / g.S0.Errors[k]
	}
	return out
}

// Defaults of the q = 2 ladder.
const (
	DefaultDeltaBetaMin = 50
	DefaultDeltaBetaMax = 6400
	DefaultDeltaSteps   = 15
)

func (p *GroundParams) fill(bmin, bmax float64, steps int) error {
	if p.BetaMin == 0 {
		p.BetaMin = bmin
	}
	if p.BetaMax == 0 {
		p.BetaMax = bmax
	}
	if p.Steps == 0 {
		p.Steps = steps
	}
	switch {
	case p.Order < 0:
		return fmt.Errorf("%w: order must be >= 0, got %d", ErrInput, p.Order)
	case !(p.BetaMin > 0) || !(p.BetaMax > p.BetaMin) || math.IsInf(p.BetaMax, 0):
		return fmt.Errorf("%w: need 0 < beta-min < beta-max < infinity, got %g, %g", ErrInput, p.BetaMin, p.BetaMax)
	case p.Steps < 8:
		return fmt.Errorf("%w: the low-temperature fits need at least 8 temperatures, got %d", ErrInput, p.Steps)
	}
	return nil
}

func (p *GroundParams) betas() []float64 {
	b := make([]float64, p.Steps)
	for i := range b {
		b[i] = p.BetaMin * math.Pow(p.BetaMax/p.BetaMin, float64(i)/float64(p.Steps-1))
	}
	return b
}

// deltaCorrections lists the corrections to log Z at order k of the q = 2
// expansion, most important first. The first non-soft operator has
// h_1 -> 4 at q = 2 and contributes beta^{-(h_1-2)}, i.e. beta^{-2}
// (log beta)^j at order k with j < k (its amplitude vanishes at q = 2, where
// the free fermion's E - E_0 has only even powers of T: Sommerfeld with an
// even density of states); then beta^{-3} and beta^{-4} with up to k logs.
func deltaCorrections(k int) []corrTerm {
	var t []corrTerm
	for j := 0; j < k; j++ {
		t = append(t, corrTerm{2, j})
	}
	for _, p := range []float64{3, 4} {
		for j := 0; j <= k; j++ {
			t = append(t, corrTerm{p, j})
		}
	}
	return t
}

// runLadder evaluates expand at every beta of the ladder (betas), in
// increasing beta, reporting progress with the work taken proportional to
// beta.
func (p *GroundParams) runLadder(expand func(beta float64) (*FiniteBeta, error)) ([]*FiniteBeta, error) {
	betas := p.betas()
	var work, done float64
	for _, b := range betas {
		work += b
	}
	ladder := make([]*FiniteBeta, len(betas))
	for i, b := range betas {
		if p.Progress != nil {
			p.Progress(done/work, fmt.Sprintf("beta %.4g (%d/%d)", b, i+1, len(betas)))
		}
		f, err := expand(b)
		if err != nil {
			return nil, fmt.Errorf("ladder step beta=%g: %w", b, err)
		}
		ladder[i] = f
		done += b
	}
	if p.Progress != nil {
		p.Progress(1, "fits")
	}
	return ladder, nil
}

// DeltaGround expands log Z and E in delta = q - 2 on a ladder of
// temperatures (DeltaExpand) and fits, order by order,
// log Z_k = -beta E_{0,k} + S_{0,k} + 2 pi^2 alpha_{S,k}/beta + corrections
// to E_k and S_k = log Z_k + beta E_k jointly. The result is in delta.
func DeltaGround(p GroundParams) (*GroundSeries, error) { return groundAroundTwo(p, false) }

// EpsGround is DeltaGround with the finite-beta series converted to
// eps = 1 - 2/q on every grid, so that the error bars come from the
// Richardson extrapolation and the fits of the eps-coefficients themselves
// (converting error bars of delta-coefficients would add them up with the
// binomial weights of the substitution, a gross overestimate).
func EpsGround(p GroundParams) (*GroundSeries, error) { return groundAroundTwo(p, true) }

func groundAroundTwo(p GroundParams, eps bool) (*GroundSeries, error) {
	if err := p.fill(DefaultDeltaBetaMin, DefaultDeltaBetaMax, DefaultDeltaSteps); err != nil {
		return nil, err
	}
	if p.Order > MaxDeltaOrder {
		return nil, fmt.Errorf("%w: order %d is above the maximum %d of the q = 2 expansion", ErrOrder, p.Order, MaxDeltaOrder)
	}
	v := VarDelta
	if eps {
		v = VarEps
	}
	// Progress: around q = 2 in eps the ladder is the first half of the
	// work, the zero-temperature eps-series the second.
	progress := p.Progress
	lp := p
	if eps && progress != nil {
		lp.Progress = func(f float64, d string) { progress(f/2, d) }
	}
	ladder, err := lp.runLadder(func(b float64) (*FiniteBeta, error) {
		return DeltaExpand(DeltaParams{Beta: b, Order: p.Order, Variable: v})
	})
	if err != nil {
		return nil, err
	}
	g, err := groundFromLadder(ladder, deltaCorrections)
	var lf *LadderFitError
	switch {
	case err == nil:
	case eps && errors.As(err, &lf) && lf.Order >= 1 && p.Order+1 <= MaxZeroTEpsOrder:
		// The zero-temperature eps-series supplies the orders the fits
		// could not; S_0 keeps only its fitted orders.
	default:
		if lf != nil && eps && lf.Order >= 1 {
			return nil, fmt.Errorf("%w (the zero-temperature eps-series, which could complete it, reaches E_0 to order %d and alpha_S to order %d)", err, MaxZeroTEpsOrder, MaxZeroTEpsOrder-1)
		}
		return nil, err
	}
	ladderErr := err
	g.Variable = VarDelta
	exact := ExactS0Delta
	if eps {
		g.Variable = VarEps
		exact = ExactS0Eps
	}
	g.S0Exact, err = floats(exact(p.Order, 128))
	if err != nil {
		return nil, err
	}
	g.E0Route = routes(p.Order+1, RouteLadder)
	g.AlphaSRoute = routes(p.Order+1, RouteLadder)
	if eps {
		var zp func(float64, string)
		if progress != nil {
			zp = func(f float64, d string) { progress(0.5+f/2, d) }
		}
		z, err := EpsZeroT(min(p.Order+1, MaxZeroTEpsOrder), zp)
		if err != nil {
			if g.LadderOrders <= p.Order {
				return nil, fmt.Errorf("%v; the zero-temperature eps-series that would complete the series failed: %w", ladderErr, err)
			}
			// The ladder's series stands; say why the other route is missing.
			g.ZeroTFailure = err.Error()
			return g, nil
		}
		if progress != nil {
			progress(1, "done")
		}
		// Orders the fits did not reach count as unknown on the ladder.
		for k := g.LadderOrders; k <= p.Order; k++ {
			g.E0.Errors[k], g.AlphaS.Errors[k] = math.Inf(1), math.Inf(1)
		}
		g.S0 = Coeffs{Values: g.S0.Values[:g.LadderOrders], Errors: g.S0.Errors[:g.LadderOrders]}
		g.mergeZeroT(z)
	}
	return g, nil
}

func routes(n int, r string) []string {
	out := make([]string, n)
	for i := range out {
		out[i] = r
	}
	return out
}

// mergeZeroT takes, per coefficient of E_0 and alpha_S, the
// zero-temperature value where its stated error is the smaller.
func (g *GroundSeries) mergeZeroT(z *ZeroTEps) {
	g.LadderE0, g.LadderAlphaS, g.ZeroT = cloneCoeffs(g.E0), cloneCoeffs(g.AlphaS), z
	g.ZeroTAlphaG = cloneCoeffs(z.AlphaG)
	if g.ZeroTMethod == "" {
		g.ZeroTMethod = z.Method
	}
	take := func(dst *Coeffs, src Coeffs, route []string) {
		for l := 0; l < dst.Len() && l < src.Len(); l++ {
			if src.Errors[l] < dst.Errors[l] {
				dst.Values[l], dst.Errors[l] = src.Values[l], src.Errors[l]
				route[l] = RouteZeroT
			}
		}
	}
	take(&g.E0, z.E0, g.E0Route)
	take(&g.AlphaS, z.AlphaS, g.AlphaSRoute)
}

// groundFromLadder fits every order of the ladder's series.
func groundFromLadder(ladder []*FiniteBeta, corr func(k int) []corrTerm) (*GroundSeries, error) {
	return groundFromLadderFrom(ladder, corr, 0)
}

// groundFromLadderFrom fits the orders from first on; lower orders are left
// zero with zero error (they are exact and set by the caller).
func groundFromLadderFrom(ladder []*FiniteBeta, corr func(k int) []corrTerm, first int) (*GroundSeries, error) {
	n := ladder[0].E.Len()
	g := &GroundSeries{Ladder: ladder, BetaMin: ladder[0].Beta, BetaMax: ladder[len(ladder)-1].Beta}
	for _, c := range []*Coeffs{&g.E0, &g.S0, &g.AlphaS} {
		c.Values = make([]float64, n)
		c.Errors = make([]float64, n)
	}
	m := len(ladder)
	beta := make([]float64, m)
	e, ee, s, se := make([]float64, m), make([]float64, m), make([]float64, m), make([]float64, m)
	for k := 0; k < first; k++ {
		g.FitsPerOrder = append(g.FitsPerOrder, 0)
		g.TotalFitsPerOrder = append(g.TotalFitsPerOrder, 0)
	}
	for k := first; k < n; k++ {
		for i, f := range ladder {
			b := f.Beta
			beta[i] = b
			e[i] = f.E.Values[k]
			s[i] = f.LogZ.Values[k] + b*e[i]
			// Floors keep the weights finite when an error estimate vanishes.
			ee[i] = f.E.Errors[k] + 1e-15*(1+math.Abs(e[i]))
			se[i] = f.LogZ.Errors[k] + b*f.E.Errors[k] + 1e-14*(1+math.Abs(f.LogZ.Values[k]))
		}
		est, err := extractLowT(beta, e, ee, s, se, corr(k), max(8, m/2))
		if err != nil {
			// The fitted orders are kept: the caller may complete the
			// series from another route.
			g.LadderOrders = k
			return g, &LadderFitError{Order: k, Err: err}
		}
		g.E0.Values[k], g.E0.Errors[k] = est.E0, est.E0Err
		g.S0.Values[k], g.S0.Errors[k] = est.S0, est.S0Err
		g.AlphaS.Values[k], g.AlphaS.Errors[k] = est.AlphaS, est.AlphaSErr
		acc := 0
		for _, f := range est.Fits {
			if f.Accepted {
				acc++
			}
		}
		g.FitsPerOrder = append(g.FitsPerOrder, acc)
		g.TotalFitsPerOrder = append(g.TotalFitsPerOrder, len(est.Fits))
	}
	g.LadderOrders = n
	return g, nil
}

// LadderFitError is the failure of the low-temperature fits at one order
// of a ladder; the orders below were fitted.
type LadderFitError struct {
	Order int
	Err   error
}

func (e *LadderFitError) Error() string { return fmt.Sprintf("order %d: %v", e.Order, e.Err) }
func (e *LadderFitError) Unwrap() error { return e.Err }

// Defaults of the q = infinity ladder.
const (
	DefaultInvQBetaMin = 100
	DefaultInvQBetaMax = 6400
	DefaultInvQSteps   = 13
	// invQPointsPerBeta: the higher orders of the 1/q expansion need a finer
	// grid than the q = 2 expansion for the same accuracy.
	invQPointsPerBeta = 64
)

// invQCorrections lists the corrections to log Z at every order of the 1/q
// expansion: powers beta^{-2} ... beta^{-8}. At large q the operator
// dimensions tend to odd integers, h_n -> 2n + 1, so the non-Schwarzian
// corrections are integer powers at leading order; the fitted S_0 at every
// order reproducing the exact series is the check that no log(beta) terms
// are missed at the orders computed.
func invQCorrections(int) []corrTerm {
	var t []corrTerm
	for p := 2.0; p <= 8; p++ {
		t = append(t, corrTerm{p, 0})
	}
	return t
}

// InvQGround expands log Z and E in x = 1/q on a ladder of temperatures
// (InvQExpand) and fits every order k >= 2 like DeltaGround. The
// coefficients of x^0 and x^1 are exact: E_0 = 0, 0; S_0 = (1/2) log 2, 0;
// alpha_S = 0, 0.
func InvQGround(p GroundParams) (*GroundSeries, error) {
	if err := p.fill(DefaultInvQBetaMin, DefaultInvQBetaMax, DefaultInvQSteps); err != nil {
		return nil, err
	}
	if p.Order < 2 || p.Order > MaxInvQOrder {
		return nil, fmt.Errorf("%w: the 1/q expansion takes orders 2..%d, got %d", ErrOrder, MaxInvQOrder, p.Order)
	}
	ladder, err := p.runLadder(func(b float64) (*FiniteBeta, error) {
		n := 256
		for float64(n) < invQPointsPerBeta*b && n < MaxGridPoints {
			n *= 2
		}
		return InvQExpand(InvQParams{Beta: b, Order: p.Order, Points: n})
	})
	if err != nil {
		return nil, err
	}
	g, err := groundFromLadderFrom(ladder, invQCorrections, 2)
	if err != nil {
		return nil, err
	}
	g.Variable = VarX
	g.S0.Values[0] = 0.5 * math.Ln2
	g.S0Exact, err = floats(ExactS0InvQ(p.Order, 128))
	if err != nil {
		return nil, err
	}
	g.E0Route = routes(p.Order+1, RouteLadder)
	g.AlphaSRoute = routes(p.Order+1, RouteLadder)
	if err := g.mergeLiouville(); err != nil {
		return nil, err
	}
	return g, nil
}

// mergeLiouville replaces the x^2 coefficients of E_0 and alpha_S by the
// exact order-1/q^2 thermodynamics (the ladder's values stay in LadderE0
// and LadderAlphaS, and its S_0 remains the check of the fits). The exact
// values are computed at 128 bits; their only error is the float64
// rounding, stated as one ulp.
func (g *GroundSeries) mergeLiouville() error {
	l, err := LiouvilleExpansion(3, 128)
	if err != nil {
		return err
	}
	g.LadderE0, g.LadderAlphaS = cloneCoeffs(g.E0), cloneCoeffs(g.AlphaS)
	for _, c := range []struct {
		dst   *Coeffs
		v     *big.Float
		route []string
	}{{&g.E0, l.E0, g.E0Route}, {&g.AlphaS, l.AlphaS, g.AlphaSRoute}} {
		v, _ := c.v.Float64()
		c.dst.Values[2], c.dst.Errors[2] = v, ulp(v)
		c.route[2] = RouteLiouville
	}
	return nil
}

// ulp is the spacing of float64 numbers at v: the rounding error bound of
// a value computed in higher precision and rounded to float64.
func ulp(v float64) float64 {
	a := math.Abs(v)
	return math.Nextafter(a, math.Inf(1)) - a
}

// cloneCoeffs returns an independent copy of c.
func cloneCoeffs(c Coeffs) Coeffs {
	return Coeffs{Values: append([]float64(nil), c.Values...), Errors: append([]float64(nil), c.Errors...)}
}
