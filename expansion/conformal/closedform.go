package conformal

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"strings"

	"qbridge/series/pslq"
	"qbridge/series/scalar"
)

// ClosedFormBasisDoc describes the basis that IdentifyCoefficients tries
// and the confidence it states for a form it keeps.
const ClosedFormBasisDoc = "each coefficient is matched by PSLQ against rational multiples of the products " +
	"pi^(2a) zeta(3)^b zeta(5)^c (log 2)^d: first all products of one weight w = 2a+3b+5c+d at a time " +
	"(w = 0..8; 1 to 13 basis elements, 13 at w = 8), then all products of weight <= 4 together (11 basis elements); " +
	"integer coefficients up to 10^12; PSLQ searches all but 12 of the digits the coefficient's error leaves, " +
	"and a form is kept only if it holds to at least 10 digits beyond those PSLQ used"

// ClosedForm is an identified exact form of a number.
type ClosedForm struct {
	// Text is the form as plain text, e.g. "-1/6*pi^2 + 2*log(2)".
	Text string
	// TeX is the same form as LaTeX, e.g. "-\frac{1}{6}\pi^{2} + 2\log 2".
	TeX string
	// FoundDigits is the number of leading decimal digits of the
	// coefficient that PSLQ searched; 0 when the coefficient is zero within
	// its error (Text is then "0" and no search was run).
	FoundDigits int
	// BeyondDigits is the confidence of the form: the number of further
	// decimal digits, past FoundDigits, on which the relation was checked
	// and holds (at least 10; at most the digits the error leaves). 0 with
	// FoundDigits.
	BeyondDigits int
}

type basisElem struct {
	text, tex string
	weight    int
	value     *big.Float
}

// closedFormBasis returns the products of pi^2, zeta(3), zeta(5), log 2 of
// weight minWeight..maxWeight, lowest weight first, at prec bits.
func closedFormBasis(minWeight, maxWeight int, prec uint) ([]basisElem, error) {
	pi := scalar.Pi(prec)
	pi2 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	z3, err := scalar.BigZeta(bigInt(3, prec), prec)
	if err != nil {
		return nil, err
	}
	z5, err := scalar.BigZeta(bigInt(5, prec), prec)
	if err != nil {
		return nil, err
	}
	l2 := scalar.Ln2(prec)
	type gen struct {
		text, tex string
		w         int
		v         *big.Float
	}
	gens := []gen{{"pi^2", `\pi^{2}`, 2, pi2}, {"zeta(3)", `\zeta(3)`, 3, z3}, {"zeta(5)", `\zeta(5)`, 5, z5}, {"log(2)", `\log 2`, 1, l2}}
	var out []basisElem
	if minWeight == 0 {
		out = append(out, basisElem{"1", "1", 0, bigInt(1, prec)})
	}
	// exponents (a, b, c, d) by increasing weight
	for w := max(minWeight, 1); w <= maxWeight; w++ {
		for a := 0; 2*a <= w; a++ {
			for b := 0; 2*a+3*b <= w; b++ {
				for c := 0; 2*a+3*b+5*c <= w; c++ {
					d := w - 2*a - 3*b - 5*c
					exps := []int{a, b, c, d}
					v := bigInt(1, prec)
					var texts, texs []string
					for i, e := range exps {
						for j := 0; j < e; j++ {
							v.Mul(v, gens[i].v)
						}
						if e == 1 {
							texts = append(texts, gens[i].text)
							texs = append(texs, gens[i].tex)
						} else if e > 1 && i == 0 {
							texts = append(texts, fmt.Sprintf("pi^%d", 2*e))
							texs = append(texs, fmt.Sprintf(`\pi^{%d}`, 2*e))
						} else if e > 1 {
							texts = append(texts, fmt.Sprintf("%s^%d", gens[i].text, e))
							texs = append(texs, fmt.Sprintf("(%s)^{%d}", gens[i].tex, e))
						}
					}
					out = append(out, basisElem{strings.Join(texts, "*"), strings.Join(texs, " "), w, v})
				}
			}
		}
	}
	return out, nil
}

// Weights searched by IdentifyCoefficients: each single weight up to
// maxSingleWeight, then all weights up to maxMixedWeight together.
const (
	maxSingleWeight = 8
	maxMixedWeight  = 4
)

// Digits of a coefficient IdentifyCoefficients leaves out of the search:
// FindRelation checks a relation on verifyDigits more than it searched, and
// marginDigits more are left for the coefficient's error estimate itself.
const (
	verifyDigits = 10
	marginDigits = 2
)

// minFindDigits is the fewest digits a search is run on.
const minFindDigits = 15

// maxRelationCoeff bounds the integers of a relation PSLQ looks for.
const maxRelationCoeff = 1_000_000_000_000

// closedFormSearch is one basis tried by IdentifyCoefficients.
type closedFormSearch struct{ minWeight, maxWeight int }

// closedFormSearches lists the bases of ClosedFormBasisDoc in the order
// they are tried: one weight at a time, then the mixed low weights.
func closedFormSearches() []closedFormSearch {
	var out []closedFormSearch
	for w := 0; w <= maxSingleWeight; w++ {
		out = append(out, closedFormSearch{w, w})
	}
	return append(out, closedFormSearch{0, maxMixedWeight})
}

// IdentifyCoefficients runs PSLQ on each coefficient against the bases of
// ClosedFormBasisDoc, in the order given there; the first verified form is
// kept. An entry is nil where no form was found and verified. The
// coefficients must carry enough digits (their error estimate decides):
// PSLQ searches all but 12 of them and the relation must hold on 10 more;
// the search needs about (basis size + 1) times the digits of the largest
// integer in the relation (a 13-element basis and integers of 4 digits:
// some 60 digits). A coefficient zero within its error is "0".
func IdentifyCoefficients(c *Coefficients) ([]*ClosedForm, error) {
	if c == nil {
		return nil, errors.New("expansion: IdentifyCoefficients: no coefficients (nil)")
	}
	if len(c.Errors) != len(c.Values) {
		return nil, fmt.Errorf("expansion: IdentifyCoefficients: %d values but %d errors", len(c.Values), len(c.Errors))
	}
	out := make([]*ClosedForm, len(c.Values))
	searches := closedFormSearches()
	for k, v := range c.Values {
		e := c.Errors[k]
		if v == nil || e == nil || v.IsInf() || e.IsInf() || e.Sign() < 0 {
			return nil, fmt.Errorf("expansion: IdentifyCoefficients: coefficient %d or its error is missing, infinite or negative", k)
		}
		prec := max(c.Prec, v.Prec())
		for _, sr := range searches {
			f, err := identify(v, e, sr.minWeight, sr.maxWeight, prec)
			if err != nil {
				return nil, err
			}
			if f != nil {
				out[k] = f
				break
			}
		}
	}
	return out, nil
}

// knownDigits returns the decimal digits of v that its absolute error err
// leaves: floor(-log10(err/|v|)), for v != 0 and err > 0 (v's precision when
// err is 0).
func knownDigits(v, err *big.Float) int {
	if err.Sign() == 0 {
		return int(float64(v.Prec()) * math.Log10(2))
	}
	rel := new(big.Float).SetPrec(64).Quo(err, new(big.Float).Abs(v))
	mant := new(big.Float)
	e := rel.MantExp(mant)
	m, _ := mant.Float64()
	return int(math.Floor(-(math.Log10(m) + float64(e)*math.Log10(2))))
}

// identify tries to write v (known to within err) as a rational combination
// of the products of weight minWeight..maxWeight.
func identify(v, err *big.Float, minWeight, maxWeight int, prec uint) (*ClosedForm, error) {
	if new(big.Float).Abs(v).Cmp(err) <= 0 {
		return &ClosedForm{Text: "0", TeX: "0"}, nil
	}
	known := knownDigits(v, err)
	findDigits := known - verifyDigits - marginDigits
	if findDigits < minFindDigits {
		return nil, nil
	}
	basis, berr := closedFormBasis(minWeight, maxWeight, prec)
	if berr != nil {
		return nil, berr
	}
	vec := []*big.Float{v}
	for _, b := range basis {
		vec = append(vec, b.value)
	}
	r, ferr := pslq.FindRelation(vec, findDigits, maxRelationCoeff)
	if ferr != nil || r == nil {
		return nil, nil // no verified relation: the number stands alone
	}
	a0 := r.Coeffs[0]
	if a0.Sign() == 0 {
		return nil, nil
	}
	var texts, texs []string
	for i, b := range basis {
		ai := r.Coeffs[i+1]
		if ai.Sign() == 0 {
			continue
		}
		// v = -sum a_i b_i / a_0
		q := new(big.Rat).SetFrac(new(big.Int).Neg(ai), a0)
		texts = append(texts, ratTimes(q, b.text, false))
		texs = append(texs, ratTimes(q, b.tex, true))
	}
	if len(texts) == 0 {
		return nil, nil
	}
	return &ClosedForm{Text: joinSigned(texts), TeX: joinSigned(texs),
		FoundDigits: findDigits, BeyondDigits: min(r.Digits, known) - findDigits}, nil
}

// ratTimes prints q*name, as text or LaTeX.
func ratTimes(q *big.Rat, name string, tex bool) string {
	num := q.Num().String()
	den := q.Denom().String()
	sign := ""
	if q.Sign() < 0 {
		sign = "-"
		num = strings.TrimPrefix(num, "-")
	}
	var coef string
	switch {
	case tex && den != "1":
		coef = fmt.Sprintf(`\frac{%s}{%s}`, num, den)
	case den != "1":
		coef = num + "/" + den
	default:
		coef = num
	}
	if name == "1" {
		return sign + coef
	}
	if coef == "1" {
		return sign + name
	}
	if tex {
		return sign + coef + " " + name
	}
	return sign + coef + "*" + name
}

func joinSigned(parts []string) string {
	s := parts[0]
	for _, p := range parts[1:] {
		if strings.HasPrefix(p, "-") {
			s += " - " + p[1:]
		} else {
			s += " + " + p
		}
	}
	return s
}
