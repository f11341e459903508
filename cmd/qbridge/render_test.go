package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"math/big"
	"strings"
	"testing"
)

func TestFmtBig(t *testing.T) {
	pi, _, _ := big.ParseFloat("3.14159265358979323846264338327950288", 10, 200, big.ToNearestEven)
	cases := []struct {
		x      *big.Float
		digits int
		want   string
	}{
		{pi, 10, "3.141592654"},
		{pi, 30, "3.14159265358979323846264338328"},
		{big.NewFloat(-0.05746), 4, "-0.05746"},
		{big.NewFloat(1.5e-9), 3, "1.50e-09"},
		{big.NewFloat(0), 5, "0"},
		{big.NewFloat(12345.678), 3, "12346"},
	}
	for _, c := range cases {
		if got := fmtBig(c.x, c.digits); got != c.want {
			t.Errorf("fmtBig(%v, %d) = %q, want %q", c.x, c.digits, got, c.want)
		}
	}
}

func sampleOutput() *Output {
	return &Output{
		JSON:   map[string]any{"quantity": "b", "values": []string{"0.1"}},
		Tables: []Table{{Title: "t_1", Header: []string{"n", "h_n"}, Rows: [][]string{{"1", "3.77"}, {"2", "5.68"}}}},
		Notes:  []string{"method: test"},
	}
}

// Each format must be parseable by a standard reader of that format.
func TestRenderFormats(t *testing.T) {
	var buf bytes.Buffer
	if err := render(&buf, "json", sampleOutput()); err != nil {
		t.Fatal(err)
	}
	var v map[string]any
	if err := json.Unmarshal(buf.Bytes(), &v); err != nil || v["quantity"] != "b" {
		t.Fatalf("json round trip: %v %v", err, v)
	}
	for _, k := range []string{"command", "version", "units", "notes"} {
		if _, ok := v[k]; !ok {
			t.Errorf("JSON document lacks %q: %v", k, v)
		}
	}
	buf.Reset()
	if err := render(&buf, "csv", sampleOutput()); err != nil {
		t.Fatal(err)
	}
	// One header line and data lines only: a strict reader with no comment
	// character and a fixed field count must take it.
	r := csv.NewReader(strings.NewReader(buf.String()))
	recs, err := r.ReadAll()
	if err != nil || len(recs) != 3 || recs[2][1] != "5.68" || recs[0][1] != "h_n" {
		t.Fatalf("csv: %v %v", err, recs)
	}
	buf.Reset()
	if err := render(&buf, "tex", sampleOutput()); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), `$h_n$`) || !strings.Contains(buf.String(), `\caption{t\_1}`) {
		t.Fatalf("tex: %s", buf.String())
	}
	buf.Reset()
	if err := render(&buf, "text", sampleOutput()); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), "note: method: test") {
		t.Fatalf("text notes: %s", buf.String())
	}
}

// JSON documents have one shape: numbers become decimal strings, _err
// becomes _error, legacy names become the vocabulary's.
func TestJSONDocumentShape(t *testing.T) {
	out := &Output{JSON: map[string]any{"E0": 1.5, "E0_err": 0.25, "alphaS": "x", "n": 3, "ok": true}}
	doc, err := jsonDocument(out, "qbridge test")
	if err != nil {
		t.Fatal(err)
	}
	want := map[string]any{"E_0": "1.5", "E_0_error": "0.25", "alpha_S": "x", "n": "3", "ok": true}
	for k, w := range want {
		if doc[k] != w {
			t.Errorf("%s = %#v, want %#v", k, doc[k], w)
		}
	}
	list, err := jsonDocument(&Output{JSON: []any{1, 2}}, "qbridge test")
	if err != nil {
		t.Fatal(err)
	}
	if r, ok := list["results"].([]any); !ok || len(r) != 2 || r[0] != "1" {
		t.Errorf("list document: %v", list)
	}
}

// LaTeX: the mathematics of titles and headers is typeset, the rest escaped.
func TestTexText(t *testing.T) {
	cases := map[string]string{
		"h_1 around q = 2, coefficients of eps^k": `$h_{1}$ around q = 2, coefficients of $\epsilon^{k}$`,
		"alpha_S fitted":    `$\alpha_S$ fitted`,
		"50% of S_0":        `50\% of $S_0$`,
		"chi_1 and epsilon": `chi\_1 and epsilon`,
	}
	for in, want := range cases {
		if got := texText(in); got != want {
			t.Errorf("texText(%q) = %q, want %q", in, got, want)
		}
	}
}

// A table wider than the limit is split into parts that repeat the first
// column and each fit.
func TestSplitWide(t *testing.T) {
	tab := Table{Title: "wide", Header: []string{"quantity"}}
	row := []string{"h_1"}
	for i := 0; i < 12; i++ {
		tab.Header = append(tab.Header, strings.Repeat("c", 15))
		row = append(row, strings.Repeat("1", 15))
	}
	tab.Rows = [][]string{row}
	parts := splitWide(tab)
	if len(parts) < 2 {
		t.Fatalf("not split: %d part(s)", len(parts))
	}
	cols := 0
	for _, p := range parts {
		w := 0
		for _, x := range textWidth(p) {
			w += x + 2
		}
		if w > maxTextWidth {
			t.Errorf("part of width %d", w)
		}
		if p.Rows[0][0] != "h_1" {
			t.Errorf("first column not repeated: %v", p.Rows[0])
		}
		cols += len(p.Header) - 1
	}
	if cols != 12 {
		t.Errorf("columns kept: %d, want 12", cols)
	}
}

// A value within its error keeps two significant digits: a bare 0 is kept
// for an exact zero only.
func TestFmtValueWithinError(t *testing.T) {
	cases := []struct {
		x, err float64
		want   string
	}{
		{3.1e-5, 8.5e-4, "0.000031"},
		{-2.26e-30, 7.9e-29, "-2.3e-30"},
		{0, 1e-10, "0"},
		{0.25, 1e-12, "0.250000000"},
	}
	for _, c := range cases {
		if got := fmtValue(big.NewFloat(c.x), big.NewFloat(c.err), 9); got != c.want {
			t.Errorf("fmtValue(%g, %g) = %q, want %q", c.x, c.err, got, c.want)
		}
	}
}
