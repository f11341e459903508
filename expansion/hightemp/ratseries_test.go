package hightemp

import "math/big"

// Exact power series with rational coefficients for the reference
// computations of the tests, written independently of the solver.

type rseries []*big.Rat

func rzero(n int) rseries {
	s := make(rseries, n)
	for i := range s {
		s[i] = new(big.Rat)
	}
	return s
}

func (a rseries) mul(b rseries, n int) rseries {
	out := rzero(n)
	t := new(big.Rat)
	for i := 0; i < len(a) && i < n; i++ {
		if a[i].Sign() == 0 {
			continue
		}
		for j := 0; j < len(b) && i+j < n; j++ {
			out[i+j].Add(out[i+j], t.Mul(a[i], b[j]))
		}
	}
	return out
}

func (a rseries) scale(c *big.Rat) rseries {
	out := make(rseries, len(a))
	for i := range a {
		out[i] = new(big.Rat).Mul(a[i], c)
	}
	return out
}

func (a rseries) add(b rseries) rseries {
	n := max(len(a), len(b))
	out := rzero(n)
	for i := range out {
		if i < len(a) {
			out[i].Add(out[i], a[i])
		}
		if i < len(b) {
			out[i].Add(out[i], b[i])
		}
	}
	return out
}

// inv returns 1/a to n terms (a[0] != 0).
func (a rseries) inv(n int) rseries {
	out := rzero(n)
	out[0].Inv(a[0])
	for m := 1; m < n; m++ {
		s := new(big.Rat)
		for i := 1; i <= m && i < len(a); i++ {
			s.Add(s, new(big.Rat).Mul(a[i], out[m-i]))
		}
		out[m].Mul(s, new(big.Rat).Neg(out[0]))
	}
	return out
}

// log returns log a to n terms (a[0] = 1): (log a)' = a'/a.
func (a rseries) log(n int) rseries {
	d := rzero(n)
	for i := 1; i < len(a) && i <= n; i++ {
		d[i-1].Mul(a[i], big.NewRat(int64(i), 1))
	}
	q := d.mul(a.inv(n), n)
	out := rzero(n)
	for i := 1; i < n; i++ {
		out[i].Quo(q[i-1], big.NewRat(int64(i), 1))
	}
	return out
}

// compose returns sum_m c_m x^m with x a series without constant term.
func composeSeries(c []*big.Rat, x rseries, n int) rseries {
	out := rzero(n)
	for m := len(c) - 1; m >= 0; m-- {
		out = out.mul(x, n)
		out[0].Add(out[0], c[m])
	}
	return out
}

func ratFact(n int) *big.Rat { return new(big.Rat).SetInt(factorial(n)) }
