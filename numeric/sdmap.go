package numeric

import "math"

// sdMap is the Schwinger-Dyson fixed-point map on one grid.
//
// The unknown is the remainder r_n = g_n - gm_n, where gm_n = w_n/(w_n^2 + a^2)
// with a^2 = 2/q is the model whose time-domain form (1/2) cosh(a(beta/2 - tau))/cosh(a beta/2)
// carries the exact 1/w and 1/w^3 tails of g (G(0+) = 1/2, G”(0+) = Sigma(0+) = 1/q).
// Likewise Sigma(tau) is split into Sigma(0+) cosh(b(beta/2 - tau))/cosh(b beta/2) with
// b^2 = Sigma”(0+)/Sigma(0+), transformed analytically, plus a remainder whose odd
// extension is smooth to third order, so the discrete sine transforms lose no digits
// to the jump at tau = 0.
type sdMap struct {
	*HalfGrid
	q       float64   // interaction order
	j2      float64   // J^2 = 2^{q-1}/q in units script-J = 1
	a       float64   // model parameter of G
	gm      []float64 // model coefficients of g
	gmTime  []float64 // model of G at tau_k
	b       float64   // model parameter of Sigma (follows the solution until frozen)
	freezeB bool
	buf     []float64 // G(tau_k), then the Sigma remainder in time and frequency
}

func newSDMap(q float64, gr *HalfGrid) *sdMap {
	s := &sdMap{HalfGrid: gr, q: q, j2: math.Pow(2, q-1) / q, a: math.Sqrt(2 / q)}
	m := gr.m
	s.gm = make([]float64, m)
	s.gmTime = make([]float64, m)
	for n := range s.gm {
		w := gr.Freq(n)
		s.gm[n] = w / (w*w + s.a*s.a)
	}
	gr.addCoshRatio(s.gmTime, s.a, 0.5)
	s.buf = make([]float64, m)
	s.b = math.Sqrt((q - 1) * 2 / q)
	return s
}

// timeG fills dst with G(tau_k) for the remainder r.
func (s *sdMap) timeG(dst, r []float64) {
	s.toTime(dst, r)
	for k := range dst {
		dst[k] += s.gmTime[k]
	}
}

// powAbs returns sgn(x)|x|^p with fast paths for small integer p.
func powAbs(x, p float64) float64 {
	ax := math.Abs(x)
	var y float64
	switch p {
	case 1:
		y = ax
	case 2:
		y = ax * ax
	case 3:
		y = ax * ax * ax
	case 4:
		y = ax * ax
		y *= y
	case 5:
		y = ax * ax
		y = y * y * ax
	default:
		y = math.Pow(ax, p)
	}
	if x < 0 {
		return -y
	}
	return y
}

// sigmaAndIntGq overwrites gt (G at tau_k) with Sigma = J^2 sgn(G)|G|^{q-1} and
// returns int_0^{beta/2} |G|^q dtau by the end-corrected trapezoid rule, G(0) = 1/2.
func (s *sdMap) sigmaAndIntGq(gt []float64) float64 {
	q := s.q
	m := len(gt)
	gEnd := gt[m-1]
	sum := 0.5 * math.Pow(0.5, q)
	if q == 4 { // the common case, without math.Pow
		for k, g := range gt {
			g3 := g * g * g
			sum += g3 * g
			gt[k] = s.j2 * g3
		}
	} else {
		for k, g := range gt {
			p := powAbs(g, q-1)
			sum += p * g
			gt[k] = s.j2 * p
		}
	}
	// The trapezoid rule weights the end point tau = beta/2 by 1/2.
	sum -= 0.5 * math.Abs(powAbs(gEnd, q))
	// Euler-Maclaurin end correction: f = G^q has f'(beta/2) = 0 and
	// f'(0+) = q 2^{1-q} G'(0+) = -2 q 2^{1-q} J^2 I = -2 I, so
	// I = T + (h^2/12) f'(0+) gives I = T / (1 + h^2/6).
	return sum * s.h / (1 + s.h*s.h/6)
}

// sigmaB is the Sigma model parameter: b^2 = Sigma”(0+)/Sigma(0+) with
// Sigma”(0+) = J^2 (q-1) [G^{q-2} G” + (q-2) G^{q-3} G'^2] at tau = 0+,
// G = 1/2, G” = 1/q and G'(0+) = -J^2 int_0^beta |G|^q.
func (s *sdMap) sigmaB(gp0 float64) float64 {
	q := s.q
	return math.Sqrt((q - 1) * (2/q + 4*(q-2)*gp0*gp0))
}

// apply evaluates rNew = F(r) and returns G'(0+) of the input. Afterwards
// s.buf holds the sine coefficients of the Sigma remainder (used by thermo).
func (s *sdMap) apply(rNew, r []float64) float64 {
	q := s.q
	s.timeG(s.buf, r)
	gp0 := -2 * s.j2 * s.sigmaAndIntGq(s.buf)
	if !s.freezeB {
		s.b = s.sigmaB(gp0)
	}
	sig0 := 1 / q // Sigma(0+) = J^2 2^{1-q}
	s.addCoshRatio(s.buf, s.b, -sig0)
	s.toFreq(s.buf, s.buf)
	b2 := s.b * s.b
	for n, sf := range s.buf {
		w := s.Freq(n)
		sigma := sf + sig0*2*w/(w*w+b2)
		rNew[n] = 1/(w+sigma) - s.gm[n]
	}
	return gp0
}
