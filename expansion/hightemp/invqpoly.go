package hightemp

import "math/big"

// Add returns p + r.
func (p InvQPoly) Add(r InvQPoly) InvQPoly {
	n := max(len(p.C), len(r.C))
	out := InvQPoly{C: make([]*big.Rat, n)}
	for j := range out.C {
		out.C[j] = new(big.Rat).Add(p.Coeff(j), r.Coeff(j))
	}
	return out
}

// Mul returns p r.
func (p InvQPoly) Mul(r InvQPoly) InvQPoly {
	if len(p.C) == 0 || len(r.C) == 0 {
		return InvQPoly{}
	}
	out := InvQPoly{C: make([]*big.Rat, len(p.C)+len(r.C)-1)}
	for j := range out.C {
		out.C[j] = new(big.Rat)
	}
	t := new(big.Rat)
	for i, a := range p.C {
		if a.Sign() == 0 {
			continue
		}
		for j, b := range r.C {
			out.C[i+j].Add(out.C[i+j], t.Mul(a, b))
		}
	}
	return out
}

// Scale returns c p.
func (p InvQPoly) Scale(c *big.Rat) InvQPoly {
	out := InvQPoly{C: make([]*big.Rat, len(p.C))}
	for j, a := range p.C {
		out.C[j] = new(big.Rat).Mul(a, c)
	}
	return out
}

// constPoly is the constant polynomial c.
func constPoly(c *big.Rat) InvQPoly { return InvQPoly{C: []*big.Rat{new(big.Rat).Set(c)}} }

// InEps rewrites the polynomial in u = 1/q as a polynomial in
// eps = 1 - 2/q, u = (1 - eps)/2: element m multiplies eps^m.
func (p InvQPoly) InEps() []*big.Rat {
	u := InvQPoly{C: []*big.Rat{big.NewRat(1, 2), big.NewRat(-1, 2)}} // (1 - eps)/2 as a polynomial in eps
	acc := constPoly(new(big.Rat))
	pow := constPoly(big.NewRat(1, 1))
	for j := range p.C {
		acc = acc.Add(pow.Scale(p.C[j]))
		pow = pow.Mul(u)
	}
	return acc.C
}
