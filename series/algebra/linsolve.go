package algebra

import (
	"qbridge/series/scalar"

	"errors"
	"fmt"
	"math/big"
)

// ErrSingular is returned when a linear system is singular, or so close to
// singular that the working precision cannot resolve it.
var ErrSingular = errors.New("series: matrix is singular to working precision")

// SolveLinear solves a x = b by Gaussian elimination with partial pivoting at
// prec bits. a must be square (n by n, n >= 1) with b of length n; neither a
// nor b is modified.
//
// The matrix is declared numerically singular, with ErrSingular, when a pivot
// is smaller than 2^-(7 prec/8) times the largest entry its row has held: at
// that size the pivot is indistinguishable from accumulated rounding, and
// dividing by it would return noise rather than a solution.
func SolveLinear(a [][]*big.Float, b []*big.Float, prec uint) ([]*big.Float, error) {
	if prec == 0 || prec > scalar.MaxPrec {
		return nil, fmt.Errorf("%w (got %d)", scalar.ErrPrec, prec)
	}
	n := len(a)
	if n == 0 {
		return nil, errors.New("series: SolveLinear: empty matrix")
	}
	if len(b) != n {
		return nil, fmt.Errorf("series: SolveLinear: matrix has %d rows but right-hand side has %d entries", n, len(b))
	}
	m := make([][]*big.Float, n)
	rowScale := make([]*big.Float, n)
	for i := range a {
		if len(a[i]) != n {
			return nil, fmt.Errorf("series: SolveLinear: row %d has %d entries, want %d", i, len(a[i]), n)
		}
		m[i] = make([]*big.Float, n+1)
		rowScale[i] = new(big.Float).SetPrec(prec)
		for j, v := range a[i] {
			if v == nil || v.IsInf() {
				return nil, fmt.Errorf("series: SolveLinear: entry (%d,%d) is nil or infinite", i, j)
			}
			m[i][j] = new(big.Float).SetPrec(prec).Set(v)
			scalar.RaiseAbs(rowScale[i], v)
		}
		if b[i] == nil || b[i].IsInf() {
			return nil, fmt.Errorf("series: SolveLinear: right-hand side entry %d is nil or infinite", i)
		}
		m[i][n] = new(big.Float).SetPrec(prec).Set(b[i])
	}
	tolExp := -int(prec - prec/8)
	t := new(big.Float).SetPrec(prec)
	f := new(big.Float).SetPrec(prec)
	for k := 0; k < n; k++ {
		// Partial pivoting: the largest entry in column k at or below row k.
		p := k
		for i := k + 1; i < n; i++ {
			if scalar.CmpAbs(m[i][k], m[p][k]) > 0 {
				p = i
			}
		}
		m[k], m[p] = m[p], m[k]
		rowScale[k], rowScale[p] = rowScale[p], rowScale[k]
		piv := m[k][k]
		if piv.Sign() == 0 || rowScale[k].Sign() == 0 {
			return nil, fmt.Errorf("%w (zero pivot in column %d of %d)", ErrSingular, k, n)
		}
		t.Quo(piv, rowScale[k])
		if t.MantExp(nil) < tolExp {
			return nil, fmt.Errorf("%w (pivot in column %d of %d is %.3g relative to its row)", ErrSingular, k, n, t)
		}
		for i := k + 1; i < n; i++ {
			if m[i][k].Sign() == 0 {
				continue
			}
			f.Quo(m[i][k], piv)
			for j := k + 1; j <= n; j++ {
				t.Mul(f, m[k][j])
				m[i][j].Sub(m[i][j], t)
				if j < n {
					scalar.RaiseAbs(rowScale[i], m[i][j])
				}
			}
			m[i][k].SetInt64(0)
		}
	}
	x := make([]*big.Float, n)
	for i := n - 1; i >= 0; i-- {
		s := new(big.Float).SetPrec(prec).Set(m[i][n])
		for j := i + 1; j < n; j++ {
			t.Mul(m[i][j], x[j])
			s.Sub(s, t)
		}
		x[i] = s.Quo(s, m[i][i])
	}
	return x, nil
}
