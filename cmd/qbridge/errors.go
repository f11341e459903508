package main

import "fmt"

// usageError marks bad input (unknown values, out-of-range flags): main
// prints it on one line and exits with status 2.
type usageError struct{ error }

func (e *usageError) Unwrap() error { return e.error }

// usageErr returns a bad-input error with a formatted message.
func usageErr(format string, a ...any) error {
	return &usageError{fmt.Errorf(format, a...)}
}
