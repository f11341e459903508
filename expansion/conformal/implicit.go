package conformal

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"runtime"
	"sync"

	"qbridge/series"
	"qbridge/series/scalar"
)

// funcKind names the two functions an implicit equation is built from.
type funcKind int

const (
	kindLogGamma funcKind = iota // log|Gamma(u)|
	kindLog                      // log|u|
)

// term is coef * f(a + b y), with a and b series in the expansion variable
// s and y the unknown.
type term struct {
	coef int64
	kind funcKind
	a, b *series.Series
	// tay caches the Taylor coefficients of log Gamma at tayAt: within one
	// series Newton iteration u(0) = a(0) + b(0) y(0) stays fixed.
	tayAt *big.Float
	tay   []*big.Float
	// fixed caches coef f(a) when b vanishes: such a term (a constant
	// factor of the kernel, or a pole split of one) does not depend on y,
	// so it is evaluated once, at the full length of a, instead of at
	// every Newton step.
	fixed *series.Series
	// indep caches independent: 0 not yet known, 1 yes, 2 no.
	indep int8
}

// independent reports whether b vanishes identically.
func (tm *term) independent() bool {
	if tm.indep == 0 {
		tm.indep = 1
		for k := 0; k < tm.b.Len(); k++ {
			if tm.b.Coeff(k).Sign() != 0 {
				tm.indep = 2
				break
			}
		}
	}
	return tm.indep == 1
}

// logGammaTaylor returns at least n Taylor coefficients of log Gamma at u0,
// from the term's cache when it holds them.
func (tm *term) logGammaTaylor(u0 *big.Float, n int, prec uint) ([]*big.Float, error) {
	if tm.tayAt != nil && len(tm.tay) >= n && tm.tayAt.Cmp(u0) == 0 && tm.tayAt.Prec() == prec {
		return tm.tay, nil
	}
	tay, err := scalar.LogGammaTaylor(u0, n, prec)
	if err != nil {
		return nil, err
	}
	tm.tayAt, tm.tay = new(big.Float).SetPrec(prec).Set(u0), tay
	return tay, nil
}

// logEquation is sum_i coef_i f_i(a_i + b_i y) = 0: the logarithm of a
// product of Gamma functions and linear factors set equal to log 1. Terms
// whose argument vanishes or hits a pole of Gamma at s = 0 are split so that
// the colliding factors of s cancel analytically (see addLogGamma and
// addLog); logS counts the powers of s split off, which must cancel.
type logEquation struct {
	prec  uint
	terms []term
	logS  int64
	sign  int // sign of the constant factors dropped from the product
	// tayLen is how many Taylor coefficients of log Gamma to compute at
	// once (the full length of a series root), so that the short early
	// Newton steps fill the cache for the later ones.
	tayLen int
}

func newLogEquation(prec uint) *logEquation {
	return &logEquation{prec: prec, sign: 1}
}

func isZero(x *big.Float) bool { return x.Sign() == 0 }

// nonPositiveInteger reports whether x is 0, -1, -2, ... and returns -x.
func nonPositiveInteger(x *big.Float) (int64, bool) {
	if x.Sign() > 0 || !x.IsInt() {
		return 0, false
	}
	m, _ := new(big.Float).Neg(x).Int64()
	return m, true
}

// shiftDown divides a series with zero constant term by s.
func shiftDown(a *series.Series) (*series.Series, error) {
	if a.Len() < 2 {
		return nil, errors.New("expansion: series too short to divide by the expansion variable")
	}
	c := a.Coeffs()
	if !isZero(c[0]) {
		return nil, errors.New("expansion: internal error: dividing a series with non-zero constant term by s")
	}
	return series.FromBig(a.Prec(), c[1:])
}

// addLog adds coef * log|a + b y|. When a and b both vanish at s = 0 the
// common factor s is split off (and counted in logS).
func (e *logEquation) addLog(coef int64, a, b *series.Series) error {
	for isZero(a.Coeff(0)) && isZero(b.Coeff(0)) {
		var err error
		if a, err = shiftDown(a); err != nil {
			return err
		}
		if b, err = shiftDown(b); err != nil {
			return err
		}
		e.logS += coef
	}
	e.terms = append(e.terms, term{coef: coef, kind: kindLog, a: a, b: b})
	return nil
}

// addLogGamma adds coef * log|Gamma(a + b y)|. When the argument sits on a
// pole -m of Gamma at s = 0 (a(0) = -m, b(0) = 0) it is rewritten, with
// t = a + m + b y, as
//
//	log|Gamma(-m + t)| = log Gamma(1 + t) - sum_{j=1..m} log|t - j| - log|t|,
//
// and log|t| goes through addLog, which cancels the power of s exactly.
func (e *logEquation) addLogGamma(coef int64, a, b *series.Series) error {
	m, pole := nonPositiveInteger(a.Coeff(0))
	if !pole || !isZero(b.Coeff(0)) {
		if pole {
			return fmt.Errorf("expansion: Gamma argument on the pole %d for every value of the unknown", -m)
		}
		e.terms = append(e.terms, term{coef: coef, kind: kindLogGamma, a: a, b: b})
		return nil
	}
	p := e.prec
	mf := new(big.Float).SetPrec(p).SetInt64(m)
	t := series.AddConst(a, mf) // t = a + m (+ b y)
	one := new(big.Float).SetPrec(p).SetInt64(1)
	e.terms = append(e.terms, term{coef: coef, kind: kindLogGamma, a: series.AddConst(t, one), b: b})
	for j := int64(1); j <= m; j++ {
		jf := new(big.Float).SetPrec(p).SetInt64(-j)
		if err := e.addLog(-coef, series.AddConst(t, jf), b); err != nil {
			return err
		}
	}
	return e.addLog(-coef, t, b)
}

// evaluation holds L(y) and dL/dy as series.
type evaluation struct {
	L, Ly *series.Series
}

// eval returns L(y) and L_y(y) for the series y (a length-1 series is a
// plain number).
func (e *logEquation) eval(y *series.Series) (*evaluation, error) {
	if e.logS != 0 {
		return nil, fmt.Errorf("expansion: internal error: %d uncancelled powers of the expansion variable", e.logS)
	}
	// The terms are independent (each has its own Taylor cache): they are
	// evaluated concurrently, then summed in their order, so the result
	// does not depend on the scheduling.
	n := len(e.terms)
	fs, dfs, errs := make([]*series.Series, n), make([]*series.Series, n), make([]error, n)
	workers := min(runtime.GOMAXPROCS(0), n)
	next := make(chan int, n)
	for i := range e.terms {
		next <- i
	}
	close(next)
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				fs[i], dfs[i], errs[i] = e.evalTerm(&e.terms[i], y)
			}
		}()
	}
	wg.Wait()
	var L, Ly *series.Series
	for i := range e.terms {
		if errs[i] != nil {
			return nil, errs[i]
		}
		if L == nil {
			L, Ly = fs[i], dfs[i]
		} else {
			L, Ly = series.Add(L, fs[i]), series.Add(Ly, dfs[i])
		}
	}
	return &evaluation{L: L, Ly: Ly}, nil
}

// evalTerm returns coef f(u) and its derivative in y, coef f'(u) b, for
// one term at u = a + b y.
func (e *logEquation) evalTerm(tm *term, y *series.Series) (f, df *series.Series, err error) {
	if !tm.independent() {
		return e.evalTermAt(tm, series.Add(tm.a, series.Mul(tm.b, y)))
	}
	l := min(tm.a.Len(), tm.b.Len(), y.Len())
	if tm.fixed == nil || tm.fixed.Len() < l {
		if tm.fixed, _, err = e.evalTermAt(tm, tm.a); err != nil {
			tm.fixed = nil
			return nil, nil, err
		}
	}
	if f, err = tm.fixed.Truncate(l); err != nil {
		return nil, nil, err
	}
	return f, series.Scale(f, new(big.Float)), nil
}

// evalTermAt returns coef f(u) and coef f'(u) b at the argument series u.
func (e *logEquation) evalTermAt(tm *term, u *series.Series) (f, df *series.Series, err error) {
	if u.Coeff(0).Sign() == 0 {
		return nil, nil, errors.New("expansion: argument of a logarithm or pole of Gamma reached")
	}
	switch tm.kind {
	case kindLogGamma:
		// One composition: psi(u) = (log Gamma)'(u) from its Taylor
		// coefficients, and log Gamma(u) as the integral of psi(u) u'
		// from log Gamma(u(0)).
		n := u.Len()
		tay, terr := tm.logGammaTaylor(u.Coeff(0), max(n+1, e.tayLen), e.prec)
		if terr != nil {
			return nil, nil, terr
		}
		dtay := make([]*big.Float, n)
		for k := 0; k < n; k++ {
			dtay[k] = new(big.Float).SetPrec(e.prec).Mul(tay[k+1], new(big.Float).SetInt64(int64(k+1)))
		}
		if df, err = series.ComposeTaylor(dtay, u); err != nil {
			return nil, nil, err
		}
		if n == 1 {
			f, err = series.FromBig(e.prec, tay[:1])
		} else {
			f, err = series.Integral(series.Mul(df, series.Deriv(u)), tay[0]), nil
		}
		if err != nil {
			return nil, nil, err
		}
	case kindLog:
		// One inversion serves both: d log|u| = u'/u, and f'(u) = 1/u.
		if df, err = series.Inv(u); err != nil {
			return nil, nil, err
		}
		u0 := new(big.Float).Abs(u.Coeff(0))
		l0, lerr := scalar.BigLog(u0, e.prec)
		if lerr != nil {
			return nil, nil, lerr
		}
		if u.Len() == 1 {
			f, err = series.FromBig(e.prec, []*big.Float{l0})
		} else {
			f, err = series.Integral(series.Mul(df, series.Deriv(u)), l0), nil
		}
		if err != nil {
			return nil, nil, err
		}
	}
	c := new(big.Float).SetPrec(e.prec).SetInt64(tm.coef)
	return series.Scale(f, c), series.Scale(series.Mul(df, tm.b), c), nil
}

// signAt returns the sign of the product whose logarithm is the equation,
// at the scalar point y0 and s -> 0+ (or at the given scalar s).
func (e *logEquation) signAt(y0 *big.Float) int {
	sg := e.sign
	for _, tm := range e.terms {
		u := new(big.Float).SetPrec(e.prec).Mul(tm.b.Coeff(0), y0)
		u.Add(u, tm.a.Coeff(0))
		neg := false
		switch tm.kind {
		case kindLog:
			neg = u.Sign() < 0
		case kindLogGamma:
			neg = gammaNegative(u)
		}
		if neg && tm.coef%2 != 0 {
			sg = -sg
		}
	}
	return sg
}

// gammaNegative reports whether Gamma(u) < 0 (u not a pole).
func gammaNegative(u *big.Float) bool {
	if u.Sign() > 0 {
		return false
	}
	// Gamma(u) < 0 for u in (-1, 0), (-3, -2), ...: floor(u) odd.
	f, _ := new(big.Float).Neg(u).Int(nil) // trunc(-u)
	return f.Bit(0) == 0
}

// scalarAt returns L and L_y at s = 0 (the constant terms) for scalar y.
func (e *logEquation) scalarAt(y *big.Float) (L, Ly *big.Float, err error) {
	ys, err := series.FromBig(e.prec, []*big.Float{y})
	if err != nil {
		return nil, nil, err
	}
	ev, err := e.eval(ys)
	if err != nil {
		return nil, nil, err
	}
	return ev.L.Coeff(0), ev.Ly.Coeff(0), nil
}

// scalarRoot solves L(y) = 0 at s = 0 for a scalar y. samples are
// increasing points inside the domain; the root is taken in the first
// interval between neighbouring samples where L changes sign. Bisection
// brings the bracket to about 2^-50 of its size, then Newton polishes at full
// precision. The scan and the bisection use coarse, the same equation at a
// low precision, when it is not nil (they only need signs).
func (e *logEquation) scalarRoot(samples []*big.Float, coarse *logEquation) (*big.Float, error) {
	y, _, err := e.scalarRootC(samples, coarse)
	return y, err
}

// scalarRootC is scalarRoot that also returns Newton's convergence
// constant (see newtonScalarC).
func (e *logEquation) scalarRootC(samples []*big.Float, coarse *logEquation) (*big.Float, *big.Float, error) {
	if coarse == nil {
		coarse = e
	}
	lo, hi, ok := e.bracketFloat64(samples)
	if !ok {
		var err error
		if lo, hi, err = coarse.bracket(samples); err != nil {
			return nil, nil, err
		}
	}
	half := big.NewFloat(0.5)
	y := new(big.Float).SetPrec(e.prec).Add(lo, hi)
	y.Mul(y, half)
	return e.newtonScalarC(y, lo, hi, nil)
}

// scalarAtFloat64 returns L(y) at s = 0 in float64 arithmetic, a bound on
// its rounding error, and whether the value is finite. The bound counts the
// rounding of each term and of its argument u = a + b y, magnified by
// |d f/du| (about 1/distance to the nearest pole or zero).
func (e *logEquation) scalarAtFloat64(y float64) (L, errBound float64, ok bool) {
	const ulp = 0x1p-50
	for _, tm := range e.terms {
		a, _ := tm.a.Coeff(0).Float64()
		b, _ := tm.b.Coeff(0).Float64()
		u := a + b*y
		var f, slope float64
		if tm.kind == kindLogGamma {
			f, _ = math.Lgamma(u)
			slope = math.Log(math.Abs(u)+2) + 1
			if u < 0.5 {
				slope += 1 / math.Abs(u-math.Round(u))
			}
		} else {
			f = math.Log(math.Abs(u))
			slope = 1 / math.Abs(u)
		}
		c := math.Abs(float64(tm.coef))
		L += float64(tm.coef) * f
		errBound += c * (math.Abs(f) + slope*(math.Abs(a)+math.Abs(b*y))) * ulp
	}
	return L, errBound, !math.IsNaN(L) && !math.IsInf(L, 0) && !math.IsNaN(errBound)
}

// bracketFloat64 is bracket in float64 arithmetic: a sign scan over the
// samples and bisection to a relative width of about 1e-13. It reports
// false when float64 cannot resolve a sign change (the root too close to an
// end of the interval, or |L| too small to trust its sign), and the caller
// falls back to big-float arithmetic.
func (e *logEquation) bracketFloat64(samples []*big.Float) (lo, hi *big.Float, ok bool) {
	var xlo, flo float64
	have := false
	found := false
	var xhi float64
	for _, xs := range samples {
		x, _ := xs.Float64()
		f, fe, fin := e.scalarAtFloat64(x)
		if !fin || math.Abs(f) < 4*fe {
			continue
		}
		if have && (f > 0) != (flo > 0) {
			xhi, found = x, true
			break
		}
		xlo, flo, have = x, f, true
	}
	if !found || xlo == xhi {
		return nil, nil, false
	}
	for i := 0; i < 60 && xhi-xlo > 1e-13*math.Max(1, math.Abs(xlo)); i++ {
		mid := 0.5 * (xlo + xhi)
		f, fe, fin := e.scalarAtFloat64(mid)
		if !fin || math.Abs(f) < 4*fe {
			break
		}
		if (f > 0) == (flo > 0) {
			xlo = mid
		} else {
			xhi = mid
		}
	}
	return new(big.Float).SetPrec(e.prec).SetFloat64(xlo), new(big.Float).SetPrec(e.prec).SetFloat64(xhi), true
}

// bracket finds the first sign change of L among the samples and narrows it
// by 50 bisection steps.
func (e *logEquation) bracket(samples []*big.Float) (lo, hi *big.Float, err error) {
	p := e.prec
	var flo *big.Float
	for _, x := range samples {
		f, _, err := e.scalarAt(x)
		if err != nil {
			continue // a sample on a singular point: skip it
		}
		if f.Sign() == 0 {
			return x, x, nil
		}
		if flo != nil && f.Sign() != flo.Sign() {
			hi = x
			break
		}
		lo, flo = x, f
	}
	if hi == nil {
		return nil, nil, errors.New("expansion: no sign change of the kernel equation in the search interval")
	}
	lo = new(big.Float).SetPrec(p).Set(lo)
	hi = new(big.Float).SetPrec(p).Set(hi)
	half := big.NewFloat(0.5)
	mid := new(big.Float).SetPrec(p)
	for i := 0; i < 50; i++ {
		mid.Add(lo, hi)
		mid.Mul(mid, half)
		f, _, err := e.scalarAt(mid)
		if err != nil {
			return nil, nil, err
		}
		if f.Sign() == 0 {
			return mid, mid, nil
		}
		if f.Sign() == flo.Sign() {
			lo.Set(mid)
		} else {
			hi.Set(mid)
		}
	}
	return lo, hi, nil
}

// newtonScalar polishes a root of L inside [lo, hi] by Newton's method until
// the step stops shrinking or falls below the working precision, or until
// quadratic convergence predicts that the next one would: after steps
// s_(k-1), s_k the next is about C s_k^2 with C = |s_k|/|s_(k-1)|^2, and
// when 4 C s_k^2 is below the precision the evaluation that would only
// confirm it is skipped.
func (e *logEquation) newtonScalar(y, lo, hi *big.Float) (*big.Float, error) {
	y, _, err := e.newtonScalarC(y, lo, hi, nil)
	return y, err
}

// newtonScalarC is newtonScalar that also returns the convergence constant
// C it measured (nil when it took fewer than two steps) and can start from
// a known one, c0: a root found at a lower precision is then refined by a
// single evaluation.
func (e *logEquation) newtonScalarC(y, lo, hi, c0 *big.Float) (*big.Float, *big.Float, error) {
	p := e.prec
	step := new(big.Float).SetPrec(p)
	var lastStep *big.Float
	c := c0
	// The bracket comes from signs of L evaluated in rounded arithmetic, so
	// a root on its edge may sit just outside: allow one bracket width.
	w := new(big.Float).SetPrec(p).Sub(hi, lo)
	if minW := new(big.Float).SetMantExp(big.NewFloat(1), -60); w.Cmp(minW) < 0 && c0 == nil {
		w = minW
	}
	lo = new(big.Float).SetPrec(p).Sub(lo, w)
	hi = new(big.Float).SetPrec(p).Add(hi, w)
	for it := 0; it < 200; it++ {
		f, df, err := e.scalarAt(y)
		if err != nil {
			return nil, nil, err
		}
		if f.Sign() == 0 || df.Sign() == 0 {
			return y, c, nil
		}
		step.Quo(f, df)
		y.Sub(y, step)
		if y.Cmp(lo) < 0 || y.Cmp(hi) > 0 {
			return nil, nil, errors.New("expansion: Newton step left the bracket of the root")
		}
		as := new(big.Float).Abs(step)
		// Steps are measured against the size of y, but at least against 1:
		// y = 0 is a legitimate root (the soft mode h_0 = 2).
		scale := max(y.MantExp(nil), 1)
		if step.Sign() == 0 || as.MantExp(nil) < scale-int(p)+4 {
			return y, c, nil
		}
		if lastStep != nil && as.Cmp(lastStep) >= 0 && as.MantExp(nil) < scale-int(p)/2 {
			return y, c, nil // rounding-level steps no longer shrink
		}
		if lastStep != nil && as.Cmp(lastStep) < 0 {
			// a shrinking step: measure C, keeping the largest seen
			ck := new(big.Float).SetPrec(64).Quo(as, new(big.Float).SetPrec(64).Mul(lastStep, lastStep))
			if c == nil || ck.Cmp(c) > 0 {
				c = ck
			}
		}
		if c != nil {
			next := new(big.Float).SetPrec(64).Mul(as, as)
			next.Mul(next, c)
			if next.Sign() == 0 || next.MantExp(nil)+2 < scale-int(p)+4 {
				return y, c, nil
			}
		}
		lastStep = as
	}
	return nil, nil, errors.New("expansion: Newton iteration for the root did not converge in 200 steps")
}

// newtonCorrection is the Newton step L(y)/L_y(y) for the series y.
func (e *logEquation) newtonCorrection(y *series.Series) (*series.Series, error) {
	ev, err := e.eval(y)
	if err != nil {
		return nil, err
	}
	return series.Div(ev.L, ev.Ly)
}

// seriesRootFrom refines a root series found at a lower precision (seed,
// length n) by one Newton step at e.prec: from an error 2^-p1 it leaves
// about 2^-2p1, below e.prec whenever e.prec < 2 p1 - 24, as for the pair
// of precisions of twoPrecision. The step's size, returned, is the error
// of the seed.
func (e *logEquation) seriesRootFrom(seed []*big.Float) (*series.Series, *big.Float, error) {
	y, err := series.FromBig(e.prec, seed)
	if err != nil {
		return nil, nil, err
	}
	e.tayLen = len(seed) + 1
	defer func() { e.tayLen = 0 }()
	corr, err := e.newtonCorrection(y)
	if err != nil {
		return nil, nil, err
	}
	y = series.Sub(y, corr)
	if y.Len() > len(seed) {
		if y, err = y.Truncate(len(seed)); err != nil {
			return nil, nil, err
		}
	}
	return y, maxAbs(corr), nil
}

// seriesRoot solves L(s, y(s)) = 0 for the series y(s) of length n with
// y(0) = y0, by Newton's iteration on whole series: each step
// y <- y - L(y)/L_y(y) doubles the number of correct coefficients. It
// returns y and the size of the last correction. With verify, Newton steps
// at the full length go on until the correction is below the precision;
// without, the iteration stops after the step that completes the doubling
// to length n (for a caller that checks the root otherwise).
func (e *logEquation) seriesRoot(y0 *big.Float, n int, verify bool) (*series.Series, *big.Float, error) {
	y, err := series.New(n, e.prec)
	if err != nil {
		return nil, nil, err
	}
	if err := y.SetCoeff(0, y0); err != nil {
		return nil, nil, err
	}
	e.tayLen = n + 1
	defer func() { e.tayLen = 0 }()
	// Newton on series doubles the number of correct coefficients per
	// step, so the early steps run on truncations of lengths ..., n/4, n/2
	// (rounded up), each twice the last: together they cost less than one
	// step at full length, and the step at length n completes the root.
	var lengths []int
	for l := (n + 1) / 2; l >= 2; l = (l + 1) / 2 {
		lengths = append([]int{l}, lengths...)
	}
	for _, l := range lengths {
		yl, err := y.Truncate(l)
		if err != nil {
			return nil, nil, err
		}
		corr, err := e.newtonCorrection(yl)
		if err != nil {
			return nil, nil, err
		}
		yl = series.Sub(yl, corr)
		for k := 1; k < l; k++ {
			if err := y.SetCoeff(k, yl.Coeff(k)); err != nil {
				return nil, nil, err
			}
		}
	}
	done := 1 // coefficients correct before the full-length steps
	if len(lengths) > 0 {
		done = lengths[len(lengths)-1]
	}
	var last *big.Float
	maxIter := 8
	for it := 0; it < maxIter; it++ {
		corr, err := e.newtonCorrection(y)
		if err != nil {
			return nil, nil, err
		}
		size := maxAbs(corr)
		y = series.Sub(y, corr)
		if y.Len() < n {
			return nil, nil, fmt.Errorf("expansion: internal error: series shortened to %d (< %d)", y.Len(), n)
		}
		if y.Len() > n {
			if y, err = y.Truncate(n); err != nil {
				return nil, nil, err
			}
		}
		scale := max(maxAbs(y).MantExp(nil), 1)
		if !verify && it == 0 {
			// The step completed the doubling if it left the coefficients
			// the doubling had fixed (nearly) alone; otherwise the
			// iteration goes on as with verify.
			low, err := corr.Truncate(min(done, corr.Len()))
			if err != nil {
				return nil, nil, err
			}
			if ls := maxAbs(low); ls.Sign() == 0 || ls.MantExp(nil) < scale-int(e.prec)/2 {
				return y, size, nil
			}
		}
		if size.Sign() == 0 || size.MantExp(nil) < scale-int(e.prec)+8 {
			return y, size, nil
		}
		if last != nil && size.Cmp(last) >= 0 && size.MantExp(nil) < scale-int(e.prec)/2 {
			return y, size, nil
		}
		last = size
	}
	return nil, nil, fmt.Errorf("expansion: series Newton iteration did not converge (last correction %s)", last.Text('e', 3))
}

// maxAbs returns the largest |coefficient| of s.
func maxAbs(s *series.Series) *big.Float {
	m := new(big.Float)
	for k := 0; k < s.Len(); k++ {
		c := s.Coeff(k)
		c.Abs(c)
		if c.Cmp(m) > 0 {
			m = c
		}
	}
	return m
}
