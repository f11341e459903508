package dd

import "math/big"

// Pi and Ln2 to double-double precision, from their decimal expansions
// (DLMF 3.12.1 for pi; ln 2 = 0.6931... , DLMF 4.2 tables). The tests check
// Pi against Machin's formula evaluated in math/big and Ln2 against
// bigfloat's logarithm.
var (
	Pi  = mustParse(piDigits)
	Ln2 = mustParse(ln2Digits)
	// ln2Tail is ln 2 - Ln2: Exp's argument reduction k ln 2 needs it for
	// |k| up to about 1000.
	ln2Tail = tail(ln2Digits, Ln2)
)

const (
	piDigits  = "3.14159265358979323846264338327950288419716939937510"
	ln2Digits = "0.69314718055994530941723212145817656807550013436026"
)

// tail returns the float64 nearest s - x.
func tail(s string, x Float) float64 {
	v, _, err := big.ParseFloat(s, 10, 240, big.ToNearestEven)
	if err != nil {
		panic(err) // only reached with a malformed constant above
	}
	v.Sub(v, x.Big(240))
	f, _ := v.Float64()
	return f
}

// Parse returns the Float nearest the decimal string s.
func Parse(s string) (Float, error) {
	x, _, err := big.ParseFloat(s, 10, 240, big.ToNearestEven)
	if err != nil {
		return Float{}, err
	}
	return FromBig(x), nil
}

func mustParse(s string) Float {
	x, err := Parse(s)
	if err != nil {
		panic(err) // only reached with a malformed constant above
	}
	return x
}
