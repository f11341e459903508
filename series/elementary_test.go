package series

import (
	"qbridge/series/scalar"

	"errors"
	"fmt"
	"math/big"
	"testing"
)

// elemTFromStrings builds a series at prec bits from decimal strings, so
// test inputs are exact to the working precision (no float64 rounding).
func elemTFromStrings(t *testing.T, prec uint, coeffs ...string) *Series {
	t.Helper()
	s := newZero(len(coeffs), prec)
	for i, c := range coeffs {
		if _, ok := s.c[i].SetString(c); !ok {
			t.Fatalf("bad test coefficient %q", c)
		}
	}
	return s
}

// elemTRat returns the rational p/q at prec bits.
func elemTRat(p, q int64, prec uint) *big.Float {
	return new(big.Float).SetPrec(prec).SetRat(big.NewRat(p, q))
}

// elemTCloseFloat reports whether |got - want| <= 2^-bits * max(1, |want|).
func elemTCloseFloat(got, want *big.Float, bits int) bool {
	d := new(big.Float).SetPrec(got.Prec()+64).Sub(got, want)
	d.Abs(d)
	scale := new(big.Float).Abs(want)
	if scale.Cmp(big.NewFloat(1)) < 0 {
		scale.SetInt64(1)
	}
	tol := new(big.Float).SetMantExp(scale, -bits)
	return d.Cmp(tol) <= 0
}

// elemTAssertClose fails unless got and want have the same length and
// every coefficient agrees to 2^-bits relative to max(1, |want_k|).
func elemTAssertClose(t *testing.T, name string, got, want *Series, bits int) {
	t.Helper()
	if got.Len() != want.Len() {
		t.Fatalf("%s: length %d, want %d", name, got.Len(), want.Len())
	}
	for k := range want.c {
		if !elemTCloseFloat(got.c[k], want.c[k], bits) {
			t.Fatalf("%s: coefficient %d = %s, want %s (to %d bits)", name, k,
				got.c[k].Text('g', 30), want.c[k].Text('g', 30), bits)
		}
	}
}

// elemTOne returns the series 1 (length n).
func elemTOne(n int, prec uint) *Series {
	s := newZero(n, prec)
	s.c[0].SetInt64(1)
	return s
}

// elemTVar returns the series t (length n).
func elemTVar(n int, prec uint) *Series {
	s := newZero(n, prec)
	if n > 1 {
		s.c[1].SetInt64(1)
	}
	return s
}

func elemTFactorial(k int64) *big.Int {
	return new(big.Int).MulRange(1, k)
}

// elemTBernoulli returns B_0..B_m exactly from sum_{j=0..k} C(k+1, j) B_j = 0
// (the standard recurrence, DLMF 24.5.3 from memory; B_1 = -1/2).
func elemTBernoulli(m int) []*big.Rat {
	b := make([]*big.Rat, m+1)
	b[0] = big.NewRat(1, 1)
	for k := 1; k <= m; k++ {
		s := new(big.Rat)
		for j := 0; j < k; j++ {
			c := new(big.Rat).SetInt(new(big.Int).Binomial(int64(k+1), int64(j)))
			s.Add(s, c.Mul(c, b[j]))
		}
		b[k] = s.Quo(s.Neg(s), big.NewRat(int64(k+1), 1))
	}
	return b
}

// Closed-form Taylor coefficients at t = 0 of elementary functions of t.
// The formulas are standard; the DLMF equation numbers next to them are from
// memory (not re-read at the source).
func TestElementaryKnownCoefficients(t *testing.T) {
	const n = 30
	const prec = 256
	x := elemTVar(n, prec)
	onePlusT := AddConst(x, big.NewFloat(1))
	bern := elemTBernoulli(2 * n)
	half := big.NewFloat(0.5)
	type tc struct {
		name string
		f    func() (*Series, error)
		coef func(k int) *big.Rat // exact coefficient of t^k
	}
	cases := []tc{
		{"exp(t), 1/k! (DLMF 4.2.19)", func() (*Series, error) { return Exp(x) },
			func(k int) *big.Rat { return new(big.Rat).SetFrac(big.NewInt(1), elemTFactorial(int64(k))) }},
		{"log(1+t), (-1)^(k+1)/k (DLMF 4.6.1)", func() (*Series, error) { return Log(onePlusT) },
			func(k int) *big.Rat {
				if k == 0 {
					return new(big.Rat)
				}
				r := big.NewRat(1, int64(k))
				if k%2 == 0 {
					r.Neg(r)
				}
				return r
			}},
		{"sin(t), (-1)^j/(2j+1)! (DLMF 4.19.1)", func() (*Series, error) { return Sin(x) },
			func(k int) *big.Rat {
				if k%2 == 0 {
					return new(big.Rat)
				}
				r := new(big.Rat).SetFrac(big.NewInt(1), elemTFactorial(int64(k)))
				if (k/2)%2 == 1 {
					r.Neg(r)
				}
				return r
			}},
		{"cos(t), (-1)^j/(2j)! (DLMF 4.19.2)", func() (*Series, error) { return Cos(x) },
			func(k int) *big.Rat {
				if k%2 == 1 {
					return new(big.Rat)
				}
				r := new(big.Rat).SetFrac(big.NewInt(1), elemTFactorial(int64(k)))
				if (k/2)%2 == 1 {
					r.Neg(r)
				}
				return r
			}},
		{"tan(t), (-1)^(m-1) 2^(2m) (2^(2m)-1) B_(2m)/(2m)! (DLMF 4.19.4)", func() (*Series, error) { return Tan(x) },
			func(k int) *big.Rat {
				if k%2 == 0 {
					return new(big.Rat)
				}
				m := (k + 1) / 2
				p := new(big.Int).Lsh(big.NewInt(1), uint(2*m))
				q := new(big.Int).Sub(p, big.NewInt(1))
				r := new(big.Rat).SetInt(p.Mul(p, q))
				r.Mul(r, bern[2*m])
				r.Quo(r, new(big.Rat).SetInt(elemTFactorial(int64(2*m))))
				if m%2 == 0 {
					r.Neg(r)
				}
				return r
			}},
		{"atan(t), (-1)^j/(2j+1) (DLMF 4.24.3)", func() (*Series, error) { return Atan(x) },
			func(k int) *big.Rat {
				if k%2 == 0 {
					return new(big.Rat)
				}
				r := big.NewRat(1, int64(k))
				if (k/2)%2 == 1 {
					r.Neg(r)
				}
				return r
			}},
		{"(1+t)^(1/2), binomial C(1/2, k) (DLMF 4.6.7)", func() (*Series, error) { return Pow(onePlusT, half) },
			elemTBinomialHalf},
		{"sqrt(1+t), binomial C(1/2, k) (DLMF 4.6.7)", func() (*Series, error) { return Sqrt(onePlusT) },
			elemTBinomialHalf},
		{"(1+t)^(-3), (-1)^k (k+1)(k+2)/2 (binomial series)", func() (*Series, error) { return Pow(onePlusT, big.NewFloat(-3)) },
			func(k int) *big.Rat {
				r := big.NewRat(int64((k+1)*(k+2)/2), 1)
				if k%2 == 1 {
					r.Neg(r)
				}
				return r
			}},
		{"1/(1+t), (-1)^k (geometric series)", func() (*Series, error) { return Inv(onePlusT) },
			func(k int) *big.Rat { return big.NewRat(int64(1-2*(k%2)), 1) }},
	}
	for _, c := range cases {
		got, err := c.f()
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		want := newZero(n, prec)
		for k := 0; k < n; k++ {
			want.c[k].SetRat(c.coef(k))
		}
		elemTAssertClose(t, c.name, got, want, prec-8)
	}
}

// elemTBinomialHalf is C(1/2, k) = prod_{i<k} (1/2 - i) / k!.
func elemTBinomialHalf(k int) *big.Rat {
	r := big.NewRat(1, 1)
	for i := 0; i < k; i++ {
		r.Mul(r, big.NewRat(int64(1-2*i), 2))
		r.Quo(r, big.NewRat(int64(i+1), 1))
	}
	return r
}

// Identities between the functions, checked to 100 decimal digits (333 bits)
// from a 400-bit computation: the margin absorbs the growth of the
// coefficients (up to ~10^5 here) relative to the tolerance scale max(1, |c_k|).
func TestElementaryIdentities(t *testing.T) {
	const prec = 400
	const bits = 333 // 100 digits
	a := elemTFromStrings(t, prec, "2", "0.3333", "-1", "0.5", "0.25", "-0.125", "3", "0", "1e-3", "7", "-2", "0.1", "0.2", "0.3", "0.4", "0.5", "0.6", "0.7", "0.8", "0.9")
	b := elemTFromStrings(t, prec, "0.3", "-1", "0.142857", "2", "0", "-0.5", "0.25", "1", "-1", "0.001", "4", "5", "-6", "0", "0", "1", "1", "1", "2", "3")
	n := a.Len()

	t.Run("exp(log a) = a", func(t *testing.T) {
		l, err := Log(a)
		if err != nil {
			t.Fatal(err)
		}
		e, err := Exp(l)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "exp(log a)", e, a, bits)
	})
	t.Run("log(exp b) = b", func(t *testing.T) {
		e, err := Exp(b)
		if err != nil {
			t.Fatal(err)
		}
		l, err := Log(e)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "log(exp b)", l, b, bits)
	})
	t.Run("sin^2 + cos^2 = 1 (Pythagoras)", func(t *testing.T) {
		s, c, err := SinCos(a)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "sin^2+cos^2", Add(Mul(s, s), Mul(c, c)), elemTOne(n, prec), bits)
	})
	t.Run("tan = sin/cos", func(t *testing.T) {
		s, c, err := SinCos(b)
		if err != nil {
			t.Fatal(err)
		}
		q, err := Div(s, c)
		if err != nil {
			t.Fatal(err)
		}
		tn, err := Tan(b)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "tan", tn, q, bits)
	})
	t.Run("sqrt(a)^2 = a", func(t *testing.T) {
		r, err := Sqrt(a)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "sqrt^2", Mul(r, r), a, bits)
	})
	t.Run("a^p = exp(p log a)", func(t *testing.T) {
		p := elemTRat(-7, 3, prec)
		got, err := Pow(a, p)
		if err != nil {
			t.Fatal(err)
		}
		l, _ := Log(a)
		want, _ := Exp(Scale(l, p))
		elemTAssertClose(t, "pow", got, want, bits)
	})
	t.Run("tan(atan b) = b", func(t *testing.T) {
		at, err := Atan(b)
		if err != nil {
			t.Fatal(err)
		}
		tn, err := Tan(at)
		if err != nil {
			t.Fatal(err)
		}
		elemTAssertClose(t, "tan(atan)", tn, b, bits)
	})
	t.Run("Exp equals ComposeTaylor with exp's Taylor coefficients", func(t *testing.T) {
		e0 := scalar.BigExp(b.c[0], prec+64)
		taylor := make([]*big.Float, n)
		for k := range taylor {
			taylor[k] = new(big.Float).SetPrec(prec+64).Quo(e0, new(big.Float).SetInt(elemTFactorial(int64(k))))
		}
		want, err := ComposeTaylor(taylor, b)
		if err != nil {
			t.Fatal(err)
		}
		got, _ := Exp(b)
		elemTAssertClose(t, "exp vs ComposeTaylor", got, want, bits)
	})
}

// The same computation at 64, 256 and 1024 bits agrees to the lower precision.
func TestElementaryPrecisionControl(t *testing.T) {
	coeffs := []string{"0.7", "1", "-0.5", "0.3", "0.25", "-1.5", "2", "0.1", "-0.2", "0.05", "1", "1"}
	type fn struct {
		name string
		f    func(*Series) (*Series, error)
	}
	fns := []fn{
		{"Exp", Exp}, {"Log", Log}, {"Sqrt", Sqrt}, {"Sin", Sin}, {"Cos", Cos}, {"Tan", Tan}, {"Atan", Atan}, {"Inv", Inv},
		{"Pow(., 1/3)", func(s *Series) (*Series, error) { return Pow(s, elemTRat(1, 3, s.Prec())) }},
		{"Revert(s - s(0))", func(s *Series) (*Series, error) { return Revert(AddConst(s, new(big.Float).Neg(s.c[0]))) }},
	}
	for _, f := range fns {
		var prev *Series
		for _, prec := range []uint{64, 256, 1024} {
			got, err := f.f(elemTFromStrings(t, prec, coeffs...))
			if err != nil {
				t.Fatalf("%s at %d bits: %v", f.name, prec, err)
			}
			if got.Prec() != prec {
				t.Fatalf("%s: result precision %d, want %d", f.name, got.Prec(), prec)
			}
			if prev != nil {
				// Inputs differ by the rounding of decimal strings to prev.Prec()
				// bits; allow a few bits for its propagation.
				elemTAssertClose(t, fmt.Sprintf("%s %d vs %d bits", f.name, prec, prev.Prec()), got, prev, int(prev.Prec())-10)
			}
			prev = got
		}
	}
}

// Outside the domain every function returns an error wrapping ErrDomain.
func TestElementaryDomainErrors(t *testing.T) {
	const prec = 128
	zero := elemTFromStrings(t, prec, "0", "1", "2")
	neg := elemTFromStrings(t, prec, "-1", "1", "2")
	halfPi := newZero(3, prec)
	halfPi.c[0].Quo(scalar.Pi(prec), big.NewFloat(2))
	cases := []struct {
		name string
		f    func() (*Series, error)
	}{
		{"Log a(0)=0", func() (*Series, error) { return Log(zero) }},
		{"Log a(0)<0", func() (*Series, error) { return Log(neg) }},
		{"Sqrt a(0)=0", func() (*Series, error) { return Sqrt(zero) }},
		{"Sqrt a(0)<0", func() (*Series, error) { return Sqrt(neg) }},
		{"Pow a(0)<0", func() (*Series, error) { return Pow(neg, big.NewFloat(0.5)) }},
		{"Pow a(0)=0", func() (*Series, error) { return Pow(zero, big.NewFloat(2)) }},
		{"Tan at pi/2", func() (*Series, error) { return Tan(halfPi) }},
	}
	for _, c := range cases {
		s, err := c.f()
		if err == nil || !errors.Is(err, scalar.ErrDomain) {
			t.Errorf("%s: got %v, %v; want an ErrDomain error", c.name, s, err)
		}
	}
	if _, err := Pow(neg, nil); err == nil {
		t.Error("Pow with nil exponent: no error")
	}
	for name, f := range map[string]func(*Series) (*Series, error){
		"Exp": Exp, "Log": Log, "Sqrt": Sqrt, "Sin": Sin, "Cos": Cos, "Tan": Tan, "Atan": Atan, "Inv": Inv, "Revert": Revert,
	} {
		if _, err := f(nil); err == nil {
			t.Errorf("%s(nil): no error", name)
		}
		if _, err := f(&Series{}); err == nil {
			t.Errorf("%s(zero Series): no error", name)
		}
	}
}
