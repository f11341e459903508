package numeric

import (
	"fmt"
	"math"
)

// ZeroTParams selects one zero-temperature Schwinger-Dyson solve (SolveZeroT).
// Units are script-J = 1 (J^2 = 2^{q-1}/q). Zero fields take the defaults.
type ZeroTParams struct {
	Q float64 // interaction order, real, >= 2
	// Step is the grid spacing in log tau (default DefaultZeroTStep). The
	// aliasing error of the log-grid transforms falls like
	// exp(-pi^2/(2 Step)).
	Step float64
	// TauMin is the first grid point (default 1e-16): the tilted
	// self-energy there, tau^{2 - 2/q - Tilt}/q, is below 1e-15 for every
	// q >= 2 and below 1e-19 for q >= 3.
	TauMin float64
	// TauPin is where the grid hands over to the conformal solution
	// (default 1e40): beyond it G = G_c exactly, which is exact to
	// alpha_G/TauPin and keeps the far end, where the tilted values carry no
	// digits, from feeding back. The grid extends from TauPin by
	// 18/Tilt decades more, so that the tilted functions are 1e-18 at the seam.
	TauPin float64
	// Tilt is the epsilon of the tilts (default 0.15): the transforms see
	// Sigma tau^{2 - 2/q - Tilt} and g w^{1 - 2/q + Tilt}, flat in the
	// conformal region up to |tau|^{-Tilt}, so the round-off relative to
	// G_c grows only like tau^Tilt.
	Tilt float64
	// Tol is the residual (see ZeroTSolution.Residual) at which the
	// iteration stops (default DefaultZeroTTol). A residual that stalls
	// within a factor 100 of Tol is the round-off floor and is accepted;
	// anything above is an error.
	Tol float64
	// Progress, when not nil, receives the fraction done and a short status.
	Progress func(frac float64, detail string)
}

// Defaults of ZeroTParams.
const (
	DefaultZeroTStep   = 0.05
	DefaultZeroTTauMin = 1e-16
	DefaultZeroTTauPin = 1e40
	DefaultZeroTTilt   = 0.15
	DefaultZeroTTol    = 1e-14
)

// ZeroTSolution is the converged zero-temperature solution on its log grid.
type ZeroTSolution struct {
	Params ZeroTParams // the parameters, defaults filled in
	// B is the conformal amplitude, G_c(tau) = B tau^{-2/q} for tau > 0:
	// B = b J^{-2/q} with b^q pi = (1/2 - 1/q) tan(pi/q) (Maldacena-Stanford
	// arXiv:1604.07818; PHYSICS.md sec. 4).
	B float64
	// Tau holds the grid points up to TauPin, and Ratio = G(tau)/G_c(tau) at
	// each (-> 1 - alpha_G/tau + ... deep in the conformal region).
	Tau, Ratio []float64
	// E0 is the ground-state energy -(2 J^2/q) int_0^inf G^q dtau from the
	// solution (the T -> 0 limit of E = -(J^2/q) int_0^beta |G|^q dtau).
	E0         float64
	Points     int // grid points, including the conformal tail
	Iterations int // fixed-point iterations
	// Residual is the final max change of G/G_c tau^{-Tilt} over the free
	// points: the change in the units in which the transforms work, whose
	// round-off is uniform (G/G_c itself keeps a relative accuracy of the
	// residual times tau^Tilt).
	Residual float64
}

func (p *ZeroTParams) fill() error {
	if p.Step == 0 {
		p.Step = DefaultZeroTStep
	}
	if p.TauMin == 0 {
		p.TauMin = DefaultZeroTTauMin
	}
	if p.TauPin == 0 {
		p.TauPin = DefaultZeroTTauPin
	}
	if p.Tilt == 0 {
		p.Tilt = DefaultZeroTTilt
	}
	if p.Tol == 0 {
		p.Tol = DefaultZeroTTol
	}
	switch {
	case math.IsNaN(p.Q) || p.Q < 2 || math.IsInf(p.Q, 0):
		return fmt.Errorf("%w: the zero-temperature solver needs a finite q >= 2, got %g", ErrInput, p.Q)
	case !(p.Step >= 0.01 && p.Step <= 0.2):
		return fmt.Errorf("%w: log-grid step must lie in [0.01, 0.2], got %g", ErrInput, p.Step)
	case !(p.TauMin > 0 && p.TauMin <= 1e-6):
		return fmt.Errorf("%w: tau-min must lie in (0, 1e-6], got %g", ErrInput, p.TauMin)
	case !(p.TauPin >= 1e12 && p.TauPin <= 1e100):
		return fmt.Errorf("%w: tau-pin must lie in [1e12, 1e100], got %g", ErrInput, p.TauPin)
	case !(p.Tilt >= 0.05 && p.Tilt <= 0.5):
		return fmt.Errorf("%w: tilt must lie in [0.05, 0.5], got %g", ErrInput, p.Tilt)
	case !(p.Tol >= 1e-16 && p.Tol <= 1e-6):
		return fmt.Errorf("%w: tolerance must lie in [1e-16, 1e-6], got %g", ErrInput, p.Tol)
	}
	return nil
}

// ConformalAmplitude returns B = b J^{-2/q}, G_c(tau) = B tau^{-2/q} in units
// script-J = 1 (J^2 = 2^{q-1}/q), from b^q pi = (1/2 - 1/q) tan(pi/q)
// (Maldacena-Stanford arXiv:1604.07818; PHYSICS.md sec. 4).
func ConformalAmplitude(q float64) float64 {
	d := 1 / q
	// (1/2 - D) tan(pi D) = u cot(pi u), u = 1/2 - D, with its q = 2 limit 1/pi.
	u := 0.5 - d
	bq := 1 / (math.Pi * math.Pi)
	if u > 0 {
		bq = u / math.Tan(math.Pi*u) / math.Pi
	}
	lj2 := (q-1)*math.Ln2 - math.Log(q) // log J^2, which overflows float64 for q > 1000
	return math.Exp(d * (math.Log(bq) - lj2))
}

// The iteration stops at Tol, or when the residual has not dropped by 10%
// for zeroTStall iterations while within zeroTFloorFactor of Tol (the
// round-off floor of the transforms, which grows slowly with q).
const (
	zeroTStall       = 60
	zeroTFloorFactor = 100
)

// zeroTMap is the Schwinger-Dyson map on the log grid, in variables scaled
// by the conformal powers: Gt = tau^{2D} G, St = tau^{2-2D} Sigma =
// J^2 Gt^{q-1} (D = 1/q), sigma~ = w^{2D-1} sigma, g~ = w^{1-2D} g =
// 1/(w^{2D} + sigma~), with G(iw) = i g(w), Sigma(iw) = i sigma(w),
// g = 1/(w + sigma), sigma(w) = 2 int_0^inf sin(w tau) Sigma(tau) dtau and
// G(tau) = (1/pi) int_0^inf sin(w tau) g(w) dw. The model w/(w^2 + a^2),
// a^2 = 2/q, carries the 1/w and 1/w^3 tails of g (G(0+) = 1/2,
// Sigma(0+) = 1/q); its transform (1/2) e^{-a tau} is added back.
type zeroTMap struct {
	grid       *LogGrid
	q, d, j2   float64
	b          float64 // conformal amplitude B
	gtc        float64 // conformal g~ = 1/sigma~_c
	pS, pG     float64 // tilts of the two transforms
	free       int     // points 0..free-1 are iterated; the rest are G_c
	freqPin    int     // frequencies j < freqPin are conformal
	tiltS      []float64
	resWeight  []float64 // tau^{-eps}/B: residuals are measured in the tilted units
	sigOut     []float64 // 2 w^{-eps}
	w2d        []float64 // w^{2D}
	gModel     []float64 // w^{1-2D} w/(w^2+a^2)
	gIn        []float64 // w^{eps}
	gOut       []float64 // tau^{eps}/pi
	gtModel    []float64 // tau^{2D} e^{-a tau}/2
	bufA, bufB []float64
}

// zeroTSpan is the extent in log tau of the zero-temperature grid: from
// TauMin to TauPin, then 18/Tilt decades of conformal tail, where the
// tilted functions fall to 1e-18.
func zeroTSpan(p ZeroTParams) float64 {
	return math.Log(p.TauPin/p.TauMin) + 18/p.Tilt*math.Ln10
}

// zeroTGrid is the log grid of the smallest power-of-two size that covers
// span with the step of p.
func zeroTGrid(p ZeroTParams, span float64) (*LogGrid, error) {
	n := 16
	for float64(n-1)*p.Step < span {
		n *= 2
	}
	return NewLogGrid(p.TauMin, p.Step, n)
}

func newZeroTMap(p ZeroTParams) (*zeroTMap, error) {
	q := p.Q
	d := 1 / q
	eps := p.Tilt
	grid, err := zeroTGrid(p, zeroTSpan(p))
	if err != nil {
		return nil, err
	}
	n := grid.n
	m := &zeroTMap{grid: grid, q: q, d: d, j2: math.Pow(2, q-1) / q, b: ConformalAmplitude(q),
		pS: 2*d - 2 + eps, pG: 2*d - 1 - eps}
	// Conformal sigma~: Sigma_c = J^2 B^{q-1} tau^{2D-2}, sigma_c = 2 J^2 B^{q-1} M(2D-2) w^{1-2D}.
	m.gtc = 1 / (2 * m.j2 * math.Pow(m.b, q-1) * real(mellinSine(complex(2*d-2, 0))))
	a := math.Sqrt(2 / q)
	lpin := math.Log(p.TauPin)
	mk := func() []float64 { return make([]float64, n) }
	m.resWeight = mk()
	m.tiltS, m.sigOut, m.w2d, m.gModel, m.gIn, m.gOut, m.gtModel = mk(), mk(), mk(), mk(), mk(), mk(), mk()
	m.bufA, m.bufB = mk(), mk()
	for k := 0; k < n; k++ {
		x := grid.LogTau(k)
		if x <= lpin {
			m.free = k + 1
		}
		m.tiltS[k] = math.Exp(-eps * x)
		m.resWeight[k] = m.tiltS[k] / m.b
		m.gOut[k] = math.Exp(eps*x) / math.Pi
		m.gtModel[k] = 0.5 * math.Exp(2*d*x-a*math.Exp(x))
		y := grid.LogFreq(k)
		if y < -lpin {
			m.freqPin = k + 1
		}
		m.sigOut[k] = 2 * math.Exp(-eps*y)
		m.w2d[k] = math.Exp(2 * d * y)
		m.gModel[k] = math.Exp((2-2*d)*y) / (math.Exp(2*y) + a*a)
		m.gIn[k] = math.Exp(eps * y)
	}
	return m, nil
}

// apply sets out to the map of gt (both of grid length; out's conformal
// tail is set to B).
func (m *zeroTMap) apply(out, gt []float64) {
	n := m.grid.n
	s := m.bufA
	for k := 0; k < n; k++ {
		s[k] = m.j2 * powAbs(gt[k], m.q-1) * m.tiltS[k]
	}
	m.grid.sine(m.bufB, s, m.pS)
	r := m.bufA
	for j := 0; j < n; j++ {
		gtil := m.gtc
		if j >= m.freqPin {
			gtil = 1 / (m.w2d[j] + m.bufB[j]*m.sigOut[j])
		}
		r[j] = (gtil - m.gModel[j]) * m.gIn[j]
	}
	m.grid.sine(m.bufB, r, m.pG)
	for k := 0; k < m.free; k++ {
		out[k] = m.bufB[k]*m.gOut[k] + m.gtModel[k]
	}
	for k := m.free; k < n; k++ {
		out[k] = m.b
	}
}

// SolveZeroT solves the large-N Schwinger-Dyson equations at zero
// temperature on a logarithmic grid in tau from TauMin to far beyond
// TauPin, with the sine transforms of LogGrid (exact in Mellin space) in
// variables scaled by the conformal powers, so that G/G_c is an O(1)
// number everywhere and keeps its digits deep in the conformal region. The
// iteration is Anderson-accelerated with a damping weight halved whenever
// the residual grows; non-convergence is an error.
func SolveZeroT(p ZeroTParams) (*ZeroTSolution, error) {
	if err := p.fill(); err != nil {
		return nil, err
	}
	m, err := newZeroTMap(p)
	if err != nil {
		return nil, err
	}
	n, q, d := m.grid.n, p.Q, m.d
	// Start from the large-q form G = (1/2)(1 + c tau)^{-2D}, matched to G_c.
	c := math.Pow(2*m.b, -1/(2*d))
	x := make([]float64, n)
	for k := 0; k < n; k++ {
		lt := m.grid.LogTau(k)
		lc := math.Log(c) + lt // log(c tau)
		var l1 float64
		if lc > 0 {
			l1 = lc + math.Log1p(math.Exp(-lc))
		} else {
			l1 = math.Log1p(math.Exp(lc))
		}
		x[k] = 0.5 * math.Exp(2*d*lt-2*d*l1)
		if k >= m.free {
			x[k] = m.b
		}
	}
	fp := fixedPoint{tol: p.Tol, mix: 0.5, active: m.free, floor: true}
	if p.Progress != nil {
		fp.progress = func(it int, res, startRes float64) {
			if it%10 == 0 && startRes > p.Tol {
				f := math.Log(startRes/res) / math.Log(startRes/p.Tol)
				p.Progress(math.Max(0, math.Min(1, f)), fmt.Sprintf("T = 0, %d points, iteration %d, residual %.2e", n, it, res))
			}
		}
	}
	r := fp.run(x, func(x, fx []float64) float64 {
		m.apply(fx, x)
		res := 0.0
		for k := 0; k < m.free; k++ {
			dk := math.Abs(fx[k]-x[k]) * m.resWeight[k]
			if dk > res || math.IsNaN(dk) {
				res = dk
			}
			fx[k] -= x[k]
		}
		return res
	})
	if r.nanAt > 0 {
		return nil, fmt.Errorf("numeric: NaN in the zero-temperature iteration at q=%g (iteration %d)", q, r.nanAt)
	}
	res, it := r.res, r.it
	if !r.converged(p.Tol) {
		return nil, fmt.Errorf("numeric: zero-temperature iteration did not converge at q=%g (%d points): residual %.3g after %d iterations (tolerance %.3g); try a looser tolerance or a smaller step", q, n, r.bestRes, it-1, p.Tol)
	}
	sol := &ZeroTSolution{Params: p, B: m.b, Points: n, Iterations: it, Residual: res}
	sol.Tau = make([]float64, m.free)
	sol.Ratio = make([]float64, m.free)
	sum := 0.0
	for k := 0; k < n; k++ {
		g := x[k]
		if k >= m.free {
			g = m.b
		}
		lt := m.grid.LogTau(k)
		sum += math.Exp(q*math.Log(math.Abs(g)) - lt)
		if k < m.free {
			sol.Tau[k] = math.Exp(lt)
			sol.Ratio[k] = g / m.b
		}
	}
	sol.E0 = -2 * m.j2 / q * sum * p.Step
	return sol, nil
}
