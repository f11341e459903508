package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strings"
	"testing"
)

// checkStatusOf is the exit status main gives a check: 0, 1 for a claim that
// fails (claimFailed) or a failed computation, 2 for bad input.
func checkStatusOf(err error) int {
	var cf *claimFailed
	var ue *usageError
	switch {
	case err == nil:
		return 0
	case errors.As(err, &cf):
		return 1
	case errors.As(err, &ue):
		return 2
	}
	return 1
}

// runCheckJSON runs check with --format json and decodes the document,
// whatever the exit status.
func runCheckJSON(t *testing.T, args ...string) (map[string]any, error) {
	t.Helper()
	out, err := runCLI(t, append(append([]string{"check"}, args...), "--format", "json")...)
	m := map[string]any{}
	if jerr := json.Unmarshal([]byte(out), &m); jerr != nil {
		t.Fatalf("%v: %v (%v)\n%s", args, jerr, err, out)
	}
	return m, err
}

// A true claim: the eps^2 coefficient of h_1 is -5/6 (PSLQ closed form,
// equal to the mpmath Taylor coefficient of testdata/conformal_golden.json).
// The JSON document has the keys of the check contract.
func TestCheckHoldsJSON(t *testing.T) {
	m, err := runCheckJSON(t, "h_1 = 4 - (5/6)*eps^2 + O(eps^4)")
	if err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"claim", "around", "variable", "orders", "holds_to", "first_disagreement", "values"} {
		if _, ok := m[k]; !ok {
			t.Errorf("no key %q in %v", k, m)
		}
	}
	if m["claim"] != "h_1 = 4 - (5/6)*eps^2 + O(eps^4)" || m["around"] != "2" || m["variable"] != "eps" || m["holds_to"] != "3" || m["first_disagreement"] != nil {
		t.Errorf("document %v", m)
	}
	orders, _ := m["orders"].([]any)
	if len(orders) != 4 {
		t.Fatalf("orders %v", orders)
	}
	for i, o := range orders {
		row := o.(map[string]any)
		if row["k"] != string(rune('0'+i)) || row["agrees"] != true {
			t.Errorf("order %d: %v", i, row)
		}
		for _, k := range []string{"difference", "error", "sigma"} {
			if _, ok := row[k].(string); !ok {
				t.Errorf("order %d: %s = %v, want a decimal string", i, k, row[k])
			}
		}
	}
	if v, ok := m["values"].([]any); !ok || len(v) != 0 {
		t.Errorf("values %v, want []", m["values"])
	}
}

// A false claim: the 1/q coefficient of h_1 is 4 (Maldacena-Stanford 2016,
// arXiv:1604.07818: h_n = 2n+1 + (2/q)(2n^2+n+1)/(2n^2+n-1) + O(1/q^2)), so
// 2 fails at order 1 by 2; the table is printed and the status is 1.
func TestCheckFailsJSON(t *testing.T) {
	m, err := runCheckJSON(t, "h_1 = 3 + 2/q + O(1/q^2)")
	if checkStatusOf(err) != 1 {
		t.Fatalf("status %d (%v), want 1", checkStatusOf(err), err)
	}
	f, ok := m["first_disagreement"].(map[string]any)
	if !ok || f["k"] != "1" || math.Abs(parseDecimal(t, f["difference"])-2) > 1e-14 {
		t.Fatalf("first disagreement %v", m["first_disagreement"])
	}
	if m["holds_to"] != "0" || m["around"] != "inf" || m["variable"] != "x" {
		t.Errorf("document %v", m)
	}
	out, _ := runCLI(t, "check", "h_1 = 3 + 2/q + O(1/q^2)")
	if !strings.Contains(out, "first fails at order 1: difference 2") || !strings.Contains(out, "NO") {
		t.Errorf("text output:\n%s", out)
	}
}

// --q evaluates both sides: h_1(4) = 3.7735 (published 3.77, MS 2016;
// mpmath 3.7735356186... in testdata/conformal_golden.json) against
// 4 - (5/6)(1/2)^2 = 3.7916666...
func TestCheckValues(t *testing.T) {
	m, err := runCheckJSON(t, "h_1 = 4 - (5/6)*eps^2 + O(eps^4)", "--q", "3,4")
	if err != nil {
		t.Fatal(err)
	}
	vals, _ := m["values"].([]any)
	if len(vals) != 2 {
		t.Fatalf("values %v", m["values"])
	}
	v := vals[1].(map[string]any)
	for _, k := range []string{"q", "lhs", "rhs", "difference", "error"} {
		if _, ok := v[k].(string); !ok {
			t.Errorf("values: %s = %v", k, v[k])
		}
	}
	lhs, rhs, d := parseDecimal(t, v["lhs"]), parseDecimal(t, v["rhs"]), parseDecimal(t, v["difference"])
	if v["q"] != "4" || math.Abs(lhs-3.7735356186376) > 1e-12 || math.Abs(rhs-(4-5.0/24)) > 1e-15 || math.Abs(d-(lhs-rhs)) > 1e-15 {
		t.Errorf("values at q = 4: %v", v)
	}
}

// A claim with no variable is checked at both ends (a list of documents).
func TestCheckBothEnds(t *testing.T) {
	m := runJSON(t, "check", "S_0 = S_0", "--order", "2")
	res, _ := m["results"].([]any)
	if len(res) != 2 || res[0].(map[string]any)["around"] != "2" || res[1].(map[string]any)["around"] != "inf" {
		t.Errorf("results %v", m["results"])
	}
}

// --file: one row per claim; comments and blank lines are skipped; a
// failing claim makes the status 1, a malformed one 2.
func TestCheckFile(t *testing.T) {
	dir := t.TempDir()
	write := func(name, text string) string {
		p := filepath.Join(dir, name)
		if err := os.WriteFile(p, []byte(text), 0o644); err != nil {
			t.Fatal(err)
		}
		return p
	}
	good := write("good.txt", "# large q, MS 2016\nh_1 = 3 + 4/q + O(1/q^2)\n\nS_0 = log(2)/2 - pi^2/(4*q^2) + O(1/q^3)  # PHYSICS sec. 5\n")
	m := runJSON(t, "check", "--file", good)
	res, _ := m["results"].([]any)
	if len(res) != 2 || res[0].(map[string]any)["line"] != "2" || res[1].(map[string]any)["line"] != "4" {
		t.Fatalf("results %v", m["results"])
	}
	bad := write("bad.txt", "h_1 = 3 + 4/q + O(1/q^2)\nh_1 = 3 + 2/q + O(1/q^2)\n")
	out, err := runCLI(t, "check", "--file", bad)
	if checkStatusOf(err) != 1 || !strings.Contains(out, "holds to order 1") || !strings.Contains(out, "first fails at order 1") {
		t.Errorf("status %d (%v):\n%s", checkStatusOf(err), err, out)
	}
	malformed := write("malformed.txt", "h_1 = 3 + 4/q + O(1/q^2)\nh_1 = 3 + foo\n")
	out, err = runCLI(t, "check", "--file", malformed)
	if checkStatusOf(err) != 2 || !strings.Contains(out, `malformed: at column 11: unknown name "foo"`) || !strings.Contains(err.Error(), "line 2") {
		t.Errorf("status %d (%v):\n%s", checkStatusOf(err), err, out)
	}
}

// Bad input: one-line usage errors, status 2, naming what is wrong.
func TestCheckBadInput(t *testing.T) {
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"check"}, "name a claim"},
		{[]string{"check", "h_1 = 4 + O(eps)", "--around", "3"}, "--around must be 2 or inf"},
		{[]string{"check", "h_1 = 4 + O(eps)", "--order", "-1"}, "--order must be between"},
		{[]string{"check", "h_1 = 4 + O(eps)", "--tol", "-1"}, "--tol must be"},
		{[]string{"check", "h_1 = 4 + O(eps)", "--tol", "abc"}, "--tol must be"},
		{[]string{"check", "h_1 = 4 + O(eps)", "--q", "1.5"}, "below 2"},
		{[]string{"check", "h_1 = 4 + O(eps)", "--q", "4,abc"}, "cannot read q"},
		{[]string{"check", "h_1 = 4 + O(eps)", "--q", "inf"}, "finite"},
		{[]string{"check", "h_1 = 4 + O(eps)", "--file", "x.txt"}, "not both"},
		{[]string{"check", "--file", "/nonexistent/claims.txt"}, "--file"},
		{[]string{"check", "h_1 = 4 - (5/6)*eps^2 + alpha_s2"}, `check: at column 25: unknown name "alpha_s2"; known quantities: h_1, h_2`},
		{[]string{"check", "h_1 = 4 - (5/6*eps^2"}, "check: at column 21: missing ) to close the ( at column 11"},
		{[]string{"check", "h_1 = 4 + O(eps^4)", "--order", "5"}, "--order 5 conflicts with O(eps^4)"},
		{[]string{"check", "h_1 = 4 + O(eps^4)", "--around", "inf"}, "is an order around q = 2, but --around inf"},
		{[]string{"check", "b = 1 + O(1/q)"}, "b is not a power series around q = inf"},
		{[]string{"check", "h_1 = 1/(eps - eps) + O(eps)"}, "at column 8: division by a series that vanishes"},
		{[]string{"check", "h_1 = log(eps - 1) + O(eps)"}, "at column 7: log of a series whose leading term -1 is not positive"},
		{[]string{"check", "E_0 = O(1/q^40)"}, "E_0 around q = inf to order 39"},
	}
	for _, c := range cases {
		_, err := runCLI(t, c.args...)
		if checkStatusOf(err) != 2 || !strings.Contains(err.Error(), c.want) || strings.Contains(err.Error(), "\n") {
			t.Errorf("%v: status %d, %v; want 2 and %q", c.args, checkStatusOf(err), err, c.want)
		}
	}
}

// The other formats carry the same table: CSV writes the orders table.
func TestCheckCSV(t *testing.T) {
	out, err := runCLI(t, "check", "h_1 = 4 - (5/6)*eps^2 + O(eps^4)", "--format", "csv")
	if err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSpace(out), "\n")
	if len(lines) != 5 || lines[0] != "k,LHS - RHS,error,sigma,agrees" || !strings.HasPrefix(lines[3], "2,0,") {
		t.Errorf("csv:\n%s", out)
	}
	if _, err := runCLI(t, "check", "h_1 = 4 - (5/6)*eps^2 + O(eps^4)", "--format", "tex"); err != nil {
		t.Error(err)
	}
}

// The exit statuses of the built binary: 0 when the claim holds, 1 when it
// fails (the table on stdout, nothing more on stderr), 2 for a malformed
// claim (one line on stderr).
func TestCheckExitStatus(t *testing.T) {
	if testing.Short() {
		t.Skip("builds the binary")
	}
	bin := filepath.Join(t.TempDir(), "qbridge")
	build := exec.Command(filepath.Join(runtime.GOROOT(), "bin", "go"), "build", "-o", bin, ".")
	if out, err := build.CombinedOutput(); err != nil {
		t.Fatalf("go build: %v\n%s", err, out)
	}
	for _, c := range []struct {
		claim  string
		status int
	}{
		{"h_1 = 4 - (5/6)*eps^2 + O(eps^4)", 0},
		{"h_1 = 4 - (4/5)*eps^2 + O(eps^4)", 1},
		{"h_1 = 4 - (5/6)*eps^2 + alpha_s2", 2},
	} {
		cmd := exec.Command(bin, "check", c.claim, "--quiet")
		var stdout, stderr bytes.Buffer
		cmd.Stdout, cmd.Stderr = &stdout, &stderr
		err := cmd.Run()
		status := 0
		var ee *exec.ExitError
		if errors.As(err, &ee) {
			status = ee.ExitCode()
		} else if err != nil {
			t.Fatal(err)
		}
		if status != c.status {
			t.Errorf("%s: exit status %d, want %d\n%s%s", c.claim, status, c.status, stdout.String(), stderr.String())
		}
		switch c.status {
		case 1:
			if !strings.Contains(stdout.String(), "first fails at order 2") || stderr.Len() != 0 {
				t.Errorf("%s: stdout %q, stderr %q", c.claim, stdout.String(), stderr.String())
			}
		case 2:
			if msg := stderr.String(); strings.Count(msg, "\n") != 1 || !strings.HasPrefix(msg, "qbridge: check: at column 25: unknown name") {
				t.Errorf("%s: stderr %q", c.claim, msg)
			}
		}
	}
}
