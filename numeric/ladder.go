package numeric

import (
	"fmt"
	"math"
)

// LadderParams selects a ladder of solves at geometrically spaced beta,
// each started from the previous one (continuation in beta).
type LadderParams struct {
	Q                float64 // interaction order, real, >= 2
	BetaMin, BetaMax float64 // range of beta*script-J, 0 < BetaMin < BetaMax
	Steps            int     // number of beta values, >= 2
	// PointsPerBeta sets each grid: the finest grid has the smallest power of
	// two >= PointsPerBeta*beta points (0 means 32, as DefaultPoints).
	PointsPerBeta float64
	Tol           float64 // 0 means DefaultTol
	// Progress, when not nil, receives the fraction of the ladder done and a
	// short status.
	Progress func(frac float64, detail string)
}

// Ladder solves at Steps values of beta from BetaMin to BetaMax (geometric),
// without the per-point derivative check, and returns the solutions in
// increasing beta.
func Ladder(p LadderParams) ([]*Solution, error) {
	switch {
	case math.IsNaN(p.Q) || p.Q < 2:
		return nil, fmt.Errorf("%w: q must be >= 2, got %g", ErrInput, p.Q)
	case !(p.BetaMin > 0) || !(p.BetaMax > p.BetaMin) || math.IsInf(p.BetaMax, 0):
		return nil, fmt.Errorf("%w: need 0 < beta-min < beta-max, got %g, %g", ErrInput, p.BetaMin, p.BetaMax)
	case p.Steps < 2:
		return nil, fmt.Errorf("%w: need at least 2 ladder steps, got %d", ErrInput, p.Steps)
	}
	ppb := p.PointsPerBeta
	if ppb == 0 {
		ppb = 32
	}
	betas := make([]float64, p.Steps)
	work, total := make([]float64, p.Steps), 0.0
	for i := range betas {
		betas[i] = p.BetaMin * math.Pow(p.BetaMax/p.BetaMin, float64(i)/float64(p.Steps-1))
		work[i] = float64(pointsFor(betas[i], ppb))
		total += work[i]
	}
	var out []*Solution
	var warm *Solution
	done := 0.0
	for i, b := range betas {
		sub := func(f float64, d string) {
			if p.Progress != nil {
				p.Progress((done+f*work[i])/total, fmt.Sprintf("beta %.4g (%d/%d) %s", b, i+1, len(betas), d))
			}
		}
		s, err := Solve(Params{Q: p.Q, Beta: b, Points: pointsFor(b, ppb), Tol: p.Tol, Warm: warm, SkipCheck: true, Progress: sub})
		if err != nil {
			return nil, fmt.Errorf("ladder step beta=%g: %w", b, err)
		}
		out = append(out, s)
		warm = s
		done += work[i]
	}
	return out, nil
}

func pointsFor(beta, perBeta float64) int {
	n := 1024
	for float64(n) < perBeta*beta && n < MaxPoints {
		n *= 2
	}
	return n
}
