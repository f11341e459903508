package numeric

import (
	"fmt"
	"math"

	"qbridge/numeric/dd"
)

// refineMaxSteps bounds the refinement steps per order; each step gains
// about thirteen digits (the float64 correction solve's relative
// accuracy), so two or three reach the double-double floor.
const refineMaxSteps = 5

// refineEpsDD refines the float64 eps-series solution full (coefficient-
// major, k orders) in double-double, order by order: the residual of the
// double-double map md is computed, the correction solves
// (1 - L) d = residual with L the float64 linearised map (order 1 of a
// two-term map on the same grid, whose linear part is the derivative of
// the q = 2 map at order 0), and is added in double-double. Order 0 is the
// same step applied to a nonlinear map: Newton's method with the Jacobian
// at the float64 solution. It returns the refined solution and, per order,
// the final residual in the weights of the float64 solve.
func refineEpsDD(m *epsMap, md *epsMapDD, p ZeroTParams, kr float64, full []float64, k int) ([]dd.Float, []float64, error) {
	n, free := m.n, m.free
	X := make([]dd.Float, n*k)
	for j := 0; j < k; j++ {
		for i := 0; i < n; i++ {
			if i < free {
				X[j*n+i] = dd.New(full[j*n+i])
			} else {
				X[j*n+i] = md.b[j]
			}
		}
	}
	w := make([]float64, free)
	for i := range w {
		w[i] = md.tiltS[i].Float64() / md.b[0].Float64()
	}
	// The two-term float64 map: order 0 the float64 rounding of X's, its
	// transforms set once; L u = order 1 of map(base + u) - order 1 of
	// map(base), with u scaled to order one so that the source carried in
	// order 1 does not swamp it.
	mL := newEpsMapOn(p, kr, 2, m.grid)
	fl := make([]float64, 2*n)
	outL := make([]float64, 2*n)
	copy(fl[:n], full[:n])
	mL.apply(outL, fl, 1)
	mL.apply(outL, fl, 2)
	base := append([]float64(nil), outL[n:n+free]...)
	outD := make([]dd.Float, n*k)
	r := make([]dd.Float, free)
	rf := make([]float64, free)
	u := make([]float64, free)
	res := make([]float64, k)
	for j := 0; j < k; j++ {
		prev := math.Inf(1)
		for step := 0; ; step++ {
			md.apply(outD, X, j+1)
			for i := 0; i < free; i++ {
				r[i] = outD[j*n+i].Sub(X[j*n+i])
			}
			rn := weightedMax(r, w)
			if math.IsNaN(rn) {
				return nil, nil, fmt.Errorf("numeric: NaN in the double-double refinement of order %d", j)
			}
			res[j] = rn
			if rn == 0 || step == refineMaxSteps || rn > 0.1*prev {
				break
			}
			prev = rn
			for i := range rf {
				rf[i] = r[i].Float64() / rn
			}
			for i := range u {
				u[i] = 0
			}
			fp := fixedPoint{tol: 1e-13, mix: 0.5, active: free, floor: true}
			fr := fp.run(u, func(x, fx []float64) float64 {
				copy(fl[n:n+free], x)
				mL.apply(outL, fl, 2)
				m := 0.0
				for i := 0; i < free; i++ {
					fx[i] = outL[n+i] - base[i] + rf[i] - x[i]
					if d := math.Abs(fx[i]) * w[i]; d > m || math.IsNaN(d) {
						m = d
					}
				}
				return m
			})
			if fr.nanAt > 0 || !fr.converged(1e-13) {
				return nil, nil, fmt.Errorf("numeric: the correction solve of the double-double refinement did not converge at order %d (residual %.3g)", j, fr.bestRes)
			}
			for i := 0; i < free; i++ {
				X[j*n+i] = X[j*n+i].Add(dd.New(u[i]).MulFloat(rn))
			}
		}
		// The loop ends only right after a residual at the kept X, so md
		// holds this order's transforms of X for the next orders.
	}
	return X, res, nil
}

// epsOutputDD fills the grid values, ratios and E_0 of sol from the
// double-double solution X (as the float64 output does from full).
func epsOutputDD(md *epsMapDD, X []dd.Float, k int, step float64, sol *ZeroTEpsSeries) {
	n, free := md.n, md.free
	sol.Tau = make([]float64, free)
	sol.Ratio = make([][]float64, k)
	for j := range sol.Ratio {
		sol.Ratio[j] = make([]float64, free)
	}
	invB := make([]dd.Float, k)
	ddInvInto(invB, md.b)
	mk := func() []dd.Float { return make([]dd.Float, k) }
	g, r, lg, pw, sum := mk(), mk(), mk(), mk(), mk()
	for i := 0; i < n; i++ {
		md.at(X, i, g)
		if i < free {
			sol.Tau[i] = dd.Exp(md.x[i]).Float64()
			ddMulInto(r, g, invB)
			for j := range r {
				sol.Ratio[j][i] = r[j].Float64()
			}
		}
		ddLogInto(lg, g)
		ddMulInto(pw, md.q, lg)
		pw[0] = pw[0].Sub(md.x[i])
		ddExpInto(lg, pw)
		for j := range sum {
			sum[j] = sum[j].Add(lg[j])
		}
	}
	iq := mk()
	iq[0] = dd.New(0.5)
	if k > 1 {
		iq[1] = dd.New(-0.5)
	}
	j2q, e0 := mk(), mk()
	ddMulInto(j2q, md.j2, iq)
	ddMulInto(e0, j2q, sum)
	sol.E0 = make([]float64, k)
	for j := range e0 {
		sol.E0[j] = e0[j].MulFloat(-2 * step).Float64()
	}
	sol.B = make([]float64, k)
	for j := range md.b {
		sol.B[j] = md.b[j].Float64()
	}
}
