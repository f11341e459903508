package conformal

import (
	"math"
	"math/cmplx"
)

// Gamma(z) and psi(z) in complex128 as a Stirling exponent and a product,
// for the continuation of the coarse scan. Keeping the recurrence product
// apart (Gamma(z) = exp(s)/p) saves the logarithm of the product, and the
// digamma sum of the recurrence is carried as p'/p, so that one shift costs
// two complex multiplications and no division.

// partsShift is the real part to which the recurrence shifts the argument;
// there Stirling's series to w^-15 is accurate to about 1e-16.
const partsShift = 9

// partsMaxSteps bounds the recurrence; farther left the reflection formula
// of lgammaPsi128 is used instead (the product would overflow).
const partsMaxSteps = 40

// halfLog2Pi128 is log(2 pi)/2.
var halfLog2Pi128 = 0.5 * math.Log(2*math.Pi)

// gammaParts128 returns s, p and psi(z) with Gamma(z) = exp(s)/p (s modulo
// 2 pi i): the recurrence Gamma(z) = Gamma(z+m)/prod_{j<m}(z+j) up to
// Re(z+m) >= partsShift, Stirling's series (DLMF 5.11.1) for
// log Gamma(z+m) and the digamma series (DLMF 5.11.2) for psi(z+m).
func gammaParts128(z complex128) (s, p, psi complex128) {
	steps := math.Ceil(partsShift - real(z))
	if steps > partsMaxSteps {
		l, ps := lgammaPsi128(z)
		return l, 1, ps
	}
	p = 1
	dp := complex(0, 0) // d p / d z, so that p'/p = sum_j 1/(z+j)
	for real(z) < partsShift {
		dp = dp*z + p
		p *= z
		z++
	}
	lw := cmplx.Log(z)
	iw := 1 / z
	iw2 := iw * iw
	// B_2k / (2k (2k-1)) for k = 1..8
	ser := iw * (1.0/12 + iw2*(-1.0/360+iw2*(1.0/1260+iw2*(-1.0/1680+iw2*(1.0/1188+
		iw2*(-691.0/360360+iw2*(1.0/156+iw2*(-3617.0/122400))))))))
	s = (z-0.5)*lw - z + complex(halfLog2Pi128, 0) + ser
	// B_2k / (2k) for k = 1..8
	pser := iw2 * (1.0/12 + iw2*(-1.0/120+iw2*(1.0/252+iw2*(-1.0/240+iw2*(1.0/132+
		iw2*(-691.0/32760+iw2*(1.0/12+iw2*(-3617.0/8160))))))))
	psi = lw - 0.5*iw - pser
	if dp != 0 {
		psi -= dp / p
	}
	return s, p, psi
}

// trigammaShift128 returns psi'(z) by the same shift: the recurrence sum
// of 1/(z+j)^2 and the asymptotic series DLMF 5.15.8 to w^-17.
func trigammaShift128(z complex128) complex128 {
	if math.Ceil(partsShift-real(z)) > partsMaxSteps {
		return trigamma128(z)
	}
	acc := complex(0, 0)
	for real(z) < partsShift {
		acc += 1 / (z * z)
		z++
	}
	iw := 1 / z
	iw2 := iw * iw
	// B_2k for k = 1..8
	ser := iw * iw2 * (1.0/6 + iw2*(-1.0/30+iw2*(1.0/42+iw2*(-1.0/30+iw2*(5.0/66+
		iw2*(-691.0/2730+iw2*(7.0/6+iw2*(-3617.0/510))))))))
	return acc + iw + 0.5*iw2 + ser
}
