package scalar

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"math/bits"
)

// ErrPole is returned when a function is evaluated at one of its poles
// (for Gamma: 0, -1, -2, ...; for a rational approximant: a zero of its
// denominator, to within rounding).
var ErrPole = errors.New("series: argument is a pole")

// errNoConvergence reports an asymptotic series that stopped decreasing
// before reaching the working precision; callers retry with a larger shift.
var errNoConvergence = errors.New("series: asymptotic series did not converge (internal)")

// maxGammaArg bounds |x| for Gamma itself: beyond it Gamma(x) or 1/Gamma(x)
// leaves the exponent range of big.Float (log2 Gamma(2^28) > 2^31).
const maxGammaArgExp = 28

// checkReal rejects a nil or infinite argument.
func checkReal(name string, x *big.Float) error {
	if x == nil {
		return fmt.Errorf("series: %s: nil argument", name)
	}
	if x.IsInf() {
		return fmt.Errorf("%w: %s of an infinite argument", ErrDomain, name)
	}
	return nil
}

// isGammaPole reports whether x is 0, -1, -2, ...
func isGammaPole(x *big.Float) bool {
	return x.Sign() <= 0 && x.IsInt()
}

// stirlingMinArg is the argument above which Stirling's series (and the
// Euler-Maclaurin tail) reaches 2^-wp with about 0.15 wp Bernoulli terms.
// Below it the argument is shifted up by the recurrence. The ratio trades
// the length of the shift against the number of Bernoulli terms.
func stirlingMinArg(wp uint) float64 {
	return 0.2*float64(wp) + 10
}

// shiftCount is the number of unit steps that lift x (> 0) to at least
// minArg; zero when x is already there.
func shiftCount(x *big.Float, minArg float64) int {
	xf, _ := x.Float64()
	if xf >= minArg {
		return 0
	}
	return int(math.Ceil(minArg - xf))
}

// addIntExact returns x + j, exactly whenever the sum cancels (x close to
// -j); otherwise rounded to at least prec bits.
func addIntExact(x *big.Float, j int64, prec uint) *big.Float {
	aj := j
	if aj < 0 {
		aj = -aj
	}
	p := x.MinPrec() + uint(bits.Len64(uint64(aj))) + 2
	if p < prec {
		p = prec
	}
	return new(big.Float).SetPrec(p).Add(x, new(big.Float).SetInt64(j))
}

// splitNearestInt returns n = round(x) and f = x - n exactly, |f| <= 1/2.
func splitNearestInt(x *big.Float, prec uint) (*big.Int, *big.Float) {
	p := x.Prec()
	if p < prec {
		p = prec
	}
	n, _ := x.Int(nil) // truncation toward zero
	f := new(big.Float).SetPrec(p).Sub(x, new(big.Float).SetInt(n))
	half := big.NewFloat(0.5)
	if f.Cmp(half) > 0 {
		n.Add(n, big.NewInt(1))
		f.Sub(f, big.NewFloat(1))
	} else if f.Cmp(new(big.Float).Neg(half)) < 0 {
		n.Sub(n, big.NewInt(1))
		f.Add(f, big.NewFloat(1))
	}
	return n, f
}

// sinCosPi returns sin(pi f) and cos(pi f) for |f| <= 1/2 at prec bits.
func sinCosPi(f *big.Float, prec uint) (*big.Float, *big.Float) {
	p := prec + 8
	a := Pi(p)
	a.Mul(a, f)
	return BigSinCos(a, p)
}

// zivRefine runs f at increasing working precision until the result is
// accurate to prec bits. f returns the value and the binary exponent of the
// largest quantity that was added or subtracted to form it; the difference
// with the exponent of the result is the number of bits lost to
// cancellation. After a few rounds the last value is returned as is (it is
// then accurate in absolute terms, as for a value that is exactly zero).
func zivRefine(prec uint, f func(wp uint) (*big.Float, int, error)) (*big.Float, error) {
	wp := prec + Guard
	for try := 0; ; try++ {
		v, scale, err := f(wp)
		if err != nil {
			return nil, err
		}
		lost := int(wp)
		if v.Sign() != 0 {
			lost = scale - v.MantExp(nil)
		}
		if lost <= Guard/2 || try == 4 || wp >= MaxPrec {
			return v.SetPrec(prec), nil
		}
		if v.Sign() == 0 {
			wp *= 2
		} else {
			wp = prec + Guard + uint(lost) + 16
		}
		if wp > MaxPrec {
			wp = MaxPrec
		}
	}
}

// expOf is the binary exponent of x, with a very negative value for zero so
// that zero never dominates a maximum.
func expOf(x *big.Float) int {
	if x.Sign() == 0 {
		return math.MinInt32
	}
	return x.MantExp(nil)
}

// stirlingTail returns sum_{m>=1} B_{2m} / (den(m) w^(2m-1+off)) with
// winv = 1/w, stopping once a term is below 2^(ref-wp-4). It returns
// errNoConvergence when the terms start growing first.
func stirlingTail(winv *big.Float, off int, den func(m int64) int64, ref int, wp uint) (*big.Float, error) {
	winv2 := new(big.Float).SetPrec(wp).Mul(winv, winv)
	pw := new(big.Float).SetPrec(wp).Set(winv)
	for i := 0; i < off; i++ {
		pw.Mul(pw, winv)
	}
	sum := new(big.Float).SetPrec(wp)
	term := new(big.Float).SetPrec(wp)
	est := int(wp)/6 + 8
	bern := bernoulliEvenFloat(est, wp)
	prevExp := math.MaxInt32
	for m := 1; ; m++ {
		if m > len(bern) {
			if m > 4*int(wp)+100 {
				return nil, errNoConvergence
			}
			bern = bernoulliEvenFloat(2*len(bern), wp)
		}
		term.Mul(bern[m-1], pw)
		term.Quo(term, new(big.Float).SetInt64(den(int64(m))))
		sum.Add(sum, term)
		e := expOf(term)
		if e < ref-int(wp)-4 {
			return sum, nil
		}
		if m > 2 && e > prevExp {
			return nil, errNoConvergence
		}
		prevExp = e
		pw.Mul(pw, winv2)
	}
}

// lgammaStirling returns log Gamma(w) for w >= stirlingMinArg(wp) by
// Stirling's series (DLMF 5.11.1), and the exponent of its largest part.
func lgammaStirling(w *big.Float, wp uint) (*big.Float, int, error) {
	lw, err := BigLog(w, wp)
	if err != nil {
		return nil, 0, err
	}
	main := new(big.Float).SetPrec(wp).Sub(w, big.NewFloat(0.5))
	main.Mul(main, lw)
	scale := expOf(main)
	if e := expOf(w); e > scale {
		scale = e
	}
	main.Sub(main, w)
	main.Add(main, halfLog2Pi(wp))
	winv := new(big.Float).SetPrec(wp).Quo(big.NewFloat(1), w)
	tail, err := stirlingTail(winv, 0, func(m int64) int64 { return 2 * m * (2*m - 1) }, expOf(main), wp)
	if err != nil {
		return nil, 0, err
	}
	return main.Add(main, tail), scale, nil
}

// risingProduct returns x (x+1) ... (x+n-1) for x > 0 at wp bits.
func risingProduct(x *big.Float, n int, wp uint) *big.Float {
	p := new(big.Float).SetPrec(wp).SetInt64(1)
	t := new(big.Float).SetPrec(wp)
	for j := 0; j < n; j++ {
		t.Add(x, new(big.Float).SetInt64(int64(j)))
		p.Mul(p, t)
	}
	return p
}

// lgammaPositive returns log Gamma(x) for x > 0 and the exponent of the
// largest part (for zivRefine): shift to w = x + N >= stirlingMinArg, then
// log Gamma(x) = log Gamma(w) - log(x (x+1) ... (x+N-1)).
func lgammaPositive(x *big.Float, wp uint) (*big.Float, int, error) {
	if x.Cmp(big.NewFloat(1)) == 0 || x.Cmp(big.NewFloat(2)) == 0 {
		return new(big.Float).SetPrec(wp), 0, nil
	}
	minArg := stirlingMinArg(wp)
	for try := 0; try < 6; try, minArg = try+1, 2*minArg {
		n := shiftCount(x, minArg)
		w := new(big.Float).SetPrec(wp).Add(x, new(big.Float).SetInt64(int64(n)))
		v, scale, err := lgammaStirling(w, wp)
		if errors.Is(err, errNoConvergence) {
			continue
		}
		if err != nil {
			return nil, 0, err
		}
		if n > 0 {
			lp, err := BigLog(risingProduct(x, n, wp), wp)
			if err != nil {
				return nil, 0, err
			}
			if e := expOf(lp); e > scale {
				scale = e
			}
			v.Sub(v, lp)
		}
		return v, scale, nil
	}
	return nil, 0, errNoConvergence
}

// lgammaReal returns log|Gamma(x)| for any non-pole x, with the reflection
// log|Gamma(x)| = log pi - log|sin(pi x)| - log Gamma(1-x) for x < 0.
func lgammaReal(x *big.Float, wp uint) (*big.Float, int, error) {
	if x.Sign() > 0 {
		return lgammaPositive(x, wp)
	}
	_, f := splitNearestInt(x, wp)
	s, _ := sinCosPi(f, wp)
	ls, err := BigLog(s.Abs(s), wp)
	if err != nil {
		return nil, 0, err
	}
	y := addIntExact(new(big.Float).Neg(x), 1, wp)
	lg, scale, err := lgammaPositive(y, wp)
	if err != nil {
		return nil, 0, err
	}
	if e := expOf(ls); e > scale {
		scale = e
	}
	if scale < 1 {
		scale = 1
	}
	v := logPi(wp)
	v.Sub(v, ls)
	v.Sub(v, lg)
	return v, scale, nil
}

// BigLogGamma returns log|Gamma(x)| at prec bits. It returns ErrPole at
// x = 0, -1, -2, ... For x > 0 the argument is shifted up by the recurrence
// and Stirling's series with Bernoulli numbers is summed (DLMF 5.11.1); for
// x < 0 the reflection formula (DLMF 5.5.3) is used. Cancellation near the
// zeros of log|Gamma| is detected and the working precision raised.
func BigLogGamma(x *big.Float, prec uint) (*big.Float, error) {
	if err := CheckPrec(prec); err != nil {
		return nil, err
	}
	if err := checkReal("BigLogGamma", x); err != nil {
		return nil, err
	}
	if isGammaPole(x) {
		return nil, fmt.Errorf("%w: log Gamma at %s", ErrPole, x.Text('g', 10))
	}
	return zivRefine(prec, func(wp uint) (*big.Float, int, error) {
		return lgammaReal(x, wp)
	})
}

// factorialFloat returns (n)! for small n >= 0, exactly then rounded.
func factorialFloat(n int64, prec uint) *big.Float {
	f := new(big.Int).MulRange(1, n)
	if n == 0 {
		f.SetInt64(1)
	}
	return new(big.Float).SetPrec(prec).SetInt(f)
}

// gammaPositive returns Gamma(x) for x > 0 at about wp bits: exactly for
// small integers, else exp(log Gamma(w)) / (x (x+1) ... (x+w-x-1)).
func gammaPositive(x *big.Float, wp uint) (*big.Float, error) {
	if x.IsInt() && x.Cmp(big.NewFloat(3000)) <= 0 {
		n, _ := x.Int64()
		return factorialFloat(n-1, wp), nil
	}
	if x.MantExp(nil) > maxGammaArgExp {
		return nil, fmt.Errorf("%w: Gamma(%s) overflows", ErrDomain, x.Text('g', 10))
	}
	minArg := stirlingMinArg(wp)
	for try := 0; try < 6; try, minArg = try+1, 2*minArg {
		n := shiftCount(x, minArg)
		xf, _ := x.Float64()
		wf := xf + float64(n)
		// exp turns the absolute error of log Gamma(w) ~ w log w 2^-wp into a
		// relative one: carry that many extra bits.
		extra := uint(math.Log2(wf*math.Log(wf)+2)) + 4
		p := wp + extra
		w := new(big.Float).SetPrec(p).Add(x, new(big.Float).SetInt64(int64(n)))
		lg, _, err := lgammaStirling(w, p)
		if errors.Is(err, errNoConvergence) {
			continue
		}
		if err != nil {
			return nil, err
		}
		v := BigExp(lg, wp)
		if n > 0 {
			v.Quo(v, risingProduct(x, n, wp))
		}
		return v, nil
	}
	return nil, errNoConvergence
}

// gammaReal returns Gamma(x) at about wp bits for a non-pole x, with
// Gamma(x) = pi / (sin(pi x) Gamma(1-x)) for x < 0 (DLMF 5.5.3).
func gammaReal(x *big.Float, wp uint) (*big.Float, error) {
	if x.Sign() > 0 {
		return gammaPositive(x, wp)
	}
	if x.MantExp(nil) > maxGammaArgExp {
		return nil, fmt.Errorf("%w: Gamma(%s) underflows", ErrDomain, x.Text('g', 10))
	}
	n, f := splitNearestInt(x, wp)
	s, _ := sinCosPi(f, wp)
	if n.Bit(0) == 1 {
		s.Neg(s)
	}
	g, err := gammaPositive(addIntExact(new(big.Float).Neg(x), 1, wp), wp)
	if err != nil {
		return nil, err
	}
	s.Mul(s, g)
	return new(big.Float).SetPrec(wp).Quo(Pi(wp), s), nil
}

// BigGamma returns Gamma(x) at prec bits. It returns ErrPole at
// x = 0, -1, -2, ... and ErrDomain when the result leaves the range of
// big.Float (|x| > 2^28). Small positive integers are exact factorials.
func BigGamma(x *big.Float, prec uint) (*big.Float, error) {
	if err := CheckPrec(prec); err != nil {
		return nil, err
	}
	if err := checkReal("BigGamma", x); err != nil {
		return nil, err
	}
	if isGammaPole(x) {
		return nil, fmt.Errorf("%w: Gamma at %s", ErrPole, x.Text('g', 10))
	}
	v, err := gammaReal(x, prec+Guard)
	if err != nil {
		return nil, err
	}
	return v.SetPrec(prec), nil
}

// BigRGamma returns 1/Gamma(x) at prec bits: an entire function, exactly
// zero at x = 0, -1, -2, ... and at +Inf. Where Gamma(x) overflows
// (x > 2^28) the result underflows to zero. It returns nil for a nil or
// -Inf argument or a precision outside [1, MaxPrec], the only inputs
// without a value.
func BigRGamma(x *big.Float, prec uint) *big.Float {
	if CheckPrec(prec) != nil || x == nil || (x.IsInf() && x.Sign() < 0) {
		return nil
	}
	if isGammaPole(x) || x.IsInf() || (x.Sign() > 0 && x.MantExp(nil) > maxGammaArgExp) {
		return new(big.Float).SetPrec(prec)
	}
	if x.Sign() < 0 && x.MantExp(nil) > maxGammaArgExp {
		return nil
	}
	g, err := gammaReal(x, prec+Guard)
	if err != nil {
		return nil
	}
	return new(big.Float).SetPrec(prec).Quo(big.NewFloat(1), g)
}

// psiPositive returns digamma(x) for x > 0 and the exponent of its largest
// part: psi(x) = psi(w) - sum_{j<N} 1/(x+j) with w = x + N, and
// psi(w) = log w - 1/(2w) - sum B_{2m} / (2m w^{2m}) (DLMF 5.11.2).
func psiPositive(x *big.Float, wp uint) (*big.Float, int, error) {
	minArg := stirlingMinArg(wp)
	for try := 0; try < 6; try, minArg = try+1, 2*minArg {
		n := shiftCount(x, minArg)
		w := new(big.Float).SetPrec(wp).Add(x, new(big.Float).SetInt64(int64(n)))
		v, err := BigLog(w, wp)
		if err != nil {
			return nil, 0, err
		}
		scale := expOf(v)
		winv := new(big.Float).SetPrec(wp).Quo(big.NewFloat(1), w)
		h := new(big.Float).SetPrec(wp).Set(winv)
		v.Sub(v, h.SetMantExp(h, -1))
		tail, err := stirlingTail(winv, 1, func(m int64) int64 { return 2 * m }, expOf(v), wp)
		if errors.Is(err, errNoConvergence) {
			continue
		}
		if err != nil {
			return nil, 0, err
		}
		v.Sub(v, tail)
		if n > 0 {
			hs := new(big.Float).SetPrec(wp)
			t := new(big.Float).SetPrec(wp)
			for j := 0; j < n; j++ {
				t.Add(x, new(big.Float).SetInt64(int64(j)))
				hs.Add(hs, t.Quo(big.NewFloat(1), t))
			}
			if e := expOf(hs); e > scale {
				scale = e
			}
			v.Sub(v, hs)
		}
		return v, scale, nil
	}
	return nil, 0, errNoConvergence
}

// psiReal returns digamma(x) for a non-pole x, with
// psi(x) = psi(1-x) - pi cot(pi x) for x < 0 (DLMF 5.5.4).
func psiReal(x *big.Float, wp uint) (*big.Float, int, error) {
	if x.Sign() > 0 {
		return psiPositive(x, wp)
	}
	_, f := splitNearestInt(x, wp)
	s, c := sinCosPi(f, wp)
	cot := new(big.Float).SetPrec(wp).Quo(c, s)
	cot.Mul(cot, Pi(wp))
	v, scale, err := psiPositive(addIntExact(new(big.Float).Neg(x), 1, wp), wp)
	if err != nil {
		return nil, 0, err
	}
	if e := expOf(cot); e > scale {
		scale = e
	}
	return v.Sub(v, cot), scale, nil
}

// BigDigamma returns psi(x) = Gamma'(x)/Gamma(x) at prec bits; ErrPole at
// x = 0, -1, -2, ... Near the zero x = 1.4616... the working precision is
// raised to keep the relative accuracy.
func BigDigamma(x *big.Float, prec uint) (*big.Float, error) {
	if err := CheckPrec(prec); err != nil {
		return nil, err
	}
	if err := checkReal("BigDigamma", x); err != nil {
		return nil, err
	}
	if isGammaPole(x) {
		return nil, fmt.Errorf("%w: digamma at %s", ErrPole, x.Text('g', 10))
	}
	return zivRefine(prec, func(wp uint) (*big.Float, int, error) {
		return psiReal(x, wp)
	})
}

// maxPolygammaOrder bounds m in BigPolygamma and Polygamma.
const maxPolygammaOrder = 1 << 16

// BigPolygamma returns the polygamma function psi^(m)(x), the m-th
// derivative of digamma, at prec bits. For m >= 1 it is
// (-1)^(m+1) m! zeta(m+1, x) (DLMF 25.11.12), with the Hurwitz sum continued
// below zero by the recurrence (DLMF 5.15.5) for negative x. It returns an
// error for m < 0 (or m > 65536) and ErrPole at x = 0, -1, -2, ...
func BigPolygamma(m int, x *big.Float, prec uint) (*big.Float, error) {
	if m < 0 || m > maxPolygammaOrder {
		return nil, fmt.Errorf("%w: polygamma order %d outside [0, %d]", ErrDomain, m, maxPolygammaOrder)
	}
	if m == 0 {
		return BigDigamma(x, prec)
	}
	if err := CheckPrec(prec); err != nil {
		return nil, err
	}
	if err := checkReal("BigPolygamma", x); err != nil {
		return nil, err
	}
	if isGammaPole(x) {
		return nil, fmt.Errorf("%w: polygamma at %s", ErrPole, x.Text('g', 10))
	}
	return zivRefine(prec, func(wp uint) (*big.Float, int, error) {
		return polygammaReal(m, x, wp)
	})
}

// polygammaPositive returns psi^(m)(x) = (-1)^(m+1) m! zeta(m+1, x) for
// m >= 1, x > 0.
func polygammaPositive(m int, x *big.Float, wp uint) (*big.Float, int, error) {
	s := new(big.Float).SetInt64(int64(m + 1))
	v, scale, err := hurwitzEulerMaclaurin(s, x, wp)
	if err != nil {
		return nil, 0, err
	}
	f := factorialFloat(int64(m), wp)
	if m%2 == 0 {
		f.Neg(f)
	}
	return v.Mul(v, f), scale + expOf(f), nil
}

// polygammaReal returns psi^(m)(x), m >= 1, for a non-pole x, with the
// reflection psi^(m)(x) = (-1)^m psi^(m)(1-x) - pi^(m+1) P_m(cot pi x)
// for x < 0 (DLMF 5.15.6), where P_m(cot u) = d^m/du^m cot u.
func polygammaReal(m int, x *big.Float, wp uint) (*big.Float, int, error) {
	if x.Sign() > 0 {
		return polygammaPositive(m, x, wp)
	}
	v, scale, err := polygammaPositive(m, addIntExact(new(big.Float).Neg(x), 1, wp), wp)
	if err != nil {
		return nil, 0, err
	}
	if m%2 == 1 {
		v.Neg(v)
	}
	_, f := splitNearestInt(x, wp)
	sn, cs := sinCosPi(f, wp)
	cot := new(big.Float).SetPrec(wp).Quo(cs, sn)
	d := cotDerivatives(cot, m, wp)[m]
	if e := expOf(d); e > scale {
		scale = e
	}
	return v.Sub(v, d), scale, nil
}

// cotDerivPolys returns the integer polynomials P_0 .. P_mmax with
// d^m/du^m cot u = P_m(cot u): P_0(c) = c, P_{m+1}(c) = -(1+c^2) P_m'(c).
// P_m has the parity of m+1 and all its coefficients have the sign
// (-1)^m, so evaluating it never cancels.
func cotDerivPolys(mmax int) [][]*big.Int {
	polys := make([][]*big.Int, mmax+1)
	polys[0] = []*big.Int{big.NewInt(0), big.NewInt(1)}
	for m := 0; m < mmax; m++ {
		p := polys[m]
		next := make([]*big.Int, len(p)+1)
		for i := range next {
			next[i] = new(big.Int)
		}
		t := new(big.Int)
		for i := 1; i < len(p); i++ {
			// d/dc of p_i c^i is i p_i c^(i-1); times -(1 + c^2).
			t.Mul(p[i], big.NewInt(int64(i)))
			next[i-1].Sub(next[i-1], t)
			next[i+1].Sub(next[i+1], t)
		}
		polys[m+1] = next
	}
	return polys
}

// cotDerivatives returns pi^(m+1) P_m(c) for m = 0..mmax: the derivatives
// d^m/dx^m of pi cot(pi x) at a point where cot(pi x) = c.
func cotDerivatives(c *big.Float, mmax int, wp uint) []*big.Float {
	polys := cotDerivPolys(mmax)
	out := make([]*big.Float, mmax+1)
	pi := Pi(wp)
	pipow := new(big.Float).SetPrec(wp).Set(pi)
	coef := new(big.Float).SetPrec(wp)
	for m, p := range polys {
		acc := new(big.Float).SetPrec(wp)
		for i := len(p) - 1; i >= 0; i-- {
			acc.Mul(acc, c)
			acc.Add(acc, coef.SetInt(p[i]))
		}
		out[m] = acc.Mul(acc, pipow)
		pipow.Mul(pipow, pi)
	}
	return out
}
