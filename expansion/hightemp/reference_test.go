package hightemp

import (
	"math"
	"math/big"
	"testing"
)

// semicircleCoefficients returns a_k(q = 2) from the q = 2 free energy
// log Z = (1/2) int rho(E) log(2 cosh(beta E/2)) dE, rho the Wigner
// semicircle of radius 2 script-J (PHYSICS.md sec. 5): with the Catalan
// moments int rho E^(2k) = C_k and log cosh x = sum_k l_k x^(2k),
// a_k = (1/2) l_k C_k / 4^k. l_k comes from the logarithm of the cosh
// series, not from Bernoulli numbers, so the reference shares nothing
// with the solver.
func semicircleCoefficients(K int) []*big.Rat {
	// cosh x in s = x^2: sum_k s^k/(2k)!
	ch := rzero(K + 1)
	for k := range ch {
		ch[k].Inv(ratFact(2 * k))
	}
	l := ch.log(K + 1)
	out := make([]*big.Rat, K+1)
	for k := 1; k <= K; k++ {
		cat := new(big.Rat).SetFrac(new(big.Int).Binomial(int64(2*k), int64(k)), big.NewInt(int64(k+1)))
		v := new(big.Rat).Mul(l[k], cat)
		v.Quo(v, new(big.Rat).SetInt(new(big.Int).Lsh(big.NewInt(2), uint(2*k))))
		out[k] = v
	}
	return out
}

func TestSemicircleLimit(t *testing.T) {
	const K = 30
	c, err := Solve(big.NewRat(2, 1), K)
	if err != nil {
		t.Fatal(err)
	}
	want := semicircleCoefficients(K)
	for k := 1; k <= K; k++ {
		if c.A[k].Cmp(want[k]) != 0 {
			t.Errorf("q = 2, a_%d = %s, semicircle gives %s", k, c.A[k].RatString(), want[k].RatString())
		}
	}
}

// largeQCoefficients returns the Taylor coefficients in t = (beta script-J)^2
// of the large-q free energy (Maldacena-Stanford 2016, arXiv:1604.07818,
// large-q section; PHYSICS.md sec. 5):
// q^2 (log Z/N - (1/2) log 2) = pi v [tan(pi v/2) - pi v/4] with
// beta script-J = pi v/cos(pi v/2). With y = pi v/2 = b w(b^2), b = beta script-J,
// the closure is w = (1/2) cos(y) and the function 2 y tan y - y^2 = t w^2 (2 Si/Co - 1),
// Si = sin(y)/y and Co = cos(y) as series in y^2 = t w^2.
func largeQCoefficients(K int) []*big.Rat {
	n := K + 1
	cosC := make([]*big.Rat, n) // cos: sum (-1)^m z^m/(2m)!, z = y^2
	sinC := make([]*big.Rat, n) // sin(y)/y: sum (-1)^m z^m/(2m+1)!
	for m := range n {
		sg := int64(1 - 2*(m%2))
		cosC[m] = new(big.Rat).Quo(big.NewRat(sg, 1), ratFact(2*m))
		sinC[m] = new(big.Rat).Quo(big.NewRat(sg, 1), ratFact(2*m+1))
	}
	w := rzero(n)
	w[0].SetFrac64(1, 2)
	tvar := rzero(2)
	tvar[1].SetInt64(1)
	for range n + 1 {
		z := tvar.mul(w.mul(w, n), n)
		w = composeSeries(cosC, z, n).scale(big.NewRat(1, 2))
	}
	z := tvar.mul(w.mul(w, n), n)
	co := composeSeries(cosC, z, n)
	si := composeSeries(sinC, z, n)
	ratio := si.mul(co.inv(n), n).scale(big.NewRat(2, 1))
	ratio[0].Sub(ratio[0], big.NewRat(1, 1))
	f := z.mul(ratio, n)
	return f
}

func TestLargeQLimit(t *testing.T) {
	const K = 24
	s, err := SymbolicLogZ(K, nil)
	if err != nil {
		t.Fatal(err)
	}
	want := largeQCoefficients(K)
	for k := 1; k <= K; k++ {
		if got := s.A[k].Coeff(2); got.Cmp(want[k]) != 0 {
			t.Errorf("1/q^2 part of a_%d = %s, large-q formula gives %s", k, got.RatString(), want[k].RatString())
		}
		if s.A[k].Coeff(0).Sign() != 0 || s.A[k].Coeff(1).Sign() != 0 {
			t.Errorf("a_%d has a 1 or 1/q part: %s", k, s.A[k])
		}
	}
}

// TestBetaSixCoefficient checks the t^3 coefficient against
// (3q - 1)/(720 q^3), i.e. kappa_6/N = 3/q^2 - 1/q^3. That value was derived
// independently for this project from the chord-diagram moments of the
// many-body spectral density (crossing weight eta, García-García and
// Verbaarschot arXiv:1610.03816, its formula written from memory), and
// agrees at q = 2 with the semicircle. Jia and Verbaarschot
// (arXiv:1806.03271) publish the beta^6 coefficient for general q, but its
// text could not be read here, so their normalisation could not be matched
// directly: the check is against the derivation, not a quotation.
func TestBetaSixCoefficient(t *testing.T) {
	s, err := SymbolicLogZ(3, nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, q := range []*big.Rat{big.NewRat(2, 1), big.NewRat(4, 1), big.NewRat(9, 2), big.NewRat(17, 1)} {
		q3 := ratPow(q, 3)
		want := new(big.Rat).Sub(new(big.Rat).Mul(q, big.NewRat(3, 1)), big.NewRat(1, 1))
		want.Quo(want, new(big.Rat).Mul(q3, big.NewRat(720, 1)))
		if got := s.A[3].At(q); got.Cmp(want) != 0 {
			t.Errorf("q = %s: a_3 = %s, want %s", q.RatString(), got.RatString(), want.RatString())
		}
	}
}

// TestFourthCumulant checks kappa_4/N against the exact finite-N fourth
// moment M_4 = (2 + eta) M_2^2 with the crossing weight
// eta = C(N,q)^-1 sum_r (-1)^r C(q,r) C(N-q,q-r) (García-García and
// Verbaarschot arXiv:1610.03816; formula from memory): kappa_4 =
// (eta - 1) M_2^2 with M_2 = N/(2 q^2) at large N, so
// kappa_4/N -> lim N (eta - 1)/(4 q^4); the limit is taken by Richardson
// extrapolation in 1/N from exact eta at large N.
func TestFourthCumulant(t *testing.T) {
	for _, q := range []int64{2, 4, 6} {
		c, err := Solve(big.NewRat(q, 1), 2)
		if err != nil {
			t.Fatal(err)
		}
		got, _ := new(big.Rat).Mul(c.A[2], big.NewRat(24, 1)).Float64()
		// N (eta - 1) at N, 2N, 4N, then two Richardson steps in 1/N.
		var f [3]float64
		for i, N := range []int64{4000, 8000, 16000} {
			sum := new(big.Int)
			for r := int64(0); r <= q; r++ {
				term := new(big.Int).Mul(new(big.Int).Binomial(q, r), new(big.Int).Binomial(N-q, q-r))
				if r%2 == 1 {
					term.Neg(term)
				}
				sum.Add(sum, term)
			}
			eta := new(big.Rat).SetFrac(sum, new(big.Int).Binomial(N, q))
			x, _ := new(big.Rat).Mul(new(big.Rat).Sub(eta, big.NewRat(1, 1)), big.NewRat(N, 1)).Float64()
			f[i] = x
		}
		r1, r2 := 2*f[1]-f[0], 2*f[2]-f[1]
		lim := (4*r2 - r1) / 3
		want := lim / float64(4*q*q*q*q)
		if math.Abs(got-want) > 1e-9*math.Abs(want) {
			t.Errorf("q = %d: kappa_4/N = %.12g, chord-diagram limit %.12g", q, got, want)
		}
	}
}
