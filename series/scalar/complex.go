package scalar

import "math/big"

// Complex is an arbitrary-precision complex number Re + i Im. Its methods
// return new values at the precision passed in; operands are not modified.
type Complex struct {
	// Re and Im are the real and imaginary parts; each carries its own
	// precision in bits.
	Re, Im *big.Float
}

// NewComplex returns re + i im at prec bits.
func NewComplex(re, im *big.Float, prec uint) Complex {
	z := Complex{new(big.Float).SetPrec(prec), new(big.Float).SetPrec(prec)}
	if re != nil {
		z.Re.Set(re)
	}
	if im != nil {
		z.Im.Set(im)
	}
	return z
}

// ComplexFloat64 returns re + i im at prec bits.
func ComplexFloat64(re, im float64, prec uint) Complex {
	return NewComplex(big.NewFloat(re), big.NewFloat(im), prec)
}

// Complex128 rounds z to a complex128.
func (z Complex) Complex128() complex128 {
	r, _ := z.Re.Float64()
	i, _ := z.Im.Float64()
	return complex(r, i)
}

// CAdd returns a + b.
func CAdd(a, b Complex, prec uint) Complex {
	z := NewComplex(nil, nil, prec)
	z.Re.Add(a.Re, b.Re)
	z.Im.Add(a.Im, b.Im)
	return z
}

// CSub returns a - b.
func CSub(a, b Complex, prec uint) Complex {
	z := NewComplex(nil, nil, prec)
	z.Re.Sub(a.Re, b.Re)
	z.Im.Sub(a.Im, b.Im)
	return z
}

// CMul returns a * b.
func CMul(a, b Complex, prec uint) Complex {
	p := prec + 8
	t1 := new(big.Float).SetPrec(p).Mul(a.Re, b.Re)
	t2 := new(big.Float).SetPrec(p).Mul(a.Im, b.Im)
	t3 := new(big.Float).SetPrec(p).Mul(a.Re, b.Im)
	t4 := new(big.Float).SetPrec(p).Mul(a.Im, b.Re)
	z := NewComplex(nil, nil, prec)
	z.Re.Sub(t1, t2)
	z.Im.Add(t3, t4)
	return z
}

// CScale returns x * a for real x.
func CScale(a Complex, x *big.Float, prec uint) Complex {
	z := NewComplex(nil, nil, prec)
	z.Re.Mul(a.Re, x)
	z.Im.Mul(a.Im, x)
	return z
}

// CAbs2 returns |a|^2.
func CAbs2(a Complex, prec uint) *big.Float {
	t := new(big.Float).SetPrec(prec).Mul(a.Re, a.Re)
	u := new(big.Float).SetPrec(prec).Mul(a.Im, a.Im)
	return t.Add(t, u)
}

// CAbs returns |a|.
func CAbs(a Complex, prec uint) *big.Float {
	t := CAbs2(a, prec+8)
	return t.Sqrt(t).SetPrec(prec)
}

// CDiv returns a / b; it returns ErrDomain when b = 0.
func CDiv(a, b Complex, prec uint) (Complex, error) {
	p := prec + 8
	d := CAbs2(b, p)
	if d.Sign() == 0 {
		return Complex{}, ErrDomain
	}
	conj := NewComplex(b.Re, new(big.Float).Neg(b.Im), p)
	n := CMul(a, conj, p)
	z := NewComplex(nil, nil, prec)
	z.Re.Quo(n.Re, d)
	z.Im.Quo(n.Im, d)
	return z, nil
}

// CExp returns e^a.
func CExp(a Complex, prec uint) Complex {
	p := prec + Guard
	m := BigExp(a.Re, p)
	s, c := BigSinCos(a.Im, p)
	z := NewComplex(nil, nil, prec)
	z.Re.Mul(m, c)
	z.Im.Mul(m, s)
	return z
}

// CLog returns the principal logarithm of a (imaginary part in (-pi, pi]);
// ErrDomain for a = 0.
func CLog(a Complex, prec uint) (Complex, error) {
	p := prec + Guard
	arg, err := BigAtan2(a.Im, a.Re, p)
	if err != nil {
		return Complex{}, err
	}
	r2 := CAbs2(a, p)
	lr, err := BigLog(r2, p)
	if err != nil {
		return Complex{}, err
	}
	lr.SetMantExp(lr, -1)
	return NewComplex(lr, arg, prec), nil
}

// CSqrt returns the principal square root of a.
func CSqrt(a Complex, prec uint) Complex {
	p := prec + Guard
	if a.Re.Sign() == 0 && a.Im.Sign() == 0 {
		return NewComplex(nil, nil, prec)
	}
	r := CAbs(a, p)
	// sqrt = sqrt((r+Re)/2) + i sgn(Im) sqrt((r-Re)/2), computed stably.
	t := new(big.Float).SetPrec(p).Add(r, new(big.Float).SetPrec(p).Abs(a.Re))
	t.SetMantExp(t, -1)
	t.Sqrt(t)
	u := new(big.Float).SetPrec(p).Quo(a.Im, t)
	u.SetMantExp(u, -1)
	if a.Re.Sign() >= 0 {
		return NewComplex(t, u, prec)
	}
	u.Abs(u)
	if a.Im.Sign() < 0 {
		t.Neg(t)
	}
	return NewComplex(u, t, prec)
}
