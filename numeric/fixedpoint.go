package numeric

import "math"

// fixedPoint is the damped, Anderson-accelerated iteration x -> F(x) that
// the solvers share: the step is taken on x[:active], the best iterate so
// far is kept, a residual that grows fourfold sends the iteration back to
// it with half the damping weight and a fresh history, and NaNs do the
// same (or fail at once when no finite residual was seen yet).
type fixedPoint struct {
	tol    float64 // residual at which the iteration stops
	mix    float64 // initial damping weight
	active int     // length of the part of x the step moves
	// floor accepts the best iterate when the residual has not dropped by
	// 10% for zeroTStall iterations while within zeroTFloorFactor of tol
	// (the round-off floor of the transforms).
	floor bool
	// progress, when not nil, sees every iteration's residual and the first.
	progress func(it int, res, startRes float64)
	// afterBest, when not nil, sees the residual after the best iterate is
	// updated; returning true restarts the history (a change of the map).
	afterBest func(res float64) bool
}

// fixedPointResult is how a fixedPoint run ended.
type fixedPointResult struct {
	res     float64 // final residual (the best one when floor is set)
	bestRes float64 // smallest residual seen
	it      int     // iterations done (maxIterations + 1 when they ran out)
	floor   bool    // stopped at the round-off floor
	nanAt   int     // iteration of a NaN before any finite residual (0: none)
}

// run iterates from x (updated in place). step sets f = F(x) - x on at least
// f[:active] and returns the residual measure of that change.
func (fp fixedPoint) run(x []float64, step func(x, f []float64) float64) fixedPointResult {
	f := make([]float64, len(x))
	best := make([]float64, len(x))
	r := fixedPointResult{res: math.Inf(1), bestRes: math.Inf(1)}
	acc := newAnderson(andersonDepth, fp.active)
	mix := fp.mix
	prevRes := math.Inf(1)
	startRes := -1.0
	lastGain := 0
	for r.it = 1; r.it <= maxIterations; r.it++ {
		r.res = step(x, f)
		if math.IsNaN(r.res) || math.IsInf(r.res, 0) {
			if math.IsInf(r.bestRes, 1) {
				r.nanAt = r.it
				return r
			}
			copy(x, best)
			mix /= 2
			acc.reset()
			continue
		}
		if startRes < 0 {
			startRes = r.res
		}
		if fp.progress != nil {
			fp.progress(r.it, r.res, startRes)
		}
		if r.res < 0.9*r.bestRes {
			lastGain = r.it
		}
		if r.res < r.bestRes {
			r.bestRes = r.res
			copy(best, x)
		}
		if r.res <= fp.tol {
			break
		}
		if fp.floor && r.bestRes <= zeroTFloorFactor*fp.tol && r.it-lastGain > zeroTStall {
			copy(x, best)
			r.res, r.floor = r.bestRes, true
			break
		}
		if fp.afterBest != nil && fp.afterBest(r.res) {
			acc.reset()
		}
		if r.res > 4*prevRes {
			copy(x, best)
			mix /= 2
			acc.reset()
			prevRes = r.bestRes
			if mix < 1e-6 {
				break
			}
			continue
		}
		prevRes = r.res
		acc.step(x[:fp.active], f[:fp.active], mix)
	}
	return r
}

// converged reports whether the run met its tolerance or stopped at the floor.
func (r fixedPointResult) converged(tol float64) bool {
	return r.nanAt == 0 && (r.res <= tol || r.floor)
}
