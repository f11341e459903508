package numeric

// Defaults of the low-temperature ladder (GroundLadder): beta*script-J from
// 25 to 4000, 24 solves with 64 points per unit of beta, residual 1e-14.
const (
	GroundBetaSpan      = 160.0  // BetaMax/BetaMin
	GroundBetaMax       = 4000.0 // largest beta*script-J
	GroundSteps         = 24     // number of solves
	GroundPointsPerBeta = 64.0   // grid points per unit of beta on the finest grid
	GroundTol           = 1e-14  // residual tolerance of every solve
)

// GroundLadder returns the default low-temperature ladder at q, ending at
// betaMax (0 means GroundBetaMax) and starting at betaMax/GroundBetaSpan,
// with progress reports to progress (may be nil).
func GroundLadder(q, betaMax float64, progress func(float64, string)) LadderParams {
	if betaMax == 0 {
		betaMax = GroundBetaMax
	}
	return LadderParams{
		Q: q, BetaMin: betaMax / GroundBetaSpan, BetaMax: betaMax, Steps: GroundSteps,
		PointsPerBeta: GroundPointsPerBeta, Tol: GroundTol, Progress: progress,
	}
}

// SolveGround runs the ladder p (GroundLadder gives the defaults) and the
// joint fits of FitGround with the conformal data c. With the defaults at
// q = 4 it takes a few seconds on one core and gives E_0 to about 13 digits.
func SolveGround(p LadderParams, c ConformalData) (*Ground, error) {
	lad, err := Ladder(p)
	if err != nil {
		return nil, err
	}
	return FitGround(p.Q, c, lad)
}

// The precision ladder (PrecisionLadder): beta*script-J from 20 to 8000 in
// 40 solves, the grids and residual of the default ladder.
const (
	PrecisionBetaMin = 20.0
	PrecisionBetaMax = 8000.0
	PrecisionSteps   = 40
)

// PrecisionLadder is the ladder of the sharpest low-temperature fits, chosen
// by the error it buys on alpha_S at q = 4 with FitGround and h_1..h_6:
// GroundLadder (25..4000, 24 solves) about 5e-9; 25..4000 in 40 solves
// 7e-10; 20..8000 in 40 solves 4.5e-10 (this one; about three times the
// cost of GroundLadder); 16..16000 in 48 solves 6.6e-10 (the hottest
// points need more terms and the coldest have larger relative errors).
func PrecisionLadder(q float64, progress func(float64, string)) LadderParams {
	return LadderParams{Q: q, BetaMin: PrecisionBetaMin, BetaMax: PrecisionBetaMax, Steps: PrecisionSteps,
		PointsPerBeta: GroundPointsPerBeta, Tol: GroundTol, Progress: progress}
}
