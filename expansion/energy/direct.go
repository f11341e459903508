package energy

import (
	"fmt"

	"qbridge/numeric"
)

// Direct is the low-temperature data of the direct Schwinger-Dyson solver
// (numeric.Ladder and numeric.FitGround) at one q.
type Direct struct {
	Q                 float64
	E0, E0Err         float64
	S0, S0Err         float64
	AlphaS, AlphaSErr float64
}

// Ladder of the direct solves: beta*script-J from 50 to 2000 in 16 steps.
const (
	directBetaMin = 50
	directBetaMax = 2000
	directSteps   = 16
)

// DirectGround runs the direct solver's ladder and low-temperature fits at q.
func DirectGround(q float64, progress func(float64, string)) (*Direct, error) {
	lad, err := numeric.Ladder(numeric.LadderParams{Q: q, BetaMin: directBetaMin, BetaMax: directBetaMax, Steps: directSteps, Progress: progress})
	if err != nil {
		return nil, fmt.Errorf("direct solver at q=%g: %w", q, err)
	}
	g, err := numeric.FitGround(q, lad)
	if err != nil {
		return nil, fmt.Errorf("direct solver fits at q=%g: %w", q, err)
	}
	return &Direct{Q: q, E0: g.E0, E0Err: g.E0Err, S0: g.S0, S0Err: g.S0Err, AlphaS: g.AlphaS, AlphaSErr: g.AlphaSErr}, nil
}
