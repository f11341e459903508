package conformal

import (
	"math/big"

	"qbridge/series"
)

// EpsToDelta turns a series in eps = 1 - 2/q into the series in
// delta = q - 2 of the same function, using eps = delta/(2 + delta). Both
// variables vanish at q = 2, so this is an exact identity of truncated
// series.
func EpsToDelta(s *series.Series) (*series.Series, error) {
	return series.Mobius(s, big.NewFloat(1), new(big.Float), big.NewFloat(1), big.NewFloat(2))
}

// DeltaToEps turns a series in delta = q - 2 into the series in
// eps = 1 - 2/q of the same function, using delta = 2 eps/(1 - eps); the
// inverse of EpsToDelta, also exact.
func DeltaToEps(s *series.Series) (*series.Series, error) {
	return series.Mobius(s, big.NewFloat(2), new(big.Float), big.NewFloat(-1), big.NewFloat(1))
}
