package claim

import (
	"math/big"
	"math/rand/v2"
	"testing"

	"qbridge/series"
)

const testPrec = 200

// randomLaurent returns a series with coefficients in [-2, 2] (the constant
// term in [1, 2], so that log, sqrt, 1/a and Gamma are defined) and error
// bounds of relative size 1e-8.
func randomLaurent(rng *rand.Rand, n int) *Laurent {
	v, e := zeros(n, testPrec), zeros(n, testPrec)
	for k := range n {
		x := 4*rng.Float64() - 2
		if k == 0 {
			x = 1 + rng.Float64()
		}
		v[k].SetFloat64(x)
		e[k].SetFloat64(1e-8 * (0.1 + rng.Float64()))
	}
	vs, _ := series.FromBig(testPrec, v)
	es, _ := series.FromBig(testPrec, e)
	return &Laurent{Lo: 0, Val: vs, Err: es}
}

// perturb returns a with every coefficient moved by a random amount within
// its error bound (the error-free series the bound must account for).
func perturb(rng *rand.Rand, a *Laurent) *Laurent {
	v := a.Val.Coeffs()
	for k := range v {
		d := a.Err.Coeff(k)
		d.Mul(d, big.NewFloat(2*rng.Float64()-1))
		v[k].Add(v[k], d)
	}
	vs, _ := series.FromBig(testPrec, v)
	es, _ := series.New(len(v), testPrec)
	return &Laurent{Lo: a.Lo, Val: vs, Err: es}
}

// The propagated error bounds cover the true error: for random inputs with
// error bounds, and inputs moved anywhere within them, every coefficient of
// the result moves by no more than its stated bound (times 1.01: the bounds
// are first order, the moves 1e-8 relative, so second-order terms are
// 1e-8 of the bound). The exact result is computed from the moved inputs
// at the same precision.
func TestPropagationCoversTrueError(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	ops := map[string]func(a, b *Laurent) (*Laurent, error){
		"add":   func(a, b *Laurent) (*Laurent, error) { return add(a, b, false) },
		"sub":   func(a, b *Laurent) (*Laurent, error) { return add(a, b, true) },
		"mul":   func(a, b *Laurent) (*Laurent, error) { return mul(a, b), nil },
		"div":   div,
		"pow-3": func(a, _ *Laurent) (*Laurent, error) { return intPow(a, -3, 8) },
		"pow5":  func(a, _ *Laurent) (*Laurent, error) { return intPow(a, 5, 8) },
		"sqrt":  func(a, _ *Laurent) (*Laurent, error) { return apply("sqrt", a) },
		"pow2/3": func(a, _ *Laurent) (*Laurent, error) {
			return realPow(a, big.NewRat(2, 3))
		},
	}
	for _, f := range []string{"exp", "log", "sin", "cos", "tan", "Gamma", "psi"} {
		ops[f] = func(a, _ *Laurent) (*Laurent, error) { return apply(f, a) }
	}
	ratio := new(big.Float)
	for name, op := range ops {
		worst := 0.0
		for trial := 0; trial < 20; trial++ {
			a, b := randomLaurent(rng, 9), randomLaurent(rng, 9)
			got, err := op(a, b)
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			for move := 0; move < 5; move++ {
				exact, err := op(perturb(rng, a), perturb(rng, b))
				if err != nil {
					t.Fatalf("%s: %v", name, err)
				}
				for k := got.Lo; k <= got.Hi(); k++ {
					v, e := got.Coeff(k)
					w, _ := exact.Coeff(k)
					d := new(big.Float).Sub(v, w)
					d.Abs(d)
					r, _ := ratio.Quo(d, e).Float64()
					worst = max(worst, r)
					if r > 1.01 {
						t.Errorf("%s, coefficient %d: moved by %s, bound %s", name, k, d.Text('e', 3), e.Text('e', 3))
					}
				}
			}
		}
		t.Logf("%s: largest move / bound = %.3f", name, worst)
	}
}

// Laurent bookkeeping: around q = infinity q = 1/x has a pole that x^2
// cancels, and 1/eps^2 times eps^3 is eps (exact series, exact zeros below).
func TestLaurentPowers(t *testing.T) {
	ev := NewEvaluator(30)
	for _, c := range []struct {
		claim string
		lo    int
	}{
		{"q*x^2 = x", 1},
		{"eps^3/eps^2 = eps", 1},
		{"q^2 = 1/x^2", -2},
	} {
		cl, err := Parse(c.claim)
		if err != nil {
			t.Fatal(err)
		}
		pl, err := cl.Plan(nil, 4)
		if err != nil {
			t.Fatal(err)
		}
		r, err := ev.Check(cl, pl.Ends[0], 4, nil)
		if err != nil {
			t.Fatalf("%s: %v", c.claim, err)
		}
		if !r.Holds() {
			t.Errorf("%s: %s", c.claim, r.Verdict(6))
		}
		l, _ := strip(r.LHS)
		if l.Lo != c.lo {
			t.Errorf("%s: LHS starts at t^%d, want t^%d", c.claim, l.Lo, c.lo)
		}
	}
}
