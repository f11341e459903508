package energy

import (
	"fmt"
	"math"
	"math/big"
	"sync"

	"qbridge/expansion/conformal"
	"qbridge/numeric"
)

// Direct is the low-temperature data of the direct Schwinger-Dyson solver
// (numeric.Ladder and numeric.FitGround) at one q.
type Direct struct {
	Q                 float64 // interaction order
	E0, E0Err         float64 // ground-state energy per fermion and its error
	S0, S0Err         float64 // fitted zero-temperature entropy and its error
	AlphaS, AlphaSErr float64 // Schwarzian coefficient and its error
}

// DirectGround runs the direct solver on the default low-temperature ladder
// (numeric.GroundLadder: beta*script-J from 25 to 4000 in 24 solves, 64
// points per unit of beta, residual 1e-14) and its fits at q, through
// Ground: the ground command, report and resum see the same numbers, and a
// second call at the same q (E_0, then alpha_S) does not solve again.
func DirectGround(q float64, progress func(float64, string)) (*Direct, error) {
	g, err := Ground(numeric.GroundLadder(q, 0, progress))
	if err != nil {
		return nil, fmt.Errorf("direct solver at q=%g: %w", q, err)
	}
	return &Direct{Q: q, E0: g.E0, E0Err: g.E0Err, S0: g.S0, S0Err: g.S0Err, AlphaS: g.AlphaS, AlphaSErr: g.AlphaSErr}, nil
}

// conformalDigits is the precision of the conformal data handed to the
// float64 fits: a few digits beyond float64.
const conformalDigits = 20

// ConformalData returns what the direct solver's fits need from the exact
// conformal data at q (numeric.ConformalData): h_1, the first operator
// dimension above 2 (conformal.Dimension), and the exact zero-temperature
// entropy (conformal.S0), rounded to float64.
func ConformalData(q float64) (numeric.ConformalData, error) {
	if math.IsNaN(q) || q < 2 || math.IsInf(q, 0) {
		return numeric.ConformalData{}, fmt.Errorf("%w: q must be a real number >= 2, got %g", ErrInput, q)
	}
	qp := conformal.QPoint{Q: new(big.Float).SetFloat64(q)}
	h, err := conformal.Dimension(qp, 1, conformalDigits)
	if err != nil {
		return numeric.ConformalData{}, fmt.Errorf("h_1 at q=%g: %w", q, err)
	}
	s, err := conformal.S0(qp, conformalDigits)
	if err != nil {
		return numeric.ConformalData{}, fmt.Errorf("S_0 at q=%g: %w", q, err)
	}
	var c numeric.ConformalData
	c.H1, _ = h.Value.Float64()
	c.S0Exact, _ = s.Value.Float64()
	return c, nil
}

// groundKey identifies a ladder: every field of numeric.LadderParams but the
// progress callback.
type groundKey struct {
	q, betaMin, betaMax, pointsPerBeta, tol float64
	steps                                   int
}

// groundEntry is one cached extraction; ready is closed once g and err are set.
type groundEntry struct {
	ready chan struct{}
	g     *numeric.Ground
	err   error
}

// groundCache holds the extractions of this process, one per ladder.
var groundCache = struct {
	sync.Mutex
	m map[groundKey]*groundEntry
}{m: map[groundKey]*groundEntry{}}

// Ground runs the direct solver's ladder p and the joint low-temperature
// fits (numeric.SolveGround) with h_1 and the exact S_0 from package
// expansion/conformal (ConformalData). Results are cached for the life of
// the process, keyed by q and the ladder parameters (all fields of p but
// Progress): a repeated call, also a concurrent one, waits for the first and
// shares its result, and p.Progress is then only told that it is done.
// Failures are not cached.
//
// The result is shared and must not be modified. To keep the cache small,
// its Ladder solutions carry no per-grid Levels (G(tau) of every grid).
func Ground(p numeric.LadderParams) (*numeric.Ground, error) {
	k := groundKey{p.Q, p.BetaMin, p.BetaMax, p.PointsPerBeta, p.Tol, p.Steps}
	groundCache.Lock()
	e, ok := groundCache.m[k]
	if !ok {
		e = &groundEntry{ready: make(chan struct{})}
		groundCache.m[k] = e
	}
	groundCache.Unlock()
	if ok {
		<-e.ready
		if e.err == nil && p.Progress != nil {
			p.Progress(1, "cached")
		}
		return e.g, e.err
	}
	e.g, e.err = solveGround(p)
	if e.err != nil {
		groundCache.Lock()
		delete(groundCache.m, k)
		groundCache.Unlock()
	}
	close(e.ready)
	return e.g, e.err
}

// solveGround is Ground without the cache; it drops the per-grid levels of
// the ladder.
func solveGround(p numeric.LadderParams) (*numeric.Ground, error) {
	c, err := ConformalData(p.Q)
	if err != nil {
		return nil, err
	}
	g, err := numeric.SolveGround(p, c)
	if err != nil {
		return nil, err
	}
	for i, s := range g.Ladder {
		light := *s
		light.Levels = nil
		g.Ladder[i] = &light
	}
	return g, nil
}
