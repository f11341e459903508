package conformal

import (
	"errors"
	"math"
	"math/big"
	"strconv"
	"sync"

	"qbridge/series/scalar"
)

// twoGammaKernel evaluates log|k_A(h)| at one real q in the form with two
// Gamma functions. The reflection formula on Gamma(1/2 + D - h/2) and
// Gamma(3/2 - D - h/2) and the duplication formula
// Gamma(z) Gamma(z + 1/2) = 2^(1-2z) sqrt(pi) Gamma(2z) (DLMF 5.5.3, 5.5.5)
// turn PHYSICS.md's four-Gamma k_A (D = 1/q) into
//
//	k_A(h) = -(q-1) C 2^(2-4D) Gamma(h-1+2D)/Gamma(h+1-2D)
//	         * (-cos(pi(h/2+D)))/cos(pi(h/2-D)),
//	C = Gamma(3/2-D) Gamma(1-D)/(Gamma(1/2+D) Gamma(D)),
//
// which at q = 4 is PHYSICS.md's -(3/2) tan(pi(h-1/2)/2)/(h-1/2). The
// scalar root search needs two Gamma functions and a sine and cosine per
// step instead of four Gamma functions and four digammas. Above h = 1 both
// Gamma arguments are positive, the fast case of BigLogGamma.
type twoGammaKernel struct {
	q, d *big.Float
	// logConst is log|(q-1) C 2^(2-4D)| at the precision of q.
	logConst *big.Float
}

func newTwoGammaKernel(q *big.Float) *twoGammaKernel {
	d := new(big.Float).SetPrec(q.Prec()).Quo(big.NewFloat(1), q)
	return &twoGammaKernel{q: q, d: d}
}

// kernelConstants keeps log|(q-1) C 2^(2-4D)| by q and precision: the
// dimensions h_1, h_2, ... at one q share it.
var kernelConstants struct {
	sync.Mutex
	m map[string]*big.Float
}

// resetKernelConstants empties the cache (benchmarks time the first use).
func resetKernelConstants() {
	kernelConstants.Lock()
	kernelConstants.m = nil
	kernelConstants.Unlock()
}

// constant returns log|(q-1) C 2^(2-4D)| at prec bits (at most the
// precision of q).
func (k *twoGammaKernel) constant(prec uint) (*big.Float, error) {
	if k.logConst == nil {
		key := k.q.Text('p', 0) + "/" + strconv.Itoa(int(k.q.Prec()))
		kernelConstants.Lock()
		c, ok := kernelConstants.m[key]
		kernelConstants.Unlock()
		if !ok {
			var err error
			if c, err = k.computeConstant(k.q.Prec()); err != nil {
				return nil, err
			}
			kernelConstants.Lock()
			if kernelConstants.m == nil || len(kernelConstants.m) > 256 {
				kernelConstants.m = map[string]*big.Float{}
			}
			kernelConstants.m[key] = c
			kernelConstants.Unlock()
		}
		k.logConst = c
	}
	return new(big.Float).SetPrec(min(prec, k.logConst.Prec())).Set(k.logConst), nil
}

func (k *twoGammaKernel) computeConstant(prec uint) (*big.Float, error) {
	wp := prec + 16
	d := new(big.Float).SetPrec(wp).Set(k.d)
	lg := func(a, b int64, sign int) (*big.Float, error) { // log Gamma(a/b + sign D)
		x := new(big.Float).SetPrec(wp).Quo(big.NewFloat(float64(a)), big.NewFloat(float64(b)))
		if sign > 0 {
			x.Add(x, d)
		} else {
			x.Sub(x, d)
		}
		return scalar.BigLogGamma(x, wp)
	}
	sum := new(big.Float).SetPrec(wp)
	for _, t := range []struct {
		a, b int64
		sign int
		plus bool
	}{{3, 2, -1, true}, {1, 1, -1, true}, {1, 2, 1, false}, {0, 1, 1, false}} {
		v, err := lg(t.a, t.b, t.sign)
		if err != nil {
			return nil, err
		}
		if t.plus {
			sum.Add(sum, v)
		} else {
			sum.Sub(sum, v)
		}
	}
	qm1 := new(big.Float).SetPrec(wp).Sub(k.q, big.NewFloat(1))
	lq, err := scalar.BigLog(qm1, wp)
	if err != nil {
		return nil, err
	}
	sum.Add(sum, lq)
	two := new(big.Float).SetPrec(wp).Mul(d, big.NewFloat(-4))
	two.Add(two, big.NewFloat(2))
	two.Mul(two, scalar.Ln2(wp))
	sum.Add(sum, two)
	return sum.SetPrec(prec), nil
}

// at returns L = log|k_A(h)| at pL bits and dL/dh at pD bits (Newton
// needs the slope only to the accuracy it gains in one step).
func (k *twoGammaKernel) at(h *big.Float, pL, pD uint) (L, dL *big.Float, err error) {
	c, err := k.constant(pL)
	if err != nil {
		return nil, nil, err
	}
	wp := pL + 16
	twoD := new(big.Float).SetPrec(wp).Mul(k.d, big.NewFloat(2))
	a := new(big.Float).SetPrec(wp).Sub(h, big.NewFloat(1))
	a.Add(a, twoD) // h - 1 + 2D
	b := new(big.Float).SetPrec(wp).Add(h, big.NewFloat(1))
	b.Sub(b, twoD) // h + 1 - 2D
	ga, err := scalar.BigLogGamma(a, wp)
	if err != nil {
		return nil, nil, err
	}
	gb, err := scalar.BigLogGamma(b, wp)
	if err != nil {
		return nil, nil, err
	}
	pi := scalar.Pi(wp)
	half := new(big.Float).SetPrec(wp).Quo(h, big.NewFloat(2))
	xp := new(big.Float).SetPrec(wp).Add(half, k.d)
	xp.Mul(xp, pi) // pi (h/2 + D)
	xm := new(big.Float).SetPrec(wp).Sub(half, k.d)
	xm.Mul(xm, pi) // pi (h/2 - D)
	sp, cp := scalar.BigSinCos(xp, wp)
	sm, cm := scalar.BigSinCos(xm, wp)
	if cp.Sign() == 0 || cm.Sign() == 0 {
		return nil, nil, errors.New("expansion: pole or zero of k_A reached")
	}
	lcp, err := scalar.BigLog(new(big.Float).Abs(cp), wp)
	if err != nil {
		return nil, nil, err
	}
	lcm, err := scalar.BigLog(new(big.Float).Abs(cm), wp)
	if err != nil {
		return nil, nil, err
	}
	L = new(big.Float).SetPrec(wp).Add(c, ga)
	L.Sub(L, gb)
	L.Add(L, lcp)
	L.Sub(L, lcm)
	// dL/dh = psi(a) - psi(b) - (pi/2) tan(xp) + (pi/2) tan(xm)
	pa, err := scalar.BigDigamma(new(big.Float).SetPrec(pD).Set(a), pD)
	if err != nil {
		return nil, nil, err
	}
	pb, err := scalar.BigDigamma(new(big.Float).SetPrec(pD).Set(b), pD)
	if err != nil {
		return nil, nil, err
	}
	dL = new(big.Float).SetPrec(pD).Sub(pa, pb)
	tp := new(big.Float).SetPrec(pD).Quo(sp, cp)
	tm := new(big.Float).SetPrec(pD).Quo(sm, cm)
	tm.Sub(tm, tp)
	tm.Mul(tm, pi)
	tm.Quo(tm, big.NewFloat(2))
	dL.Add(dL, tm)
	return L.SetPrec(pL), dL, nil
}

// float64At returns log|k_A(h)| and the sign of k_A(h) in float64.
func (k *twoGammaKernel) float64At(h float64) (L float64, sign int) {
	d, _ := k.d.Float64()
	q, _ := k.q.Float64()
	lc := func(x float64) float64 { v, _ := math.Lgamma(x); return v }
	c := math.Log(q-1) + lc(1.5-d) + lc(1-d) - lc(0.5+d) - lc(d) + (2-4*d)*math.Ln2
	ga, sa := math.Lgamma(h - 1 + 2*d)
	gb, sb := math.Lgamma(h + 1 - 2*d)
	t := -math.Cos(math.Pi*(h/2+d)) / math.Cos(math.Pi*(h/2-d))
	// k_A = -(q-1) C 2^(2-4D) (Gamma(a)/Gamma(b)) t with (q-1) C 2^(2-4D) > 0
	sign = -sa * sb
	if t < 0 {
		sign = -sign
	}
	return c + ga - gb + math.Log(math.Abs(t)), sign
}

// bracket returns an interval of about 1e-13 relative width around the
// root h_n of k_A(h) = +1 between the pole at 2n+1+2D and the zero at
// 2n+3-2D, by a float64 sign scan and bisection; ok is false where float64
// cannot resolve it (the caller then takes the general route).
func (k *twoGammaKernel) bracket(n int) (lo, hi float64, ok bool) {
	d, _ := k.d.Float64()
	p, z := float64(2*n+1)+2*d, float64(2*n+3)-2*d
	w := z - p
	if !(w > 1e-6) {
		return 0, 0, false
	}
	// f = log|k_A| restricted to k_A > 0; it falls from +inf at the pole
	// side or rises from -inf at the zero side: scan for a sign change
	f := func(h float64) (float64, bool) {
		L, s := k.float64At(h)
		return L, s > 0 && !math.IsNaN(L) && !math.IsInf(L, 0)
	}
	// uniform samples, and geometric ones crowding towards both ends, where
	// the root sits at large q or n (near the pole) and near q = 2
	const m = 256
	var hs []float64
	for j := 40; j > 8; j-- {
		hs = append(hs, p+w*math.Ldexp(1, -j))
	}
	for i := 1; i < m; i++ {
		hs = append(hs, p+w*float64(i)/m)
	}
	for j := 9; j <= 40; j++ {
		hs = append(hs, z-w*math.Ldexp(1, -j))
	}
	prevH, prevF, have := 0.0, 0.0, false
	for _, h := range hs {
		v, good := f(h)
		if !good {
			have = false
			continue
		}
		if have && (v > 0) != (prevF > 0) {
			lo, hi = prevH, h
			flo := prevF
			for j := 0; j < 80 && hi-lo > 1e-13*hi; j++ {
				mid := 0.5 * (lo + hi)
				fm, g := f(mid)
				if !g {
					return 0, 0, false
				}
				if (fm > 0) == (flo > 0) {
					lo, flo = mid, fm
				} else {
					hi = mid
				}
			}
			return lo, hi, true
		}
		prevH, prevF, have = h, v, true
	}
	return 0, 0, false
}

// root solves log|k_A(h)| = 0 by Newton's method from h, known to about
// acc bits, inside [lo, hi], to prec bits. The working precision follows
// the accuracy: a step from acc bits gains about 2 acc - 8, so L is
// evaluated at 2 acc + 24 bits and its slope at acc + 24, and the
// iteration stops once a step at full precision is so small that the next
// one (about its square) would lie below 2^-prec.
func (k *twoGammaKernel) root(h, lo, hi *big.Float, acc int, prec uint) (*big.Float, error) {
	full := int(prec) + 16
	h = new(big.Float).SetPrec(uint(full)).Set(h)
	for it := 0; it < 100; it++ {
		pL := min(2*acc+24, full)
		pD := min(acc+24, full)
		L, dL, err := k.at(h, uint(pL), uint(max(pD, 64)))
		if err != nil {
			return nil, err
		}
		if dL.Sign() == 0 {
			return nil, errors.New("expansion: zero slope of k_A in Newton's method")
		}
		step := new(big.Float).SetPrec(uint(full)).Quo(L, dL)
		h.Sub(h, step)
		if h.Cmp(lo) < 0 || h.Cmp(hi) > 0 {
			return nil, errors.New("expansion: Newton step left the bracket of the root")
		}
		scale := max(h.MantExp(nil), 1)
		if step.Sign() == 0 {
			return h.SetPrec(prec), nil
		}
		gained := scale - step.MantExp(nil) // bits of the step below h
		if pL == full && 2*gained-8 >= int(prec)+4 {
			return h.SetPrec(prec), nil
		}
		acc = max(min(2*gained-8, pL-8), acc+1)
	}
	return nil, errors.New("expansion: Newton iteration for the root did not converge in 100 steps")
}
