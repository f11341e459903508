package main

import (
	"errors"
	"math"
	"strconv"
	"testing"
)

// Bad input to solve and ground is a usage error (exit status 2).
func TestSolveGroundBadInput(t *testing.T) {
	cases := [][]string{
		{"solve", "--q", "1.5"},
		{"solve", "--beta", "0"},
		{"solve", "--beta", "-3"},
		{"solve", "--beta", "1e9"},
		{"solve", "--points", "1000"},
		{"solve", "--tol", "0"},
		{"solve", "--out", "g.txt"},
		{"solve", "--out", ""},
		{"solve", "--out", "/no/such/dir/g.csv"},
		{"ground", "--q", "1"},
		{"ground", "--beta-max", "-1"},
	}
	for _, args := range cases {
		_, err := runCLI(t, args...)
		var ue *usageError
		if !errors.As(err, &ue) {
			t.Errorf("%v: error %v, want a usage error", args, err)
		}
	}
}

// solve --format json at q = 2, beta = 1 gives the semicircle value
// log Z = 0.404584396859811 (quadrature of the exact density, PHYSICS sec. 5)
// under the contract keys.
func TestSolveJSON(t *testing.T) {
	js := runJSON(t, "solve", "--q", "2", "--beta", "1")
	for _, k := range []string{"q", "beta", "logZ", "logZ_error", "E", "E_error", "S", "S_error", "units", "command", "version"} {
		if _, ok := js[k].(string); !ok {
			t.Errorf("key %q missing or not a string", k)
		}
	}
	lz, _ := strconv.ParseFloat(js["logZ"].(string), 64)
	if math.Abs(lz-0.404584396859811) > 1e-12 {
		t.Errorf("logZ = %v", js["logZ"])
	}
}
