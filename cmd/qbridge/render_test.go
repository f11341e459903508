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
	buf.Reset()
	if err := render(&buf, "csv", sampleOutput()); err != nil {
		t.Fatal(err)
	}
	r := csv.NewReader(strings.NewReader(buf.String()))
	r.Comment = '#'
	r.FieldsPerRecord = -1
	recs, err := r.ReadAll()
	if err != nil || len(recs) != 3 || recs[2][1] != "5.68" {
		t.Fatalf("csv: %v %v", err, recs)
	}
	buf.Reset()
	if err := render(&buf, "tex", sampleOutput()); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), `h\_n`) || !strings.Contains(buf.String(), `\caption{t\_1}`) {
		t.Fatalf("tex escaping: %s", buf.String())
	}
	buf.Reset()
	if err := render(&buf, "text", sampleOutput()); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), "note: method: test") {
		t.Fatalf("text notes: %s", buf.String())
	}
}
