package numeric

import (
	"fmt"
	"math"
	"math/cmplx"
)

// EpsSeriesParams selects a zero-temperature solve as a power series in
// eps = 1 - 2/q around the free point q = 2 (SolveZeroTEps). The grid
// fields mean what they mean in ZeroTParams (Q is ignored); Order is the
// highest power of eps.
type EpsSeriesParams struct {
	Grid  ZeroTParams
	Order int
	// KernelRadius is the radius of the Cauchy sums that expand the Mellin
	// weights in eps, as a fraction of the distance to their first pole (0
	// means DefaultKernelRadius; it must lie in [0.3, 0.9]). Its choice moves
	// the result only by round-off, which the order-by-order solve
	// amplifies roughly tenfold per order: a second radius measures it.
	KernelRadius float64
	// Extended refines the float64 solution in double-double arithmetic
	// (about 32 digits): residuals of the map evaluated in double-double,
	// corrections solved with the float64 linearised map, order by order.
	// The results are still returned as float64, now without the
	// order-by-order amplification of float64 round-off.
	Extended bool
}

// MaxEpsSeriesOrder bounds Order: the Mellin weights' eps-series come from
// Cauchy sums whose round-off grows like 2^Order.
const MaxEpsSeriesOrder = 24

// ZeroTEpsSeries is the zero-temperature solution as a series in eps:
// every grid value is a truncated power series, the coefficient of eps^k
// computed to float64 accuracy by the same fixed-point iteration as
// SolveZeroT run on series-valued samples.
type ZeroTEpsSeries struct {
	Params EpsSeriesParams // the parameters, defaults filled in
	// Tau holds the grid points up to TauPin; Ratio[k][i] is the eps^k
	// coefficient of G/G_c at Tau[i] (G_c with its own eps-dependent
	// amplitude and power, so Ratio -> 1 in the conformal region at every
	// order).
	Tau   []float64
	Ratio [][]float64
	// B[k] is the eps^k coefficient of the conformal amplitude B
	// (G_c = B tau^{-2/q}, script-J = 1).
	B []float64
	// E0[k] is the eps^k coefficient of E_0/script-J.
	E0         []float64
	Points     int
	Iterations int
	Residual   float64 // final max change, as in ZeroTSolution, over all orders
	// OrderResidual is the final max change of each order.
	OrderResidual []float64
	// RefinedResidual is, with Params.Extended, the final residual of each
	// order of the double-double map (same weights as Residual).
	RefinedResidual []float64
}

// epsConst holds the eps-series of the q-dependent constants (length K).
type epsConst struct {
	q, qm1, j2, logB, b, gtc []float64
}

// newEpsConst builds the constants of the map as eps-series:
// q = 2/(1-eps), J^2 = 2^{q-1}/q, B = (b^q/J^2)^{1/q} with
// b^q = u cot(pi u)/pi, u = eps/2 (PHYSICS.md sec. 4), and the conformal
// g~ = 1/(2 J^2 B^{q-1} M(2D-2)) with M(-1-eps) = Gamma(1-eps)
// sin(pi eps/2)/eps (DLMF 5.5.3 and 5.9.7).
func newEpsConst(k int) epsConst {
	mk := func() []float64 { return make([]float64, k) }
	c := epsConst{q: mk(), qm1: mk(), j2: mk(), logB: mk(), b: mk(), gtc: mk()}
	for i := range c.q {
		c.q[i] = 2
		c.qm1[i] = 2
	}
	c.qm1[0] = 1 // (1+eps)/(1-eps) = 1 + 2 eps + 2 eps^2 + ...
	// log q = log 2 - log(1-eps).
	logq := mk()
	logq[0] = math.Ln2
	for i := 1; i < k; i++ {
		logq[i] = 1 / float64(i)
	}
	lj2 := mk()
	for i := range lj2 {
		lj2[i] = c.qm1[i]*math.Ln2 - logq[i]
	}
	ExpSeriesInto(c.j2, lj2)
	// x cot x at x = pi eps/2, from cos x and sin x / x.
	cosS, sincS, xcot := mk(), mk(), mk()
	x := math.Pi / 2
	for i := 0; 2*i < k; i++ {
		sign := 1.0
		if i%2 == 1 {
			sign = -1
		}
		cosS[2*i] = sign * math.Pow(x, float64(2*i)) / math.Gamma(float64(2*i+1))
		sincS[2*i] = sign * math.Pow(x, float64(2*i)) / math.Gamma(float64(2*i+2))
	}
	inv := mk()
	fsInvInto(inv, sincS)
	fsMulInto(xcot, cosS, inv)
	// log b^q = log(x cot x) - 2 log pi.
	lbq := mk()
	LogSeriesInto(lbq, xcot)
	lbq[0] -= 2 * math.Log(math.Pi)
	// 1/q = (1-eps)/2.
	invq := mk()
	invq[0] = 0.5
	if k > 1 {
		invq[1] = -0.5
	}
	d := mk()
	for i := range d {
		d[i] = lbq[i] - lj2[i]
	}
	fsMulInto(c.logB, invq, d)
	ExpSeriesInto(c.b, c.logB)
	// log M(-1-eps) = log Gamma(1-eps) + log(sin x / x) + log(pi/2), with
	// log Gamma(1-eps) = gamma eps + sum_{j>=2} zeta(j) eps^j / j (DLMF 5.7.3).
	lm := mk()
	LogSeriesInto(lm, sincS)
	lm[0] += math.Log(math.Pi / 2)
	if k > 1 {
		lm[1] += eulerGamma
	}
	for j := 2; j < k; j++ {
		lm[j] += zetaInt(j) / float64(j)
	}
	// log gtc = -log 2 - log J^2 - (q-1) log B - log M.
	qlb := mk()
	fsMulInto(qlb, c.qm1, c.logB)
	lg := mk()
	for i := range lg {
		lg[i] = -lj2[i] - qlb[i] - lm[i]
	}
	lg[0] -= math.Ln2
	ExpSeriesInto(c.gtc, lg)
	return c
}

// eulerGamma is Euler's constant (DLMF 5.2.3).
const eulerGamma = 0.57721566490153286060651209

// zetaInt returns zeta(s) for an integer s >= 2 by Euler-Maclaurin
// summation (DLMF 2.10.1) from n = 10 with the Bernoulli terms through
// B_16: the first omitted term is below 1e-17.
func zetaInt(s int) float64 {
	const n = 10
	bern := [...]float64{1.0 / 6, -1.0 / 30, 1.0 / 42, -1.0 / 30, 5.0 / 66, -691.0 / 2730, 7.0 / 6, -3617.0 / 510}
	fs := float64(s)
	sum := 0.0
	for m := n - 1; m >= 1; m-- {
		sum += math.Pow(float64(m), -fs)
	}
	sum += math.Pow(n, 1-fs)/(fs-1) + 0.5*math.Pow(n, -fs)
	// B_2j/(2j)! s (s+1) ... (s+2j-2) n^{-s-2j+1}
	rising := fs
	fact := 2.0
	for j := 1; j <= len(bern); j++ {
		sum += bern[j-1] / fact * rising * math.Pow(n, -fs-float64(2*j)+1)
		rising *= (fs + float64(2*j-1)) * (fs + float64(2*j))
		fact *= float64(2*j+1) * float64(2*j+2)
	}
	return sum
}

// epsKernel returns, per Fourier mode m of the grid, the eps-series of the
// Mellin weight M(p0 - eps + i eta_m) e^{-2 pi i m/N}/N (the weight of
// LogGrid.kernel with the tilt moved by -eps), from Cauchy sums on a circle
// in eps around 0. M is analytic for Re s > -2 (its first pole is at
// s = -2), so the circle's radius is the fraction kr of the distance to
// that pole (at most kernelMaxRadius): the round-off of the sums, which grows
// like r^-j at order j, then stays near that of M itself, and the aliasing
// (r/distance)^kernelNodes is below 1e-16. The coefficients' accuracy sets
// the round-off of the whole eps-series solve.
func epsKernel(g *LogGrid, p0, kr float64, k int) [][]complex128 {
	const nc = kernelNodes
	out := make([][]complex128, g.n/2+1)
	vals := make([]complex128, nc)
	rot := make([]complex128, nc)
	for l := range rot {
		rot[l] = cmplx.Rect(1, -2*math.Pi*float64(l)/nc)
	}
	for m := range out {
		eta := 2 * math.Pi * float64(m) / (float64(g.n) * g.step)
		r := math.Min(kr*math.Hypot(p0+2, eta), kernelMaxRadius)
		ph := cmplx.Exp(complex(0, -2*math.Pi*float64(m)/float64(g.n))) / complex(float64(g.n), 0)
		for l := range vals {
			e := cmplx.Rect(r, 2*math.Pi*float64(l)/nc)
			vals[l] = mellinSine(complex(p0, eta) - e)
		}
		c := make([]complex128, k)
		for j := range c {
			var s complex128
			for l, v := range vals {
				s += v * rot[l*j%nc]
			}
			c[j] = s / complex(nc*math.Pow(r, float64(j)), 0) * ph
		}
		out[m] = c
	}
	return out
}

// The circle of the Mellin weights' Cauchy sums: by default
// DefaultKernelRadius of the distance to the pole at s = -2, at most
// kernelMaxRadius (where |M| varies by |eta|^{2r} around the circle), on
// kernelNodes points.
const (
	DefaultKernelRadius = 0.75
	kernelMaxRadius     = 1.2
	kernelNodes         = 160
)

// epsMap is zeroTMap with eps-series samples: arrays are coefficient-major,
// a[k*n + i] the eps^k coefficient at point i.
type epsMap struct {
	grid         *LogGrid
	n            int
	c            epsConst
	free         int
	freqPin      int
	kernS, kernG [][]complex128
	tiltS, gOut  []float64 // tau^{-tilt}, tau^{tilt}/pi
	sigOut, gIn  []float64 // 2 w^{-tilt}, w^{tilt}
	w2d          []float64 // series of w^{2D} = w^{1-eps}
	gModel       []float64 // series of w^{eps} w/(w^2 + a^2)
	gtModel      []float64 // series of tau^{1-eps} e^{-a tau}/2
	// The UV model Sigma_m = e^{-tau}/q (Sigma(0+) = J^2 2^{1-q} = 1/q) is
	// subtracted before the first transform and its transform
	// (2/q) w/(w^2+1) added back: the tilt tau^{1+eps-Tilt} of that
	// transform has eps-coefficients growing like |log tau|^k/k! at the UV
	// end of the grid, where the tilted remainder must be small.
	sModel       []float64 // series of (1/q) e^{-tau} tau^{1+eps-Tilt}
	sigModel     []float64 // series of w^{-eps} (2/q) w/(w^2+1)
	bufA, bufB   []float64
	sigT         []float64      // the first transform's output, all orders
	coefS, coefG [][]complex128 // per order, the Fourier coefficients of the two transforms' inputs
	coefTmp      []complex128
	tmp          [6][]float64
}

func newEpsMap(p ZeroTParams, kr float64, k int) (*epsMap, error) {
	eps := p.Tilt
	span := zeroTSpan(p)
	// The periodic images of the tilted functions, a period L away, enter
	// the transforms with weight e^{-Tilt L}; the eps-expansion of the
	// moving tilts multiplies that by L^j/j! at order j. The period is
	// made long enough for L^(k-1)/(k-1)! e^{-Tilt L} < 1e-20.
	lgk, _ := math.Lgamma(float64(k))
	for eps*span-float64(k-1)*math.Log(span)+lgk < 46 {
		span *= 1.05
	}
	grid, err := zeroTGrid(p, span)
	if err != nil {
		return nil, err
	}
	return newEpsMapOn(p, kr, k, grid), nil
}

// newEpsMapOn is newEpsMap on a given grid (the double-double refinement
// solves its corrections with a two-term map on the grid of the full one).
func newEpsMapOn(p ZeroTParams, kr float64, k int, grid *LogGrid) *epsMap {
	eps := p.Tilt
	n := grid.n
	m := &epsMap{grid: grid, n: n, c: newEpsConst(k)}
	m.kernS = epsKernel(grid, -1+eps, kr, k)
	m.kernG = epsKernel(grid, -eps, kr, k)
	lpin := math.Log(p.TauPin)
	mk := func(l int) []float64 { return make([]float64, l) }
	m.tiltS, m.gOut, m.sigOut, m.gIn = mk(n), mk(n), mk(n), mk(n)
	m.w2d, m.gModel, m.gtModel = mk(n*k), mk(n*k), mk(n*k)
	m.sModel, m.sigModel = mk(n*k), mk(n*k)
	invq := make([]float64, k) // 1/q = (1-eps)/2
	invq[0] = 0.5
	if k > 1 {
		invq[1] = -0.5
	}
	m.bufA, m.bufB, m.sigT = mk(n*k), mk(n*k), mk(n*k)
	m.coefS, m.coefG = make([][]complex128, k), make([][]complex128, k)
	for i := range m.coefS {
		m.coefS[i] = make([]complex128, n/2+1)
		m.coefG[i] = make([]complex128, n/2+1)
	}
	m.coefTmp = make([]complex128, n/2+1)
	for i := range m.tmp {
		m.tmp[i] = mk(k)
	}
	t0, t1, t2 := m.tmp[0], m.tmp[1], m.tmp[2]
	a := make([]float64, k) // a = sqrt(1 - eps)
	la := make([]float64, k)
	for j := 1; j < k; j++ {
		la[j] = -0.5 / float64(j)
	}
	ExpSeriesInto(a, la)
	for i := 0; i < n; i++ {
		x := grid.LogTau(i)
		if x <= lpin {
			m.free = i + 1
		}
		m.tiltS[i] = math.Exp(-eps * x)
		m.gOut[i] = math.Exp(eps*x) / math.Pi
		// tau^{1-eps} e^{-a tau}/2: exponent (x - a0 tau) + sum_j (-delta_j1 x - a_j tau) eps^j.
		tau := math.Exp(x)
		for j := range t0 {
			t0[j] = -a[j] * tau
		}
		t0[0] += x - math.Ln2
		if k > 1 {
			t0[1] -= x
		}
		ExpSeriesInto(t1, t0)
		m.setAt(m.gtModel, i, t1)
		fsExpLinear(t0, (1-eps)*x-tau, x)
		fsMulInto(t1, invq, t0)
		m.setAt(m.sModel, i, t1)
		y := grid.LogFreq(i)
		if y < -lpin {
			m.freqPin = i + 1
		}
		m.sigOut[i] = 2 * math.Exp(-eps*y)
		m.gIn[i] = math.Exp(eps * y)
		fsExpLinear(t0, y, -y)
		m.setAt(m.w2d, i, t0)
		// w^{eps} w/(w^2 + 1 - eps)
		w := math.Exp(y)
		for j := range t1 {
			t1[j] = 0
		}
		t1[0] = w*w + 1
		if k > 1 {
			t1[1] = -1
		}
		fsInvInto(t2, t1)
		fsExpLinear(t0, math.Log(w), y)
		fsMulInto(t1, t0, t2)
		m.setAt(m.gModel, i, t1)
		fsExpLinear(t0, math.Log(2*w/(w*w+1)), -y)
		fsMulInto(t1, invq, t0)
		m.setAt(m.sigModel, i, t1)
	}
	return m
}

func (m *epsMap) at(a []float64, i int, dst []float64) {
	for j := range dst {
		dst[j] = a[j*m.n+i]
	}
}

func (m *epsMap) setAt(a []float64, i int, v []float64) {
	for j, x := range v {
		a[j*m.n+i] = x
	}
}

// sineTop applies the series-valued sine transform with the weights kern
// to order top of src: it transforms that order into coef[top] and sets
// order top of dst from coef[0..top], whose lower orders hold the
// transforms of earlier calls (the orders below top are fixed while order
// top iterates, so only one FFT pair per call is needed).
func (m *epsMap) sineTop(dst, src []float64, kern, coef [][]complex128, top int) {
	n := m.n
	m.grid.fft.Coefficients(coef[top], src[top*n:(top+1)*n])
	h := n / 2
	c := m.coefTmp
	for mode := 0; mode <= h; mode++ {
		w := kern[mode]
		var s complex128
		for l := 0; l <= top; l++ {
			s += coef[l][mode] * w[top-l]
		}
		v := cmplx.Conj(s)
		if mode == h {
			v = complex(real(v), 0)
		}
		c[mode] = v
	}
	m.grid.fft.Sequence(dst[top*n:(top+1)*n], c)
}

// apply sets order k-1 of out to that order of the map of gt (both
// coefficient-major of grid length; the conformal tail is B). The orders
// below k-1 of gt must be those of the previous calls: their transforms
// are reused.
func (m *epsMap) apply(out, gt []float64, k int) {
	n, top := m.n, k-1
	g, lg, pw, s := m.tmp[0][:k], m.tmp[1][:k], m.tmp[2][:k], m.tmp[3][:k]
	for i := 0; i < n; i++ {
		m.at(gt, i, g)
		LogSeriesInto(lg, g)
		fsMulInto(pw, m.c.qm1[:k], lg)
		ExpSeriesInto(lg, pw)
		fsMulInto(s, m.c.j2[:k], lg)
		m.bufA[top*n+i] = s[top]*m.tiltS[i] - m.sModel[top*n+i]
	}
	m.sineTop(m.sigT, m.bufA, m.kernS, m.coefS, top)
	den, gt2 := m.tmp[0][:k], m.tmp[1][:k]
	for i := 0; i < n; i++ {
		var v float64
		if i < m.freqPin {
			v = m.c.gtc[top]
		} else {
			m.at(m.w2d, i, den)
			for j := 0; j < k; j++ {
				den[j] += m.sigT[j*n+i]*m.sigOut[i] + m.sigModel[j*n+i]
			}
			fsInvInto(gt2, den)
			v = gt2[top]
		}
		m.bufA[top*n+i] = (v - m.gModel[top*n+i]) * m.gIn[i]
	}
	m.sineTop(m.bufB, m.bufA, m.kernG, m.coefG, top)
	for i := 0; i < m.free; i++ {
		out[top*n+i] = m.bufB[top*n+i]*m.gOut[i] + m.gtModel[top*n+i]
	}
	for i := m.free; i < n; i++ {
		out[top*n+i] = m.c.b[top]
	}
}

// SolveZeroTEps solves the zero-temperature Schwinger-Dyson equations as
// power series in eps = 1 - 2/q to p.Order: the map of SolveZeroT (same
// log grid, tilts and conformal tail) with every sample a truncated series
// and the q-dependence of the constants, the powers tau^{2D}, w^{2D} and
// the Mellin weights of the moving tilts 2D - 2 + Tilt, 2D - 1 - Tilt
// expanded in eps. Each order solves the linearised q = 2 equation with
// sources from the lower orders, so the iteration on the whole series
// converges like the q = 2 one; non-convergence is an error.
func SolveZeroTEps(p EpsSeriesParams) (*ZeroTEpsSeries, error) {
	if p.Order < 0 || p.Order > MaxEpsSeriesOrder {
		return nil, fmt.Errorf("%w: the order of the zero-temperature eps-series must lie in 0..%d, got %d", ErrInput, MaxEpsSeriesOrder, p.Order)
	}
	gp := p.Grid
	gp.Q = 2
	if err := gp.fill(); err != nil {
		return nil, err
	}
	p.Grid = gp
	k := p.Order + 1
	if p.KernelRadius == 0 {
		p.KernelRadius = DefaultKernelRadius
	}
	if !(p.KernelRadius >= 0.3 && p.KernelRadius <= 0.9) {
		return nil, fmt.Errorf("%w: the kernel radius of the eps-series solve must lie in [0.3, 0.9], got %g", ErrInput, p.KernelRadius)
	}
	m, err := newEpsMap(gp, p.KernelRadius, k)
	if err != nil {
		return nil, err
	}
	n, free := m.n, m.free
	// Start: order 0 from the large-q form at q = 2, higher orders zero.
	full := make([]float64, n*k)
	c := 1 / (2 * m.c.b[0])
	for i := 0; i < n; i++ {
		t := m.grid.Tau(i)
		full[i] = 0.5 * t / (1 + c*t)
		if i >= free {
			for j := 0; j < k; j++ {
				full[j*n+i] = m.c.b[j]
			}
		}
	}
	out := make([]float64, n*k)
	x := make([]float64, free)
	w := make([]float64, free)
	for i := range w {
		w[i] = m.tiltS[i] / m.c.b[0]
	}
	sol := &ZeroTEpsSeries{Params: p, B: append([]float64(nil), m.c.b...), Points: n}
	// Order by order: with the lower orders fixed, order j of the map is
	// affine in order j of its argument (the series operations are
	// triangular), with the linearised q = 2 map as its linear part.
	for j := 0; j < k; j++ {
		copy(x, full[j*n:j*n+free])
		row := full[j*n : j*n+free]
		fp := fixedPoint{tol: gp.Tol, mix: 0.5, active: free, floor: true}
		if gp.Progress != nil {
			j := j
			fp.progress = func(it int, res, _ float64) {
				if it%10 == 0 {
					gp.Progress(float64(j)/float64(k), fmt.Sprintf("T = 0 eps-series: order %d of %d, %d points, iteration %d, residual %.2e", j, p.Order, n, it, res))
				}
			}
		}
		r := fp.run(x, func(x, fx []float64) float64 {
			copy(row, x)
			m.apply(out, full, j+1)
			res := 0.0
			for i := 0; i < free; i++ {
				d := math.Abs(out[j*n+i]-x[i]) * w[i]
				if d > res || math.IsNaN(d) {
					res = d
				}
				fx[i] = out[j*n+i] - x[i]
			}
			return res
		})
		if r.nanAt > 0 {
			return nil, fmt.Errorf("numeric: NaN in the zero-temperature eps-series iteration (order %d, iteration %d)", j, r.nanAt)
		}
		res, it := r.res, r.it
		if !r.converged(gp.Tol) {
			return nil, fmt.Errorf("numeric: zero-temperature eps-series iteration did not converge at order %d (%d points): residual %.3g after %d iterations (tolerance %.3g)", j, n, r.bestRes, min(it, maxIterations), gp.Tol)
		}
		copy(row, x)
		// Refresh the transforms of this order for the state kept: the
		// next orders reuse them.
		m.apply(out, full, j+1)
		sol.Iterations += min(it, maxIterations)
		sol.Residual = math.Max(sol.Residual, res)
		sol.OrderResidual = append(sol.OrderResidual, res)
	}
	if p.Extended {
		if gp.Progress != nil {
			gp.Progress(float64(k-1)/float64(k), fmt.Sprintf("T = 0 eps-series: double-double refinement of %d orders", k))
		}
		md, err := newEpsMapDD(m, gp.Tilt, p.KernelRadius, k)
		if err != nil {
			return nil, err
		}
		X, res, err := refineEpsDD(m, md, gp, p.KernelRadius, full, k)
		if err != nil {
			return nil, err
		}
		sol.RefinedResidual = res
		epsOutputDD(md, X, k, gp.Step, sol)
		if gp.Progress != nil {
			gp.Progress(1, fmt.Sprintf("T = 0 eps-series to order %d: done", p.Order))
		}
		return sol, nil
	}
	sol.Tau = make([]float64, free)
	sol.Ratio = make([][]float64, k)
	for j := range sol.Ratio {
		sol.Ratio[j] = make([]float64, free)
	}
	invB := make([]float64, k)
	fsInvInto(invB, m.c.b)
	g, r, lg, pw, sum := m.tmp[0], m.tmp[1], m.tmp[2], m.tmp[3], m.tmp[4]
	for j := range sum {
		sum[j] = 0
	}
	for i := 0; i < n; i++ {
		m.at(full, i, g)
		lt := m.grid.LogTau(i)
		if i < free {
			sol.Tau[i] = math.Exp(lt)
			fsMulInto(r, g, invB)
			for j := range r {
				sol.Ratio[j][i] = r[j]
			}
		}
		// G^q tau = Gt^q / tau.
		LogSeriesInto(lg, g)
		fsMulInto(pw, m.c.q, lg)
		pw[0] -= lt
		ExpSeriesInto(lg, pw)
		for j := range sum {
			sum[j] += lg[j]
		}
	}
	if gp.Progress != nil {
		gp.Progress(1, fmt.Sprintf("T = 0 eps-series to order %d: done", p.Order))
	}
	// E_0 = -(2 J^2/q) int G^q dtau.
	j2q, iq := m.tmp[5], make([]float64, k)
	iq[0] = 0.5
	if k > 1 {
		iq[1] = -0.5
	}
	fsMulInto(j2q, m.c.j2, iq)
	sol.E0 = make([]float64, k)
	fsMulInto(sol.E0, j2q, sum)
	for j := range sol.E0 {
		sol.E0[j] *= -2 * gp.Step
	}
	return sol, nil
}
