package numeric

// Defaults of the ladder behind GroundQuick (and the ground command). The
// ladder starts at GroundBetaMax/GroundBetaSpan.
const (
	GroundBetaSpan      = 160.0
	GroundBetaMax       = 4000.0
	GroundSteps         = 24
	GroundPointsPerBeta = 64.0
	GroundTol           = 1e-14
)

// GroundLadder returns the ladder parameters GroundQuick uses at q, ending at
// betaMax (0 means GroundBetaMax) and starting at betaMax/GroundBetaSpan.
func GroundLadder(q, betaMax float64, progress func(float64, string)) LadderParams {
	if betaMax == 0 {
		betaMax = GroundBetaMax
	}
	return LadderParams{
		Q: q, BetaMin: betaMax / GroundBetaSpan, BetaMax: betaMax, Steps: GroundSteps,
		PointsPerBeta: GroundPointsPerBeta, Tol: GroundTol, Progress: progress,
	}
}

// GroundQuick runs the default low-temperature ladder at q (beta*script-J
// from 25 to 4000, 24 solves with 64 points per unit of beta, residual
// 1e-14) and the joint fits of FitGround. At q = 4 it takes a few seconds
// on one core and gives E_0 to about 13 digits.
func GroundQuick(q float64, progress func(frac float64, detail string)) (*Ground, error) {
	lad, err := Ladder(GroundLadder(q, 0, progress))
	if err != nil {
		return nil, err
	}
	return FitGround(q, lad)
}
