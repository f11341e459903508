package conformal

import (
	"fmt"
	"math/big"
	"strings"

	"qbridge/series/pslq"
	"qbridge/series/scalar"
)

// ClosedFormBasisDoc describes the basis that IdentifyCoefficients tries.
const ClosedFormBasisDoc = "each coefficient is matched by PSLQ against rational multiples of the products " +
	"pi^(2a) zeta(3)^b zeta(5)^c (log 2)^d: first those of one weight w = 2a+3b+5c+d at a time (w = 0..8), " +
	"then all of weight <= 4 together (at most 12 basis elements, integer coefficients up to 10^12); " +
	"a form is kept only if it holds to 10 digits beyond the digits PSLQ used"

// ClosedForm is an identified exact form of a number.
type ClosedForm struct {
	// Text is the form as plain text, e.g. "-1/6*pi^2 + 2*log(2)".
	Text string
	// TeX is the same form as LaTeX, e.g. "-\frac{1}{6}\pi^{2} + 2\log 2".
	TeX string
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

// maxBasis caps the PSLQ vector length (value plus basis).
const maxBasis = 12

// IdentifyCoefficients runs PSLQ on each coefficient against the basis of
// ClosedFormBasisDoc. An entry is nil where no form was found and verified.
// The coefficients must carry enough digits (their error estimate decides):
// PSLQ uses all but 10 of them and the relation must hold on the rest.
func IdentifyCoefficients(c *Coefficients) ([]*ClosedForm, error) {
	out := make([]*ClosedForm, len(c.Values))
	for k, v := range c.Values {
		var f *ClosedForm
		var err error
		for w := 0; w <= 8 && f == nil && err == nil; w++ {
			f, err = identify(v, c.Errors[k], w, w, c.Prec)
		}
		if f == nil && err == nil {
			f, err = identify(v, c.Errors[k], 0, 4, c.Prec)
		}
		if err != nil {
			return nil, err
		}
		out[k] = f
	}
	return out, nil
}

// identify tries to write v (known to within err) as a rational combination
// of the basis up to the given weight.
func identify(v, err *big.Float, minWeight, maxWeight int, prec uint) (*ClosedForm, error) {
	if new(big.Float).Abs(v).Cmp(err) <= 0 {
		return &ClosedForm{Text: "0", TeX: "0"}, nil
	}
	// digits known: -log10(err/|v|)
	rel := new(big.Float).Quo(err, new(big.Float).Abs(v))
	e := rel.MantExp(nil)
	known := int(float64(-e) * 0.30103)
	findDigits := known - 12
	if findDigits < 15 {
		return nil, nil
	}
	basis, berr := closedFormBasis(minWeight, maxWeight, prec)
	if berr != nil {
		return nil, berr
	}
	if len(basis)+1 > maxBasis {
		basis = basis[:maxBasis-1]
	}
	vec := []*big.Float{v}
	for _, b := range basis {
		vec = append(vec, b.value)
	}
	r, ferr := pslq.FindRelation(vec, findDigits, 1_000_000_000_000)
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
	return &ClosedForm{Text: joinSigned(texts), TeX: joinSigned(texs)}, nil
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
