package claim

import (
	"encoding/json"
	"errors"
	"math"
	"math/big"
	"os"
	"strings"
	"testing"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
	"qbridge/series/scalar"
)

// checkClaim parses, plans and checks a claim at its own end and order.
func checkClaim(t *testing.T, ev *Evaluator, text string, tol float64) *Result {
	t.Helper()
	c, err := Parse(text)
	if err != nil {
		t.Fatalf("%s: %v", text, err)
	}
	pl, err := c.Plan(nil, -1)
	if err != nil {
		t.Fatalf("%s: %v", text, err)
	}
	if len(pl.Ends) != 1 {
		t.Fatalf("%s: ends %v", text, pl.Ends)
	}
	r, err := ev.Check(c, pl.Ends[0], pl.Order, big.NewFloat(tol))
	if err != nil {
		t.Fatalf("%s: %v", text, err)
	}
	return r
}

func float(x *big.Float) float64 { f, _ := x.Float64(); return f }

// True claims about the exactly known quantities hold to their stated
// order, each with its source.
func TestTrueClaims(t *testing.T) {
	ev := NewEvaluator(30)
	for _, c := range []struct{ claim, source string }{
		// eps^2 coefficient -5/6: PSLQ closed form of the project, equal to
		// the mpmath Taylor coefficient -0.83333333333333333333 of
		// testdata/conformal_golden.json (numerical differentiation of the
		// implicit root, testdata/gen_conformal.py).
		{"h_1 = 4 - (5/6)*eps^2 + O(eps^4)", "PSLQ; mpmath golden"},
		// The eps^4 closed form -215/216 + 5 pi^2/72 (PSLQ) against the
		// series; mpmath's coefficient is -0.30998117585027602184 (golden).
		{"h_1 = 4 - (5/6)*eps^2 + (-215/216 + 5*pi^2/72)*eps^4 + O(eps^6)", "PSLQ; mpmath golden"},
		// h_n -> 2n+2 at q = 2 (PHYSICS sec. 4, free-fermion bilinears).
		{"h_3 = 8 + O(eps)", "PHYSICS sec. 4"},
		// Large q: h_n = 2n+1 + (2/q)(2n^2+n+1)/(2n^2+n-1) + O(1/q^2), n >= 1
		// (Maldacena-Stanford 2016, arXiv:1604.07818; PHYSICS sec. 4).
		{"h_1 = 3 + (2/q)*(2+1+1)/(2+1-1) + O(1/q^2)", "MS 2016"},
		{"h_2 = 5 + (2/q)*(2*2^2+2+1)/(2*2^2+2-1) + O(1/q^2)", "MS 2016"},
		{"h_5 = 11 + (2/q)*(2*5^2+5+1)/(2*5^2+5-1) + O(x^2)", "MS 2016"},
		// The same at order 1/q, written with a pole: q (h_1 - 3) -> 4.
		{"q*(h_1 - 3) = 4 + O(1/q)", "MS 2016"},
		// S_0 = (1/2) log 2 - pi^2/(4 q^2) + O(1/q^3) (MS 2016 sec. 4;
		// PHYSICS sec. 5).
		{"S_0 = log(2)/2 - pi^2/(4*q^2) + O(1/q^3)", "MS 2016"},
		// Around q = 2, from S_0 = int_x^{1/2} pi (1/2-u) tan(pi u) du
		// (PHYSICS sec. 4) with u = 1/2 - w and pi w cot(pi w) = 1 -
		// pi^2 w^2/3 - pi^4 w^4/45 - ... (DLMF 4.19.6, from memory):
		// S_0 = eps/2 - pi^2 eps^3/72 - pi^4 eps^5/7200 + O(eps^7).
		{"S_0 = eps/2 - pi^2*eps^3/72 - pi^4*eps^5/7200 + O(eps^7)", "PHYSICS sec. 4 + DLMF 4.19.6"},
		// b -> 1/pi at q = 2 (PHYSICS sec. 4) and the defining relation
		// b^q pi = (1/2 - 1/q) tan(pi/q) (MS 2016), whose right side is a
		// pole of tan times a zero at q = 2.
		{"b = 1/pi + O(eps)", "PHYSICS sec. 4"},
		{"b^q*pi = (1/2 - 1/q)*tan(pi/q) + O(eps^8)", "MS 2016"},
		// The variables: eps = 1 - 2/q and x = 1/q at both ends (exact).
		{"eps = 1 - 2*x + O(eps^9)", "definition"},
		{"q*x = 1 + O(x^9)", "definition"},
		// Normalised by the value at q = 2: (h_1 - 4)/eps^2 -> -5/6.
		{"(h_1 - 4)/eps^2 = -5/6 + O(eps^2)", "PSLQ; mpmath golden"},
	} {
		r := checkClaim(t, ev, c.claim, 0)
		if !r.Holds() {
			t.Errorf("%s (%s): %s", c.claim, c.source, r.Verdict(8))
		}
	}
}

// The eps^4 term left out of a claim made to O(eps^5): the check fails at
// order 4, and the difference is the eps^4 coefficient of h_1, against
// mpmath's -0.30998117585027602184 (testdata/conformal_golden.json, 20
// digits) and the PSLQ closed form -215/216 + 5 pi^2/72; its stated error
// covers the difference from the closed form.
func TestH1EpsFourCoefficient(t *testing.T) {
	ev := NewEvaluator(30)
	r := checkClaim(t, ev, "h_1 = 4 - (5/6)*eps^2 + O(eps^5)", 0)
	f := r.FirstDisagreement()
	if f == nil || f.K != 4 {
		t.Fatalf("%s, want a failure at order 4", r.Verdict(8))
	}
	v, e := f.Diff, f.Err
	golden := goldenTaylor(t, "2", 1)[4]
	if d := math.Abs(float(v) - golden); d > 1e-19 {
		t.Errorf("eps^4 coefficient %s, mpmath %v", v.Text('g', 25), golden)
	}
	prec := uint(200)
	exact := new(big.Float).SetPrec(prec).Mul(scalar.Pi(prec), scalar.Pi(prec))
	exact.Mul(exact, big.NewFloat(5)).Quo(exact, big.NewFloat(72))
	exact.Sub(exact, new(big.Float).SetPrec(prec).Quo(big.NewFloat(215), big.NewFloat(216)))
	d := new(big.Float).Sub(v, exact)
	if new(big.Float).Abs(d).Cmp(e) > 0 {
		t.Errorf("eps^4 coefficient %s +- %s, closed form %s: off by %s", v.Text('g', 30), e.Text('e', 1), exact.Text('g', 30), d.Text('e', 2))
	}
	t.Logf("eps^4 coefficient of h_1: %s +- %s; -215/216 + 5 pi^2/72 = %s; difference %s",
		v.Text('g', 32), e.Text('e', 2), exact.Text('g', 32), d.Text('e', 2))
}

// goldenTaylor reads the mpmath Taylor coefficients of h_n around one end
// from testdata/conformal_golden.json.
func goldenTaylor(t *testing.T, around string, n int) []float64 {
	t.Helper()
	raw, err := os.ReadFile("../../testdata/conformal_golden.json")
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		TaylorDims []struct {
			Around       string   `json:"around"`
			N            int      `json:"n"`
			Coefficients []string `json:"coefficients"`
		} `json:"taylor_dims"`
	}
	if err := json.Unmarshal(raw, &doc); err != nil {
		t.Fatal(err)
	}
	for _, d := range doc.TaylorDims {
		if d.Around == around && d.N == n {
			out := make([]float64, len(d.Coefficients))
			for i, s := range d.Coefficients {
				f, _, err := big.ParseFloat(s, 10, 80, big.ToNearestEven)
				if err != nil {
					t.Fatal(err)
				}
				out[i], _ = f.Float64()
			}
			return out
		}
	}
	t.Fatalf("no golden Taylor series for h_%d around %s", n, around)
	return nil
}

// False claims fail at the right order with the right difference.
func TestFalseClaims(t *testing.T) {
	ev := NewEvaluator(30)
	pi2 := math.Pi * math.Pi
	for _, c := range []struct {
		claim  string
		k      int
		diff   float64
		source string
	}{
		// -5/6 - (-4/5) = -1/30 at eps^2.
		{"h_1 = 4 - (4/5)*eps^2 + O(eps^4)", 2, -1.0 / 30, "PSLQ; mpmath golden"},
		// The 1/q coefficient of h_1 is 4 (MS 2016), not 2.
		{"h_1 = 3 + 2/q + O(1/q^2)", 1, 2, "MS 2016"},
		// h_2's 1/q coefficient 22/9 (MS 2016) is left out.
		{"h_2 = 5 + O(1/q^2)", 1, 22.0 / 9, "MS 2016"},
		// S_0's next term: int_0^x pi (1/2-u) tan(pi u) du = pi^2 x^2/4 -
		// pi^2 x^3/3 + O(x^4) (PHYSICS sec. 4 with tan(pi u) = pi u +
		// O(u^3)), so the claim misses +pi^2/3 at x^3.
		{"S_0 = log(2)/2 - pi^2/(4*q^2) + O(1/q^4)", 3, pi2 / 3, "PHYSICS sec. 4"},
		// A failure below order 0: q h_1 = 3 q + 4 + ..., not 4 q.
		{"q*h_1 = 4*q + O(x^0)", -1, -1, "MS 2016"},
		// S_0 vanishes at q = 2 (PHYSICS sec. 4).
		{"S_0 = log(2)/2 + O(eps)", 0, -math.Log(2) / 2, "PHYSICS sec. 4"},
	} {
		r := checkClaim(t, ev, c.claim, 0)
		f := r.FirstDisagreement()
		if f == nil {
			t.Errorf("%s: holds, want a failure at order %d", c.claim, c.k)
			continue
		}
		if f.K != c.k || math.Abs(float(f.Diff)-c.diff) > 1e-14*math.Max(1, math.Abs(c.diff)) {
			t.Errorf("%s (%s): %s, want order %d with difference %v", c.claim, c.source, r.Verdict(10), c.k, c.diff)
		}
		if k, ok := r.HoldsTo(); ok != (c.k > r.Orders[0].K) || ok && k != c.k-1 {
			t.Errorf("%s: holds to %d (%v)", c.claim, k, ok)
		}
	}
}

// A tolerance accepts a difference below it: -1/30 passes with tol 0.04
// and fails with tol 0.03.
func TestTolerance(t *testing.T) {
	ev := NewEvaluator(30)
	if r := checkClaim(t, ev, "h_1 = 4 - (4/5)*eps^2 + O(eps^4)", 0.04); !r.Holds() {
		t.Errorf("tol 0.04: %s", r.Verdict(6))
	}
	if r := checkClaim(t, ev, "h_1 = 4 - (4/5)*eps^2 + O(eps^4)", 0.03); r.Holds() {
		t.Errorf("tol 0.03: %s", r.Verdict(6))
	}
}

// Faults found while expanding name their column.
func TestCheckFaults(t *testing.T) {
	ev := NewEvaluator(30)
	for _, c := range []struct {
		claim string
		col   int
		want  string
	}{
		{"h_1 = 1/(eps - eps) + O(eps^2)", 8, "vanishes to every order computed"},
		{"h_1 = log(eps) + O(eps^2)", 7, "log of a series that vanishes"},
		{"h_1 = log(eps - 1) + O(eps^2)", 7, "is not positive"},
		{"h_1 = exp(q) + O(1/q^2)", 7, "pole"},
		{"h_1 = Gamma(eps) + O(eps^2)", 7, "Gamma"},
		{"h_1 = eps^(1/2) + O(eps^2)", 10, "not a Laurent series"},
		{"h_1 = (eps - 1)^(1/2) + O(eps^2)", 16, "not positive"},
	} {
		cl, err := Parse(c.claim)
		if err != nil {
			t.Fatalf("%s: %v", c.claim, err)
		}
		pl, err := cl.Plan(nil, -1)
		if err != nil {
			t.Fatalf("%s: %v", c.claim, err)
		}
		_, err = ev.Check(cl, pl.Ends[0], pl.Order, nil)
		var ce *Error
		if !errors.As(err, &ce) || ce.Col != c.col || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: got %v, want column %d and %q", c.claim, err, c.col, c.want)
		}
	}
}

// Plan: the O() term names the end and the order; --order above it, an
// --around against it, and b around q = infinity are refused with the
// column; a claim without a variable is checked at both ends.
func TestPlan(t *testing.T) {
	two, inf := conformal.AroundTwo, conformal.AroundInf
	cases := []struct {
		claim  string
		around *conformal.End
		order  int
		ends   []conformal.End
		k      int
		errCol int
		want   string
	}{
		{"h_1 = 4 + O(eps^4)", nil, -1, []conformal.End{two}, 3, 0, ""},
		{"h_1 = 4 + O(eps^4)", nil, 2, []conformal.End{two}, 2, 0, ""},
		{"h_1 = 4 + O(eps^4)", nil, 5, nil, 0, 11, "--order 5 conflicts with O(eps^4)"},
		{"h_1 = 4 + O(eps^4)", &inf, -1, nil, 0, 11, "O(eps^4) is an order around q = 2, but --around inf"},
		{"h_1 = 3 + 4*x", nil, -1, []conformal.End{inf}, DefaultOrder, 0, ""},
		{"h_1 = h_1", nil, 3, []conformal.End{two, inf}, 3, 0, ""},
		{"b = 1 + O(1/q)", nil, -1, nil, 0, 1, "b is not a power series around q = inf"},
		{"b = b", nil, -1, []conformal.End{two}, DefaultOrder, 0, ""},
	}
	for _, c := range cases {
		cl, err := Parse(c.claim)
		if err != nil {
			t.Fatal(err)
		}
		pl, err := cl.Plan(c.around, c.order)
		if c.want != "" {
			var ce *Error
			if !errors.As(err, &ce) || ce.Col != c.errCol || !strings.Contains(err.Error(), c.want) {
				t.Errorf("%s: got %v, want column %d and %q", c.claim, err, c.errCol, c.want)
			}
			continue
		}
		if err != nil {
			t.Errorf("%s: %v", c.claim, err)
			continue
		}
		if pl.Order != c.k || len(pl.Ends) != len(c.ends) || pl.Ends[0] != c.ends[0] {
			t.Errorf("%s: plan %+v, want ends %v order %d", c.claim, pl, c.ends, c.k)
		}
	}
}

// A request beyond what a quantity supports comes back as the provider's
// input error (the command line's bad input), without a computation.
func TestOrderBeyondProvider(t *testing.T) {
	ev := NewEvaluator(30)
	cl, err := Parse("E_0 = O(1/q^40)")
	if err != nil {
		t.Fatal(err)
	}
	_, err = ev.Check(cl, conformal.AroundInf, 39, nil)
	if !errors.Is(err, expansion.ErrInput) {
		t.Errorf("got %v, want an input error", err)
	}
}

// At q = 4 the two sides of the eps^2 truncation of h_1: the exact root
// h_1(4) = 3.77 (MS 2016; mpmath 40 digits in testdata/conformal_golden.json)
// and 4 - 5/24 exactly; the difference is what the truncation drops.
func TestValuesAtQ(t *testing.T) {
	ev := NewEvaluator(30)
	cl, err := Parse("h_1 = 4 - (5/6)*eps^2 + O(eps^4)")
	if err != nil {
		t.Fatal(err)
	}
	v, err := ev.At(cl, big.NewFloat(4))
	if err != nil {
		t.Fatal(err)
	}
	mp := goldenDim(t, "4", 1)
	if d := math.Abs(float(v.LHS) - mp); d > 1e-15 || math.Abs(float(v.LHS)-3.77) > 0.005 {
		t.Errorf("h_1(4) = %s, mpmath %v, published 3.77", v.LHS.Text('g', 20), mp)
	}
	if d := math.Abs(float(v.RHS) - (4 - 5.0/24)); d > 1e-15 {
		t.Errorf("RHS %s, want 4 - 5/24", v.RHS.Text('g', 20))
	}
	if d := math.Abs(float(v.Diff) - (mp - (4 - 5.0/24))); d > 1e-15 {
		t.Errorf("difference %s", v.Diff.Text('g', 20))
	}
	if v.DiffErr.Sign() <= 0 || float(v.DiffErr) > 1e-20 {
		t.Errorf("difference error %s", v.DiffErr.Text('e', 2))
	}
	if _, err := ev.At(cl, big.NewFloat(1.5)); err == nil {
		t.Error("q = 1.5 accepted")
	}
}

// goldenDim reads h_n(q) from testdata/conformal_golden.json (mpmath).
func goldenDim(t *testing.T, q string, n int) float64 {
	t.Helper()
	raw, err := os.ReadFile("../../testdata/conformal_golden.json")
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		Dims []struct {
			Q string `json:"q"`
			N int    `json:"n"`
			H string `json:"h"`
		} `json:"dims"`
	}
	if err := json.Unmarshal(raw, &doc); err != nil {
		t.Fatal(err)
	}
	for _, d := range doc.Dims {
		if d.Q == q && d.N == n {
			f, _, err := big.ParseFloat(d.H, 10, 80, big.ToNearestEven)
			if err != nil {
				t.Fatal(err)
			}
			v, _ := f.Float64()
			return v
		}
	}
	t.Fatalf("no golden h_%d(%s)", n, q)
	return 0
}

// The stated errors of a composite expression cover its true error: the
// coefficients at 20 digits differ from those at 60 by no more than the
// errors the 20-digit run states.
func TestErrorsCoverHigherPrecision(t *testing.T) {
	claim := "exp(h_1)*Gamma(h_1/2)/log(1 + h_1)*sqrt(S_0/eps) - psi(b*pi + h_2)^3 = 0 + O(eps^8)"
	cl, err := Parse(claim)
	if err != nil {
		t.Fatal(err)
	}
	lo, err := NewEvaluator(20).Check(cl, conformal.AroundTwo, 7, nil)
	if err != nil {
		t.Fatal(err)
	}
	hi, err := NewEvaluator(60).Check(cl, conformal.AroundTwo, 7, nil)
	if err != nil {
		t.Fatal(err)
	}
	for k := 0; k <= 7; k++ {
		v, e := lo.LHS.Coeff(k)
		w, _ := hi.LHS.Coeff(k)
		d := new(big.Float).Sub(v, w)
		if new(big.Float).Abs(d).Cmp(e) > 0 || e.Sign() == 0 {
			t.Errorf("k=%d: 20 digits %s +- %s, 60 digits %s", k, v.Text('g', 25), e.Text('e', 2), w.Text('g', 25))
		}
	}
}

// The numerical quantities (E_0, alpha_S: low-temperature fits, errors
// about 1e-6..1e-12): a few claims, each a few seconds.
func TestEnergyClaims(t *testing.T) {
	if testing.Short() {
		t.Skip("E_0 and alpha_S series take a few seconds")
	}
	ev := NewEvaluator(20)
	for _, c := range []string{
		// E_0 = -script-J/q^2 + O(1/q^3) and alpha_S = 1/(4 q^2) + O(1/q^3)
		// (MS 2016 arXiv:1604.07818; PHYSICS sec. 5).
		"q^2*E_0 = -1 + O(1/q)",
		"alpha_S = 1/(4*q^2) + O(1/q^3)",
		// q = 2 semicircle: E_0 = -2/(3 pi), alpha = 1/(24 pi) (PHYSICS sec. 5).
		"E_0 = -2/(3*pi) + O(eps)",
		"alpha_S = 1/(24*pi) + O(eps)",
	} {
		r := checkClaim(t, ev, c, 0)
		if !r.Holds() {
			t.Errorf("%s: %s", c, r.Verdict(8))
		}
	}
	// -1/2 instead of -1 fails at order 0 by -1/2 within the stated error.
	r := checkClaim(t, ev, "q^2*E_0 = -1/2 + O(1/q)", 0)
	f := r.FirstDisagreement()
	if f == nil || f.K != 0 || math.Abs(float(f.Diff)+0.5) > 3*float(f.Err) {
		t.Errorf("q^2*E_0 = -1/2: %s", r.Verdict(8))
	}
}

// High-temperature coefficients in claims: kappa_6/N = 3/q^2 - 1/q^3
// exactly (the t^3 coefficient (3q - 1)/(720 q^3) of log Z; q = 2 gives the
// semicircle's 5/8 = 720/1152) holds at both ends and to every order, and a
// wrong claim fails at the first wrong power.
func TestHighTempClaims(t *testing.T) {
	e := NewEvaluator(20)
	for _, c := range []struct {
		text  string
		holds bool
	}{
		{"kappa_6 = 3/q^2 - 1/q^3 + O(1/q^8)", true},
		{"kappa_6 = 3*x^2 - x^3 + O(eps^6)", true},
		{"logz_4 = -1/(48*q^2) + O(1/q^6)", true},
		{"heat_2 = 2*logz_2 + O(1/q^6)", true},
		{"mu_4 = kappa_4 + 3*kappa_2^2 + O(eps^5)", true},
		{"kappa_8 = -46/q^2 + O(1/q^3)", true},
		{"kappa_8 = -46*24/q^2 + O(1/q^3)", false},
		{"kappa_6 = 3/q^2 + O(1/q^4)", false},
	} {
		cl, err := Parse(c.text)
		if err != nil {
			t.Fatalf("%s: %v", c.text, err)
		}
		pl, err := cl.Plan(nil, -1)
		if err != nil {
			t.Fatalf("%s: %v", c.text, err)
		}
		r, err := e.Check(cl, pl.Ends[0], pl.Order, nil)
		if err != nil {
			t.Fatalf("%s: %v", c.text, err)
		}
		if r.Holds() != c.holds {
			t.Errorf("%s: holds = %v, want %v", c.text, r.Holds(), c.holds)
		}
	}
}
