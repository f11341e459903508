package numeric

import (
	"math"
	"testing"
)

// The finite-temperature fits recover a synthetic ladder whose log Z carries
// every correction exponent of the q = 4 semigroup up to T^10 (h_1..h_3 of
// MS 2016; coefficients of order one, alternating), with noise at the
// solver's error level: E_0, S_0 and alpha_S each within the stated error.
func TestFitGroundSynthetic(t *testing.T) {
	dims := []float64{3.773536, 5.679459, 7.631971}
	exps, err := SoftModeExponents(dims, 10)
	if err != nil {
		t.Fatal(err)
	}
	const e0, s0, alpha = -0.0574598785, 0.2324238496, 0.0070931455
	seed := uint64(99)
	rnd := func() float64 {
		seed = seed*6364136223846793005 + 1442695040888963407
		return float64(seed>>11)/float64(1<<53) - 0.5
	}
	var lad []*Solution
	for i := 0; i < 40; i++ {
		beta := 20 * math.Pow(400, float64(i)/39)
		s := &Solution{Beta: beta}
		s.LogZ, s.E = -beta*e0+s0, e0
		for k, p := range exps {
			c := math.Pow(-0.8, float64(k))
			if k == 0 {
				c = 2 * math.Pi * math.Pi * alpha
			}
			s.LogZ += c * math.Pow(beta, -p)
			s.E += p * c * math.Pow(beta, -p-1)
		}
		s.LogZErr, s.EErr = 1e-14*beta, 1e-15
		s.LogZ += 0.5 * s.LogZErr * rnd()
		s.E += 0.5 * s.EErr * rnd()
		lad = append(lad, s)
	}
	g, err := FitGround(4, ConformalData{Dims: dims, S0Exact: math.NaN()}, lad)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name            string
		got, err, model float64
	}{{"E_0", g.E0, g.E0Err, e0}, {"S_0", g.S0, g.S0Err, s0}, {"alpha_S", g.AlphaS, g.AlphaSErr, alpha}} {
		if math.Abs(c.got-c.model) > c.err {
			t.Errorf("%s = %.15g +- %.1e, model %.15g", c.name, c.got, c.err, c.model)
		}
	}
	if g.AlphaSErr > 1e-9 {
		t.Errorf("alpha_S error %.1e: the fits lost their power", g.AlphaSErr)
	}
}

// The stated error of the finite-temperature alpha_S is checked against
// fits it did not use: the even- and the odd-numbered temperatures of the
// default q = 4 ladder, fitted on their own, agree with the full fit within
// the combined errors; and the full fit agrees with the zero-temperature
// route (alpha_S = (pi + 2/3) alpha_G/(32 pi) at q = 4: k_A'(2) = -pi - 2/3
// and alpha_0 = 4 pi/3, MS 2016) within the two errors.
func TestFitGroundChecked(t *testing.T) {
	dims := conformalDims(t, 4)
	lad := defaultGround(t, 4).Ladder
	c := ConformalData{Dims: dims, S0Exact: math.NaN()}
	full, err := FitGround(4, c, lad)
	if err != nil {
		t.Fatal(err)
	}
	for parity := 0; parity < 2; parity++ {
		var half []*Solution
		for i, s := range lad {
			if i%2 == parity {
				half = append(half, s)
			}
		}
		h, err := FitGround(4, c, half)
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("parity %d: alpha_S = %.13g +- %.1e", parity, h.AlphaS, h.AlphaSErr)
		if d := math.Abs(h.AlphaS - full.AlphaS); d > h.AlphaSErr+full.AlphaSErr {
			t.Errorf("parity %d: alpha_S %.13g +- %.1e, full ladder %.13g +- %.1e", parity, h.AlphaS, h.AlphaSErr, full.AlphaS, full.AlphaSErr)
		}
	}
	z, err := SolveZeroTGround(ZeroTParams{Q: 4}, dims)
	if err != nil {
		t.Fatal(err)
	}
	f := (math.Pi + 2.0/3) / (32 * math.Pi)
	t.Logf("alpha_S: ladder %.13g +- %.1e, T = 0 %.13g +- %.1e", full.AlphaS, full.AlphaSErr, f*z.AlphaG, f*z.AlphaGErr)
	if d := math.Abs(full.AlphaS - f*z.AlphaG); d > full.AlphaSErr+f*z.AlphaGErr {
		t.Errorf("alpha_S: ladder %.13g +- %.1e, T = 0 route %.13g +- %.1e", full.AlphaS, full.AlphaSErr, f*z.AlphaG, f*z.AlphaGErr)
	}
}
