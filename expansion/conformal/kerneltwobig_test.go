package conformal

import (
	"math/cmplx"
	"testing"
)

// The big-float two-Gamma jet (kerneltwobig.go) agrees with the complex128
// eight-Gamma jet of PHYSICS.md's form in all five parts, to the accuracy
// of complex128, over the region where collisions are refined.
func TestKernelJetBigMatchesEightGamma(t *testing.T) {
	for _, d := range []complex128{0.25, 0.3 + 0.2i, 0.05 - 0.4i, -0.3 + 0.5i, 1.02 + 0.3i, 0.1268 + 0.3057i} {
		for _, h := range []complex128{2.3, 4.4764 - 1.1846i, 6.6 + 1.4i, 10.8 - 1.55i, 0.5 + 0.01i, -3.3 + 2.1i, 25 + 3i} {
			want := kernelJet128(h, d, true)
			got, err := kernelJetBig(fromC128(h, 120), fromC128(d, 120), 120, true)
			if err != nil {
				t.Fatalf("D=%v h=%v: %v", d, h, err)
			}
			parts := [][2]complex128{{got.k.Complex128(), want.k}, {got.lh.Complex128(), want.lh}, {got.ld.Complex128(), want.ld},
				{got.lhh.Complex128(), want.lhh}, {got.lhd.Complex128(), want.lhd}}
			for i, p := range parts {
				scale := 1 + cmplx.Abs(p[1])
				if i == 0 {
					scale = cmplx.Abs(p[1])
				}
				if e := cmplx.Abs(p[0]-p[1]) / scale; e > 1e-12 {
					t.Errorf("D=%v h=%v part %d: big two-Gamma %v, complex128 eight-Gamma %v (rel %.1e)", d, h, i, p[0], p[1], e)
				}
			}
		}
	}
}
