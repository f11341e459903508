package expansion

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"strings"

	"qbridge/expansion/conformal"
	"qbridge/expansion/energy"
	"qbridge/expansion/hightemp"
	"qbridge/series/scalar"
)

// energyProvider serves E_0, alpha_S, alpha_G and alpha_K from package
// energy.
type energyProvider struct {
	q    Quantity
	kind string // energy.QuantityE0, QuantityAlphaS, QuantityAlphaG or QuantityAlphaK
}

// soft reports alpha_G or alpha_K, served from the alpha_S series times
// exact factors (energy.SoftSeries) and from the zero-temperature route.
func (p energyProvider) soft() bool {
	return p.kind == energy.QuantityAlphaG || p.kind == energy.QuantityAlphaK
}

// logZProvider serves log Z (and E) at one inverse temperature.
type logZProvider struct{ q Quantity }

func init() {
	register(energyProvider{Quantity{Name: E0, Aliases: []string{"e0"}, Unit: "script-J", Scaling: ScaleEnergy,
		Summary: "ground-state energy per Majorana fermion"}, energy.QuantityE0})
	register(energyProvider{Quantity{Name: AlphaS, Aliases: []string{"alpha", "alphas"}, Unit: "1 (action N alpha_S/script-J)", Scaling: ScaleInverseEnergy,
		Summary: "Schwarzian (soft-mode) coefficient: E = E_0 + 2 pi^2 alpha_S T^2 + ..."}, energy.QuantityAlphaS})
	register(energyProvider{Quantity{Name: AlphaG, Aliases: []string{"alphag"}, Unit: "1 (G/G_c = 1 - alpha_G/(script-J |tau|) + ...)", Scaling: ScaleInverseEnergy,
		Summary: "T = 0 soft-mode correction: G = G_c [1 - alpha_G/(script-J |tau|) + ...]; alpha_K = -q k_A'(2) alpha_G"}, energy.QuantityAlphaG})
	register(energyProvider{Quantity{Name: AlphaK, Aliases: []string{"alphak"}, Unit: "1 (k(2,n) = 1 - alpha_K |n|/(beta script-J) + ...)", Scaling: ScaleInverseEnergy,
		Summary: "finite-T shift of the h = 2 kernel eigenvalue: k(2, n) = 1 - alpha_K |n|/(beta script-J); alpha_S = alpha_K/(6 q^2 alpha_0)"}, energy.QuantityAlphaK})
	register(logZProvider{Quantity{Name: LogZ, Aliases: []string{"logz", "log z"}, Unit: "1 (per Majorana fermion)", NeedsBeta: true,
		Summary: "log Z per Majorana fermion at inverse temperature beta (with E beside it)"}})
}

// Orders used by resum and report: the q = 2 side is cheap, the 1/q side
// costs order^3 per grid point, so it is capped lower.
const (
	energyResumMaxEps = 10
	energyResumMaxX   = 8
	energyResumMinX   = 3
	energyResumMinEps = 2
	// MaxBeta is the largest beta*script-J of a log Z series.
	MaxBeta = 1e5
	// MaxEnergyOrderEps and MaxEnergyOrderX are the highest orders of the
	// E_0, alpha_S and log Z series around q = 2 and q = infinity.
	MaxEnergyOrderEps = energy.MaxDeltaOrder
	MaxEnergyOrderX   = energy.MaxInvQOrder
)

// inputErr marks errors of energy caused by the request as ErrInput.
func inputErr(err error) error {
	if errors.Is(err, energy.ErrInput) || errors.Is(err, energy.ErrOrder) {
		return fmt.Errorf("%w: %v", ErrInput, err)
	}
	return err
}

func checkEnergyOrder(end conformal.End, order int) error {
	if end == conformal.AroundTwo {
		if order < 0 || order > energy.MaxDeltaOrder {
			return fmt.Errorf("%w: order %d: the q = 2 expansion takes orders 0..%d (the per-order cost and memory, order x grid points, set the limit)", ErrInput, order, energy.MaxDeltaOrder)
		}
		return nil
	}
	if order < 2 || order > energy.MaxInvQOrder {
		return fmt.Errorf("%w: order %d: the 1/q expansion takes orders 2..%d (orders 0 and 1 are trivial; above %d the order^3 cost of the local source per grid point sets the limit)", ErrInput, order, energy.MaxInvQOrder, energy.MaxInvQOrder)
	}
	return nil
}

// bigs converts float64 values to big.Float.
func bigs(v []float64) []*big.Float {
	out := make([]*big.Float, len(v))
	for i, x := range v {
		out[i] = big.NewFloat(x)
	}
	return out
}

// ground returns the ground series at one end, once per process (resum and
// report use both ends for several quantities): the memo the table and
// approximants use, without the on-disk cache.
func ground(end conformal.End, order int, progress func(float64, string)) (*energy.GroundSeries, error) {
	g, _, err := groundSeries(nil, end, order, progress)
	return g, err
}

func (p energyProvider) Quantity() Quantity { return p.q }

func (p energyProvider) check(r Request) error {
	if r.Set["beta"] {
		return fmt.Errorf("%w: --beta applies to the logZ series only: %s is a zero-temperature quantity", ErrInput, p.q.Name)
	}
	if r.Set["n"] {
		return fmt.Errorf("%w: --n does not apply to %s (only to the dimensions h_n)", ErrInput, p.q.Name)
	}
	return nil
}

func (p energyProvider) Series(r Request) (*SeriesResult, error) {
	if err := p.check(r); err != nil {
		return nil, err
	}
	if p.soft() {
		return p.softSeries(r)
	}
	if err := checkEnergyOrder(r.End, r.Order); err != nil {
		return nil, err
	}
	g, err := ground(r.End, r.Order, r.Progress)
	if err != nil {
		return nil, err
	}
	c := g.E0
	if p.kind == energy.QuantityAlphaS {
		c = g.AlphaS
	}
	route := g.E0Route
	if p.kind == energy.QuantityAlphaS {
		route = g.AlphaSRoute
	}
	notes, method := groundNotes(r.End, g, route)
	coeffs := &conformal.Coefficients{Quantity: p.q.Name, End: r.End, N: -1, Values: bigs(c.Values), Errors: bigs(c.Errors), Method: method, Prec: 53}
	return &SeriesResult{
		Parts: []*conformal.Coefficients{coeffs},
		Check: &SeriesCheck{Name: S0, Fitted: bigs(g.S0.Values), FittedErr: bigs(g.S0.Errors), Exact: bigs(g.S0Exact)},
		Notes: notes,
	}, nil
}

// Orders of the alpha_G and alpha_K series: those the alpha_S series
// supports (energy.SoftAlphaSOrder): around q = 2 alpha_K to
// MaxEnergyOrderEps and alpha_G one further; around q = infinity, where
// alpha_S starts at x^2, alpha_K to MaxEnergyOrderX - 2 and alpha_G to
// MaxEnergyOrderX - 1.
func softMaxOrder(kind string, end conformal.End) int {
	g := 0
	if kind == energy.QuantityAlphaG {
		g = 1
	}
	if end == conformal.AroundTwo {
		return MaxEnergyOrderEps + g
	}
	return MaxEnergyOrderX - 2 + g
}

// softSeries is Series for alpha_G and alpha_K: the alpha_S ground series
// of the order they need times the exact factor series.
func (p energyProvider) softSeries(r Request) (*SeriesResult, error) {
	hi := softMaxOrder(p.kind, r.End)
	if r.Order < 0 || r.Order > hi {
		return nil, fmt.Errorf("%w: order %d: the %s series around q = %s takes orders 0..%d (those the alpha_S series supports: alpha_S to order %d)",
			ErrInput, r.Order, p.q.Name, r.End, hi, map[bool]int{true: MaxEnergyOrderEps, false: MaxEnergyOrderX}[r.End == conformal.AroundTwo])
	}
	variable := energy.VarEps
	if r.End == conformal.AroundInf {
		variable = energy.VarX
	}
	so, err := energy.SoftAlphaSOrder(p.kind, variable, r.Order)
	if err != nil {
		return nil, inputErr(err)
	}
	g, err := ground(r.End, so, r.Progress)
	if err != nil {
		return nil, err
	}
	c, err := energy.SoftSeries(p.kind, variable, g.AlphaS)
	if err != nil {
		return nil, inputErr(err)
	}
	if c.Len() < r.Order+1 {
		return nil, fmt.Errorf("%s around q = %s: %d coefficients from the alpha_S series of order %d, %d needed", p.q.Name, r.End, c.Len(), so, r.Order+1)
	}
	c = energy.Coeffs{Values: c.Values[:r.Order+1], Errors: c.Errors[:r.Order+1]}
	notes, fit := groundNotes(r.End, g, g.AlphaSRoute)
	// Around q = 2 the zero-temperature route measures alpha_G itself: per
	// coefficient, the direct product (alpha_G, or -q k_A'(2) alpha_G) where
	// its error is the smaller.
	var direct []string
	if r.End == conformal.AroundTwo {
		var took []int
		if c, took, err = energy.MergeDirectAlphaG(p.kind, c, g.ZeroTAlphaG); err != nil {
			return nil, inputErr(err)
		}
		for _, k := range took {
			direct = append(direct, fmt.Sprint(k))
		}
	}
	factor := map[string]string{
		energy.QuantityAlphaK: "F_K = 6 q^2 alpha_0, alpha_0 = 2 pi q/((q-1)(q-2) tan(pi/q))",
		energy.QuantityAlphaG: "F_G = 6 q^2 alpha_0/(-q k_A'(2)), k_A'(2) in closed form",
	}[p.kind]
	method := fmt.Sprintf("alpha_S series to order %d times the exact series of %s (conformal.SoftFactorSeries; errors: the alpha_S errors propagated, sum_j |f_j| err_(k-j)); alpha_S from %s", so, factor, fit)
	if len(direct) > 0 {
		what := "the zero-temperature alpha_G eps-series itself"
		if p.kind == energy.QuantityAlphaK {
			what = "-q k_A'(2) times the zero-temperature alpha_G eps-series (one exact factor series, errors sum_j |r_j| err_(k-j))"
		}
		if len(direct) == c.Len() {
			method = "all orders: " + what
		} else {
			method = fmt.Sprintf("orders %s: %s; the others: %s", strings.Join(direct, ","), what, method)
		}
	}
	if r.End == conformal.AroundTwo {
		notes = append(notes, "F_K and F_G are analytic at q = 2 in eps: alpha_0(2) = pi^2 is finite (the zero of 1/tan(pi/q) cancels the pole of 1/(q-2)) and k_A'(2) has a simple pole, so F_K(2) = 24 pi^2 (alpha_K(2) = pi) and F_G = 6 pi^2 eps + O(eps^2) (alpha_G(2) = 0, its constant term an exact zero).")
	} else {
		notes = append(notes, "around q = infinity the series of x^2 F_K -> 12 and x F_G -> 8 multiply alpha_S/x^2 -> 1/4: alpha_K -> 3, alpha_G -> 2/q (MS 2016 sec. 4).")
	}
	coeffs := &conformal.Coefficients{Quantity: p.q.Name, End: r.End, N: -1, Values: bigs(c.Values), Errors: bigs(c.Errors), Method: method, Prec: 53}
	return &SeriesResult{
		Parts: []*conformal.Coefficients{coeffs},
		Check: &SeriesCheck{Name: S0, Fitted: bigs(g.S0.Values), FittedErr: bigs(g.S0.Errors), Exact: bigs(g.S0Exact)},
		Notes: notes,
	}, nil
}

// groundNotes are the notes of a ground series and the method of the
// coefficients whose routes are given (g.E0Route or g.AlphaSRoute).
func groundNotes(end conformal.End, g *energy.GroundSeries, route []string) ([]string, string) {
	var notes []string
	if end == conformal.AroundTwo {
		notes = append(notes, "Perturbation theory of the SD equations in delta = q - 2 at finite beta (per-frequency algebraic solves, sources by pointwise series arithmetic), converted to eps by delta = 2 eps/(1-eps) on every grid, Richardson-extrapolated in the grid spacing.")
	} else {
		notes = append(notes, "G = (1/2) sgn(tau)[1 + g_1/q + ...]: g_1 the Liouville solution, each g_k from Liouville's fluctuation operator with local and non-local sources, at finite beta, Richardson-extrapolated in the grid spacing.")
	}
	ladder := fmt.Sprintf("low-temperature fits of log Z_k = -beta E_0k + S_0k + 2 pi^2 alpha_Sk/beta + corrections over %d temperatures, beta = %.4g..%.4g; errors = spread over fit windows and models + propagated data errors", len(g.Ladder), g.BetaMin, g.BetaMax)
	notes = append(notes, ladder+".", "log Z is evaluated from the converged G and Sigma at every order (the stationarity of log Z is not used).")
	var zt, lv, fit []string
	for k, r := range route {
		switch r {
		case energy.RouteZeroT:
			zt = append(zt, fmt.Sprint(k))
		case energy.RouteLiouville:
			lv = append(lv, fmt.Sprint(k))
		default:
			fit = append(fit, fmt.Sprint(k))
		}
	}
	if len(lv) > 0 {
		notes = append(notes, fmt.Sprintf("Order %s comes from the exact order-1/q^2 thermodynamics (%s); the ladder's own fit of it is the check of the fits, with S_0 against the exact series.", strings.Join(lv, ","), energy.LiouvilleMethod))
	}
	if len(zt) == 0 {
		if g.ZeroTFailure != "" {
			notes = append(notes, "The zero-temperature eps-series, which would compete per coefficient, failed: "+g.ZeroTFailure+".")
		}
	} else {
		notes = append(notes, "Each coefficient comes from the route that states the smaller error: the finite-T ladder or the zero-temperature eps-series ("+g.ZeroTMethod+").")
		if g.LadderOrders < len(route) {
			notes = append(notes, fmt.Sprintf("The ladder's low-temperature fits fail from order %d on; those coefficients come from the zero-temperature eps-series alone, and the S_0 check covers orders 0..%d.", g.LadderOrders, g.LadderOrders-1))
		}
	}
	if len(lv) == 0 && len(zt) == 0 {
		return notes, ladder
	}
	var parts []string
	for _, p := range []struct {
		orders []string
		method string
	}{{lv, energy.LiouvilleMethod}, {zt, g.ZeroTMethod}, {fit, ladder}} {
		if len(p.orders) > 0 {
			parts = append(parts, fmt.Sprintf("orders %s: %s", strings.Join(p.orders, ","), p.method))
		}
	}
	return notes, strings.Join(parts, "; ")
}

// resumOrders clamps the requested order to what each end supports.
func resumOrders(order int) (eps, x int) {
	eps = min(max(order, energyResumMinEps), energyResumMaxEps)
	x = min(max(order, energyResumMinX), energyResumMaxX)
	return eps, x
}

// finiteQ returns q as a float64, refusing q = infinity.
func finiteQ(q conformal.QPoint, name string) (float64, error) {
	if q.Inf || q.Q == nil {
		return 0, fmt.Errorf("%w: q = inf: %s vanishes at q = infinity; its 1/q series (qbridge series %s --around inf) starts at order 2", ErrInput, name, name)
	}
	v, _ := q.Q.Float64()
	if math.IsNaN(v) || v < 2 || math.IsInf(v, 0) {
		return 0, fmt.Errorf("%w: q must be a real number >= 2 (got %g)", ErrInput, v)
	}
	return v, nil
}

func (p energyProvider) Resum(qp conformal.QPoint, r Request) (*Resummation, error) {
	if err := p.check(r); err != nil {
		return nil, err
	}
	if p.soft() && qp.Inf {
		return nil, fmt.Errorf("%w: q = inf: %s is resummed at finite q; at q = infinity its 1/q series (qbridge series %s --around inf) gives the limit (alpha_K -> 3, alpha_G -> 2/q)", ErrInput, p.q.Name, p.q.Name)
	}
	q, err := finiteQ(qp, p.q.Name)
	if err != nil {
		return nil, err
	}
	eo, xo := resumOrders(r.Order)
	ge, err := ground(conformal.AroundTwo, eo, r.Progress)
	if err != nil {
		return nil, err
	}
	gi, err := ground(conformal.AroundInf, xo, r.Progress)
	if err != nil {
		return nil, err
	}
	res, err := energy.ResumGround(p.kind, q, ge, gi)
	if err != nil {
		return nil, inputErr(err)
	}
	ref, err := p.reference(q, r.Progress)
	if err != nil {
		return nil, err
	}
	// The orders actually used: coefficients the fits do not determine are
	// dropped (energy.ResumGround). At infinity the resummed series is that
	// of q^p F, whose x^k is F's x^(k+p).
	usedEps, usedX := res.AtTwo.Len()-1, res.AtInf.Len()-1+res.Power
	fn := normalisedName(res.Power, p.q.Name)
	out := &Resummation{
		Name: p.q.Name, Q: qp, OrderEps: usedEps, OrderX: usedX,
		Reference: ref,
		Published: energyPublished(p.kind, q),
		Notes: []string{
			"The two-point Pade uses " + fn + " as a function of x = 1/q, finite at both ends: its series at x = 0 and at x = 1/2 (from eps = 1 - 2x).",
			"Errors add the spread of the approximants and the shift under the coefficient error bars.",
		},
	}
	if p.soft() {
		out.Notes = append(out.Notes, "The series of "+p.q.Name+" are those of alpha_S (the orders its fits determine) times the exact factor series; see qbridge series "+p.q.Name+".")
	}
	if usedEps != r.Order || usedX != r.Order {
		out.Notes = append(out.Notes, fmt.Sprintf("order %d asked; used %d around q = 2 and %d around q = infinity (supported here: %d..%d and %d..%d; orders whose fitted coefficient is not determined, error >= value, are dropped)",
			r.Order, usedEps, usedX, energyResumMinEps, energyResumMaxEps, energyResumMinX, energyResumMaxX))
	}
	for _, e := range res.Estimates {
		ce := conformal.Estimate{Method: e.Method, Detail: e.Detail}
		if !math.IsNaN(e.Value) {
			ce.Value = big.NewFloat(e.Value)
			if !math.IsNaN(e.Err) && !math.IsInf(e.Err, 0) {
				ce.Err = big.NewFloat(e.Err)
			}
		}
		out.Estimates = append(out.Estimates, ce)
	}
	sortEstimates(out.Estimates)
	return out, nil
}

// normalisedName is the function the two-point Pade approximates: q^p F.
func normalisedName(p int, name string) string {
	switch p {
	case 0:
		return name
	case 1:
		return "q " + name
	}
	return fmt.Sprintf("q^%d %s", p, name)
}

// reference is the value a resummation is compared with: the direct
// solver (energy.DirectGround: ground ladder or T = 0 route, whichever is
// more accurate) for E_0 and alpha_S, its
// zero-temperature route (energy.DirectSoftMode) for alpha_G and alpha_K,
// whose q = 2 values are the exact limits alpha_K = pi, alpha_G = 0.
func (p energyProvider) reference(q float64, progress func(float64, string)) (*Reference, error) {
	if !p.soft() {
		d, err := energy.DirectGround(q, progress)
		if err != nil {
			return nil, err
		}
		dv, de, m := d.E0, d.E0Err, d.E0Method
		if p.kind == energy.QuantityAlphaS {
			dv, de, m = d.AlphaS, d.AlphaSErr, d.AlphaSMethod
		}
		return &Reference{Value: big.NewFloat(dv), Err: big.NewFloat(de), Kind: "direct", Method: m}, nil
	}
	if q == 2 {
		return softLimitAtTwo(p.kind), nil
	}
	d, err := energy.DirectSoftMode(q, progress)
	if err != nil {
		return nil, inputErr(err)
	}
	v, e, m := d.AlphaG, d.AlphaGErr, d.MethodG
	if p.kind == energy.QuantityAlphaK {
		v, e, m = d.AlphaK, d.AlphaKErr, d.MethodK
	}
	return &Reference{Value: big.NewFloat(v), Err: big.NewFloat(e), Kind: "direct", Method: "direct zero-temperature Schwinger-Dyson route: " + m}, nil
}

// softLimitAtTwo is alpha_G or alpha_K at q = 2: alpha_S = 1/(24 pi)
// (the semicircle, PHYSICS.md sec. 5) times the limits F_K = 24 pi^2 and
// F_G = 0 of the exact factors (conformal.SoftFactorSeries): alpha_K = pi,
// alpha_G = 0 exactly (the semicircle's G(tau) has no 1/tau^2 term).
func softLimitAtTwo(kind string) *Reference {
	if kind == energy.QuantityAlphaK {
		pi := scalar.Pi(128)
		return &Reference{Value: pi, Err: new(big.Float).SetMantExp(pi, -126), Kind: "exact",
			Method: "exact at q = 2: alpha_K = 24 pi^2 alpha_S = pi with alpha_S = 1/(24 pi) (semicircle); error: rounding at 128 bits"}
	}
	return &Reference{Value: new(big.Float), Kind: "exact",
		Method: "exact at q = 2: alpha_G = 0 (F_G = 6 pi^2 eps + O(eps^2); the semicircle's G(tau) has no 1/tau^2 term); an exact zero, no error to estimate"}
}

// energyPublished returns the published q = 4 values (PHYSICS sec. 8):
// E_0 = -0.0406 J = -0.05746 script-J (Maldacena-Stanford arXiv:1604.07818;
// Garcia-Garcia-Verbaarschot arXiv:1610.03816; quoted from memory),
// alpha_S ~ 0.007 (MS 2016), alpha_K ~ 2.852 (MS 2016, from memory); for
// alpha_G and alpha_K elsewhere the large-q limits 2/q and 3 (MS 2016
// sec. 4), marked as limiting formulas.
func energyPublished(kind string, q float64) *conformal.Published {
	switch {
	case kind == energy.QuantityAlphaK && q == 4:
		return &conformal.Published{Value: big.NewFloat(2.852), Digits: 4, Source: "MS 2016 arXiv:1604.07818 (from memory)"}
	case kind == energy.QuantityAlphaK:
		return &conformal.Published{Value: big.NewFloat(3), Source: "large-q limit alpha_K = 3 (MS 2016 arXiv:1604.07818 sec. 4)", Limit: true}
	case kind == energy.QuantityAlphaG:
		return &conformal.Published{Value: big.NewFloat(2 / q), Source: "large-q limit alpha_G = 2/q (MS 2016 arXiv:1604.07818 sec. 4)", Limit: true}
	}
	if q != 4 {
		return nil
	}
	if kind == energy.QuantityE0 {
		return &conformal.Published{Value: big.NewFloat(-0.05746), Digits: 4, Source: "MS 2016 arXiv:1604.07818; Garcia-Garcia-Verbaarschot arXiv:1610.03816 (-0.0406 J, from memory)"}
	}
	return &conformal.Published{Value: big.NewFloat(0.007), Digits: 1, Source: "MS 2016 arXiv:1604.07818"}
}

func (p logZProvider) Quantity() Quantity { return p.q }

func (p logZProvider) Series(r Request) (*SeriesResult, error) {
	if r.Set["n"] {
		return nil, fmt.Errorf("%w: --n does not apply to %s", ErrInput, p.q.Name)
	}
	if err := checkEnergyOrder(r.End, r.Order); err != nil {
		return nil, err
	}
	b := r.Beta
	if !r.Set["beta"] {
		return nil, fmt.Errorf("%w: the logZ series needs --beta (inverse temperature beta*script-J)", ErrInput)
	}
	if math.IsNaN(b) || b <= 0 || math.IsInf(b, 0) || b > MaxBeta {
		return nil, fmt.Errorf("%w: --beta must be positive and at most %g (got %g)", ErrInput, MaxBeta, b)
	}
	var f *energy.FiniteBeta
	var err error
	if r.End == conformal.AroundTwo {
		f, err = energy.DeltaExpand(energy.DeltaParams{Beta: b, Order: r.Order, Variable: energy.VarEps})
	} else {
		f, err = energy.InvQExpand(energy.InvQParams{Beta: b, Order: r.Order})
	}
	if err != nil {
		return nil, inputErr(err)
	}
	method := fmt.Sprintf("finest grid %d points on [0, beta), %d grids, Richardson in the grid spacing, beta = %g", f.Points, f.Levels, b)
	res := &SeriesResult{
		Parts: []*conformal.Coefficients{
			{Quantity: p.q.Name, End: r.End, N: -1, Values: bigs(f.LogZ.Values), Errors: bigs(f.LogZ.Errors), Method: method, Prec: 53},
			{Quantity: "E", End: r.End, N: -1, Values: bigs(f.E.Values), Errors: bigs(f.E.Errors), Method: method, Prec: 53},
		},
		Notes: []string{method + "."},
	}
	ck, err := highTempCheck(r.End, b, f.LogZ)
	if err != nil {
		return nil, err
	}
	res.Check = ck
	res.Notes = append(res.Notes, ck.Against+".")
	return res, nil
}

// highTempOrder is the order in (beta script-J)^2 of the exact
// high-temperature coefficients behind the cross-check of the log Z
// series (about a second, once per process).
const highTempOrder = 30

// highTempCheck holds the grid coefficients of log Z at one beta against
// the same coefficients from the exact high-temperature series
// (expansion/hightemp): every power of eps or 1/q of log Z is a sum over
// orders in beta^2 of exact rationals, summed (or Pade-resummed in beta^2)
// at this beta.
func highTempCheck(end conformal.End, beta float64, grid energy.Coeffs) (*SeriesCheck, error) {
	s, err := SymbolicHighTemp(highTempOrder, nil)
	if err != nil {
		return nil, err
	}
	v := hightemp.VarEps
	if end == conformal.AroundInf {
		v = hightemp.VarX
	}
	sums, err := s.EndSeries(v, new(big.Float).SetFloat64(beta), len(grid.Values)-1, 192)
	if err != nil {
		return nil, err
	}
	ck := &SeriesCheck{Name: LogZ, Fitted: bigs(grid.Values), FittedErr: bigs(grid.Errors),
		Against: fmt.Sprintf("exact high-temperature coefficients through (beta script-J)^%d, expanded in %s and summed at beta = %g (partial sum or Pade in beta^2, whichever states the smaller error)", 2*highTempOrder, v, beta)}
	for _, x := range sums {
		if x.Diverges {
			x.Value = nil // a sum of growing terms is no value
		}
		ck.Exact = append(ck.Exact, x.Value)
		ck.ExactErr = append(ck.ExactErr, x.Err)
		reason := ""
		if x.Err == nil {
			reason = x.Reason
		}
		ck.ExactReason = append(ck.ExactReason, reason)
	}
	return ck, nil
}

func (p logZProvider) Resum(conformal.QPoint, Request) (*Resummation, error) {
	return nil, fmt.Errorf("%w: logZ is not resummed at one q yet: use qbridge series logZ --beta B at each end, or qbridge solve", ErrInput)
}
