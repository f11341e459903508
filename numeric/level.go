package numeric

import (
	"fmt"
	"math"
)

// Level is the converged Schwinger-Dyson solution on one uniform grid.
type Level struct {
	Q, Beta    float64   // interaction order and inverse temperature beta*script-J
	Points     int       // grid points on [0, beta): 2m, with m points on (0, beta/2]
	Tau        []float64 // tau_k = k beta/Points, k = 0..Points/2
	G          []float64 // G(tau_k); G(beta - tau) = G(tau)
	Iterations int       // fixed-point iterations used on this grid
	Residual   float64   // final max_n |g_new - g| / g over Matsubara frequencies
	LogZ       float64   // log Z / N on this grid
	E          float64   // E / N = G'(0+)/q on this grid
	r          []float64 // remainder g - model, the iteration variable
	sigmaB     float64   // Sigma model parameter the solution was found with
}

// iterLimits bounds the fixed-point iteration.
const (
	maxIterations  = 4000
	andersonDepth  = 6
	freezeBelowRes = 1e-7
)

// solveLevel solves the SD equations on a grid of 2m points, starting from
// warm (may be nil, or on any grid, q or beta).
func solveLevel(q, beta float64, m int, tol float64, warm *Level, progress func(float64, string)) (*Level, error) {
	gr, err := NewHalfGrid(beta, m)
	if err != nil {
		return nil, err
	}
	s := newSDMap(q, gr)
	x := make([]float64, m)
	if warm != nil {
		warmStart(s, x, warm)
		if warm.Q == q && warm.Beta == beta && warm.sigmaB > 0 {
			// Same problem on another grid: its b is right to the
			// discretisation error, so the map can be fixed from the start.
			s.b, s.freezeB = warm.sigmaB, true
		}
	}
	fp := fixedPoint{tol: tol, mix: 1, active: m,
		afterBest: func(res float64) bool {
			if res < freezeBelowRes && !s.freezeB {
				s.freezeB = true
				return true
			}
			return false
		}}
	if progress != nil {
		fp.progress = func(it int, res, startRes float64) {
			if it%5 == 0 && startRes > tol {
				f := math.Log(startRes/res) / math.Log(startRes/tol)
				progress(math.Max(0, math.Min(1, f)), fmt.Sprintf("iteration %d, residual %.2e", it, res))
			}
		}
	}
	r := fp.run(x, func(x, fx []float64) float64 {
		s.apply(fx, x)
		res := 0.0
		for n := range fx {
			g := fx[n] + s.gm[n]
			d := math.Abs(fx[n]-x[n]) / g
			if d > res || math.IsNaN(d) {
				res = d
			}
			fx[n] -= x[n]
		}
		return res
	})
	if r.nanAt > 0 {
		return nil, fmt.Errorf("numeric: NaN in the SD iteration at q=%g beta=%g (points %d, iteration %d); try a warm start from a smaller beta", q, beta, 2*m, r.nanAt)
	}
	res, it := r.res, r.it
	if !(res <= tol) {
		return nil, fmt.Errorf("numeric: SD iteration did not converge at q=%g beta=%g (points %d): residual %.3g after %d iterations (tolerance %.3g); try a looser tolerance, more points, or a warm start from a nearby beta", q, beta, 2*m, r.bestRes, it-1, tol)
	}
	fx := make([]float64, m)
	lv := &Level{Q: q, Beta: beta, Points: 2 * m, Iterations: it, Residual: res, r: x, sigmaB: s.b}
	lv.LogZ, lv.E = s.thermo(x, fx)
	lv.Tau = make([]float64, m+1)
	lv.G = make([]float64, m+1)
	lv.G[0] = 0.5
	s.timeG(lv.G[1:], x)
	for k := range lv.Tau {
		lv.Tau[k] = float64(k) * gr.h
	}
	if math.IsNaN(lv.LogZ) || math.IsNaN(lv.E) {
		return nil, fmt.Errorf("numeric: NaN in the thermodynamics at q=%g beta=%g (points %d)", q, beta, 2*m)
	}
	return lv, nil
}

// thermo returns log Z and E for the remainder x (assumed converged); work
// is scratch of the grid's size.
func (s *sdMap) thermo(x, work []float64) (logZ, e float64) {
	q := s.q
	gp0 := s.apply(work, x) // leaves the Sigma remainder's coefficients in s.buf
	sig0 := 1 / q
	c := math.Sqrt(s.sigmaB(gp0)*s.sigmaB(gp0) + sig0)
	sum := 0.0
	for n, sf := range s.buf {
		w := s.Freq(n)
		sigma := sf + sig0*CoshRatioFreq(s.b, w)
		sum += math.Log1p(sigma/w) - 2*sig0/(w*w+c*c)
	}
	s1, _ := MatsubaraTails(s.beta, c)
	sum += sig0 * s1
	logZ = 0.5*math.Ln2 + sum + 0.5*s.beta*(1-1/q)*gp0
	return logZ, gp0 / q
}

// warmStart fills x with the remainder of a previous solution mapped onto
// this grid. At the same q and beta the Matsubara frequencies coincide and
// the coefficients are copied (zero-padded or truncated); otherwise G is
// interpolated linearly in tau/beta.
func warmStart(s *sdMap, x []float64, warm *Level) {
	if warm.Q == s.q && warm.Beta == s.beta && warm.r != nil {
		n := copy(x, warm.r)
		clear(x[n:])
		return
	}
	gt := x
	mw := len(warm.G) - 1
	for k := range gt {
		u := float64(k+1) / float64(2*s.m) // tau_k/beta, in (0, 1/2]
		p := u * float64(2*mw)
		i := int(p)
		if i >= mw {
			gt[k] = warm.G[mw]
		} else {
			f := p - float64(i)
			gt[k] = (1-f)*warm.G[i] + f*warm.G[i+1]
		}
		gt[k] -= s.gmTime[k]
	}
	s.toFreq(x, gt)
}
