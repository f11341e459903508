package energy

import (
	"fmt"
	"math"
	"math/big"
	"sync"

	"qbridge/expansion/conformal"
	"qbridge/numeric"
)

// Direct is the direct numerical value of E_0 and alpha_S at one q: per
// quantity the more accurate of the direct solver's low-temperature ladder
// (numeric.Ladder and numeric.FitGround) and its zero-temperature route
// (DirectSoftMode), and the fitted S_0 of the ladder.
type Direct struct {
	Q                 float64 // interaction order
	E0, E0Err         float64 // ground-state energy per fermion and its error
	S0, S0Err         float64 // fitted zero-temperature entropy and its error
	AlphaS, AlphaSErr float64 // Schwarzian coefficient and its error
	// E0Method and AlphaSMethod say which route gave the value.
	E0Method, AlphaSMethod string
	// Ladder is the finite-temperature ladder's own result (the ground
	// command prints its fits).
	Ladder *numeric.Ground
}

// Methods of the direct values.
const (
	DirectLadderMethod = "direct Schwinger-Dyson solver: ladder of solves in beta and joint low-temperature fits of log Z and E"
	DirectZeroTMethod  = "direct zero-temperature Schwinger-Dyson route: "
)

// DirectGround runs the direct solver on the default low-temperature ladder
// (numeric.GroundLadder: beta*script-J from 25 to 4000 in 24 solves, 64
// points per unit of beta, residual 1e-14) and its fits at q, through
// Ground, and for q > 2 the zero-temperature route (DirectSoftMode), and
// takes per quantity the value with the smaller error (at q = 4 the T = 0
// route states 1.1e-12 for alpha_S, the ladder 4.7e-9). The ground
// command, report, table and resum see the same numbers, and a second
// call at the same q does not solve again.
func DirectGround(q float64, progress func(float64, string)) (*Direct, error) {
	g, err := Ground(numeric.GroundLadder(q, 0, progress))
	if err != nil {
		return nil, fmt.Errorf("direct solver at q=%g: %w", q, err)
	}
	d := &Direct{Q: q, E0: g.E0, E0Err: g.E0Err, S0: g.S0, S0Err: g.S0Err, AlphaS: g.AlphaS, AlphaSErr: g.AlphaSErr,
		E0Method: DirectLadderMethod, AlphaSMethod: DirectLadderMethod, Ladder: g}
	if checkSoftModeQ(q) != nil {
		return d, nil
	}
	z, err := DirectSoftMode(q, progress)
	if err != nil {
		// The ladder's values stand; say why the other route is missing.
		why := fmt.Sprintf(" (the zero-temperature route failed at q=%g: %v)", q, err)
		d.E0Method += why
		d.AlphaSMethod += why
		return d, nil
	}
	if z.AlphaSErr < d.AlphaSErr {
		d.AlphaS, d.AlphaSErr = z.AlphaS, z.AlphaSErr
		d.AlphaSMethod = DirectZeroTMethod + z.MethodS + "; " + z.MethodG
	}
	if z.E0Err < d.E0Err {
		d.E0, d.E0Err = z.E0, z.E0Err
		d.E0Method = DirectZeroTMethod + "E_0 = -(2 script-J^2/q) int_0^inf G^q dtau from the T = 0 solution; " + z.MethodG
	}
	return d, nil
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
