package energy

import (
	"fmt"
	"math/big"

	"qbridge/series"
	"qbridge/series/scalar"
)

// LiouvilleLowT is the exact low-temperature expansion of the x^2 = 1/q^2
// coefficient of log Z (script-J = 1):
// log Z_2(beta) = -beta E0 + S0 + sum_{k>=1} Tail[k-1] beta^-k,
// with Tail[0] = 2 pi^2 AlphaS.
type LiouvilleLowT struct {
	E0, S0, AlphaS *big.Float
	Tail           []*big.Float
	Prec           uint
}

// LiouvilleMethod describes how LiouvilleExpansion gets its numbers.
const LiouvilleMethod = "exact large-q thermodynamics at order 1/q^2: log Z_2 = pi v [tan(pi v/2) - pi v/4], beta = pi v/cos(pi v/2), expanded at low temperature by series reversion in arbitrary precision"

// LiouvilleExpansion returns terms >= 3 coefficients of the low-temperature
// expansion of log Z at order 1/q^2, at prec bits.
//
// The order-1/q^2 free energy is log Z_2 = pi v [tan(pi v/2) - pi v/4] with
// beta = pi v/cos(pi v/2) (Maldacena-Stanford arXiv:1604.07818 sec. 2.4;
// PHYSICS.md sec. 5). With eta = 1 - v and t = 1/beta the temperature
// condition reads F(eta) = sin(pi eta/2)/(pi (1 - eta)) = t, and
// pi v tan(pi v/2) = pi (1 - eta) cos(pi eta/2)/sin(pi eta/2) = cos(pi eta/2)/t,
// so t log Z_2 = cos(pi eta(t)/2) - (pi^2/4) t (1 - eta(t))^2, a power
// series in t once eta(t) = F^{-1}(t) is known: its coefficients of t^0,
// t^1, t^2, ... are -E_0, S_0, 2 pi^2 alpha_S, ...
func LiouvilleExpansion(terms int, prec uint) (*LiouvilleLowT, error) {
	if terms < 3 {
		return nil, fmt.Errorf("%w: the low-temperature expansion needs at least 3 terms (E_0, S_0, alpha_S), got %d", ErrInput, terms)
	}
	if err := scalar.CheckPrec(prec); err != nil {
		return nil, fmt.Errorf("%w: %v", ErrInput, err)
	}
	n := terms + 1 // t log Z_2 to t^terms
	wp := prec + 32
	pi := scalar.Pi(wp)
	halfPi := new(big.Float).SetPrec(wp).Quo(pi, big.NewFloat(2))
	eta, err := series.Variable(n, wp, nil)
	if err != nil {
		return nil, err
	}
	// F(eta) = sin(pi eta/2) / (pi (1 - eta)).
	s, _, err := series.SinCos(series.Scale(eta, halfPi))
	if err != nil {
		return nil, err
	}
	oneMinus := series.AddConst(series.Neg(eta), big.NewFloat(1))
	f, err := series.Div(s, series.Scale(oneMinus, pi))
	if err != nil {
		return nil, err
	}
	etaT, err := series.Revert(f) // eta(t)
	if err != nil {
		return nil, err
	}
	_, c, err := series.SinCos(series.Scale(etaT, halfPi))
	if err != nil {
		return nil, err
	}
	om := series.AddConst(series.Neg(etaT), big.NewFloat(1))
	sq := series.Mul(om, om)
	pi2 := new(big.Float).SetPrec(wp).Mul(pi, pi)
	quarterPi2 := new(big.Float).SetPrec(wp).Quo(pi2, big.NewFloat(4))
	// (pi^2/4) t (1-eta)^2: the t shifts the coefficients up by one.
	tl := c.Coeffs()
	sqc := sq.Coeffs()
	for k := 1; k < n; k++ {
		tl[k].Sub(tl[k], new(big.Float).SetPrec(wp).Mul(quarterPi2, sqc[k-1]))
	}
	round := func(x *big.Float) *big.Float { return new(big.Float).SetPrec(prec).Set(x) }
	out := &LiouvilleLowT{Prec: prec}
	out.E0 = round(new(big.Float).Neg(tl[0]))
	out.S0 = round(tl[1])
	twoPi2 := new(big.Float).SetPrec(wp).Mul(pi2, big.NewFloat(2))
	out.AlphaS = round(new(big.Float).SetPrec(wp).Quo(tl[2], twoPi2))
	for k := 2; k < n; k++ {
		out.Tail = append(out.Tail, round(tl[k]))
	}
	return out, nil
}
