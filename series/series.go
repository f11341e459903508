package series

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"qbridge/series/scalar"
)

// ErrLength is returned for a negative or zero series length.
var ErrLength = errors.New("series: length must be positive")

// Series is the truncated power series c[0] + c[1] t + ... + c[n-1] t^(n-1).
// The zero value is not usable; make one with New, FromFloat64, FromBig or
// Variable.
type Series struct {
	prec uint
	c    []*big.Float
}

// CheckShape returns an error unless n >= 1 and 1 <= prec <= scalar.MaxPrec: the
// argument check of every constructor of a series.
func CheckShape(n int, prec uint) error {
	if n <= 0 {
		return fmt.Errorf("%w (got %d)", ErrLength, n)
	}
	return scalar.CheckPrec(prec)
}

// newZero is New without argument checks, for internal use.
func newZero(n int, prec uint) *Series {
	c := make([]*big.Float, n)
	for i := range c {
		c[i] = new(big.Float).SetPrec(prec)
	}
	return &Series{prec: prec, c: c}
}

// New returns the zero series of length n at prec bits.
func New(n int, prec uint) (*Series, error) {
	if err := CheckShape(n, prec); err != nil {
		return nil, err
	}
	return newZero(n, prec), nil
}

// FromFloat64 returns the series with the given coefficients at prec bits.
func FromFloat64(prec uint, coeffs ...float64) (*Series, error) {
	if err := CheckShape(len(coeffs), prec); err != nil {
		return nil, err
	}
	s := newZero(len(coeffs), prec)
	for i, v := range coeffs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, fmt.Errorf("series: coefficient %d is not finite", i)
		}
		s.c[i].SetFloat64(v)
	}
	return s, nil
}

// FromBig returns the series with copies of the given coefficients,
// rounded to prec bits.
func FromBig(prec uint, coeffs []*big.Float) (*Series, error) {
	if err := CheckShape(len(coeffs), prec); err != nil {
		return nil, err
	}
	s := newZero(len(coeffs), prec)
	for i, v := range coeffs {
		if v == nil {
			return nil, fmt.Errorf("series: coefficient %d is nil", i)
		}
		if v.IsInf() {
			return nil, fmt.Errorf("series: coefficient %d is infinite", i)
		}
		s.c[i].Set(v)
	}
	return s, nil
}

// Variable returns the series x0 + t of length n at prec bits: the
// expansion variable shifted to the point x0.
func Variable(n int, prec uint, x0 *big.Float) (*Series, error) {
	if err := CheckShape(n, prec); err != nil {
		return nil, err
	}
	s := newZero(n, prec)
	if x0 != nil {
		s.c[0].Set(x0)
	}
	if n > 1 {
		s.c[1].SetInt64(1)
	}
	return s, nil
}

// Len is the number of coefficients (0 for a nil series).
func (s *Series) Len() int {
	if s == nil {
		return 0
	}
	return len(s.c)
}

// Prec is the working precision in bits (0 for a nil series).
func (s *Series) Prec() uint {
	if s == nil {
		return 0
	}
	return s.prec
}

// Coeff returns a copy of the coefficient of t^k; zero for k beyond the length.
func (s *Series) Coeff(k int) *big.Float {
	if s == nil {
		return new(big.Float)
	}
	if k < 0 || k >= len(s.c) {
		return new(big.Float).SetPrec(s.prec)
	}
	return new(big.Float).SetPrec(s.prec).Set(s.c[k])
}

// Coeffs returns copies of all coefficients.
func (s *Series) Coeffs() []*big.Float {
	if s == nil {
		return nil
	}
	out := make([]*big.Float, len(s.c))
	for i := range s.c {
		out[i] = s.Coeff(i)
	}
	return out
}

// SetCoeff sets the coefficient of t^k (0 <= k < Len) to v rounded to Prec.
func (s *Series) SetCoeff(k int, v *big.Float) error {
	if s == nil || v == nil {
		return fmt.Errorf("series: SetCoeff on a nil series or with a nil value")
	}
	if k < 0 || k >= len(s.c) {
		return fmt.Errorf("series: coefficient index %d out of range [0, %d)", k, len(s.c))
	}
	s.c[k].Set(v)
	return nil
}

// Copy returns a deep copy (nil for nil).
func (s *Series) Copy() *Series {
	if s == nil {
		return nil
	}
	out := newZero(len(s.c), s.prec)
	for i := range s.c {
		out.c[i].Set(s.c[i])
	}
	return out
}

// Truncate returns a copy of s with n coefficients, padding with zeros
// when n exceeds the length (the padded terms are unknown, not zero, so only
// pad when that is what you mean).
func (s *Series) Truncate(n int) (*Series, error) {
	if s == nil {
		return nil, fmt.Errorf("series: Truncate of a nil series")
	}
	if err := CheckShape(n, s.prec); err != nil {
		return nil, err
	}
	out := newZero(n, s.prec)
	for i := 0; i < n && i < len(s.c); i++ {
		out.c[i].Set(s.c[i])
	}
	return out, nil
}

// WithPrec returns a copy of s with every coefficient rounded to prec bits.
func (s *Series) WithPrec(prec uint) (*Series, error) {
	if s == nil {
		return nil, fmt.Errorf("series: WithPrec of a nil series")
	}
	if err := CheckShape(len(s.c), prec); err != nil {
		return nil, err
	}
	out := newZero(len(s.c), prec)
	for i := range s.c {
		out.c[i].Set(s.c[i])
	}
	return out, nil
}

// String prints the coefficients with 10 significant digits, for debugging.
func (s *Series) String() string {
	if s == nil {
		return "<nil>"
	}
	out := "["
	for i, v := range s.c {
		if i > 0 {
			out += ", "
		}
		out += v.Text('g', 10)
	}
	return out + "]"
}
