package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"math/big"
	"testing"

	"github.com/spf13/cobra"

	"qbridge/expansion/conformal"
)

// runProvider renders a provider's output as JSON into a map.
func runProvider(t *testing.T, out *Output, err error) map[string]any {
	t.Helper()
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if err := render(&buf, "json", out); err != nil {
		t.Fatal(err)
	}
	m := map[string]any{}
	if err := json.Unmarshal(buf.Bytes(), &m); err != nil {
		t.Fatal(err)
	}
	return m
}

func quietCmd() *cobra.Command {
	opts.Quiet = true
	opts.Digits = 12
	return seriesCmd
}

// The JSON contract of the series providers: quantity, around, variable,
// coefficients and errors as parallel arrays of decimal strings.
func TestEnergySeriesJSON(t *testing.T) {
	cmd := quietCmd()
	out, err := seriesProviders["e0"](cmd, conformal.AroundTwo, 3)
	m := runProvider(t, out, err)
	if m["quantity"] != "e0" || m["around"] != "2" || m["variable"] != "eps" {
		t.Errorf("keys: %v", m)
	}
	c, _ := m["coefficients"].([]any)
	e, _ := m["errors"].([]any)
	if len(c) != 4 || len(e) != 4 {
		t.Fatalf("coefficients %v errors %v", c, e)
	}
	// Order 0 is the free fermion: E_0 = -2/(3 pi) (PHYSICS sec. 5).
	v, _, err := big.ParseFloat(c[0].(string), 10, 64, big.ToNearestEven)
	if err != nil {
		t.Fatal(err)
	}
	if f, _ := v.Float64(); f > -0.2122065907 || f < -0.2122065908 {
		t.Errorf("E_0 at q = 2: %s, want -2/(3 pi) = -0.21220659079", c[0])
	}
}

// Bad input: one-line usage errors (exit status 2), including orders beyond
// what each expansion supports and logz without --beta.
func TestEnergyBadInput(t *testing.T) {
	cmd := quietCmd()
	cases := []struct {
		name string
		err  error
	}{
		{"order too high at 2", func() error { _, err := seriesProviders["e0"](cmd, conformal.AroundTwo, 1000); return err }()},
		{"order too low at inf", func() error { _, err := seriesProviders["alpha"](cmd, conformal.AroundInf, 1); return err }()},
		{"logz without beta", func() error { _, err := seriesProviders["logz"](cmd, conformal.AroundTwo, 4); return err }()},
		{"q below 2", func() error {
			_, err := resumProviders["e0"](cmd, conformal.QPoint{Q: big.NewFloat(1.5)}, 4)
			return err
		}()},
	}
	for _, c := range cases {
		var u *usageError
		if !errors.As(c.err, &u) {
			t.Errorf("%s: got %v, want a usage error", c.name, c.err)
		}
	}
}
