package claim

import (
	"fmt"
	"math/big"
	"strconv"
	"strings"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

// Claim is a parsed statement LHS = RHS.
type Claim struct {
	// Text is the claim as written.
	Text string
	// LHS and RHS are the two sides without their order terms (a side that
	// was only an order term is the number 0).
	LHS, RHS Node
	// Order is what the O() terms say; nil when the claim has none.
	Order *OrderTerm
	// Variables lists which of q, eps and x the claim uses.
	Variables map[string]bool
	// Quantities lists the quantities in the order they appear.
	Quantities []*Quantity
}

// maxDepth bounds the nesting of the parser's recursion.
const maxDepth = 200

// maxExponentDigits bounds the decimal exponent of a number literal
// (1e400 is allowed, 1e40000 is not).
const maxExponent = 400

// functions of one argument, in the order help texts list them.
var functions = []string{"sqrt", "exp", "log", "sin", "cos", "tan", "Gamma", "psi"}

// variables of the claim language.
var variables = []string{"q", "eps", "x"}

// vocabulary is the list of names for unknown-name messages.
func vocabulary() string {
	return "known quantities: " + expansion.KnownNames() + "; " + highTempNames +
		"; variables: q, eps, x; constant: pi; functions: " + strings.Join(functions, ", ") + ", zeta(n), O(...)"
}

type parser struct {
	text  []rune
	toks  []token
	i     int
	depth int
	quant []*Quantity
	vars  map[string]bool
}

// Parse reads a claim "LHS = RHS". Faults are returned as *Error with the
// column they are at.
func Parse(text string) (*Claim, error) {
	toks, err := lex(text)
	if err != nil {
		return nil, err
	}
	p := &parser{text: []rune(text), toks: toks, vars: map[string]bool{}}
	if p.peek().kind == tEOF {
		return nil, errAt(1, "empty claim: write LHS = RHS, e.g. h_1 = 4 - (5/6)*eps^2 + O(eps^4)")
	}
	lhs, err := p.sum()
	if err != nil {
		return nil, err
	}
	if t := p.peek(); t.kind != tEquals {
		if t.kind == tEOF {
			return nil, errAt(t.col, "a claim has the form LHS = RHS: no = found")
		}
		return nil, p.unexpected(t, "an operator or =")
	}
	eq := p.next()
	if p.peek().kind == tEOF {
		return nil, errAt(p.peek().col, "nothing right of the = at column %d", eq.col)
	}
	rhs, err := p.sum()
	if err != nil {
		return nil, err
	}
	if t := p.peek(); t.kind != tEOF {
		if t.kind == tEquals {
			return nil, errAt(t.col, "a claim has one =; found a second one")
		}
		return nil, p.unexpected(t, "an operator or the end of the claim")
	}
	c := &Claim{Text: text, Variables: p.vars, Quantities: p.quant}
	var terms []*BigO
	if c.LHS, err = stripSide(lhs, 1, &terms); err != nil {
		return nil, err
	}
	if c.RHS, err = stripSide(rhs, eq.col+1, &terms); err != nil {
		return nil, err
	}
	if c.Order, err = orderOf(terms, p.text); err != nil {
		return nil, err
	}
	return c, nil
}

func (p *parser) peek() token { return p.toks[p.i] }

func (p *parser) next() token {
	t := p.toks[p.i]
	if t.kind != tEOF {
		p.i++
	}
	return t
}

// unexpected reports token t where something else was wanted.
func (p *parser) unexpected(t token, want string) error {
	switch t.kind {
	case tNum, tName, tLParen:
		return errAt(t.col, "missing operator before %s (multiplication is written with *)", t.describe())
	case tRParen:
		return errAt(t.col, "unmatched )")
	case tComma:
		return errAt(t.col, "unexpected , (every function takes one argument)")
	}
	return errAt(t.col, "expected %s, found %s", want, t.describe())
}

func (p *parser) enter(col int) error {
	p.depth++
	if p.depth > maxDepth {
		return errAt(col, "the expression is nested more than %d deep", maxDepth)
	}
	return nil
}

// sum = product { ("+" | "-") product }
func (p *parser) sum() (Node, error) {
	if err := p.enter(p.peek().col); err != nil {
		return nil, err
	}
	defer func() { p.depth-- }()
	x, err := p.product()
	if err != nil {
		return nil, err
	}
	for k := p.peek().kind; k == tPlus || k == tMinus; k = p.peek().kind {
		op := p.next()
		y, err := p.product()
		if err != nil {
			return nil, err
		}
		x = &Binary{At: op.col, Op: op.text[0], X: x, Y: y}
	}
	return x, nil
}

// product = unary { ("*" | "/") unary }
func (p *parser) product() (Node, error) {
	x, err := p.unary()
	if err != nil {
		return nil, err
	}
	for k := p.peek().kind; k == tStar || k == tSlash; k = p.peek().kind {
		op := p.next()
		y, err := p.unary()
		if err != nil {
			return nil, err
		}
		x = &Binary{At: op.col, Op: op.text[0], X: x, Y: y}
	}
	return x, nil
}

// unary = ("-" | "+") unary | power
func (p *parser) unary() (Node, error) {
	if err := p.enter(p.peek().col); err != nil {
		return nil, err
	}
	defer func() { p.depth-- }()
	switch t := p.peek(); t.kind {
	case tMinus:
		p.next()
		x, err := p.unary()
		if err != nil {
			return nil, err
		}
		return &Unary{At: t.col, X: x}, nil
	case tPlus:
		p.next()
		return p.unary()
	}
	return p.power()
}

// power = primary [ "^" unary ]
func (p *parser) power() (Node, error) {
	x, err := p.primary()
	if err != nil {
		return nil, err
	}
	if k := p.peek().kind; k == tNum || k == tName || k == tLParen {
		return nil, p.unexpected(p.peek(), "")
	}
	if p.peek().kind != tCaret {
		return x, nil
	}
	op := p.next()
	if p.peek().kind == tEOF {
		return nil, errAt(p.peek().col, "missing exponent after ^ at column %d", op.col)
	}
	y, err := p.unary()
	if err != nil {
		return nil, err
	}
	return &Binary{At: op.col, Op: '^', X: x, Y: y}, nil
}

// primary = number | name | name "(" sum ")" | "(" sum ")"
func (p *parser) primary() (Node, error) {
	t := p.next()
	switch t.kind {
	case tNum:
		return number(t)
	case tLParen:
		x, err := p.sum()
		if err != nil {
			return nil, err
		}
		if c := p.peek(); c.kind != tRParen {
			if c.kind == tEOF {
				return nil, errAt(c.col, "missing ) to close the ( at column %d", t.col)
			}
			return nil, p.unexpected(c, ")")
		}
		p.next()
		return x, nil
	case tName:
		if p.peek().kind == tLParen {
			return p.call(t)
		}
		return p.name(t)
	case tEOF:
		return nil, errAt(t.col, "the claim ends where a number, a name or ( was expected")
	case tRParen:
		return nil, errAt(t.col, "expected a number, a name or ( before )")
	}
	return nil, errAt(t.col, "expected a number, a name or (, found %s", t.describe())
}

// number reads a literal exactly.
func number(t token) (Node, error) {
	if i := strings.IndexAny(t.text, "eE"); i >= 0 {
		e, err := strconv.Atoi(t.text[i+1:])
		if err != nil || e > maxExponent || e < -maxExponent {
			return nil, errAt(t.col, "the exponent of %s is outside -%d..%d", t.text, maxExponent, maxExponent)
		}
	}
	r, ok := new(big.Rat).SetString(t.text)
	if !ok {
		return nil, errAt(t.col, "cannot read the number %q", t.text)
	}
	return &Number{At: t.col, Text: t.text, Value: r}, nil
}

// name resolves a name that is not followed by "(".
func (p *parser) name(t token) (Node, error) {
	for _, v := range variables {
		if t.text == v {
			p.vars[v] = true
			return &Variable{At: t.col, Name: v}, nil
		}
	}
	if t.text == "pi" {
		return &Pi{At: t.col}, nil
	}
	for _, f := range append(functions, "zeta", "O") {
		if t.text == f {
			return nil, errAt(t.col, "%s needs its argument in parentheses: %s(...)", f, f)
		}
	}
	if ht, ok, err := parseHighTemp(t); ok {
		return ht, err
	}
	prov, n, err := expansion.ParseName(t.text)
	if err != nil {
		return nil, &Error{Col: t.col, Msg: fmt.Sprintf("unknown name %q", t.text), Hint: vocabulary()}
	}
	q := prov.Quantity()
	switch {
	case q.Indexed && n < 0:
		return nil, errAt(t.col, "%s names the family of dimensions: write h_1, h_2, ...", t.text)
	case q.Indexed && n > conformal.MaxN:
		return nil, errAt(t.col, "dimension index %d is above the supported %d", n, conformal.MaxN)
	case q.NeedsBeta:
		return nil, errAt(t.col, "%s depends on the temperature; claims are about the zero-temperature quantities (h_n, b, S_0, E_0, alpha_S)", t.text)
	}
	qn := &Quantity{At: t.col, Text: t.text, Provider: prov, N: n}
	p.quant = append(p.quant, qn)
	return qn, nil
}

// call reads name "(" sum ")" for the functions, zeta and O.
func (p *parser) call(t token) (Node, error) {
	known := t.text == "zeta" || t.text == "O"
	for _, f := range functions {
		known = known || t.text == f
	}
	if !known {
		for _, v := range append(variables, "pi") {
			if t.text == v {
				return nil, errAt(t.col, "%s is not a function: write %s*(...)", v, v)
			}
		}
		if _, _, err := expansion.ParseName(t.text); err == nil {
			return nil, errAt(t.col, "%s is a quantity, not a function of an argument: the claim's variable is set by its O() term or --around", t.text)
		}
		return nil, &Error{Col: t.col, Msg: fmt.Sprintf("unknown function %q", t.text), Hint: vocabulary()}
	}
	open := p.next()
	if p.peek().kind == tRParen {
		return nil, errAt(p.peek().col, "%s() needs an argument", t.text)
	}
	arg, err := p.sum()
	if err != nil {
		return nil, err
	}
	switch c := p.peek(); c.kind {
	case tRParen:
		p.next()
	case tComma:
		return nil, errAt(c.col, "%s takes one argument", t.text)
	case tEOF:
		return nil, errAt(c.col, "missing ) to close the ( at column %d", open.col)
	default:
		return nil, p.unexpected(c, ")")
	}
	switch t.text {
	case "O":
		return &BigO{At: t.col, Arg: arg}, nil
	case "zeta":
		r, ok := fold(arg)
		if !ok || !r.IsInt() || r.Cmp(big.NewRat(2, 1)) < 0 || r.Cmp(big.NewRat(maxZeta, 1)) > 0 {
			return nil, errAt(arg.Col(), "zeta takes an integer n with 2 <= n <= %d", maxZeta)
		}
		return &Zeta{At: t.col, N: int(r.Num().Int64())}, nil
	}
	return &Call{At: t.col, Func: t.text, Arg: arg}, nil
}

// maxZeta is the largest argument of zeta(n).
const maxZeta = 1000
