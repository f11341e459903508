package energy

import (
	"fmt"
	"math"

	"qbridge/numeric"
)

// deltaLevel is the expansion of the Schwinger-Dyson solution in delta = q - 2
// on one grid of 2m points on [0, beta): the coefficients of delta^k,
// k = 0..order, of log Z, of E and of G'(0+).
type deltaLevel struct {
	beta       float64
	m          int
	logZ, e, p []float64
}

// sigmaSecond returns the series in delta of Sigma”(0+) =
// (q-1)/q [4 (q-2) G'(0+)^2 + 2/q] (from Sigma = J^2 G^{q-1}, G(0+) = 1/2,
// G”(0+) = 1/q, J^2 = 2^{q-1}/q), with G'(0+) = p(delta) to n terms.
func sigmaSecond(p []float64, n int) []float64 {
	invq := fsGeometric(2, 1, n)
	pre := fsMul([]float64{1, 1}, invq, n) // (1+delta)/(2+delta)
	p2 := fsMul(p, p, n)
	br := make([]float64, n)
	for k := range br {
		br[k] = 2 * invq[k]
		if k >= 1 {
			br[k] += 4 * p2[k-1]
		}
	}
	return fsMul(pre, br, n)
}

// couplingSeries returns J^2 = 2^{1+delta}/(2+delta) (script-J = 1) to n terms.
func couplingSeries(n int) []float64 {
	ex := make([]float64, n)
	f := 2.0
	for k := range ex {
		ex[k] = f
		f *= math.Ln2 / float64(k+1)
	}
	return fsMul(ex, fsGeometric(2, 1, n), n)
}

// solveDeltaLevel expands the SD equations around q = 2 to the given order
// on a grid of 2m points.
//
// With g = sum delta^k g_k and sigma = g + s (at q = 2, Sigma = G), the Dyson
// equation g (w + sigma) = 1 at order k >= 1 is
// g_k (1/g_0 + g_0) = -g_0 s_k - sum_{j=1}^{k-1} g_{k-j} sigma_j,
// one division per frequency. The source s_k = Sigma_k - G_k comes from
// Sigma = J^2 G exp(delta log G) expanded pointwise in tau with G_k set to
// zero: it involves only G_0..G_{k-1}.
func solveDeltaLevel(beta float64, m, order int) (*deltaLevel, error) {
	n := order + 1
	gr, err := numeric.NewHalfGrid(beta, m)
	if err != nil {
		return nil, err
	}
	freqs := gr.Freqs()
	invq := fsGeometric(2, 1, n)
	j2 := couplingSeries(n)
	G := make([][]float64, n)   // G_k(tau)
	L := make([][]float64, n)   // coefficients of log G
	X := make([][]float64, n)   // coefficients of exp(delta log G)
	P := make([][]float64, n)   // coefficients of G exp(delta log G)
	Sig := make([][]float64, n) // Sigma_k(tau)
	g := make([][]float64, n)   // g_k(w)
	sig := make([][]float64, n) // sigma_k(w)
	p := make([]float64, n)     // G'(0+) coefficients
	in := make([]float64, n)    // int_0^{beta/2} (G Sigma)_k
	// Order 0: the semicircle, g_0 = (sqrt(w^2+4) - w)/2 = 2/(w + sqrt(w^2+4)).
	g[0] = make([]float64, m)
	for i, w := range freqs {
		g[0][i] = 2 / (w + math.Sqrt(w*w+4))
	}
	G[0] = make([]float64, m)
	if err := gr.ToTimeJump(G[0], g[0], 0.5, invq[0]); err != nil {
		return nil, err
	}
	L[0] = make([]float64, m)
	for i, v := range G[0] {
		if !(v > 0) {
			return nil, fmt.Errorf("energy: G_0 not positive at tau=%g on %d points (beta=%g): grid too coarse", gr.Tau(i+1), 2*m, beta)
		}
		L[0][i] = math.Log(v)
	}
	X[0] = ones(m)
	P[0] = append([]float64(nil), G[0]...)
	Sig[0] = scaled(P[0], j2[0])
	sig[0] = append([]float64(nil), g[0]...)
	damp := 1 / (1 + gr.H()*gr.H()/6)
	prod := make([]float64, m)
	integral := func(k int) {
		for i := range prod {
			s := 0.0
			for j := 0; j <= k; j++ {
				s += G[j][i] * Sig[k-j][i]
			}
			prod[i] = s
		}
		// (G Sigma)'(0+) = G'(0+) = -2 int: the Euler-Maclaurin h^2 term is
		// -(h^2/6) int, hence the factor 1/(1 + h^2/6).
		in[k] = gr.Trapezoid(0.5*invq[k], prod) * damp
		p[k] = -2 * in[k]
	}
	integral(0)
	src := make([]float64, m)
	shat := make([]float64, m)
	for k := 1; k < n; k++ {
		X[k] = make([]float64, m)
		for i := range src {
			x := 0.0
			for j := 1; j <= k; j++ {
				x += float64(j) * L[j-1][i] * X[k-j][i]
			}
			X[k][i] = x / float64(k)
			pm := 0.0
			for j := 0; j < k; j++ {
				pm += G[j][i] * X[k-j][i]
			}
			s := j2[0] * pm
			for a := 1; a <= k; a++ {
				s += j2[a] * P[k-a][i]
			}
			// Sigma_k = j2_0 (pm + G_k) + rest, and j2_0 = 1 at q = 2.
			src[i] = s
			prod[i] = pm
		}
		sdd := sigmaSecond(p[:k], n)[k]
		if err := gr.ToFreqJump(shat, src, invq[k], sdd-invq[k]); err != nil {
			return nil, err
		}
		g[k] = make([]float64, m)
		sig[k] = make([]float64, m)
		for i := range shat {
			r := 0.0
			for j := 1; j < k; j++ {
				r += g[k-j][i] * sig[j][i]
			}
			g0 := g[0][i]
			g[k][i] = -(g0*shat[i] + r) / (1/g0 + g0)
			sig[k][i] = g[k][i] + shat[i]
		}
		G[k] = make([]float64, m)
		if err := gr.ToTimeJump(G[k], g[k], 0, invq[k]); err != nil {
			return nil, err
		}
		P[k] = make([]float64, m)
		Sig[k] = make([]float64, m)
		L[k] = make([]float64, m)
		for i := range src {
			P[k][i] = prod[i] + G[k][i]
			Sig[k][i] = src[i] + G[k][i]
			l := G[k][i]
			for j := 1; j < k; j++ {
				l -= float64(j) / float64(k) * L[j][i] * G[k-j][i]
			}
			L[k][i] = l / G[0][i]
		}
		integral(k)
	}
	lv := &deltaLevel{beta: beta, m: m, p: p}
	lv.logZ = deltaLogZ(gr, sig, in, p, n)
	lv.e = fsMul(p, invq, n) // E = G'(0+)/q
	for k := range lv.logZ {
		if math.IsNaN(lv.logZ[k]) || math.IsInf(lv.logZ[k], 0) || math.IsNaN(lv.e[k]) {
			return nil, fmt.Errorf("energy: non-finite coefficient at order %d (beta=%g, %d points)", k, beta, 2*m)
		}
	}
	return lv, nil
}

// deltaLogZ assembles
// log Z = (1/2) log 2 + sum_{n>=0} log(1 + sigma_n/w_n) - beta (1 - 1/q) int_0^{beta/2} G Sigma
// order by order. The Matsubara sum's tail 2 Sigma(0+)/w^2 - 2 (Sigma”(0+) + Sigma(0+)^2)/w^4
// is subtracted with 2/(w^2+1) and 2/(w^2+1)^2 and their exact sums added back.
func deltaLogZ(gr *numeric.HalfGrid, sig [][]float64, in, p []float64, n int) []float64 {
	invq := fsGeometric(2, 1, n)
	sdd := sigmaSecond(p, n)
	q2 := fsMul(invq, invq, n)
	a1 := make([]float64, n)
	a2 := make([]float64, n)
	const c = 1.0
	for k := range a1 {
		A := 2 * invq[k]
		B := -2 * (sdd[k] + q2[k])
		a1[k] = A / 2
		a2[k] = (B + c*c*A) / 2
	}
	pre := fsMul([]float64{1, 1}, invq, n) // 1 - 1/q = (1+delta)/(2+delta)
	return assembleLogZ(gr, sig, a1, a2, c, fsMul(pre, in, n))
}

func ones(m int) []float64 {
	o := make([]float64, m)
	for i := range o {
		o[i] = 1
	}
	return o
}

func scaled(a []float64, s float64) []float64 {
	o := make([]float64, len(a))
	for i, v := range a {
		o[i] = v * s
	}
	return o
}
