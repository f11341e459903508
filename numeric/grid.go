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
// Grids of the same beta share their Matsubara frequencies, so a solution
// moves between them by truncating or zero-padding its coefficients.
type grid struct {
	q, beta float64
	m       int
	h       float64
	dw      float64 // w_n = (2n+1) dw
	fft     *fourier.QuarterWaveFFT
}

func newGrid(q, beta float64, m int) *grid {
	return &grid{q: q, beta: beta, m: m, h: beta / float64(2*m), dw: math.Pi / beta, fft: fourier.NewQuarterWaveFFT(m)}
}

// freq returns the Matsubara frequency w_n.
func (g *grid) freq(n int) float64 { return float64(2*n+1) * g.dw }

// toFreq sets dst[n] to the trapezoid-rule sine coefficient of f, where
// f[k-1] = f(tau_k): dst_n = 2h [sum_{k<m} f_k sin(w_n tau_k) + f_m sin(w_n beta/2)/2].
// dst and f may be the same slice.
func (g *grid) toFreq(dst, f []float64) {
	g.fft.SinCoefficients(dst, f)
	for i := range dst {
		dst[i] *= g.h
	}
}

// toTime is the exact inverse of toFreq: dst_k = (2/beta) sum_n c_n sin(w_n tau_k).
// dst and c may be the same slice.
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

// addCoshRatio adds c coshRatio(a, tau_k) to dst[k-1] for all grid points,
// using a multiplicative recurrence refreshed every 64 steps so the cost is
// mostly multiplications and the round-off stays at a few ulps.
func (g *grid) addCoshRatio(dst []float64, a, c float64) {
	l := g.beta / 2
	den := c / (1 + math.Exp(-2*a*l))
	step := math.Exp(-a * g.h)
	inv := 1 / step
	var up, down float64
	for k := range dst {
		if k%64 == 0 {
			t := float64(k+1) * g.h
			up = math.Exp(-a * t)
			down = math.Exp(-a * (2*l - t))
		} else {
			up *= step
			down *= inv
		}
		dst[k] += (up + down) * den
	}
}
