package scalar

import (
	"errors"
	"math"
	"math/big"
	"testing"
)

// Constants to 50 digits, from memory (OEIS A001113 e, A002162 log 2,
// A002392 log 10).
const (
	eDigits     = "2.71828182845904523536028747135266249775724709369995"
	ln2Digits   = "0.693147180559945309417232121458176568075500134360255"
	ln10Digits  = "2.30258509299404568401799145468436420760110148862877"
	realFuncTol = 1e-48
)

func relErr(t *testing.T, got *big.Float, want string) float64 {
	t.Helper()
	w, _, err := big.ParseFloat(want, 10, 300, big.ToNearestEven)
	if err != nil {
		t.Fatal(err)
	}
	d := new(big.Float).SetPrec(300).Sub(got, w)
	d.Quo(d, w)
	f, _ := d.Float64()
	return math.Abs(f)
}

func TestBigExpLogConstants(t *testing.T) {
	for _, p := range []uint{200, 400, 1200} {
		if e := relErr(t, BigExp(big.NewFloat(1), p), eDigits); e > realFuncTol {
			t.Errorf("exp(1) at %d bits: rel err %.1e", p, e)
		}
		if e := relErr(t, Ln2(p), ln2Digits); e > realFuncTol {
			t.Errorf("log 2 at %d bits: rel err %.1e", p, e)
		}
		l10, err := BigLog(big.NewFloat(10), p)
		if err != nil {
			t.Fatal(err)
		}
		if e := relErr(t, l10, ln10Digits); e > realFuncTol {
			t.Errorf("log 10 at %d bits: rel err %.1e", p, e)
		}
	}
}

// exp(log x) = x and log(exp y) = y at 300 bits over many scales, and
// agreement with the float64 math library.
func TestBigExpLogInverse(t *testing.T) {
	const p = 300
	for _, x := range []float64{1e-300, 1e-20, 0.001, 0.5, 0.999999, 1, 1.000001, 2, 3.7, 1e5, 1e200} {
		xb := new(big.Float).SetPrec(p).SetFloat64(x)
		l, err := BigLog(xb, p)
		if err != nil {
			t.Fatal(err)
		}
		back := BigExp(l, p)
		d := new(big.Float).Sub(back, xb)
		d.Quo(d, xb)
		if f, _ := d.Float64(); math.Abs(f) > 1e-85 {
			t.Errorf("exp(log %g) rel err %.1e", x, f)
		}
		if lf, _ := l.Float64(); math.Abs(lf-math.Log(x)) > 1e-15*math.Max(1, math.Abs(lf)) {
			t.Errorf("log %g = %v, math.Log %v", x, lf, math.Log(x))
		}
	}
	if l, _ := BigLog(big.NewFloat(1), p); l.Sign() != 0 {
		t.Errorf("log 1 = %v, want exactly 0", l)
	}
	if _, err := BigLog(big.NewFloat(0), p); err == nil {
		t.Error("log 0 accepted")
	}
	if _, err := BigLog(big.NewFloat(-2), p); err == nil {
		t.Error("log -2 accepted")
	}
}

func TestBigPow(t *testing.T) {
	// 2^10 = 1024 exactly representable; 9^0.5 = 3.
	for _, c := range []struct{ x, y, want float64 }{{2, 10, 1024}, {9, 0.5, 3}, {10, -3, 0.001}} {
		v, err := BigPow(big.NewFloat(c.x), big.NewFloat(c.y), 200)
		if err != nil {
			t.Fatal(err)
		}
		f, _ := v.Float64()
		if math.Abs(f-c.want) > 1e-15*c.want {
			t.Errorf("%g^%g = %v", c.x, c.y, f)
		}
	}
}

// Beyond big.Float's exponent range e^x is an overflow error, not +Inf
// (and e^-x underflows to zero, which BigExp returns).
func TestCheckedExpOverflow(t *testing.T) {
	for _, x := range []float64{1.5e9, 1e12, 1e300} {
		if _, err := CheckedExp(big.NewFloat(x), 64); !errors.Is(err, ErrOverflow) {
			t.Errorf("exp(%g): err = %v, want ErrOverflow", x, err)
		}
	}
	if _, err := CheckedExp(nil, 64); !errors.Is(err, ErrDomain) {
		t.Errorf("exp(nil): err = %v", err)
	}
	v, err := CheckedExp(big.NewFloat(1e9), 64) // 2^(1.44e9): inside the range
	if err != nil || v.IsInf() || v.Sign() <= 0 {
		t.Errorf("exp(1e9) = %v, %v", v, err)
	}
	if v := BigExp(big.NewFloat(-1e12), 64); v.Sign() != 0 {
		t.Errorf("exp(-1e12) = %v, want 0", v)
	}
	if _, err := BigPow(big.NewFloat(10), big.NewFloat(1e12), 64); !errors.Is(err, ErrOverflow) {
		t.Errorf("10^1e12: err = %v, want ErrOverflow", err)
	}
}
