package main

import (
	"strconv"
	"strings"
)

// parseNRange reads a dimension index "3" or an inclusive range "0..20".
func parseNRange(text string) (lo, hi int, err error) {
	t := strings.TrimSpace(text)
	a, b, isRange := strings.Cut(t, "..")
	if !isRange {
		b = a
	}
	lo, err1 := strconv.Atoi(strings.TrimSpace(a))
	hi, err2 := strconv.Atoi(strings.TrimSpace(b))
	if err1 != nil || err2 != nil {
		return 0, 0, usageErr("cannot read --n %q: give an index such as 3 or a range such as 0..20", text)
	}
	if lo < 0 || hi < 0 {
		return 0, 0, usageErr("--n must be non-negative (got %q)", text)
	}
	if hi < lo {
		return 0, 0, usageErr("--n range %q is empty (the first index exceeds the last)", text)
	}
	return lo, hi, nil
}
