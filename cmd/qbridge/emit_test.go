package main

import (
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// emitQ are the points the emitted functions are evaluated at.
var emitQ = []string{"2", "2.5", "3", "4", "7.5", "20", "inf"}

// resummedAt returns qbridge's own two-point values and errors at emitQ.
func resummedAt(t *testing.T, name, order string) (vals, errs []float64) {
	t.Helper()
	out, err := runCLI(t, "table", name, "--q", strings.Join(emitQ, ","), "--method", "resummed", "--order", order, "--format", "json")
	if err != nil {
		t.Fatal(err)
	}
	for _, r := range tableRows(t, out) {
		for k, v := range r {
			if k == "q" {
				continue
			}
			c := v.(map[string]any)
			f, _ := decimal(t, c["value"]).Float64()
			e := 0.0
			if c["error"] != nil {
				e, _ = decimal(t, c["error"]).Float64()
			}
			vals, errs = append(vals, f), append(errs, e)
		}
	}
	return vals, errs
}

// runEmitted runs the emitted code in its language and returns its values
// at emitQ; ok is false when the language is not installed.
func runEmitted(t *testing.T, lang, code, fn string) ([]float64, bool) {
	t.Helper()
	dir := t.TempDir()
	var cmd *exec.Cmd
	qs := make([]string, len(emitQ))
	for i, q := range emitQ {
		qs[i] = q
		if q == "inf" {
			qs[i] = map[string]string{"go": "math.Inf(1)", "c": "INFINITY", "python": "math.inf"}[lang]
		}
	}
	switch lang {
	case "go":
		src := "package main\n\nimport (\n\t\"errors\"\n\t\"fmt\"\n\t\"math\"\n)\n\nvar _ = errors.New\n\n" + code +
			"\nfunc main() {\n\tfor _, q := range []float64{" + strings.Join(qs, ", ") + "} {\n\t\tv, err := " + fn + "(q)\n\t\tif err != nil {\n\t\t\tpanic(err)\n\t\t}\n\t\tfmt.Printf(\"%.17g\\n\", v)\n\t}\n}\n"
		path := filepath.Join(dir, "main.go")
		if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
			t.Fatal(err)
		}
		cmd = exec.Command("go", "run", path)
		cmd.Env = append(os.Environ(), "GOWORK=off", "GOFLAGS=")
	case "c":
		cc, err := exec.LookPath("cc")
		if err != nil {
			t.Logf("skipped C: no cc on this machine")
			return nil, false
		}
		src := code + "\n#include <stdio.h>\nint main(void)\n{\n    double qs[] = {" + strings.Join(qs, ", ") + "};\n    int i;\n    for (i = 0; i < " + strconv.Itoa(len(qs)) + "; i++)\n        printf(\"%.17g\\n\", " + fn + "(qs[i]));\n    return 0;\n}\n"
		path := filepath.Join(dir, "f.c")
		if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
			t.Fatal(err)
		}
		bin := filepath.Join(dir, "f")
		if out, err := exec.Command(cc, "-std=c99", "-Wall", "-Werror", "-o", bin, path, "-lm").CombinedOutput(); err != nil {
			t.Fatalf("cc: %v\n%s\n%s", err, out, src)
		}
		cmd = exec.Command(bin)
	case "python":
		py, err := exec.LookPath("python3")
		if err != nil {
			t.Logf("skipped Python: no python3 on this machine")
			return nil, false
		}
		src := code + "\n\nfor q in [" + strings.Join(qs, ", ") + "]:\n    print(repr(" + fn + "(q)))\n"
		path := filepath.Join(dir, "f.py")
		if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
			t.Fatal(err)
		}
		cmd = exec.Command(py, path)
	}
	out, err := cmd.CombinedOutput()
	if err != nil {
		t.Fatalf("%s: %v\n%s", lang, err, out)
	}
	var vals []float64
	for _, l := range strings.Fields(string(out)) {
		v, err := strconv.ParseFloat(l, 64)
		if err != nil {
			t.Fatalf("%s output %q", lang, l)
		}
		vals = append(vals, v)
	}
	if len(vals) != len(emitQ) {
		t.Fatalf("%s: %d values, want %d\n%s", lang, len(vals), len(emitQ), out)
	}
	return vals, true
}

// The emitted Go, C and Python functions, run by their own toolchains,
// reproduce qbridge's two-point values within the stated errors (plus
// float64 rounding) at q = 2 ... infinity; the header states the check.
func TestEmitRuns(t *testing.T) {
	isolateCache(t)
	for _, c := range []struct {
		name, order string
		fn          map[string]string
	}{
		{"h_1", "12", map[string]string{"go": "H1", "c": "qbridge_h1", "python": "h1"}},
		{"b", "12", map[string]string{"go": "B", "c": "qbridge_b", "python": "b"}},
		{"s0", "10", map[string]string{"go": "S0", "c": "qbridge_S0", "python": "s0"}},
	} {
		want, werr := resummedAt(t, c.name, c.order)
		for _, lang := range []string{"go", "c", "python"} {
			code, err := runCLI(t, "resum", c.name, "--emit", lang, "--order", c.order)
			if err != nil {
				t.Fatal(err)
			}
			if !strings.Contains(code, "max |error| =") || !strings.Contains(code, "qbridge resum "+c.name) || !strings.Contains(code, "x = 1/q") {
				t.Errorf("%s %s: header incomplete:\n%s", c.name, lang, code)
			}
			got, ok := runEmitted(t, lang, code, c.fn[lang])
			if !ok {
				continue
			}
			for i, q := range emitQ {
				tol := werr[i] + 4e-15*math.Max(1, math.Abs(want[i]))
				if d := math.Abs(got[i] - want[i]); !(d <= tol) {
					t.Errorf("%s %s q=%s: emitted %v, qbridge %v ± %v", c.name, lang, q, got[i], want[i], werr[i])
				}
			}
		}
	}
}

// --emit json: coefficients as decimal strings, the variable, the check.
func TestEmitJSON(t *testing.T) {
	isolateCache(t)
	out, err := runCLI(t, "resum", "h_2", "--emit", "json", "--order", "8")
	if err != nil {
		t.Fatal(err)
	}
	var doc map[string]any
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("%v\n%s", err, out)
	}
	num, _ := doc["numerator"].([]any)
	den, _ := doc["denominator"].([]any)
	if doc["variable"] != "x = 1/q" || len(num) == 0 || len(den) == 0 || den[0] != "1.0e+00" && den[0] != "1e+00" {
		t.Errorf("document: %v", doc)
	}
	// P(0)/Q(0) is h_2 at q = infinity, 2n+1 = 5 (PHYSICS sec. 4).
	p0, _ := strconv.ParseFloat(num[0].(string), 64)
	q0, _ := strconv.ParseFloat(den[0].(string), 64)
	if math.Abs(p0/q0-5) > 1e-14 {
		t.Errorf("R(0) = %v, want h_2(inf) = 5", p0/q0)
	}
	for _, bad := range [][]string{{"resum", "h_1", "--emit", "fortran"}, {"resum", "h_1", "--emit", "go", "--q", "4"}, {"resum", "dims", "--n", "1,2", "--emit", "go"}} {
		if _, err := runCLI(t, bad...); err == nil {
			t.Errorf("%v: no error", bad)
		}
	}
}

// E_0 emitted as Python against qbridge's value (ground series at low
// order and three direct solves for the check: slow).
func TestEmitEnergyPython(t *testing.T) {
	if testing.Short() {
		t.Skip("ground series and direct solves take many seconds")
	}
	isolateCache(t)
	want, werr := resummedAt(t, "e0", "4")
	code, err := runCLI(t, "resum", "e0", "--emit", "python", "--order", "4")
	if err != nil {
		t.Fatal(err)
	}
	got, ok := runEmitted(t, "python", code, "e0")
	if !ok {
		return
	}
	for i, q := range emitQ {
		if d := math.Abs(got[i] - want[i]); !(d <= werr[i]+1e-15) {
			t.Errorf("E_0 python q=%s: emitted %v, qbridge %v ± %v", q, got[i], want[i], werr[i])
		}
	}
}
