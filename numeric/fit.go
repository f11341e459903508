package numeric

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"
)

// Fit is one least-squares fit of a low-temperature expansion
// y(T) = sum_i Coef[i] T^Exponents[i] over a window of the ladder.
type Fit struct {
	Quantity         string    // "E" or "S"
	BetaMin, BetaMax float64   // window of beta*script-J used
	Exponents        []float64 // powers of T in the model
	Coef             []float64 // fitted coefficients, same order
	Points           int       // data points in the window
	RMS              float64   // root-mean-square residual of the fit
	Accepted         bool      // used for the central value and spread
}

// Ground is the low-temperature extraction: E_0, S_0 and alpha_S, each from
// the spread over fit windows and fit orders, with the exact S_0 beside.
type Ground struct {
	Q                 float64
	H1                float64 // first operator dimension above 2, sets the correction exponents
	E0, E0Err         float64
	S0, S0Err         float64
	AlphaS, AlphaSErr float64
	S0Exact           float64 // ExactS0(Q)
	Fits              []Fit
	Ladder            []*Solution
}

// correctionPowers returns the exponents p of the corrections beta^{-p} to
// log Z = -beta E_0 + S_0 + c/(2 beta): integer powers from the Schwarzian's
// own expansion and h_1 - 1, h_1 from the first non-soft operator
// (Maldacena-Stanford arXiv:1604.07818 sec. 4), sorted and without repeats.
func correctionPowers(h1 float64) []float64 {
	ps := []float64{2, 3, 4}
	if !math.IsNaN(h1) {
		ps = append(ps, h1-1, h1)
	}
	sort.Float64s(ps)
	out := ps[:0]
	for _, p := range ps {
		if len(out) == 0 || math.Abs(p-out[len(out)-1]) > 1e-6 {
			out = append(out, p)
		}
	}
	return out
}

// FitGround fits E(T) = E_0 + 2 pi^2 alpha_S T^2 + sum a_p T^{p+1} and
// S(T) = S_0 + 4 pi^2 alpha_S T + sum b_p T^p (PHYSICS sec. 3) over windows
// that drop the highest temperatures and over the number of correction terms,
// and reports the median of the accepted fits with half their spread as the
// error (plus the largest per-point error of the data).
func FitGround(q float64, ladder []*Solution) (*Ground, error) {
	if len(ladder) < 5 {
		return nil, fmt.Errorf("%w: need at least 5 ladder points for the fits, got %d", ErrInput, len(ladder))
	}
	pts := append([]*Solution(nil), ladder...)
	sort.Slice(pts, func(i, j int) bool { return pts[i].Beta < pts[j].Beta })
	g := &Ground{Q: q, H1: FirstDimension(q), S0Exact: ExactS0(q), Ladder: pts}
	corr := correctionPowers(g.H1)
	dataE, dataS := 0.0, 0.0
	var medE, medS []float64
	for _, s := range pts {
		dataE = math.Max(dataE, s.EErr)
		dataS = math.Max(dataS, s.SErr)
		medE = append(medE, s.EErr)
		medS = append(medS, s.SErr)
	}
	typE, _ := medianSpread(medE)
	typS, _ := medianSpread(medS)
	var e0s, s0s, alphas []float64
	n := len(pts)
	for k := 0; k <= 3 && k <= len(corr); k++ {
		for drop := 0; n-drop >= k+2+3; drop += max(1, n/8) {
			win := pts[drop:]
			fe, err := fitOne("E", win, append([]float64{0, 2}, shift(corr[:k], 1)...))
			if err != nil {
				return nil, err
			}
			fs, err := fitOne("S", win, append([]float64{0, 1}, corr[:k]...))
			if err != nil {
				return nil, err
			}
			g.Fits = append(g.Fits, fe, fs)
		}
	}
	// Accept fits whose residual is within a factor 4 of the best one (or of the
	// typical data error): under-fitted models leave large systematic residuals.
	for _, qty := range []string{"E", "S"} {
		best := math.Inf(1)
		for _, f := range g.Fits {
			if f.Quantity == qty {
				best = math.Min(best, f.RMS)
			}
		}
		floor := typE
		if qty == "S" {
			floor = typS
		}
		for i := range g.Fits {
			f := &g.Fits[i]
			if f.Quantity == qty && f.RMS <= 4*math.Max(best, floor) {
				f.Accepted = true
				if qty == "E" {
					e0s = append(e0s, f.Coef[0])
					alphas = append(alphas, f.Coef[1]/(2*math.Pi*math.Pi))
				} else {
					s0s = append(s0s, f.Coef[0])
					alphas = append(alphas, f.Coef[1]/(4*math.Pi*math.Pi))
				}
			}
		}
	}
	g.E0, g.E0Err = medianSpread(e0s)
	g.S0, g.S0Err = medianSpread(s0s)
	g.AlphaS, g.AlphaSErr = medianSpread(alphas)
	g.E0Err += dataE
	g.S0Err += dataS
	return g, nil
}

func shift(p []float64, d float64) []float64 {
	out := make([]float64, len(p))
	for i, v := range p {
		out[i] = v + d
	}
	return out
}

// medianSpread returns the median and half the range.
func medianSpread(v []float64) (float64, float64) {
	if len(v) == 0 {
		return math.NaN(), math.NaN()
	}
	s := append([]float64(nil), v...)
	sort.Float64s(s)
	med := s[len(s)/2]
	if len(s)%2 == 0 {
		med = (s[len(s)/2-1] + s[len(s)/2]) / 2
	}
	return med, (s[len(s)-1] - s[0]) / 2
}

// fitOne is a least-squares fit in the scaled variable t = T/T_max (QR).
func fitOne(qty string, win []*Solution, exps []float64) (Fit, error) {
	tmax := 1 / win[0].Beta
	a := mat.NewDense(len(win), len(exps), nil)
	y := mat.NewVecDense(len(win), nil)
	for i, s := range win {
		t := 1 / s.Beta / tmax
		for j, e := range exps {
			a.Set(i, j, math.Pow(t, e))
		}
		if qty == "E" {
			y.SetVec(i, s.E)
		} else {
			y.SetVec(i, s.S)
		}
	}
	var x mat.VecDense
	if err := x.SolveVec(a, y); err != nil {
		return Fit{}, fmt.Errorf("numeric: %s fit with exponents %v failed: %v", qty, exps, err)
	}
	var r mat.VecDense
	r.MulVec(a, &x)
	r.SubVec(&r, y)
	f := Fit{Quantity: qty, BetaMin: win[0].Beta, BetaMax: win[len(win)-1].Beta, Exponents: exps, Points: len(win)}
	f.RMS = math.Sqrt(mat.Dot(&r, &r) / float64(len(win)))
	f.Coef = make([]float64, len(exps))
	for j, e := range exps {
		f.Coef[j] = x.AtVec(j) / math.Pow(tmax, e)
	}
	return f, nil
}
