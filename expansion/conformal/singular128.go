package conformal

import (
	"math"
	"math/cmplx"
)

// This file holds complex128 versions of log Gamma, digamma and trigamma,
// accurate to about 1e-14 away from the poles. They serve the coarse scan
// of the singularity search (singularscan.go), which continues levels along
// many rays and needs many cheap evaluations; every point it finds is
// refined afterwards in big-float arithmetic (singular.go).

// stirlingShift is the real part above which the asymptotic series are
// used; below it the recurrences shift the argument up.
const stirlingShift = 12

// lgammaPsi128 returns log Gamma(z) (modulo 2 pi i) and psi(z) with one
// shift of the argument.
func lgammaPsi128(z complex128) (complex128, complex128) {
	if real(z) < 0.5 {
		pz := complex(math.Pi, 0) * z
		sn, cs := cmplx.Sin(pz), cmplx.Cos(pz)
		l, ps := lgammaPsi128(1 - z)
		return complex(math.Log(math.Pi), 0) - cmplx.Log(sn) - l, ps - complex(math.Pi, 0)*cs/sn
	}
	p := complex(1, 0)
	acc := complex(0, 0)
	for real(z) < stirlingShift {
		p *= z
		acc -= 1 / z
		z++
	}
	w := 1 / z
	w2 := w * w
	lz := cmplx.Log(z)
	ser := w * (1.0/12 + w2*(-1.0/360+w2*(1.0/1260+w2*(-1.0/1680+w2*(1.0/1188)))))
	lg := (z-0.5)*lz - z + complex(0.5*math.Log(2*math.Pi), 0) + ser - cmplx.Log(p)
	pser := w2 * (-1.0/12 + w2*(1.0/120+w2*(-1.0/252+w2*(1.0/240+w2*(-1.0/132)))))
	return lg, acc + lz - 0.5*w + pser
}

// psi128 returns the digamma function psi(z): reflection
// psi(z) = psi(1-z) - pi cot(pi z) (DLMF 5.5.4) for Re z < 1/2, else the
// recurrence and the asymptotic series DLMF 5.11.2 to z^-10.
func psi128(z complex128) complex128 {
	if real(z) < 0.5 {
		pz := complex(math.Pi, 0) * z
		return psi128(1-z) - complex(math.Pi, 0)*cmplx.Cos(pz)/cmplx.Sin(pz)
	}
	acc := complex(0, 0)
	for real(z) < stirlingShift {
		acc -= 1 / z
		z++
	}
	w := 1 / z
	w2 := w * w
	ser := w2 * (-1.0/12 + w2*(1.0/120+w2*(-1.0/252+w2*(1.0/240+w2*(-1.0/132)))))
	return acc + cmplx.Log(z) - 0.5*w + ser
}

// trigamma128 returns psi'(z): reflection psi'(z) = pi^2/sin^2(pi z) -
// psi'(1-z) (DLMF 5.15.6) for Re z < 1/2, else the recurrence and the
// asymptotic series of trigammaShift128.
func trigamma128(z complex128) complex128 {
	if real(z) < 0.5 {
		s := cmplx.Sin(complex(math.Pi, 0) * z)
		return complex(math.Pi*math.Pi, 0)/(s*s) - trigamma128(1-z)
	}
	return trigammaShift128(z)
}

// kernelArg is one Gamma factor Gamma(a + b h + c D)^sign of k_A.
type kernelArg struct {
	a, b, c float64
	sign    float64
}

// kernelArgs lists the Gamma factors of k_A (MS 2016, arXiv:1604.07818;
// PHYSICS.md section 4): the four that depend on h, then the four of the
// prefactor. The remaining factor is -(q - 1) = 1 - 1/D.
var kernelArgs = []kernelArg{
	{0, 0.5, 1, +1},     // Gamma(D + h/2)
	{0.5, -0.5, 1, +1},  // Gamma(1/2 + D - h/2)
	{1.5, -0.5, -1, -1}, // 1/Gamma(3/2 - D - h/2)
	{1, 0.5, -1, -1},    // 1/Gamma(1 - D + h/2)
	{1.5, 0, -1, +1},    // Gamma(3/2 - D)
	{1, 0, -1, +1},      // Gamma(1 - D)
	{0.5, 0, 1, -1},     // 1/Gamma(1/2 + D)
	{0, 0, 1, -1},       // 1/Gamma(D)
}

// jet128 holds k_A and the derivatives of L = log k_A needed by the
// continuation and by Newton's method on the collision system.
type jet128 struct {
	k, lh, ld, lhh, lhd complex128
}

// finite128 reports whether z has finite parts.
func finite128(z complex128) bool {
	return !cmplx.IsNaN(z) && !cmplx.IsInf(z)
}
