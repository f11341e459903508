package hightemp

import (
	"fmt"
	"math/big"
	"runtime"
	"strings"
	"sync"
)

// InvQPoly is a polynomial in u = 1/q with rational coefficients:
// C[j] multiplies u^j.
type InvQPoly struct {
	C []*big.Rat
}

// At evaluates the polynomial at q (q != 0) exactly.
func (p InvQPoly) At(q *big.Rat) *big.Rat {
	u := new(big.Rat).Inv(q)
	s := new(big.Rat)
	for j := len(p.C) - 1; j >= 0; j-- {
		s.Mul(s, u)
		s.Add(s, p.C[j])
	}
	return s
}

// Coeff returns the coefficient of u^j (zero where none is held).
func (p InvQPoly) Coeff(j int) *big.Rat {
	if j < 0 || j >= len(p.C) {
		return new(big.Rat)
	}
	return new(big.Rat).Set(p.C[j])
}

// String writes the polynomial as "c2/q^2 + c3/q^3 + ...".
func (p InvQPoly) String() string {
	var b strings.Builder
	for j, c := range p.C {
		if c.Sign() == 0 {
			continue
		}
		a := new(big.Rat).Abs(c)
		switch {
		case b.Len() == 0 && c.Sign() < 0:
			b.WriteString("-")
		case b.Len() > 0 && c.Sign() < 0:
			b.WriteString(" - ")
		case b.Len() > 0:
			b.WriteString(" + ")
		}
		switch {
		case j == 0:
			b.WriteString(a.RatString())
		case a.Cmp(big.NewRat(1, 1)) == 0:
			fmt.Fprintf(&b, "1/q^%d", j)
		case a.IsInt():
			fmt.Fprintf(&b, "%s/q^%d", a.RatString(), j)
		default:
			fmt.Fprintf(&b, "(%s)/q^%d", a.RatString(), j)
		}
	}
	if b.Len() == 0 {
		return "0"
	}
	return b.String()
}

// Symbolic holds the coefficients of log Z/N exactly in q:
// log Z/N = (1/2) log 2 + sum_{k>=1} A[k](1/q) t^k.
type Symbolic struct {
	// A[k] is the coefficient of t^k, a polynomial in 1/q; A[0] is empty.
	A []InvQPoly
	// Nodes are the values of q solved at; the first k fix A[k], the
	// others check it.
	Nodes []*big.Rat
}

// Order is the highest power of t held.
func (s *Symbolic) Order() int { return len(s.A) - 1 }

// interpolationNodes are q = 1, -1, 2, -2, ...: small integers keep the
// exact numbers short; any q != 0 is valid since every step of the
// recursion is a polynomial identity in q and 1/q.
func interpolationNodes(n int) []*big.Rat {
	out := make([]*big.Rat, n)
	for i := range out {
		v := int64(i/2 + 1)
		if i%2 == 1 {
			v = -v
		}
		out[i] = big.NewRat(v, 1)
	}
	return out
}

// extraNodes is how many values of q beyond the needed ones check every
// interpolated coefficient.
const extraNodes = 2

// SymbolicLogZ returns the coefficients of log Z/N to t^order as exact
// polynomials in 1/q. q^(k+1) a_k(q) is a polynomial of degree at most k-1
// in q (see the package comment), so k exact solves fix a_k; two more
// confirm it, and a mismatch is an error, not a silent result. progress,
// if not nil, is called after each solve with the number done and due.
func SymbolicLogZ(order int, progress func(done, total int)) (*Symbolic, error) {
	if order < 1 || order > MaxOrder {
		return nil, fmt.Errorf("%w: order %d outside 1..%d", ErrInput, order, MaxOrder)
	}
	nodes := interpolationNodes(order + extraNodes)
	b := newBasis(2 * order)
	at := make([]*Coefficients, len(nodes))
	// The solves are independent (b is only read): one worker per CPU.
	jobs := make(chan int)
	var wg sync.WaitGroup
	var mu sync.Mutex
	done := 0
	for range runtime.GOMAXPROCS(0) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range jobs {
				c := solve(nodes[i], order, b)
				mu.Lock()
				at[i] = c
				done++
				if progress != nil {
					progress(done, len(nodes))
				}
				mu.Unlock()
			}
		}()
	}
	// largest |q| first: those solves take longest
	for i := len(nodes) - 1; i >= 0; i-- {
		jobs <- i
	}
	close(jobs)
	wg.Wait()
	out := &Symbolic{A: make([]InvQPoly, order+1), Nodes: nodes}
	for k := 1; k <= order; k++ {
		// y_i = q_i^(k+1) a_k(q_i), a polynomial of degree <= k-1 in q.
		xs := nodes[:k]
		ys := make([]*big.Rat, len(nodes))
		for i, q := range nodes {
			ys[i] = new(big.Rat).Mul(at[i].A[k], ratPow(q, k+1))
		}
		mono := newtonToMonomial(xs, dividedDifferences(xs, ys[:k]))
		// a_k = sum_i mono[i] q^(i-k-1) = sum_i mono[i] u^(k+1-i)
		p := InvQPoly{C: make([]*big.Rat, k+2)}
		for j := range p.C {
			p.C[j] = new(big.Rat)
		}
		for i, m := range mono {
			p.C[k+1-i].Set(m)
		}
		for i := k; i < len(nodes); i++ {
			if got := p.At(nodes[i]); got.Cmp(at[i].A[k]) != 0 {
				return nil, fmt.Errorf("hightemp: the coefficient of t^%d is not a polynomial of degree %d in 1/q: the interpolant misses the solve at q = %s (%s vs %s)",
					k, k+1, nodes[i].RatString(), got.RatString(), at[i].A[k].RatString())
			}
		}
		out.A[k] = p
	}
	return out, nil
}

func ratPow(x *big.Rat, n int) *big.Rat {
	out := big.NewRat(1, 1)
	for range n {
		out.Mul(out, x)
	}
	return out
}

// dividedDifferences returns Newton's coefficients of the interpolant of
// (xs, ys).
func dividedDifferences(xs, ys []*big.Rat) []*big.Rat {
	d := make([]*big.Rat, len(ys))
	for i := range ys {
		d[i] = new(big.Rat).Set(ys[i])
	}
	for lvl := 1; lvl < len(xs); lvl++ {
		for i := len(xs) - 1; i >= lvl; i-- {
			num := new(big.Rat).Sub(d[i], d[i-1])
			den := new(big.Rat).Sub(xs[i], xs[i-lvl])
			d[i] = num.Quo(num, den)
		}
	}
	return d
}

// newtonToMonomial expands sum_i d_i prod_{j<i} (x - xs_j) into powers of x.
func newtonToMonomial(xs, d []*big.Rat) []*big.Rat {
	n := len(d)
	out := make([]*big.Rat, n)
	for i := range out {
		out[i] = new(big.Rat)
	}
	if n == 0 {
		return out
	}
	// Horner in Newton form: p = d_(n-1); p = p (x - xs_i) + d_i.
	out[0].Set(d[n-1])
	deg := 0
	for i := n - 2; i >= 0; i-- {
		// multiply by (x - xs_i)
		for j := deg + 1; j >= 1; j-- {
			t := new(big.Rat).Mul(out[j], xs[i])
			out[j].Sub(out[j-1], t)
		}
		out[0].Mul(out[0], xs[i])
		out[0].Neg(out[0])
		out[0].Add(out[0], d[i])
		deg++
	}
	return out
}
