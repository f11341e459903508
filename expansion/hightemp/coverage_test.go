package hightemp

import (
	"math/big"
	"testing"

	"github.com/ALTree/bigfloat"
)

// semicircleBig is the q = 2 model's log Z/N, E/N or C/N at beta in prec
// bits, from the Wigner semicircle rho(E) = sqrt(4 - E^2)/(2 pi)
// (PHYSICS.md sec. 5), independently of the series:
//
//	log Z/N = (1/2) int rho log(2 cosh(beta E/2)) dE,
//	E/N     = -(1/4) int rho E tanh(beta E/2) dE,
//	C/N     = (beta^2/8) int rho E^2 sech^2(beta E/2) dE.
//
// With E = 2 sin(theta) each integrand is an analytic function of theta
// with period pi, so the trapezoidal rule on n points converges
// exponentially (Trefethen and Weideman, SIAM Rev. 56 (2014) 385, sec. 3);
// exp, log come from github.com/ALTree/bigfloat.
func semicircleBig(kind Kind, beta *big.Float, n int, prec uint) *big.Float {
	sum := new(big.Float).SetPrec(prec)
	pi := bigPi(prec)
	h := new(big.Float).SetPrec(prec).Quo(pi, big.NewFloat(float64(n)))
	one := big.NewFloat(1).SetPrec(prec)
	for j := range n {
		th := new(big.Float).SetPrec(prec).Mul(h, big.NewFloat(float64(j)))
		th.Sub(th, new(big.Float).SetPrec(prec).Quo(pi, big.NewFloat(2)))
		s, c := sinCos(th, prec)
		e := new(big.Float).SetPrec(prec).Mul(s, big.NewFloat(2))
		// rho dE = (2 cos)(2 cos)/(2 pi) dtheta
		w := new(big.Float).SetPrec(prec).Mul(c, c)
		w.Mul(w, big.NewFloat(2))
		w.Quo(w, pi)
		x := new(big.Float).SetPrec(prec).Mul(beta, e)
		x.Quo(x, big.NewFloat(2))
		x.Abs(x)
		// exp(-2|x|) keeps every function below in range
		m := bigfloat.Exp(new(big.Float).SetPrec(prec).Mul(x, big.NewFloat(-2)))
		var g *big.Float
		switch kind {
		case LogZ: // (1/2) log(2 cosh x) = (1/2)(|x| + log(1 + e^-2|x|))
			g = bigfloat.Log(new(big.Float).SetPrec(prec).Add(one, m))
			g.Add(g, x)
			g.Quo(g, big.NewFloat(2))
		case Energy: // -(1/4) E tanh(beta E/2) = -(1/4)|E| (1 - m)/(1 + m)
			g = new(big.Float).SetPrec(prec).Sub(one, m)
			g.Quo(g, new(big.Float).SetPrec(prec).Add(one, m))
			g.Mul(g, new(big.Float).Abs(e))
			g.Quo(g, big.NewFloat(-4))
		case Heat: // (beta^2/8) E^2 sech^2 x = (beta^2/8) E^2 4m/(1 + m)^2
			d := new(big.Float).SetPrec(prec).Add(one, m)
			d.Mul(d, d)
			g = new(big.Float).SetPrec(prec).Mul(m, big.NewFloat(4))
			g.Quo(g, d)
			g.Mul(g, e)
			g.Mul(g, e)
			g.Mul(g, beta)
			g.Mul(g, beta)
			g.Quo(g, big.NewFloat(8))
		}
		g.Mul(g, w)
		sum.Add(sum, g)
	}
	return sum.Mul(sum, h)
}

// bigPi is pi from 4 atan(1) by Machin's formula in prec bits.
func bigPi(prec uint) *big.Float {
	wp := prec + 32
	at := func(n int64) *big.Float { // atan(1/n)
		x := new(big.Float).SetPrec(wp).Quo(big.NewFloat(1), big.NewFloat(float64(n)))
		x2 := new(big.Float).SetPrec(wp).Mul(x, x)
		sum := new(big.Float).SetPrec(wp)
		term := new(big.Float).SetPrec(wp).Set(x)
		for k := int64(0); term.Sign() != 0 && term.MantExp(nil) > -int(wp)-8; k++ {
			t := new(big.Float).SetPrec(wp).Quo(term, big.NewFloat(float64(2*k+1)))
			if k%2 == 0 {
				sum.Add(sum, t)
			} else {
				sum.Sub(sum, t)
			}
			term.Mul(term, x2)
		}
		return sum
	}
	p := new(big.Float).SetPrec(wp).Mul(at(5), big.NewFloat(16))
	p.Sub(p, new(big.Float).SetPrec(wp).Mul(at(239), big.NewFloat(4)))
	return p.SetPrec(prec)
}

// sinCos by the Taylor series (|x| <= pi/2 here).
func sinCos(x *big.Float, prec uint) (s, c *big.Float) {
	wp := prec + 32
	x2 := new(big.Float).SetPrec(wp).Mul(x, x)
	s, c = new(big.Float).SetPrec(wp), new(big.Float).SetPrec(wp)
	ts := new(big.Float).SetPrec(wp).Set(x)
	tc := big.NewFloat(1).SetPrec(wp)
	for k := 0; k < 4*int(wp); k++ {
		s.Add(s, ts)
		c.Add(c, tc)
		ts.Mul(ts, x2)
		ts.Quo(ts, big.NewFloat(-float64((2*k+2)*(2*k+3))))
		tc.Mul(tc, x2)
		tc.Quo(tc, big.NewFloat(-float64((2*k+1)*(2*k+2))))
		if tc.Sign() == 0 || tc.MantExp(nil) < -int(wp)-8 {
			break
		}
	}
	return s, c
}

// TestPadeErrorCoversAtHighOrder holds the stated errors of both sums
// against the semicircle at q = 2 computed to 200 bits by quadrature, at
// order 60 and at working precisions from 64 bits up: the Pade table's
// Hankel systems lose bits with the order, and the stated error must
// still cover.
func TestPadeErrorCoversAtHighOrder(t *testing.T) {
	if testing.Short() {
		t.Skip("order-60 Pade tables")
	}
	const refPrec = 200
	c, err := Solve(big.NewRat(2, 1), 60)
	if err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		kind Kind
		beta float64
		prec uint
	}{
		{Heat, 4.5, 84}, // the digits+10 the CLI uses at 15 digits
		{Energy, 3, 110},
		{LogZ, 2, 64},
		{LogZ, 1, 200},
		{Heat, 1.2, 140},
	}
	for _, cs := range cases {
		beta := new(big.Float).SetPrec(refPrec).SetFloat64(cs.beta)
		ref := semicircleBig(cs.kind, beta, 240, refPrec)
		// the quadrature's own error: against half the points
		coarse := semicircleBig(cs.kind, beta, 160, refPrec)
		refErr := new(big.Float).Sub(ref, coarse)
		refErr.Abs(refErr)
		got, err := Evaluate(cs.kind, c, new(big.Float).SetPrec(cs.prec).SetFloat64(cs.beta), cs.prec)
		if err != nil {
			t.Fatal(err)
		}
		for _, s := range []Sum{got.Partial, got.Pade} {
			if s.Err == nil {
				t.Logf("%s beta=%g prec=%d: not estimated (%s)", cs.kind, cs.beta, cs.prec, s.Reason)
				continue
			}
			d := new(big.Float).Sub(s.Value, ref)
			d.Abs(d)
			bound := new(big.Float).Add(s.Err, refErr)
			t.Logf("%s beta=%g prec=%d: stated %.3g, true %.3g (reference +- %.1g) %s", cs.kind, cs.beta, cs.prec, s.Err, d, refErr, s.Method)
			if d.Cmp(bound) > 0 {
				t.Errorf("%s beta=%g prec=%d: stated %.3g does not cover the true error %.3g", cs.kind, cs.beta, cs.prec, s.Err, d)
			}
		}
	}
}
