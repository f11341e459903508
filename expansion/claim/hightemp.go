package claim

import (
	"fmt"
	"math/big"
	"regexp"
	"strconv"
	"strings"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
	"qbridge/expansion/hightemp"
)

// HighTemp is one exact high-temperature coefficient: logz_p, energy_p,
// entropy_p, heat_p (the coefficient of (beta script-J)^p), kappa_n
// (kappa_n/N) or mu_n (the moments), a polynomial in 1/q with rational
// coefficients (qbridge hightemp).
type HighTemp struct {
	// At is the column of the name.
	At int
	// Text is the name as written.
	Text string
	// Kind is the quantity and Power the p or n of its name.
	Kind  hightemp.Kind
	Power int
}

// Col is the column of the name.
func (n *HighTemp) Col() int { return n.At }

// String prints the name.
func (n *HighTemp) String() string { return n.Text }

var highTempName = regexp.MustCompile(`^(logz|energy|entropy|heat|kappa|mu)_([0-9]+)$`)

// highTempNames says how the coefficients are written in claims.
const highTempNames = "high-temperature coefficients logz_p, energy_p, entropy_p, heat_p (of (beta script-J)^p), kappa_n (kappa_n/N), mu_n"

// parseHighTemp resolves a name of the form kind_p; ok is false for any
// other name.
func parseHighTemp(t token) (*HighTemp, bool, error) {
	m := highTempName.FindStringSubmatch(strings.ToLower(t.text))
	if m == nil {
		return nil, false, nil
	}
	k, err := claimKind(m[1])
	if err != nil {
		return nil, true, errAt(t.col, "%s: %v", t.text, err)
	}
	top := 2 * hightemp.MaxOrder
	if k == hightemp.Energy {
		top-- // E = -d log Z/d beta lowers the top power by one
	}
	p, err := strconv.Atoi(m[2])
	if err != nil || p > top {
		return nil, true, errAt(t.col, "%s: the index must be at most %d", t.text, top)
	}
	switch {
	case k == hightemp.Energy && p%2 == 0:
		return nil, true, errAt(t.col, "%s: the energy has odd powers of beta only (E = -d log Z/d beta): write energy_1, energy_3, ...", t.text)
	case k != hightemp.Energy && p%2 == 1:
		return nil, true, errAt(t.col, "%s: %s has even powers only (odd cumulants and moments vanish at large N)", t.text, m[1])
	case p == 0 && (k == hightemp.LogZ || k == hightemp.Entropy):
		return nil, true, errAt(t.col, "%s is (1/2) log 2: write log(2)/2", t.text)
	case p == 0 && k != hightemp.Moments:
		return nil, true, errAt(t.col, "%s: the index starts at 2", t.text)
	}
	return &HighTemp{At: t.col, Text: t.text, Kind: k, Power: p}, true, nil
}

// claimKind resolves the prefix of a claim name: the quantity names of
// hightemp, with kappa and mu (the symbols of the coefficients) for the
// cumulants and the moments.
func claimKind(prefix string) (hightemp.Kind, error) {
	switch prefix {
	case "kappa":
		prefix = "cumulants"
	case "mu":
		prefix = "moments"
	}
	return hightemp.ParseKind(prefix)
}

// poly returns the coefficient as a polynomial in 1/q.
func (n *HighTemp) poly() (hightemp.InvQPoly, error) {
	order := max((n.Power+1)/2, 1)
	s, err := expansion.SymbolicHighTemp(order, nil)
	if err != nil {
		return hightemp.InvQPoly{}, err
	}
	for _, t := range hightemp.DeriveSymbolic(n.Kind, s) {
		if t.Power == n.Power && !t.HalfLog2 {
			return t.Value, nil
		}
	}
	return hightemp.InvQPoly{}, fmt.Errorf("%s: no such coefficient", n.Text)
}

// highTempSeries expands the coefficient around end through t^hi: exactly,
// since it is a polynomial in x = 1/q = (1 - eps)/2.
func highTempSeries(n *HighTemp, end conformal.End, hi int, prec uint) (*Laurent, error) {
	p, err := n.poly()
	if err != nil {
		return nil, err
	}
	cs := p.C
	if end == conformal.AroundTwo {
		cs = p.InEps()
	}
	c := zeros(max(hi+1, 1), prec)
	e := zeros(len(c), prec)
	for j := range c {
		if j < len(cs) {
			c[j].SetRat(cs[j])
			if c[j].Acc() != big.Exact {
				e[j].Abs(c[j]).Mul(e[j], roundBound(prec))
			}
		}
	}
	l, err := exactLaurent(0, c, prec)
	if err != nil {
		return nil, err
	}
	for j, x := range e {
		if err := l.Err.SetCoeff(j, x); err != nil {
			return nil, err
		}
	}
	return l, nil
}

// highTempAt is the coefficient at q, exactly up to rounding.
func highTempAt(n *HighTemp, q *big.Float, prec uint) (*pointValue, error) {
	p, err := n.poly()
	if err != nil {
		return nil, err
	}
	qr, _ := q.Rat(nil)
	v := new(big.Float).SetPrec(prec).SetRat(p.At(qr))
	pv := roundOff(v, v.Acc() != big.Exact)
	pv.method = "exact polynomial in 1/q from the high-temperature solution"
	return pv, nil
}
