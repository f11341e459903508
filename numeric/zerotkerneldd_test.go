package numeric

import (
	"math"
	"math/cmplx"
	"testing"

	"qbridge/numeric/dd"
)

// The double-double Mellin weight against DLMF: M(-1) = pi/2 (5.9.7 at
// s = -1: int sin t dt/t) and M(s) = Gamma(1+s) cos(pi s/2) (5.9.7) where
// the float64 Gamma is accurate, and against the float64 mellinSine.
func TestMellinSineDD(t *testing.T) {
	if d := mellinSineDD(dd.NewComplex(-1, 0)).Re.Sub(dd.Pi.Ldexp(-1)).Float64(); math.Abs(d) > 5e-30 {
		t.Errorf("M(-1) - pi/2 = %.3g", d)
	}
	for _, s := range []float64{-0.5, -0.15, -1.7} {
		want := math.Gamma(1+s) * math.Cos(math.Pi*s/2)
		if got := mellinSineDD(dd.NewComplex(s, 0)).Re.Float64(); math.Abs(got/want-1) > 1e-14 {
			t.Errorf("M(%g) = %.17g, want %.17g", s, got, want)
		}
	}
	for _, s := range []complex128{complex(-0.85, 3), complex(-0.15, -40), complex(-1.3, 0.2)} {
		got := mellinSineDD(dd.NewComplex(real(s), imag(s))).Complex128()
		if d := cmplx.Abs(got/mellinSine(s) - 1); d > 1e-13 {
			t.Errorf("M(%v): dd %v, float64 %v", s, got, mellinSine(s))
		}
	}
}

// The double-double weights' eps-series: equal to the float64 ones
// (epsKernel) to float64 accuracy, and, as Taylor polynomials, equal to
// the directly evaluated weight M(p0 - delta + i eta) at a small delta to
// double-double accuracy (the check that the Cauchy sums are Taylor
// coefficients, independent of the float64 code).
func TestEpsKernelDD(t *testing.T) {
	const n, step, k = 64, 0.4, 14
	g, err := NewLogGrid(1e-3, step, n)
	if err != nil {
		t.Fatal(err)
	}
	for _, p0 := range []float64{-0.85, -0.15} {
		kd := epsKernelDD(n, step, dd.New(p0), DefaultKernelRadius, k)
		kf := epsKernel(g, p0, DefaultKernelRadius, k)
		for m := range kd {
			for j := 0; j < k; j++ {
				a, b := kd[m][j].Complex128(), kf[m][j]
				if d := cmplx.Abs(a - b); d > 1e-12*(cmplx.Abs(b)+cmplx.Abs(kf[m][0])) {
					t.Errorf("p0=%g mode %d order %d: dd %v, float64 %v", p0, m, j, a, b)
				}
			}
		}
		for _, m := range []int{0, 1, 7, 32} {
			eta := dd.Pi.MulFloat(2 * float64(m)).DivFloat(n * step)
			delta := 0.004
			want := mellinSineDD(dd.Complex{Re: dd.New(p0).AddFloat(-delta), Im: eta})
			var sum dd.Complex
			pw := dd.New(1)
			for j := 0; j < k; j++ {
				sum = sum.Add(kd[m][j].Scale(pw))
				pw = pw.MulFloat(delta)
			}
			// Remove the phase e^{-2 pi i m/n}/n.
			ps, pc := dd.SinCos(dd.Pi.MulFloat(-2 * float64(m) / n))
			ph := dd.Complex{Re: pc.DivFloat(n), Im: ps.DivFloat(n)}
			got := sum.Div(ph)
			d := got.Sub(want)
			if r := math.Sqrt(d.Abs2().Hi / want.Abs2().Hi); r > 1e-28 {
				t.Errorf("p0=%g mode %d: Taylor sum off by %.3g relative", p0, m, r)
			}
		}
	}
}
