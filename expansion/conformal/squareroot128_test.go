package conformal

import (
	"math/big"
	"testing"

	"qbridge/series/scalar"
)

// The complex128 type check on the nearest collision of h_1 around q = 2:
// the deviation falls like d^(1/2) (ratio near 100 between d = 1e-8 and
// 1e-12), and it fails, as a test must be able to, when the coefficient of
// the square root is off by 1 percent.
func TestCheckSquareRootCanFail(t *testing.T) {
	sc, err := scanCollisions(AroundTwo, 1)
	if err != nil || len(sc.found) == 0 {
		t.Fatalf("scan: %v", err)
	}
	col := sc.found[0]
	p := bitsFor(radiusDigits, 0)
	r, err := refineAt(AroundTwo, col, fromC128(col.h, p), fromC128(deltaOf(AroundTwo, col.s), p), p)
	if err != nil {
		t.Fatal(err)
	}
	d1, err1 := checkSquareRoot(AroundTwo, r, 1e-8)
	d2, err2 := checkSquareRoot(AroundTwo, r, 1e-12)
	if err1 != nil || err2 != nil {
		t.Fatalf("check: %v, %v", err1, err2)
	}
	if !(d2 > 0 && d2 < 1e-4 && d1/d2 > 50 && d1/d2 < 200) {
		t.Errorf("deviations %.2e (d = 1e-8), %.2e (d = 1e-12): not falling like d^(1/2)", d1, d2)
	}
	bad := *r
	bad.a = scalar.CScale(r.a, big.NewFloat(1.01), p)
	if d, err := checkSquareRoot(AroundTwo, &bad, 1e-12); err == nil && d < 5e-3 {
		t.Errorf("a 1%% wrong coefficient passes with deviation %.1e", d)
	}
}
