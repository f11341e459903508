package numeric

import (
	"math"

	"qbridge/numeric/dd"
)

// The double-double Mellin weights of the eps-series solve: the same
// eps-series as epsKernel, M(p0 - eps + i eta_m) e^{-2 pi i m/N}/N, with
// every value and the Cauchy sums in double-double arithmetic. They are
// the first piece of an extended-precision eps-series solve: in float64
// the weights' round-off (1e-16 of the largest |M| on the circle, times
// r^-j at order j) is one of the sources the order-by-order solve
// amplifies about tenfold per order.

// mellinSineDD is mellinSine in double-double: M(s) = -(pi/2) / (Gamma(-s)
// sin(pi s/2)) (DLMF 5.5.3 and 5.9.7), with 1/Gamma entire so that the
// poles of Gamma(-s) at s = 0, 1, ... cancel the zeros of the sine.
func mellinSineDD(s dd.Complex) dd.Complex {
	halfPi := dd.Pi.Ldexp(-1)
	rg := dd.RecipGamma(s.Neg())
	sn := dd.CSin(s.Scale(halfPi))
	return rg.Div(sn).Scale(halfPi.Neg())
}

// kernelAliasDD is the aliasing target of the double-double Cauchy sums:
// the coefficient of eps^j picks up (r/R)^nc of the one of eps^(j+nc), R
// the distance to M's first pole, so nc is chosen per mode with
// (r/R)^nc below it.
const kernelAliasDD = 1e-34

// cauchyNodesDD returns the number of nodes (a multiple of 8, at least
// 2k + 8) that makes (ratio)^nc < kernelAliasDD.
func cauchyNodesDD(ratio float64, k int) int {
	nc := int(math.Ceil(math.Log(kernelAliasDD) / math.Log(ratio)))
	nc = max(nc, 2*k+8)
	return (nc + 7) / 8 * 8
}

// epsKernelDD returns, per Fourier mode m of a grid of n points and step
// step in log tau, the eps-series (k terms) of M(p0 - eps + i eta_m)
// e^{-2 pi i m/n}/n in double-double, from Cauchy sums on the circle of
// epsKernel (radius kr times the distance to the pole at s = -2, at most
// kernelMaxRadius) with as many nodes as double-double aliasing needs:
// 256 at the lowest modes, about 40 where the circle is small against the
// distance to the pole.
func epsKernelDD(n int, step float64, p0 dd.Float, kr float64, k int) [][]dd.Complex {
	out := make([][]dd.Complex, n/2+1)
	rots := map[int][]dd.Complex{}
	rotation := func(nc int) []dd.Complex {
		if r, ok := rots[nc]; ok {
			return r
		}
		r := make([]dd.Complex, nc)
		for l := range r {
			s, c := dd.SinCos(dd.Pi.MulFloat(2 * float64(l)).DivFloat(float64(nc))) // nc is not a power of two: divide in double-double
			r[l] = dd.Complex{Re: c, Im: s}                                         // e^{2 pi i l/nc}
		}
		rots[nc] = r
		return r
	}
	nStep := float64(n) * step
	for m := range out {
		eta := dd.Pi.MulFloat(2 * float64(m)).DivFloat(nStep)
		dist := math.Hypot(p0.Float64()+2, eta.Float64())
		r := math.Min(kr*dist, kernelMaxRadius)
		nc := cauchyNodesDD(r/dist, k)
		rot := rotation(nc)
		ps, pc := dd.SinCos(dd.Pi.MulFloat(-2 * float64(m) / float64(n)))
		ph := dd.Complex{Re: pc.DivFloat(float64(n)), Im: ps.DivFloat(float64(n))}
		vals := make([]dd.Complex, nc)
		for l := range vals {
			e := rot[l].Scale(dd.New(r))
			vals[l] = mellinSineDD(dd.Complex{Re: p0.Sub(e.Re), Im: eta.Sub(e.Im)})
		}
		c := make([]dd.Complex, k)
		rj := dd.New(1)
		for j := range c {
			var s dd.Complex
			for l, v := range vals {
				s = s.Add(v.Mul(rot[(nc-(l*j)%nc)%nc])) // e^{-2 pi i lj/nc}
			}
			c[j] = s.Scale(rj.MulFloat(float64(nc)).Inv()).Mul(ph)
			rj = rj.MulFloat(r)
		}
		out[m] = c
	}
	return out
}
