package numeric

import (
	"math"

	"qbridge/numeric/dd"
)

// The eps-series map in double-double arithmetic (epsMapDD) and the
// constants it needs (newEpsConstDD): the same map as epsMap, on the same
// grid, with every constant, model, tilt, Mellin weight and transform at
// about 32 digits. The refinement (refineEpsDD) evaluates only residuals
// with it and solves the corrections with the float64 linear map.

// newEpsConstDD is newEpsConst in double-double.
func newEpsConstDD(k int) (q, qm1, j2, b, gtc []dd.Float) {
	mk := func() []dd.Float { return make([]dd.Float, k) }
	q, qm1 = mk(), mk()
	for i := range q {
		q[i], qm1[i] = dd.New(2), dd.New(2)
	}
	qm1[0] = dd.New(1)
	logq := mk()
	logq[0] = dd.Ln2
	for i := 1; i < k; i++ {
		logq[i] = dd.New(1).DivFloat(float64(i))
	}
	lj2 := mk()
	for i := range lj2 {
		lj2[i] = qm1[i].Mul(dd.Ln2).Sub(logq[i])
	}
	j2 = mk()
	ddExpInto(j2, lj2)
	cosS, sincS, xcot := mk(), mk(), mk()
	x := dd.Pi.Ldexp(-1)
	pw := dd.New(1) // x^{2i}/(2i)!
	for i := 0; 2*i < k; i++ {
		sign := 1.0
		if i%2 == 1 {
			sign = -1
		}
		cosS[2*i] = pw.MulFloat(sign)
		sincS[2*i] = pw.MulFloat(sign).DivFloat(float64(2*i + 1))
		pw = pw.Mul(x).Mul(x).DivFloat(float64((2*i + 1) * (2*i + 2)))
	}
	inv := mk()
	ddInvInto(inv, sincS)
	ddMulInto(xcot, cosS, inv)
	lbq := mk()
	ddLogInto(lbq, xcot)
	lbq[0] = lbq[0].Sub(dd.Log(dd.Pi).Ldexp(1))
	invq := mk()
	invq[0] = dd.New(0.5)
	if k > 1 {
		invq[1] = dd.New(-0.5)
	}
	d := mk()
	for i := range d {
		d[i] = lbq[i].Sub(lj2[i])
	}
	logB := mk()
	ddMulInto(logB, invq, d)
	b = mk()
	ddExpInto(b, logB)
	lm := mk()
	ddLogInto(lm, sincS)
	lm[0] = lm[0].Add(dd.Log(dd.Pi.Ldexp(-1)))
	if k > 1 {
		lm[1] = lm[1].Add(dd.EulerGamma)
	}
	for j := 2; j < k; j++ {
		lm[j] = lm[j].Add(dd.Zeta(j).DivFloat(float64(j)))
	}
	qlb := mk()
	ddMulInto(qlb, qm1, logB)
	lg := mk()
	for i := range lg {
		lg[i] = lj2[i].Add(qlb[i]).Add(lm[i]).Neg()
	}
	lg[0] = lg[0].Sub(dd.Ln2)
	gtc = mk()
	ddExpInto(gtc, lg)
	return q, qm1, j2, b, gtc
}

// ddExpLinear sets dst = exp(c0 + c1 e).
func ddExpLinear(dst []dd.Float, c0, c1 dd.Float) {
	v := dd.Exp(c0)
	for k := range dst {
		dst[k] = v
		v = v.Mul(c1).DivFloat(float64(k + 1))
	}
}

// epsMapDD is epsMap in double-double (arrays coefficient-major, a[k*n+i]).
type epsMapDD struct {
	n, free, freqPin   int
	fft                *dd.FFT
	q, qm1, j2, b, gtc []dd.Float
	kernS, kernG       [][]dd.Complex
	x                  []dd.Float // log tau_i
	tiltS, gOut        []dd.Float
	sigOut, gIn        []dd.Float
	w2d, gModel        []dd.Float
	gtModel            []dd.Float
	sModel, sigModel   []dd.Float
	bufA, bufB, sigT   []dd.Float
	coefS, coefG       [][]dd.Complex
	coefTmp            []dd.Complex
	tmp                [6][]dd.Float
}

// newEpsMapDD builds the double-double map on the grid of m (tilt eps,
// kernel radius kr, k orders). The grid points are x_i = x0 + i step
// exactly (x0 and step as the float64 grid holds them).
func newEpsMapDD(m *epsMap, eps, kr float64, k int) (*epsMapDD, error) {
	n := m.n
	fft, err := dd.NewFFT(n)
	if err != nil {
		return nil, err
	}
	md := &epsMapDD{n: n, free: m.free, freqPin: m.freqPin, fft: fft}
	md.q, md.qm1, md.j2, md.b, md.gtc = newEpsConstDD(k)
	e := dd.New(eps)
	md.kernS = epsKernelDD(n, m.grid.step, dd.New(-1).Add(e), kr, k)
	md.kernG = epsKernelDD(n, m.grid.step, e.Neg(), kr, k)
	mk := func(l int) []dd.Float { return make([]dd.Float, l) }
	md.x = mk(n)
	md.tiltS, md.gOut, md.sigOut, md.gIn = mk(n), mk(n), mk(n), mk(n)
	md.w2d, md.gModel, md.gtModel, md.sModel, md.sigModel = mk(n*k), mk(n*k), mk(n*k), mk(n*k), mk(n*k)
	md.bufA, md.bufB, md.sigT = mk(n*k), mk(n*k), mk(n*k)
	md.coefS, md.coefG = make([][]dd.Complex, k), make([][]dd.Complex, k)
	for i := range md.coefS {
		md.coefS[i] = make([]dd.Complex, n/2+1)
		md.coefG[i] = make([]dd.Complex, n/2+1)
	}
	md.coefTmp = make([]dd.Complex, n/2+1)
	for i := range md.tmp {
		md.tmp[i] = mk(k)
	}
	invq := mk(k)
	invq[0] = dd.New(0.5)
	if k > 1 {
		invq[1] = dd.New(-0.5)
	}
	a, la := mk(k), mk(k) // a = sqrt(1 - eps)
	for j := 1; j < k; j++ {
		la[j] = dd.New(-0.5).DivFloat(float64(j))
	}
	ddExpInto(a, la)
	t0, t1, t2 := md.tmp[0], md.tmp[1], md.tmp[2]
	x0, step := dd.New(m.grid.x0), dd.New(m.grid.step)
	for i := 0; i < n; i++ {
		x := x0.Add(step.MulFloat(float64(i)))
		md.x[i] = x
		md.tiltS[i] = dd.Exp(e.Mul(x).Neg())
		md.gOut[i] = dd.Exp(e.Mul(x)).Div(dd.Pi)
		tau := dd.Exp(x)
		if tau.Hi > 1e4 {
			// e^{-tau} underflows: both UV models vanish (and tau itself
			// may be infinite, which double-double products turn into NaN).
			for j := range t1 {
				t1[j] = dd.Float{}
			}
			md.setAt(md.gtModel, i, t1)
			md.setAt(md.sModel, i, t1)
		} else {
			md.uvModels(i, x, tau, e, a, invq)
		}
		y := x0.Add(step.MulFloat(float64(n - 1 - i))).Neg()
		md.sigOut[i] = dd.Exp(e.Mul(y).Neg()).MulFloat(2)
		md.gIn[i] = dd.Exp(e.Mul(y))
		ddExpLinear(t0, y, y.Neg())
		md.setAt(md.w2d, i, t0)
		w := dd.Exp(y)
		w2 := w.Mul(w)
		for j := range t1 {
			t1[j] = dd.Float{}
		}
		t1[0] = w2.AddFloat(1)
		if k > 1 {
			t1[1] = dd.New(-1)
		}
		ddInvInto(t2, t1)
		ddExpLinear(t0, y, y)
		ddMulInto(t1, t0, t2)
		md.setAt(md.gModel, i, t1)
		ddExpLinear(t0, dd.Log(w.MulFloat(2).Div(w2.AddFloat(1))), y.Neg())
		ddMulInto(t1, invq, t0)
		md.setAt(md.sigModel, i, t1)
	}
	return md, nil
}

// uvModels sets the UV models at point i: tau^{1-eps} e^{-a tau}/2 and
// (1/q) e^{-tau} tau^{1+eps-Tilt} (see epsMap).
func (md *epsMapDD) uvModels(i int, x, tau, e dd.Float, a, invq []dd.Float) {
	t0, t1 := md.tmp[3], md.tmp[4]
	for j := range t0 {
		t0[j] = a[j].Mul(tau).Neg()
	}
	t0[0] = t0[0].Add(x).Sub(dd.Ln2)
	if len(t0) > 1 {
		t0[1] = t0[1].Sub(x)
	}
	ddExpInto(t1, t0)
	md.setAt(md.gtModel, i, t1)
	ddExpLinear(t0, dd.New(1).Sub(e).Mul(x).Sub(tau), x)
	ddMulInto(t1, invq, t0)
	md.setAt(md.sModel, i, t1)
}

func (md *epsMapDD) at(a []dd.Float, i int, dst []dd.Float) {
	for j := range dst {
		dst[j] = a[j*md.n+i]
	}
}

func (md *epsMapDD) setAt(a []dd.Float, i int, v []dd.Float) {
	for j, x := range v {
		a[j*md.n+i] = x
	}
}

// sineTop is epsMap.sineTop in double-double.
func (md *epsMapDD) sineTop(dst, src []dd.Float, kern, coef [][]dd.Complex, top int) {
	n := md.n
	md.fft.Coefficients(coef[top], src[top*n:(top+1)*n])
	h := n / 2
	c := md.coefTmp
	for mode := 0; mode <= h; mode++ {
		w := kern[mode]
		var s dd.Complex
		for l := 0; l <= top; l++ {
			s = s.Add(coef[l][mode].Mul(w[top-l]))
		}
		v := s.Conj()
		if mode == h {
			v.Im = dd.Float{}
		}
		c[mode] = v
	}
	md.fft.Sequence(dst[top*n:(top+1)*n], c)
}

// apply is epsMap.apply in double-double: it sets order k-1 of out from gt,
// reusing the transforms of the lower orders from earlier calls.
func (md *epsMapDD) apply(out, gt []dd.Float, k int) {
	n, top := md.n, k-1
	g, lg, pw, s := md.tmp[0][:k], md.tmp[1][:k], md.tmp[2][:k], md.tmp[3][:k]
	for i := 0; i < n; i++ {
		md.at(gt, i, g)
		ddLogInto(lg, g)
		ddMulInto(pw, md.qm1[:k], lg)
		ddExpInto(lg, pw)
		ddMulInto(s, md.j2[:k], lg)
		md.bufA[top*n+i] = s[top].Mul(md.tiltS[i]).Sub(md.sModel[top*n+i])
	}
	md.sineTop(md.sigT, md.bufA, md.kernS, md.coefS, top)
	den, gt2 := md.tmp[0][:k], md.tmp[1][:k]
	for i := 0; i < n; i++ {
		var v dd.Float
		if i < md.freqPin {
			v = md.gtc[top]
		} else {
			md.at(md.w2d, i, den)
			for j := 0; j < k; j++ {
				den[j] = den[j].Add(md.sigT[j*n+i].Mul(md.sigOut[i])).Add(md.sigModel[j*n+i])
			}
			ddInvInto(gt2, den)
			v = gt2[top]
		}
		md.bufA[top*n+i] = v.Sub(md.gModel[top*n+i]).Mul(md.gIn[i])
	}
	md.sineTop(md.bufB, md.bufA, md.kernG, md.coefG, top)
	for i := 0; i < md.free; i++ {
		out[top*n+i] = md.bufB[top*n+i].Mul(md.gOut[i]).Add(md.gtModel[top*n+i])
	}
	for i := md.free; i < n; i++ {
		out[top*n+i] = md.b[top]
	}
}

// weightedMax returns max_i |r_i| w_i.
func weightedMax(r []dd.Float, w []float64) float64 {
	m := 0.0
	for i, v := range r {
		if d := math.Abs(v.Float64()) * w[i]; d > m || math.IsNaN(d) {
			m = d
		}
	}
	return m
}
