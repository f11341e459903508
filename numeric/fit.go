package numeric

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"
)

// Fit is one weighted least-squares fit of the low-temperature expansion
//
//	log Z(beta) = -beta E_0 + S_0 + sum_k c_k T^{p_k},  T = 1/beta,
//
// to the log Z and E = -d log Z/d beta data of a window of the ladder at
// once: E(T) = E_0 + sum_k p_k c_k T^{p_k+1} and S = log Z + beta E follow
// from the same coefficients. p_0 = 1 is the Schwarzian term,
// c_0 = 2 pi^2 alpha_S.
type Fit struct {
	BetaMin, BetaMax float64   // window of beta*script-J used
	Exponents        []float64 // p_k, powers of T in log Z beyond -beta E_0 + S_0
	E0, S0           float64   // fitted ground-state energy and zero-temperature entropy
	Coef             []float64 // c_k, same order as Exponents
	E0Err, S0Err     float64   // statistical errors (scaled by sqrt(chi2/dof) when that exceeds 1)
	AlphaS           float64   // Schwarzian coefficient, c_0/(2 pi^2)
	AlphaSErr        float64   // its statistical error
	Points           int       // ladder points in the window (each gives two data)
	Chi2             float64   // chi^2 per degree of freedom with the solver's error estimates
	Accepted         bool      // used for the central value and spread
}

// Ground is the low-temperature extraction: E_0, S_0 and alpha_S from joint
// fits of log Z and E, with errors from the spread over fit windows and fit
// orders plus the statistical error, and the exact S_0 beside.
type Ground struct {
	Q                 float64     // interaction order
	H1                float64     // first operator dimension above 2 (ConformalData.H1), sets the correction exponents
	E0, E0Err         float64     // ground-state energy per fermion and its error
	S0, S0Err         float64     // fitted zero-temperature entropy and its error
	AlphaS, AlphaSErr float64     // Schwarzian coefficient and its error
	S0Exact           float64     // exact S_0 (ConformalData.S0Exact; NaN when not known)
	Fits              []Fit       // every fit tried, Accepted marking those used
	Ladder            []*Solution // the ladder, in increasing beta
}

// ConformalData is what the low-temperature fits need from the exact
// conformal data at q, computed by the caller (package expansion/conformal
// has it to any precision).
type ConformalData struct {
	// H1 is h_1, the smallest operator dimension above the soft mode h = 2
	// (the root of k_A(h) = 1 between 3 + 2/q and 5 - 2/q; 4 at q = 2): the
	// corrections to log Z carry T^{h_1 - 1}, T^{h_1} and T^{2 h_1 - 2}.
	// NaN leaves only the integer powers of T.
	H1 float64
	// S0Exact is the exact zero-temperature entropy, reported beside the
	// fitted one for comparison (it does not enter the fits); NaN means not
	// known.
	S0Exact float64
}

// correctionPowers returns the powers p of T in the corrections to
// log Z = -beta E_0 + S_0 + 2 pi^2 alpha_S T, in the order they are added to
// the fits: the Schwarzian's own expansion in T (integers) and the first
// non-soft operator, whose one-point function contributes T^{h_1 - 1}, its
// mixing with the Schwarzian T^{h_1} and its second order T^{2 h_1 - 2}
// (Maldacena-Stanford arXiv:1604.07818 sec. 4). Repeats are dropped.
func correctionPowers(h1 float64) []float64 {
	ps := []float64{2, 3, 4, 5, 6}
	if !math.IsNaN(h1) {
		ps = []float64{2, h1 - 1, 3, h1, 4, 2*h1 - 2, 5, 6}
	}
	out := ps[:0]
	for _, p := range ps {
		dup := false
		for _, o := range out {
			dup = dup || math.Abs(p-o) < 1e-6
		}
		if !dup {
			out = append(out, p)
		}
	}
	return out
}

// fitOrders are the numbers of correction terms beyond the Schwarzian tried
// in FitGround.
var fitOrders = []int{3, 4, 5, 6}

// FitGround fits log Z and E of the ladder at q jointly (see Fit) over
// windows that drop the highest temperatures, windows that drop the lowest
// ones, and the number of correction terms, whose exponents follow from
// c.H1. Each quantity is the median over the accepted fits (see below), its
// error half their spread plus their median statistical error.
func FitGround(q float64, c ConformalData, ladder []*Solution) (*Ground, error) {
	if math.IsInf(c.H1, 0) || (!math.IsNaN(c.H1) && c.H1 <= 2) {
		return nil, fmt.Errorf("%w: h_1 must be a dimension above 2 (or NaN), got %g", ErrInput, c.H1)
	}
	if len(ladder) < 8 {
		return nil, fmt.Errorf("%w: need at least 8 ladder points for the fits, got %d", ErrInput, len(ladder))
	}
	pts := append([]*Solution(nil), ladder...)
	sort.Slice(pts, func(i, j int) bool { return pts[i].Beta < pts[j].Beta })
	g := &Ground{Q: q, H1: c.H1, S0Exact: c.S0Exact, Ladder: pts}
	corr := correctionPowers(g.H1)
	n := len(pts)
	step := max(1, n/8)
	for _, k := range fitOrders {
		if k > len(corr) {
			continue
		}
		exps := append([]float64{1}, corr[:k]...)
		for lo := 0; lo <= n/2; lo += step {
			for _, hi := range []int{n, n - step} {
				win := pts[lo:hi]
				if 2*len(win)-len(exps)-2 < 4 {
					continue
				}
				f, err := fitJoint(win, exps)
				if err != nil {
					return nil, err
				}
				g.Fits = append(g.Fits, f)
			}
		}
	}
	if len(g.Fits) == 0 {
		return nil, fmt.Errorf("%w: %d ladder points are too few for the fits", ErrInput, n)
	}
	// Accept fits that describe the data (chi^2 per degree of freedom within
	// a factor 4 of the best, or of 1) and that still constrain alpha_S, the
	// most fragile output (statistical error within a factor 20 of the best):
	// a window too narrow for its order says nothing, and would only widen the
	// spread.
	best, sharpest := math.Inf(1), math.Inf(1)
	for _, f := range g.Fits {
		best = math.Min(best, f.Chi2)
	}
	for _, f := range g.Fits {
		if f.Chi2 <= 4*math.Max(best, 1) {
			sharpest = math.Min(sharpest, f.AlphaSErr)
		}
	}
	var e0s, s0s, as, e0Stat, s0Stat, aStat []float64
	for i := range g.Fits {
		f := &g.Fits[i]
		if f.Chi2 <= 4*math.Max(best, 1) && f.AlphaSErr <= 20*sharpest {
			f.Accepted = true
			e0s, s0s, as = append(e0s, f.E0), append(s0s, f.S0), append(as, f.AlphaS)
			e0Stat, s0Stat, aStat = append(e0Stat, f.E0Err), append(s0Stat, f.S0Err), append(aStat, f.AlphaSErr)
		}
	}
	g.E0, g.E0Err = MedianSpread(e0s)
	g.S0, g.S0Err = MedianSpread(s0s)
	g.AlphaS, g.AlphaSErr = MedianSpread(as)
	// Add the typical statistical error of the accepted fits.
	st, _ := MedianSpread(e0Stat)
	g.E0Err += st
	st, _ = MedianSpread(s0Stat)
	g.S0Err += st
	st, _ = MedianSpread(aStat)
	g.AlphaSErr += st
	return g, nil
}

// Error floors of the data: a few ulps accumulated over the grid sums.
const (
	relFloorLogZ = 1e-15
	relFloorE    = 1e-14
)

// fitJoint is the weighted least-squares fit of Fit to log Z and E of win
// (FitLinear with the solver's error estimates, floored at a few ulps).
func fitJoint(win []*Solution, exps []float64) (Fit, error) {
	nw, np := len(win), len(exps)+2
	a := mat.NewDense(2*nw, np, nil)
	y := make([]float64, 2*nw)
	sigma := make([]float64, 2*nw)
	for i, s := range win {
		t := 1 / s.Beta
		a.Set(2*i, 0, -s.Beta)
		a.Set(2*i, 1, 1)
		a.Set(2*i+1, 0, 1)
		for j, p := range exps {
			a.Set(2*i, j+2, math.Pow(t, p))
			a.Set(2*i+1, j+2, p*math.Pow(t, p+1))
		}
		y[2*i], sigma[2*i] = s.LogZ, math.Max(s.LogZErr, relFloorLogZ*math.Abs(s.LogZ))
		y[2*i+1], sigma[2*i+1] = s.E, math.Max(s.EErr, relFloorE*math.Abs(s.E))
	}
	lf, err := FitLinear(a, y, sigma)
	if err != nil {
		return Fit{}, fmt.Errorf("numeric: joint fit with exponents %v over beta %g..%g failed: %w", exps, win[0].Beta, win[nw-1].Beta, err)
	}
	coef, sig := lf.Values, lf.Errors
	f := Fit{
		BetaMin: win[0].Beta, BetaMax: win[nw-1].Beta, Exponents: exps, Points: nw, Chi2: lf.Chi2,
		E0: coef[0], S0: coef[1], Coef: coef[2:],
		E0Err: sig[0], S0Err: sig[1],
	}
	f.AlphaS = f.Coef[0] / (2 * math.Pi * math.Pi)
	f.AlphaSErr = sig[2] / (2 * math.Pi * math.Pi)
	return f, nil
}
