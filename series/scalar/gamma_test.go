package scalar

import (
	"encoding/json"
	"errors"
	"fmt"
	"math/big"
	"math/rand"
	"os"
	"os/exec"
	"strings"
	"testing"
)

// parseBig parses a decimal string at prec bits; it fails the test on error.
func parseBig(t testing.TB, s string, prec uint) *big.Float {
	t.Helper()
	v, _, err := big.ParseFloat(s, 10, prec, big.ToNearestEven)
	if err != nil {
		t.Fatalf("parse %q: %v", s, err)
	}
	return v
}

// closeTo reports whether got agrees with want to bits relative bits (or
// absolutely, when want is zero).
func closeTo(got, want *big.Float, bits int) bool {
	if got == nil || want == nil {
		return false
	}
	d := new(big.Float).SetPrec(got.Prec()+64).Sub(got, want)
	if d.Sign() == 0 {
		return true
	}
	if want.Sign() == 0 {
		return d.MantExp(nil) <= -bits
	}
	return d.MantExp(nil)-want.MantExp(nil) <= -bits
}

// checkClose fails the test unless got matches the decimal want to bits.
func checkClose(t *testing.T, what string, got *big.Float, want string, bits int) {
	t.Helper()
	w := parseBig(t, want, uint(bits)+64)
	if !closeTo(got, w, bits) {
		gs := "<nil>"
		if got != nil {
			gs = got.Text('g', bits/3)
		}
		t.Errorf("%s = %s\n want %s (to %d bits)", what, gs, want, bits)
	}
}

// golden is special_golden.json, written by testdata/gen_special.py (mpmath
// 1.3.0 at 80 digits).
type golden struct {
	Gamma    []struct{ X, V string } `json:"gamma"`
	LogGamma []struct{ X, V string } `json:"loggamma"`
	RGamma   []struct{ X, V string } `json:"rgamma"`
	Psi      []struct {
		M    int
		X, V string
	} `json:"psi"`
	Zeta        []struct{ S, A, V string } `json:"zeta"`
	RiemannZeta []struct{ S, V string }    `json:"riemann_zeta"`
	LGTaylor    []struct {
		X0 string   `json:"x0"`
		C  []string `json:"c"`
	} `json:"loggamma_taylor"`
	RGTaylorM3 []string `json:"rgamma_taylor_m3"`
	CLogGamma  []struct {
		Re, Im, Vre, Vim string
	} `json:"cloggamma"`
	Constants map[string]string `json:"constants"`
}

func loadGolden(t *testing.T) *golden {
	t.Helper()
	b, err := os.ReadFile("../../testdata/special_golden.json")
	if err != nil {
		t.Fatalf("golden file: %v (regenerate with testdata/gen_special.py)", err)
	}
	var g golden
	if err := json.Unmarshal(b, &g); err != nil {
		t.Fatal(err)
	}
	return &g
}

func TestGammaHandbookValues(t *testing.T) {
	const prec = 200
	cases := []struct {
		name string
		f    func(*big.Float, uint) (*big.Float, error)
		x    string
		want string
	}{
		// DLMF 5.4.6: Gamma(1/2) = sqrt(pi); digits of sqrt(pi) from memory (also in the golden file).
		{"Gamma", BigGamma, "0.5", "1.7724538509055160272981674833411451827975494561223871282138"},
		// Gamma(1/4), DLMF 5.4 (value from memory, also checked against mpmath in the golden file).
		{"Gamma", BigGamma, "0.25", "3.6256099082219083119306851558676720029951676828800654674333"},
		// DLMF 5.4.12: psi(1) = -gamma; Euler gamma from OEIS A001620, from memory.
		{"psi", BigDigamma, "1", "-0.57721566490153286060651209008240243104215933593992359880576723"},
		// Abramowitz & Stegun Table 6.1 (Gamma on [1,2]), entries from memory.
		{"Gamma", BigGamma, "1.5", "0.88622692545275801364908374167057259139877472806119356410690"},
		// Abramowitz & Stegun Table 6.1, log Gamma column at x = 1.5, from memory.
		{"lnGamma", BigLogGamma, "1.5", "-0.12078223763524522234551844578164721225185272790259946836387"},
		// Abramowitz & Stegun Table 6.2 (psi on [1,2]) at x = 2: 1 - gamma, from memory.
		{"psi", BigDigamma, "2", "0.42278433509846713939348790991759756895784066406007640119424"},
	}
	for _, c := range cases {
		got, err := c.f(parseBig(t, c.x, prec), prec)
		if err != nil {
			t.Errorf("%s(%s): %v", c.name, c.x, err)
			continue
		}
		checkClose(t, c.name+"("+c.x+")", got, c.want, 185)
	}
	// Abramowitz & Stegun Table 6.1 gives Gamma to 10 decimals on [1, 2];
	// entries from memory.
	for _, c := range []struct{ x, want string }{{"1.25", "0.9064024771"}, {"1.75", "0.9190625268"}, {"1.1", "0.9513507699"}} {
		got, err := BigGamma(parseBig(t, c.x, prec), prec)
		if err != nil {
			t.Fatal(err)
		}
		d := new(big.Float).Sub(got, parseBig(t, c.want, prec))
		if d.Abs(d).Cmp(big.NewFloat(6e-11)) > 0 {
			t.Errorf("Gamma(%s) = %s, A&S Table 6.1 has %s", c.x, got.Text('g', 15), c.want)
		}
	}
	// DLMF 5.4.13: psi(1/2) = -gamma - 2 ln 2, with gamma from OEIS A001620
	// (from memory) and ln 2 from Ln2.
	eg := parseBig(t, "0.57721566490153286060651209008240243104215933593992359880576723", prec)
	want12 := Ln2(prec)
	want12.Mul(want12, big.NewFloat(-2))
	want12.Sub(want12, eg)
	if got, err := BigDigamma(big.NewFloat(0.5), prec); err != nil || !closeTo(got, want12, 195) {
		t.Errorf("psi(1/2) = %v (%v), want -gamma - 2 ln 2 = %s", got, err, want12.Text('g', 40))
	}
	// psi'(1) = pi^2/6 (DLMF 5.15.2 with zeta(2) = pi^2/6, DLMF 25.6.1).
	got, err := BigPolygamma(1, big.NewFloat(1), prec)
	if err != nil {
		t.Fatal(err)
	}
	want := Pi(prec + 20)
	want.Mul(want, want)
	want.Quo(want, big.NewFloat(6))
	if !closeTo(got, want, 195) {
		t.Errorf("psi'(1) = %s, want pi^2/6", got.Text('g', 40))
	}
}

func TestGammaGolden(t *testing.T) {
	g := loadGolden(t)
	const prec, bits = 256, 250
	for _, c := range g.Gamma { // mpmath.gamma
		v, err := BigGamma(parseBig(t, c.X, 512), prec)
		if err != nil {
			t.Errorf("Gamma(%s): %v", c.X, err)
			continue
		}
		checkClose(t, "Gamma("+c.X+")", v, c.V, bits)
	}
	for _, c := range g.LogGamma { // log|mpmath.gamma|
		v, err := BigLogGamma(parseBig(t, c.X, 512), prec)
		if err != nil {
			t.Errorf("LogGamma(%s): %v", c.X, err)
			continue
		}
		checkClose(t, "LogGamma("+c.X+")", v, c.V, bits)
	}
	for _, c := range g.RGamma { // mpmath.rgamma, exact zeros at poles
		checkClose(t, "RGamma("+c.X+")", BigRGamma(parseBig(t, c.X, 512), prec), c.V, bits)
	}
	for _, c := range g.Psi { // mpmath.psi(m, x)
		v, err := BigPolygamma(c.M, parseBig(t, c.X, 512), prec)
		if err != nil {
			t.Errorf("psi(%d, %s): %v", c.M, c.X, err)
			continue
		}
		checkClose(t, fmt.Sprintf("psi(%d, %s)", c.M, c.X), v, c.V, bits)
	}
}

func TestGammaIdentities100Digits(t *testing.T) {
	const prec = 340 // > 100 digits
	const bits = 330
	for _, xs := range []string{"0.3", "2.71828", "17.5", "-3.4", "0.001", "-0.75"} {
		x := parseBig(t, xs, prec)
		g, err := BigGamma(x, prec)
		if err != nil {
			t.Fatal(err)
		}
		// DLMF 5.5.1: Gamma(x+1) = x Gamma(x).
		x1 := new(big.Float).SetPrec(prec).Add(x, big.NewFloat(1))
		g1, err := BigGamma(x1, prec)
		if err != nil {
			t.Fatal(err)
		}
		if !closeTo(g1, new(big.Float).SetPrec(prec).Mul(x, g), bits) {
			t.Errorf("Gamma(x+1) != x Gamma(x) at x = %s", xs)
		}
		// DLMF 5.5.3: Gamma(x) Gamma(1-x) = pi / sin(pi x).
		omx := new(big.Float).SetPrec(prec).Sub(big.NewFloat(1), x)
		gm, err := BigGamma(omx, prec)
		if err != nil {
			t.Fatal(err)
		}
		lhs := new(big.Float).SetPrec(prec).Mul(g, gm)
		s, _ := BigSinCos(new(big.Float).SetPrec(prec).Mul(Pi(prec), x), prec)
		rhs := new(big.Float).SetPrec(prec).Quo(Pi(prec), s)
		if !closeTo(lhs, rhs, bits-20) {
			t.Errorf("reflection fails at x = %s: %s vs %s", xs, lhs.Text('g', 30), rhs.Text('g', 30))
		}
		// DLMF 5.5.5: Gamma(2x) = pi^(-1/2) 2^(2x-1) Gamma(x) Gamma(x+1/2).
		x2 := new(big.Float).SetPrec(prec).Mul(x, big.NewFloat(2))
		g2, err := BigGamma(x2, prec)
		if err != nil {
			t.Fatal(err)
		}
		xh := new(big.Float).SetPrec(prec).Add(x, big.NewFloat(0.5))
		gh, err := BigGamma(xh, prec)
		if err != nil {
			t.Fatal(err)
		}
		e := new(big.Float).SetPrec(prec).Sub(x2, big.NewFloat(1))
		p2, _ := BigPow(new(big.Float).SetPrec(prec).SetInt64(2), e, prec)
		dup := new(big.Float).SetPrec(prec).Mul(g, gh)
		dup.Mul(dup, p2)
		sp := Pi(prec)
		dup.Quo(dup, sp.Sqrt(sp))
		if !closeTo(g2, dup, bits-10) {
			t.Errorf("duplication fails at x = %s", xs)
		}
	}
}

func TestGammaPrecisionControl(t *testing.T) {
	// Values at 64, 256 and 1024 bits must agree to the lower precision.
	x := parseBig(t, "0.3183098861837906715377675", 1024)
	fns := map[string]func(*big.Float, uint) (*big.Float, error){
		"Gamma": BigGamma, "LogGamma": BigLogGamma, "Digamma": BigDigamma,
		"Trigamma": func(x *big.Float, p uint) (*big.Float, error) { return BigPolygamma(1, x, p) },
	}
	for name, f := range fns {
		var prev *big.Float
		var prevPrec uint
		for _, p := range []uint{64, 256, 1024} {
			v, err := f(x, p)
			if err != nil {
				t.Fatalf("%s at %d bits: %v", name, p, err)
			}
			if prev != nil && !closeTo(prev, v, int(prevPrec)-1) {
				t.Errorf("%s: %d-bit value %s disagrees with %d-bit %s", name, prevPrec, prev.Text('g', 20), p, v.Text('g', 20))
			}
			prev, prevPrec = v, p
		}
	}
}

func TestGammaNearZerosOfLogGammaAndDigamma(t *testing.T) {
	// Relative accuracy where the result is tiny: log Gamma(1 + 1e-40) ~
	// -gamma 1e-40 and psi near its zero 1.46163... (reference: mpmath,
	// python3 -c "from mpmath import *; mp.dps=60; print(loggamma(1+mpf('1e-40')))").
	const prec = 128
	x := parseBig(t, "1.0000000000000000000000000000000000000001", 300)
	v, err := BigLogGamma(x, prec)
	if err != nil {
		t.Fatal(err)
	}
	checkClose(t, "LogGamma(1+1e-40)", v, "-5.7721566490153286060651209008240243104133686932345e-41", 120)
	if v, err := BigLogGamma(big.NewFloat(2), prec); err != nil || v.Sign() != 0 {
		t.Errorf("LogGamma(2) = %v, %v; want exactly 0 (Gamma(2) = 1)", v, err)
	}
}

func TestGammaBadInput(t *testing.T) {
	poles := []*big.Float{big.NewFloat(0), big.NewFloat(-1), big.NewFloat(-17)}
	for _, x := range poles {
		if _, err := BigGamma(x, 64); !errors.Is(err, ErrPole) {
			t.Errorf("Gamma(%v): err = %v, want ErrPole", x, err)
		}
		if _, err := BigLogGamma(x, 64); !errors.Is(err, ErrPole) {
			t.Errorf("LogGamma(%v): want ErrPole", x)
		}
		if _, err := BigDigamma(x, 64); !errors.Is(err, ErrPole) {
			t.Errorf("Digamma(%v): want ErrPole", x)
		}
		if _, err := BigPolygamma(2, x, 64); !errors.Is(err, ErrPole) {
			t.Errorf("Polygamma(2, %v): want ErrPole", x)
		}
		if r := BigRGamma(x, 64); r == nil || r.Sign() != 0 {
			t.Errorf("RGamma(%v) = %v, want exactly 0", x, r)
		}
	}
	if _, err := BigPolygamma(-1, big.NewFloat(1), 64); err == nil {
		t.Error("Polygamma(-1, 1): want error")
	}
	for _, f := range []func(*big.Float, uint) (*big.Float, error){BigGamma, BigLogGamma, BigDigamma} {
		if _, err := f(big.NewFloat(1.5), 0); !errors.Is(err, ErrPrec) {
			t.Errorf("zero precision: err = %v, want ErrPrec", err)
		}
		if _, err := f(nil, 64); err == nil {
			t.Error("nil argument: want error")
		}
		if _, err := f(new(big.Float).SetInf(false), 64); err == nil {
			t.Error("+Inf argument: want error")
		}
	}
	if BigRGamma(big.NewFloat(2), 0) != nil {
		t.Error("RGamma at zero precision: want nil")
	}
	if _, err := BigGamma(big.NewFloat(1e10), 64); !errors.Is(err, ErrDomain) {
		t.Errorf("Gamma(1e10) overflows: err = %v, want ErrDomain", err)
	}
}

// TestGammaLiveMpmath compares with mpmath on fresh random points, when
// python3 and mpmath are available.
func TestGammaLiveMpmath(t *testing.T) {
	if testing.Short() {
		t.Skip("short mode")
	}
	if _, err := exec.LookPath("python3"); err != nil {
		t.Skip("python3 not found; skipping the live mpmath cross-check")
	}
	if err := exec.Command("python3", "-c", "import mpmath").Run(); err != nil {
		t.Skip("mpmath not importable; skipping the live mpmath cross-check")
	}
	const prec, bits = 220, 210
	rng := rand.New(rand.NewSource(rand.Int63()))
	var xs []string
	for i := 0; i < 4; i++ {
		xs = append(xs, fmt.Sprintf("%.15g", rng.Float64()*20-8))
	}
	script := `
import sys
from mpmath import mp, mpf, gamma, loggamma, psi, zeta, log
mp.dps = 70
for x in sys.argv[1:]:
    v = mpf(x)
    print(x, mp.nstr(gamma(v), 70), mp.nstr(log(abs(gamma(v))), 70), mp.nstr(psi(0, v), 70),
          mp.nstr(psi(2, v), 70), mp.nstr(zeta(mpf('3.5'), abs(v) + mpf('0.1')), 70))
`
	out, err := exec.Command("python3", append([]string{"-c", script}, xs...)...).Output()
	if err != nil {
		t.Fatalf("python3: %v", err)
	}
	for _, line := range strings.Split(strings.TrimSpace(string(out)), "\n") {
		f := strings.Fields(line)
		x := parseBig(t, f[0], 400) // the decimal, exactly as mpmath reads it
		g, err1 := BigGamma(x, prec)
		lg, err2 := BigLogGamma(x, prec)
		d, err3 := BigDigamma(x, prec)
		p2, err4 := BigPolygamma(2, x, prec)
		a := new(big.Float).SetPrec(400).Abs(x)
		a.Add(a, parseBig(t, "0.1", 400))
		z, err5 := BigHurwitzZeta(big.NewFloat(3.5), a, prec)
		if err := errors.Join(err1, err2, err3, err4, err5); err != nil {
			t.Fatalf("x = %s: %v", f[0], err)
		}
		checkClose(t, "Gamma("+f[0]+")", g, f[1], bits)
		checkClose(t, "LogGamma("+f[0]+")", lg, f[2], bits-8)
		checkClose(t, "psi("+f[0]+")", d, f[3], bits-8)
		checkClose(t, "psi2("+f[0]+")", p2, f[4], bits)
		checkClose(t, "zeta(3.5, |x|+0.1) at x = "+f[0], z, f[5], bits)
	}
}
