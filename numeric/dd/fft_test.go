package dd

import (
	"math"
	"math/big"
	"math/cmplx"
	"math/rand"
	"testing"

	"gonum.org/v1/gonum/dsp/fourier"
)

// The transform against gonum's real FFT (same conventions, float64
// accuracy) and against a direct DFT summed in math/big at 200 bits
// (double-double accuracy), then the round trip Sequence(Coefficients(x))
// = n x.
func TestFFTAgainstGonumAndBig(t *testing.T) {
	r := rand.New(rand.NewSource(5))
	for _, n := range []int{4, 8, 16, 64, 256} {
		f, err := NewFFT(n)
		if err != nil {
			t.Fatal(err)
		}
		x := make([]Float, n)
		xf := make([]float64, n)
		for i := range x {
			x[i] = randFloat(r, 2)
			xf[i] = x[i].Float64()
		}
		c := make([]Complex, n/2+1)
		f.Coefficients(c, x)
		g := fourier.NewFFT(n)
		cg := g.Coefficients(nil, xf)
		for k := range c {
			if d := cmplx.Abs(c[k].Complex128() - cg[k]); d > 1e-13*float64(n) {
				t.Errorf("n=%d k=%d: dd %v, gonum %v", n, k, c[k].Complex128(), cg[k])
			}
		}
		// Direct DFT in big: X_k = sum_j x_j (cos - i sin)(2 pi jk/n), the
		// angles' sin and cos from the big Taylor reference.
		pi := Pi.Big(refPrec)
		worst := 0.0
		for k := 0; k <= n/2; k += max(1, n/16) {
			re, im := new(big.Float).SetPrec(refPrec), new(big.Float).SetPrec(refPrec)
			for j := 0; j < n; j++ {
				a := new(big.Float).SetPrec(refPrec).Mul(pi, big.NewFloat(float64(2*((j*k)%n))/float64(n)))
				if a.Cmp(big.NewFloat(4)) > 0 {
					a.Sub(a, new(big.Float).SetPrec(refPrec).Mul(pi, big.NewFloat(2)))
				}
				s, co := bigSinCos(a)
				xj := x[j].Big(refPrec)
				re.Add(re, new(big.Float).SetPrec(refPrec).Mul(xj, co))
				im.Sub(im, new(big.Float).SetPrec(refPrec).Mul(xj, s))
			}
			dr, _ := new(big.Float).Sub(c[k].Re.Big(refPrec), re).Float64()
			di, _ := new(big.Float).Sub(c[k].Im.Big(refPrec), im).Float64()
			worst = math.Max(worst, math.Hypot(dr, di))
		}
		if worst > 1e-30*float64(n) {
			t.Errorf("n=%d: worst difference from the big DFT %.3g", n, worst)
		}
		back := make([]Float, n)
		f.Sequence(back, c)
		for i := range back {
			if d := back[i].Sub(x[i].MulFloat(float64(n))).Float64(); math.Abs(d) > 1e-30*float64(n) {
				t.Errorf("n=%d: round trip at %d off by %.3g", n, i, d)
			}
		}
	}
	if _, err := NewFFT(12); err == nil {
		t.Error("length 12 accepted")
	}
}

// Sequence against gonum on arbitrary coefficients (imaginary parts of the
// end coefficients ignored by both).
func TestSequenceAgainstGonum(t *testing.T) {
	r := rand.New(rand.NewSource(6))
	n := 32
	f, _ := NewFFT(n)
	g := fourier.NewFFT(n)
	c := make([]Complex, n/2+1)
	cg := make([]complex128, n/2+1)
	for k := range c {
		c[k] = NewComplex(r.NormFloat64(), r.NormFloat64())
		cg[k] = c[k].Complex128()
	}
	x := make([]Float, n)
	f.Sequence(x, c)
	xg := g.Sequence(nil, cg)
	for i := range x {
		if d := math.Abs(x[i].Float64() - xg[i]); d > 1e-12 {
			t.Errorf("sample %d: dd %g, gonum %g", i, x[i].Float64(), xg[i])
		}
	}
}
