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

// packed is a factor in fixed point: coefficient i is
// m_i 2^(top - width - r i), |m_i| < 2^width.
type packed struct {
	val   big.Int
	top   int
	width int
}

// pack returns c (after t -> 2^r t) in fixed point with the given slot
// size in words. Truncation to width bits errs by less than one unit of the
// last place of the smallest non-zero coefficient's prec+guard bits.
func pack(c []*big.Float, r, top, width, slotWords int) *packed {
	pos := make([]big.Word, len(c)*slotWords)
	neg := make([]big.Word, len(c)*slotWords)
	var t big.Float
	var m big.Int
	for i, v := range c {
		if v.Sign() == 0 {
			continue
		}
		t.SetMantExp(v, r*i+width-top)
		t.Int(&m)
		dst := pos
		if m.Sign() < 0 {
			dst = neg
		}
		copy(dst[i*slotWords:(i+1)*slotWords], m.Bits())
	}
	p := &packed{top: top, width: width}
	var n big.Int
	p.val.SetBits(pos)
	n.SetBits(neg)
	p.val.Sub(&p.val, &n)
	return p
}

// mulLowFixed writes into out the first len(out) coefficients of the
// product of the series with coefficients a and b (missing ones zero), each
// rounded to prec bits. It reports false, writing nothing, when the factors'
// coefficients span too many binades for the packed product to pay off.
func mulLowFixed(out, a, b []*big.Float, prec uint) bool {
	n := len(out)
	a, b = a[:min(len(a), n)], b[:min(len(b), n)]
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
	wa := int(prec) + sa + fixedGuard
	wb := int(prec) + sb + fixedGuard
	// a slot holds |sum of min(len) products| < 2^(wa+wb+len bits) and a
	// sign bit
	slotBits := wa + wb + bits.Len(uint(min(len(a), len(b)))) + 1
	slotWords := (slotBits + bits.UintSize) / bits.UintSize
	pa := pack(a, r, topA, wa, slotWords)
	pb := pack(b, r, topB, wb, slotWords)
	var z big.Int
	z.Mul(&pa.val, &pb.val)
	unpack(out, &z, slotWords, prec, topA+topB-wa-wb, r)
	return true
}

// unpack reads the first len(out) slots of z = sum_m c_m 2^(m slot), with
// signed digits |c_m| < 2^(slot-1), and writes c_m 2^(shift - r m) into
// out[m] at prec bits.
func unpack(out []*big.Float, z *big.Int, slotWords int, prec uint, shift, r int) {
	w := z.Bits() // |z|, little-endian
	neg := z.Sign() < 0
	var half, full, d big.Int
	full.Lsh(big.NewInt(1), uint(slotWords*bits.UintSize))
	half.Rsh(&full, 1)
	carry := 0
	buf := make([]big.Word, slotWords)
	for m := range out {
		clear(buf)
		if lo := m * slotWords; lo < len(w) {
			copy(buf, w[lo:min(lo+slotWords, len(w))])
		}
		d.SetBits(buf)
		if carry != 0 {
			d.Add(&d, big.NewInt(1))
		}
		carry = 0
		if d.Cmp(&half) >= 0 {
			d.Sub(&d, &full)
			carry = 1
		}
		if neg {
			d.Neg(&d)
		}
		o := out[m].SetPrec(prec).SetInt(&d)
		o.SetMantExp(o, shift-r*m)
		// SetBits may alias buf: detach before the next slot reuses it
		buf = make([]big.Word, slotWords)
	}
}
