package main

import (
	"strings"
	"testing"
)

// No command prints an error bar of zero, infinity or NaN: across the
// exact and resummed conformal quantities at q = 2.5, 3, 4, 6, 10 (and
// E_0, alpha_S at q = 4, whose direct reference is the costly part) every
// error is a positive finite number or null ("not estimated", with the
// reason in the notes).
func TestNoMeaninglessErrors(t *testing.T) {
	type run struct{ args []string }
	var runs []run
	for _, q := range []string{"2.5", "3", "4", "6", "10"} {
		runs = append(runs,
			run{[]string{"exact", "dims", "--q", q, "--n", "0..4"}},
			run{[]string{"exact", "b", "--q", q}},
			run{[]string{"exact", "s0", "--q", q}},
			run{[]string{"resum", "dims", "--q", q, "--n", "1..4", "--order", "10"}},
			run{[]string{"resum", "b", "--q", q, "--order", "10"}},
			run{[]string{"resum", "S_0", "--q", q, "--order", "10"}},
		)
	}
	runs = append(runs,
		run{[]string{"resum", "E_0", "--q", "4"}},
		run{[]string{"resum", "alpha_S", "--q", "4"}},
		run{[]string{"series", "h_2", "--around", "inf", "--order", "10"}},
		run{[]string{"series", "b", "--around", "inf", "--order", "10"}},
		run{[]string{"series", "alpha_S", "--around", "inf", "--order", "4"}},
		run{[]string{"series", "E_0", "--around", "2", "--order", "4"}},
		run{[]string{"hightemp", "logz", "--order", "30", "--q", "2.5,3,4,6,10", "--beta", "1.2"}},
		run{[]string{"hightemp", "entropy", "--order", "12", "--q", "4", "--beta", "3"}},
	)
	for _, r := range runs {
		doc := runJSON(t, r.args...)
		checkErrors(t, strings.Join(r.args, " "), "", doc)
	}
}

// checkErrors walks a JSON document and fails on any error-like value
// (under a key containing "error") that is zero, infinite or NaN.
func checkErrors(t *testing.T, what, key string, v any) {
	t.Helper()
	switch x := v.(type) {
	case map[string]any:
		for k, y := range x {
			checkErrors(t, what, k, y)
		}
	case []any:
		for _, y := range x {
			checkErrors(t, what, key, y)
		}
	case string:
		if !strings.Contains(key, "error") {
			return
		}
		l := strings.ToLower(x)
		if strings.Contains(l, "inf") || strings.Contains(l, "nan") || strings.Trim(x, "0.e+-") == "" {
			t.Errorf("%s: %s = %q", what, key, x)
		}
	}
}
