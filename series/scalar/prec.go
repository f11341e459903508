package scalar

import (
	"errors"
	"fmt"
	"math/big"
)

// MaxPrec is the largest working precision, in bits, that the packages of
// the series tree accept.
const MaxPrec = 1 << 20

// ErrPrec is returned for a precision of zero bits or above MaxPrec.
var ErrPrec = errors.New("precision must be between 1 and 2^20 bits")

// CheckPrec returns an error wrapping ErrPrec unless 1 <= prec <= MaxPrec.
func CheckPrec(prec uint) error {
	if prec == 0 || prec > MaxPrec {
		return fmt.Errorf("%w (got %d)", ErrPrec, prec)
	}
	return nil
}

// ErrLength is returned for a negative or zero number of coefficients.
var ErrLength = errors.New("length must be positive")

// checkLength checks a coefficient count and a precision together.
func checkLength(n int, prec uint) error {
	if n <= 0 {
		return fmt.Errorf("%w (got %d)", ErrLength, n)
	}
	return CheckPrec(prec)
}

// zeros returns n zero values at prec bits.
func zeros(n int, prec uint) []*big.Float {
	c := make([]*big.Float, n)
	for i := range c {
		c[i] = new(big.Float).SetPrec(prec)
	}
	return c
}

// ErrNoConvergence is returned when an iteration does not reach the requested
// accuracy within its step limit.
var ErrNoConvergence = errors.New("iteration did not converge")
