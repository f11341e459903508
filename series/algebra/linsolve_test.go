package algebra

import (
	"errors"
	"math/big"
	"testing"
)

// The Hilbert matrix H_ij = 1/(i+j+1) with b = H * (1, ..., 1) has the
// solution x = (1, ..., 1) (exact by construction); its condition number
// grows like e^(3.5 n) (Todd 1954), so n = 10 costs about 15 digits.
func TestSolveLinearHilbert(t *testing.T) {
	const prec = 256
	for _, n := range []int{1, 3, 10} {
		a := make([][]*big.Float, n)
		b := make([]*big.Float, n)
		for i := range a {
			a[i] = make([]*big.Float, n)
			b[i] = new(big.Float).SetPrec(prec)
			for j := range a[i] {
				a[i][j] = new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), big.NewFloat(float64(i+j+1)))
				b[i].Add(b[i], a[i][j])
			}
		}
		x, err := SolveLinear(a, b, prec)
		if err != nil {
			t.Fatalf("n=%d: %v", n, err)
		}
		for i, v := range x {
			if !algTestClose(v, big.NewFloat(1), 1e-55) {
				t.Errorf("n=%d: x[%d] = %g, want 1", n, i, v)
			}
		}
	}
}

// A permuted system needs pivoting: [[0, 1], [1, 0]] x = (2, 3) gives x = (3, 2).
func TestSolveLinearPivot(t *testing.T) {
	a := [][]*big.Float{{big.NewFloat(0), big.NewFloat(1)}, {big.NewFloat(1), big.NewFloat(0)}}
	x, err := SolveLinear(a, []*big.Float{big.NewFloat(2), big.NewFloat(3)}, 64)
	if err != nil {
		t.Fatal(err)
	}
	if x[0].Cmp(big.NewFloat(3)) != 0 || x[1].Cmp(big.NewFloat(2)) != 0 {
		t.Errorf("x = %v, want [3 2]", x)
	}
	if a[0][0].Sign() != 0 {
		t.Error("input matrix was modified")
	}
}

func TestSolveLinearBadInput(t *testing.T) {
	one, two := big.NewFloat(1), big.NewFloat(2)
	third := new(big.Float).SetPrec(200).Quo(one, big.NewFloat(3))
	// Rows (1/3, 1) and (1, 3) are dependent; 1/3 rounded at 200 bits leaves
	// a pivot at the rounding level, which must count as singular.
	nearSingular := [][]*big.Float{{third, one}, {one, big.NewFloat(3)}}
	for _, tc := range []struct {
		name     string
		a        [][]*big.Float
		b        []*big.Float
		prec     uint
		singular bool
	}{
		{"singular", [][]*big.Float{{one, two}, {two, big.NewFloat(4)}}, []*big.Float{one, one}, 64, true},
		{"numerically singular", nearSingular, []*big.Float{one, one}, 200, true},
		{"zero matrix", [][]*big.Float{{new(big.Float)}}, []*big.Float{one}, 64, true},
		{"empty", nil, nil, 64, false},
		{"not square", [][]*big.Float{{one, two}}, []*big.Float{one}, 64, false},
		{"short rhs", [][]*big.Float{{one}}, nil, 64, false},
		{"nil entry", [][]*big.Float{{nil}}, []*big.Float{one}, 64, false},
		{"zero precision", [][]*big.Float{{one}}, []*big.Float{one}, 0, false},
	} {
		x, err := SolveLinear(tc.a, tc.b, tc.prec)
		if err == nil {
			t.Errorf("%s: got %v, want error", tc.name, x)
			continue
		}
		if tc.singular != errors.Is(err, ErrSingular) {
			t.Errorf("%s: err = %v, ErrSingular expected %v", tc.name, err, tc.singular)
		}
	}
}

// algTestClose reports |a - b| <= tol * max(1, |b|).
func algTestClose(a, b *big.Float, tol float64) bool {
	d := new(big.Float).SetPrec(a.Prec()).Sub(a, b)
	d.Abs(d)
	scale := new(big.Float).Abs(b)
	if scale.Cmp(big.NewFloat(1)) < 0 {
		scale.SetInt64(1)
	}
	return d.Cmp(new(big.Float).Mul(scale, big.NewFloat(tol))) <= 0
}
