package expansion

import (
	"fmt"
	"math/big"
	"strings"
	"sync"

	"qbridge/expansion/hightemp"
)

// HalfLog2 is (1/2) log 2, the constant term of log Z/N and S/N, in prec bits.
func HalfLog2(prec uint) *big.Float {
	return hightemp.HalfLog2(prec)
}

// HighTempRequest asks for the exact high-temperature series of one
// quantity (hightemp.Kinds: logz, energy, entropy, heat, cumulants,
// moments).
type HighTempRequest struct {
	// Kind is the quantity's name.
	Kind string
	// Order is the highest power of t = (beta script-J)^2, 1..hightemp.MaxOrder.
	Order int
	// Qs are the interaction orders (exact rationals >= 2); none asks for
	// the coefficients as polynomials in 1/q.
	Qs []*big.Rat
	// Beta, when not nil, sums the series at this inverse temperature (in
	// the request's units: beta J for UnitsJ); it needs Qs.
	Beta *big.Float
	// Units of energy. UnitsJ turns the coefficient of (beta script-J)^p into
	// that of (beta J)^p, a factor r^p with r^2 = q/2^(q-1) (r^(p+1) for the
	// energy, which is itself an energy; r^(2k) for kappa_2k and mu_2k).
	// The powers are even, so the factor is rational for integer q (up to
	// MaxExactJQ); other q are refused in J units.
	Units Units
	// Prec is the working precision in bits of the sums and the radius.
	Prec uint
	// Progress, when not nil, receives the fraction done and a status.
	Progress func(frac float64, detail string)
}

// HighTempAtQ is the series at one q.
type HighTempAtQ struct {
	// Q is the interaction order.
	Q *big.Rat
	// Terms are the exact coefficients, in the request's units.
	Terms []hightemp.Term
	// Radius is the nearest singularity of log Z in t = (beta script-J)^2.
	Radius hightemp.RadiusEstimate
	// BetaMax and BetaMaxErr are the radius as a largest beta, in the
	// request's units (beta J for UnitsJ); nil where the radius is not
	// estimated.
	BetaMax, BetaMaxErr *big.Float
	// Sum is the quantity summed at the requested beta (nil without one).
	Sum *hightemp.Summed
}

// HighTempResult is what a HighTempRequest returns.
type HighTempResult struct {
	// Kind is the quantity; Doc says what its terms are.
	Kind hightemp.Kind
	Doc  string
	// Symbolic holds the coefficients as polynomials in 1/q (no Qs given).
	Symbolic []hightemp.SymTerm
	// AtQ holds one entry per requested q.
	AtQ []HighTempAtQ
	// Method says how the coefficients were obtained.
	Method string
}

var highTempMemo struct {
	sync.Mutex
	sym *hightemp.Symbolic
}

// SymbolicHighTemp returns the coefficients of log Z/N as polynomials in
// 1/q to t^order, computed once per process for the highest order asked
// (lower orders are truncations of it).
func SymbolicHighTemp(order int, progress func(done, total int)) (*hightemp.Symbolic, error) {
	highTempMemo.Lock()
	defer highTempMemo.Unlock()
	if s := highTempMemo.sym; s != nil && s.Order() >= order {
		return &hightemp.Symbolic{A: s.A[:order+1], Nodes: s.Nodes}, nil
	}
	s, err := hightemp.SymbolicLogZ(order, progress)
	if err != nil {
		return nil, inputErr(err)
	}
	highTempMemo.sym = s
	return s, nil
}

// HighTemp computes the exact high-temperature series a request asks for.
func HighTemp(r HighTempRequest) (*HighTempResult, error) {
	kind, err := hightemp.ParseKind(r.Kind)
	if err != nil {
		return nil, fmt.Errorf("%w: %v", ErrInput, err)
	}
	if r.Order < 1 || r.Order > hightemp.MaxOrder {
		return nil, fmt.Errorf("%w: the order must be between 1 and %d (got %d)", ErrInput, hightemp.MaxOrder, r.Order)
	}
	if r.Prec == 0 {
		r.Prec = 256
	}
	out := &HighTempResult{Kind: kind}
	for _, k := range hightemp.Kinds {
		if k.Kind == kind {
			out.Doc = k.Doc
		}
	}
	report := func(frac float64, d string) {
		if r.Progress != nil {
			r.Progress(frac, d)
		}
	}
	if len(r.Qs) == 0 {
		if r.Beta != nil {
			return nil, fmt.Errorf("%w: a sum at beta needs values of q", ErrInput)
		}
		if r.Units == UnitsJ {
			return nil, fmt.Errorf("%w: in J units the coefficients carry (q/2^(q-1))^k, not a rational function of q: ask at given integer q, or in script-J units", ErrInput)
		}
		s, err := SymbolicHighTemp(r.Order, func(done, total int) {
			report(float64(done)/float64(total), fmt.Sprintf("exact solve %d of %d", done, total))
		})
		if err != nil {
			return nil, err
		}
		out.Symbolic = hightemp.DeriveSymbolic(kind, s)
		out.Method = fmt.Sprintf("exact rational solution of the Schwinger-Dyson equations in powers of (beta script-J)^2 at q = %s, interpolated in 1/q (the coefficient of t^k through k solves) and confirmed at %d further q",
			nodeList(s.Nodes[:r.Order]), len(s.Nodes)-r.Order)
		return out, nil
	}
	if r.Beta != nil && !hightemp.Summable(kind) {
		return nil, fmt.Errorf("%w: sums at beta exist for logz, energy, entropy and heat; %s is a set of numbers", ErrInput, kind)
	}
	for i, q := range r.Qs {
		report(float64(i)/float64(len(r.Qs)), "q = "+q.RatString())
		c, err := hightemp.Solve(q, r.Order)
		if err != nil {
			return nil, inputErr(err)
		}
		at := HighTempAtQ{Q: q, Terms: hightemp.Derive(kind, c), Radius: hightemp.Radius(c.A, r.Prec)}
		at.BetaMax, at.BetaMaxErr = at.Radius.Beta, at.Radius.BetaErr
		// rj = script-J/J, by which beta script-J = beta J rj
		var rj *big.Float
		if r.Units == UnitsJ {
			if err := termsToJ(kind, q, at.Terms); err != nil {
				return nil, err
			}
			if rj, err = JRatioBig(q, r.Prec); err != nil {
				return nil, err
			}
			if at.BetaMax != nil {
				at.BetaMax = new(big.Float).SetPrec(r.Prec).Quo(at.BetaMax, rj)
				at.BetaMaxErr = new(big.Float).SetPrec(r.Prec).Quo(at.BetaMaxErr, rj)
			}
		}
		if r.Beta != nil {
			b := new(big.Float).SetPrec(r.Prec).Set(r.Beta)
			if rj != nil {
				b.Mul(b, rj)
			}
			s, err := hightemp.Evaluate(kind, c, b, r.Prec)
			if err != nil {
				return nil, inputErr(err)
			}
			if rj != nil && kind == hightemp.Energy {
				// E/J = (E/script-J) rj; the relative error of rj is 2^-prec
				for _, sum := range []*hightemp.Sum{&s.Partial, &s.Pade} {
					if sum.Value == nil {
						continue
					}
					sum.Value.Mul(sum.Value, rj)
					if sum.Err != nil {
						sum.Err.Mul(sum.Err, rj)
						ulp := new(big.Float).SetMantExp(new(big.Float).Abs(sum.Value), -int(r.Prec)+4)
						sum.Err.Add(sum.Err, ulp)
					}
				}
			}
			at.Sum = s
		}
		out.AtQ = append(out.AtQ, at)
	}
	report(1, "")
	out.Method = "exact rational solution of the Schwinger-Dyson equations in powers of (beta script-J)^2 at each q (monomial products, Euler-basis convolutions)"
	return out, nil
}

// termsToJ turns coefficients of (beta script-J)^p (or kappa_p in units
// script-J^p) into units J: times r^p, r^2 = q/2^(q-1), and r^(p+1) for
// the energy (E/J = (E/script-J) r). Every such power is even.
func termsToJ(kind hightemp.Kind, q *big.Rat, terms []hightemp.Term) error {
	r2, err := JRatioSquared(q)
	if err != nil {
		return err
	}
	for i := range terms {
		if terms[i].HalfLog2 || terms[i].Power == 0 {
			continue
		}
		n := terms[i].Power / 2
		if kind == hightemp.Energy {
			n = (terms[i].Power + 1) / 2
		}
		f := big.NewRat(1, 1)
		for range n {
			f.Mul(f, r2)
		}
		terms[i].Value = new(big.Rat).Mul(terms[i].Value, f)
	}
	return nil
}

func nodeList(qs []*big.Rat) string {
	if len(qs) <= 6 {
		s := make([]string, len(qs))
		for i, q := range qs {
			s[i] = q.RatString()
		}
		return strings.Join(s, ", ")
	}
	return fmt.Sprintf("%s, %s, ..., %s", qs[0].RatString(), qs[1].RatString(), qs[len(qs)-1].RatString())
}
