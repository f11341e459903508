package main

import (
	"math"
	"os/exec"
	"strconv"
	"strings"
	"testing"
)

func jsonFloat(t *testing.T, m map[string]any, key string) float64 {
	t.Helper()
	s, ok := m[key].(string)
	if !ok {
		t.Fatalf("key %q missing or not a string in %v", key, m)
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("key %q: %v", key, err)
	}
	return v
}

// The nearest singularity of h_1 around q = 2: a square-root branch point
// at |eps| = 0.9648 where h_1 and h_2 collide (the value the issue that
// asked for this command quotes, from an independent computation; 4
// digits). Around infinity the nearest pair has |x| = 0.331, just below
// x = 1/3 (q = 3): the 1/q series does not converge at q = 3.
func TestSingularitiesNearest(t *testing.T) {
	cases := []struct {
		args    []string
		modulus float64
		tol     float64
		levels  string
	}{
		{[]string{"singularities", "h_1", "--around", "2"}, 0.9648, 1e-4, "h_1 and h_2"},
		{[]string{"singularities", "dims", "--n", "1", "--around", "inf"}, 0.331, 1e-3, "h_1 and h_2"},
	}
	for _, c := range cases {
		m := runJSON(t, c.args...)
		sing, ok := m["singularities"].([]any)
		if !ok || len(sing) == 0 {
			t.Fatalf("%v: no singularities in %v", c.args, m)
		}
		s := sing[0].(map[string]any)
		if got := jsonFloat(t, s, "modulus"); math.Abs(got-c.modulus) > c.tol {
			t.Errorf("%v: modulus %g, want %g +- %g", c.args, got, c.modulus, c.tol)
		}
		if e := jsonFloat(t, s, "modulus_error"); !(e > 0 && e < 1e-15) {
			t.Errorf("%v: modulus error %g, want a small positive number", c.args, e)
		}
		if s["levels"] != c.levels || s["type"] != "square-root branch point" {
			t.Errorf("%v: levels %v, type %v", c.args, s["levels"], s["type"])
		}
	}
}

// At the printed point (q*, h*) two roots of k_A(h) = 1 collide: k_A = 1
// and dk_A/dh = 0, checked by mpmath with the kernel of Maldacena and
// Stanford 2016 (arXiv:1604.07818, as quoted in the physics brief,
// section 4), evaluated at complex q and h by mpmath alone.
func TestSingularitiesAreCollisionsMpmath(t *testing.T) {
	if testing.Short() {
		t.Skip("short mode")
	}
	if err := exec.Command("python3", "-c", "import mpmath").Run(); err != nil {
		t.Skip("python3 with mpmath not available; skipping the live check")
	}
	for _, args := range [][]string{
		{"singularities", "h_1", "--around", "2", "--digits", "25"},
		{"singularities", "h_2", "--around", "inf", "--digits", "25"},
	} {
		m := runJSON(t, args...)
		s := m["singularities"].([]any)[0].(map[string]any)
		in := []string{s["q_re"].(string), s["q_im"].(string), s["h_re"].(string), s["h_im"].(string)}
		script := `
import sys
from mpmath import mp, mpf, mpc, gamma, diff
mp.dps = 40
q = mpc(mpf(sys.argv[1]), mpf(sys.argv[2])); h0 = mpc(mpf(sys.argv[3]), mpf(sys.argv[4]))
D = 1/q
def kA(h):
    pre = -(q-1)*gamma(1.5-D)*gamma(1-D)/(gamma(0.5+D)*gamma(D))
    return pre*gamma(D+h/2)*gamma(0.5+D-h/2)/(gamma(1.5-D-h/2)*gamma(1-D+h/2))
print(mp.nstr(abs(kA(h0)-1), 5), mp.nstr(abs(diff(kA, h0)), 5))
`
		out, err := exec.Command("python3", append([]string{"-c", script}, in...)...).Output()
		if err != nil {
			t.Fatalf("python3: %v", err)
		}
		f := strings.Fields(string(out))
		// 25 printed digits: both residuals must be at that level.
		for i, what := range []string{"|k_A - 1|", "|dk_A/dh|"} {
			v, _ := strconv.ParseFloat(f[i], 64)
			if !(v < 1e-20) {
				t.Errorf("%v: %s = %s at the printed point", args, what, f[i])
			}
		}
	}
}

// b and S_0 from their closed forms: S_0 around infinity has logarithmic
// branch points at the poles x = -1/2 and 3/2 of the integrand
// pi (1/2 - x) tan(pi x) (PHYSICS.md section 4).
func TestSingularitiesClosedForm(t *testing.T) {
	m := runJSON(t, "singularities", "s0", "--around", "inf")
	s := m["singularities"].([]any)
	if got := jsonFloat(t, s[0].(map[string]any), "point_re"); got != -0.5 {
		t.Errorf("nearest S_0 singularity at x = %g, want -1/2", got)
	}
	if got := jsonFloat(t, s[1].(map[string]any), "point_re"); got != 1.5 {
		t.Errorf("next S_0 singularity at x = %g, want 3/2", got)
	}
	for _, f := range []string{"text", "csv", "tex"} {
		if _, err := runCLI(t, "singularities", "b", "--around", "2", "--format", f); err != nil {
			t.Errorf("format %s: %v", f, err)
		}
	}
}

func TestSingularitiesBadInput(t *testing.T) {
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"singularities", "e0"}, "no exact singularity map"},
		{[]string{"singularities", "alpha_S"}, "no exact singularity map"},
		{[]string{"singularities", "h_1", "--count", "0"}, "--count must be between"},
		{[]string{"singularities", "h_1", "--count", "-3"}, "--count must be between"},
		{[]string{"singularities", "h_1", "--around", "3"}, "--around must be 2 or inf"},
		{[]string{"singularities", "dims", "--n", "-1"}, "--n"},
		{[]string{"singularities", "b", "--n", "2"}, "--n does not apply"},
		{[]string{"singularities"}, "name one quantity"},
	}
	for _, c := range cases {
		_, err := runCLI(t, c.args...)
		if err == nil || exitStatus(err) != 2 || !strings.Contains(err.Error(), c.want) || strings.Contains(err.Error(), "\n") {
			t.Errorf("%v: got %v (status %d), want a one-line usage error containing %q", c.args, err, exitStatus(err), c.want)
		}
	}
}
