package conformal

import (
	"math"
	"math/big"
	"strings"
	"testing"

	"qbridge/series/scalar"
)

// goldenTol is the absolute accuracy of a golden value printed with 40
// significant digits (testdata/gen_conformal.py).
func goldenTol(w *big.Float) *big.Float {
	t := new(big.Float).SetPrec(64).Abs(w)
	return t.Mul(t, big.NewFloat(1e-39))
}

// Resummed S_0 and b at q = 2.5, 3, 4, 6, 10, 100 against mpmath
// (testdata/conformal_golden.json: S_0 by mpmath.quad of the entropy
// integral, b from b^q pi = (1/2 - 1/q) tan(pi/q), 40 digits): every
// estimate's stated error covers its true error (up to the golden file's
// own 40 digits), and the two-point Pade, which uses both ends, is good to
// 1e-18 at order 12.
func TestResumS0AndBAgainstMpmath(t *testing.T) {
	g := loadConformalGolden(t)
	for _, qc := range []struct {
		quantity string
		vals     []struct {
			Q     string `json:"q"`
			Value string `json:"value"`
		}
	}{{QuantityS0, g.S0}, {QuantityB, g.B}} {
		for _, c := range qc.vals {
			q := mustQ(t, c.Q)
			r, err := Resum(qc.quantity, q, 0, 12, 30)
			if err != nil {
				t.Fatalf("%s q=%s: %v", qc.quantity, c.Q, err)
			}
			w := parseBig(t, c.Value)
			tol := goldenTol(w)
			if r.N != -1 || r.Order != 12 || r.Q.String() != q.String() {
				t.Errorf("%s q=%s: labels N=%d order=%d q=%s", qc.quantity, c.Q, r.N, r.Order, r.Q)
			}
			if d := relDiff(r.Exact.Value, w); d > 1e-38 {
				t.Errorf("%s q=%s: exact value %s, mpmath %s", qc.quantity, c.Q, r.Exact.Value.Text('g', 40), c.Value)
			}
			methods := []string{"eps partial sum", "eps Pade", "eps conformal map", "1/q partial sum", "1/q Pade", "1/q conformal map", "two-point Pade"}
			if len(r.Estimates) != len(methods) {
				t.Fatalf("%s q=%s: %d estimates", qc.quantity, c.Q, len(r.Estimates))
			}
			for i, e := range r.Estimates {
				if e.Method != methods[i] {
					t.Errorf("%s q=%s: estimate %d is %q, want %q", qc.quantity, c.Q, i, e.Method, methods[i])
				}
				if e.Value == nil {
					t.Errorf("%s q=%s %s: failed: %s", qc.quantity, c.Q, e.Method, e.Detail)
					continue
				}
				d := new(big.Float).SetPrec(400).Sub(e.Value, w)
				d.Abs(d)
				bound := new(big.Float).SetPrec(64).Add(e.Err, tol)
				if d.Cmp(bound) > 0 {
					t.Errorf("%s q=%s %s: %s, mpmath %s: error %s stated, %s true", qc.quantity, c.Q, e.Method,
						e.Value.Text('g', 25), c.Value, e.Err.Text('e', 2), d.Text('e', 2))
				}
				if e.Err.Sign() <= 0 || e.Err.IsInf() {
					t.Errorf("%s q=%s %s: error %s", qc.quantity, c.Q, e.Method, e.Err.Text('e', 2))
				}
				if diff := r.Difference(e); diff == nil || diff.Cmp(new(big.Float).SetPrec(e.Value.Prec()).Sub(e.Value, r.Exact.Value)) != 0 {
					t.Errorf("%s q=%s %s: Difference %v", qc.quantity, c.Q, e.Method, diff)
				}
			}
			if tp := r.Estimates[len(r.Estimates)-1]; tp.Value != nil && relDiff(tp.Value, w) > 1e-18 {
				t.Errorf("%s q=%s: two-point Pade %s, mpmath %s", qc.quantity, c.Q, tp.Value.Text('g', 25), c.Value)
			}
		}
	}
}

// At q = 4: S_0 = 0.2324 (MS 2016, arXiv:1604.07818, 4 digits) and
// b = (1/(4 pi))^(1/4) exactly (b^4 pi = (1/4) tan(pi/4) = 1/4).
func TestResumQ4Published(t *testing.T) {
	q := mustQ(t, "4")
	s, err := Resum(QuantityS0, q, 0, 8, 20)
	if err != nil {
		t.Fatal(err)
	}
	tp := s.Estimates[len(s.Estimates)-1]
	if f, _ := tp.Value.Float64(); math.Abs(f-0.2324) > 5e-5 {
		t.Errorf("S_0(4) two-point Pade %.6f, published 0.2324", f)
	}
	if p := PublishedS0(q); p.Digits != 4 || p.Limit || relDiff(p.Value, big.NewFloat(0.2324)) > 1e-15 {
		t.Errorf("PublishedS0(4) = %+v", p)
	}
	b, err := Resum(QuantityB, q, 0, 8, 20)
	if err != nil {
		t.Fatal(err)
	}
	const prec = 200
	want := new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), new(big.Float).SetPrec(prec).Mul(big.NewFloat(4), scalar.Pi(prec)))
	want.Sqrt(want)
	want.Sqrt(want)
	for _, e := range b.Estimates {
		if e.Value == nil {
			t.Errorf("b(4) %s failed: %s", e.Method, e.Detail)
			continue
		}
		d := new(big.Float).Sub(e.Value, want)
		if d.Abs(d).Cmp(e.Err) > 0 {
			t.Errorf("b(4) %s = %s +- %s, exact %s", e.Method, e.Value.Text('g', 20), e.Err.Text('e', 2), want.Text('g', 20))
		}
		if !strings.Contains(e.Detail, "b = (b^q)^(1/q)") {
			t.Errorf("b(4) %s: detail %q does not say b^q was resummed", e.Method, e.Detail)
		}
	}
}

// ResumFrom on the series of TwoEndSeries gives Resum's estimates, for h_1
// at q = 3 (also against mpmath's h_1(3), 40 digits in the golden file).
func TestResumFromMatchesResum(t *testing.T) {
	q := mustQ(t, "3")
	r, err := Resum(QuantityDims, q, 1, 10, 25)
	if err != nil {
		t.Fatal(err)
	}
	two, inf, err := TwoEndSeries(QuantityDims, 1, 10, 25)
	if err != nil {
		t.Fatal(err)
	}
	est, err := ResumFrom(QuantityDims, q, two, inf, ResumPrec(25, 10))
	if err != nil {
		t.Fatal(err)
	}
	if len(est) != len(r.Estimates) {
		t.Fatalf("ResumFrom: %d estimates, Resum %d", len(est), len(r.Estimates))
	}
	for i := range est {
		a, b := est[i], r.Estimates[i]
		if a.Method != b.Method || (a.Value == nil) != (b.Value == nil) || a.Detail != b.Detail {
			t.Errorf("estimate %d: ResumFrom %q %q, Resum %q %q", i, a.Method, a.Detail, b.Method, b.Detail)
			continue
		}
		if a.Value != nil && a.Value.Cmp(b.Value) != 0 {
			t.Errorf("%s: ResumFrom %s, Resum %s", a.Method, a.Value.Text('g', 25), b.Value.Text('g', 25))
		}
	}
	var h13 *big.Float
	for _, d := range loadConformalGolden(t).Dims {
		if d.Q == "3" && d.N == 1 {
			h13 = parseBig(t, d.H)
		}
	}
	if tp := r.Estimates[len(r.Estimates)-1]; tp.Value == nil || relDiff(tp.Value, h13) > 1e-10 {
		t.Errorf("h_1(3) two-point Pade %v, mpmath %s", tp.Value, h13.Text('g', 20))
	}
	// The two series the two-point Pade sees: x-series at x = 0, and the
	// eps-series in powers of x - 1/2 (eps = -2 (x - 1/2)).
	atZero, atHalf, err := TwoPointSeries(two, inf, 200)
	if err != nil {
		t.Fatal(err)
	}
	for k := 0; k <= 10; k++ {
		want := new(big.Float).SetPrec(200).SetMantExp(two.Values[k], k) // times 2^k
		if k%2 == 1 {
			want.Neg(want)
		}
		if relDiff(atHalf.Coeff(k), want) > 1e-50 || relDiff(atZero.Coeff(k), inf.Values[k]) > 1e-50 {
			t.Errorf("k=%d: two-point inputs %s, %s", k, atZero.Coeff(k).Text('g', 15), atHalf.Coeff(k).Text('g', 15))
		}
	}
	// FromResummed leaves dims alone and takes the q-th root for b.
	e := Estimate{Method: "m", Value: big.NewFloat(0.25), Err: big.NewFloat(1e-10)}
	if got := FromResummed(QuantityDims, e, q, 100); got.Value.Cmp(e.Value) != 0 {
		t.Errorf("FromResummed dims changed the value to %s", got.Value.Text('g', 10))
	}
	// b^q = 1/4 at q = 4 is b = (1/4)^(1/4) = 1/sqrt(2), db = b/q * d(b^q)/b^q
	got := FromResummed(QuantityB, e, mustQ(t, "4"), 100)
	if f, _ := got.Value.Float64(); math.Abs(f-math.Sqrt(0.5)) > 1e-15 {
		t.Errorf("FromResummed b: %v", f)
	}
	if f, _ := got.Err.Float64(); math.Abs(f-math.Sqrt(0.5)/4*4e-10) > 1e-24 {
		t.Errorf("FromResummed b error %g", f)
	}
	neg := FromResummed(QuantityB, Estimate{Method: "m", Value: big.NewFloat(-1), Err: big.NewFloat(1)}, q, 100)
	if neg.Value != nil || !strings.Contains(neg.Detail, "non-positive") {
		t.Errorf("negative b^q: %+v", neg)
	}
}

func TestResumBadInput(t *testing.T) {
	four := mustQ(t, "4")
	inf := mustQ(t, "inf")
	cases := []struct {
		name string
		run  func() error
	}{
		{"q = inf", func() error { _, err := Resum(QuantityS0, inf, 0, 8, 20); return err }},
		{"order 1", func() error { _, err := Resum(QuantityS0, four, 0, 1, 20); return err }},
		{"order -1", func() error { _, err := Resum(QuantityB, four, 0, -1, 20); return err }},
		{"digits 1", func() error { _, err := Resum(QuantityB, four, 0, 8, 1); return err }},
		{"dims n = -1", func() error { _, err := Resum(QuantityDims, four, -1, 8, 20); return err }},
		{"TwoEndSeries order 1", func() error { _, _, err := TwoEndSeries(QuantityS0, 0, 1, 20); return err }},
		{"TwoEndSeries order above cap", func() error { _, _, err := TwoEndSeries(QuantityS0, 0, MaxOrder+1, 20); return err }},
		{"TwoEndSeries unknown", func() error { _, _, err := TwoEndSeries("entropy", 0, 4, 20); return err }},
		{"ResumFrom q = inf", func() error { _, err := ResumFrom(QuantityS0, inf, nil, nil, 64); return err }},
		{"Cauchy nodes <= order", func() error { _, err := DimensionCauchy(AroundTwo, 1, 8, 0.2, 8, 20); return err }},
	}
	for _, c := range cases {
		if err := c.run(); err == nil {
			t.Errorf("%s: accepted", c.name)
		}
	}
}

// A short Cauchy cross-check: the x-series of h_2 from Newton's iteration
// on series against the Cauchy integral of complex roots of k_A(h) = 1, and
// both against mpmath.taylor of the implicit root (golden file, 20 digits).
func TestDimensionCauchyInfGolden(t *testing.T) {
	const order = 4
	cau, err := DimensionCauchy(AroundInf, 2, order, 0.05, 32, 25)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range loadConformalGolden(t).TaylorDims {
		if c.Around != "inf" || c.N != 2 {
			continue
		}
		for k := 0; k <= order; k++ {
			// aliasing error about c_(k+32) r^32 / r^k with radius about 1/4
			tol := 1e-18 * math.Pow(0.05, -float64(k))
			if d := relDiff(cau[k], parseBig(t, c.Coefficients[k])); d > tol {
				t.Errorf("x^%d: Cauchy %s, mpmath %s", k, cau[k].Text('g', 22), c.Coefficients[k])
			}
		}
	}
}

// ParseQ on the edges of its input: spellings of infinity, blanks, the
// end point 2, exponents, and refusals with a message naming the range.
func TestParseQEdges(t *testing.T) {
	good := []struct {
		in    string
		inf   bool
		two   bool
		print string
		x     float64
	}{
		{"inf", true, false, "inf", 0},
		{" Infinity ", true, false, "inf", 0},
		{"+INF", true, false, "inf", 0},
		{"2", false, true, "2", 0.5},
		{"2.0", false, true, "2", 0.5},
		{"1e3", false, false, "1000", 1e-3},
		{" 4 ", false, false, "4", 0.25},
		{"1e400", false, false, "1e+400", 0},
	}
	for _, c := range good {
		q, err := ParseQ(c.in, 128)
		if err != nil {
			t.Errorf("ParseQ(%q): %v", c.in, err)
			continue
		}
		if q.Inf != c.inf || q.IsTwo() != c.two || q.String() != c.print {
			t.Errorf("ParseQ(%q) = inf %v, two %v, %q", c.in, q.Inf, q.IsTwo(), q.String())
		}
		x, _ := q.X(128).Float64()
		eps, _ := q.Eps(128).Float64()
		if math.Abs(x-c.x) > 1e-300 || math.Abs(eps-(1-2*c.x)) > 1e-15 {
			t.Errorf("ParseQ(%q): x = %g, eps = %g", c.in, x, eps)
		}
	}
	bad := []struct{ in, says string }{
		{"1.999999999999999999999", "below 2"},
		{"0", "below 2"},
		{"-inf", "cannot read"},
		{"", "cannot read"},
		{"abc", "cannot read"},
		{"nan", "cannot read"},
		{"4q", "cannot read"},
		{"2..4", "cannot read"},
	}
	for _, c := range bad {
		if _, err := ParseQ(c.in, 128); err == nil || !strings.Contains(err.Error(), c.says) {
			t.Errorf("ParseQ(%q): error %v, want one saying %q", c.in, err, c.says)
		}
	}
}

// Published values: the q = 4 dimensions as printed (MS 2016,
// arXiv:1604.07818), else the large-q formula h_n = 2n + 1 +
// (2/q)(2n^2+n+1)/(2n^2+n-1) and S_0 = log(2)/2 - pi^2/(4 q^2) (MS 2016),
// marked as limits.
func TestPublishedValues(t *testing.T) {
	four := mustQ(t, "4")
	for n, want := range []struct {
		v      float64
		digits int
	}{{2, 1}, {3.77, 3}, {5.68, 3}} {
		p, ok := PublishedDimension(four, n)
		if f, _ := p.Value.Float64(); !ok || f != want.v || p.Digits != want.digits || p.Limit {
			t.Errorf("PublishedDimension(4, %d) = %+v", n, p)
		}
	}
	ten := mustQ(t, "10")
	p, ok := PublishedDimension(ten, 1)
	if f, _ := p.Value.Float64(); !ok || math.Abs(f-3.4) > 1e-15 || !p.Limit || p.Digits != 0 {
		t.Errorf("PublishedDimension(10, 1) = %+v (want the limiting formula 3 + 0.2*4/2 = 3.4)", p)
	}
	if _, ok := PublishedDimension(ten, 0); ok {
		t.Error("PublishedDimension(10, 0): the large-q formula starts at n = 1")
	}
	s := PublishedS0(ten)
	if f, _ := s.Value.Float64(); math.Abs(f-(math.Ln2/2-math.Pi*math.Pi/400)) > 1e-15 || !s.Limit {
		t.Errorf("PublishedS0(10) = %+v", s)
	}
	if AroundTwo.Variable() != "eps" || AroundInf.Variable() != "x" || AroundTwo.String() != "2" || AroundInf.String() != "inf" {
		t.Error("End labels changed")
	}
}
