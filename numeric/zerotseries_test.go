package numeric

import (
	"errors"
	"math"
	"testing"
)

// The eps-series solve against the q = 2 semicircle (PHYSICS sec. 5:
// E_0 = -2/(3 pi) script-J, G/G_c -> 1 with G_c = 1/(pi tau)) at order 0,
// and its partial sums against the direct float64 solve SolveZeroT at
// q = 2.05 (eps = 0.0244, where the first omitted term, of order
// 1e-3 eps^7, is 1e-15): E_0 and G/G_c at every tau.
func TestSolveZeroTEpsAgainstSemicircleAndDirect(t *testing.T) {
	const order = 6
	s, err := SolveZeroTEps(EpsSeriesParams{Order: order})
	if err != nil {
		t.Fatal(err)
	}
	if d := math.Abs(s.E0[0] + 2/(3*math.Pi)); d > 1e-14 {
		t.Errorf("E_0(q = 2) = %.16g, exact %.16g", s.E0[0], -2/(3*math.Pi))
	}
	if d := math.Abs(s.B[0] - 1/math.Pi); d > 1e-16 {
		t.Errorf("B(q = 2) = %.16g, exact 1/pi", s.B[0])
	}
	const q = 2.05
	e := 1 - 2/q
	z, err := SolveZeroT(ZeroTParams{Q: q})
	if err != nil {
		t.Fatal(err)
	}
	sum := func(c []float64) float64 {
		v, p := 0.0, 1.0
		for _, x := range c {
			v += x * p
			p *= e
		}
		return v
	}
	if d := math.Abs(sum(s.E0) - z.E0); d > 1e-13 {
		t.Errorf("E_0(q = %g): eps-series %.16g, direct %.16g (off by %.1e)", q, sum(s.E0), z.E0, d)
	}
	b := make([]float64, len(s.B))
	copy(b, s.B)
	if d := math.Abs(sum(b) - z.B); d > 2e-14 { // B_7 eps^7 ~ 5e-15
		t.Errorf("B(q = %g): eps-series %.16g, closed form %.16g", q, sum(b), z.B)
	}
	// The grids agree point by point (same tau_min and step).
	worst := 0.0
	col := make([]float64, order+1)
	for i := 0; i < len(s.Tau) && i < len(z.Tau); i++ {
		if math.Abs(s.Tau[i]/z.Tau[i]-1) > 1e-12 || s.Tau[i] > 1e8 {
			break
		}
		for j := range col {
			col[j] = s.Ratio[j][i]
		}
		worst = math.Max(worst, math.Abs(sum(col)-z.Ratio[i]))
	}
	// The direct solve's round-off grows like 1e-14 tau^Tilt (1.6e-13 at 1e8).
	if worst > 5e-12 {
		t.Errorf("G/G_c at q = %g: eps-series and direct solve differ by up to %.1e for tau <= 1e8", q, worst)
	}
	t.Logf("E_0 coefficients %.15g; largest G/G_c difference %.1e", s.E0, worst)
}

// The exponent families: generators 1 and h_n - 1 and their sums, sorted
// by their value at eps = 0, with the series added term by term.
func TestEpsExponents(t *testing.T) {
	h1 := []float64{4, 0, -5.0 / 6}
	h2 := []float64{6, 0, -77.0 / 60}
	ex, err := EpsExponents([][]float64{h1, h2}, 3, 6)
	if err != nil {
		t.Fatal(err)
	}
	want := map[string]float64{"1": 1, "1+1": 2, "(h_1-1)": 3, "1+1+1": 3, "1+(h_1-1)": 4, "(h_2-1)": 5, "1+1+(h_1-1)": 5,
		"1+1+1+1": 4, "1+1+1+1+1": 5, "1+1+1+1+1+1": 6, "1+1+1+(h_1-1)": 6, "1+(h_2-1)": 6, "(h_1-1)+(h_1-1)": 6}
	if len(ex) != len(want) {
		t.Errorf("%d exponents, want %d", len(ex), len(want))
	}
	if ex[0].Label != "1" {
		t.Errorf("first exponent %q, want the soft mode 1", ex[0].Label)
	}
	for i, e := range ex {
		w, ok := want[e.Label]
		if !ok || e.Series[0] != w {
			t.Errorf("exponent %q = %v, want %v", e.Label, e.Series[0], w)
		}
		if i > 0 && e.Series[0] < ex[i-1].Series[0] {
			t.Errorf("exponents not sorted at %d", i)
		}
		if e.Label == "(h_1-1)+(h_1-1)" && e.Series[2] != -5.0/3 {
			t.Errorf("2(h_1-1) eps^2 coefficient %v, want -5/3", e.Series[2])
		}
	}
	if _, err := EpsExponents([][]float64{{1.5, 0, 0}}, 3, 6); !errors.Is(err, ErrInput) {
		t.Errorf("h_1(2) = 1.5 accepted: %v", err)
	}
	if _, err := EpsExponents([][]float64{{4}}, 3, 6); !errors.Is(err, ErrInput) {
		t.Errorf("a short series accepted: %v", err)
	}
}

func TestSolveZeroTEpsBadInput(t *testing.T) {
	for _, o := range []int{-1, MaxEpsSeriesOrder + 1} {
		if _, err := SolveZeroTEps(EpsSeriesParams{Order: o}); !errors.Is(err, ErrInput) {
			t.Errorf("order %d: %v", o, err)
		}
	}
	if _, err := SolveZeroTEps(EpsSeriesParams{Order: 2, Grid: ZeroTParams{Step: 1}}); !errors.Is(err, ErrInput) {
		t.Errorf("step 1 accepted: %v", err)
	}
	if _, err := SolveZeroTEpsGround(EpsSeriesParams{Order: 2}, nil); !errors.Is(err, ErrInput) {
		t.Errorf("no dims accepted: %v", err)
	}
}

// zetaInt against DLMF 25.6.1 (zeta(2) = pi^2/6, zeta(4) = pi^4/90) and
// the values of zeta(3) and zeta(12) in A&S table 23.3 (written here from
// memory).
func TestZetaInt(t *testing.T) {
	for _, c := range []struct {
		s    int
		want float64
	}{{2, math.Pi * math.Pi / 6}, {3, 1.2020569031595942854}, {4, math.Pow(math.Pi, 4) / 90}, {12, 1.000246086553308048}} {
		if d := math.Abs(zetaInt(c.s) - c.want); d > 4e-16 {
			t.Errorf("zeta(%d) = %.17g, want %.17g", c.s, zetaInt(c.s), c.want)
		}
	}
}

func TestFitAlphaGEpsBadInput(t *testing.T) {
	tau := make([]float64, 200)
	r0, r1 := make([]float64, 200), make([]float64, 200)
	for i := range tau {
		tau[i] = math.Exp(float64(i) * 0.05)
		r0[i] = 1
		r1[i] = -math.Pi / 4 / tau[i]
	}
	s := &ZeroTEpsSeries{Tau: tau, Ratio: [][]float64{r0, r1}}
	good, err := EpsExponents([][]float64{{4, 0}}, 2, 4)
	if err != nil {
		t.Fatal(err)
	}
	ok := make([][]float64, 2)
	zero := make([][]float64, 2)
	for j := range ok {
		ok[j] = make([]float64, len(tau))
		zero[j] = make([]float64, len(tau))
		for i := range ok[j] {
			ok[j][i] = 1e-15
		}
	}
	cases := []struct {
		name  string
		s     *ZeroTEpsSeries
		exps  []EpsExponent
		noise [][]float64
		lo    float64
	}{
		{"nil solution", nil, good, ok, 10},
		{"no exponents", s, nil, ok, 10},
		{"first exponent not 1", s, good[1:], ok, 10},
		{"short exponent", s, []EpsExponent{{Series: []float64{1}, Label: "1"}}, ok, 10},
		{"zero noise", s, good, zero, 10},
		{"short noise", s, good, ok[:1], 10},
		{"bad window", s, good, ok, -1},
	}
	for _, c := range cases {
		if _, err := FitAlphaGEps(c.s, c.exps, c.noise, c.lo, 1e4); !errors.Is(err, ErrInput) {
			t.Errorf("%s: %v", c.name, err)
		}
	}
	// The same data fitted: alpha_G = (pi/4) eps exactly.
	f, err := FitAlphaGEps(s, good, ok, 10, 1e4)
	if err != nil {
		t.Fatal(err)
	}
	if d := math.Abs(f.AlphaG[1] - math.Pi/4); d > 1e-12 || math.Abs(f.AlphaG[0]) > 1e-12 {
		t.Errorf("alpha_G = %v, want 0 and pi/4", f.AlphaG)
	}
}
