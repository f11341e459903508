package conformal

import (
	"fmt"
	"math"
)

// Limits on what callers may ask for.
const (
	// MinDigits is the smallest number of decimal digits a caller may ask for.
	MinDigits = 5
	// MaxDigits is the largest number of decimal digits a caller may ask for.
	MaxDigits = 1000
	// MaxOrder is the highest series order (power of the expansion
	// variable) accepted.
	MaxOrder = 200
	// MaxN is the highest dimension index n of h_n accepted.
	MaxN = 200
)

// bitsFor returns the working precision in bits for the requested decimal
// digits, with guard bits that grow with the series order (coefficients are
// built from sums whose terms can exceed the result).
func bitsFor(digits, order int) uint {
	return uint(math.Ceil(float64(digits)*math.Log2(10))) + 32 + uint(order)
}

// secondPrec is the higher precision of the pair used for error estimates.
func secondPrec(prec uint) uint { return prec + prec/2 + 32 }

func checkDigits(digits int) error {
	if digits < MinDigits || digits > MaxDigits {
		return fmt.Errorf("expansion: digits must be between %d and %d (got %d)", MinDigits, MaxDigits, digits)
	}
	return nil
}

func checkOrder(order int) error {
	if order < 0 || order > MaxOrder {
		return fmt.Errorf("expansion: order must be between 0 and %d (got %d)", MaxOrder, order)
	}
	return nil
}

func checkN(n int) error {
	if n < 0 || n > MaxN {
		return fmt.Errorf("expansion: dimension index n must be between 0 and %d (got %d)", MaxN, n)
	}
	return nil
}
