package conformal

import (
	"fmt"
	"math/big"
	"strings"
	"testing"

	"qbridge/series/scalar"
)

// formTerm is num/den * pi^(2 pi2) zeta(3)^zeta3 log(2)^l2; pi2 may be
// negative.
type formTerm struct {
	num, den int64
	pi2      int // power of pi^2
	zeta3    int // power of zeta(3)
	l2       int // power of log 2
}

// formValue evaluates a sum of formTerms at prec bits: the closed forms
// the tests expect, written out independently of the printing in
// closedform.go.

func formValue(t *testing.T, terms []formTerm, prec uint) *big.Float {
	t.Helper()
	pi := scalar.Pi(prec)
	pi2 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	z3, err := scalar.BigZeta(new(big.Float).SetPrec(prec).SetInt64(3), prec)
	if err != nil {
		t.Fatal(err)
	}
	sum := new(big.Float).SetPrec(prec)
	for _, f := range terms {
		v := new(big.Float).SetPrec(prec).Quo(big.NewFloat(float64(f.num)), big.NewFloat(float64(f.den)))
		for i := 0; i < f.pi2; i++ {
			v.Mul(v, pi2)
		}
		for i := 0; i > f.pi2; i-- {
			v.Quo(v, pi2)
		}
		for i := 0; i < f.l2; i++ {
			v.Mul(v, scalar.Ln2(prec))
		}
		for i := 0; i < f.zeta3; i++ {
			v.Mul(v, z3)
		}
		sum.Add(sum, v)
	}
	return sum
}

// The eps-series of h_1 around q = 2: the identified forms of eps^2, eps^4
// and eps^6 must agree with mpmath's Taylor coefficients of the implicit
// root (testdata/conformal_golden.json, 20 digits, written by
// testdata/gen_conformal.py with mpmath.taylor) to the 20 digits given,
// and IdentifyCoefficients must print exactly those forms. The odd
// coefficients vanish (h_1 is even in eps to this order in the golden file).
func TestIdentifyDimensionEpsSeries(t *testing.T) {
	g := loadConformalGolden(t)
	var golden []string
	for _, c := range g.TaylorDims {
		if c.Around == "2" && c.N == 1 {
			golden = c.Coefficients
		}
	}
	if len(golden) < 7 {
		t.Fatal("golden file: no eps-series of h_1 with 7 coefficients")
	}
	c, err := DimensionSeries(AroundTwo, 1, 6, 80)
	if err != nil {
		t.Fatal(err)
	}
	forms, err := IdentifyCoefficients(c)
	if err != nil {
		t.Fatal(err)
	}
	want := []struct {
		k     int
		text  string
		terms []formTerm
	}{
		{0, "4", []formTerm{{4, 1, 0, 0, 0}}},
		{2, "-5/6", []formTerm{{-5, 6, 0, 0, 0}}},
		{4, "-215/216 + 5/72*pi^2", []formTerm{{-215, 216, 0, 0, 0}, {5, 72, 1, 0, 0}}},
		{6, "-8915/3888 + 335/2592*pi^2 + 25/36*zeta(3) + 1/432*pi^4",
			[]formTerm{{-8915, 3888, 0, 0, 0}, {335, 2592, 1, 0, 0}, {25, 36, 0, 1, 0}, {1, 432, 2, 0, 0}}},
	}
	for _, w := range want {
		// the expected form against mpmath, to the golden file's 20 digits
		v := formValue(t, w.terms, 200)
		if d := relDiff(v, parseBig(t, golden[w.k])); d > 1e-19 {
			t.Errorf("eps^%d: form %s = %s, mpmath %s", w.k, w.text, v.Text('g', 22), golden[w.k])
		}
		f := forms[w.k]
		if f == nil {
			t.Errorf("eps^%d: no form found, want %s", w.k, w.text)
			continue
		}
		if f.Text != w.text {
			t.Errorf("eps^%d: form %q, want %q", w.k, f.Text, w.text)
		}
		if f.BeyondDigits < 10 || f.FoundDigits < minFindDigits {
			t.Errorf("eps^%d: confidence %d digits beyond %d searched, want >= 10 beyond >= %d", w.k, f.BeyondDigits, f.FoundDigits, minFindDigits)
		}
		if known := knownDigits(c.Values[w.k], c.Errors[w.k]); f.FoundDigits+f.BeyondDigits > known {
			t.Errorf("eps^%d: claims %d+%d digits, the error leaves %d", w.k, f.FoundDigits, f.BeyondDigits, known)
		}
	}
	for _, k := range []int{1, 3, 5} {
		if forms[k] == nil || forms[k].Text != "0" || forms[k].FoundDigits != 0 {
			t.Errorf("eps^%d: form %+v, want 0 (zero within its error)", k, forms[k])
		}
	}
}

// The S_0 series around q = infinity. From S_0 = log(2)/2 - int_0^x pi
// (1/2 - y) tan(pi y) dy (MS 2016 arXiv:1604.07818 sec. 2.6, PHYSICS.md
// sec. 4) and tan z = sum_n T_n z^(2n-1), T_n = 2^(2n) (2^(2n) - 1)
// |B_2n|/(2n)! (DLMF 4.19.3, number from memory; B_2..B_8 = 1/6, -1/30, 1/42, -1/30, DLMF
// table 24.2.1; T = 1, 1/3, 2/15, 17/315):
// S_0 = log(2)/2 - sum_n T_n pi^(2n) [x^(2n)/(4n) - x^(2n+1)/(2n+1)],
// so c_2n = -T_n pi^(2n)/(4n) and c_(2n+1) = T_n pi^(2n)/(2n+1).
// The x^8 and x^9 terms, rational multiples of pi^8 (weight 8), lie in the
// stated basis and must be found.
func TestIdentifyS0InfSeries(t *testing.T) {
	c, err := S0Series(AroundInf, 9, 80)
	if err != nil {
		t.Fatal(err)
	}
	forms, err := IdentifyCoefficients(c)
	if err != nil {
		t.Fatal(err)
	}
	want := []string{"1/2*log(2)", "0", "-1/4*pi^2", "1/3*pi^2", "-1/24*pi^4", "1/15*pi^4",
		"-1/90*pi^6", "2/105*pi^6", "-17/5040*pi^8", "17/2835*pi^8"}
	for k, w := range want {
		if forms[k] == nil {
			t.Errorf("x^%d: no form found, want %s", k, w)
			continue
		}
		if forms[k].Text != w {
			t.Errorf("x^%d: form %q, want %q", k, forms[k].Text, w)
		}
	}
	if f := forms[8]; f != nil && f.TeX != `-\frac{17}{5040} \pi^{8}` {
		t.Errorf("x^8 as LaTeX: %q", f.TeX)
	}
}

// Every product of the weight-8 basis is found, in particular the ones a
// cap on the basis size used to cut off (pi^6 log(2)^2, pi^8), and a
// product of weight 7 next to one of weight 8 (mixed, outside the basis)
// is not given a form.
func TestIdentifyWeightEight(t *testing.T) {
	const prec = 400
	pi := scalar.Pi(prec)
	pi2 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	l2 := scalar.Ln2(prec)
	z3, _ := scalar.BigZeta(new(big.Float).SetPrec(prec).SetInt64(3), prec)
	z5, _ := scalar.BigZeta(new(big.Float).SetPrec(prec).SetInt64(5), prec)
	pow := func(x *big.Float, n int) *big.Float {
		v := new(big.Float).SetPrec(prec).SetInt64(1)
		for i := 0; i < n; i++ {
			v.Mul(v, x)
		}
		return v
	}
	mul := func(xs ...*big.Float) *big.Float {
		v := new(big.Float).SetPrec(prec).SetInt64(1)
		for _, x := range xs {
			v.Mul(v, x)
		}
		return v
	}
	frac := func(p, q int64, x *big.Float) *big.Float {
		v := new(big.Float).SetPrec(prec).Mul(x, big.NewFloat(float64(p)))
		return v.Quo(v, big.NewFloat(float64(q)))
	}
	cases := []struct {
		name string
		v    *big.Float
		want string // "" for no form
	}{
		{"pi^8", frac(-17, 5040, pow(pi2, 4)), "-17/5040*pi^8"},
		{"pi^6 log^2 2", frac(3, 7, mul(pow(pi2, 3), l2, l2)), "3/7*pi^6*log(2)^2"},
		{"zeta(3) zeta(5)", frac(5, 11, mul(z3, z5)), "5/11*zeta(3)*zeta(5)"},
		{"pi^2 zeta(3)^2", frac(-1, 3, mul(pi2, z3, z3)), "-1/3*pi^2*zeta(3)^2"},
		{"weight 7 + weight 8", new(big.Float).SetPrec(prec).Add(mul(pi2, z5), pow(pi2, 4)), ""},
	}
	for _, c := range cases {
		err := new(big.Float).SetPrec(64).SetMantExp(new(big.Float).Abs(c.v), -330) // about 99 digits known
		coeffs := &Coefficients{Values: []*big.Float{c.v}, Errors: []*big.Float{err}, Prec: prec}
		forms, e := IdentifyCoefficients(coeffs)
		if e != nil {
			t.Fatal(e)
		}
		got := ""
		if forms[0] != nil {
			got = forms[0].Text
		}
		if got != c.want {
			t.Errorf("%s: form %q, want %q", c.name, got, c.want)
		}
	}
}

// Numbers outside the basis stay unidentified: b(q = 2) = 1/pi (PHYSICS
// sec. 4) and its eps-derivative log(pi)/pi (b = pi^(eps-1) (1 + O(eps^2)),
// from b^q = z cot z/pi^2 with z = pi eps/2).
func TestIdentifyOutsideBasis(t *testing.T) {
	cs, err := BSeries(AroundTwo, 1, 40)
	if err != nil {
		t.Fatal(err)
	}
	forms, err := IdentifyCoefficients(cs[0])
	if err != nil {
		t.Fatal(err)
	}
	for k, f := range forms {
		if f != nil {
			t.Errorf("b eps^%d = %s: spurious form %q", k, cs[0].Values[k].Text('g', 20), f.Text)
		}
	}
}

// Too few digits: no search, no form (15 searched digits are the least).
func TestIdentifyTooFewDigits(t *testing.T) {
	half := big.NewFloat(0.5)
	c := &Coefficients{Values: []*big.Float{half}, Errors: []*big.Float{big.NewFloat(1e-20)}, Prec: 64}
	forms, err := IdentifyCoefficients(c)
	if err != nil {
		t.Fatal(err)
	}
	if forms[0] != nil {
		t.Errorf("1/2 known to 20 digits: form %q, want none (needs %d digits)", forms[0].Text, minFindDigits+verifyDigits+marginDigits)
	}
}

func TestIdentifyBadInput(t *testing.T) {
	one := big.NewFloat(1)
	cases := []struct {
		name string
		c    *Coefficients
	}{
		{"nil", nil},
		{"length mismatch", &Coefficients{Values: []*big.Float{one}, Prec: 64}},
		{"nil value", &Coefficients{Values: []*big.Float{nil}, Errors: []*big.Float{one}, Prec: 64}},
		{"infinite error", &Coefficients{Values: []*big.Float{one}, Errors: []*big.Float{new(big.Float).SetInf(false)}, Prec: 64}},
		{"negative error", &Coefficients{Values: []*big.Float{one}, Errors: []*big.Float{big.NewFloat(-1)}, Prec: 64}},
	}
	for _, c := range cases {
		if _, err := IdentifyCoefficients(c.c); err == nil || !strings.HasPrefix(err.Error(), "expansion: IdentifyCoefficients") {
			t.Errorf("%s: error %v", c.name, err)
		}
	}
}

// The doc string states the weights, basis sizes and digit counts the code
// uses.
func TestClosedFormBasisSizes(t *testing.T) {
	for _, c := range []struct{ lo, hi, n int }{{0, 0, 1}, {2, 2, 2}, {7, 7, 10}, {8, 8, 13}, {0, 4, 11}} {
		b, err := closedFormBasis(c.lo, c.hi, 64)
		if err != nil {
			t.Fatal(err)
		}
		if len(b) != c.n {
			t.Errorf("weights %d..%d: %d basis elements, want %d", c.lo, c.hi, len(b), c.n)
		}
	}
	single, _ := closedFormBasis(maxSingleWeight, maxSingleWeight, 64)
	mixed, _ := closedFormBasis(0, maxMixedWeight, 64)
	for _, s := range []string{
		fmt.Sprintf("w = 0..%d", maxSingleWeight),
		fmt.Sprintf("%d at w = %d", len(single), maxSingleWeight),
		fmt.Sprintf("weight <= %d together (%d basis elements)", maxMixedWeight, len(mixed)),
		fmt.Sprintf("all but %d of the digits", verifyDigits+marginDigits),
		fmt.Sprintf("%d digits beyond", verifyDigits),
	} {
		if !strings.Contains(ClosedFormBasisDoc, s) {
			t.Errorf("ClosedFormBasisDoc lacks %q", s)
		}
	}
}
