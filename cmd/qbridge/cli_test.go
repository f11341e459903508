package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"math/big"
	"testing"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"
)

// resetFlags puts every flag of every command back to its default, so that
// in-process runs do not see each other's flags.
func resetFlags(c *cobra.Command) {
	reset := func(f *pflag.Flag) {
		_ = f.Value.Set(f.DefValue)
		f.Changed = false
	}
	c.Flags().VisitAll(reset)
	c.PersistentFlags().VisitAll(reset)
	for _, sub := range c.Commands() {
		resetFlags(sub)
	}
}

// runCLI runs qbridge in-process with args (plus --quiet) and returns
// standard output and the error.
func runCLI(t *testing.T, args ...string) (string, error) {
	t.Helper()
	resetFlags(rootCmd)
	var buf bytes.Buffer
	rootCmd.SetOut(&buf)
	rootCmd.SetArgs(append(args, "--quiet"))
	defer rootCmd.SetOut(nil)
	err := rootCmd.Execute()
	return buf.String(), err
}

// runJSON runs a command with --format json and decodes the document.
func runJSON(t *testing.T, args ...string) map[string]any {
	t.Helper()
	out, err := runCLI(t, append(args, "--format", "json")...)
	if err != nil {
		t.Fatalf("%v: %v", args, err)
	}
	m := map[string]any{}
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatalf("%v: %v\n%s", args, err, out)
	}
	return m
}

func parseDecimal(t *testing.T, v any) float64 {
	t.Helper()
	s, ok := v.(string)
	if !ok {
		t.Fatalf("value %v is not a decimal string", v)
	}
	f, _, err := big.ParseFloat(s, 10, 64, big.ToNearestEven)
	if err != nil {
		t.Fatal(err)
	}
	x, _ := f.Float64()
	return x
}

// The JSON contract of series for E_0: quantity, around, variable,
// coefficients and errors as parallel arrays of decimal strings; order 0 is
// the free fermion, E_0 = -2/(3 pi) (PHYSICS sec. 5, q = 2 semicircle).
func TestEnergySeriesJSON(t *testing.T) {
	for _, name := range []string{"e0", "E_0"} {
		m := runJSON(t, "series", name, "--around", "2", "--order", "3", "--digits", "12")
		if m["quantity"] != "E_0" || m["around"] != "2" || m["variable"] != "eps" {
			t.Errorf("%s keys: %v", name, m)
		}
		c, _ := m["coefficients"].([]any)
		e, _ := m["errors"].([]any)
		if len(c) != 4 || len(e) != 4 {
			t.Fatalf("coefficients %v errors %v", c, e)
		}
		if f := parseDecimal(t, c[0]); f > -0.2122065907 || f < -0.2122065908 {
			t.Errorf("E_0 at q = 2: %v, want -2/(3 pi) = -0.21220659079", c[0])
		}
		if _, ok := m["check"].(map[string]any); !ok {
			t.Errorf("no S_0 check in %v", m)
		}
	}
}

// The names of the vocabulary reach the same provider: h_1 and dims --n 1
// give the same series; the x^2 coefficient of h_1 around q = 2 is -5/6
// (exact, PSLQ-verified closed form; also checked against mpmath in
// expansion/conformal).
func TestSeriesNamesAgree(t *testing.T) {
	a := runJSON(t, "series", "h_1", "--order", "4", "--digits", "20")
	b := runJSON(t, "series", "dims", "--n", "1", "--order", "4", "--digits", "20")
	ca, cb := a["coefficients"].([]any), b["coefficients"].([]any)
	if len(ca) != 5 || len(cb) != 5 {
		t.Fatalf("lengths %d %d", len(ca), len(cb))
	}
	for k := range ca {
		if ca[k] != cb[k] {
			t.Errorf("k=%d: h_1 %v, dims --n 1 %v", k, ca[k], cb[k])
		}
	}
	if c2 := parseDecimal(t, ca[2]); c2+5.0/6 > 1e-15 || c2+5.0/6 < -1e-15 {
		t.Errorf("h_1 eps^2 coefficient %v, want -5/6", ca[2])
	}
	if a["quantity"] != "h_1" {
		t.Errorf("quantity key %v, want h_1", a["quantity"])
	}
}

// resum of h_1 at q = 4 lists the methods in the one order and agrees with
// the exact root h_1(4) = 3.77354... (published 3.77, MS 2016
// arXiv:1604.07818) within its errors.
func TestResumMethodsOrder(t *testing.T) {
	m := runJSON(t, "resum", "h_1", "--q", "4", "--order", "12")
	want := []string{"eps partial sum", "eps Pade", "eps conformal map", "1/q partial sum", "1/q Pade", "1/q conformal map", "two-point Pade"}
	got, _ := m["methods"].([]any)
	if len(got) != len(want) {
		t.Fatalf("methods %v", got)
	}
	for i := range want {
		if got[i] != want[i] {
			t.Errorf("method %d = %v, want %v", i, got[i], want[i])
		}
	}
	ref := parseDecimal(t, m["reference"])
	if ref < 3.765 || ref > 3.775 {
		t.Errorf("exact h_1(4) = %v, published 3.77", ref)
	}
	if m["reference_kind"] != "exact" {
		t.Errorf("reference kind %v", m["reference_kind"])
	}
}

// Bad input: one-line usage errors (exit status 2), including orders beyond
// what each expansion supports, flags that do not apply and logZ without
// --beta.
func TestProviderBadInput(t *testing.T) {
	cases := [][]string{
		{"series", "e0", "--order", "1000"},
		{"series", "alpha", "--around", "inf", "--order", "1"},
		{"series", "logz", "--order", "4"},
		{"series", "b", "--n", "2"},
		{"series", "e0", "--closed-form"},
		{"series", "e0", "--beta", "10"},
		{"series", "h_x"},
		{"series", "nonsense"},
		{"series", "h_1", "--n", "2"},
		{"series", "dims", "--n", "1..x"},
		{"resum", "e0", "--q", "1.5"},
		{"resum", "e0", "--q", "inf"},
		{"exact", "e0"},
		{"exact", "b", "--n", "3"},
	}
	for _, args := range cases {
		_, err := runCLI(t, args...)
		var ue *usageError
		if !errors.As(err, &ue) {
			t.Errorf("%v: got %v, want a usage error", args, err)
		}
	}
}
