package energy

import (
	"fmt"
	"math"

	"qbridge/numeric"
)

// invQLevel is the expansion of the SD solution in x = 1/q on one grid:
// coefficients of x^k, k = 0..order, of log Z and E, and G'(0+).
type invQLevel struct {
	beta, v    float64
	m          int
	logZ, e, p []float64
}

// LiouvilleV returns v in (0, 1) with beta = pi v / cos(pi v/2)
// (script-J = 1; Maldacena-Stanford arXiv:1604.07818 sec. 2.4), by Newton
// iteration on a bisection bracket.
func LiouvilleV(beta float64) (float64, error) {
	if !(beta > 0) || math.IsInf(beta, 0) {
		return 0, fmt.Errorf("%w: beta must be positive and finite, got %g", ErrInput, beta)
	}
	f := func(v float64) float64 { return math.Pi*v - beta*math.Cos(math.Pi*v/2) }
	lo, hi := 0.0, 1.0
	for i := 0; i < 200 && hi-lo > 1e-17; i++ {
		mid := (lo + hi) / 2
		if f(mid) < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return (lo + hi) / 2, nil
}

// liouvilleEta returns eta = 1 - v to full relative precision, from
// beta sin(pi eta/2) = pi (1 - eta) (the same condition as LiouvilleV):
// at low temperature eta ~ 2/beta and 1 - v computed from v would lose
// digits.
func liouvilleEta(beta float64) float64 {
	f := func(e float64) float64 { return beta*math.Sin(math.Pi*e/2) - math.Pi*(1-e) }
	lo, hi := 0.0, 1.0
	for i := 0; i < 2000 && hi > lo; i++ {
		mid := lo + (hi-lo)/2
		if mid == lo || mid == hi {
			break
		}
		if f(mid) < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return lo + (hi-lo)/2
}

// liouvilleSolver solves (1/2) y” - e^{g_1} y = R on [0, beta/2] with
// y(0) = 0 and y'(beta/2) = 0 (y even about beta/2): Liouville's
// fluctuation operator, e^{g_1} = a^2/cos^2(theta), theta = a (beta/2 - tau),
// a = cos(pi v/2) (Maldacena-Stanford arXiv:1604.07818 sec. 2.4).
//
// One zero mode of the operator is known in closed form and positive:
// w = 1 + theta tan(theta), the derivative of the Liouville solution with
// respect to its scale, even about beta/2. With y = w z the equation becomes
// (w^2 z')' = 2 w R, so
// y(tau) = -w(tau) int_0^tau ds w(s)^{-2} int_s^{beta/2} 2 w R dt,
// two nested quadratures with no cancellation between large terms. (Plain
// variation of parameters with both zero modes cancels digits like beta^2
// at low temperature; a finite-difference boundary-value solve loses them
// like (beta/h)^2.)
type liouvilleSolver struct {
	h       float64
	m       int
	eg1, g1 []float64 // e^{g_1(tau_i)} and g_1, i = 0..m
	w       []float64 // the zero mode 1 + theta tan(theta)
	wf, wz  []float64 // work space
}

func newLiouvilleSolver(beta float64, m int) *liouvilleSolver {
	eta := liouvilleEta(beta)
	// phi = pi/2 - theta = pi eta/2 + a tau is computed directly so that
	// tan(theta) = cot(phi) keeps full relative precision near the edge.
	c0 := math.Pi * eta / 2
	a := math.Sin(c0)
	s := &liouvilleSolver{h: beta / float64(2*m), m: m}
	n := m + 1
	s.eg1, s.g1, s.w = make([]float64, n), make([]float64, n), make([]float64, n)
	s.wf, s.wz = make([]float64, n), make([]float64, n)
	for i := range s.eg1 {
		phi := c0 + a*float64(i)*s.h
		sp, cp := math.Sincos(phi)
		th := math.Pi/2 - phi
		if i == m {
			sp, cp, th = 1, 0, 0
		}
		s.eg1[i] = a * a / (sp * sp)
		s.g1[i] = 2 * math.Log(a/sp)
		s.w[i] = 1 + th*cp/sp
	}
	return s
}

// solve returns y on tau_0..tau_m for the source R on tau_0..tau_m.
func (s *liouvilleSolver) solve(R []float64) []float64 {
	for i := range s.wf {
		s.wf[i] = 2 * s.w[i] * R[i]
	}
	inner := cumulativeFromRight(s.wf, s.h)
	for i := range s.wz {
		s.wz[i] = inner[i] / (s.w[i] * s.w[i])
	}
	outer := cumulativeFromLeft(s.wz, s.h)
	y := make([]float64, s.m+1)
	for i := range y {
		y[i] = -s.w[i] * outer[i]
	}
	return y
}

// cumulativeFromRight returns C_i = int_{t_i}^{t_m} F dt on a uniform grid
// t_i = i h, i = 0..m, using the fourth-order panel rule
// int_{t_j}^{t_{j+1}} F = h/24 (-F_{j-1} + 13 F_j + 13 F_{j+1} - F_{j+2})
// with one-sided variants at the ends.
func cumulativeFromRight(F []float64, h float64) []float64 {
	m := len(F) - 1
	c := make([]float64, m+1)
	for j := m - 1; j >= 0; j-- {
		c[j] = c[j+1] + panel(F, j, h)
	}
	return c
}

// cumulativeFromLeft returns C_i = int_{t_0}^{t_i} F dt (same rule).
func cumulativeFromLeft(F []float64, h float64) []float64 {
	m := len(F) - 1
	c := make([]float64, m+1)
	for j := 0; j < m; j++ {
		c[j+1] = c[j] + panel(F, j, h)
	}
	return c
}

// panel is the fourth-order integral of F over [t_j, t_{j+1}].
func panel(F []float64, j int, h float64) float64 {
	m := len(F) - 1
	switch {
	case m < 3:
		return (F[j] + F[j+1]) / 2 * h
	case j == 0:
		return h / 24 * (9*F[0] + 19*F[1] - 5*F[2] + F[3])
	case j == m-1:
		return h / 24 * (F[m-3] - 5*F[m-2] + 19*F[m-1] + 9*F[m])
	default:
		return h / 24 * (-F[j-1] + 13*F[j] + 13*F[j+1] - F[j+2])
	}
}

// sigmaSecondInvQ returns the series in x = 1/q of Sigma”(0+) =
// 2x(1-x) + 4x(1-x)(1-2x) P^2 with P = G'(0+)/x (from Sigma = J^2 G^{q-1},
// G(0+) = 1/2, G”(0+) = x); p[k] is the coefficient of x^k of G'(0+).
func sigmaSecondInvQ(p []float64, n int) []float64 {
	P := make([]float64, n)
	for j := 0; j+1 < len(p) && j < n; j++ {
		P[j] = p[j+1]
	}
	P2 := fsMul(P, P, n)
	pre := fsMul([]float64{1, -1}, []float64{1, -2}, n) // (1-x)(1-2x)
	t := fsMul(pre, P2, n)
	out := make([]float64, n)
	for k := 1; k < n; k++ {
		out[k] = 4 * t[k-1]
		if k == 1 {
			out[k] += 2
		}
		if k == 2 {
			out[k] -= 2
		}
	}
	return out
}

// solveInvQLevel expands the SD equations in x = 1/q to the given order on
// a grid of 2m points. With G = (1/2)(1 + sum_k x^k g_k) on (0, beta),
// Sigma = x (1 + g)^{1/x - 1} and the Dyson equation in the form
// (1/2) g” = Sigma - S^{-1}[sigma^2 g(w)] (S: sine transform; exact, from
// g(w) = 1/(w + sigma)), order k reads
// (1/2) g_k” - e^{g_1} g_k = [Sigma]_k(g_k = 0) - N_k,
// N_k = S^{-1}[sum sigma_a sigma_b / w + sum sigma_a sigma_b gamma_c],
// with g_k(0) = g_k(beta) = 0: Liouville's fluctuation operator with a
// source from lower orders, local and non-local.
func solveInvQLevel(beta float64, m, order int) (*invQLevel, error) {
	if order < 1 {
		order = 1
	}
	n := order + 1
	v, err := LiouvilleV(beta)
	if err != nil {
		return nil, err
	}
	gr, err := numeric.NewHalfGrid(beta, m)
	if err != nil {
		return nil, err
	}
	freqs := gr.Freqs()
	ls := newLiouvilleSolver(beta, m)
	g := make([][]float64, n)   // g_k on tau_0..tau_m
	Sig := make([][]float64, n) // Sigma_k on tau_1..tau_m
	sig := make([][]float64, n) // sine coefficients of Sigma_k
	gam := make([][]float64, n) // sine coefficients of g_k/2
	p := make([]float64, n)     // coefficients of G'(0+)
	in := make([]float64, n)    // coefficients of int_0^{beta/2} G Sigma
	damp := 1 / (1 + gr.H()*gr.H()/6)
	phi := make([]float64, m+1)
	R := make([]float64, m+1)
	T := make([]float64, m)
	N := make([]float64, m)
	buf := make([]float64, m)
	a := make([]float64, n+1)
	lam := make([]float64, n+1)
	psi := make([]float64, n)
	ex := make([]float64, n)
	for k := 1; k < n; k++ {
		if k == 1 {
			g[1] = append([]float64(nil), ls.g1...)
			Sig[1] = append([]float64(nil), ls.eg1[1:]...)
		} else {
			// Local source: [x (1+g)^{1/x-1}]_k = Phi_{k-1} with g_k = 0, where
			// Phi = exp((1-x) log(1+g)/x).
			for i := 1; i <= m; i++ {
				a[0] = 1
				for j := 1; j <= k; j++ {
					a[j] = 0
					if j < k {
						a[j] = g[j][i]
					}
				}
				numeric.LogSeriesInto(lam[:k+1], a[:k+1])
				for j := 0; j < k; j++ {
					psi[j] = lam[j+1]
					if j > 0 {
						psi[j] -= lam[j]
					}
				}
				numeric.ExpSeriesInto(ex[:k], psi[:k])
				phi[i] = ex[k-1]
			}
			// Non-local source from the frequency-space products.
			for ni, w := range freqs {
				s := 0.0
				for aa := 1; aa < k; aa++ {
					s += sig[aa][ni] * sig[k-aa][ni] / w
				}
				for c := 1; c <= k-2; c++ {
					for aa := 1; aa < k-c; aa++ {
						s += sig[aa][ni] * sig[k-c-aa][ni] * gam[c][ni]
					}
				}
				T[ni] = s
			}
			// sigma_1^2 / w ~ 4/w^3: N_2 has N”(0+) = -2; all N_k(0+) = 0.
			d := 0.0
			if k == 2 {
				d = -2
			}
			if err := gr.ToTimeJump(N, T, 0, d); err != nil {
				return nil, err
			}
			R[0] = 0
			for i := 1; i <= m; i++ {
				R[i] = phi[i] - N[i-1]
			}
			g[k] = ls.solve(R)
			Sig[k] = make([]float64, m)
			for i := 1; i <= m; i++ {
				Sig[k][i-1] = phi[i] + ls.eg1[i]*g[k][i]
			}
		}
		// int_0^{beta/2} (G Sigma)_k with (G Sigma)_k = (1/2)[Phi_{k-1} + sum_c g_c Phi_{k-1-c}].
		for i := 1; i <= m; i++ {
			s := Sig[k][i-1]
			for c := 1; c < k; c++ {
				s += g[c][i] * Sig[k-c][i-1]
			}
			buf[i-1] = 0.5 * s
		}
		f0 := 0.0
		if k == 1 {
			f0 = 0.5
		}
		in[k] = gr.Trapezoid(f0, buf) * damp
		p[k] = -2 * in[k]
		sdd := sigmaSecondInvQ(p[:k+1], n)
		v0, d1 := 0.0, 0.0
		if k == 1 {
			v0, d1 = 1, 1
		}
		sig[k] = make([]float64, m)
		if err := gr.ToFreqJump(sig[k], Sig[k], v0, sdd[k]); err != nil {
			return nil, err
		}
		for i := 1; i <= m; i++ {
			buf[i-1] = g[k][i] / 2
		}
		gam[k] = make([]float64, m)
		if err := gr.ToFreqJump(gam[k], buf, 0, d1); err != nil {
			return nil, err
		}
	}
	lv := &invQLevel{beta: beta, v: v, m: m, p: p}
	lv.logZ = invQLogZ(gr, sig, in, p, n)
	lv.e = make([]float64, n)
	for k := 2; k < n; k++ {
		lv.e[k] = p[k-1] // E = G'(0+)/q = x p(x)
	}
	for k := range lv.logZ {
		if math.IsNaN(lv.logZ[k]) || math.IsInf(lv.logZ[k], 0) || math.IsNaN(lv.e[k]) {
			return nil, fmt.Errorf("energy: non-finite coefficient at order %d of the 1/q expansion (beta=%g, %d points)", k, beta, 2*m)
		}
	}
	return lv, nil
}

// invQLogZ assembles log Z = (1/2) log 2 + sum_n log(1 + sigma_n/w_n)
// - beta (1 - x) int_0^{beta/2} G Sigma order by order in x, with the
// Matsubara tail 2x/w^2 - 2(Sigma”(0+) + x^2)/w^4 summed in closed form.
func invQLogZ(gr *numeric.HalfGrid, sig [][]float64, in, p []float64, n int) []float64 {
	sdd := sigmaSecondInvQ(p, n)
	a1 := make([]float64, n)
	a2 := make([]float64, n)
	const c = 1.0
	for k := range a1 {
		A := 0.0
		if k == 1 {
			A = 2
		}
		B := -2 * sdd[k]
		if k == 2 {
			B -= 2
		}
		a1[k] = A / 2
		a2[k] = (B + c*c*A) / 2
	}
	return assembleLogZ(gr, sig, a1, a2, c, fsMul([]float64{1, -1}, in, n))
}
