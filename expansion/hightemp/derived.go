package hightemp

import (
	"fmt"
	"math/big"
	"strings"

	"qbridge/series/scalar"
)

// Kind is a quantity that follows from the coefficients of log Z.
type Kind int

// The quantities of the high-temperature series; see Kinds for the names.
const (
	LogZ      Kind = iota // log Z/N = sum a_k beta^(2k)
	Energy                // E/N = -d(log Z/N)/d beta
	Entropy               // S/N = log Z/N + beta E/N
	Heat                  // C/N = beta^2 d^2(log Z/N)/d beta^2
	Cumulants             // kappa_2k/N = (2k)! a_k
	Moments               // formal moments that go with the cumulants kappa_2k/N
)

// Kinds lists the quantities in their one order, with their names.
var Kinds = []struct {
	Kind Kind
	Name string
	// Power names the expansion variable of the terms.
	Power string
	// Doc says what the terms are, in one line.
	Doc string
}{
	{LogZ, "logz", "beta", "log Z/N = (1/2) log 2 + sum_k a_k beta^(2k)"},
	{Energy, "energy", "beta", "E/N = -d(log Z/N)/d beta = -sum_k 2k a_k beta^(2k-1)"},
	{Entropy, "entropy", "beta", "S/N = log Z/N + beta E/N = (1/2) log 2 + sum_k (1-2k) a_k beta^(2k)"},
	{Heat, "heat", "beta", "C/N = beta^2 d^2(log Z/N)/d beta^2 = sum_k 2k(2k-1) a_k beta^(2k)"},
	{Cumulants, "cumulants", "index", "kappa_2k/N = (2k)! a_k: cumulants of the many-body spectral density per fermion"},
	{Moments, "moments", "index", "mu_2k = (2k)! [beta^(2k)] exp(sum_k a_k beta^(2k)) = (2k)! [beta^(2k)] (Z/2^(N/2))^(1/N): the formal moments that go with the cumulants kappa_2k/N (not those of a positive density: mu_4 < mu_2^2 for q > 2)"},
}

// ParseKind resolves a quantity name (case-insensitive).
func ParseKind(name string) (Kind, error) {
	n := strings.ToLower(strings.TrimSpace(name))
	var names []string
	for _, k := range Kinds {
		if k.Name == n {
			return k.Kind, nil
		}
		names = append(names, k.Name)
	}
	return 0, fmt.Errorf("%w: unknown high-temperature quantity %q (known: %s)", ErrInput, name, strings.Join(names, ", "))
}

// String is the quantity's name.
func (k Kind) String() string {
	for _, e := range Kinds {
		if e.Kind == k {
			return e.Name
		}
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}

// Term is one coefficient of a derived quantity at one q.
type Term struct {
	// Power is the power of beta script-J (LogZ, Energy, Entropy, Heat) or
	// the index 2k of kappa_2k or mu_2k (Cumulants, Moments).
	Power int
	// Value is the exact coefficient; nil when it is HalfLog2.
	Value *big.Rat
	// HalfLog2 marks the constant (1/2) log 2 of log Z and S.
	HalfLog2 bool
}

// SymTerm is one coefficient of a derived quantity as a polynomial in 1/q.
type SymTerm struct {
	// Power is as in Term.
	Power int
	// Value is the coefficient; empty when HalfLog2.
	Value InvQPoly
	// HalfLog2 marks the constant (1/2) log 2.
	HalfLog2 bool
}

// HalfLog2 is (1/2) log 2, the constant term of log Z/N and S/N, in prec bits.
func HalfLog2(prec uint) *big.Float {
	return new(big.Float).SetPrec(prec).Quo(scalar.Ln2(prec), big.NewFloat(2))
}

// linearFactor is the factor that maps a_k to the coefficient of a linear
// quantity, and the power that coefficient multiplies.
// ok is false for Moments, which are not linear in the a_k.
func linearFactor(kind Kind, k int) (f *big.Rat, power int, ok bool) {
	kk := int64(k)
	switch kind {
	case LogZ:
		return big.NewRat(1, 1), 2 * k, true
	case Energy:
		return big.NewRat(-2*kk, 1), 2*k - 1, true
	case Entropy:
		return big.NewRat(1-2*kk, 1), 2 * k, true
	case Heat:
		return big.NewRat(2*kk*(2*kk-1), 1), 2 * k, true
	case Cumulants:
		return new(big.Rat).SetInt(factorial(2 * k)), 2 * k, true
	}
	return nil, 0, false
}

func factorial(n int) *big.Int { return new(big.Int).MulRange(1, int64(n)) }

// Derive returns the terms of kind at one q, from the coefficients c.
func Derive(kind Kind, c *Coefficients) []Term {
	var out []Term
	if kind == LogZ || kind == Entropy {
		out = append(out, Term{Power: 0, HalfLog2: true})
	}
	if kind == Moments {
		m := momentsOf(len(c.A)-1, func(k int) InvQPoly { return constPoly(c.A[k]) })
		for i, p := range m {
			out = append(out, Term{Power: 2 * i, Value: p.Coeff(0)})
		}
		return out
	}
	for k := 1; k < len(c.A); k++ {
		f, p, ok := linearFactor(kind, k)
		if !ok {
			break
		}
		out = append(out, Term{Power: p, Value: new(big.Rat).Mul(f, c.A[k])})
	}
	return out
}

// DeriveSymbolic returns the terms of kind as polynomials in 1/q.
func DeriveSymbolic(kind Kind, s *Symbolic) []SymTerm {
	var out []SymTerm
	if kind == LogZ || kind == Entropy {
		out = append(out, SymTerm{Power: 0, HalfLog2: true})
	}
	if kind == Moments {
		for i, p := range momentsOf(len(s.A)-1, func(k int) InvQPoly { return s.A[k] }) {
			out = append(out, SymTerm{Power: 2 * i, Value: p})
		}
		return out
	}
	for k := 1; k < len(s.A); k++ {
		f, p, ok := linearFactor(kind, k)
		if !ok {
			break
		}
		out = append(out, SymTerm{Power: p, Value: s.A[k].Scale(f)})
	}
	return out
}

// momentsOf returns mu_0 .. mu_2K: (2k)! times the coefficients of
// exp(sum_k a_k x^k), by the recurrence m e_m = sum_j j a_j e_(m-j) for
// the exponential of a series without constant term.
func momentsOf(order int, a func(k int) InvQPoly) []InvQPoly {
	e := make([]InvQPoly, order+1)
	e[0] = constPoly(big.NewRat(1, 1))
	for m := 1; m <= order; m++ {
		acc := constPoly(new(big.Rat))
		for j := 1; j <= m; j++ {
			acc = acc.Add(a(j).Mul(e[m-j]).Scale(big.NewRat(int64(j), 1)))
		}
		e[m] = acc.Scale(big.NewRat(1, int64(m)))
	}
	out := make([]InvQPoly, order+1)
	for m := range e {
		out[m] = e[m].Scale(new(big.Rat).SetInt(factorial(2 * m)))
	}
	return out
}
