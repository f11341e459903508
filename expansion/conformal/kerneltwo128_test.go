package conformal

import (
	"math/cmplx"
	"testing"
)

// The two-Gamma form of k_A (kerneltwo128.go) agrees with the eight-Gamma
// form of PHYSICS.md (kernelJet128) in value and first and second
// derivatives, over
// the region the scan continues levels in, on both sides of the real h axis.
func TestTwoJet128MatchesEightGamma(t *testing.T) {
	worst := 0.0
	count := 0
	for _, d := range []complex128{0.25, 0.004, 0.3 + 0.2i, 0.05 - 0.4i, -0.3 + 0.5i, 1.02 + 0.3i, 0.6 - 0.1i, -0.5 - 1i} {
		pre := twoPrefactor128(d)
		for _, h := range []complex128{2.3, 4.5 - 1.2i, 4.47 + 1.18i, 6.6 + 1.4i, 10.8 - 1.55i, 0.5 + 0.1i, -3.3 + 2.1i, 1.7 - 9i, 25 + 3i, 140 - 60i} {
			want := kernelJet128(h, d, true)
			got := twoJet128(h, pre)
			full := twoJetFull128(h, d)
			for i, pair := range [][2]complex128{{got.k, want.k}, {got.lh, want.lh}, {got.ld, want.ld}, {full.lhh, want.lhh}, {full.lhd, want.lhd}} {
				scale := 1 + cmplx.Abs(pair[1])
				if i == 0 {
					scale = cmplx.Abs(pair[1])
				}
				e := cmplx.Abs(pair[0]-pair[1]) / scale
				if e > worst {
					worst = e
				}
				if e > 1e-12 || !finite128(pair[0]) {
					t.Errorf("D=%v h=%v part %d: two-Gamma %v, eight-Gamma %v (rel %.1e)", d, h, i, pair[0], pair[1], e)
				}
				count++
			}
		}
	}
	t.Logf("%d values, worst relative difference %.1e", count, worst)
}
