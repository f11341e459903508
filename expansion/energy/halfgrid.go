package energy

import (
	"math"

	"gonum.org/v1/gonum/dsp/fourier"
)

// halfGrid is a uniform grid tau_k = k h, k = 1..m, h = beta/(2m), on the half
// interval (0, beta/2] of a function f with f(beta - tau) = f(tau), odd in tau,
// together with its sine coefficients f_n = 2 int_0^{beta/2} sin(w_n tau) f dtau
// at the odd Matsubara frequencies w_n = (2n+1) pi/beta, n = 0..m-1.
//
// The discontinuities of the odd extension at tau = 0 (a jump of the value and
// of the second derivative) are carried by two model functions
// cosh(a (beta/2 - tau))/cosh(a beta/2) with fixed a = modelA1, modelA2 whose
// sine coefficients 2w/(w^2+a^2) are exact; the remainder is smooth to third
// order and its discrete transform is accurate to O(h^4).
type halfGrid struct {
	beta float64
	m    int
	h    float64
	w    []float64
	tau  []float64
	fft  *fourier.QuarterWaveFFT
	// model functions on the grid and their sine coefficients
	c1, c2   []float64
	c1w, c2w []float64
}

// The two model decay rates; any two distinct values of order one work.
const (
	modelA1 = 1.0
	modelA2 = 2.0
)

func newHalfGrid(beta float64, m int) *halfGrid {
	g := &halfGrid{beta: beta, m: m, h: beta / float64(2*m)}
	g.w = make([]float64, m)
	g.tau = make([]float64, m)
	for n := range g.w {
		g.w[n] = float64(2*n+1) * math.Pi / beta
		g.tau[n] = float64(n+1) * g.h
	}
	g.fft = fourier.NewQuarterWaveFFT(m)
	g.c1, g.c1w = g.coshModel(modelA1)
	g.c2, g.c2w = g.coshModel(modelA2)
	return g
}

// coshModel returns cosh(a(beta/2 - tau))/cosh(a beta/2) on the grid and its
// exact sine coefficients 2w/(w^2 + a^2).
func (g *halfGrid) coshModel(a float64) (t, f []float64) {
	t = make([]float64, g.m)
	f = make([]float64, g.m)
	l := g.beta / 2
	den := 1 + math.Exp(-2*a*l)
	for k, tau := range g.tau {
		t[k] = (math.Exp(-a*tau) + math.Exp(-a*(2*l-tau))) / den
	}
	for n, w := range g.w {
		f[n] = 2 * w / (w*w + a*a)
	}
	return t, f
}

// modelCoef returns the weights (c1, c2) of the two model functions whose sum
// has value v and second derivative d at tau = 0+.
func modelCoef(v, d float64) (c1, c2 float64) {
	a1, a2 := modelA1*modelA1, modelA2*modelA2
	c2 = (d - v*a1) / (a2 - a1)
	return v - c2, c2
}

// toFreq sets dst to the sine coefficients of f (values at tau_1..tau_m),
// whose odd extension has value v and second derivative d at 0+: the model
// part exactly, the remainder by the end-corrected trapezoid rule.
func (g *halfGrid) toFreq(dst, f []float64, v, d float64) {
	c1, c2 := modelCoef(v, d)
	r := make([]float64, g.m)
	for k := range r {
		r[k] = f[k] - c1*g.c1[k] - c2*g.c2[k]
	}
	g.fft.SinCoefficients(dst, r)
	for n := range dst {
		dst[n] = dst[n]*g.h + c1*g.c1w[n] + c2*g.c2w[n]
	}
}

// toTime sets dst to the function with sine coefficients c whose value at
// 0+ is v and second derivative d: the model part exactly, the remainder by
// the inverse discrete transform (exact inverse of the trapezoid rule).
func (g *halfGrid) toTime(dst, c []float64, v, d float64) {
	c1, c2 := modelCoef(v, d)
	r := make([]float64, g.m)
	for n := range r {
		r[n] = c[n] - c1*g.c1w[n] - c2*g.c2w[n]
	}
	g.fft.SinSequence(dst, r)
	s := 1 / (2 * g.beta)
	for k := range dst {
		dst[k] = dst[k]*s + c1*g.c1[k] + c2*g.c2[k]
	}
}

// trapezoid returns h [f0/2 + f_1 + ... + f_{m-1} + f_m/2], the trapezoid
// rule on [0, beta/2] with f(0+) = f0.
func (g *halfGrid) trapezoid(f0 float64, f []float64) float64 {
	s := 0.5 * f0
	for k := 0; k < g.m-1; k++ {
		s += f[k]
	}
	s += 0.5 * f[g.m-1]
	return s * g.h
}

// matsubaraTails returns S1 = sum_{n>=0} 2/(w_n^2+c^2) and
// S2 = sum_{n>=0} 2/(w_n^2+c^2)^2 in closed form.
func matsubaraTails(beta, c float64) (s1, s2 float64) {
	x := c * beta / 2
	th := math.Tanh(x)
	s1 = beta * th / (2 * c)
	sech2 := 1 - th*th
	s2 = beta / (4 * c * c * c) * (th - x*sech2)
	return s1, s2
}
