package scalar

import (
	"math/big"
	"sync"
)

// The series engines expand log Gamma again and again at the same few
// points: the Gamma arguments at the two ends of the q-line are integers
// and half-integers, and every dimension series, at each of its two
// precisions, asks for the same Taylor coefficients there. The memo keeps
// the longest list computed per (point, precision) for points with a short
// binary expansion (the ends' rational points), so that the Hurwitz zeta
// sums run once per process instead of once per series.

// memoMaxBits is the longest mantissa, in bits, of a point kept in the
// memo: enough for integers and small dyadic fractions, too short for the
// generic points of a root finder, whose lists would never be reused.
const memoMaxBits = 16

// memoMaxEntries bounds the memo; it is emptied when full.
const memoMaxEntries = 256

type taylorKey struct {
	x0   string
	prec uint
}

var lgammaMemo = struct {
	sync.Mutex
	m map[taylorKey][]*big.Float
}{m: map[taylorKey][]*big.Float{}}

// memoKey reports the memo key of x0 at prec, and false when x0 is not
// kept.
func memoKey(x0 *big.Float, prec uint) (taylorKey, bool) {
	if x0.MinPrec() > memoMaxBits {
		return taylorKey{}, false
	}
	return taylorKey{x0.Text('p', 0), prec}, true
}

// memoGet returns copies of the first n memoized coefficients at x0, or
// nil.
func memoGet(x0 *big.Float, n int, prec uint) []*big.Float {
	key, ok := memoKey(x0, prec)
	if !ok {
		return nil
	}
	lgammaMemo.Lock()
	c := lgammaMemo.m[key]
	lgammaMemo.Unlock()
	if len(c) < n {
		return nil
	}
	out := make([]*big.Float, n)
	for k := range out {
		out[k] = new(big.Float).Copy(c[k])
	}
	return out
}

// memoPut keeps copies of c as the coefficients at x0 unless a longer
// list is kept already.
func memoPut(x0 *big.Float, c []*big.Float, prec uint) {
	key, ok := memoKey(x0, prec)
	if !ok {
		return
	}
	kept := make([]*big.Float, len(c))
	for k := range c {
		kept[k] = new(big.Float).Copy(c[k])
	}
	lgammaMemo.Lock()
	defer lgammaMemo.Unlock()
	if len(lgammaMemo.m[key]) >= len(c) {
		return
	}
	if len(lgammaMemo.m) >= memoMaxEntries {
		lgammaMemo.m = map[taylorKey][]*big.Float{}
	}
	lgammaMemo.m[key] = kept
}
