package numeric

import "math"

// anderson is Anderson acceleration (type II, Walker-Ni form) of a fixed-point
// iteration x -> F(x), with a damping weight mix that the caller halves
// whenever the residual grows.
//
// The Gram matrix of the stored residual differences is kept up to date one
// column per step, so a step costs one fused pass over the history for the
// new dot products and one for the update, independent of the depth squared.
type anderson struct {
	depth int
	size  int
	df    [][]float64 // ring of residual differences f_i - f_{i-1}
	e     [][]float64 // ring of x_i - x_{i-1} + mix (f_i - f_{i-1})
	gram  []float64   // depth x depth, gram[i*depth+j] = df_i . df_j
	n     int         // number of stored pairs
	head  int         // slot the next pair goes to
	prevX []float64
	prevF []float64
	has   bool
	// scratch for the small least-squares problem
	rhs, mat, chol, gamma, y []float64
	idx                      []int
}

func newAnderson(depth, size int) *anderson {
	// The history vectors are allocated as they are first needed: a solve
	// started close to convergence never pays for them.
	a := &anderson{depth: depth, size: size}
	a.df = make([][]float64, depth)
	a.e = make([][]float64, depth)
	a.gram = make([]float64, depth*depth)
	a.rhs = make([]float64, depth)
	a.mat = make([]float64, depth*depth)
	a.chol = make([]float64, depth*depth)
	a.gamma = make([]float64, depth)
	a.y = make([]float64, depth)
	a.idx = make([]int, 0, depth)
	return a
}

// reset forgets the history (after a failed step or a change of mix).
func (a *anderson) reset() { a.n, a.head, a.has = 0, 0, false }

// step replaces x by the next iterate, given f = F(x) - x.
func (a *anderson) step(x, f []float64, mix float64) {
	d := a.depth
	// Slots holding history, and the slot of the new pair (if any).
	a.idx = a.idx[:0]
	slot := -1
	if a.has {
		slot = a.head
		a.head = (a.head + 1) % d
		if a.n < d {
			a.n++
		}
	}
	for i := 0; i < a.n; i++ {
		a.idx = append(a.idx, (a.head-a.n+i+d)%d)
	}
	m := len(a.idx)
	for i := range a.rhs {
		a.rhs[i] = 0
	}
	if slot >= 0 {
		if a.df[slot] == nil {
			a.df[slot] = make([]float64, a.size)
			a.e[slot] = make([]float64, a.size)
		}
		// One pass: build the new pair, its Gram column and all right-hand sides.
		dfn, en := a.df[slot], a.e[slot]
		for _, j := range a.idx {
			a.gram[slot*d+j] = 0
		}
		const block = 512
		for lo := 0; lo < len(x); lo += block {
			hi := min(lo+block, len(x))
			for k := lo; k < hi; k++ {
				v := f[k] - a.prevF[k]
				dfn[k] = v
				en[k] = x[k] - a.prevX[k] + mix*v
			}
			for jj, j := range a.idx {
				dj := a.df[j][lo:hi]
				fb := f[lo:hi]
				nb := dfn[lo:hi]
				var sg, sr float64
				for k := range dj {
					sg += dj[k] * nb[k]
					sr += dj[k] * fb[k]
				}
				a.gram[slot*d+j] += sg
				a.rhs[jj] += sr
			}
		}
		for _, j := range a.idx {
			a.gram[j*d+slot] = a.gram[slot*d+j]
		}
	}
	if a.prevX == nil {
		a.prevX = make([]float64, a.size)
		a.prevF = make([]float64, a.size)
	}
	copy(a.prevX, x)
	copy(a.prevF, f)
	a.has = true
	if m == 0 {
		for k := range x {
			x[k] += mix * f[k]
		}
		return
	}
	// Normal equations (DF^T DF + lambda) gamma = DF^T f, small and regularised.
	tr := 0.0
	for ii, i := range a.idx {
		for jj, j := range a.idx {
			a.mat[ii*m+jj] = a.gram[i*d+j]
		}
		tr += a.gram[i*d+i]
	}
	for i := 0; i < m; i++ {
		a.mat[i*m+i] += 1e-12*tr/float64(m) + math.SmallestNonzeroFloat64
	}
	if !solveSPD(a.mat[:m*m], a.rhs[:m], a.chol[:m*m], a.y[:m], a.gamma[:m], m) {
		a.reset()
		for k := range x {
			x[k] += mix * f[k]
		}
		return
	}
	// x += mix f - sum_i gamma_i e_i, in blocks so each block of x stays in cache.
	const block = 2048
	for lo := 0; lo < len(x); lo += block {
		hi := min(lo+block, len(x))
		xb, fb := x[lo:hi], f[lo:hi]
		for k := range xb {
			xb[k] += mix * fb[k]
		}
		for ii, i := range a.idx {
			g := a.gamma[ii]
			eb := a.e[i][lo:hi]
			for k := range xb {
				xb[k] -= g * eb[k]
			}
		}
	}
}

// solveSPD solves the m x m symmetric positive definite system a x = b by
// Cholesky, using l (m*m) and y (m) as scratch; it reports false if a is not
// numerically positive definite.
func solveSPD(a, b, l, y, x []float64, m int) bool {
	for i := 0; i < m; i++ {
		for j := 0; j <= i; j++ {
			s := a[i*m+j]
			for k := 0; k < j; k++ {
				s -= l[i*m+k] * l[j*m+k]
			}
			if i == j {
				if s <= 0 {
					return false
				}
				l[i*m+i] = math.Sqrt(s)
			} else {
				l[i*m+j] = s / l[j*m+j]
			}
		}
	}
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
			s -= l[k*m+i] * x[k]
		}
		x[i] = s / l[i*m+i]
	}
	return true
}
