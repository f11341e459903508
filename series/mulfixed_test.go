package series

import (
	"math/big"
	"math/rand"
	"testing"
)

// exactProduct returns the first n coefficients of a*b in exact rational
// arithmetic (math/big.Rat, the outside reference), and the sums of the
// absolute values of the terms, which bound the rounding of any summation
// order.
func exactProduct(a, b []*big.Float, n int) (c, mag []*big.Rat) {
	c, mag = make([]*big.Rat, n), make([]*big.Rat, n)
	for m := 0; m < n; m++ {
		c[m], mag[m] = new(big.Rat), new(big.Rat)
		for i := 0; i <= m; i++ {
			if i >= len(a) || m-i >= len(b) {
				continue
			}
			x, _ := a[i].Rat(nil)
			y, _ := b[m-i].Rat(nil)
			t := new(big.Rat).Mul(x, y)
			c[m].Add(c[m], t)
			mag[m].Add(mag[m], t.Abs(t))
		}
	}
	return c, mag
}

// randomCoeffs returns n coefficients c_k = +-(1 + u) 2^(g k + j) with
// growth g, random signs and jitter j in [-jit, jit], and a fraction of
// exact zeros and of tiny entries 2^-tiny times the envelope (the rounding
// noise of coefficients that vanish in exact arithmetic).
func randomCoeffs(rng *rand.Rand, n int, prec uint, g float64, jit, tiny int, zeros float64) []*big.Float {
	out := make([]*big.Float, n)
	for k := range out {
		out[k] = new(big.Float).SetPrec(prec)
		switch r := rng.Float64(); {
		case r < zeros:
			continue
		case r < 2*zeros && tiny > 0:
			out[k].SetMantExp(big.NewFloat(1+rng.Float64()), int(g*float64(k))-tiny)
		default:
			m := new(big.Float).SetPrec(prec).SetInt64(rng.Int63())
			m.Quo(m, new(big.Float).SetPrec(prec).SetInt64(1<<62))
			m.Add(m, big.NewFloat(1))
			out[k].SetMantExp(m, int(g*float64(k))+rng.Intn(2*jit+1)-jit)
		}
		if rng.Intn(2) == 0 {
			out[k].Neg(out[k])
		}
	}
	return out
}

// TestMulLowFixedExact checks the packed product against exact rational
// arithmetic: every coefficient within 2^-prec of the sum of the absolute
// values of its terms (the bound the schoolbook product meets), for
// growing, decaying, sparse and noisy factors.
func TestMulLowFixedExact(t *testing.T) {
	cases := []struct {
		name       string
		n          int
		prec       uint
		ga, gb     float64
		jit, tiny  int
		zeros      float64
		lenA, lenB int
	}{
		{"flat", 20, 128, 0, 0, 3, 0, 0, 20, 20},
		{"growing 3^k", 43, 239, 1.58, 1.58, 4, 0, 0.1, 43, 43},
		{"decaying 2^-5k", 43, 239, -5, -5, 6, 0, 0.1, 43, 43},
		{"opposite growth", 30, 200, 3, -3, 2, 0, 0, 30, 30},
		{"noise at the precision", 43, 239, 0, 0, 2, 240, 0.2, 43, 43},
		{"short b", 40, 160, 0.5, 0.2, 3, 0, 0, 40, 5},
		{"wide jitter", 25, 100, 0, 0, 60, 0, 0, 25, 25},
		{"long factors truncated", 12, 300, 1, 1, 3, 0, 0, 30, 30},
	}
	rng := rand.New(rand.NewSource(7))
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			for rep := 0; rep < 5; rep++ {
				a := randomCoeffs(rng, c.lenA, c.prec, c.ga, c.jit, c.tiny, c.zeros)
				b := randomCoeffs(rng, c.lenB, c.prec, c.gb, c.jit, c.tiny, c.zeros)
				out := newFloats(c.n, c.prec)
				if !mulLowFixed(out, a, b, c.prec, nil) {
					t.Fatalf("packed product declined")
				}
				want, mag := exactProduct(a, b, c.n)
				tol := new(big.Rat).SetFrac(big.NewInt(1), new(big.Int).Lsh(big.NewInt(1), c.prec))
				for m := range out {
					got, _ := out[m].Rat(nil)
					d := new(big.Rat).Sub(got, want[m])
					d.Abs(d)
					bound := new(big.Rat).Mul(mag[m], tol)
					if d.Cmp(bound) > 0 {
						df, _ := d.Float64()
						bf, _ := bound.Float64()
						t.Fatalf("rep %d, coefficient %d: error %.3g above 2^-%d * sum|terms| = %.3g",
							rep, m, df, c.prec, bf)
					}
					if out[m].Prec() != c.prec {
						t.Fatalf("coefficient %d has %d bits, want %d", m, out[m].Prec(), c.prec)
					}
				}
			}
		})
	}
}

// TestMulLowFixedDeclines checks the schoolbook fallback for factors that
// span too many binades, and that Mul gives the same product either way.
func TestMulLowFixedDeclines(t *testing.T) {
	prec := uint(64)
	a := newFloats(12, prec)
	b := newFloats(12, prec)
	for k := range a {
		a[k].SetMantExp(big.NewFloat(1), 0)
		b[k].SetMantExp(big.NewFloat(1), 0)
	}
	a[5].SetMantExp(big.NewFloat(1), -5000)
	if mulLowFixed(newFloats(12, prec), a, b, prec, nil) {
		t.Fatalf("packed product taken for a factor spanning 5000 binades")
	}
	sa, sb := &Series{prec: prec, c: a}, &Series{prec: prec, c: b}
	p := Mul(sa, sb)
	want, _ := exactProduct(a, b, 12)
	for m := range want {
		got, _ := p.c[m].Rat(nil)
		if d := new(big.Rat).Sub(got, want[m]); d.Sign() != 0 {
			g, _ := d.Float64()
			if g > 1e-15 || g < -1e-15 {
				t.Fatalf("schoolbook coefficient %d off by %g", m, g)
			}
		}
	}
}

// TestMulLowFixedZeros checks that a vanishing factor gives zeros.
func TestMulLowFixedZeros(t *testing.T) {
	prec := uint(100)
	a, b, out := newFloats(15, prec), newFloats(15, prec), newFloats(15, prec)
	b[3].SetInt64(7)
	out[2].SetInt64(5)
	if !mulLowFixed(out, a, b, prec, nil) {
		t.Fatal("declined")
	}
	for m, o := range out {
		if o.Sign() != 0 {
			t.Fatalf("coefficient %d = %s, want 0", m, o.Text('g', 5))
		}
	}
}

func BenchmarkMulOrder43Prec239(b *testing.B) {
	rng := rand.New(rand.NewSource(1))
	x := &Series{prec: 239, c: randomCoeffs(rng, 43, 239, 0.2, 3, 0, 0)}
	y := &Series{prec: 239, c: randomCoeffs(rng, 43, 239, 0.2, 3, 0, 0)}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		Mul(x, y)
	}
}

// TestMulLowFixedInfinity checks that an infinite coefficient is left to
// the schoolbook product (which propagates it) instead of being packed as
// a stale integer.
func TestMulLowFixedInfinity(t *testing.T) {
	prec := uint(80)
	a, b := newFloats(12, prec), newFloats(12, prec)
	for k := range a {
		a[k].SetInt64(int64(k + 1))
		b[k].SetInt64(1)
	}
	a[3].SetInf(false)
	if mulLowFixed(newFloats(12, prec), a, b, prec, nil) {
		t.Fatal("packed product taken with an infinite coefficient")
	}
	p := Mul(&Series{prec: prec, c: a}, &Series{prec: prec, c: b})
	for m := 3; m < 12; m++ {
		if !p.c[m].IsInf() {
			t.Errorf("coefficient %d = %s, want +Inf", m, p.c[m].Text('g', 5))
		}
	}
}
