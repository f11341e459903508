package special

import (
	"fmt"

	"qbridge/series"
	"qbridge/series/scalar"
)

// checkSeries rejects a nil or empty series.
func checkSeries(name string, s *series.Series) error {
	if s == nil || s.Len() == 0 {
		return fmt.Errorf("special: %s of a nil or empty series", name)
	}
	return nil
}

// LogGamma returns the series of log|Gamma(s(t))|: the Taylor expansion of
// log|Gamma| at s(0) (scalar.LogGammaTaylor) composed with s - s(0). It
// returns scalar.ErrPole when s(0) is 0, -1, -2, ...
func LogGamma(s *series.Series) (*series.Series, error) {
	if err := checkSeries("LogGamma", s); err != nil {
		return nil, err
	}
	taylor, err := scalar.LogGammaTaylor(s.Coeff(0), s.Len(), s.Prec())
	if err != nil {
		return nil, err
	}
	return series.ComposeTaylor(taylor, s)
}

// Gamma returns the series of Gamma(s(t)). It returns scalar.ErrPole when
// s(0) is 0, -1, -2, ... (use GammaPoleSeries to expand around a pole).
func Gamma(s *series.Series) (*series.Series, error) {
	if err := checkSeries("Gamma", s); err != nil {
		return nil, err
	}
	taylor, err := scalar.GammaTaylor(s.Coeff(0), s.Len(), s.Prec())
	if err != nil {
		return nil, err
	}
	return series.ComposeTaylor(taylor, s)
}

// RGamma returns the series of 1/Gamma(s(t)), which is entire: at the
// poles of Gamma the pole expansion is used.
func RGamma(s *series.Series) (*series.Series, error) {
	if err := checkSeries("RGamma", s); err != nil {
		return nil, err
	}
	taylor, err := scalar.RGammaTaylor(s.Coeff(0), s.Len(), s.Prec())
	if err != nil {
		return nil, err
	}
	return series.ComposeTaylor(taylor, s)
}

// Digamma returns the series of psi(s(t)). It returns scalar.ErrPole when
// s(0) is 0, -1, -2, ...
func Digamma(s *series.Series) (*series.Series, error) {
	return Polygamma(0, s)
}

// Polygamma returns the series of psi^(m)(s(t)) for m >= 0. It returns an
// error for m < 0 and scalar.ErrPole when s(0) is 0, -1, -2, ...
func Polygamma(m int, s *series.Series) (*series.Series, error) {
	if err := checkSeries("Polygamma", s); err != nil {
		return nil, err
	}
	taylor, err := scalar.PolygammaTaylor(m, s.Coeff(0), s.Len(), s.Prec())
	if err != nil {
		return nil, err
	}
	return series.ComposeTaylor(taylor, s)
}

// GammaPoleSeries returns the series in t of t Gamma(-n+t), n >= 0, with
// the given length at prec bits: finite at t = 0 with value (-1)^n/n!
// (DLMF 5.2.1 residues), so that callers can cancel a pole of Gamma
// against a zero exactly.
func GammaPoleSeries(n, length int, prec uint) (*series.Series, error) {
	c, err := scalar.GammaPoleCoeffs(n, length, prec)
	if err != nil {
		return nil, err
	}
	return series.FromBig(prec, c)
}

// RGammaPoleSeries returns the series in t of 1/Gamma(-n+t), n >= 0, with
// the given length at prec bits: zero constant term, and linear
// coefficient (-1)^n n!.
func RGammaPoleSeries(n, length int, prec uint) (*series.Series, error) {
	c, err := scalar.RGammaPoleCoeffs(n, length, prec)
	if err != nil {
		return nil, err
	}
	return series.FromBig(prec, c)
}
