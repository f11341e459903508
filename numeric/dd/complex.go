package dd

// Complex is a complex number with double-double parts.
type Complex struct{ Re, Im Float }

// NewComplex returns re + i im.
func NewComplex(re, im float64) Complex { return Complex{New(re), New(im)} }

// Complex128 returns z rounded to complex128.
func (z Complex) Complex128() complex128 { return complex(z.Re.Float64(), z.Im.Float64()) }

// Add returns z + w.
func (z Complex) Add(w Complex) Complex { return Complex{z.Re.Add(w.Re), z.Im.Add(w.Im)} }

// Sub returns z - w.
func (z Complex) Sub(w Complex) Complex { return Complex{z.Re.Sub(w.Re), z.Im.Sub(w.Im)} }

// Neg returns -z.
func (z Complex) Neg() Complex { return Complex{z.Re.Neg(), z.Im.Neg()} }

// Conj returns the complex conjugate of z.
func (z Complex) Conj() Complex { return Complex{z.Re, z.Im.Neg()} }

// Mul returns z w.
func (z Complex) Mul(w Complex) Complex {
	return Complex{z.Re.Mul(w.Re).Sub(z.Im.Mul(w.Im)), z.Re.Mul(w.Im).Add(z.Im.Mul(w.Re))}
}

// Scale returns a z for real a.
func (z Complex) Scale(a Float) Complex { return Complex{z.Re.Mul(a), z.Im.Mul(a)} }

// Abs2 returns |z|^2.
func (z Complex) Abs2() Float { return z.Re.Mul(z.Re).Add(z.Im.Mul(z.Im)) }

// Div returns z/w.
func (z Complex) Div(w Complex) Complex {
	d := w.Abs2()
	n := z.Mul(w.Conj())
	return Complex{n.Re.Div(d), n.Im.Div(d)}
}

// CExp returns e^z.
func CExp(z Complex) Complex {
	m := Exp(z.Re)
	s, c := SinCos(z.Im)
	return Complex{m.Mul(c), m.Mul(s)}
}

// CLog returns the principal logarithm of z != 0.
func CLog(z Complex) Complex {
	return Complex{Log(z.Abs2()).Ldexp(-1), Atan2(z.Im, z.Re)}
}

// CSin returns sin z = sin x cosh y + i cos x sinh y.
func CSin(z Complex) Complex {
	s, c := SinCos(z.Re)
	sh, ch := SinhCosh(z.Im)
	return Complex{s.Mul(ch), c.Mul(sh)}
}
