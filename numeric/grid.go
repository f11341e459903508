package numeric

import (
	"math"

	"gonum.org/v1/gonum/dsp/fourier"
)

// grid is one uniform discretisation of the half interval [0, beta/2].
//
// Because G(beta - tau) = G(tau) and only odd Matsubara frequencies
// w_n = (2n+1) pi / beta occur, G is fully described by its values at
// tau_k = k h, k = 1..m, h = beta/(2m) (G(0+) = 1/2 is fixed), and by the
// sine coefficients g_n = 2 int_0^{beta/2} sin(w_n tau) G(tau) dtau,
// n = 0..m-1. The discrete pair between the two is a quarter-wave sine
// transform, which keeps the particle-hole symmetry exact: no complex FFT
// over [0, beta) whose round-off could seed a symmetry-breaking mode.
type grid struct {
	q, beta float64
	m       int
	h       float64
	w       []float64 // Matsubara frequencies w_n, n = 0..m-1
	tau     []float64 // tau_k, k = 1..m (index k-1)
	fft     *fourier.QuarterWaveFFT
}

func newGrid(q, beta float64, m int) *grid {
	g := &grid{q: q, beta: beta, m: m, h: beta / float64(2*m)}
	g.w = make([]float64, m)
	g.tau = make([]float64, m)
	for n := range g.w {
		g.w[n] = float64(2*n+1) * math.Pi / beta
		g.tau[n] = float64(n+1) * g.h
	}
	g.fft = fourier.NewQuarterWaveFFT(m)
	return g
}

// toFreq sets dst[n] to the trapezoid-rule sine coefficient of f, where
// f[k-1] = f(tau_k): dst_n = 2h [sum_{k<m} f_k sin(w_n tau_k) + f_m sin(w_n beta/2)/2].
func (g *grid) toFreq(dst, f []float64) {
	g.fft.SinCoefficients(dst, f)
	for i := range dst {
		dst[i] *= g.h
	}
}

// toTime is the exact inverse of toFreq: dst_k = (2/beta) sum_n c_n sin(w_n tau_k).
func (g *grid) toTime(dst, c []float64) {
	g.fft.SinSequence(dst, c)
	s := 1 / (2 * g.beta)
	for i := range dst {
		dst[i] *= s
	}
}

// coshRatio returns cosh(a (beta/2 - tau)) / cosh(a beta/2) without overflow.
func coshRatio(a, tau, beta float64) float64 {
	l := beta / 2
	return (math.Exp(-a*tau) + math.Exp(-a*(2*l-tau))) / (1 + math.Exp(-2*a*l))
}

// coshRatioFreq is the exact sine coefficient of coshRatio(a, ., beta) at
// an odd Matsubara frequency w: 2w/(w^2 + a^2).
func coshRatioFreq(a, w float64) float64 { return 2 * w / (w*w + a*a) }

// fillCoshRatio writes coshRatio(a, tau_k) for all grid points, using a
// multiplicative recurrence refreshed every 64 steps so the cost is mostly
// multiplications and the round-off stays at a few ulps.
func (g *grid) fillCoshRatio(dst []float64, a float64) {
	l := g.beta / 2
	den := 1 / (1 + math.Exp(-2*a*l))
	step := math.Exp(-a * g.h)
	inv := 1 / step
	var up, down float64
	for k := range dst {
		if k%64 == 0 {
			t := g.tau[k]
			up = math.Exp(-a * t)
			down = math.Exp(-a * (2*l - t))
		} else {
			up *= step
			down *= inv
		}
		dst[k] = (up + down) * den
	}
}
