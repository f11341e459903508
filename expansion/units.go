package expansion

import (
	"fmt"
	"math"
	"math/big"
	"strings"

	"qbridge/expansion/conformal"
	"qbridge/series"
	"qbridge/series/scalar"
)

// Units: the coupling J of the Hamiltonian has <J_{i1..iq}^2> =
// (q-1)! J^2/N^(q-1) (PHYSICS.md sec. 1; Maldacena-Stanford 2016,
// arXiv:1604.07818), and every computation here is in units of the
// rescaled coupling script-J, script-J^2 = q J^2/2^(q-1). With
//
//	r(q) = script-J/J = sqrt(q/2^(q-1))   (r(2) = 1, r(4) = sqrt(4/8)),
//
// a number printed in units J = 1 follows from the script-J = 1 number:
//
//   - E_0 (and E, -d log Z/d beta) is an energy: E_0/J = (E_0/script-J) r.
//   - alpha_S enters as alpha_S/script-J: log Z = -beta E_0 + S_0 +
//     2 pi^2 alpha_S/(beta script-J) + ... (PHYSICS.md sec. 3), i.e. the
//     Schwarzian action N alpha_S/script-J. Written as N alpha_S'/J,
//     alpha_S' = alpha_S J/script-J = alpha_S/r: an inverse energy times J.
//   - alpha_G enters as alpha_G/(script-J |tau|) in G/G_c - 1, so it
//     converts like alpha_S: alpha_G' = alpha_G/r.
//   - alpha_K enters as alpha_K |n|/(beta script-J) in the eigenvalue shift
//     k(2, n) - 1: alpha_K' = alpha_K/r, the same as alpha_G, consistent with
//     alpha_K = -q k_A'(2) alpha_G (k_A'(2) is a pure number) and with
//     alpha_S = alpha_K/(6 q^2 alpha_0).
//   - h_n, b, S_0 and log Z at a given physical temperature are pure
//     numbers, unchanged; but an inverse temperature given as beta J is
//     beta script-J = (beta J) r.
//
// r(q) is analytic at q = 2 in eps (q = 2/(1-eps)), so the eps series of
// E_0, alpha_S, alpha_G and alpha_K in J units are the script-J series
// times the series of r or 1/r (FactorSeries). Around q = infinity
// r = sqrt(q) 2^(-(q-1)/2) has an essential singularity at x = 1/q = 0
// (2^(-q/2) = exp(-(log 2)/(2x))): there is no series in 1/q in J units,
// and it is refused.

// Units selects the unit of energy in which values are printed.
type Units int

const (
	// UnitsScriptJ is script-J = 1, the default and the units of every
	// computation.
	UnitsScriptJ Units = iota
	// UnitsJ is J = 1, the coupling of the Hamiltonian.
	UnitsJ
)

// ParseUnits reads "script-J" or "J" (case of "script" ignored).
func ParseUnits(s string) (Units, error) {
	switch t := strings.TrimSpace(s); {
	case t == "J":
		return UnitsJ, nil
	case strings.EqualFold(t, "script-J"):
		return UnitsScriptJ, nil
	}
	return 0, fmt.Errorf("units must be script-J or J (got %q)", s)
}

// String is "script-J" or "J".
func (u Units) String() string {
	if u == UnitsJ {
		return "J"
	}
	return "script-J"
}

// Statement is the units as every output states them: "script-J = 1" or
// "J = 1".
func (u Units) Statement() string { return u.String() + " = 1" }

// Note says what the units mean and how the values were converted.
func (u Units) Note() string {
	if u == UnitsJ {
		return "units: J = 1, <J^2> = (q-1)! J^2/N^(q-1); computed with script-J = 1 (script-J^2 = q J^2/2^(q-1)) and converted with r = script-J/J = sqrt(q/2^(q-1)): E_0 times r; alpha_S, alpha_G, alpha_K divided by r; beta J = beta script-J / r; h_n, b, S_0, log Z unchanged"
	}
	return "units: script-J = 1"
}

// Scaling says how a quantity converts between script-J and J units.
type Scaling int

const (
	// ScaleNone marks a pure number (h_n, b, S_0, log Z): unchanged.
	ScaleNone Scaling = iota
	// ScaleEnergy marks an energy (E_0): multiplied by r = sqrt(q/2^(q-1)).
	ScaleEnergy
	// ScaleInverseEnergy marks a coefficient of 1/script-J (alpha_S,
	// alpha_G, alpha_K): divided by r.
	ScaleInverseEnergy
)

// JRatio returns r(q) = script-J/J = sqrt(q/2^(q-1)) for finite q >= 2
// (computed as exp of its logarithm, so that it underflows to 0 smoothly).
func JRatio(q float64) float64 {
	return math.Exp(0.5*math.Log(q) - 0.5*(q-1)*math.Ln2)
}

// Factor returns the number a value in script-J units is multiplied by to
// give it in units u at q (q = +Inf for q = infinity): 1 for script-J and
// pure numbers, r(q) for an energy, 1/r(q) for an inverse energy. At
// q = infinity an energy's factor is 0 and an inverse energy's does not
// exist (an error: alpha_S in J units grows like 2^(q/2)/q^(5/2)).
func (u Units) Factor(s Scaling, q float64) (float64, error) {
	if u == UnitsScriptJ || s == ScaleNone {
		return 1, nil
	}
	if math.IsNaN(q) || q < 2 {
		return 0, fmt.Errorf("%w: q must be a real number >= 2 (got %g)", ErrInput, q)
	}
	if math.IsInf(q, 1) {
		if s == ScaleEnergy {
			return 0, nil
		}
		return 0, fmt.Errorf("%w: in J units a coefficient of 1/J diverges at q = infinity (it is the script-J value times sqrt(2^(q-1)/q))", ErrInput)
	}
	r := JRatio(q)
	if s == ScaleEnergy {
		return r, nil
	}
	return 1 / r, nil
}

// FactorAt is Factor at a QPoint.
func (u Units) FactorAt(s Scaling, q conformal.QPoint) (float64, error) {
	if q.Inf {
		return u.Factor(s, math.Inf(1))
	}
	if q.Q == nil {
		return 0, fmt.Errorf("%w: no q", ErrInput)
	}
	f, _ := q.Q.Float64()
	return u.Factor(s, f)
}

// BetaScriptJ converts an inverse temperature given in units u (beta J for
// UnitsJ) into beta script-J = (beta J) r(q).
func (u Units) BetaScriptJ(beta, q float64) float64 {
	if u == UnitsJ {
		return beta * JRatio(q)
	}
	return beta
}

// FactorSeries returns the Taylor series in eps = 1 - 2/q around q = 2 of
// the factor of s in units u (r or 1/r; 1 for script-J or a pure number),
// n coefficients at prec bits, from
// log r = (1/2) log q - ((q-1)/2) log 2 with q = 2/(1-eps), q - 1 =
// (1+eps)/(1-eps): log r = -(1/2) log(1-eps) - (log 2/2)(2 eps/(1-eps)).
// Around q = infinity there is no such series (essential singularity at
// x = 0): an error wrapping ErrInput.
func (u Units) FactorSeries(s Scaling, end conformal.End, n int, prec uint) (*series.Series, error) {
	one := new(big.Float).SetPrec(prec).SetInt64(1)
	if u == UnitsScriptJ || s == ScaleNone {
		c := make([]*big.Float, n)
		for i := range c {
			c[i] = new(big.Float).SetPrec(prec)
		}
		c[0].Set(one)
		return series.FromBig(prec, c)
	}
	if end != conformal.AroundTwo {
		return nil, fmt.Errorf("%w: in J units a series in 1/q does not exist: script-J/J = sqrt(q/2^(q-1)) has an essential singularity at q = infinity (2^(-q/2) = exp(-log(2)/(2x))); use --units script-J for the series around inf, or --around 2", ErrInput)
	}
	e, err := series.Variable(n, prec, nil)
	if err != nil {
		return nil, err
	}
	oneMinus := series.AddConst(series.Neg(e), one)
	lg, err := series.Log(oneMinus)
	if err != nil {
		return nil, err
	}
	ratio, err := series.Div(series.Scale(e, new(big.Float).SetPrec(prec).SetInt64(2)), oneMinus)
	if err != nil {
		return nil, err
	}
	half := new(big.Float).SetPrec(prec).SetFloat64(0.5)
	halfLn2 := new(big.Float).SetPrec(prec).Mul(scalar.Ln2(prec), half)
	logR := series.Neg(series.Add(series.Scale(lg, half), series.Scale(ratio, halfLn2)))
	if s == ScaleInverseEnergy {
		logR = series.Neg(logR)
	}
	return series.Exp(logR)
}

// ScalingOf returns the scaling of the quantity named name (any name
// ParseName knows; ScaleNone for an unknown name).
func ScalingOf(name string) Scaling {
	if name == ThermoE {
		return ScaleEnergy
	}
	p, _, err := ParseName(name)
	if err != nil {
		return ScaleNone
	}
	return p.Quantity().Scaling
}

// UnitIn is the quantity's unit in units u.
func (q Quantity) UnitIn(u Units) string {
	if u == UnitsJ {
		return strings.ReplaceAll(q.Unit, "script-J", "J")
	}
	return q.Unit
}

// CheckSeries returns an error wrapping ErrInput when the series of q
// around end has no counterpart in units u: log Z (at fixed beta J,
// beta script-J varies with q) and, in J units, an energy or soft-mode
// coefficient around q = infinity (FactorSeries).
func (u Units) CheckSeries(q Quantity, end conformal.End) error {
	if u == UnitsScriptJ {
		return nil
	}
	if q.NeedsBeta {
		return fmt.Errorf("%w: the %s series is at fixed beta script-J; at fixed beta J, beta script-J = beta J sqrt(q/2^(q-1)) varies with q, so its series is not the script-J series converted: use --units script-J", ErrInput, q.Name)
	}
	if q.Scaling != ScaleNone && end != conformal.AroundTwo {
		_, err := u.FactorSeries(q.Scaling, end, 1, 64)
		return err
	}
	return nil
}

// ConvertSeries rewrites the series of r (the quantity named name, around
// end) from script-J units into units u: each coefficient list times the
// series of the factor (FactorSeries), errors propagated to first order
// (err_k = sum_j |f_j| err_{k-j}; the factor is exact to far below them).
// Pure numbers are left as they are. It fails for an energy or soft-mode
// coefficient around q = infinity in J units (no series exists) and for
// log Z, whose argument beta J would vary with q.
func ConvertSeries(r *SeriesResult, name string, end conformal.End, u Units) error {
	if u == UnitsScriptJ {
		return nil
	}
	p, _, err := ParseName(name)
	if err != nil {
		return err
	}
	q := p.Quantity()
	if err := u.CheckSeries(q, end); err != nil {
		return err
	}
	if q.Scaling == ScaleNone {
		r.Notes = append(r.Notes, fmt.Sprintf("%s is a pure number: the same in J and script-J units", q.Named(0)))
		return nil
	}
	for _, c := range r.Parts {
		n := len(c.Values)
		prec := max(c.Prec, 64) + 64
		f, err := u.FactorSeries(q.Scaling, end, n, prec)
		if err != nil {
			return err
		}
		fc := f.Coeffs()
		vals := make([]*big.Float, n)
		errs := make([]*big.Float, n)
		for k := 0; k < n; k++ {
			v := new(big.Float).SetPrec(prec)
			e := new(big.Float).SetPrec(prec)
			t := new(big.Float).SetPrec(prec)
			for j := 0; j <= k; j++ {
				v.Add(v, t.Mul(fc[j], c.Values[k-j]))
				if c.Errors[k-j] != nil {
					e.Add(e, t.Abs(t.Mul(fc[j], c.Errors[k-j])))
				}
			}
			vals[k], errs[k] = v.SetPrec(max(c.Prec, 53)), e.SetPrec(53)
		}
		c.Values, c.Errors = vals, errs
		c.Radius, c.RadiusErr, c.RadiusMethod = nil, nil, ""
		c.Method += "; converted to J = 1: times the eps series of " + map[Scaling]string{ScaleEnergy: "sqrt(q/2^(q-1))", ScaleInverseEnergy: "sqrt(2^(q-1)/q)"}[q.Scaling]
	}
	r.Notes = append(r.Notes, "J units: each coefficient list is the script-J series times the eps series of "+
		map[Scaling]string{ScaleEnergy: "r = sqrt(q/2^(q-1))", ScaleInverseEnergy: "1/r = sqrt(2^(q-1)/q)"}[q.Scaling]+
		" (analytic at q = 2, r(2) = 1), errors propagated coefficient-wise; the built-in S_0 check is a pure number and unchanged")
	return nil
}

// ConvertResummation rewrites r from script-J units into units u: the
// reference, every estimate and the published value times the factor at
// r.Q (Factor). Pure numbers are left as they are.
func ConvertResummation(r *Resummation, u Units) error {
	s := ScalingOf(r.Name)
	if u == UnitsScriptJ || s == ScaleNone {
		return nil
	}
	f, err := u.FactorAt(s, r.Q)
	if err != nil {
		return err
	}
	fb := big.NewFloat(f)
	mul := func(x *big.Float) *big.Float {
		if x == nil {
			return nil
		}
		return new(big.Float).SetPrec(max(x.Prec(), 53)).Mul(x, fb)
	}
	abs := func(x *big.Float) *big.Float {
		if x == nil {
			return nil
		}
		return new(big.Float).Abs(mul(x))
	}
	if ref := r.Reference; ref != nil {
		ref.Value, ref.Err = mul(ref.Value), abs(ref.Err)
	}
	for i := range r.Estimates {
		r.Estimates[i].Value, r.Estimates[i].Err = mul(r.Estimates[i].Value), abs(r.Estimates[i].Err)
	}
	if p := r.Published; p != nil {
		cp := *p
		cp.Value = mul(p.Value)
		r.Published = &cp
	}
	r.Notes = append(r.Notes, fmt.Sprintf("J units: %s values times %.15g (%s at q = %s)", r.Name, f,
		map[Scaling]string{ScaleEnergy: "r = sqrt(q/2^(q-1))", ScaleInverseEnergy: "1/r = sqrt(2^(q-1)/q)"}[s], r.Q))
	return nil
}

// ConvertTable rewrites the values of res from script-J units into units u:
// each cell of an energy or soft-mode column times the factor at its q. A
// coefficient of 1/J at q = infinity has no value in J units: its cell is
// marked missing (not failed).
func ConvertTable(res *TableResult, u Units) {
	if u == UnitsScriptJ {
		return
	}
	for ci := range res.Columns {
		s := ScalingOf(res.Columns[ci].Name)
		if s == ScaleNone {
			continue
		}
		res.Columns[ci].Unit = strings.ReplaceAll(res.Columns[ci].Unit, "script-J", "J")
		for ri := range res.Rows {
			f, err := u.FactorAt(s, res.Rows[ri].Q)
			for si := range res.Rows[ri].Cells[ci] {
				c := &res.Rows[ri].Cells[ci][si]
				if c.Value == nil {
					continue
				}
				if err != nil {
					*c = TableCell{Missing: strings.TrimPrefix(err.Error(), ErrInput.Error()+": ")}
					continue
				}
				fb := big.NewFloat(f)
				c.Value = new(big.Float).SetPrec(max(c.Value.Prec(), 53)).Mul(c.Value, fb)
				if c.Err != nil {
					c.Err = new(big.Float).Abs(new(big.Float).SetPrec(max(c.Err.Prec(), 53)).Mul(c.Err, fb))
				}
			}
		}
	}
	res.Notes = append(res.Notes, "J units: E_0 and E times r = sqrt(q/2^(q-1)), alpha_S, alpha_G and alpha_K divided by r, at each q (beta J given: beta script-J = r beta J)")
}

// MaxExactJQ is the largest integer q for which coefficients are converted
// to J units exactly: r^2 = q/2^(q-1) has a (q-1)-bit denominator, and the
// coefficient of (beta J)^p carries r^p, so at q = 4096 and p = 120 the
// denominators reach 2.5e5 bits.
const MaxExactJQ = 4096

// JRatioSquared returns r^2 = (script-J/J)^2 = q/2^(q-1) exactly for an
// integer q with 2 <= q <= MaxExactJQ; otherwise it returns an error that
// says why there is no rational value.
func JRatioSquared(q *big.Rat) (*big.Rat, error) {
	if q == nil || q.Cmp(big.NewRat(2, 1)) < 0 {
		return nil, fmt.Errorf("%w: q must be at least 2", ErrInput)
	}
	if !q.IsInt() {
		return nil, fmt.Errorf("%w: at q = %s the J-unit factor q/2^(q-1) is irrational (2 to a fractional power), so exact coefficients in J units exist only for integer q", ErrInput, q.RatString())
	}
	if q.Num().Cmp(big.NewInt(MaxExactJQ)) > 0 {
		return nil, fmt.Errorf("%w: at q = %s the J-unit factor q/2^(q-1) is rational but its powers have denominators of about (q-1) p/2 bits; exact J-unit coefficients are offered up to q = %d", ErrInput, q.RatString(), MaxExactJQ)
	}
	n := q.Num().Int64()
	return new(big.Rat).SetFrac(big.NewInt(n), new(big.Int).Lsh(big.NewInt(1), uint(n-1))), nil
}

// JRatioBig returns r(q) = script-J/J = sqrt(q/2^(q-1)) in prec bits for
// a rational q >= 2, as exp((1/2) log q - ((q-1)/2) log 2) at prec + 64
// bits: unlike JRatio it neither loses digits beyond float64 nor
// underflows (it stays in range up to q of about 3e9).
func JRatioBig(q *big.Rat, prec uint) (*big.Float, error) {
	if q == nil || q.Cmp(big.NewRat(2, 1)) < 0 {
		return nil, fmt.Errorf("%w: q must be at least 2", ErrInput)
	}
	// (q-1) log 2 needs as many more bits as q has before the point
	wp := prec + 64 + uint(q.Num().BitLen())
	qf := new(big.Float).SetPrec(wp).SetRat(q)
	lq, err := scalar.BigLog(qf, wp)
	if err != nil {
		return nil, err
	}
	x := new(big.Float).SetPrec(wp).Sub(qf, big.NewFloat(1))
	x.Mul(x, scalar.Ln2(wp))
	x.Sub(lq, x)
	x.Quo(x, big.NewFloat(2))
	r, err := scalar.CheckedExp(x, wp)
	if err != nil {
		return nil, fmt.Errorf("%w: r(q) = sqrt(q/2^(q-1)) at q = %s: %v", ErrInput, q.RatString(), err)
	}
	if r.Sign() == 0 {
		return nil, fmt.Errorf("%w: r(q) = sqrt(q/2^(q-1)) at q = %s is below big.Float's range", ErrInput, q.RatString())
	}
	return r.SetPrec(prec), nil
}
