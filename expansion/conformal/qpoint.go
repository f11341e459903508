package conformal

import (
	"fmt"
	"math/big"
	"strings"
)

// QPoint is a value of the interaction order q: a real number >= 2 or
// infinity.
type QPoint struct {
	// Inf is true for q = infinity.
	Inf bool
	// Q is the finite value of q (>= 2); nil when Inf.
	Q *big.Float
}

// ParseQ reads q from text ("4", "2.5", "1e3", "inf") at prec bits and
// checks that it lies in the supported range [2, infinity].
func ParseQ(text string, prec uint) (QPoint, error) {
	t := strings.TrimSpace(strings.ToLower(text))
	switch t {
	case "inf", "infinity", "+inf":
		return QPoint{Inf: true}, nil
	}
	var q *big.Float
	var err error
	if num, den, isFrac := strings.Cut(t, "/"); isFrac {
		// a fraction such as 9/2, read exactly and rounded once
		r, ok := new(big.Rat).SetString(t)
		if !ok || !plainDecimal(num) || !plainDecimal(den) {
			err = fmt.Errorf("not a fraction")
		} else {
			q = new(big.Float).SetPrec(prec).SetRat(r)
		}
	} else if !plainDecimal(t) {
		err = fmt.Errorf("not a decimal")
	} else {
		q, _, err = big.ParseFloat(t, 10, prec, big.ToNearestEven)
	}
	if err != nil || q.IsInf() {
		return QPoint{}, fmt.Errorf("cannot read q = %q as a number (use a decimal such as 4 or 2.5, a fraction such as 9/2, or inf)", text)
	}
	if q.Cmp(big.NewFloat(2)) < 0 {
		return QPoint{}, fmt.Errorf("q = %s is below 2: supported is 2 <= q <= inf (q = 2 is free random hopping)", text)
	}
	return QPoint{Q: q}, nil
}

// Check returns an error unless p is q = infinity or a finite q >= 2 (the
// zero value QPoint{} is not a point).
func (p QPoint) Check() error {
	if p.Inf {
		return nil
	}
	if p.Q == nil || p.Q.IsInf() || p.Q.Cmp(big.NewFloat(2)) < 0 {
		return fmt.Errorf("q must be a real number >= 2 or inf (got %v)", p)
	}
	return nil
}

// IsTwo reports q = 2 exactly.
func (p QPoint) IsTwo() bool { return !p.Inf && p.Q != nil && p.Q.Cmp(big.NewFloat(2)) == 0 }

// String prints q.
func (p QPoint) String() string {
	if p.Inf {
		return "inf"
	}
	if p.Q == nil {
		return "<no q>"
	}
	return p.Q.Text('g', 20)
}

// Eps returns eps = 1 - 2/q at prec bits (1 at q = infinity).
func (p QPoint) Eps(prec uint) *big.Float {
	one := bigInt(1, prec)
	if p.Inf {
		return one
	}
	e := new(big.Float).SetPrec(prec).Quo(bigInt(2, prec), p.Q)
	return e.Sub(one, e)
}

// X returns x = 1/q at prec bits (0 at q = infinity).
func (p QPoint) X(prec uint) *big.Float {
	if p.Inf {
		return new(big.Float).SetPrec(prec)
	}
	return new(big.Float).SetPrec(prec).Quo(bigInt(1, prec), p.Q)
}

// PlainDecimal reports whether s is written in decimal digits with an
// optional sign, point and exponent (1, 2.5, 1e3): no hexadecimal,
// underscores or words, which the strconv and math/big readers also take.
func PlainDecimal(s string) bool { return plainDecimal(s) }

func plainDecimal(s string) bool {
	s = strings.TrimSpace(s)
	if s == "" {
		return false
	}
	digits := false
	for i, c := range s {
		switch {
		case c >= '0' && c <= '9':
			digits = true
		case c == '.' || c == 'e' || c == 'E':
		case (c == '+' || c == '-') && (i == 0 || s[i-1] == 'e' || s[i-1] == 'E'):
		default:
			return false
		}
	}
	return digits
}
