package scalar

import (
	"fmt"
	"math/big"
	"testing"
)

func TestRGammaPoleCoeffsGolden(t *testing.T) {
	// Reference: mpmath.taylor(rgamma(-3+t)) at 200 digits
	// (testdata/gen_special.py); 1/Gamma is entire so this converges.
	g := loadGolden(t)
	const prec = 256
	s, err := RGammaPoleCoeffs(3, len(g.RGTaylorM3), prec)
	if err != nil {
		t.Fatal(err)
	}
	for k, w := range g.RGTaylorM3 {
		checkClose(t, fmt.Sprintf("1/Gamma(-3+t) coefficient %d", k), s[k], w, 190)
	}
}

func TestPoleSeriesResidueAndProduct(t *testing.T) {
	const prec = 340 // 100 digits
	const n = 30
	for _, pole := range []int{0, 1, 3, 7} {
		gs, err := GammaPoleCoeffs(pole, n, prec)
		if err != nil {
			t.Fatal(err)
		}
		rs, err := RGammaPoleCoeffs(pole, n, prec)
		if err != nil {
			t.Fatal(err)
		}
		// DLMF 5.2.1 / 5.5.1: residue of Gamma at -n is (-1)^n/n!.
		res := new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), factorialFloat(int64(pole), prec))
		if pole%2 == 1 {
			res.Neg(res)
		}
		if !closeTo(gs[0], res, 330) {
			t.Errorf("n=%d: residue %s, want %s", pole, gs[0].Text('g', 20), res.Text('g', 20))
		}
		// t Gamma(-n+t) * 1/Gamma(-n+t) = t exactly.
		p := testMulTrunc(gs, rs, prec)
		for k := 0; k < n; k++ {
			want := new(big.Float)
			if k == 1 {
				want.SetInt64(1)
			}
			if !closeTo(p[k], want, 320) {
				t.Errorf("n=%d: product coefficient %d = %s", pole, k, p[k].Text('g', 10))
			}
		}
	}
}

func TestGammaPoleCoeffsMatchesNearbyExpansion(t *testing.T) {
	// t Gamma(-2+t) at t = 1/4 from the series must equal
	// (1/4) Gamma(-7/4) from BigGamma (DLMF 5.5.1 recurrence inside).
	const prec = 200
	s, err := GammaPoleCoeffs(2, 140, prec)
	if err != nil {
		t.Fatal(err)
	}
	sum := new(big.Float).SetPrec(prec)
	for k := len(s) - 1; k >= 0; k-- {
		sum.Mul(sum, big.NewFloat(0.25))
		sum.Add(sum, s[k])
	}
	g, err := BigGamma(big.NewFloat(-1.75), prec)
	if err != nil {
		t.Fatal(err)
	}
	g.Mul(g, big.NewFloat(0.25))
	if !closeTo(sum, g, 180) {
		t.Errorf("series sum %s, BigGamma gives %s", sum.Text('g', 30), g.Text('g', 30))
	}
}

func TestPoleSeriesBadInput(t *testing.T) {
	if _, err := GammaPoleCoeffs(-1, 5, 64); err == nil {
		t.Error("negative pole index: want error")
	}
	if _, err := RGammaPoleCoeffs(2, -3, 64); err == nil {
		t.Error("negative length: want error")
	}
	if _, err := GammaPoleCoeffs(2, 5, 0); err == nil {
		t.Error("zero precision: want error")
	}
}

// testMulTrunc is the truncated product of two coefficient lists (Cauchy
// product), for checks of identities between Taylor series.
func testMulTrunc(a, b []*big.Float, prec uint) []*big.Float {
	n := min(len(a), len(b))
	out := make([]*big.Float, n)
	for k := range out {
		acc := new(big.Float).SetPrec(prec)
		for i := 0; i <= k; i++ {
			acc.Add(acc, new(big.Float).SetPrec(prec).Mul(a[i], b[k-i]))
		}
		out[k] = acc
	}
	return out
}
