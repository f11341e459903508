package series

import (
	"math"
	"math/big"
	"math/bits"
)

// Truncated products by Kronecker substitution: both factors are turned
// into fixed-point integers, packed side by side into one big integer each,
// multiplied once (math/big's Karatsuba), and the product's coefficients are
// read back from the slots. That replaces the n^2/2 rounded big.Float
// products and sums of the schoolbook product by one integer product of
// about n slots, which is several times faster from n of about 10 on.
//
// Accuracy: a factor whose largest coefficient is 2^top and whose
// smallest non-zero one is 2^(top-spread) is held with prec+spread+guard
// bits, so every non-zero coefficient keeps at least prec+guard bits, every
// term a_i b_j is exact in the integer product, and each coefficient of the
// result is as accurate as the schoolbook sum or better. A change of
// variable t -> 2^r t, exact in binary, flattens geometric growth of the
// coefficients first, so that spread, and with it the integer size, stays
// small for the series of a finite radius of convergence.

// fixedMinLen is the shortest truncation that takes the packed product;
// below it the schoolbook product is as fast.
const fixedMinLen = 10

// fixedGuard is the number of bits held beyond prec in every non-zero
// coefficient of a packed factor.
const fixedGuard = 8

// fixedMaxExtra caps spread (in bits beyond prec): factors whose
// coefficients span more than that take the schoolbook product, where the
// packed integers would grow too large to be faster.
const fixedMaxExtra = 2048

// expProfile returns the binary exponents of the non-zero entries of c
// (with their indices); ok is false when all are zero.
func expProfile(c []*big.Float) (idx, exp []int, ok bool) {
	for i, v := range c {
		if v.Sign() != 0 {
			idx = append(idx, i)
			exp = append(exp, v.MantExp(nil))
		}
	}
	return idx, exp, len(idx) > 0
}

// spreadAt returns the top exponent and the spread of exp + r*idx.
func spreadAt(idx, exp []int, r int) (top, spread int) {
	top, low := math.MinInt, math.MaxInt
	for k, i := range idx {
		e := exp[k] + r*i
		top = max(top, e)
		low = min(low, e)
	}
	return top, top - low
}

// bestScale returns the integer r that minimises the summed spread of
// both factors after t -> 2^r t. The summed spread is convex in r, so a
// scan outward from the factors' mean slopes finds the minimum.
func bestScale(ia, ea, ib, eb []int) int {
	slope := func(idx, exp []int) float64 {
		if len(idx) < 2 {
			return 0
		}
		return float64(exp[len(exp)-1]-exp[0]) / float64(idx[len(idx)-1]-idx[0])
	}
	cost := func(r int) int {
		_, sa := spreadAt(ia, ea, r)
		_, sb := spreadAt(ib, eb, r)
		return sa + sb
	}
	r := int(math.Round(-(slope(ia, ea) + slope(ib, eb)) / 2))
	best := cost(r)
	for _, step := range []int{1, -1} {
		for {
			c := cost(r + step)
			if c >= best {
				break
			}
			r, best = r+step, c
		}
	}
	return r
}

// fixedWork is the scratch space of packed products; one serves a whole
// sequence of them (the steps of a composition), so that the integers and
// word buffers are allocated once instead of at every product.
type fixedWork struct {
	posA, negA, posB, negB []big.Word
	a, b, n, z, m          big.Int
	t                      big.Float
	slot                   []big.Word
}

// words returns buf resized to n zeroed words; it grows geometrically,
// since the factors of a composition grow by one coefficient per step.
func words(buf []big.Word, n int) []big.Word {
	if cap(buf) < n {
		return make([]big.Word, n, max(n, 2*cap(buf)))
	}
	buf = buf[:n]
	clear(buf)
	return buf
}

// pack sets dst to c (after t -> 2^r t) in fixed point, coefficient i
// being m_i 2^(top - width - r i) with |m_i| < 2^width, in slots of
// slotWords words; pos and neg are its word buffers, returned for reuse.
// A coefficient of at most prec bits becomes an exact integer (width leaves
// at least guard bits below its last one); a longer one is truncated, by
// less than one unit in the last place of prec+guard bits.
func (w *fixedWork) pack(dst *big.Int, pos, neg []big.Word, c []*big.Float, r, top, width, slotWords int) ([]big.Word, []big.Word) {
	pos = words(pos, len(c)*slotWords)
	neg = words(neg, len(c)*slotWords)
	for i, v := range c {
		if v.Sign() == 0 {
			continue
		}
		w.t.SetMantExp(v, r*i+width-top)
		w.t.Int(&w.m)
		buf := pos
		if w.m.Sign() < 0 {
			buf = neg
		}
		copy(buf[i*slotWords:(i+1)*slotWords], w.m.Bits())
	}
	// dst and w.n alias the buffers; they are rebuilt at the next pack
	dst.SetBits(pos)
	w.n.SetBits(neg)
	dst.Sub(dst, &w.n)
	return pos, neg
}

// mulLowFixed writes into out the first len(out) coefficients of the
// product of the series with coefficients a and b (missing ones zero), each
// rounded to prec bits, using the scratch space w (nil: its own). It
// reports false, writing nothing, when the factors' coefficients span too
// many binades for the packed product to pay off, or hold an infinity.
func mulLowFixed(out, a, b []*big.Float, prec uint, w *fixedWork) bool {
	n := len(out)
	a, b = a[:min(len(a), n)], b[:min(len(b), n)]
	for _, c := range [][]*big.Float{a, b} {
		for _, v := range c {
			if v.IsInf() {
				return false // the schoolbook product propagates it
			}
		}
	}
	ia, ea, okA := expProfile(a)
	ib, eb, okB := expProfile(b)
	if !okA || !okB {
		for _, o := range out {
			o.SetPrec(prec).SetInt64(0)
		}
		return true
	}
	r := bestScale(ia, ea, ib, eb)
	topA, sa := spreadAt(ia, ea, r)
	topB, sb := spreadAt(ib, eb, r)
	if sa > fixedMaxExtra || sb > fixedMaxExtra {
		return false
	}
	if w == nil {
		w = new(fixedWork)
	}
	wa := int(prec) + sa + fixedGuard
	wb := int(prec) + sb + fixedGuard
	// a slot holds |sum of min(len) products| < 2^(wa+wb+len bits) and a
	// sign bit
	slotBits := wa + wb + bits.Len(uint(min(len(a), len(b)))) + 1
	slotWords := (slotBits + bits.UintSize) / bits.UintSize
	w.posA, w.negA = w.pack(&w.a, w.posA, w.negA, a, r, topA, wa, slotWords)
	w.posB, w.negB = w.pack(&w.b, w.posB, w.negB, b, r, topB, wb, slotWords)
	w.z.Mul(&w.a, &w.b)
	w.unpack(out, slotWords, prec, topA+topB-wa-wb, r)
	return true
}

// unpack reads the first len(out) slots of w.z = sum_m c_m 2^(m slot),
// with signed digits |c_m| < 2^(slot-1), and writes c_m 2^(shift - r m)
// into out[m] at prec bits.
func (w *fixedWork) unpack(out []*big.Float, slotWords int, prec uint, shift, r int) {
	z := w.z.Bits() // |z|, little-endian
	neg := w.z.Sign() < 0
	var carry uint
	for m := range out {
		w.slot = words(w.slot, slotWords)
		d := w.slot
		if lo := m * slotWords; lo < len(z) {
			copy(d, z[lo:min(lo+slotWords, len(z))])
		}
		// d += carry; a digit at or above half the slot is negative: it
		// stands for d - 2^slot and carries one into the next slot
		for i := 0; carry != 0 && i < len(d); i++ {
			var v uint
			v, carry = bits.Add(uint(d[i]), carry, 0)
			d[i] = big.Word(v)
		}
		negDigit := d[len(d)-1]>>(bits.UintSize-1) != 0
		if negDigit {
			// |d - 2^slot| = two's complement of d
			var borrow uint
			for i := range d {
				var v uint
				v, borrow = bits.Sub(0, uint(d[i]), borrow)
				d[i] = big.Word(v)
			}
			carry = 1
		}
		w.m.SetBits(d)
		if negDigit != neg {
			w.m.Neg(&w.m)
		}
		o := out[m].SetPrec(prec).SetInt(&w.m)
		o.SetMantExp(o, shift-r*m)
	}
}
