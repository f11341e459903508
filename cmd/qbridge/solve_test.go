package main

import (
	"bytes"
	"encoding/json"
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
		{"solve", "--points", "1000"},
		{"solve", "--tol", "0"},
		{"solve", "--out", "g.txt"},
		{"ground", "--q", "1"},
		{"ground", "--beta-max", "-1"},
	}
	for _, args := range cases {
		solveFlags.Q, solveFlags.Beta, solveFlags.Points, solveFlags.Tol, solveFlags.Out = 4, 10, 0, 1e-13, ""
		groundFlags.Q, groundFlags.BetaMax, groundFlags.BetaMin, groundFlags.Steps = 4, 4000, 0, 16
		rootCmd.SetArgs(args)
		err := rootCmd.Execute()
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
	solveFlags.Q, solveFlags.Beta, solveFlags.Points, solveFlags.Tol, solveFlags.Out = 2, 1, 0, 1e-13, ""
	var buf bytes.Buffer
	rootCmd.SetOut(&buf)
	rootCmd.SetArgs([]string{"solve", "--q", "2", "--beta", "1", "--format", "json"})
	defer func() { opts.Format = "text"; rootCmd.SetOut(nil) }()
	if err := rootCmd.Execute(); err != nil {
		t.Fatal(err)
	}
	var js map[string]any
	if err := json.Unmarshal(buf.Bytes(), &js); err != nil {
		t.Fatal(err, buf.String())
	}
	for _, k := range []string{"q", "beta", "logZ", "logZ_err", "E", "E_err", "S", "S_err"} {
		if _, ok := js[k].(string); !ok {
			t.Errorf("key %q missing or not a string", k)
		}
	}
	lz, _ := strconv.ParseFloat(js["logZ"].(string), 64)
	if math.Abs(lz-0.404584396859811) > 1e-12 {
		t.Errorf("logZ = %v", js["logZ"])
	}
}
