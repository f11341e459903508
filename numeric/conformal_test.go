package numeric

import (
	"math/big"
	"testing"

	"qbridge/expansion/conformal"
)

// conformalData returns h_1 and the exact S_0 at q from package
// expansion/conformal, the inputs FitGround expects from its callers.
func conformalData(tb testing.TB, q float64) ConformalData {
	tb.Helper()
	qp := conformal.QPoint{Q: new(big.Float).SetFloat64(q)}
	h, err := conformal.Dimension(qp, 1, 20)
	if err != nil {
		tb.Fatal(err)
	}
	s, err := conformal.S0(qp, 20)
	if err != nil {
		tb.Fatal(err)
	}
	c := ConformalData{}
	c.H1, _ = h.Value.Float64()
	c.S0Exact, _ = s.Value.Float64()
	return c
}

// groundCache holds the default-ladder results of the tests, so that tests
// reading the same q share one ladder.
var groundCache = map[float64]*Ground{}

// defaultGround returns SolveGround on the default ladder at q, once per q.
func defaultGround(tb testing.TB, q float64) *Ground {
	tb.Helper()
	if g, ok := groundCache[q]; ok {
		return g
	}
	g, err := SolveGround(GroundLadder(q, 0, nil), conformalData(tb, q))
	if err != nil {
		tb.Fatal(err)
	}
	groundCache[q] = g
	return g
}
