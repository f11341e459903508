package conformal

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"math/cmplx"
	"sort"
	"sync"
)

// The coarse search for the collisions of h_n (complex128 arithmetic).
//
// h_n(s) is continued from s = 0 outwards along rays s = t u, |u| = 1, on
// a fan of directions covering the upper half plane (h_n is real on the
// real axis, so its singularities come in conjugate pairs). Continuation is
// predictor-corrector: the tangent dh/dt = -L_D D'(s) u / L_h predicts,
// Newton's method on k_A(h) = 1 corrects, and a step is accepted only when
// the correction is small against the predicted change, so that the
// continuation stays on one root. Along each ray the local maxima of
// |dh/dt| (it grows like |s - s*|^(-1/2) near a branch point s*) start
// Newton's method on the 2x2 system k_A = 1, dk_A/dh = 0 in (h, D). Every
// solution is then checked by continuing h_n along the straight ray to it:
// only points that h_n reaches from the expansion point are singularities
// of its series (the other solutions lie on other sheets). The partner
// level is identified by continuing the other colliding root back along the
// same ray to |s| = scanStart and comparing it with the levels there.

// scanStart is |s| at which continuation starts from the real root at
// s = scanStart (above nearEnd, so that the bracketing root finder is used).
const scanStart = 4e-3

// scanRays is the number of ray directions in [0, pi].
const scanRays = 49

// approachGap is the relative distance 1 - t/|s*| at which the ray
// continuation stops short of a candidate branch point when checking it.
const approachGap = 1e-4

// hRunaway is the size of |h| beyond which a level is said to run off.
const hRunaway = 400

// variable maps between the expansion variable s and Delta = 1/q.
func deltaOf(end End, s complex128) complex128 {
	if end == AroundTwo {
		return (1 - s) / 2
	}
	return s
}

func sOfDelta(end End, d complex128) complex128 {
	if end == AroundTwo {
		return 1 - 2*d
	}
	return d
}

// dDelta is dDelta/ds.
func dDelta(end End) complex128 {
	if end == AroundTwo {
		return -0.5
	}
	return 1
}

// levelBase is h_m at the end itself: 2m + 2 around q = 2; 2m + 1 (m >= 1)
// and 2 (m = 0) around q = infinity.
func levelBase(end End, m int) float64 {
	if m == 0 {
		return 2
	}
	if end == AroundTwo {
		return float64(2*m + 2)
	}
	return float64(2*m + 1)
}

// newtonH128 solves k_A(h, D(s)) = 1 for h from h0 (two-Gamma form,
// kerneltwo128.go). It stops when the step is below 1e-12 (1 + |h|), or,
// with early, when the error left after it is: once two steps show the
// quadratic convergence e' = M e^2, that error is about M step^2 with
// M = step/step_prev^2 (early serves the scan rays, which only seed the
// collision Newton; verification and the partner level, whose continuation
// must not jump roots, use the full test). The jet returned is the one of the last
// iteration, taken before that step: the tangent and |dh/dt| built from it
// are as good as at h, and a further evaluation is saved.
func newtonH128(end End, h0, s complex128, maxIt int, early bool) (complex128, jet128, bool) {
	pre := twoPrefactor128(deltaOf(end, s))
	h := h0
	var j jet128
	prev := math.Inf(1)
	for it := 0; it < maxIt; it++ {
		j = twoJet128(h, pre)
		step := (j.k - 1) / (j.k * j.lh)
		if !finite128(step) {
			return h, j, false
		}
		h -= step
		a := cmplx.Abs(step)
		tol := 1e-12 * (1 + cmplx.Abs(h))
		if a < tol || (early && it > 0 && a < 1e-3*prev && a*a*a < 0.1*tol*prev*prev) {
			return h, j, true
		}
		prev = a
	}
	return h, j, false
}

// levelStart128 returns h_m at s = scanStart*u, from the real root at
// s = scanStart (bracketing root finder), moved to the direction u to first
// order in s and polished by Newton's method.
func levelStart128(end End, m int, u complex128) (complex128, error) {
	if m == 0 {
		return 2, nil // the soft mode: k_A(2) = 1 for every q
	}
	y, err := levelSlope(end, m)
	if err != nil {
		return 0, err
	}
	base := levelBase(end, m)
	h, _, ok := newtonH128(end, complex(base, 0)+complex(scanStart*y, 0)*u, complex(scanStart, 0)*u, 40, false)
	if !ok {
		return 0, fmt.Errorf("expansion: no start for h_%d at s = %g in direction %v", m, scanStart, u)
	}
	return h, nil
}

// slopeCache holds (h_m(s) - h_m(0))/s at s = scanStart on the real axis.
var slopeCache = struct {
	sync.Mutex
	m map[[2]int]float64
}{m: map[[2]int]float64{}}

// levelSlope returns (h_m(s) - h_m(0))/s at the real s = scanStart.
func levelSlope(end End, m int) (float64, error) {
	key := [2]int{int(end), m}
	slopeCache.Lock()
	y, ok := slopeCache.m[key]
	slopeCache.Unlock()
	if ok {
		return y, nil
	}
	const prec = 96
	var q QPoint
	if end == AroundTwo {
		q = QPoint{Q: new(big.Float).SetPrec(prec).SetFloat64(2 / (1 - scanStart))}
	} else {
		q = QPoint{Q: new(big.Float).SetPrec(prec).SetFloat64(1 / scanStart)}
	}
	hb, err := dimensionExact(q, m, prec)
	if err != nil {
		return 0, err
	}
	hr, _ := hb.Float64()
	var sr float64
	if end == AroundTwo {
		sr, _ = q.Eps(prec).Float64()
	} else {
		sr, _ = q.X(prec).Float64()
	}
	y = (hr - levelBase(end, m)) / sr
	slopeCache.Lock()
	slopeCache.m[key] = y
	slopeCache.Unlock()
	return y, nil
}

// rayPoint is one accepted step of a continuation.
type rayPoint struct {
	t     float64
	h     complex128
	slope float64 // |dh/dt|
}

// tangent returns dh/dt along s = t u at a root with jet j.
func tangent(end End, u complex128, j jet128) complex128 {
	return -j.ld * dDelta(end) * u / j.lh
}

// errRunaway reports a level that grows beyond hRunaway.
var errRunaway = errors.New("expansion: the level runs off to infinity")

// follow128 continues the root h0 at s = ta u to s = tb u (ta, tb > 0,
// either direction), calling visit after every accepted step. stepCap
// bounds the step in t. The scan (visit set) lets Newton stop early.
func follow128(end End, u complex128, ta, tb float64, h0 complex128, stepCap float64, visit func(rayPoint)) (complex128, error) {
	h, j, ok := newtonH128(end, h0, complex(ta, 0)*u, 40, false)
	if !ok {
		return h, fmt.Errorf("expansion: continuation start did not converge at s = %v", complex(ta, 0)*u)
	}
	dir := 1.0
	if tb < ta {
		dir = -1
	}
	t := ta
	dt := 0.02 * t
	for (tb-t)*dir > 0 {
		maxStep := math.Min(0.1*t, stepCap)
		if dir < 0 {
			maxStep = math.Min(0.05*t, stepCap)
		}
		dt = math.Min(dt, maxStep)
		if dt < 1e-13*t {
			return h, fmt.Errorf("expansion: continuation stalled at s = %v", complex(t, 0)*u)
		}
		tn := t + dir*dt
		if (tb-tn)*dir < 0 {
			tn = tb
		}
		dh := tangent(end, u, j)
		pred := h + dh*complex(tn-t, 0)
		hn, jn, ok := newtonH128(end, pred, complex(tn, 0)*u, 8, visit != nil)
		if !ok || cmplx.Abs(hn-pred) > 0.1*cmplx.Abs(dh)*math.Abs(tn-t)+1e-10*(1+cmplx.Abs(h)) {
			dt /= 2
			continue
		}
		t, h, j = tn, hn, jn
		if cmplx.Abs(h) > hRunaway {
			return h, errRunaway
		}
		if visit != nil {
			visit(rayPoint{t: t, h: h, slope: cmplx.Abs(tangent(end, u, j))})
		}
		dt *= 1.5
	}
	return h, nil
}

// newton2x2 solves k_A(h, D) = 1, L_h(h, D) = 0 (L = log k_A) from (h, d)
// in complex128 (two-Gamma form, kerneltwo128.go); the steps are damped
// to at most 0.5 in h.
func newton2x2(h, d complex128) (complex128, complex128, jet128, bool) {
	var j jet128
	for it := 0; it < 60; it++ {
		j = twoJetFull128(h, d)
		f1, f2 := j.k-1, j.lh
		det := j.k*j.lh*j.lhd - j.k*j.ld*j.lhh
		dh := (f1*j.lhd - j.k*j.ld*f2) / det
		dd := (j.k*j.lh*f2 - j.lhh*f1) / det
		if !finite128(dh) || !finite128(dd) {
			return h, d, j, false
		}
		if a := cmplx.Abs(dh); a > 0.5 {
			dh *= complex(0.5/a, 0)
			dd *= complex(0.5/a, 0)
		}
		h -= dh
		d -= dd
		if cmplx.Abs(dh)+cmplx.Abs(dd) < 1e-13*(1+cmplx.Abs(h)) {
			j = twoJetFull128(h, d)
			return h, d, j, cmplx.Abs(j.k-1) < 1e-9
		}
	}
	return h, d, j, false
}

// collision is a verified collision of h_n with another root, from the
// coarse scan.
type collision struct {
	h, s complex128
	// c is the coefficient in h_n - h* ~ c (-s*)^(1/2) (1 - s/s*)^(1/2) on
	// the branch h_n reaches along the ray (principal roots)
	c      complex128
	levels string // which roots collide
}

// scanResult is what the coarse search found for one level and end.
type scanResult struct {
	found   []collision // upper half plane (Im s >= 0), sorted by |s|
	notes   []string
	rmax    float64
	crossed int // solutions of the 2x2 system that are crossings with h = 2 or -1
	other   int // solutions not on the sheet of h_n
}

// searchRadius is the radius of the region searched, in the expansion
// variable.
func searchRadius(end End) float64 {
	if end == AroundTwo {
		return 2
	}
	return 1
}

// scanCollisions runs the coarse search for h_n around end.
func scanCollisions(end End, n int) (*scanResult, error) {
	res := &scanResult{rmax: searchRadius(end)}
	if n == 0 {
		res.notes = append(res.notes, "h_0 = 2 for every q (k_A(2) = 1 identically): no singularity")
		return res, nil
	}
	rmax := res.rmax
	type start struct{ h, s complex128 }
	var starts []start
	runaway := 0
	for r := 0; r < scanRays; r++ {
		theta := math.Pi * float64(r) / float64(scanRays-1)
		u := cmplx.Rect(1, theta)
		h0, err := levelStart128(end, n, u)
		if err != nil {
			return nil, err
		}
		var pts []rayPoint
		_, err = follow128(end, u, scanStart, rmax*1.05, h0, rmax/60, func(p rayPoint) { pts = append(pts, p) })
		if errors.Is(err, errRunaway) {
			runaway++
		}
		for i := 1; i+1 < len(pts); i++ {
			if pts[i].slope > pts[i-1].slope && pts[i].slope >= pts[i+1].slope {
				starts = append(starts, start{pts[i].h, complex(pts[i].t, 0) * u})
			}
		}
		if err != nil && len(pts) > 0 {
			// a ray that stalls or runs off ends near a singular point
			p := pts[len(pts)-1]
			starts = append(starts, start{p.h, complex(p.t, 0) * u})
		}
	}
	if runaway > 0 {
		res.notes = append(res.notes, fmt.Sprintf("h_%d grew beyond |h| = %d on %d of %d rays", n, hRunaway, runaway, scanRays))
	}
	// Newton on the collision system from every start; deduplicate.
	type cand struct {
		h, s complex128
		j    jet128
	}
	var cands []cand
	for _, st := range starts {
		h, d, j, ok := newton2x2(st.h, deltaOf(end, st.s))
		if !ok {
			continue
		}
		s := sOfDelta(end, d)
		if cmplx.Abs(s) > rmax || imag(s) < -1e-9 {
			continue
		}
		if imag(s) < 0 {
			s = complex(real(s), 0)
		}
		dup := false
		for _, c := range cands {
			if cmplx.Abs(c.s-s) < 1e-7*(1+cmplx.Abs(s)) && cmplx.Abs(c.h-h) < 1e-6*(1+cmplx.Abs(h)) {
				dup = true
				break
			}
		}
		if !dup {
			cands = append(cands, cand{h, s, j})
		}
	}
	// by |s|; points of equal modulus (the mirror pairs s, -conj(s) around
	// q = 2) by decreasing Re s, so that rounding does not pick the order
	sort.SliceStable(cands, func(a, b int) bool {
		ra, rb := cmplx.Abs(cands[a].s), cmplx.Abs(cands[b].s)
		if math.Abs(ra-rb) > 1e-9*ra {
			return ra < rb
		}
		return real(cands[a].s) > real(cands[b].s)
	})
	for _, c := range cands {
		if cmplx.Abs(c.j.ld) < 1e-8 {
			// k_A(h*, D) = 1 for every D: h = 2 or its mirror -1 crossing h_n
			res.crossed++
			continue
		}
		col, ok := verifyCollision(end, n, c.h, c.s, c.j)
		if debugScan {
			fmt.Printf("cand s=%.6f h=%.6f ok=%v\n", c.s, c.h, ok)
		}
		if !ok {
			res.other++
			continue
		}
		res.found = append(res.found, col)
	}
	if res.crossed > 0 {
		res.notes = append(res.notes, fmt.Sprintf("%d point(s) where h_%d crosses the exact root h = 2 (or its mirror -1) are no singularities (both roots stay analytic) and are left out", res.crossed, n))
	}
	return res, nil
}

// sqrtC is the principal square root.
func sqrtC(z complex128) complex128 { return cmplx.Sqrt(z) }

// verifyCollision checks that h_n, continued along the straight ray from
// the expansion point, reaches the collision (h*, s*), and identifies the
// other root that collides there.
func verifyCollision(end End, n int, hs, ss complex128, j jet128) (collision, bool) {
	r := cmplx.Abs(ss)
	u := ss / complex(r, 0)
	c := sqrtC(-2 * j.ld * dDelta(end) / j.lhh)
	h0, err := levelStart128(end, n, u)
	if err != nil {
		return collision{}, false
	}
	ta := (1 - approachGap) * r
	ha, err := follow128(end, u, scanStart, ta, h0, r/60, nil)
	if err != nil {
		return collision{}, false
	}
	scale := cmplx.Abs(c) * math.Sqrt(approachGap*r)
	if debugScan {
		fmt.Printf("  verify: ha=%.6f hs=%.6f scale %.3g err %v\n", ha, hs, scale, err)
	}
	if cmplx.Abs(ha-hs) > 4*scale+1e-7 {
		return collision{}, false
	}
	// orientation: h_n - h* = sigma c sqrt(-s*) sqrt(1 - s/s*), and at the
	// stopping point 1 - s/s* = approachGap.
	ratio := (ha - hs) / (c * sqrtC(-ss) * complex(math.Sqrt(approachGap), 0))
	sigma := 1.0
	if real(ratio) < 0 {
		sigma = -1
	}
	col := collision{h: hs, s: ss, c: complex(sigma, 0) * c}
	col.levels = fmt.Sprintf("h_%d and an unidentified root", n)
	// the partner: the other root near h*
	hp, _, ok := newtonH128(end, 2*hs-ha, complex(ta, 0)*u, 40, false)
	if !ok || cmplx.Abs(hp-ha) < 0.5*cmplx.Abs(ha-hs) {
		return col, true
	}
	if lv, ok := partnerLevel(end, n, u, ta, r, ha, hp); ok {
		col.levels = fmt.Sprintf("h_%d and %s", n, lv)
	}
	return col, true
}

// level names a root at the start of a ray: h_m, or the mirror root
// 1 - h_m (k_A is symmetric under h -> 1 - h).
type level struct {
	m      int
	mirror bool
}

func (l level) String() string {
	if l.mirror {
		return fmt.Sprintf("the mirror root 1 - h_%d", l.m)
	}
	return fmt.Sprintf("h_%d", l.m)
}

// partnerLevel names the root hp that meets h_n (ha, at s = ta u next to
// the collision). The candidate is read off by continuing hp back to the
// start of the ray; it is accepted only if that level, continued forward
// along the ray, arrives at hp rather than at ha (a backward continuation
// next to other near-collisions can jump roots; the forward one of a
// candidate is the same test as the one h_n passed). Where the candidate
// fails, the neighbouring levels n +- 1, n +- 2, n +- 3 are tried forward.
func partnerLevel(end End, n int, u complex128, ta, r float64, ha, hp complex128) (level, bool) {
	reaches := func(l level) bool {
		if l.m < 0 || l.m > MaxN || (l.m == n && !l.mirror) {
			return false
		}
		h0, err := levelStart128(end, l.m, u)
		if err != nil {
			return false
		}
		if l.mirror {
			h0 = 1 - h0
		}
		h, err := follow128(end, u, scanStart, ta, h0, r/60, nil)
		if err != nil {
			return false
		}
		return cmplx.Abs(h-hp) < 0.25*cmplx.Abs(ha-hp)
	}
	if hb, err := follow128(end, u, ta, scanStart, hp, r/60, nil); err == nil {
		if debugScan {
			fmt.Printf("partner back: %v\n", hb)
		}
		if l, ok := identifyLevel(end, u, hb); ok && reaches(l) {
			return l, true
		}
	}
	for _, d := range []int{1, -1, 2, -2, 3, -3} {
		if l := (level{m: n + d}); reaches(l) {
			return l, true
		}
	}
	return level{}, false
}

// identifyLevel names the root h at s = scanStart u: h_m or the mirror
// root 1 - h_m, by the nearest value at the end and then by comparison
// with the continued level.
func identifyLevel(end End, u complex128, h complex128) (level, bool) {
	for _, mirror := range []bool{false, true} {
		v := h
		if mirror {
			v = 1 - h
		}
		m := -1
		if math.Abs(real(v)-2) < 0.5 && math.Abs(imag(v)) < 0.5 {
			m = 0
		} else if end == AroundTwo {
			m = int(math.Round((real(v) - 2) / 2))
		} else {
			m = int(math.Round((real(v) - 1) / 2))
		}
		if m < 0 || m > MaxN || cmplx.Abs(v-complex(levelBase(end, m), 0)) > 0.5 {
			continue
		}
		hm, err := levelStart128(end, m, u)
		if err != nil || cmplx.Abs(hm-v) > 1e-6*(1+cmplx.Abs(v)) {
			continue
		}
		return level{m: m, mirror: mirror}, true
	}
	return level{}, false
}

var debugScan = false
