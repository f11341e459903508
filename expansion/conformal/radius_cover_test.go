package conformal

import (
	"fmt"
	"math"
	"testing"
)

// The coefficient test of the radius (coefficientRadius, used where no
// exact singularity map exists) checked where the exact radius is known:
// the modulus of the nearest singularity from the map (collisions of
// levels for h_n, closed-form points for b and S_0). Its stated error must
// cover its true error on every case.
func TestCoefficientRadiusCoversExact(t *testing.T) {
	if testing.Short() {
		t.Skip("short mode")
	}
	type tcase struct {
		name string
		c    *Coefficients
	}
	var cases []tcase
	for _, end := range []End{AroundTwo, AroundInf} {
		for n := 1; n <= 4; n++ {
			c, err := DimensionSeries(end, n, 40, 30)
			if err != nil {
				t.Fatal(err)
			}
			cases = append(cases, tcase{fmt.Sprintf("h_%d around %s", n, end), c})
		}
		s0, err := S0Series(end, 40, 30)
		if err != nil {
			t.Fatal(err)
		}
		cases = append(cases, tcase{"S_0 around " + end.String(), s0})
		bs, err := BSeries(end, 40, 30)
		if err != nil {
			t.Fatal(err)
		}
		for _, b := range bs {
			cases = append(cases, tcase{b.Quantity + " around " + end.String(), b})
		}
	}
	for _, tc := range cases {
		if tc.c.Radius == nil || tc.c.RadiusErr == nil {
			t.Logf("%s: no exact radius (%s)", tc.name, tc.c.RadiusMethod)
			continue
		}
		exact, _ := tc.c.Radius.Float64()
		r, rerr, _, ok := coefficientRadius(tc.c.Values, tc.c.Errors)
		if !ok {
			t.Logf("%s: exact %.6g; coefficient test gives no estimate", tc.name, exact)
			continue
		}
		trueErr := math.Abs(r - exact)
		t.Logf("%-28s exact %.6f  coefficient test %.6f +- %.2g  (true error %.2g)", tc.name, exact, r, rerr, trueErr)
		if trueErr > rerr {
			t.Errorf("%s: coefficient-test radius %.6g +- %.2g misses the exact %.6g (true error %.2g)", tc.name, r, rerr, exact, trueErr)
		}
	}
}
