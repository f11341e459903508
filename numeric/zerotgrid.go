package numeric

import (
	"fmt"
	"math"
	"math/cmplx"

	"gonum.org/v1/gonum/dsp/fourier"
)

// LogGrid is a uniform grid in log tau, tau_k = exp(x0 + k step),
// k = 0..N-1, together with its mirror grid in frequency,
// w_j = 1/tau_{N-1-j}, on which the sine transform
//
//	F(w) = int_0^infinity sin(w tau) f(tau) dtau
//
// is diagonal in Mellin space (a logarithmic FFT): the samples of the
// tilted function a(x) = f(e^x) e^{-p x} are read as one period of a
// trigonometric polynomial in x = log tau, and every Fourier mode
// tau^{p + i eta} transforms exactly, int_0^inf sin(w tau) tau^s dtau =
// M(s) w^{-1-s} with M(s) = Gamma(1+s) sin(pi (1+s)/2) (DLMF 5.9.7 with
// the substitution t = w tau), valid for -2 < Re s < 0.
//
// There is no quadrature error: what is left is aliasing, which for a
// function analytic in |Im x| < pi/2 (a Laplace transform in tau, as every
// Green's function in imaginary time) falls like exp(-pi^2/(2 step)), and
// the seam of the periodic extension, whose size is that of the tilted
// function at the two ends of the grid. The tilt p must make a(x) small at
// both ends. Because the grid and its mirror have the same spacing and
// x0 + y0 = -(N-1) step, the same transform maps the tau grid to the
// frequency grid and back.
//
// A LogGrid is not safe for concurrent use.
type LogGrid struct {
	n    int
	x0   float64 // log tau_0
	step float64 // spacing in log tau
	fft  *fourier.FFT
	coef []complex128
	kern map[float64][]complex128 // per tilt: M(p + i eta_m) e^{-2 pi i m/N} / N
}

// NewLogGrid returns the grid of n points (n even, at least 16) with
// tau_0 = tauMin and spacing step in log tau (positive).
func NewLogGrid(tauMin, step float64, n int) (*LogGrid, error) {
	if !(tauMin > 0) || math.IsInf(tauMin, 0) || !(step > 0) || math.IsInf(step, 0) || n < 16 || n%2 != 0 {
		return nil, fmt.Errorf("%w: a log grid needs tau_min > 0, a positive step and an even number >= 16 of points, got %g, %g, %d", ErrInput, tauMin, step, n)
	}
	return &LogGrid{n: n, x0: math.Log(tauMin), step: step, fft: fourier.NewFFT(n),
		coef: make([]complex128, n/2+1), kern: map[float64][]complex128{}}, nil
}

// N returns the number of points.
func (g *LogGrid) N() int { return g.n }

// Step returns the spacing in log tau.
func (g *LogGrid) Step() float64 { return g.step }

// LogTau returns log tau_k.
func (g *LogGrid) LogTau(k int) float64 { return g.x0 + float64(k)*g.step }

// Tau returns tau_k = exp(x0 + k step).
func (g *LogGrid) Tau(k int) float64 { return math.Exp(g.LogTau(k)) }

// LogFreq returns log w_j = -log tau_{N-1-j}.
func (g *LogGrid) LogFreq(j int) float64 { return -g.LogTau(g.n - 1 - j) }

// Freq returns w_j = 1/tau_{N-1-j}.
func (g *LogGrid) Freq(j int) float64 { return math.Exp(g.LogFreq(j)) }

// SineTransform sets dst_j = w_j^{1+p} F(w_j), F the sine transform of f,
// from src_k = tau_k^{-p} f(tau_k) (both tilted by p, which must lie in
// (-2, 0)). By the symmetry of the two grids the same call maps samples on
// the frequency grid, src_j = w_j^{-p} g(w_j), to
// dst_k = tau_k^{1+p} int_0^inf sin(w tau_k) g(w) dw on the tau grid.
// dst and src must have length N and may be the same slice.
func (g *LogGrid) SineTransform(dst, src []float64, p float64) error {
	if len(dst) != g.n || len(src) != g.n {
		return fmt.Errorf("%w: SineTransform needs slices of the grid's length %d, got %d and %d", ErrInput, g.n, len(dst), len(src))
	}
	if !(p > -2 && p < 0) {
		return fmt.Errorf("%w: the tilt of a sine transform must lie in (-2, 0), got %g", ErrInput, p)
	}
	g.sine(dst, src, p)
	return nil
}

// sine is SineTransform without the checks.
func (g *LogGrid) sine(dst, src []float64, p float64) {
	w := g.kernel(p)
	c := g.fft.Coefficients(g.coef, src)
	for m := range c {
		c[m] = cmplx.Conj(c[m] * w[m])
	}
	// The Nyquist mode is cos(pi k), its coefficient real: only the real
	// part of its weight acts.
	h := g.n / 2
	c[h] = complex(real(c[h]), 0)
	g.fft.Sequence(dst, c)
}

// kernel returns (and caches) the Mellin weights of tilt p.
func (g *LogGrid) kernel(p float64) []complex128 {
	if w, ok := g.kern[p]; ok {
		return w
	}
	w := make([]complex128, g.n/2+1)
	for m := range w {
		eta := 2 * math.Pi * float64(m) / (float64(g.n) * g.step)
		ph := -2 * math.Pi * float64(m) / float64(g.n)
		w[m] = mellinSine(complex(p, eta)) * cmplx.Exp(complex(0, ph)) / complex(float64(g.n), 0)
	}
	g.kern[p] = w
	return w
}

// mellinSine returns M(s) = int_0^inf sin(t) t^s dt = Gamma(1+s) cos(pi s/2)
// for -2 < Re s < 0, written as -pi / (2 sin(pi s/2) Gamma(-s)) (DLMF 5.5.3)
// so that the removable singularity at s = -1 (M = pi/2) and large |Im s|
// (where Gamma is exponentially small and sin exponentially large) cost no
// digits.
func mellinSine(s complex128) complex128 {
	if s == -1 {
		return complex(math.Pi/2, 0)
	}
	return complex(-math.Pi/2, 0) * cmplx.Exp(-logGammaC(-s)) / cmplx.Sin(complex(math.Pi/2, 0)*s)
}

// stirlingB are B_{2k}/(2k(2k-1)), k = 1..10, the coefficients of
// Stirling's series for log Gamma (DLMF 5.11.1).
var stirlingB = [...]float64{
	1.0 / 12, -1.0 / 360, 1.0 / 1260, -1.0 / 1680, 1.0 / 1188,
	-691.0 / 360360, 1.0 / 156, -3617.0 / 122400, 43867.0 / 244188, -174611.0 / 125400,
}

// logGammaC returns a logarithm of Gamma(z) for Re z > 0 (any branch: it
// is used through exp): Stirling's series (DLMF 5.11.1) at z + n with
// |z + n| >= 7, where the first omitted term is below 3e-17, and the
// recurrence Gamma(z+n) = z (z+1) ... (z+n-1) Gamma(z) (DLMF 5.5.1). The
// absolute error is a few 1e-15 for |z| of order one (the logarithms
// summed are of order ten), so Gamma has a relative error of that size.
func logGammaC(z complex128) complex128 {
	prod := complex(1, 0)
	for cmplx.Abs(z) < 7 {
		prod *= z
		z++
	}
	iz := 1 / z
	iz2 := iz * iz
	s := complex(0, 0)
	pw := iz
	for _, b := range stirlingB {
		s += complex(b, 0) * pw
		pw *= iz2
	}
	return (z-0.5)*cmplx.Log(z) - z + complex(0.5*math.Log(2*math.Pi), 0) + s - cmplx.Log(prod)
}
