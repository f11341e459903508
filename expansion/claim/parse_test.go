package claim

import (
	"errors"
	"strings"
	"testing"
)

// Valid claims and their fully parenthesised sides: precedence (^ over
// unary minus over * and / over + and -), right-associative powers, exact
// rationals, aliases of the quantity names, and the O() terms taken out of
// the sums.
func TestParseValid(t *testing.T) {
	cases := []struct {
		claim, lhs, rhs string
		order           int // Power of the O() term; 0 with none
		end             string
	}{
		{"h_1 = 4 - (5/6)*eps^2 + O(eps^4)", "h_1", "(4 - ((5 / 6) * (eps ^ 2)))", 4, "2"},
		{"alpha_S = 1/(4*q^2) + O(1/q^3)", "alpha_S", "(1 / (4 * (q ^ 2)))", 3, "inf"},
		{"q^2*E_0 = -1 + O(1/q)", "((q ^ 2) * E_0)", "(-1)", 1, "inf"},
		{"e0 = alpha + s0 + O(x^2)", "E_0", "(alpha_S + S_0)", 2, "inf"},
		{"H_3 = 7 + O(q^-1)", "h_3", "7", 1, "inf"},
		{"-x^2 = -(x^2)", "(-(x ^ 2))", "(-(x ^ 2))", 0, ""},
		{"2^3^2 = 512", "(2 ^ (3 ^ 2))", "512", 0, ""},
		{"1 - 2 - 3 = 1/2/3", "((1 - 2) - 3)", "((1 / 2) / 3)", 0, ""},
		{"0.25 = 1e-3 + .5", "1/4", "(1/1000 + 1/2)", 0, ""},
		{"S_0 = O(1/q^0) + log(2)/2", "S_0", "(log(2) / 2)", 0, "inf"},
		{"h_1 - O(eps^3) = 4", "h_1", "4", 3, "2"},
		{"b^q*pi = (1/2 - 1/q)*tan(pi/q)", "((b ^ q) * pi)", "(((1 / 2) - (1 / q)) * tan((pi / q)))", 0, ""},
		{"psi(1) + Gamma(1/2)^2 = zeta(3) * sqrt(exp(sin(cos(x))))", "(psi(1) + (Gamma((1 / 2)) ^ 2))", "(zeta(3) * sqrt(exp(sin(cos(x)))))", 0, ""},
		{"h_1 = 4 + O(eps^4) + O(eps^2)", "h_1", "4", 2, "2"},
		{"S_0 = O(1)", "S_0", "0", 0, ""},
		{"h_1 = 3 + O(2/q)", "h_1", "3", 1, "inf"},
	}
	for _, c := range cases {
		cl, err := Parse(c.claim)
		if err != nil {
			t.Errorf("%q: %v", c.claim, err)
			continue
		}
		if got := cl.LHS.String(); got != c.lhs {
			t.Errorf("%q: LHS %s, want %s", c.claim, got, c.lhs)
		}
		if got := cl.RHS.String(); got != c.rhs {
			t.Errorf("%q: RHS %s, want %s", c.claim, got, c.rhs)
		}
		switch {
		case c.order == 0 && c.end == "" && cl.Order != nil && cl.Order.Power != 0:
			t.Errorf("%q: order term %+v, want none", c.claim, cl.Order)
		case c.end != "":
			if cl.Order == nil || cl.Order.Power != c.order || !cl.Order.HasEnd || cl.Order.End.String() != c.end {
				t.Errorf("%q: order term %+v, want O(t^%d) around %s", c.claim, cl.Order, c.order, c.end)
			}
		}
	}
}

// Invalid claims: each message names the column of the fault and what is
// wrong.
func TestParseInvalid(t *testing.T) {
	cases := []struct {
		claim string
		col   int
		want  string
	}{
		{"", 1, "empty claim"},
		{"h_1", 4, "no = found"},
		{"h_1 = ", 7, "nothing right of the ="},
		{"h_1 = 4 = 4", 9, "one ="},
		{"h_1 == 4", 5, "not =="},
		{"h_1 = 2eps", 8, "missing operator before name \"eps\""},
		{"h_1 = 2 eps", 9, "multiplication is written with *"},
		{"h_1 = (1+eps)(1-eps)", 14, "missing operator"},
		{"h_1 = 4 - (5/6*eps^2", 21, "missing ) to close the ( at column 11"},
		{"h_1 = 4)", 8, "unmatched )"},
		{"h_1 = 4 + * eps", 11, "expected a number, a name or ("},
		{"h_1 = 4 - (5/6)*eps^2 + alpha_s2", 25, `unknown name "alpha_s2"; known quantities:`},
		{"h_1 = foo(eps)", 7, `unknown function "foo"`},
		{"h_1 = eps(2)", 7, "eps is not a function"},
		{"h_1 = sqrt", 7, "needs its argument in parentheses"},
		{"h_1 = sqrt()", 12, "needs an argument"},
		{"h_1 = log(2, 3)", 12, "takes one argument"},
		{"h_1 = zeta(1)", 12, "zeta takes an integer n"},
		{"h_1 = zeta(2.5)", 12, "zeta takes an integer n"},
		{"h_1 = zeta(q)", 12, "zeta takes an integer n"},
		{"h_n = 3", 1, "names the family"},
		{"dims = 3", 1, "names the family"},
		{"h_999 = 3", 1, "above the supported"},
		{"logZ = 3", 1, "depends on the temperature"},
		{"h_1 = 4 * O(eps^2)", 11, "must be a term of the sum"},
		{"h_1 = exp(O(eps))", 11, "must be a term of the sum"},
		{"h_1 = 4 + O(eps*x)", 11, "O() takes a power"},
		{"h_1 = 4 + O(h_1)", 11, "O() takes a power"},
		{"h_1 = 4 + O(eps^q)", 11, "O() takes a power"},
		{"h_1 = 4 + O(0)", 11, "O() takes a power"},
		{"h_1 = 4 + O(eps^2) + O(x^3)", 22, "is an order around q = inf, but O(eps^2) at column 11 is around q = 2"},
		{"h_1 = 4 ε", 9, "write eps"},
		{"h_1 = 4 ** 2", 9, "not **"},
		{"h_1 = 1e999", 7, "exponent"},
		{"h_1 = 1.2.3", 10, "one decimal point"},
		{"h_1 = 4 +", 10, "the claim ends where"},
		{"h_1 = x^", 9, "missing exponent"},
		{"h_1(q) = 4", 1, "is a quantity, not a function"},
		{"h_1 = 4 # note", 9, "unexpected character"},
		{strings.Repeat("(", 300) + "1" + strings.Repeat(")", 300) + " = 1", 101, "nested more than"},
	}
	for _, c := range cases {
		_, err := Parse(c.claim)
		var ce *Error
		if !errors.As(err, &ce) {
			t.Errorf("%q: got %v, want a claim error", c.claim, err)
			continue
		}
		if ce.Col != c.col || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%q: got %q (column %d), want column %d and %q", c.claim, err, ce.Col, c.col, c.want)
		}
		if !strings.HasPrefix(err.Error(), "at column ") {
			t.Errorf("%q: message %q does not start with the column", c.claim, err)
		}
	}
}

// FuzzParse: the parser returns a claim or an error, never panics, and the
// columns of its errors lie within the text (or one past its end).
func FuzzParse(f *testing.F) {
	for _, s := range []string{
		"h_1 = 4 - (5/6)*eps^2 + O(eps^4)", "alpha_S = 1/(4*q^2) + O(1/q^3)", "q^2*E_0 = -1 + O(1/q)",
		"b^q*pi = (1/2 - 1/q)*tan(pi/q)", "psi(1) = -Gamma(1)*zeta(3)^-2", "((((", "= = =", "1e400 = .5e-400",
		"O(O(eps)) = O(1)", "h_ = h__1", "x^-(-2)^3 = 2^64^64",
	} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		c, err := Parse(s)
		if err != nil {
			var ce *Error
			if errors.As(err, &ce) && (ce.Col < 0 || ce.Col > len([]rune(s))+1) {
				t.Errorf("%q: column %d outside the text", s, ce.Col)
			}
			return
		}
		if c.LHS == nil || c.RHS == nil {
			t.Errorf("%q: parsed without two sides", s)
		}
		_ = c.LHS.String() + c.RHS.String()
	})
}
