package numeric

import (
	"errors"
	"fmt"
	"math"
)

// Params selects one Schwinger-Dyson solve. Units are script-J = 1
// (J^2 = 2^{q-1}/q).
type Params struct {
	Q    float64 // interaction order, real, >= 2
	Beta float64 // inverse temperature beta*script-J, > 0
	// Points is the number of grid points on [0, beta) of the finest grid:
	// a power of two between MinPoints and MaxPoints; 0 picks DefaultPoints(Beta).
	Points int
	// Tol is the residual tolerance max_n |g_new - g|/g of the fixed-point
	// iteration; 0 means DefaultTol.
	Tol float64
	// Levels is the number of grids (Points, Points/2, Points/4, ...) used in
	// the Richardson extrapolation in the grid spacing; 0 means 3.
	Levels int
	// Warm is a nearby solution (other beta, q or grid) to start from; nil
	// starts cold, with an internal continuation in beta when Beta is large.
	Warm *Solution
	// SkipCheck skips the E = -d log Z/d beta cross-check (four extra solves per grid).
	SkipCheck bool
	// Progress, when not nil, receives the fraction done and a short status.
	Progress func(frac float64, detail string)
}

// Limits and defaults of Params.
const (
	MinPoints  = 64
	MaxPoints  = 1 << 24
	DefaultTol = 1e-13
)

// DefaultPoints returns the finest grid used when Params.Points is 0: the
// smallest power of two with at least 32 points per unit of beta*script-J
// (grid spacing <= 1/32), and at least 1024.
func DefaultPoints(beta float64) int {
	n := 1024
	for float64(n) < 32*beta && n < MaxPoints {
		n *= 2
	}
	return n
}

// Thermo holds the thermodynamics per Majorana fermion, extrapolated to zero
// grid spacing, each with an error estimate (the size of the last Richardson
// correction, plus the iteration tolerance's effect).
type Thermo struct {
	LogZ, LogZErr float64 // log Z / N
	E, EErr       float64 // energy per fermion
	S, SErr       float64 // entropy per fermion, log Z + beta E
}

// Solution is an extrapolated solve: thermodynamics with errors, the check of
// E against -d log Z / d beta, and the per-grid solutions.
type Solution struct {
	Q, Beta float64 // interaction order and inverse temperature beta*script-J
	Thermo          // the extrapolated thermodynamics with errors
	// DLogZ is -d log Z/d beta from a six-point difference on every grid,
	// extrapolated like E, with error DLogZErr (the extrapolation's last
	// change plus the solves' noise through the difference); Mismatch =
	// E - DLogZ should vanish within MismatchErr = EErr + DLogZErr.
	DLogZ, DLogZErr, Mismatch, MismatchErr float64
	Checked                                bool     // false when SkipCheck was set
	Levels                                 []*Level // finest first
	Iterations                             int      // total over all grids and checks
	Tol                                    float64  // residual tolerance of the iterations
}

// ValidatePoints reports whether n is a supported number of grid points.
func ValidatePoints(n int) error {
	if n < MinPoints || n > MaxPoints || n&(n-1) != 0 {
		return fmt.Errorf("points must be a power of two between %d and %d, got %d", MinPoints, MaxPoints, n)
	}
	return nil
}

func (p *Params) validate() error {
	switch {
	case math.IsNaN(p.Q) || p.Q < 2 || math.IsInf(p.Q, 0):
		return fmt.Errorf("q must be a real number >= 2, got %g", p.Q)
	case math.IsNaN(p.Beta) || p.Beta <= 0 || math.IsInf(p.Beta, 0):
		return fmt.Errorf("beta must be positive and finite, got %g", p.Beta)
	case p.Tol < 0 || math.IsNaN(p.Tol):
		return fmt.Errorf("tolerance must be positive, got %g", p.Tol)
	case p.Levels < 0 || p.Levels > 5:
		return fmt.Errorf("levels must be between 1 and 5, got %d", p.Levels)
	}
	if p.Points != 0 {
		if err := ValidatePoints(p.Points); err != nil {
			return err
		}
	}
	return nil
}

// ErrInput marks errors caused by invalid parameters.
var ErrInput = errors.New("invalid input")

// Solve solves the large-N SD equations at (q, beta) on Levels grids and
// returns Richardson-extrapolated thermodynamics with error estimates.
func Solve(p Params) (*Solution, error) {
	if err := p.validate(); err != nil {
		return nil, fmt.Errorf("%w: %v", ErrInput, err)
	}
	if p.Points == 0 {
		p.Points = DefaultPoints(p.Beta)
	}
	if p.Tol == 0 {
		p.Tol = DefaultTol
	}
	if p.Levels == 0 {
		p.Levels = 3
	}
	if p.Points>>(p.Levels-1) < MinPoints/4 {
		return nil, fmt.Errorf("%w: %d points leave too few on the coarsest of %d grids", ErrInput, p.Points, p.Levels)
	}
	sol := &Solution{Q: p.Q, Beta: p.Beta, Tol: p.Tol, Checked: !p.SkipCheck}
	levels := make([]*Level, p.Levels)
	dlz := make([]float64, p.Levels)
	noise := make([]float64, p.Levels)
	// Work: a grid of n points costs ~n; checks cost ~4 partial solves.
	total, done := 0.0, 0.0
	for l := 0; l < p.Levels; l++ {
		total += float64(p.Points >> l)
	}
	report := func(frac float64, d string) {
		if p.Progress != nil {
			p.Progress(math.Min(1, frac), d)
		}
	}
	var warm *Level
	if p.Warm != nil && len(p.Warm.Levels) > 0 {
		warm = p.Warm.Levels[len(p.Warm.Levels)-1]
	}
	// Coarsest grid first; each finer grid starts from the coarser solution.
	for l := p.Levels - 1; l >= 0; l-- {
		n := p.Points >> l
		share := float64(n) / total
		sub := func(f float64, d string) {
			report(done+share*f, fmt.Sprintf("grid %d: %s", n, d))
		}
		var lv *Level
		var err error
		if warm != nil && warm.Q == p.Q && warm.Beta == p.Beta {
			lv, err = solveLevel(p.Q, p.Beta, n/2, p.Tol, warm, sub)
		} else {
			lv, err = startAndRefine(p.Q, p.Beta, n, p.Tol, warm, sub)
		}
		if err != nil {
			return nil, err
		}
		sol.Iterations += lv.Iterations
		if !p.SkipCheck {
			d, nz, its, err := derivative(lv, p.Tol)
			if err != nil {
				return nil, err
			}
			dlz[l], noise[l] = d, nz
			sol.Iterations += its
		}
		levels[l] = lv
		warm = lv
		done += share
	}
	report(1, "done")
	sol.Levels = levels
	pick := func(f func(*Level) float64) []float64 {
		v := make([]float64, len(levels))
		for i, lv := range levels {
			v[i] = f(lv)
		}
		return v
	}
	var eTol float64
	sol.LogZ, sol.LogZErr = Richardson(pick(func(l *Level) float64 { return l.LogZ }), richardsonPowers)
	sol.E, sol.EErr = Richardson(pick(func(l *Level) float64 { return l.E }), richardsonPowers)
	// The energy is not variational: a residual tol shifts it by about tol |E|.
	eTol = p.Tol * math.Abs(sol.E)
	sol.EErr += eTol
	sol.LogZErr += p.Tol * math.Abs(sol.LogZ)
	sol.S = sol.LogZ + p.Beta*sol.E
	sol.SErr = sol.LogZErr + p.Beta*sol.EErr
	if !p.SkipCheck {
		sol.DLogZ, sol.DLogZErr = Richardson(dlz, richardsonPowers)
		// the extrapolation's last change does not see noise common to the
		// grids: add the largest of their noise estimates
		worst := 0.0
		for _, nz := range noise {
			worst = math.Max(worst, nz)
		}
		sol.DLogZErr += worst
		sol.Mismatch = sol.E - sol.DLogZ
		sol.MismatchErr = sol.EErr + sol.DLogZErr
	}
	return sol, nil
}

// coarsePerBeta sets the coarse grid of a cold or warm start: about this
// many points per unit of beta*script-J on [0, beta/2].
const coarsePerBeta = 4.0

// continuation solves at beta on n points from a cold start.
func continuation(q, beta float64, n int, tol float64, progress func(float64, string)) (*Level, error) {
	return startAndRefine(q, beta, n, tol, nil, progress)
}

// startAndRefine solves at beta on n points. A coarse grid (spacing about
// 1/coarsePerBeta) is solved first, from warm when it is given (any q, beta
// or grid), otherwise by walking up in beta from a small value; the coarse
// solution is then refined by doubling the points at fixed beta. Its
// coefficients are an excellent start on the finer grid, since grids of the
// same beta differ only by the O(h^4) discretisation error, and the first
// iterations, which do all the work, run on the cheap grid.
func startAndRefine(q, beta float64, n int, tol float64, warm *Level, progress func(float64, string)) (*Level, error) {
	const start, factor = 64.0, 4.0
	m := n / 2
	mc := m
	for mc > 256 && float64(mc/2) >= coarsePerBeta*beta {
		mc /= 2
	}
	if warm == nil {
		b := beta
		var steps []float64
		for b > start {
			b /= factor
			steps = append([]float64{b}, steps...)
		}
		for _, bs := range steps {
			ms := max(int(float64(mc)*bs/beta), 16)
			lv, err := solveLevel(q, bs, ms, math.Max(tol, 1e-8), warm, nil)
			if err != nil {
				return nil, err
			}
			warm = lv
		}
	}
	// Work of the sweep, for progress: grid sizes mc, 2mc, ..., m.
	total, done := 0.0, 0.0
	for k := mc; k <= m; k *= 2 {
		total += float64(k)
	}
	for k := mc; k <= m; k *= 2 {
		var sub func(float64, string)
		if progress != nil {
			d, share := done, float64(k)/total
			sub = func(f float64, s string) { progress(d+share*f, s) }
		}
		lv, err := solveLevel(q, beta, k, tol, warm, sub)
		if err != nil {
			return nil, err
		}
		warm = lv
		done += float64(k) / total
	}
	return warm, nil
}

// derivative returns -d log Z/d beta on lv's grid (same number of points)
// by a fourth-order central difference with step beta/1000.
func derivative(lv *Level, tol float64) (deriv, noise float64, its int, err error) {
	d := lv.Beta * derivStep
	var f [7]float64 // log Z at beta + k d, k = -3..3
	for i := range f {
		o, err := solveLevel(lv.Q, lv.Beta+float64(i-3)*d, lv.Points/2, tol, lv, nil)
		if err != nil {
			return 0, 0, its, err
		}
		its += o.Iterations
		f[i] = o.LogZ
	}
	// six-point central difference, truncation -d^6 f^(7)/140 (A&S 25.3.6)
	deriv = (-f[0] + 9*f[1] - 45*f[2] + 45*f[4] - 9*f[5] + f[6]) / (60 * d)
	// The noise of the solves (rounding, the residual tolerance) is what
	// limits it: the sixth difference, d^6 f^(6) plus that noise times
	// sqrt(924), measures it, and the difference passes noise on with a
	// gain sqrt(4214)/60 = 1.08 per unit of d; twice that is stated (the
	// solves' errors are smooth in beta, so this overstates: at q = 4,
	// beta = 1 it states 3e-14 where the difference is off by 4e-15).
	d6 := f[0] - 6*f[1] + 15*f[2] - 20*f[3] + 15*f[4] - 6*f[5] + f[6]
	noise = 2 * 1.08 * math.Abs(d6) / math.Sqrt(924) / d
	return -deriv, noise, its, nil
}

// derivStep is the difference step of derivative in units of beta: at
// 5e-3 the six-point truncation is below 1e-15 for beta script-J <= 10,
// and the solves' noise (about 1e-17 in log Z) costs about 2e-15.
const derivStep = 5e-3

// richardsonPowers are the powers of h that Solve removes one by one: the
// discretisation is fourth order (tails subtracted analytically,
// end-corrected trapezoid) and the truncated Matsubara sum of log Z adds an
// h^5 term.
var richardsonPowers = []float64{4, 5, 6, 7}
