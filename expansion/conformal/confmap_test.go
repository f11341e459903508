package conformal

import (
	"math"
	"math/big"
	"math/cmplx"
	"strings"
	"testing"

	"qbridge/series"
	"qbridge/series/scalar"
)

// pairClosed evaluates the two-ray map of m in closed form at a complex w
// (complex128, principal powers): s = D + B [y0^-g p^-g/g - y0^(2-g) p^(2-g)/(2-g)],
// p = (1 - w)/(1 + w).
func pairClosed(m *pairCut, w complex128) complex128 {
	f := func(x *big.Float) float64 { v, _ := x.Float64(); return v }
	g, bb, d, y0 := f(m.gamma), f(m.bb), f(m.d), f(m.y0)
	p := (1 - w) / (1 + w)
	return complex(d, 0) + complex(bb, 0)*(complex(math.Pow(y0, -g)/g, 0)*cmplx.Pow(p, complex(-g, 0))-
		complex(math.Pow(y0, 2-g)/(2-g), 0)*cmplx.Pow(p, complex(2-g, 0)))
}

// The pieces of the conformal maps against their defining properties: the
// unit circle goes onto the cuts (and for a slit map onto the circle and
// the slit), the series of a map agrees with its closed form inside the
// disc, and the real inverse undoes the map. The two-ray map is built from
// the Schwarz-Christoffel formula; these checks do not use it.
func TestConfMapPieces(t *testing.T) {
	const prec = 200
	bf := func(x float64) *big.Float { return new(big.Float).SetPrec(prec).SetFloat64(x) }
	type piece struct {
		name   string
		step   mapStep
		onCut  func(s complex128) bool // s on the image of |w| = 1
		closed func(w complex128) complex128
	}
	var pieces []piece
	for _, R := range []float64{0.7, -0.5, 4} {
		R := R
		pieces = append(pieces, piece{name: "real cut", step: realCut{r: bf(R)},
			onCut: func(s complex128) bool { return math.Abs(imag(s)) < 1e-9*(1+cmplx.Abs(s)) && real(s)/R >= 1-1e-9 },
			closed: func(w complex128) complex128 {
				sg := complex(math.Copysign(1, R), 0)
				return complex(4*math.Abs(R), 0) * w / ((1 + sg*w) * (1 + sg*w))
			}})
	}
	for _, c := range []struct{ a, b, phi float64 }{
		{0.1830464253, 0.9126006875, 0}, // h_1 in eps^2, radial
		{0.1268673955, 0.3057226427, 0}, // h_1 in x, radial
		{0.1268673955, 0.3057226427, math.Pi / 2},
		{-0.127, 0.417, 0}, // beyond 90 degrees
		{0.3, 0.2, 2.5},
	} {
		phi := c.phi
		if phi == 0 {
			phi = math.Atan2(c.b, c.a)
		}
		m, err := newPairCut(bf(c.a), bf(c.b), bf(phi), prec)
		if err != nil {
			t.Fatal(err)
		}
		sStar := complex(c.a, c.b)
		dir := cmplx.Exp(complex(0, phi))
		pieces = append(pieces, piece{name: "pair cut", step: m,
			onCut: func(s complex128) bool {
				for _, z := range []complex128{(s - sStar) / dir, (s - cmplx.Conj(sStar)) / cmplx.Conj(dir)} {
					if math.Abs(imag(z)) < 1e-9*(1+cmplx.Abs(s)) && real(z) >= -1e-9 {
						return true
					}
				}
				return false
			},
			closed: func(w complex128) complex128 { return pairClosed(m, w) }})
	}
	for _, r := range []float64{-0.49, 0.3} {
		r := r
		pieces = append(pieces, piece{name: "slit", step: slitCut{r: bf(r)},
			onCut: func(s complex128) bool {
				if math.Abs(cmplx.Abs(s)-1) < 1e-9 {
					return true
				}
				return math.Abs(imag(s)) < 1e-9 && real(s)/r >= 1-1e-9
			},
			closed: func(v complex128) complex128 {
				rho := math.Abs(r) / ((1 + math.Abs(r)) * (1 + math.Abs(r)))
				sg := complex(math.Copysign(1, r), 0)
				u := -sg * v // the r < 0 form in u, mirrored back at the end
				y := complex(4*rho, 0) * u / ((1 - u) * (1 - u))
				w := 2 * y / (1 + 2*y + cmplx.Sqrt(1+4*y))
				return -sg * w
			}})
	}
	for _, p := range pieces {
		// the circle goes onto the cuts (or, for a slit, the circle and the slit)
		for i := 1; i < 64; i++ {
			if i == 32 {
				continue // w = -1: the image of infinity
			}
			w := cmplx.Exp(complex(0, 2*math.Pi*float64(i)/64))
			if s := p.closed(w); !p.onCut(s) {
				t.Errorf("%s %s: w = %v goes to %v, off the cuts", p.name, p.step.text(), w, s)
			}
		}
		// the series against the closed form inside the disc
		sr, err := p.step.series(120, prec)
		if err != nil {
			t.Fatal(err)
		}
		if c := sr.Coeff(0); c.Sign() != 0 || sr.Coeff(1).Sign() <= 0 {
			t.Errorf("%s: S(0) = %s, S'(0) = %s (want 0 and > 0)", p.name, c.Text('g', 5), sr.Coeff(1).Text('g', 5))
		}
		for _, w := range []complex128{0.3, -0.25, complex(0.1, 0.3), complex(-0.2, -0.25)} {
			got := series.EvalComplex(sr, scalar.ComplexFloat64(real(w), imag(w), prec)).Complex128()
			if want := p.closed(w); cmplx.Abs(got-want) > 1e-12*(1+cmplx.Abs(want)) {
				t.Errorf("%s %s at w = %v: series %v, closed form %v", p.name, p.step.text(), w, got, want)
			}
		}
		// the real inverse undoes the map
		for _, w := range []float64{0.35, -0.3, 0.05} {
			s := series.Eval(sr, bf(w))
			back, ok := p.step.inverse(s, prec)
			if !ok {
				t.Errorf("%s: inverse of S(%g) = %s refused", p.name, w, s.Text('g', 10))
				continue
			}
			if d := new(big.Float).Sub(back, bf(w)); new(big.Float).Abs(d).Cmp(big.NewFloat(1e-40)) > 0 {
				t.Errorf("%s: inverse(S(%g)) = %s", p.name, w, back.Text('g', 20))
			}
		}
	}
}

// With a = 0 and phi = pi/2 the two-ray map is the textbook map of the
// plane cut along the imaginary axis from +-i b to +-i inf,
// s = 2 b w/(1 - w^2) (the two-cut map z = 2w/(1 + w^2) rotated by i;
// Zinn-Justin, Quantum Field Theory and Critical Phenomena, chapter on
// the summation of series, from memory): coefficients 2b at odd powers.
func TestPairCutTextbookCase(t *testing.T) {
	const prec = 200
	b := big.NewFloat(0.75)
	m, err := newPairCut(new(big.Float).SetPrec(prec), b, new(big.Float).SetPrec(prec).Quo(scalar.Pi(prec), big.NewFloat(2)), prec)
	if err != nil {
		t.Fatal(err)
	}
	s, err := m.series(30, prec)
	if err != nil {
		t.Fatal(err)
	}
	for k := 0; k < 30; k++ {
		want := 0.0
		if k%2 == 1 {
			want = 1.5
		}
		if f, _ := s.Coeff(k).Float64(); math.Abs(f-want) > 1e-50 {
			t.Errorf("w^%d: %g, want %g", k, f, want)
		}
	}
}

// The maps Resum builds put every singularity they cut at on the unit
// circle: the branch points of h_1 around q = infinity (nearest pair by
// the tips of the Schwarz-Christoffel map, the real one at x = -0.581 by
// the slit), and the poles of b^q there (x = -1/2 cut, x = 3/2 slit).
func TestConfMapSingularitiesOnCircle(t *testing.T) {
	const prec = 200
	for _, c := range []struct {
		quantity string
		n        int
		steps    int
	}{{QuantityDims, 1, 2}, {QuantityB, -1, 2}} {
		_, inf := tableBothEnds(t, c.quantity, c.n)
		pts, why := confSingularities(inf, prec)
		if why != "" {
			t.Fatal(why)
		}
		sortPoints(pts, prec)
		x := big.NewFloat(1.0 / 3)
		m, err := buildConfMap(pts, x, radialPhi, prec)
		if err != nil {
			t.Fatal(err)
		}
		if len(m.steps) != c.steps {
			t.Fatalf("%s: map %s, want %d steps", inf.Quantity, m.text(), c.steps)
		}
		// the real singularities: a point 1e-50 (relative) short of one
		// maps to within 1e-20 of the circle (|w| = 1 - O(distance^(1/2)))
		// or lies on a cut already
		cut := 0
		for _, p := range pts {
			if p.im.Sign() != 0 {
				continue
			}
			near := new(big.Float).SetPrec(prec).Mul(p.re, new(big.Float).SetPrec(prec).Sub(big.NewFloat(1), big.NewFloat(1e-50)))
			if v, ok := m.inverse(near, prec); ok {
				f, _ := new(big.Float).Abs(v).Float64()
				if math.Abs(f-1) > 1e-20 {
					t.Errorf("%s: the singularity at %s maps to |w| = %g, inside the disc", inf.Quantity, p.re.Text('g', 8), f)
				} else {
					cut++
				}
			}
		}
		if cut == 0 {
			t.Errorf("%s: no real singularity on the circle", inf.Quantity)
		}
		// the nearest pair: its tips zeta = +-1 of the Schwarz-Christoffel
		// map are w = (1 - p)/(1 + p), p = -+i/y0, on the circle, and go to s*
		if pc, ok := m.steps[0].(*pairCut); ok {
			y0, _ := pc.y0.Float64()
			p := complex(0, -1/y0)
			w := (1 - p) / (1 + p)
			s := pairClosed(pc, w)
			sa, _ := pts[0].re.Float64()
			sb, _ := pts[0].im.Float64()
			if math.Abs(cmplx.Abs(w)-1) > 1e-14 || cmplx.Abs(s-complex(sa, sb)) > 1e-12 {
				t.Errorf("%s: tip at w = %v (|w| = %g) goes to %v, branch point %v", inf.Quantity, w, cmplx.Abs(w), s, complex(sa, sb))
			}
		}
	}
}

// Parity: h_n and b^q are even in eps, S_0 is odd (eps -> -eps is
// x -> 1 - x, under which k_A -> 1/k_A and b^q is unchanged); the
// series in x have no parity.
func TestSeriesParity(t *testing.T) {
	for _, c := range []struct {
		quantity string
		n        int
		two, inf int
	}{{QuantityDims, 1, 0, -1}, {QuantityDims, 3, 0, -1}, {QuantityB, -1, 0, -1}, {QuantityS0, -1, 1, -1}} {
		two, inf := tableBothEnds(t, c.quantity, c.n)
		if p := seriesParity(two); p != c.two {
			t.Errorf("%s around q = 2: parity %d, want %d", two.Quantity, p, c.two)
		}
		if p := seriesParity(inf); p != c.inf {
			t.Errorf("%s around q = inf: parity %d, want %d", inf.Quantity, p, c.inf)
		}
	}
}

// The targets of the conformal-mapping resummation, against mpmath's
// roots of k_A(h) = 1 (testdata/conformal_golden.json, 40 digits): h_1 at
// q = 4 from the order-40 eps series to 1e-20, h_1 at q = 3 from the
// order-40 x series to 1e-12 (x = 1/3 lies outside the radius 0.331 of
// that series), each within its stated error.
func TestConformalMapTargets(t *testing.T) {
	two, inf := tableBothEnds(t, QuantityDims, 1)
	g := loadConformalGolden(t)
	for _, c := range []struct {
		q   string
		c   *Coefficients
		tol float64
	}{{"4", two, 1e-20}, {"3", inf, 1e-12}} {
		var want *big.Float
		for _, d := range g.Dims {
			if d.Q == c.q && d.N == 1 {
				want = parseBig(t, d.H)
			}
		}
		if want == nil {
			t.Fatalf("no golden h_1(%s)", c.q)
		}
		q := mustQ(t, c.q)
		prec := bitsFor(tableDigits, tableOrder)
		at := q.Eps(prec)
		name := "eps"
		if c.c.End == AroundInf {
			at, name = q.X(prec), "1/q"
		}
		e := conformalEstimate(name, c.c, at, prec)
		if e.Value == nil {
			t.Fatalf("h_1(%s) %s: %s", c.q, e.Method, e.Detail)
		}
		d := new(big.Float).Sub(e.Value, want)
		d.Abs(d)
		// the golden value carries 40 digits
		if f, _ := d.Float64(); f > c.tol || d.Cmp(new(big.Float).Add(e.Err, goldenTol(want))) > 0 {
			t.Errorf("h_1(%s) %s = %s +- %s, mpmath %s: off by %.2g (target %g)", c.q, e.Method, e.Value.Text('g', 30), e.Err.Text('e', 2), want.Text('g', 30), f, c.tol)
		}
		t.Logf("h_1(%s) %s: true error %s, stated %s; %s", c.q, e.Method, d.Text('e', 2), e.Err.Text('e', 2), e.Detail)
	}
}

// Where there is nothing to map the estimate says so and has no value:
// h_0 = 2 has no singularity, and a series without an exact singularity
// map (here a made-up quantity name) is not mapped.
func TestConformalNotApplicable(t *testing.T) {
	h0, err := DimensionSeries(AroundTwo, 0, 8, 20)
	if err != nil {
		t.Fatal(err)
	}
	other := *h0
	other.Quantity = "E_0"
	for _, c := range []*Coefficients{h0, &other} {
		e := conformalEstimate("eps", c, big.NewFloat(0.5), 100)
		if e.Value != nil || e.Err != nil || !strings.HasPrefix(e.Detail, "not applicable: ") || e.Method != "eps conformal map" {
			t.Errorf("%s: %+v", c.Quantity, e)
		}
	}
	// a point on the cut: q = 3 is x = 1/3, beyond the pole of b^q at
	// x = -1/2 on the other side, so it is fine; x = -0.6 (no q) is on it
	_, inf := tableBothEnds(t, QuantityB, -1)
	if e := conformalEstimate("1/q", inf, big.NewFloat(-0.6), 100); e.Value != nil || !strings.Contains(e.Detail, "cut") {
		t.Errorf("point on the cut: %+v", e)
	}
}
