package main

import (
	"encoding/csv"
	"encoding/json"
	"errors"
	"math"
	"math/big"
	"strconv"
	"strings"
	"testing"
)

// isolateCache points the user's cache directory at a temporary one, so
// that no test reads or writes the real cache.
func isolateCache(t *testing.T) {
	t.Helper()
	t.Setenv("XDG_CACHE_HOME", t.TempDir())
	t.Setenv("HOME", t.TempDir())
}

// tableRows decodes table --format json: the array of row objects, bare or
// under "results".
func tableRows(t *testing.T, out string) []map[string]any {
	t.Helper()
	var rows []map[string]any
	if err := json.Unmarshal([]byte(out), &rows); err == nil {
		return rows
	}
	var doc map[string]any
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("%v\n%s", err, out)
	}
	list, _ := doc["results"].([]any)
	for _, r := range list {
		rows = append(rows, r.(map[string]any))
	}
	return rows
}

func decimal(t *testing.T, v any) *big.Float {
	t.Helper()
	s, ok := v.(string)
	if !ok {
		t.Fatalf("%v is not a decimal string", v)
	}
	f, _, err := big.ParseFloat(s, 10, 200, big.ToNearestEven)
	if err != nil {
		t.Fatal(err)
	}
	return f
}

// The JSON layout {"q", "<quantity>": {"value", "error", "method"}} under
// the canonical names, checked against mpmath values of h_1 (findroot of
// k_A(h) = 1, testdata/conformal_golden.json) and the published S_0(4) =
// 0.2324 (MS 2016 arXiv:1604.07818) and b from b^q pi = (1/2 - 1/q)
// tan(pi/q) evaluated here in float64.
func TestTableJSON(t *testing.T) {
	isolateCache(t)
	out, err := runCLI(t, "table", "h_1,s0", "b", "--q", "3,4,inf", "--format", "json", "--order", "12")
	if err != nil {
		t.Fatal(err)
	}
	rows := tableRows(t, out)
	if len(rows) != 3 {
		t.Fatalf("%d rows, want 3:\n%s", len(rows), out)
	}
	h1 := map[string]string{"3": "3.90366169581660733492150334357533173766", "4": "3.773535618637621541061433149809472697002", "inf": "3"}
	for _, r := range rows {
		q := r["q"].(string)
		for _, name := range []string{"h_1", "S_0", "b"} {
			c, ok := r[name].(map[string]any)
			if !ok || c["method"] == nil || c["value"] == nil {
				t.Fatalf("q=%s %s: %v", q, name, r[name])
			}
		}
		v := decimal(t, r["h_1"].(map[string]any)["value"])
		e := decimal(t, r["h_1"].(map[string]any)["error"])
		d := new(big.Float).Sub(v, decimal(t, h1[q]))
		if d.Abs(d).Cmp(new(big.Float).Add(e, big.NewFloat(1e-15))) > 0 {
			t.Errorf("h_1(%s) = %v ± %v, mpmath %s", q, v, e, h1[q])
		}
		if q == "4" {
			if s, _ := decimal(t, r["S_0"].(map[string]any)["value"]).Float64(); math.Abs(s-0.2324) > 5e-5 {
				t.Errorf("S_0(4) = %v, published 0.2324", s)
			}
		}
		if q != "inf" {
			qf, _ := decimal(t, q).Float64()
			want := math.Pow((0.5-1/qf)*math.Tan(math.Pi/qf)/math.Pi, 1/qf)
			if b, _ := decimal(t, r["b"].(map[string]any)["value"]).Float64(); math.Abs(b-want) > 1e-14 {
				t.Errorf("b(%s) = %v, closed form %v", q, b, want)
			}
		}
	}
}

// CSV: one header line, then one machine-readable line per q; --method all
// adds the differences from the exact value, which stay within the stated
// errors.
func TestTableCSV(t *testing.T) {
	isolateCache(t)
	out, err := runCLI(t, "table", "h_n", "--n", "1..2", "--q", "2.5..4:0.5", "--method", "all", "--format", "csv", "--order", "12")
	if err != nil {
		t.Fatal(err)
	}
	var lines []string
	for _, l := range strings.Split(strings.TrimSpace(out), "\n") {
		if !strings.HasPrefix(l, "#") && l != "" {
			lines = append(lines, l)
		}
	}
	recs, err := csv.NewReader(strings.NewReader(strings.Join(lines, "\n"))).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	want := []string{"q", "h_1 exact", "h_1 exact error", "h_1 resummed", "h_1 resummed error", "h_1 resummed - exact",
		"h_2 exact", "h_2 exact error", "h_2 resummed", "h_2 resummed error", "h_2 resummed - exact"}
	if strings.Join(recs[0], "|") != strings.Join(want, "|") {
		t.Fatalf("header %v", recs[0])
	}
	if len(recs) != 5 {
		t.Fatalf("%d lines, want header + 4", len(recs))
	}
	for _, r := range recs[1:] {
		for _, col := range []int{5, 10} {
			d := decimal(t, r[col])
			e := decimal(t, r[col-1])
			if d.Abs(d).Cmp(e) > 0 {
				t.Errorf("q=%s: resummed - exact = %s beyond the error %s", r[0], r[col], r[col-1])
			}
		}
	}
}

// LaTeX: a tabular with value(error) cells.
func TestTableTeX(t *testing.T) {
	isolateCache(t)
	out, err := runCLI(t, "table", "h_1", "--q", "4", "--method", "resummed", "--format", "tex", "--order", "8")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(out, `\begin{tabular}`) || !strings.Contains(out, "$3.77353") || !strings.Contains(out, ")$") {
		t.Errorf("tex output:\n%s", out)
	}
}

// value(error) rounding: the error rounded up to one digit (two when it
// starts with 1), the value to the same place.
func TestFmtUncertain(t *testing.T) {
	for _, c := range []struct {
		v, e string
		d    int
		want string
	}{
		{"0.00709312", "4.3e-7", 16, "0.0070931(5)"},
		{"0.00709312", "1.3e-7", 16, "0.00709312(13)"},
		{"3.77353561", "0.0012", 16, "3.7735(12)"},
		{"-0.0574598", "2e-6", 16, "-0.057460(2)"},
		{"123.4", "12", 16, "123(12)"},
		{"1234.5", "30", 16, "1230(30)"},
		{"3.773535618637621541", "1e-25", 16, "3.773535618637622(1)"},
		{"2.9e-36", "1e-30", 16, `0.0(10)\times 10^{-30}`},
		{"-4.56e-9", "3.3e-11", 16, `-4.56(4)\times 10^{-9}`},
	} {
		v, _, _ := big.ParseFloat(c.v, 10, 200, big.ToNearestEven)
		e, _, _ := big.ParseFloat(c.e, 10, 64, big.ToNearestEven)
		if got := fmtUncertain(v, e, c.d); got != c.want {
			t.Errorf("fmtUncertain(%s, %s) = %s, want %s", c.v, c.e, got, c.want)
		}
	}
}

// --q lists and ranges.
func TestParseQList(t *testing.T) {
	for _, c := range []struct {
		in   string
		want string
	}{
		{"3,4,6", "3 4 6"},
		{"2.5..4:0.5", "2.5 3 3.5 4"},
		{"2..2.3:0.1", "2 2.1 2.2 2.3"},
		{"2.5..10:*2", "2.5 5 10"},
		{"2.5..8:*1.25", "2.5 3.125 3.90625 4.8828125 6.103515625 7.62939453125"},
		{"inf,3", "inf 3"},
		{"2..3:1,inf", "2 3 inf"},
	} {
		qs, err := parseQList(c.in)
		if err != nil {
			t.Errorf("%q: %v", c.in, err)
			continue
		}
		var got []string
		for _, q := range qs {
			got = append(got, q.String())
		}
		if strings.Join(got, " ") != c.want {
			t.Errorf("%q: %v, want %s", c.in, got, c.want)
		}
	}
	for _, bad := range []string{"", "1.5", "x", "3..2:1", "2..4", "2..4:0", "2..4:-1", "2..4:*1", "2..4:*0.5", "2..inf:1", "1..4:1", "2..1e9:1e-9", "2..nan:1", ",", "4,,5"} {
		_, err := parseQList(bad)
		var ue *usageError
		if !errors.As(err, &ue) {
			t.Errorf("%q: %v, want a usage error", bad, err)
		}
	}
}

// Any input either parses to at most maxQPoints points, all q >= 2 or inf,
// each printing as a q that parses back to itself, or is a usage error; it
// never panics.
func FuzzParseQList(f *testing.F) {
	for _, s := range []string{"3,4,6", "2.5..20:0.5", "2.5..1000:*1.25", "inf", "2..3:1e-3", "1e3", "2..4:*1.0000001"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		qs, err := parseQList(s)
		if err != nil {
			var ue *usageError
			if !errors.As(err, &ue) {
				t.Fatalf("%q: non-usage error %v", s, err)
			}
			return
		}
		if len(qs) == 0 || len(qs) > maxQPoints {
			t.Fatalf("%q: %d points", s, len(qs))
		}
		for _, q := range qs {
			if !q.Inf && q.Q.Cmp(big.NewFloat(2)) < 0 {
				t.Fatalf("%q: q = %s below 2", s, q)
			}
			back, err := parseQList(q.String())
			if err != nil || len(back) != 1 || back[0].String() != q.String() {
				t.Fatalf("%q: %s does not parse back (%v)", s, q, err)
			}
		}
	})
}

// Bad input to table: usage errors.
func TestTableBadInput(t *testing.T) {
	isolateCache(t)
	for _, args := range [][]string{
		{"table", "h_1"},
		{"table", "h_1", "--q", "1.5"},
		{"table", "h_1", "--q", "4", "--method", "best"},
		{"table", "e0", "--q", "4", "--method", "exact"},
		{"table", "b", "--q", "4", "--method", "direct"},
		{"table", "h_n", "--q", "4"},
		{"table", "b", "--q", "4", "--n", "2"},
		{"table", "logz", "--q", "4"},
		{"table", "h_1", "--q", "4", "--beta", "10"},
		{"table", "logz", "--q", "4", "--beta", "-1"},
		{"table", "logz", "--q", "4", "--beta", "1e9"},
		{"table", "logz", "--q", "4", "--beta", "10", "--method", "resummed"},
		{"table", "h_1", "--q", "4", "--order", "1"},
		{"table", "--q", "4"},
		{"cache", "clear", "extra"},
	} {
		_, err := runCLI(t, args...)
		var ue *usageError
		if !errors.As(err, &ue) && !(err != nil && isUsageText(err.Error())) {
			t.Errorf("%v: got %v, want a usage error", args, err)
		}
	}
}

// log Z over q at fixed beta brings E and S beside it; at q = 2 the values
// are the free-fermion ones (checked against the exact semicircle integrals
// in expansion's TestTableThermo), here the document shape and
// S = log Z + beta E.
func TestTableLogZ(t *testing.T) {
	isolateCache(t)
	m := runJSON(t, "table", "logZ", "--q", "2,3", "--beta", "8")
	rows, ok := m["results"].([]any)
	if !ok || len(rows) != 2 {
		t.Fatalf("want 2 rows, got %v", m["results"])
	}
	for _, r := range rows {
		row := r.(map[string]any)
		get := func(k string) float64 {
			c, ok := row[k].(map[string]any)
			if !ok {
				t.Fatalf("row %v: no %s", row["q"], k)
			}
			v, err := strconv.ParseFloat(c["value"].(string), 64)
			if err != nil {
				t.Fatal(err)
			}
			return v
		}
		lz, e, s := get("logZ"), get("E"), get("S")
		if d := math.Abs(s - (lz + 8*e)); d > 1e-11 {
			t.Errorf("q = %v: S - (log Z + beta E) = %g", row["q"], d)
		}
	}
}

// isUsageText recognises cobra's own argument errors.
func isUsageText(s string) bool {
	return strings.HasPrefix(s, "unknown command") || strings.HasPrefix(s, "accepts ")
}

// The second run reads the series from the cache (XDG_CACHE_HOME points
// to a temporary directory); cache clear empties it and --no-cache stores
// nothing.
func TestTableCacheCommands(t *testing.T) {
	isolateCache(t)
	if _, err := runCLI(t, "table", "s0", "--q", "4", "--method", "resummed", "--no-cache"); err != nil {
		t.Fatal(err)
	}
	info := runJSON(t, "cache", "info")
	if files, _ := info["files"].([]any); len(files) != 0 {
		t.Fatalf("--no-cache stored %v", files)
	}
	if _, err := runCLI(t, "table", "s0", "--q", "4", "--method", "resummed"); err != nil {
		t.Fatal(err)
	}
	info = runJSON(t, "cache", "info")
	if files, _ := info["files"].([]any); len(files) != 2 {
		t.Fatalf("after a run the cache holds %v, want both ends of S_0", info["files"])
	}
	out, err := runCLI(t, "table", "s0", "--q", "4", "--method", "resummed", "--format", "json")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(out, "read from the cache") {
		t.Errorf("second run did not read the cache:\n%s", out)
	}
	cl := runJSON(t, "cache", "clear")
	if n, _ := cl["removed"].(string); n != "2" && cl["removed"] != float64(2) {
		t.Errorf("cache clear: %v", cl)
	}
}
