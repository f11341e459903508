package conformal

import (
	"fmt"
	"math/big"

	"qbridge/series/scalar"
)

// bExact returns b(q) at prec bits from b^q pi = (1/2 - 1/q) tan(pi/q)
// (MS 2016, arXiv:1604.07818; PHYSICS.md section 4), with the limits
// b(2) = 1/pi and b(infinity) = 1.
func bExact(q QPoint, prec uint) (*big.Float, error) {
	p := prec + 32
	pi := scalar.Pi(p)
	if q.Inf {
		return bigInt(1, prec), nil
	}
	if q.IsTwo() {
		return new(big.Float).SetPrec(prec).Quo(bigInt(1, p), pi), nil
	}
	x := q.X(p)
	a := new(big.Float).SetPrec(p).Sub(bigFrac(1, 2, p), x) // 1/2 - 1/q
	s, c := scalar.BigSinCos(new(big.Float).SetPrec(p).Mul(pi, x), p)
	bq := new(big.Float).SetPrec(p).Mul(a, s)
	bq.Quo(bq, c)
	bq.Quo(bq, pi)
	b, err := scalar.BigPow(bq, x, p)
	if err != nil {
		return nil, err
	}
	return b.SetPrec(prec), nil
}

// clausen2 returns Cl_2(theta) for 0 < theta < 2 pi from the series
// Cl_2(t) = t - t log t + sum_{k>=1} |B_2k| t^(2k+1) / (2k (2k+1)!)
// (A&S 27.8.2, from memory; checked against mpmath.clsin in the tests).
func clausen2(theta *big.Float, prec uint) (*big.Float, error) {
	p := prec + 32
	t := new(big.Float).SetPrec(p).Set(theta)
	lt, err := scalar.BigLog(t, p)
	if err != nil {
		return nil, err
	}
	sum := new(big.Float).SetPrec(p).Mul(t, lt)
	sum.Sub(t, sum)
	t2 := new(big.Float).SetPrec(p).Mul(t, t)
	pw := new(big.Float).SetPrec(p).Set(t) // t^(2k+1) / (2k+1)!
	term := new(big.Float).SetPrec(p)
	for k := 1; k < 100000; k++ {
		pw.Mul(pw, t2)
		pw.Quo(pw, bigInt(int64((2*k)*(2*k+1)), p))
		bn, err := scalar.Bernoulli(2 * k)
		if err != nil {
			return nil, err
		}
		bf := new(big.Float).SetPrec(p).SetRat(bn)
		bf.Abs(bf)
		term.Mul(bf, pw)
		term.Quo(term, bigInt(int64(2*k), p))
		sum.Add(sum, term)
		if term.Sign() == 0 || term.MantExp(nil) < sum.MantExp(nil)-int(p) {
			return sum.SetPrec(prec), nil
		}
	}
	return nil, fmt.Errorf("expansion: Clausen series did not converge at theta = %s", theta.Text('g', 10))
}

// s0Exact returns S_0(q) at prec bits. With a = 1/2 - 1/q,
// S_0 = int_0^a pi u cot(pi u) du = a log(2 sin(pi a)) + Cl_2(2 pi a)/(2 pi)
// (integration by parts and int_0^a log(2 sin pi u) du = -Cl_2(2 pi a)/(2 pi)).
func s0Exact(q QPoint, prec uint) (*big.Float, error) {
	p := prec + 32
	if q.IsTwo() {
		return new(big.Float).SetPrec(prec), nil
	}
	a := new(big.Float).SetPrec(p).Sub(bigFrac(1, 2, p), q.X(p))
	pi := scalar.Pi(p)
	pa := new(big.Float).SetPrec(p).Mul(pi, a)
	s, _ := scalar.BigSinCos(pa, p)
	s.Mul(s, bigInt(2, p))
	ls, err := scalar.BigLog(s, p)
	if err != nil {
		return nil, err
	}
	out := new(big.Float).SetPrec(p).Mul(a, ls)
	theta := new(big.Float).SetPrec(p).Mul(pa, bigInt(2, p))
	cl, err := clausen2(theta, p)
	if err != nil {
		return nil, err
	}
	cl.Quo(cl, pi)
	cl.Quo(cl, bigInt(2, p))
	return out.Add(out, cl).SetPrec(prec), nil
}

// exactValue evaluates f at two precisions and packages the result.
func exactValue(quantity string, q QPoint, digits int, method string, f func(QPoint, uint) (*big.Float, error)) (*Value, error) {
	if err := checkDigits(digits); err != nil {
		return nil, err
	}
	if err := q.Check(); err != nil {
		return nil, err
	}
	p1 := bitsFor(digits, 0)
	p2 := secondPrec(p1)
	lo, err := f(q, p1)
	if err != nil {
		return nil, err
	}
	hi, err := f(q, p2)
	if err != nil {
		return nil, err
	}
	vals, errs := pairErrors([]*big.Float{lo}, []*big.Float{hi}, p1)
	return &Value{Quantity: quantity, Q: q, N: -1, Value: vals[0], Err: errs[0],
		Method: fmt.Sprintf("%s; errors from %d and %d bits", method, p1, p2)}, nil
}

// B returns the conformal coefficient b(q) of G_c = b sgn(tau)/|J tau|^(2/q).
func B(q QPoint, digits int) (*Value, error) {
	return exactValue("b", q, digits, "closed form b^q pi = (1/2 - 1/q) tan(pi/q)", bExact)
}

// S0 returns the zero-temperature entropy S_0(q) per Majorana fermion.
func S0(q QPoint, digits int) (*Value, error) {
	return exactValue("S_0", q, digits, "S_0 = a log(2 sin pi a) + Cl_2(2 pi a)/(2 pi), a = 1/2 - 1/q, Clausen series with Bernoulli numbers", s0Exact)
}
