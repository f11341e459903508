package conformal

import (
	"math"
	"math/cmplx"
	"testing"

	"qbridge/series/scalar"
)

// gammaParts128 against the big-float CLogGamma of package scalar (Gamma
// itself, compared as exp(s)/p, so the branch of the logarithm does not
// enter) and the digamma against the recurrence-free big-float value of
// gammaPartsBig, at points on both sides of the recurrence threshold and of
// the real axis, including negative real parts; and against DLMF 5.4.3,
// |Gamma(iy)|^2 = pi/(y sinh(pi y)), and DLMF 5.4.12, psi(1/2) = -gamma - 2 log 2.
func TestGammaParts128(t *testing.T) {
	const prec = 120
	for _, z := range []complex128{0.3 + 0.2i, 1, 2.5 - 3i, 8.9 + 0.1i, 9.1 - 0.1i, 15 + 40i, -2.7 + 0.4i, -7.5 - 1.2i, 0.004 - 0.7i, 4.47 + 1.18i} {
		s, p, psi := gammaParts128(z)
		g := cmplx.Exp(s) / p
		lg, err := scalar.CLogGamma(fromC128(z, prec), prec)
		if err != nil {
			t.Fatal(err)
		}
		want := cmplx.Exp(lg.Complex128())
		if e := cmplx.Abs(g-want) / cmplx.Abs(want); e > 1e-13 {
			t.Errorf("Gamma(%v) = %v, want %v (rel %.1e)", z, g, want, e)
		}
		gb, err := gammaPartsBig(fromC128(z, prec), prec, true)
		if err != nil {
			t.Fatal(err)
		}
		if e := cmplx.Abs(psi - gb.psi.Complex128()); e > 1e-13*(1+cmplx.Abs(psi)) {
			t.Errorf("psi(%v) = %v, want %v (diff %.1e)", z, psi, gb.psi.Complex128(), e)
		}
		if tri := trigammaShift128(z); cmplx.Abs(tri-gb.tri.Complex128()) > 1e-13*(1+cmplx.Abs(tri)) {
			t.Errorf("psi'(%v) = %v, want %v", z, tri, gb.tri.Complex128())
		}
	}
	for _, y := range []float64{0.1, 1, 3.7, 12} {
		s, p, _ := gammaParts128(complex(0, y))
		g2 := cmplx.Abs(cmplx.Exp(s) / p)
		g2 *= g2
		want := math.Pi / (y * math.Sinh(math.Pi*y))
		if e := math.Abs(g2/want - 1); e > 1e-13 {
			t.Errorf("|Gamma(%gi)|^2 = %v, want pi/(y sinh(pi y)) = %v (rel %.1e)", y, g2, want, e)
		}
	}
	_, _, psi := gammaParts128(0.5)
	if want := -0.5772156649015329 - 2*math.Ln2; cmplx.Abs(psi-complex(want, 0)) > 1e-14 {
		t.Errorf("psi(1/2) = %v, want %v", psi, want)
	}
}
