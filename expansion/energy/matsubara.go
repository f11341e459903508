package energy

import (
	"math"

	"qbridge/numeric"
)

// assembleLogZ returns, order by order in the expansion variable,
// log Z = (1/2) log 2 + sum_{n>=0} [log(1 + sigma(w_n)/w_n)]_k - beta inter_k.
// sig[k] are the sine coefficients of Sigma_k (sig[0] nil means sigma_0 = 0)
// and inter_k the coefficients of (1 - 1/q) int_0^{beta/2} G Sigma. The
// Matsubara tail of the log, a1_k 2/w^2 + (a2_k - c^2 a1_k) 2/w^4 + ..., is
// subtracted term by term as a1_k 2/(w^2+c^2) + a2_k 2/(w^2+c^2)^2 and its
// exact sum (numeric.MatsubaraTails) added back.
func assembleLogZ(gr *numeric.HalfGrid, sig [][]float64, a1, a2 []float64, c float64, inter []float64) []float64 {
	n := len(a1)
	sum := make([]numeric.CompSum, n) // compensated: 10^6 frequencies
	u := make([]float64, n)
	l := make([]float64, n)
	for i := 0; i < gr.M(); i++ {
		w := gr.Freq(i)
		u[0] = 1
		if sig[0] != nil {
			u[0] += sig[0][i] / w
		}
		for k := 1; k < n; k++ {
			u[k] = sig[k][i] / w
		}
		numeric.LogSeriesInto(l, u)
		d := w*w + c*c
		f1 := 2 / d
		f2 := f1 / d
		for k := range sum {
			sum[k].Add(l[k] - a1[k]*f1 - a2[k]*f2)
		}
	}
	s1, s2 := numeric.MatsubaraTails(gr.Beta(), c)
	out := make([]float64, n)
	for k := range out {
		out[k] = sum[k].Sum() + a1[k]*s1 + a2[k]*s2 - gr.Beta()*inter[k]
	}
	out[0] += 0.5 * math.Ln2
	return out
}
