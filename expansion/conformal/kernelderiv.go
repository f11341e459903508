package conformal

import (
	"errors"
	"fmt"
	"math/big"

	"qbridge/series/scalar"
)

// The antisymmetric-channel kernel eigenvalue and its slope in h
// (Maldacena-Stanford 2016, arXiv:1604.07818; PHYSICS.md sec. 4), with
// D = 1/q:
//
//	k_A(h) = -(q-1) Gamma(3/2-D) Gamma(1-D) / [Gamma(1/2+D) Gamma(D)]
//	         * Gamma(D + h/2) Gamma(1/2 + D - h/2) / [Gamma(3/2 - D - h/2) Gamma(1 - D + h/2)],
//	k_A'(h)/k_A(h) = (1/2) [psi(D + h/2) - psi(1/2 + D - h/2) + psi(3/2 - D - h/2) - psi(1 - D + h/2)].
//
// At the soft mode h = 2, where k_A = 1, the recurrence psi(x+1) = psi(x) + 1/x
// (DLMF 5.5.2) and the reflection psi(1-x) - psi(x) = pi cot(pi x) (DLMF
// 5.5.4) close the slope:
//
//	k_A'(2) = (1/2) [1/D - 2/(1 - 2D) - 1/(1 - D) - 2 pi / sin(2 pi D)],
//
// which is -pi - 2/3 at q = 4 and tends to -3/2 as q -> infinity (the slope
// of the large-q kernel 2/(h(h-1))); it diverges as q -> 2, where the pole of
// k_A at h = 1 + 2D reaches h = 2.

// kernelA returns k_A(h) at prec bits (q finite, > 2 or = 2).
func kernelA(q QPoint, h *big.Float, prec uint) (*big.Float, error) {
	p := prec + 32
	if q.Inf {
		// 2/(h(h-1)).
		v := new(big.Float).SetPrec(p).Sub(h, bigInt(1, p))
		v.Mul(v, h)
		return new(big.Float).SetPrec(prec).Quo(bigInt(2, p), v), nil
	}
	d := q.X(p)
	half := bigFrac(1, 2, p)
	hh := new(big.Float).SetPrec(p).Mul(h, half)
	add := func(xs ...*big.Float) *big.Float {
		s := new(big.Float).SetPrec(p)
		for _, x := range xs {
			s.Add(s, x)
		}
		return s
	}
	neg := func(x *big.Float) *big.Float { return new(big.Float).SetPrec(p).Neg(x) }
	num := []*big.Float{add(bigFrac(3, 2, p), neg(d)), add(bigInt(1, p), neg(d)), add(d, hh), add(half, d, neg(hh))}
	den := []*big.Float{add(half, d), d, add(bigFrac(3, 2, p), neg(d), neg(hh)), add(bigInt(1, p), neg(d), hh)}
	k := new(big.Float).SetPrec(p).Sub(q.Q, bigInt(1, p))
	k.Neg(k)
	for _, x := range num {
		g, err := scalar.BigGamma(x, p)
		if err != nil {
			return nil, fmt.Errorf("k_A(%s) at q = %s: %w", h.Text('g', 10), q, err)
		}
		k.Mul(k, g)
	}
	for _, x := range den {
		g, err := scalar.BigGamma(x, p)
		if err != nil {
			return nil, fmt.Errorf("k_A(%s) at q = %s: %w", h.Text('g', 10), q, err)
		}
		k.Quo(k, g)
	}
	return k.SetPrec(prec), nil
}

// kernelASlope returns k_A'(h) at prec bits from the digamma form.
func kernelASlope(q QPoint, h *big.Float, prec uint) (*big.Float, error) {
	p := prec + 32
	if q.Inf {
		// d/dh 2/(h(h-1)) = -2(2h-1)/(h(h-1))^2.
		hm := new(big.Float).SetPrec(p).Sub(h, bigInt(1, p))
		hm.Mul(hm, h)
		hm.Mul(hm, hm)
		v := new(big.Float).SetPrec(p).Mul(h, bigInt(2, p))
		v.Sub(v, bigInt(1, p))
		v.Mul(v, bigInt(-2, p))
		return v.Quo(v, hm).SetPrec(prec), nil
	}
	k, err := kernelA(q, h, p)
	if err != nil {
		return nil, err
	}
	d := q.X(p)
	half := bigFrac(1, 2, p)
	hh := new(big.Float).SetPrec(p).Mul(h, half)
	args := []struct {
		sign int
		x    *big.Float
	}{
		{+1, new(big.Float).SetPrec(p).Add(d, hh)},
		{-1, new(big.Float).SetPrec(p).Sub(new(big.Float).SetPrec(p).Add(half, d), hh)},
		{+1, new(big.Float).SetPrec(p).Sub(new(big.Float).SetPrec(p).Sub(bigFrac(3, 2, p), d), hh)},
		{-1, new(big.Float).SetPrec(p).Add(new(big.Float).SetPrec(p).Sub(bigInt(1, p), d), hh)},
	}
	s := new(big.Float).SetPrec(p)
	for _, a := range args {
		v, err := scalar.BigDigamma(a.x, p)
		if err != nil {
			return nil, fmt.Errorf("k_A'(%s) at q = %s: %w", h.Text('g', 10), q, err)
		}
		if a.sign > 0 {
			s.Add(s, v)
		} else {
			s.Sub(s, v)
		}
	}
	s.Mul(s, half)
	return s.Mul(s, k).SetPrec(prec), nil
}

// kernelASlopeAtTwo returns k_A'(2) at prec bits from the closed form.
func kernelASlopeAtTwo(q QPoint, prec uint) (*big.Float, error) {
	if q.Inf {
		return new(big.Float).SetPrec(prec).SetFloat64(-1.5), nil
	}
	if q.IsTwo() {
		return nil, fmt.Errorf("%w: k_A'(2) diverges at q = 2 (the pole of k_A at h = 1 + 2/q reaches h = 2)", ErrNoSlope)
	}
	p := prec + 32
	d := q.X(p)
	one := bigInt(1, p)
	s := new(big.Float).SetPrec(p).Quo(one, d)
	t := new(big.Float).SetPrec(p).Mul(d, bigInt(2, p))
	t.Sub(one, t) // 1 - 2D
	t.Quo(bigInt(2, p), t)
	s.Sub(s, t)
	t = new(big.Float).SetPrec(p).Sub(one, d)
	t.Quo(one, t)
	s.Sub(s, t)
	twoPi := new(big.Float).SetPrec(p).Mul(scalar.Pi(p), bigInt(2, p))
	sn, _ := scalar.BigSinCos(new(big.Float).SetPrec(p).Mul(twoPi, d), p)
	t = new(big.Float).SetPrec(p).Quo(twoPi, sn)
	s.Sub(s, t)
	return s.Mul(s, bigFrac(1, 2, p)).SetPrec(prec), nil
}

// ErrNoSlope marks a kernel slope asked for where it does not exist
// (k_A'(2) at q = 2).
var ErrNoSlope = errors.New("kernel slope does not exist")

// KernelA returns the antisymmetric-channel kernel eigenvalue k_A(h) at q
// (its q = infinity limit 2/(h(h-1)) when q.Inf), from Gamma functions at
// two precisions. It fails at the poles of k_A.
func KernelA(q QPoint, h *big.Float, digits int) (*Value, error) {
	return exactValue("k_A", q, digits, fmt.Sprintf("Gamma-function form of k_A at h = %s", h.Text('g', 12)),
		func(q QPoint, prec uint) (*big.Float, error) { return kernelA(q, h, prec) })
}

// KernelASlope returns dk_A/dh at h from the digamma form
// k_A'(h) = k_A(h) (1/2)[psi(D + h/2) - psi(1/2 + D - h/2) + psi(3/2 - D - h/2) - psi(1 - D + h/2)],
// D = 1/q, at two precisions.
func KernelASlope(q QPoint, h *big.Float, digits int) (*Value, error) {
	return exactValue("k_A'", q, digits, fmt.Sprintf("digamma form of dk_A/dh at h = %s", h.Text('g', 12)),
		func(q QPoint, prec uint) (*big.Float, error) { return kernelASlope(q, h, prec) })
}

// KernelASlopeAtTwo returns k_A'(2), the slope of the kernel eigenvalue at
// the soft mode, from the closed form
// (1/2)[q - 2q/(q-2) - q/(q-1) - 2 pi/sin(2 pi/q)] (see the comment at the
// top of this file), at two precisions; -3/2 at q = infinity. It enters
// alpha_K = -q k_A'(2) alpha_G (Maldacena-Stanford 2016). q = 2 is an
// error wrapping ErrNoSlope (the slope diverges there).
func KernelASlopeAtTwo(q QPoint, digits int) (*Value, error) {
	return exactValue("k_A'(2)", q, digits, "closed form (1/2)[1/D - 2/(1-2D) - 1/(1-D) - 2 pi/sin(2 pi D)], D = 1/q", kernelASlopeAtTwo)
}
