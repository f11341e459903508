package dd

import (
	"math"
	"math/big"
	"math/rand"
	"testing"

	"github.com/ALTree/bigfloat"
)

const refPrec = 200

// relErr returns |got - want|/|want| (|got - want| when want is 0).
func relErr(got Float, want *big.Float) float64 {
	d := new(big.Float).SetPrec(refPrec).Sub(got.Big(refPrec), want)
	if want.Sign() != 0 {
		d.Quo(d, want)
	}
	f, _ := d.Float64()
	return math.Abs(f)
}

// randFloat returns a Float with a random 106-bit significand and exponent
// in [-e, e].
func randFloat(r *rand.Rand, e int) Float {
	hi := (r.Float64()*2 - 1) * math.Pow(2, float64(r.Intn(2*e+1)-e))
	lo := hi * 0x1p-53 * (r.Float64()*2 - 1)
	return quickTwoSum(hi, lo)
}

// The arithmetic against math/big at 200 bits: a relative error of at
// most 2^-100 (the double-double format holds 106 bits; the accurate sum
// and the products lose a few).
func TestArithmeticAgainstBig(t *testing.T) {
	r := rand.New(rand.NewSource(1))
	ops := []struct {
		name string
		dd   func(a, b Float) Float
		big  func(z, a, b *big.Float) *big.Float
	}{
		{"add", Float.Add, (*big.Float).Add},
		{"sub", Float.Sub, (*big.Float).Sub},
		{"mul", Float.Mul, (*big.Float).Mul},
		{"div", Float.Div, (*big.Float).Quo},
		{"mulfloat", func(a, b Float) Float { return a.MulFloat(b.Hi) }, func(z, a, b *big.Float) *big.Float {
			bh, _ := b.Float64()
			return z.Mul(a, new(big.Float).SetFloat64(bh))
		}},
		{"divfloat", func(a, b Float) Float { return a.DivFloat(b.Hi) }, func(z, a, b *big.Float) *big.Float {
			bh, _ := b.Float64()
			return z.Quo(a, new(big.Float).SetFloat64(bh))
		}},
	}
	for _, op := range ops {
		worst := 0.0
		for i := 0; i < 2000; i++ {
			a, b := randFloat(r, 30), randFloat(r, 30)
			if op.name == "add" && i%3 == 0 {
				b = a.Neg().Add(randFloat(r, 0).Ldexp(-60)) // heavy cancellation
			}
			if op.name == "mulfloat" || op.name == "divfloat" {
				b = New(b.Hi)
			}
			want := op.big(new(big.Float).SetPrec(refPrec), a.Big(refPrec), b.Big(refPrec))
			worst = math.Max(worst, relErr(op.dd(a, b), want))
		}
		if worst > 0x1p-100 {
			t.Errorf("%s: worst relative error %.3g > 2^-100", op.name, worst)
		}
	}
	worst := 0.0
	for i := 0; i < 2000; i++ {
		a := randFloat(r, 30).Abs()
		want := new(big.Float).SetPrec(refPrec).Sqrt(a.Big(refPrec))
		worst = math.Max(worst, relErr(a.Sqrt(), want))
	}
	if worst > 0x1p-100 {
		t.Errorf("sqrt: worst relative error %.3g > 2^-100", worst)
	}
}

// Exp and Log against github.com/ALTree/bigfloat at 200 bits.
func TestExpLogAgainstBigfloat(t *testing.T) {
	r := rand.New(rand.NewSource(2))
	we, wl, wm := 0.0, 0.0, 0.0
	for i := 0; i < 1500; i++ {
		x := New((r.Float64()*2 - 1) * 660).Add(randFloat(r, 0).Ldexp(-60))
		if i%4 == 0 {
			x = randFloat(r, 0).Ldexp(-r.Intn(40)) // small arguments
		}
		we = math.Max(we, relErr(Exp(x), bigfloat.Exp(x.Big(refPrec))))
		if math.Abs(x.Hi) < 0.5 {
			em1 := new(big.Float).SetPrec(refPrec).Sub(bigfloat.Exp(x.Big(refPrec)), big.NewFloat(1))
			wm = math.Max(wm, relErr(Expm1(x), em1))
		}
		y := randFloat(r, 300).Abs()
		if y.Hi == 0 {
			continue
		}
		ly := bigfloat.Log(y.Big(refPrec))
		// Near y = 1 the logarithm is small: compare absolutely there.
		e := relErr(Log(y), ly)
		if ly.Sign() != 0 && math.Abs(func() float64 { f, _ := ly.Float64(); return f }()) < 1 {
			e = math.Abs(Log(y).Sub(FromBig(ly)).Float64())
		}
		wl = math.Max(wl, e)
	}
	for _, c := range []struct {
		name  string
		worst float64
	}{{"exp", we}, {"expm1", wm}, {"log", wl}} {
		if c.worst > 0x1p-98 {
			t.Errorf("%s: worst error %.3g > 2^-98", c.name, c.worst)
		}
	}
}

// bigSinCos is the reference: Taylor series of sin and cos summed in
// math/big at 300 bits with no argument reduction (|x| <= 8 here).
func bigSinCos(x *big.Float) (*big.Float, *big.Float) {
	const p = 300
	s, c := new(big.Float).SetPrec(p), new(big.Float).SetPrec(p).SetInt64(1)
	s.Set(x)
	x2 := new(big.Float).SetPrec(p).Mul(x, x)
	ts, tc := new(big.Float).SetPrec(p).Set(x), new(big.Float).SetPrec(p).SetInt64(1)
	for j := int64(1); j < 80; j++ {
		ts.Mul(ts, x2).Quo(ts, new(big.Float).SetInt64(-(2*j)*(2*j+1)))
		tc.Mul(tc, x2).Quo(tc, new(big.Float).SetInt64(-(2*j-1)*(2*j)))
		s.Add(s, ts)
		c.Add(c, tc)
	}
	return s, c
}

func TestSinCosAgainstBig(t *testing.T) {
	r := rand.New(rand.NewSource(3))
	worst := 0.0
	for i := 0; i < 1500; i++ {
		x := New((r.Float64()*2 - 1) * 8).Add(randFloat(r, 0).Ldexp(-60))
		s, c := SinCos(x)
		bs, bc := bigSinCos(x.Big(refPrec))
		// Absolute errors: sin and cos are bounded by one.
		for _, d := range []float64{s.Sub(FromBig(bs)).Float64(), c.Sub(FromBig(bc)).Float64()} {
			worst = math.Max(worst, math.Abs(d))
		}
	}
	if worst > 1e-31 {
		t.Errorf("sin/cos: worst absolute error %.3g > 1e-31", worst)
	}
	// sinh and cosh from the big exponential.
	wh := 0.0
	for i := 0; i < 500; i++ {
		x := randFloat(r, 0).MulFloat(math.Pow(2, float64(r.Intn(12)-6)) * 20)
		sh, ch := SinhCosh(x)
		e := bigfloat.Exp(x.Big(refPrec))
		ie := new(big.Float).SetPrec(refPrec).Quo(big.NewFloat(1), e)
		bsh := new(big.Float).SetPrec(refPrec).Sub(e, ie)
		bsh.Quo(bsh, big.NewFloat(2))
		bch := new(big.Float).SetPrec(refPrec).Add(e, ie)
		bch.Quo(bch, big.NewFloat(2))
		wh = math.Max(wh, math.Max(relErr(sh, bsh), relErr(ch, bch)))
	}
	if wh > 0x1p-98 {
		t.Errorf("sinh/cosh: worst relative error %.3g > 2^-98", wh)
	}
}

// Pi against Machin's formula pi = 16 atan(1/5) - 4 atan(1/239), and Ln2
// against bigfloat's log, both in math/big.
func TestConstants(t *testing.T) {
	atanInv := func(n int64) *big.Float {
		const p = 300
		x := new(big.Float).SetPrec(p).Quo(big.NewFloat(1), new(big.Float).SetInt64(n))
		x2 := new(big.Float).SetPrec(p).Mul(x, x)
		s, term := new(big.Float).SetPrec(p).Set(x), new(big.Float).SetPrec(p).Set(x)
		for k := int64(1); k < 120; k++ {
			term.Mul(term, x2).Neg(term)
			s.Add(s, new(big.Float).SetPrec(p).Quo(term, new(big.Float).SetInt64(2*k+1)))
		}
		return s
	}
	pi := new(big.Float).SetPrec(300).Mul(big.NewFloat(16), atanInv(5))
	pi.Sub(pi, new(big.Float).SetPrec(300).Mul(big.NewFloat(4), atanInv(239)))
	if e := relErr(Pi, pi); e > 0x1p-105 {
		t.Errorf("Pi: relative error %.3g", e)
	}
	if e := relErr(Ln2, bigfloat.Log(new(big.Float).SetPrec(refPrec).SetInt64(2))); e > 0x1p-105 {
		t.Errorf("Ln2: relative error %.3g", e)
	}
}

// Atan2 against the Machin-style reference: atan2(1, 1) = pi/4, and the
// angle of e^{i theta} from SinCos returns theta.
func TestAtan2(t *testing.T) {
	if d := Atan2(New(1), New(1)).Sub(Pi.Ldexp(-2)).Float64(); math.Abs(d) > 1e-31 {
		t.Errorf("atan2(1,1) - pi/4 = %.3g", d)
	}
	r := rand.New(rand.NewSource(4))
	for i := 0; i < 300; i++ {
		th := New((r.Float64()*2 - 1) * 3.1).Add(randFloat(r, 0).Ldexp(-60))
		s, c := SinCos(th)
		m := New(math.Exp(r.Float64()*10 - 5))
		if d := Atan2(s.Mul(m), c.Mul(m)).Sub(th).Float64(); math.Abs(d) > 1e-30 {
			t.Fatalf("atan2 of angle %v: error %.3g", th.Hi, d)
		}
	}
}
