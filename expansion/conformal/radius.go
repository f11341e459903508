package conformal

import (
	"math"
	"math/big"
)

// estimateRadius fills Radius from the growth of the coefficients: a
// least-squares fit of log|c_k| = A - k log R over the upper half of the
// non-negligible coefficients (root test), with the difference from the fit
// over the upper third as its uncertainty.
func (c *Coefficients) estimateRadius() {
	type pt struct{ k, l float64 }
	var pts []pt
	for k, v := range c.Values {
		if k == 0 || v.Sign() == 0 {
			continue
		}
		// Only coefficients known to better than 1%.
		if c.Errors[k] != nil {
			r := new(big.Float).Quo(c.Errors[k], new(big.Float).Abs(v))
			if f, _ := r.Float64(); f > 1e-2 {
				continue
			}
		}
		mant := new(big.Float)
		e := v.MantExp(mant)
		m, _ := mant.Float64()
		pts = append(pts, pt{float64(k), math.Log(math.Abs(m)) + float64(e)*math.Ln2})
	}
	if len(pts) < 4 {
		return
	}
	fit := func(ps []pt) float64 {
		var sk, sl, skk, skl float64
		for _, p := range ps {
			sk += p.k
			sl += p.l
			skk += p.k * p.k
			skl += p.k * p.l
		}
		n := float64(len(ps))
		slope := (n*skl - sk*sl) / (n*skk - sk*sk)
		return math.Exp(-slope)
	}
	r1 := fit(pts[len(pts)/2:])
	r2 := fit(pts[len(pts)/3:])
	if math.IsNaN(r1) || math.IsInf(r1, 0) || math.IsNaN(r2) || math.IsInf(r2, 0) {
		return
	}
	c.Radius = big.NewFloat(r1)
	c.RadiusErr = big.NewFloat(math.Abs(r1 - r2))
	c.RadiusMethod = "root test: least-squares slope of log|c_k| over the upper half of the coefficients (error: against the upper two thirds)"
}
