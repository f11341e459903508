package claim

import "fmt"

// Error is a fault of the claim itself: its syntax, an unknown name, an
// operation outside its domain (a division by a series that vanishes within
// its error, a log of a series whose leading term is not positive), or an
// order term that conflicts with what was asked. The command line reports
// it as bad input.
type Error struct {
	// Col is the 1-based column (in characters) of the claim text the fault
	// is at; 0 when it has no single place.
	Col int
	// Msg says what is wrong and, where there is one, what to write instead.
	Msg string
	// Hint, when not empty, lists what may be written (the vocabulary
	// after an unknown name).
	Hint string
}

// Error prints "at column C: message; hint".
func (e *Error) Error() string {
	if e.Hint != "" {
		return e.Short() + "; " + e.Hint
	}
	return e.Short()
}

// Short prints "at column C: message" without the hint.
func (e *Error) Short() string {
	if e.Col > 0 {
		return fmt.Sprintf("at column %d: %s", e.Col, e.Msg)
	}
	return e.Msg
}

// errAt returns an *Error at column col.
func errAt(col int, format string, a ...any) error {
	return &Error{Col: col, Msg: fmt.Sprintf(format, a...)}
}
