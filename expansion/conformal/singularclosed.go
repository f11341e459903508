package conformal

import (
	"fmt"
	"math"
	"math/big"
	"sort"

	"qbridge/series/scalar"
)

// Singularities of b and S_0, read off their closed forms (MS 2016,
// arXiv:1604.07818; PHYSICS.md section 4). With x = 1/q:
//
//	b^q = (1/2 - x) tan(pi x) / pi,
//	S_0 = (1/2) log 2 - int_0^x pi (1/2 - t) tan(pi t) dt.
//
// tan(pi x) has simple zeros at x = k and simple poles at x = k + 1/2
// (residue -1/pi), k an integer; at x = 1/2 (q = 2) the factor 1/2 - x
// cancels the pole. Hence:
//
//   - b^q has simple poles at x = k + 1/2, k != 0 (q = 2/(2k + 1), eps = -2k),
//     residue k/pi^2 in x, and is analytic elsewhere;
//   - S_0 has logarithmic branch points there, S_0 = -k log(x - x*) + analytic;
//   - log(b)/x - log(x) = log(b^q/x) has logarithmic branch points at the
//     poles (coefficient -1) and at the zeros x = k != 0 (coefficient +1);
//   - b = (b^q)^x: at a zero x = k of b^q, b = (b^q)^k (1 + w log w + ...),
//     w = x - k, so b = analytic + (1/2 - k)^k w^(k+1) log w + ...; at a pole
//     x* = k + 1/2 of b^q, b ~ (k/pi^2)^(x*) w^(-x*), an algebraic branch point
//     of exponent -x* (w = x - x*).
//
// The variable of the end is eps = 1 - 2x (dx/deps = -1/2) or x itself.

// closedPoint is one singular point of a closed form, in x.
type closedPoint struct {
	x       *big.Rat // the point in x = 1/q
	kind    string
	form    string  // local form, in the expansion variable s
	coefX   float64 // coefficient of the singular term written in w = x - x*
	power   int     // the singular term is w^power (log w if logTerm), in x
	log     bool    // whether the singular term carries log w
	level   string  // what the closed form does there
	modOnly bool    // Coefficient is only known in modulus (branch-dependent phase)
}

// closedPoints lists the singular points in x of the function, for
// |k| <= kmax.
func closedPoints(fn string, kmax int) []closedPoint {
	var out []closedPoint
	pi2 := math.Pi * math.Pi
	for k := -kmax; k <= kmax; k++ {
		zero := big.NewRat(int64(k), 1)
		pole := big.NewRat(int64(2*k+1), 2)
		switch fn {
		case "b^q":
			if k != 0 {
				out = append(out, closedPoint{x: pole, kind: "simple pole", form: "b^q = R/(s - s*) + analytic",
					coefX: float64(k) / pi2, power: -1, level: fmt.Sprintf("pole of tan(pi/q) at 1/q = %s", pole.RatString())})
			}
		case "S_0":
			if k != 0 {
				out = append(out, closedPoint{x: pole, kind: "logarithmic branch point", form: "S_0 = C log(s - s*) + analytic",
					coefX: -float64(k), power: 0, log: true, level: fmt.Sprintf("the integrand pi (1/2 - x) tan(pi x) has a simple pole at x = %s", pole.RatString())})
			}
		case "log(b)/x - log(x)":
			if k != 0 {
				out = append(out, closedPoint{x: pole, kind: "logarithmic branch point", form: "f = C log(s - s*) + analytic",
					coefX: -1, power: 0, log: true, level: fmt.Sprintf("b^q has a simple pole at x = %s", pole.RatString())})
				out = append(out, closedPoint{x: zero, kind: "logarithmic branch point", form: "f = C log(s - s*) + analytic",
					coefX: 1, power: 0, log: true, level: fmt.Sprintf("b^q has a simple zero at x = %d", k)})
			}
		case "b":
			c := math.Pow(0.5-float64(k), float64(k))
			kind := fmt.Sprintf("branch point (s - s*)^%d log(s - s*)", k+1)
			switch {
			case k == -1:
				kind = "logarithmic branch point"
			case k < -1:
				kind = fmt.Sprintf("branch point (s - s*)^(%d) log(s - s*)", k+1)
			}
			out = append(out, closedPoint{x: zero, kind: kind, form: fmt.Sprintf("b = analytic + C (s - s*)^(%d) log(s - s*) + ...", k+1),
				coefX: c, power: k + 1, log: true, level: fmt.Sprintf("b^q = (1/2 - 1/q) tan(pi/q)/pi has a simple zero at x = %d", k)})
			if k != 0 {
				xs, _ := pole.Float64()
				out = append(out, closedPoint{x: pole, kind: fmt.Sprintf("algebraic branch point of exponent %s", new(big.Rat).Neg(pole).RatString()),
					form:  fmt.Sprintf("|b| ~ |C| |s - s*|^(%s) (the phase depends on the branch)", new(big.Rat).Neg(pole).RatString()),
					coefX: math.Pow(math.Abs(float64(k))/pi2, xs), modOnly: true,
					level: fmt.Sprintf("b^q has a simple pole at x = %s", pole.RatString())})
			}
		}
	}
	return out
}

// closedFunctions lists the analytic functions whose series the series
// and resum commands use for the quantity at the end: b itself around
// q = 2 and b^q (resummed); b^q and log(b)/x - log(x) around q = infinity;
// S_0 at both ends.
func closedFunctions(quantity string, end End) ([]string, error) {
	switch quantity {
	case QuantityB:
		if end == AroundTwo {
			return []string{"b", "b^q"}, nil
		}
		return []string{"b^q", "log(b)/x - log(x)"}, nil
	case QuantityS0:
		return []string{"S_0"}, nil
	}
	return nil, fmt.Errorf("expansion: no closed form for %q", quantity)
}

// ClosedFormSingularities returns the count singularities nearest to the
// end of the function fn ("b", "b^q", "S_0" or "log(b)/x - log(x)") from
// its closed form: exact positions (rationals in x, printed at digits), the
// type, and the coefficient of the singular term.
func ClosedFormSingularities(fn string, end End, count, digits int) (*SingularityMap, error) {
	if err := checkDigits(digits); err != nil {
		return nil, err
	}
	if count < 1 || count > MaxSingularities {
		return nil, fmt.Errorf("expansion: count must be between 1 and %d (got %d)", MaxSingularities, count)
	}
	if fn == "b" && end == AroundInf {
		return nil, fmt.Errorf("expansion: b is not analytic at q = infinity (b = x^x exp(x R(x))): use b^q or log(b)/x - log(x)")
	}
	if fn == "log(b)/x - log(x)" && end == AroundTwo {
		return nil, fmt.Errorf("expansion: log(b)/x - log(x) is the series of b around q = infinity only")
	}
	pts := closedPoints(fn, count+4)
	if pts == nil {
		return nil, fmt.Errorf("expansion: no closed form for %q", fn)
	}
	prec := bitsFor(digits, 0)
	sOf := func(x *big.Rat) *big.Rat {
		if end == AroundTwo {
			e := new(big.Rat).Mul(x, big.NewRat(-2, 1)) // eps = 1 - 2x
			return e.Add(e, big.NewRat(1, 1))
		}
		return new(big.Rat).Set(x)
	}
	sort.SliceStable(pts, func(a, b int) bool {
		sa, sb := new(big.Rat).Abs(sOf(pts[a].x)), new(big.Rat).Abs(sOf(pts[b].x))
		if c := sa.Cmp(sb); c != 0 {
			return c < 0
		}
		return sOf(pts[a].x).Cmp(sOf(pts[b].x)) > 0
	})
	m := &SingularityMap{Quantity: fn, End: end, N: -1,
		Method: "exact, from the closed form b^q pi = (1/2 - 1/q) tan(pi/q) (MS 2016) and the entropy integral: zeros of tan(pi x) at x = 1/q = k, poles at x = k + 1/2; positions are rationals, errors are rounding at the printed precision"}
	ulp := big.NewFloat(math.Ldexp(1, -int(prec)+2))
	for _, p := range pts[:min(count, len(pts))] {
		s := sOf(p.x)
		sf := new(big.Float).SetPrec(prec).SetRat(s)
		sg := Singularity{
			S:    scalar.NewComplex(sf, nil, prec),
			SErr: new(big.Float).Mul(ulp, new(big.Float).Add(new(big.Float).Abs(sf), big.NewFloat(1))),
			Kind: p.kind, Form: p.form, Levels: p.level,
		}
		sg.Modulus = new(big.Float).SetPrec(prec).Abs(sf)
		sg.ModulusErr = sg.SErr
		if p.x.Sign() == 0 {
			sg.QInf = true
		} else {
			q := new(big.Float).SetPrec(prec).SetRat(new(big.Rat).Inv(p.x))
			sg.Q = scalar.NewComplex(q, nil, prec)
			sg.QErr = new(big.Float).Mul(ulp, new(big.Float).Add(new(big.Float).Abs(q), big.NewFloat(1)))
		}
		// coefficient in s: w = x - x* = (s - s*) dx/ds
		coef := p.coefX
		if end == AroundTwo {
			switch {
			case p.modOnly:
				xs, _ := p.x.Float64()
				coef *= math.Pow(0.5, -xs) // |w|^(-x*) = (1/2)^(-x*) |s - s*|^(-x*)
			case p.power == -1 && !p.log:
				coef *= -2 // R_x/w = R_x/(-(s - s*)/2)
			default:
				coef *= math.Pow(-0.5, float64(p.power)) // w^p log w = (-1/2)^p (s - s*)^p (log(s - s*) + const)
			}
		}
		sg.Coefficient = scalar.ComplexFloat64(coef, 0, prec)
		sg.CoefficientErr = big.NewFloat(math.Abs(coef)*1e-15 + 1e-300)
		sg.Check = "closed form; the coefficient is evaluated in float64 (relative error about 1e-15)"
		if p.modOnly {
			sg.Check = "closed form; only the modulus |C| is given (float64), its phase depends on the branch of b = (b^q)^(1/q)"
		}
		m.Singularities = append(m.Singularities, sg)
	}
	return m, nil
}

// Singularities returns the singularity maps of a quantity at an end: for
// the dimensions (QuantityDims, index n) the collisions of levels of
// DimensionSingularities; for b and S_0 (QuantityB, QuantityS0) the exact
// singular points of their closed forms, one map per analytic function the
// series use (b and b^q around q = 2; b^q and log(b)/x - log(x) around
// q = infinity; S_0).
func Singularities(quantity string, end End, n, count, digits int) ([]*SingularityMap, error) {
	if quantity == QuantityDims {
		m, err := DimensionSingularities(end, n, count, digits)
		if err != nil {
			return nil, err
		}
		return []*SingularityMap{m}, nil
	}
	fns, err := closedFunctions(quantity, end)
	if err != nil {
		return nil, err
	}
	var out []*SingularityMap
	for _, fn := range fns {
		m, err := ClosedFormSingularities(fn, end, count, digits)
		if err != nil {
			return nil, err
		}
		out = append(out, m)
	}
	return out, nil
}
