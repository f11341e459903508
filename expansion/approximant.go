package expansion

import (
	"fmt"
	"math"
	"math/big"
	"math/rand/v2"
	"sync"

	"qbridge/expansion/conformal"
	"qbridge/expansion/energy"
	"qbridge/series"
)

// Approximant is everything of a quantity's resummation that does not
// depend on q, built once: its series around q = 2 and q = infinity and the
// pole-free two-point Pade approximants made from them. Its methods
// evaluate at any q >= 2 (and q = infinity) without recomputing a series.
type Approximant struct {
	// Name is the printed name (h_1, b, S_0, E_0, alpha_S).
	Name string
	// Function is the function the two-point Pade approximates, in the
	// variable x = 1/q: the quantity itself for h_n, S_0 and alpha_K, b^q
	// for b, q^2 E_0 and q^2 alpha_S for the energies, q alpha_G (finite
	// at both ends).
	Function string
	// OrderEps and OrderX are the orders of the series used around q = 2
	// and q = infinity.
	OrderEps, OrderX int
	// Two and Inf are the series expanded (of b^q for b, of the quantity
	// otherwise) around q = 2 in eps and around q = infinity in x.
	Two, Inf *conformal.Coefficients
	// Notes say how the series were obtained and where they came from (the
	// cache or a fresh computation).
	Notes []string

	kind    string // conformal.QuantityDims, QuantityB, QuantityS0, energy.QuantityE0, QuantityAlphaS, QuantityAlphaG or QuantityAlphaK
	pow     int    // energies: the power p of the approximated q^p F (energy.SoftPower)
	n       int
	exact   bool
	prec    uint
	set     *twoPointSet   // conformal quantities
	lower   *twoPointSet   // from the series one order shorter at each end
	sets    []*twoPointSet // energies: central coefficients, then the sign patterns (nil: failed)
	normInf energy.Coeffs  // energies: q^2 F in x around x = 0
	normTwo energy.Coeffs  // and in x - 1/2 around q = 2
}

// NewApproximant builds the approximant of the named quantity (any name
// ParseName knows that names one quantity: h_3, b, s0, e0, alpha) from
// series of the given order at each end (E_0 and alpha_S clamp it to what
// their expansions support, and say so in Notes), computing at digits
// decimal digits. The series are taken from cache when it holds them and
// stored there otherwise; cache may be nil.
func NewApproximant(name string, order, digits int, cache *Cache) (*Approximant, error) {
	p, n, err := ParseName(name)
	if err != nil {
		return nil, fmt.Errorf("%w: %v", ErrInput, err)
	}
	switch pv := p.(type) {
	case conformalProvider:
		if pv.q.Indexed && n < 0 {
			return nil, fmt.Errorf("%w: name one dimension (h_1, h_2, ...), not the family %s", ErrInput, name)
		}
		return newConformalApproximant(pv, max(n, 0), order, digits, cache)
	case energyProvider:
		return newEnergyApproximant(pv, order, cache)
	}
	return nil, fmt.Errorf("%w: %s is not resummed from its series at both ends (it depends on the inverse temperature)", ErrInput, p.Quantity().Name)
}

func newConformalApproximant(p conformalProvider, n, order, digits int, cache *Cache) (*Approximant, error) {
	if order < 2 || order > conformal.MaxOrder {
		return nil, fmt.Errorf("%w: order %d: resummation takes orders 2..%d", ErrInput, order, conformal.MaxOrder)
	}
	if digits < conformal.MinDigits || digits > conformal.MaxDigits {
		return nil, fmt.Errorf("%w: %d digits: supported are %d..%d", ErrInput, digits, conformal.MinDigits, conformal.MaxDigits)
	}
	two, inf, note, err := conformalSeries(cache, p.kind, n, order, digits)
	if err != nil {
		return nil, err
	}
	prec := conformal.ResumPrec(digits, order)
	sa, sb, err := conformal.TwoPointSeries(two, inf, prec)
	if err != nil {
		return nil, err
	}
	set, err := newTwoPointSet(sa, new(big.Float).SetPrec(prec), sb, big.NewFloat(0.5).SetPrec(prec))
	if err != nil {
		return nil, err
	}
	lower, err := newTwoPointSet(truncate(sa, order), new(big.Float).SetPrec(prec), truncate(sb, order), big.NewFloat(0.5).SetPrec(prec))
	if err != nil {
		return nil, err
	}
	name := p.q.Named(n)
	fn := name
	if p.kind == conformal.QuantityB {
		fn = "b^q"
	}
	return &Approximant{
		Name: name, Function: fn, OrderEps: order, OrderX: order, Two: two, Inf: inf,
		Notes: []string{fmt.Sprintf("%s: series of %s to order %d at each end, %d digits (%s); %s", name, fn, order, digits, two.Method, note)},
		kind:  p.kind, n: n, exact: true, prec: prec, set: set, lower: lower,
	}, nil
}

// resumPrecEnergy is the working precision of the energies' Pade
// approximants, as in package energy (float64 coefficients).
const resumPrecEnergy = 128

func newEnergyApproximant(p energyProvider, order int, cache *Cache) (*Approximant, error) {
	eo, xo := resumOrders(order)
	var ge, gi *energy.GroundSeries
	var ne, ni string
	var errE, errI error
	var wg sync.WaitGroup
	wg.Add(2)
	go func() { defer wg.Done(); ge, ne, errE = groundSeries(cache, conformal.AroundTwo, eo, nil) }()
	go func() { defer wg.Done(); gi, ni, errI = groundSeries(cache, conformal.AroundInf, xo, nil) }()
	wg.Wait()
	if errE != nil {
		return nil, errE
	}
	if errI != nil {
		return nil, errI
	}
	// As energy.ResumGround: only the orders the fits determine (for
	// alpha_G and alpha_K, those of alpha_S times the exact factor series).
	a, b, pw, err := energy.ResumSeries(p.kind, ge, gi)
	if err != nil {
		return nil, inputErr(err)
	}
	eo, xo = a.Len()-1, b.Len()-1
	atInf, atTwo, err := energy.NormalisedPower(a, b, pw)
	if err != nil {
		return nil, inputErr(err)
	}
	sets, err := energySets(atInf, atTwo)
	if err != nil {
		return nil, err
	}
	lower, err := energyLowerSet(atInf, atTwo)
	if err != nil {
		return nil, err
	}
	name := p.q.Name
	fn := normalisedName(pw, name)
	// Around q = 2 each coefficient comes from the route that states the
	// smaller error (energy.EpsGround); around infinity from the ladder.
	const routesText = "around q = 2 per coefficient the zero-temperature eps-series (refined in double-double) or the low-temperature fits of the finite-temperature series, whichever states the smaller error; around q = infinity the low-temperature fits of the finite-temperature 1/q series"
	from := "coefficients: " + routesText
	if p.soft() {
		from = "the alpha_S series (" + routesText + ") times the exact series of " + name + "/alpha_S"
	}
	ap := &Approximant{
		Name: name, Function: fn, OrderEps: eo, OrderX: xo,
		Two: &conformal.Coefficients{Quantity: name, End: conformal.AroundTwo, N: -1, Values: bigs(a.Values), Errors: bigs(a.Errors), Prec: 53,
			Method: fmt.Sprintf("per coefficient the zero-temperature eps-series or low-temperature fits over beta = %.4g..%.4g, whichever states the smaller error", ge.BetaMin, ge.BetaMax)},
		Inf: &conformal.Coefficients{Quantity: name, End: conformal.AroundInf, N: -1, Values: bigs(b.Values), Errors: bigs(b.Errors), Prec: 53,
			Method: fmt.Sprintf("low-temperature fits over beta = %.4g..%.4g", gi.BetaMin, gi.BetaMax)},
		Notes: []string{fmt.Sprintf("%s: series to order %d around q = 2 (%s) and %d around q = infinity (%s), %s; the two-point Pade approximates %s in x = 1/q, its error adds the spread of the approximants and the shift under the coefficient error bars",
			name, eo, ne, xo, ni, from, fn)},
		kind: p.kind, pow: pw, n: -1, prec: resumPrecEnergy, sets: sets, lower: lower, normInf: atInf, normTwo: atTwo,
	}
	if eo != order || xo != order {
		ap.Notes = append(ap.Notes, fmt.Sprintf("%s: order %d asked; used %d around q = 2 and %d around q = infinity (supported here: %d..%d and %d..%d; orders whose fitted coefficient is not determined, error >= value, are dropped)",
			name, order, eo, xo, energyResumMinEps, energyResumMaxEps, energyResumMinX, energyResumMaxX))
	}
	return ap, nil
}

// energySets builds the two-point sets of the central coefficients and of
// the sign patterns c_k +- err_k that energy.Resum uses to propagate the
// coefficient errors (the same fixed-seed generator and order of draws).
func energySets(atInf, atTwo energy.Coeffs) ([]*twoPointSet, error) {
	build := func(a, b []float64) (*twoPointSet, error) {
		sa, err := series.FromFloat64(resumPrecEnergy, a...)
		if err != nil {
			return nil, err
		}
		sb, err := series.FromFloat64(resumPrecEnergy, b...)
		if err != nil {
			return nil, err
		}
		return newTwoPointSet(sa, big.NewFloat(0), sb, big.NewFloat(0.5))
	}
	central, err := build(atInf.Values, atTwo.Values)
	if err != nil {
		return nil, err
	}
	sets := []*twoPointSet{central}
	rng := rand.New(rand.NewPCG(1, 2))
	for i := 0; i < energyCoefficientSamples; i++ {
		a := atInf.SignPerturbed(rng)
		b := atTwo.SignPerturbed(rng)
		s, err := build(a, b)
		if err != nil {
			s = nil
		}
		sets = append(sets, s)
	}
	return sets, nil
}

// energyLowerSet is the central two-point set from the series one order
// shorter at each end.
func energyLowerSet(atInf, atTwo energy.Coeffs) (*twoPointSet, error) {
	sa, err := series.FromFloat64(resumPrecEnergy, atInf.Values[:atInf.Len()-1]...)
	if err != nil {
		return nil, err
	}
	sb, err := series.FromFloat64(resumPrecEnergy, atTwo.Values[:atTwo.Len()-1]...)
	if err != nil {
		return nil, err
	}
	return newTwoPointSet(sa, big.NewFloat(0), sb, big.NewFloat(0.5))
}

// truncate keeps the first n coefficients of s.
func truncate(s *series.Series, n int) *series.Series {
	c := s.Coeffs()
	t, err := series.FromBig(s.Prec(), c[:n])
	if err != nil {
		return s
	}
	return t
}

// energyCoefficientSamples is the number of sign patterns of energy.Resum.
const energyCoefficientSamples = 8

// Kind is the quantity key of the sub-package (conformal.QuantityDims, B,
// S0; energy.QuantityE0, QuantityAlphaS).
func (a *Approximant) Kind() string { return a.kind }

// HasExact reports that the quantity has an exact value at every q.
func (a *Approximant) HasExact() bool { return a.exact }

// Prec is the working precision of the approximants in bits.
func (a *Approximant) Prec() uint { return a.prec }

// qFloat returns a finite q as a float64.
func qFloat(q conformal.QPoint) float64 {
	v, _ := q.Q.Float64()
	return v
}

// TwoPoint returns the two-point Pade estimate at q with its error, the
// same value and error that Resum gives, without recomputing a series. At
// q = infinity it is the x^0 term of the series there (h_n, S_0, alpha_K),
// b = 1, or 0 for E_0, alpha_S and alpha_G, which vanish like 1/q^2 and
// 1/q (Err nil: exact limit).
func (a *Approximant) TwoPoint(q conformal.QPoint) (conformal.Estimate, error) {
	if a.sets != nil {
		return a.energyTwoPoint(q)
	}
	if q.Inf && a.kind == conformal.QuantityB {
		return conformal.Estimate{Method: MethodTwoPoint, Value: big.NewFloat(1).SetPrec(a.prec),
			Detail: "q = infinity: b = 1, the limit of (b^q)^(1/q) (b^q pi = (1/2 - 1/q) tan(pi/q))"}, nil
	}
	x := q.X(a.prec)
	r, err := a.set.at(x)
	if err != nil {
		return conformal.Estimate{Method: MethodTwoPoint, Detail: "failed: " + err.Error()}, err
	}
	return conformal.FromResummed(a.kind, conformal.TwoPointEstimate(r), q, a.prec), nil
}

func (a *Approximant) energyTwoPoint(q conformal.QPoint) (conformal.Estimate, error) {
	if q.Inf {
		if a.pow == 0 {
			e := conformal.Estimate{Method: MethodTwoPoint, Value: big.NewFloat(a.normInf.Values[0]),
				Detail: fmt.Sprintf("q = infinity: the x^0 coefficient of the series of %s there", a.Name)}
			if er := a.normInf.Errors[0]; er > 0 && finite(er) {
				e.Err = big.NewFloat(er)
			}
			return e, nil
		}
		return conformal.Estimate{Method: MethodTwoPoint, Value: new(big.Float),
			Detail: fmt.Sprintf("q = infinity: %s vanishes like 1/q^%d (%s -> %.6g)", a.Name, a.pow, a.Function, a.normInf.Values[0])}, nil
	}
	qf := qFloat(q)
	x := 1 / qf
	xp := math.Pow(x, float64(a.pow))
	bx := big.NewFloat(x)
	r, err := a.sets[0].at(bx)
	if err != nil {
		return conformal.Estimate{Method: MethodTwoPoint, Detail: "not available: " + err.Error()}, err
	}
	v, _ := r.Value.Float64()
	trunc, _ := r.Err.Float64()
	shift := 0.0
	for _, s := range a.sets[1:] {
		if s == nil {
			continue
		}
		rp, err := s.at(bx)
		if err != nil {
			continue
		}
		w, _ := rp.Value.Float64()
		shift = math.Max(shift, math.Abs(w-v))
	}
	return energyEstimate(energy.Estimate{Method: MethodTwoPoint, Value: v * xp, Err: (trunc + shift) * xp, Detail: r.Method}), nil
}

// TableEstimate is TwoPoint with an error that also covers the change of
// the value when both series are one order shorter: Err = max(TwoPoint's
// error, |value - value one order lower|). The spread of the approximants
// alone can fall short of the true error (up to about 3 times for h_1 at
// order 20 against mpmath); the change between orders is the usual
// conservative convergence estimate. At q = infinity it is TwoPoint.
func (a *Approximant) TableEstimate(q conformal.QPoint) (conformal.Estimate, error) {
	e, err := a.TwoPoint(q)
	if err != nil || e.Value == nil || e.Err == nil || q.Inf {
		return e, err
	}
	var lo *big.Float
	if a.sets != nil {
		x := 1 / qFloat(q)
		r, err := a.lower.at(big.NewFloat(x))
		if err != nil {
			return e, fmt.Errorf("two-point Pade one order lower: %w", err)
		}
		v, _ := r.Value.Float64()
		lo = big.NewFloat(v * math.Pow(x, float64(a.pow)))
	} else {
		r, err := a.lower.at(q.X(a.prec))
		if err != nil {
			return e, fmt.Errorf("two-point Pade one order lower: %w", err)
		}
		le := conformal.FromResummed(a.kind, conformal.Estimate{Value: r.Value, Err: r.Err}, q, a.prec)
		if le.Value == nil {
			return e, fmt.Errorf("two-point Pade one order lower: %s", le.Detail)
		}
		lo = le.Value
	}
	d := new(big.Float).SetPrec(64).Sub(e.Value, lo)
	d.Abs(d)
	if d.Cmp(e.Err) > 0 {
		e.Err = d
	}
	if a.sets == nil {
		// The coefficients' own errors (two working precisions), summed at
		// the nearer end, as a floor.
		f := a.coefficientFloor(q)
		if a.kind == conformal.QuantityB {
			bf, _ := e.Value.Float64()
			qf := qFloat(q)
			f *= bf / (qf * math.Pow(bf, qf))
		}
		if fb := big.NewFloat(f); finite(f) && fb.Cmp(e.Err) > 0 {
			e.Err = fb
		}
	}
	e.Detail += "; error at least the change from the two-point Pade one order lower at each end"
	return e, nil
}

// coefficientFloor is sum_k err_k |t|^k of the series at the nearer end
// (t = eps or x), the uncertainty of the value from that of the
// coefficients alone.
func (a *Approximant) coefficientFloor(q conformal.QPoint) float64 {
	sum := func(c *conformal.Coefficients, t float64) float64 {
		s, tk := 0.0, 1.0
		for _, e := range c.Errors {
			f, _ := e.Float64()
			s += f * tk
			tk *= math.Abs(t)
		}
		return s
	}
	eps, _ := q.Eps(64).Float64()
	x, _ := q.X(64).Float64()
	return math.Min(sum(a.Two, eps), sum(a.Inf, x))
}

// energyEstimate converts an estimate of package energy (NaN: failed).
func energyEstimate(e energy.Estimate) conformal.Estimate {
	ce := conformal.Estimate{Method: e.Method, Detail: e.Detail}
	if !math.IsNaN(e.Value) {
		ce.Value = big.NewFloat(e.Value)
		if !math.IsNaN(e.Err) && !math.IsInf(e.Err, 0) {
			ce.Err = big.NewFloat(e.Err)
		}
	}
	return ce
}

// Estimates returns every resummation at finite q in MethodOrder: partial
// sums and Pade tables from each end and the two-point Pade, as Resum
// (without its reference value). The Pade tables depend on q and are
// built at each call.
func (a *Approximant) Estimates(q conformal.QPoint) ([]conformal.Estimate, error) {
	if q.Inf || q.Q == nil {
		return nil, fmt.Errorf("%w: q = inf: the series around infinity is exact there", ErrInput)
	}
	var out []conformal.Estimate
	if a.sets != nil {
		es, err := energy.ResumPower(qFloat(q), a.pow, a.normInf, a.normTwo)
		if err != nil {
			return nil, inputErr(err)
		}
		for _, e := range es {
			out = append(out, energyEstimate(e))
		}
	} else {
		es, err := conformal.ResumFrom(a.kind, q, a.Two, a.Inf, a.prec)
		if err != nil {
			return nil, err
		}
		out = es
	}
	sortEstimates(out)
	return out, nil
}

// PartialSum returns the partial sum through order k of the series around
// end at q (k at most the order used there); for b the partial sum of b^q,
// converted to b.
func (a *Approximant) PartialSum(end conformal.End, k int, q conformal.QPoint) (*big.Float, error) {
	c := a.Two
	prec := a.prec
	t := q.Eps(prec)
	if end == conformal.AroundInf {
		c = a.Inf
		t = q.X(prec)
	}
	if k < 0 || k >= len(c.Values) {
		return nil, fmt.Errorf("%w: partial sum of order %d: the series around q = %s has order %d", ErrInput, k, end, len(c.Values)-1)
	}
	sum := new(big.Float).SetPrec(prec)
	tk := new(big.Float).SetPrec(prec).SetInt64(1)
	term := new(big.Float).SetPrec(prec)
	for i := 0; i <= k; i++ {
		term.Mul(c.Values[i], tk)
		sum.Add(sum, term)
		tk.Mul(tk, t)
	}
	if a.kind == conformal.QuantityB {
		if q.Inf {
			return big.NewFloat(1), nil
		}
		e := conformal.FromResummed(a.kind, conformal.Estimate{Value: sum, Err: new(big.Float)}, q, prec)
		if e.Value == nil {
			return nil, fmt.Errorf("partial sum of b^q is not positive at q = %s", q)
		}
		return e.Value, nil
	}
	return sum, nil
}

// finite reports a finite float64.
func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// seriesMemo holds the series computed in this process, so that
// approximants built side by side (E_0 and alpha_S share their ground
// series) compute each only once.
var seriesMemo = struct {
	sync.Mutex
	m map[string]*memoEntry
}{m: map[string]*memoEntry{}}

type memoEntry struct {
	ready chan struct{}
	v     any
	note  string
	err   error
}

// memo returns the value under key, computing it with f once per process
// (failures are not kept).
func memo(key string, f func() (any, string, error)) (any, string, error) {
	seriesMemo.Lock()
	e, ok := seriesMemo.m[key]
	if !ok {
		e = &memoEntry{ready: make(chan struct{})}
		seriesMemo.m[key] = e
	}
	seriesMemo.Unlock()
	if ok {
		<-e.ready
		return e.v, e.note, e.err
	}
	e.v, e.note, e.err = f()
	if e.err != nil {
		seriesMemo.Lock()
		delete(seriesMemo.m, key)
		seriesMemo.Unlock()
	}
	close(e.ready)
	return e.v, e.note, e.err
}

// conformalSeries returns the series TwoEndSeries gives, from the cache
// when it holds both ends, else computed (and stored).
func conformalSeries(cache *Cache, kind string, n, order, digits int) (two, inf *conformal.Coefficients, note string, err error) {
	fn := map[string]string{conformal.QuantityDims: fmt.Sprintf("h_%d", n), conformal.QuantityB: "b^q", conformal.QuantityS0: "S_0"}[kind]
	prec := fmt.Sprintf("%d digits", digits)
	kTwo := CacheKey{Quantity: fn, End: conformal.AroundTwo.String(), Order: order, Precision: prec}
	kInf := CacheKey{Quantity: fn, End: conformal.AroundInf.String(), Order: order, Precision: prec}
	var sTwo, sInf storedCoefficients
	var ok bool
	if ok = cache.load(kTwo, &sTwo, func() error {
		var err error
		two, err = sTwo.coefficients(conformal.AroundTwo, order)
		return err
	}); ok {
		ok = cache.load(kInf, &sInf, func() error {
			var err error
			inf, err = sInf.coefficients(conformal.AroundInf, order)
			return err
		})
	}
	if ok {
		return two, inf, "read from the cache " + cache.Dir, nil
	}
	two, inf, err = conformal.TwoEndSeries(kind, n, order, digits)
	if err != nil {
		return nil, nil, "", err
	}
	cache.store(kTwo, storeCoefficients(two))
	cache.store(kInf, storeCoefficients(inf))
	return two, inf, "computed", nil
}

// groundSeries returns the ground series of E_0, S_0 and alpha_S around
// one end (energy.EpsGround or InvQGround with the default ladders), from
// the cache when it holds them, else computed (and stored); once per
// process. progress (may be nil) sees the computation when there is one.
func groundSeries(cache *Cache, end conformal.End, order int, progress func(float64, string)) (*energy.GroundSeries, string, error) {
	if err := checkEnergyOrder(end, order); err != nil {
		return nil, "", err
	}
	key := CacheKey{Quantity: "ground-E_0-S_0-alpha_S", End: end.String(), Order: order, Precision: "float64"}
	v, note, err := memo(cache.memoKey(key), func() (any, string, error) {
		variable := energy.VarEps
		if end == conformal.AroundInf {
			variable = energy.VarX
		}
		var g *energy.GroundSeries
		var st storedGround
		if cache.load(key, &st, func() error {
			var err error
			g, err = st.ground(variable, order)
			return err
		}) {
			return g, "read from the cache " + cache.Dir, nil
		}
		p := energy.GroundParams{Order: order, Progress: progress}
		var err error
		if end == conformal.AroundTwo {
			g, err = energy.EpsGround(p)
		} else {
			g, err = energy.InvQGround(p)
		}
		if err != nil {
			return nil, "", inputErr(err)
		}
		cache.store(key, storeGround(g))
		return g, "computed", nil
	})
	if err != nil {
		return nil, "", err
	}
	return v.(*energy.GroundSeries), note, nil
}

// memoKey keys the process memo by the cache's directory and version too,
// so that two caches in one process (tests) do not share entries.
func (c *Cache) memoKey(k CacheKey) string {
	dir, ver := "", ""
	if c != nil {
		dir, ver = c.Dir, c.Version
	}
	return dir + "\x00" + ver + "\x00" + k.fileName()
}
