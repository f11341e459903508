package numeric

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/dsp/fourier"
)

// HalfGrid is one uniform discretisation of the half interval [0, beta/2]
// of a function f(tau) with f(beta - tau) = f(tau) whose odd extension
// contains only the odd Matsubara frequencies w_n = (2n+1) pi / beta, such
// as G and Sigma of the Schwinger-Dyson equations.
//
// Such an f is described by its values at tau_k = k h, k = 1..M,
// h = beta/(2M), and by its sine coefficients
// f_n = 2 int_0^{beta/2} sin(w_n tau) f(tau) dtau, n = 0..M-1. The discrete
// pair between the two is a quarter-wave sine transform, which keeps the
// particle-hole symmetry exact: no complex FFT over [0, beta) whose
// round-off could seed a symmetry-breaking mode. Grids of the same beta
// share their Matsubara frequencies, so a function moves between them by
// truncating or zero-padding its coefficients.
//
// A HalfGrid is not safe for concurrent use (the transforms share work
// space).
type HalfGrid struct {
	beta float64
	m    int
	h    float64
	dw   float64 // w_n = (2n+1) dw
	fft  *fourier.QuarterWaveFFT
	jump *jumpModels // built on first use by the Jump transforms
}

// NewHalfGrid returns the grid of m points on (0, beta/2]; beta must be
// positive and finite and m at least 1.
func NewHalfGrid(beta float64, m int) (*HalfGrid, error) {
	if !(beta > 0) || math.IsInf(beta, 0) || m < 1 {
		return nil, fmt.Errorf("%w: a half-interval grid needs beta > 0 finite and at least one point, got beta %g, %d points", ErrInput, beta, m)
	}
	return &HalfGrid{beta: beta, m: m, h: beta / float64(2*m), dw: math.Pi / beta, fft: fourier.NewQuarterWaveFFT(m)}, nil
}

// Beta returns the inverse temperature of the grid.
func (g *HalfGrid) Beta() float64 { return g.beta }

// M returns the number of points on (0, beta/2] (and of sine coefficients).
func (g *HalfGrid) M() int { return g.m }

// H returns the grid spacing beta/(2M).
func (g *HalfGrid) H() float64 { return g.h }

// Freq returns the Matsubara frequency w_n = (2n+1) pi / beta.
func (g *HalfGrid) Freq(n int) float64 { return float64(2*n+1) * g.dw }

// Tau returns tau_k = k h (k = 1..M are the grid points, k = 0 is tau = 0).
func (g *HalfGrid) Tau(k int) float64 { return float64(k) * g.h }

// Freqs returns a new slice of the M frequencies w_0..w_{M-1}.
func (g *HalfGrid) Freqs() []float64 {
	w := make([]float64, g.m)
	for n := range w {
		w[n] = g.Freq(n)
	}
	return w
}

// checkLen reports a slice that does not have the grid's length.
func (g *HalfGrid) checkLen(what string, vs ...[]float64) error {
	for _, v := range vs {
		if len(v) != g.m {
			return fmt.Errorf("%w: %s needs slices of the grid's length %d, got %d", ErrInput, what, g.m, len(v))
		}
	}
	return nil
}

// ToFreq sets dst[n] to the trapezoid-rule sine coefficient of f, where
// f[k-1] = f(tau_k): dst_n = 2h [sum_{k<M} f_k sin(w_n tau_k) + f_M sin(w_n beta/2)/2].
// dst and f may be the same slice; both must have length M.
func (g *HalfGrid) ToFreq(dst, f []float64) error {
	if err := g.checkLen("ToFreq", dst, f); err != nil {
		return err
	}
	g.toFreq(dst, f)
	return nil
}

// ToTime is the exact inverse of ToFreq: dst_k = (2/beta) sum_n c_n sin(w_n tau_k).
// dst and c may be the same slice; both must have length M.
func (g *HalfGrid) ToTime(dst, c []float64) error {
	if err := g.checkLen("ToTime", dst, c); err != nil {
		return err
	}
	g.toTime(dst, c)
	return nil
}

// toFreq is ToFreq without the length check.
func (g *HalfGrid) toFreq(dst, f []float64) {
	g.fft.SinCoefficients(dst, f)
	scaleInPlace(dst, g.h)
}

// toTime is ToTime without the length check.
func (g *HalfGrid) toTime(dst, c []float64) {
	g.fft.SinSequence(dst, c)
	scaleInPlace(dst, 1/(2*g.beta))
}

func scaleInPlace(v []float64, s float64) {
	for i := range v {
		v[i] *= s
	}
}

// Trapezoid returns h [f0/2 + f_1 + ... + f_{n-1} + f_n/2], n = len(f):
// the trapezoid rule with the grid spacing on [0, n h] for f(0) = f0 and
// f(tau_k) = f[k-1] (on [0, beta/2] when n = M). It is 0 for an empty f.
func (g *HalfGrid) Trapezoid(f0 float64, f []float64) float64 {
	n := len(f)
	if n == 0 {
		return 0
	}
	var s CompSum // compensated: grids reach 10^6 points
	s.Add(0.5 * f0)
	for k := 0; k < n-1; k++ {
		s.Add(f[k])
	}
	s.Add(0.5 * f[n-1])
	return s.Sum() * g.h
}

// CoshRatio returns cosh(a (beta/2 - tau)) / cosh(a beta/2) without overflow.
// As a function on (0, beta) it is even about beta/2, its odd extension
// jumps by 2 at tau = 0, and its sine coefficients are CoshRatioFreq.
func CoshRatio(a, tau, beta float64) float64 {
	l := beta / 2
	return (math.Exp(-a*tau) + math.Exp(-a*(2*l-tau))) / (1 + math.Exp(-2*a*l))
}

// CoshRatioFreq is the exact sine coefficient of CoshRatio(a, ., beta) at
// an odd Matsubara frequency w: 2w/(w^2 + a^2).
func CoshRatioFreq(a, w float64) float64 { return 2 * w / (w*w + a*a) }

// addCoshRatio adds c CoshRatio(a, tau_k) to dst[k-1] for all grid points,
// using a multiplicative recurrence refreshed every 64 steps so the cost is
// mostly multiplications and the round-off stays at a few ulps.
func (g *HalfGrid) addCoshRatio(dst []float64, a, c float64) {
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

// MatsubaraTails returns, in closed form, the sums over the odd Matsubara
// frequencies w_n = (2n+1) pi/beta, n >= 0, of
// S1 = sum 2/(w_n^2 + c^2) = beta tanh(c beta/2)/(2c) and
// S2 = sum 2/(w_n^2 + c^2)^2 = -dS1/d(c^2): the exact sums of the
// 1/w^2 and 1/w^4 tails subtracted from Matsubara sums. c must be positive.
func MatsubaraTails(beta, c float64) (s1, s2 float64) {
	x := c * beta / 2
	th := math.Tanh(x)
	s1 = beta * th / (2 * c)
	sech2 := 1 - th*th
	s2 = beta / (4 * c * c * c) * (th - x*sech2)
	return s1, s2
}

// Decay rates of the two jump models of ToFreqJump; any two distinct
// values of order one work.
const (
	jumpA1 = 1.0
	jumpA2 = 2.0
)

// jumpModels are CoshRatio(jumpA1) and CoshRatio(jumpA2) on the grid
// (time) and their exact sine coefficients (freq).
type jumpModels struct {
	time, freq [2][]float64
}

func (g *HalfGrid) jumps() *jumpModels {
	if g.jump != nil {
		return g.jump
	}
	j := &jumpModels{}
	for i, a := range [2]float64{jumpA1, jumpA2} {
		j.time[i] = make([]float64, g.m)
		j.freq[i] = make([]float64, g.m)
		for k := range j.time[i] {
			j.time[i][k] = CoshRatio(a, g.Tau(k+1), g.beta)
			j.freq[i][k] = CoshRatioFreq(a, g.Freq(k))
		}
	}
	g.jump = j
	return j
}

// jumpWeights returns the weights of the two jump models whose sum has
// value v and second derivative d at tau = 0+.
func jumpWeights(v, d float64) (c1, c2 float64) {
	a1, a2 := jumpA1*jumpA1, jumpA2*jumpA2
	c2 = (d - v*a1) / (a2 - a1)
	return v - c2, c2
}

// ToFreqJump sets dst to the sine coefficients of f (values at
// tau_1..tau_M) whose odd extension has value v and second derivative d at
// tau = 0+: two CoshRatio models with those jumps are transformed exactly,
// the remainder, whose odd extension is smooth to third order, by ToFreq.
// At a fixed frequency the error is then O(h^6) (the first Euler-Maclaurin
// term left involves the fourth derivative at 0+), against O(h^2) for ToFreq
// of a function with a jump. Both slices must have length M.
func (g *HalfGrid) ToFreqJump(dst, f []float64, v, d float64) error {
	if err := g.checkLen("ToFreqJump", dst, f); err != nil {
		return err
	}
	j := g.jumps()
	g.jumpTransform(dst, f, v, d, j.time, j.freq, g.h, g.fft.SinCoefficients)
	return nil
}

// ToTimeJump is the exact inverse of ToFreqJump: it sets dst to the
// function with sine coefficients c whose value at 0+ is v and second
// derivative d. Both slices must have length M.
func (g *HalfGrid) ToTimeJump(dst, c []float64, v, d float64) error {
	if err := g.checkLen("ToTimeJump", dst, c); err != nil {
		return err
	}
	j := g.jumps()
	g.jumpTransform(dst, c, v, d, j.freq, j.time, 1/(2*g.beta), g.fft.SinSequence)
	return nil
}

// jumpTransform subtracts the jump models (in the representation from) from
// src, transforms the remainder with tr and the scale s, and adds the
// models back in the representation to.
func (g *HalfGrid) jumpTransform(dst, src []float64, v, d float64, from, to [2][]float64, s float64, tr func(dst, src []float64) []float64) {
	c1, c2 := jumpWeights(v, d)
	r := make([]float64, g.m)
	for k := range r {
		r[k] = src[k] - c1*from[0][k] - c2*from[1][k]
	}
	tr(dst, r)
	for k := range dst {
		dst[k] = dst[k]*s + c1*to[0][k] + c2*to[1][k]
	}
}
