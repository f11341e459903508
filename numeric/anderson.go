package numeric

import "math"

// anderson is Anderson acceleration (type II, Walker-Ni form) of a fixed-point
// iteration x -> F(x), with a damping weight mix that the caller halves
// whenever the residual grows.
type anderson struct {
	depth  int
	dx, df [][]float64 // ring of the last differences
	n      int         // number of stored pairs
	head   int
	prevX  []float64
	prevF  []float64
	hasPrv bool
}

func newAnderson(depth, size int) *anderson {
	a := &anderson{depth: depth}
	a.dx = make([][]float64, depth)
	a.df = make([][]float64, depth)
	for i := 0; i < depth; i++ {
		a.dx[i] = make([]float64, size)
		a.df[i] = make([]float64, size)
	}
	a.prevX = make([]float64, size)
	a.prevF = make([]float64, size)
	return a
}

// reset forgets the history (after a failed step).
func (a *anderson) reset() { a.n, a.head, a.hasPrv = 0, 0, false }

// step replaces x by the next iterate, given f = F(x) - x.
func (a *anderson) step(x, f []float64, mix float64) {
	if a.hasPrv {
		i := a.head
		for k := range x {
			a.dx[i][k] = x[k] - a.prevX[k]
			a.df[i][k] = f[k] - a.prevF[k]
		}
		a.head = (a.head + 1) % a.depth
		if a.n < a.depth {
			a.n++
		}
	}
	copy(a.prevX, x)
	copy(a.prevF, f)
	a.hasPrv = true
	m := a.n
	if m == 0 {
		for k := range x {
			x[k] += mix * f[k]
		}
		return
	}
	// Normal equations (DF^T DF + lambda) gamma = DF^T f, small and regularised.
	mat := make([]float64, m*m)
	rhs := make([]float64, m)
	for i := 0; i < m; i++ {
		for j := i; j < m; j++ {
			v := dot(a.df[i], a.df[j])
			mat[i*m+j], mat[j*m+i] = v, v
		}
		rhs[i] = dot(a.df[i], f)
	}
	tr := 0.0
	for i := 0; i < m; i++ {
		tr += mat[i*m+i]
	}
	for i := 0; i < m; i++ {
		mat[i*m+i] += 1e-12*tr/float64(m) + math.SmallestNonzeroFloat64
	}
	gamma, ok := solveSPD(mat, rhs, m)
	if !ok {
		a.reset()
		for k := range x {
			x[k] += mix * f[k]
		}
		return
	}
	for k := range x {
		v := x[k] + mix*f[k]
		for i := 0; i < m; i++ {
			v -= gamma[i] * (a.dx[i][k] + mix*a.df[i][k])
		}
		x[k] = v
	}
}

func dot(a, b []float64) float64 {
	s := 0.0
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}

// solveSPD solves the m x m symmetric positive definite system by Cholesky.
func solveSPD(a, b []float64, m int) ([]float64, bool) {
	l := make([]float64, m*m)
	for i := 0; i < m; i++ {
		for j := 0; j <= i; j++ {
			s := a[i*m+j]
			for k := 0; k < j; k++ {
				s -= l[i*m+k] * l[j*m+k]
			}
			if i == j {
				if s <= 0 {
					return nil, false
				}
				l[i*m+i] = math.Sqrt(s)
			} else {
				l[i*m+j] = s / l[j*m+j]
			}
		}
	}
	y := make([]float64, m)
	for i := 0; i < m; i++ {
		s := b[i]
		for k := 0; k < i; k++ {
			s -= l[i*m+k] * y[k]
		}
		y[i] = s / l[i*m+i]
	}
	for i := m - 1; i >= 0; i-- {
		s := y[i]
		for k := i + 1; k < m; k++ {
			s -= l[k*m+i] * y[k]
		}
		y[i] = s / l[i*m+i]
	}
	return y, true
}
