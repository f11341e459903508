package conformal

import (
	"fmt"
	"math"
	"math/big"
	"math/cmplx"
	"sync"

	"qbridge/series/scalar"
)

// The type check of a refined collision in complex128 arithmetic. Beside
// the point, at s = s*(1 - d) with d = 1e-8 and 1e-12, the two roots of
// k_A(h) = 1 lie h* +- A d^(1/2) apart, so k_A - 1 = O(d) there and k_A
// itself must be known to far better than d: a plain complex128 k_A is not
// enough, and big-float Newton steps were most of the cost of a map. Here
// log k_A(h* + eta, D* + xi) - log k_A(h*, D*) is summed instead as the
// Taylor series of each log Gamma about the refined point, whose terms are
// each small, so that complex128 carries them to full relative accuracy;
// the constant and the h-linear term (which cancel to the refinement
// precision) come from the big-float jet. The roots are then found by
// Newton's method on that series: a test of the local form that fails when
// the point is not a simple square-root branch point.

// taylorOrder is the highest power of the log Gamma Taylor series.
const taylorOrder = 14

// zetaShift is the real part from which the Hurwitz zeta tail is summed by
// Euler-Maclaurin.
const zetaShift = 16

// bernFact holds B_2i/(2i)! for i = 1..zetaTerms.
var bernFact struct {
	once sync.Once
	v    []float64
	err  error
}

const zetaTerms = 12

func bernoulliOverFactorial() ([]float64, error) {
	bernFact.once.Do(func() {
		f := new(big.Rat).SetInt64(1)
		for i := 1; i <= zetaTerms; i++ {
			f.Mul(f, big.NewRat(int64((2*i-1)*(2*i)), 1))
			b, err := scalar.Bernoulli(2 * i)
			if err != nil {
				bernFact.err = err
				return
			}
			v, _ := new(big.Rat).Quo(b, f).Float64()
			bernFact.v = append(bernFact.v, v)
		}
	})
	return bernFact.v, bernFact.err
}

// lgammaTaylor128 returns a[1..order] with log Gamma(z + t) =
// log Gamma(z) + sum_k a[k] t^k for |t| below the distance from z to the
// nearest pole: a[1] = psi(z), a[k] = (-1)^k zeta(k, z)/k for k >= 2
// (DLMF 5.7.3 with 25.11.12), the Hurwitz zeta values summed directly up to
// Re(z + m) >= zetaShift and by Euler-Maclaurin (DLMF 25.11.6 remainder
// dropped past the B_(2 zetaTerms) term) beyond.
func lgammaTaylor128(z complex128, order int) ([]complex128, error) {
	bf, err := bernoulliOverFactorial()
	if err != nil {
		return nil, err
	}
	if real(z) < -200 || math.Abs(imag(z)) > 1e6 {
		return nil, fmt.Errorf("expansion: log Gamma Taylor series at %v out of range", z)
	}
	a := make([]complex128, order+1)
	a[1] = psi128(z)
	zeta := make([]complex128, order+1)
	w := z
	for real(w) < zetaShift {
		r := 1 / w
		if !finite128(r) {
			return nil, fmt.Errorf("%w: log Gamma Taylor series at a pole", scalar.ErrPole)
		}
		pw := r
		for k := 2; k <= order; k++ {
			pw *= r
			zeta[k] += pw
		}
		w++
	}
	r := 1 / w
	for k := 2; k <= order; k++ {
		// zeta(k, w) ~ w^(1-k)/(k-1) + w^(-k)/2
		//            + sum_i B_2i/(2i)! k (k+1) ... (k+2i-2) w^(-k-2i+1)
		wk := cmplx.Pow(r, complex(float64(k-1), 0))
		tail := wk/complex(float64(k-1), 0) + 0.5*wk*r
		rise := float64(k)
		pw := wk * r // w^-k
		for i := 1; i <= zetaTerms; i++ {
			term := complex(bf[i-1]*rise, 0) * pw * r
			tail += term
			if cmplx.Abs(term) < 1e-18*cmplx.Abs(tail) {
				break
			}
			rise *= float64((k + 2*i - 1) * (k + 2*i))
			pw *= r * r
		}
		zeta[k] += tail
		sg := 1.0
		if k%2 == 1 {
			sg = -1
		}
		a[k] = complex(sg/float64(k), 0) * zeta[k]
	}
	return a, nil
}

// logRatioSeries is log k_A(h* + eta, D* + xi) - log k_A(h*, D*) as a
// function of eta at fixed xi, from the Taylor data of the eight Gamma
// factors (PHYSICS.md section 4) about (h*, D*).
type logRatioSeries struct {
	xi     complex128
	l0, lh complex128 // log k_A and L_h at the point (big-float jet)
	base   complex128 // the eta-independent part beyond l0
	a      [][]complex128
	order  int
}

// newLogRatioSeries sets up the series at (h0, d0) in complex128; l0 and
// lh are log k_A and L_h there from the refinement.
func newLogRatioSeries(h0, d0, xi, l0, lh complex128) (*logRatioSeries, error) {
	r := &logRatioSeries{xi: xi, l0: l0, lh: lh, order: taylorOrder}
	// log(1 - 1/D) = log(D - 1) - log D
	u1, u2 := xi/(d0-1), xi/d0
	if cmplx.Abs(u1) > 0.1 || cmplx.Abs(u2) > 0.1 {
		return nil, fmt.Errorf("expansion: the type check steps too close to D = 0 or 1")
	}
	r.base = log1pSmall(u1) - log1pSmall(u2)
	for _, f := range kernelArgs {
		z := complex(f.a, 0) + complex(f.b, 0)*h0 + complex(f.c, 0)*d0
		a, err := lgammaTaylor128(z, r.order)
		if err != nil {
			return nil, err
		}
		r.a = append(r.a, a)
		r.base += complex(f.sign*f.c, 0) * a[1] * xi
	}
	return r, nil
}

// log1pSmall is log(1 + u) for |u| <= 0.1, summed to u^40.
func log1pSmall(u complex128) complex128 {
	s, p := complex(0, 0), complex(1, 0)
	for k := 1; k <= 40; k++ {
		p *= u
		t := p / complex(float64(k), 0)
		if k%2 == 0 {
			t = -t
		}
		s += t
		if cmplx.Abs(p) < 1e-20*cmplx.Abs(s) {
			break
		}
	}
	return s
}

// eval returns the series F(eta), F'(eta) and the size of its last terms
// (the truncation estimate).
func (r *logRatioSeries) eval(eta complex128) (f, df complex128, last float64) {
	f = r.l0 + r.base + r.lh*eta
	df = r.lh
	for i, fa := range kernelArgs {
		t := complex(fa.b, 0)*eta + complex(fa.c, 0)*r.xi
		sb := complex(fa.sign, 0)
		pw := t // t^(k-1)
		for k := 2; k <= r.order; k++ {
			df += sb * complex(fa.b*float64(k), 0) * r.a[i][k] * pw
			pw *= t
			f += sb * r.a[i][k] * pw
		}
		last += cmplx.Abs(r.a[i][r.order] * pw)
	}
	return f, df, last
}

// root solves F(eta) = 0 by Newton's method from eta0.
func (r *logRatioSeries) root(eta0 complex128) (complex128, error) {
	eta := eta0
	for it := 0; it < 40; it++ {
		f, df, last := r.eval(eta)
		step := f / df
		if !finite128(step) {
			return eta, fmt.Errorf("expansion: Newton's method on k_A = 1 beside the point failed")
		}
		eta -= step
		if cmplx.Abs(step) <= 1e-15*cmplx.Abs(eta) {
			// the dropped terms must not move the root
			if last > 1e-13*cmplx.Abs(df*eta) {
				return eta, fmt.Errorf("expansion: the log Gamma series beside the point converges too slowly (a pole of Gamma is near)")
			}
			return eta, nil
		}
	}
	return eta, fmt.Errorf("expansion: Newton's method on k_A = 1 beside the point did not converge")
}

// checkSquareRoot solves k_A(h) = 1 at s = s*(1 - delta) from
// h* +- A delta^(1/2) (A = c (-s*)^(1/2)) and returns the largest relative
// deviation of (h - h*)/(+-A delta^(1/2)) from 1, which is O(delta^(1/2))
// at a square-root branch point with coefficient c. The roots are found
// from the log Gamma series about the refined point (see above).
func checkSquareRoot(end End, r *refined, delta float64) (float64, error) {
	s0 := r.s.Complex128()
	d0 := deltaOf(end, s0)
	xi := dDelta(end) * complex(-delta, 0) * s0
	l0 := scalar.CSub(r.j.k, cf(1, r.j.k.Re.Prec()), r.j.k.Re.Prec()).Complex128() // log k = k - 1 + O((k-1)^2)
	ser, err := newLogRatioSeries(r.h.Complex128(), d0, xi, l0, r.j.lh.Complex128())
	if err != nil {
		return 0, err
	}
	step := r.a.Complex128() * complex(math.Sqrt(delta), 0)
	worst := 0.0
	var roots []complex128
	for _, sg := range []complex128{1, -1} {
		st := sg * step
		eta, err := ser.root(st)
		if err != nil {
			return 0, err
		}
		worst = math.Max(worst, cmplx.Abs(eta/st-1))
		roots = append(roots, eta)
	}
	if cmplx.Abs(roots[0]-roots[1]) < cmplx.Abs(step) {
		return 0, fmt.Errorf("expansion: the two roots beside the collision coincide")
	}
	return worst, nil
}
