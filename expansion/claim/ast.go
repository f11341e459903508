package claim

import (
	"fmt"
	"math/big"

	"qbridge/expansion"
)

// Node is a node of a parsed side of a claim. String prints it fully
// parenthesised, the form the parser tests compare.
type Node interface {
	// Col is the 1-based column the node starts at (for an operator, the
	// operator's column).
	Col() int
	// String prints the node fully parenthesised.
	String() string
}

// Number is a literal, read exactly.
type Number struct {
	// At is the column of the first digit.
	At int
	// Text is the literal as written.
	Text string
	// Value is its exact value.
	Value *big.Rat
}

// Variable is q, eps or x.
type Variable struct {
	// At is the column of the name.
	At int
	// Name is "q", "eps" or "x".
	Name string
}

// Pi is the constant pi.
type Pi struct {
	// At is the column of the name.
	At int
}

// Zeta is zeta(N) for an integer N >= 2.
type Zeta struct {
	// At is the column of the name zeta.
	At int
	// N is the argument.
	N int
}

// Quantity is one of the quantities of package expansion.
type Quantity struct {
	// At is the column of the name.
	At int
	// Text is the name as written.
	Text string
	// Provider computes the quantity.
	Provider expansion.Provider
	// N is the dimension index of h_n; -1 for the other quantities.
	N int
}

// Name is the printed name of the quantity (h_1, S_0, ...).
func (q *Quantity) Name() string { return q.Provider.Quantity().Named(q.N) }

// Unary is -X.
type Unary struct {
	// At is the column of the sign.
	At int
	// X is the operand.
	X Node
}

// Binary is X op Y for op one of + - * / ^.
type Binary struct {
	// At is the column of the operator.
	At int
	// Op is the operator character.
	Op byte
	// X and Y are the operands.
	X, Y Node
}

// Call is a function of one argument: sqrt, exp, log, sin, cos, tan, Gamma
// or psi.
type Call struct {
	// At is the column of the function name.
	At int
	// Func is the function name.
	Func string
	// Arg is the argument.
	Arg Node
}

// BigO is an order term O(t^k) as written; Claim.Order holds what it means.
type BigO struct {
	// At is the column of the O.
	At int
	// Arg is the argument as written.
	Arg Node
}

// Col is the column the Number starts at.
func (n *Number) Col() int { return n.At }

// Col is the column the Variable starts at.
func (n *Variable) Col() int { return n.At }

// Col is the column the Pi starts at.
func (n *Pi) Col() int { return n.At }

// Col is the column the Zeta starts at.
func (n *Zeta) Col() int { return n.At }

// Col is the column the Quantity starts at.
func (n *Quantity) Col() int { return n.At }

// Col is the column the Unary starts at.
func (n *Unary) Col() int { return n.At }

// Col is the column the Binary starts at.
func (n *Binary) Col() int { return n.At }

// Col is the column the Call starts at.
func (n *Call) Col() int { return n.At }

// Col is the column the BigO starts at.
func (n *BigO) Col() int { return n.At }

// String prints the Number fully parenthesised.
func (n *Number) String() string { return n.Value.RatString() }

// String prints the Variable fully parenthesised.
func (n *Variable) String() string { return n.Name }

// String prints the Pi fully parenthesised.
func (n *Pi) String() string { return "pi" }

// String prints the Zeta fully parenthesised.
func (n *Zeta) String() string { return fmt.Sprintf("zeta(%d)", n.N) }

// String prints the Quantity fully parenthesised.
func (n *Quantity) String() string { return n.Name() }

// String prints the Unary fully parenthesised.
func (n *Unary) String() string { return "(-" + n.X.String() + ")" }

// String prints the Binary fully parenthesised.
func (n *Binary) String() string {
	return "(" + n.X.String() + " " + string(n.Op) + " " + n.Y.String() + ")"
}

// String prints the Call fully parenthesised.
func (n *Call) String() string { return n.Func + "(" + n.Arg.String() + ")" }

// String prints the BigO fully parenthesised.
func (n *BigO) String() string { return "O(" + n.Arg.String() + ")" }

// walk calls f on n and every node below it.
func walk(n Node, f func(Node)) {
	f(n)
	switch t := n.(type) {
	case *Unary:
		walk(t.X, f)
	case *Binary:
		walk(t.X, f)
		walk(t.Y, f)
	case *Call:
		walk(t.Arg, f)
	case *BigO:
		walk(t.Arg, f)
	}
}
