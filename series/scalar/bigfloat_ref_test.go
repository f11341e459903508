package scalar

// The reference for these tests is github.com/ALTree/bigfloat, an
// independent implementation: exp by Newton's method on its own log, log by
// the arithmetic-geometric mean (log x ~ pi / (2 AGM(1, 4/x)) after x is
// squared up to 2^(p/2)), pow as exp(w log z). It shares no code with
// realfunc.go (which uses Taylor series with argument halving for exp and
// atanh after repeated square roots for log), so agreement to the last bits
// is an independent check of both.
//
// bigfloat panics on negative arguments of Log and negative bases of Pow;
// only positive arguments are passed to it. Its results have the precision
// of its argument, so the reference is computed at prec+64 bits and the
// relative difference from BigExp/BigLog/BigPow at prec bits must be below
// 2^-(prec-2), i.e. within about 4 ulps of the requested precision.

import (
	"fmt"
	"math"
	"math/big"
	"testing"

	"github.com/ALTree/bigfloat"
)

// bfDigits are the decimal precisions of the comparison.
var bfDigits = []int{30, 50, 100, 200}

// bfBits returns ceil(digits * log2 10).
func bfBits(digits int) uint {
	return uint(math.Ceil(float64(digits) * math.Log2(10)))
}

// bfArg parses a decimal string, or "2^n", to a value with prec bits.
func bfArg(t testing.TB, s string, prec uint) *big.Float {
	t.Helper()
	var n int
	if _, err := fmt.Sscanf(s, "2^%d", &n); err == nil {
		return new(big.Float).SetPrec(prec).SetMantExp(big.NewFloat(1), n)
	}
	x, _, err := big.ParseFloat(s, 10, prec, big.ToNearestEven)
	if err != nil {
		t.Fatalf("parse %q: %v", s, err)
	}
	return x
}

// bfExt returns a copy of x widened (exactly) to prec+64 bits, the
// working precision of the reference.
func bfExt(x *big.Float, prec uint) *big.Float {
	return new(big.Float).SetPrec(prec + 64).Set(x)
}

// bfUlps returns |got - want| in units of 2^(e-prec), where want = m 2^e
// with 1/2 <= |m| < 1, and whether the relative difference is below
// 2^-(prec-2).
func bfUlps(got, want *big.Float, prec uint) (float64, bool) {
	if want.Sign() == 0 || want.IsInf() || got.IsInf() {
		return math.Inf(1), false
	}
	w := prec + 64
	d := new(big.Float).SetPrec(w).Sub(got, want)
	rel := new(big.Float).SetPrec(w).Quo(d, want)
	rel.Abs(rel)
	ok := rel.Cmp(new(big.Float).SetMantExp(big.NewFloat(1), -int(prec-2))) < 0
	e := want.MantExp(nil)
	u := new(big.Float).SetPrec(w).Abs(d)
	u.SetMantExp(u, int(prec)-e)
	f, _ := u.Float64()
	return f, ok
}

// bfWorst records the largest disagreement per function and precision,
// logged at the end of each test (visible with go test -v).
type bfWorst map[string]float64

func (m bfWorst) note(key string, ulps float64) {
	if ulps > m[key] {
		m[key] = ulps
	}
}

func (m bfWorst) log(t *testing.T, fn string) {
	for _, d := range bfDigits {
		key := fmt.Sprintf("%s/%d", fn, d)
		t.Logf("%s at %d digits (%d bits): worst %.3g ulp", fn, d, bfBits(d), m[key])
	}
}

func TestBigExpAgainstBigfloat(t *testing.T) {
	args := []string{
		"1e-30", "-1e-20", "2^-100", // near 0
		"1.0000000000000000000000001", "0.9999999999999999999999999", "0.999999", // near 1
		"0.5", "2", "3.14159", "-7.25", // moderate
		"1e5", "12345.678", "-12345.678", // large
	}
	worst := bfWorst{}
	for _, d := range bfDigits {
		prec := bfBits(d)
		for _, s := range args {
			x := bfArg(t, s, prec)
			got := BigExp(x, prec)
			want := bigfloat.Exp(bfExt(x, prec))
			ulps, ok := bfUlps(got, want, prec)
			worst.note(fmt.Sprintf("exp/%d", d), ulps)
			if !ok {
				t.Errorf("exp(%s) at %d digits: got %s, bigfloat %s (%.3g ulp)",
					s, d, got.Text('g', d+3), want.Text('g', d+3), ulps)
			}
		}
	}
	worst.log(t, "exp")
}

func TestBigLogAgainstBigfloat(t *testing.T) {
	args := []string{
		"1e-30", "1e-20", "2^-100", // near 0
		"1.0000000000000000000000001", "0.9999999999999999999999999", "0.999999", // near 1
		"0.5", "2", "3.14159", "7.25", // moderate
		"1e5", "12345.678", "1e100", "1e-300", "1e300", // large and small
	}
	worst := bfWorst{}
	for _, d := range bfDigits {
		prec := bfBits(d)
		for _, s := range args {
			x := bfArg(t, s, prec)
			got, err := BigLog(x, prec)
			if err != nil {
				t.Errorf("log(%s) at %d digits: %v", s, d, err)
				continue
			}
			want := bigfloat.Log(bfExt(x, prec))
			ulps, ok := bfUlps(got, want, prec)
			worst.note(fmt.Sprintf("log/%d", d), ulps)
			if !ok {
				t.Errorf("log(%s) at %d digits: got %s, bigfloat %s (%.3g ulp)",
					s, d, got.Text('g', d+3), want.Text('g', d+3), ulps)
			}
		}
	}
	worst.log(t, "log")
}

func TestBigPowAgainstBigfloat(t *testing.T) {
	pairs := []struct{ x, y string }{
		{"2", "0.5"},
		{"2", "10"},
		{"3.14159", "2.5"},
		{"0.5", "-3.75"},
		{"7.25", "100.125"},
		{"12345.678", "-1.5"},
		{"1.000001", "1e6"},
		{"1.0000000000000000000000001", "1e20"},
		{"0.999999", "12345.5"},
		{"1e-30", "0.3"},
		{"1e100", "0.3"},
		{"1e300", "1.5"},
		{"1e-300", "-0.75"},
		{"2^-100", "3.3"},
	}
	worst := bfWorst{}
	for _, d := range bfDigits {
		prec := bfBits(d)
		for _, c := range pairs {
			x := bfArg(t, c.x, prec)
			y := bfArg(t, c.y, prec)
			got, err := BigPow(x, y, prec)
			if err != nil {
				t.Errorf("pow(%s, %s) at %d digits: %v", c.x, c.y, d, err)
				continue
			}
			want := bigfloat.Pow(bfExt(x, prec), bfExt(y, prec))
			ulps, ok := bfUlps(got, want, prec)
			worst.note(fmt.Sprintf("pow/%d", d), ulps)
			if !ok {
				t.Errorf("pow(%s, %s) at %d digits: got %s, bigfloat %s (%.3g ulp)",
					c.x, c.y, d, got.Text('g', d+3), want.Text('g', d+3), ulps)
			}
		}
	}
	worst.log(t, "pow")
}

// The reference is only useful if it is itself stable: recomputing it with
// 64 more bits must not move it by more than a small fraction of an ulp of
// the tested precision, on the hardest arguments of the tables above.
func TestBigfloatReferenceStable(t *testing.T) {
	prec := bfBits(100)
	ext := func(x *big.Float, extra uint) *big.Float {
		return new(big.Float).SetPrec(prec + extra).Set(x)
	}
	for _, s := range []string{"1.0000000000000000000000001", "0.9999999999999999999999999", "1e-300", "1e300"} {
		x := bfArg(t, s, prec)
		a := bigfloat.Log(ext(x, 64))
		b := bigfloat.Log(ext(x, 128))
		if u, _ := bfUlps(a, b, prec); u > 1.0/16 {
			t.Errorf("bigfloat log(%s): +64 and +128 bits differ by %.3g ulp", s, u)
		}
	}
	for _, s := range []string{"1e-30", "12345.678", "-12345.678"} {
		x := bfArg(t, s, prec)
		a := bigfloat.Exp(ext(x, 64))
		b := bigfloat.Exp(ext(x, 128))
		if u, _ := bfUlps(a, b, prec); u > 1.0/16 {
			t.Errorf("bigfloat exp(%s): +64 and +128 bits differ by %.3g ulp", s, u)
		}
	}
}

// Own implementation against bigfloat at 100 and 300 digits. The inputs
// have the working precision, as they do inside the Gamma functions.
var bfBenchX = "3.14159265358979323846"

func benchExpOwn(b *testing.B, digits int) {
	prec := bfBits(digits)
	x := bfArg(b, bfBenchX, prec)
	for i := 0; i < b.N; i++ {
		BigExp(x, prec)
	}
}

func benchExpBigfloat(b *testing.B, digits int) {
	x := bfArg(b, bfBenchX, bfBits(digits))
	for i := 0; i < b.N; i++ {
		bigfloat.Exp(x)
	}
}

func benchLogOwn(b *testing.B, digits int) {
	prec := bfBits(digits)
	x := bfArg(b, bfBenchX, prec)
	for i := 0; i < b.N; i++ {
		if _, err := BigLog(x, prec); err != nil {
			b.Fatal(err)
		}
	}
}

func benchLogBigfloat(b *testing.B, digits int) {
	x := bfArg(b, bfBenchX, bfBits(digits))
	for i := 0; i < b.N; i++ {
		bigfloat.Log(x)
	}
}

func benchPowOwn(b *testing.B, digits int) {
	prec := bfBits(digits)
	x := bfArg(b, bfBenchX, prec)
	y := bfArg(b, "2.5", prec)
	for i := 0; i < b.N; i++ {
		if _, err := BigPow(x, y, prec); err != nil {
			b.Fatal(err)
		}
	}
}

func benchPowBigfloat(b *testing.B, digits int) {
	prec := bfBits(digits)
	x := bfArg(b, bfBenchX, prec)
	y := bfArg(b, "2.5", prec)
	for i := 0; i < b.N; i++ {
		bigfloat.Pow(x, y)
	}
}

func BenchmarkExpOwn100Digits(b *testing.B)      { benchExpOwn(b, 100) }
func BenchmarkExpBigfloat100Digits(b *testing.B) { benchExpBigfloat(b, 100) }
func BenchmarkLogOwn100Digits(b *testing.B)      { benchLogOwn(b, 100) }
func BenchmarkLogBigfloat100Digits(b *testing.B) { benchLogBigfloat(b, 100) }
func BenchmarkPowOwn100Digits(b *testing.B)      { benchPowOwn(b, 100) }
func BenchmarkPowBigfloat100Digits(b *testing.B) { benchPowBigfloat(b, 100) }
func BenchmarkExpOwn300Digits(b *testing.B)      { benchExpOwn(b, 300) }
func BenchmarkExpBigfloat300Digits(b *testing.B) { benchExpBigfloat(b, 300) }
func BenchmarkLogOwn300Digits(b *testing.B)      { benchLogOwn(b, 300) }
func BenchmarkLogBigfloat300Digits(b *testing.B) { benchLogBigfloat(b, 300) }
func BenchmarkPowOwn300Digits(b *testing.B)      { benchPowOwn(b, 300) }
func BenchmarkPowBigfloat300Digits(b *testing.B) { benchPowBigfloat(b, 300) }
