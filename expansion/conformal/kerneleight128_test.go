package conformal

import "math/cmplx"

// The eight-Gamma form of k_A in complex128, straight from its Gamma
// factors (kernelArgs): the reference against which the three-Gamma form
// the scan uses (kerneltwo128.go, kerneltwobig.go) is tested.

// prefactor128 is the h-independent part of L = log k_A at D: its value
// and its D-derivative.
type prefactor128 struct {
	d, l, ld complex128
}

// kernelPrefactor128 evaluates log(1 - 1/D) plus the four prefactor Gamma
// factors, and their D-derivative.
func kernelPrefactor128(d complex128) prefactor128 {
	p := prefactor128{d: d, l: cmplx.Log(1 - 1/d), ld: 1 / (d * (d - 1))}
	for _, a := range kernelArgs[4:] {
		z := complex(a.a, 0) + complex(a.c, 0)*d
		lg, ps := lgammaPsi128(z)
		p.l += complex(a.sign, 0) * lg
		p.ld += complex(a.sign*a.c, 0) * ps
	}
	return p
}

// kernelJet128 evaluates k_A(h, D) and L_h, L_D, L_hh, L_hD (L = log k_A)
// in complex128. second selects whether the second derivatives are wanted.
func kernelJet128(h, d complex128, second bool) jet128 {
	return kernelJetPre128(h, kernelPrefactor128(d), second)
}

// kernelJetPre128 is kernelJet128 with the prefactor evaluated before.
func kernelJetPre128(h complex128, p prefactor128, second bool) jet128 {
	j := jet128{ld: p.ld}
	L := p.l
	for _, a := range kernelArgs[:4] {
		z := complex(a.a, 0) + complex(a.b, 0)*h + complex(a.c, 0)*p.d
		lg, ps := lgammaPsi128(z)
		L += complex(a.sign, 0) * lg
		j.lh += complex(a.sign*a.b, 0) * ps
		j.ld += complex(a.sign*a.c, 0) * ps
		if second {
			tg := trigamma128(z)
			j.lhh += complex(a.sign*a.b*a.b, 0) * tg
			j.lhd += complex(a.sign*a.b*a.c, 0) * tg
		}
	}
	j.k = cmplx.Exp(L)
	return j
}
