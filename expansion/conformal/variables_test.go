package conformal

import (
	"math/big"
	"testing"

	"qbridge/series"
)

// Exact identities of the change of variable eps = delta/(2 + delta)
// (eps = 1 - 2/q, delta = q - 2): eps(delta) = sum_k (-1)^(k-1) delta^k/2^k,
// delta(eps) = 2 eps/(1 - eps) = sum_k 2 eps^k, and q = 2/(1 - eps) = 2 + delta.
func TestEpsDelta(t *testing.T) {
	const prec, n = 256, 20
	id, _ := series.Variable(n, prec, nil)
	check := func(name string, got *series.Series, want func(k int) *big.Float, bits int) {
		t.Helper()
		for k := 0; k < got.Len(); k++ {
			d := new(big.Float).SetPrec(prec).Sub(got.Coeff(k), want(k))
			if d.Sign() != 0 && d.MantExp(nil) > -bits {
				t.Errorf("%s: coefficient %d = %s, want %s", name, k, got.Coeff(k).Text('g', 20), want(k).Text('g', 20))
			}
		}
	}
	e, err := EpsToDelta(id)
	if err != nil {
		t.Fatal(err)
	}
	check("eps(delta)", e, func(k int) *big.Float {
		if k == 0 {
			return new(big.Float)
		}
		return new(big.Float).SetMantExp(big.NewFloat(float64(1-2*((k-1)%2))), -k)
	}, prec-4)
	d, err := DeltaToEps(id)
	if err != nil {
		t.Fatal(err)
	}
	check("delta(eps)", d, func(k int) *big.Float {
		if k == 0 {
			return new(big.Float)
		}
		return big.NewFloat(2)
	}, prec-4)
	oneMinus, _ := series.FromFloat64(prec, 0.5, -0.5, 0, 0, 0, 0, 0, 0)
	q, _ := series.Inv(oneMinus) // 2/(1 - eps)
	qd, err := EpsToDelta(q)
	if err != nil {
		t.Fatal(err)
	}
	check("q(delta)", qd, func(k int) *big.Float {
		switch k {
		case 0:
			return big.NewFloat(2)
		case 1:
			return big.NewFloat(1)
		}
		return new(big.Float)
	}, prec-8)
	s, _ := series.FromFloat64(prec, 0.25, 1, -3, 0.5, 2, 0, 7, -1, 0.125, 1, 1, 1)
	there, err := EpsToDelta(s)
	if err != nil {
		t.Fatal(err)
	}
	back, err := DeltaToEps(there)
	if err != nil {
		t.Fatal(err)
	}
	check("round trip", back, s.Coeff, prec-16)
}
