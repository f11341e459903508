package algebra

import (
	"qbridge/series/scalar"

	"math/big"
	"sort"
	"testing"
)

// algTestChebyshevT returns the integer coefficients of T_n by
// T_{k+1} = 2x T_k - T_{k-1} (DLMF 18.9.1).
func algTestChebyshevT(n int, prec uint) []*big.Float {
	prev := []*big.Int{big.NewInt(1)}
	cur := []*big.Int{big.NewInt(0), big.NewInt(1)}
	if n == 0 {
		cur = prev
	}
	for k := 1; k < n; k++ {
		next := make([]*big.Int, len(cur)+1)
		for i := range next {
			next[i] = new(big.Int)
			if i > 0 {
				next[i].Lsh(cur[i-1], 1)
			}
			if i < len(prev) {
				next[i].Sub(next[i], prev[i])
			}
		}
		prev, cur = cur, next
	}
	out := make([]*big.Float, len(cur))
	for i, c := range cur {
		out[i] = new(big.Float).SetPrec(prec).SetInt(c)
	}
	return out
}

// algTestSortRoots orders roots by real part, then imaginary part.
func algTestSortRoots(r []scalar.Complex) {
	sort.Slice(r, func(i, j int) bool {
		if c := r[i].Re.Cmp(r[j].Re); c != 0 {
			return c < 0
		}
		return r[i].Im.Cmp(r[j].Im) < 0
	})
}

// Roots of T_n are cos((2k-1) pi / (2n)), k = 1..n (DLMF 18.5.1 with
// x = cos theta), checked at 100 digits.
func TestPolyRootsChebyshev(t *testing.T) {
	const prec = 340 // 100 decimal digits plus a margin
	tol := new(big.Float).SetFloat64(1e-98)
	for _, n := range []int{1, 2, 5, 12, 25} {
		roots, err := PolyRoots(algTestChebyshevT(n, prec), prec)
		if err != nil {
			t.Fatalf("T_%d: %v", n, err)
		}
		if len(roots) != n {
			t.Fatalf("T_%d: %d roots", n, len(roots))
		}
		algTestSortRoots(roots)
		pi := scalar.Pi(prec)
		for k := 1; k <= n; k++ {
			th := new(big.Float).SetPrec(prec).Mul(pi, big.NewFloat(float64(2*(n-k)+1)))
			th.Quo(th, big.NewFloat(float64(2*n)))
			_, want := scalar.BigSinCos(th, prec)
			z := roots[k-1]
			d := new(big.Float).SetPrec(prec).Sub(z.Re, want)
			if d.Abs(d).Cmp(tol) > 0 || new(big.Float).Abs(z.Im).Cmp(tol) > 0 {
				t.Errorf("T_%d root %d = %.30g%+.3gi, want %.30g", n, k, z.Re, z.Im, want)
			}
		}
	}
}

// Wilkinson's polynomial prod_{k=1..20} (x - k) (Wilkinson, "Rounding Errors
// in Algebraic Processes", 1963): notoriously ill-conditioned (condition
// numbers up to ~1e13 for the middle roots), so from exact integer
// coefficients at 100 digits the roots 1..20 come back to about 85 digits.
func TestPolyRootsWilkinson(t *testing.T) {
	const prec = 340
	const n = 20
	c := []*big.Int{big.NewInt(1)}
	for k := 1; k <= n; k++ {
		next := make([]*big.Int, len(c)+1)
		for i := range next {
			next[i] = new(big.Int)
			if i > 0 {
				next[i].Set(c[i-1])
			}
			if i < len(c) {
				next[i].Sub(next[i], new(big.Int).Mul(c[i], big.NewInt(int64(k))))
			}
		}
		c = next
	}
	coeffs := make([]*big.Float, len(c))
	for i := range c {
		coeffs[i] = new(big.Float).SetPrec(prec).SetInt(c[i])
	}
	roots, err := PolyRoots(coeffs, prec)
	if err != nil {
		t.Fatal(err)
	}
	algTestSortRoots(roots)
	tol := big.NewFloat(1e-80)
	for k := 1; k <= n; k++ {
		z := roots[k-1]
		d := new(big.Float).SetPrec(prec).Sub(z.Re, big.NewFloat(float64(k)))
		if d.Abs(d).Cmp(tol) > 0 || new(big.Float).Abs(z.Im).Cmp(tol) > 0 {
			t.Errorf("root %d = %.40g%+.3gi", k, z.Re, z.Im)
		}
	}
}

// Small cases with exact answers: zero roots split off, complex pairs,
// a double root (resolved to about half the precision, as expected for a
// multiplicity-2 root), and huge coefficients that do not fit in float64.
func TestPolyRootsSpecial(t *testing.T) {
	const prec = 200
	f := func(v ...float64) []*big.Float {
		out := make([]*big.Float, len(v))
		for i, x := range v {
			out[i] = new(big.Float).SetPrec(prec).SetFloat64(x)
		}
		return out
	}
	huge := new(big.Float).SetMantExp(big.NewFloat(1), 3000) // 2^3000
	hugeSq := new(big.Float).SetMantExp(big.NewFloat(1), 6000)
	for _, tc := range []struct {
		name   string
		coeffs []*big.Float
		want   []complex128 // sorted by real, then imaginary part
		tol    float64
		huge   bool // roots are +-2^3000, compared relative to 2^3000
	}{
		{"constant", f(3), nil, 0, false},
		{"linear", f(-3, 2), []complex128{1.5}, 1e-55, false},
		{"x^2 (x-1)", f(0, 0, -1, 1), []complex128{0, 0, 1}, 1e-55, false},
		{"x^2+1 with zero leading terms", f(1, 0, 1, 0, 0), []complex128{-1i, 1i}, 1e-55, false},
		{"(x-1)^2 (x+2)", f(2, -3, 0, 1), []complex128{-2, 1, 1}, 1e-25, false},
		{"x^2 - 2^6000 (roots +-2^3000)", []*big.Float{new(big.Float).Neg(hugeSq), f(0)[0], f(1)[0]}, nil, 0, true},
	} {
		roots, err := PolyRoots(tc.coeffs, prec)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		algTestSortRoots(roots)
		if tc.huge {
			for i, sgn := range []float64{-1, 1} {
				w := new(big.Float).SetPrec(prec).Mul(huge, big.NewFloat(sgn))
				if len(roots) != 2 || !algTestClose(new(big.Float).Quo(roots[i].Re, huge), new(big.Float).Quo(w, huge), 1e-55) {
					t.Errorf("%s: roots %v", tc.name, roots)
				}
			}
			continue
		}
		if len(roots) != len(tc.want) {
			t.Fatalf("%s: %d roots, want %d", tc.name, len(roots), len(tc.want))
		}
		for i, w := range tc.want {
			wz := scalar.ComplexFloat64(real(w), imag(w), prec)
			if d := scalar.CAbs(scalar.CSub(roots[i], wz, prec), prec); d.Cmp(big.NewFloat(tc.tol)) > 0 {
				t.Errorf("%s: root %d = %.20g%+.3gi, want %v", tc.name, i, roots[i].Re, roots[i].Im, w)
			}
		}
	}
}

// The same roots at 64, 256 and 1024 bits agree to the lower precision.
func TestPolyRootsPrecision(t *testing.T) {
	ref, err := PolyRoots(algTestChebyshevT(9, 1024), 1024)
	if err != nil {
		t.Fatal(err)
	}
	algTestSortRoots(ref)
	for _, prec := range []uint{64, 256} {
		r, err := PolyRoots(algTestChebyshevT(9, prec), prec)
		if err != nil {
			t.Fatal(err)
		}
		algTestSortRoots(r)
		tol := new(big.Float).SetMantExp(big.NewFloat(1), -int(prec)+4)
		for i := range r {
			if d := scalar.CAbs(scalar.CSub(r[i], ref[i], 1024), 1024); d.Cmp(tol) > 0 {
				t.Errorf("prec %d: root %d off by %.3g", prec, i, d)
			}
			if r[i].Re.Prec() != prec {
				t.Errorf("prec %d: root has precision %d", prec, r[i].Re.Prec())
			}
		}
	}
}

func TestPolyRootsBadInput(t *testing.T) {
	for _, tc := range []struct {
		name   string
		coeffs []*big.Float
		prec   uint
	}{
		{"zero polynomial", []*big.Float{new(big.Float), new(big.Float)}, 64},
		{"empty", nil, 64},
		{"nil coefficient", []*big.Float{big.NewFloat(1), nil}, 64},
		{"infinite coefficient", []*big.Float{big.NewFloat(1), new(big.Float).SetInf(false)}, 64},
		{"zero precision", []*big.Float{big.NewFloat(1), big.NewFloat(1)}, 0},
	} {
		if r, err := PolyRoots(tc.coeffs, tc.prec); err == nil {
			t.Errorf("%s: got %v, want error", tc.name, r)
		}
	}
}
