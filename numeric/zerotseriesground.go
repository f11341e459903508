package numeric

import (
	"fmt"
	"math"
	"sort"
	"strings"
	"sync"
)

// ZeroTEpsGround is the zero-temperature extraction of alpha_G and E_0 as
// series in eps = 1 - 2/q (SolveZeroTEpsGround).
type ZeroTEpsGround struct {
	AlphaG, AlphaGErr []float64 // eps^l coefficients of alpha_G and their errors
	E0, E0Err         []float64 // eps^l coefficients of E_0/script-J and their errors
	Solutions         []*ZeroTEpsSeries
	Fits              []*EpsAlphaGFit // the fits of the main solution, then of the variant
	Method            string
}

// Settings of the eps-series extraction: the variant solutions whose
// differences from the main one are the noise model (another tilt, which
// moves the periodic images and the tilted round-off; and tau_min
// e^{epsTauMinSteps step}, on the same points, which measures the
// truncation of the grid at small tau), the fit windows and the largest
// correction exponent (at eps = 0) of the models. All solutions are
// refined in double-double (EpsSeriesParams.Extended): in float64 the
// order-by-order solve amplifies round-off about tenfold per order.
var (
	epsVariants = []EpsSeriesParams{{Grid: ZeroTParams{Tilt: epsTiltStep}}, {Grid: ZeroTParams{TauMin: -1}}}
	epsWindows  = [][2]float64{{200, 1e8}, {100, 1e7}, {300, 1e9}, {150, 3e8}}
	epsEmax     = []float64{6, 7}
)

// epsTiltStep is how much the tilt variant adds to the main tilt (the
// default 0.15 becomes 0.2); epsTauMinSteps is how many grid steps the
// tau_min variant starts later (TauMin: -1 in epsVariants marks it): 100
// steps of 0.05 raise tau_min by e^5, which raises the truncation error a
// hundredfold, so the variant bounds the main solution's.
const (
	epsTiltStep    = 0.05
	epsTauMinSteps = 100
)

// maxOf returns the largest element of v (0 for an empty v).
func maxOf(v []float64) float64 {
	m := 0.0
	for _, x := range v {
		m = math.Max(m, x)
	}
	return m
}

// epsNoise returns the noise model of the main solution a: per order, the
// largest difference from the others at the same tau (the grids share
// their points up to the hand-over when their steps agree), with a floor of
// the round-off 1e-16 tau^Tilt, and its running maximum over +-20 points.
func epsNoise(a *ZeroTEpsSeries, others []*ZeroTEpsSeries) [][]float64 {
	k := len(a.Ratio)
	out := make([][]float64, k)
	raw := make([]float64, len(a.Tau))
	for j := range out {
		for i := range a.Tau {
			// The rounding of the double-double solution to float64.
			raw[i] = 2.2e-16 * math.Abs(a.Ratio[j][i])
			if j == 0 {
				raw[i] = 2.2e-16
			}
		}
		for _, b := range others {
			ib := 0
			for i, tau := range a.Tau {
				for ib < len(b.Tau)-1 && b.Tau[ib] < tau*(1-1e-9) {
					ib++
				}
				raw[i] = math.Max(raw[i], math.Abs(a.Ratio[j][i]-b.Ratio[j][ib]))
			}
		}
		sm := make([]float64, len(raw))
		for i := range sm {
			for d := max(0, i-20); d <= min(len(raw)-1, i+20); d++ {
				sm[i] = math.Max(sm[i], raw[d])
			}
		}
		out[j] = sm
	}
	return out
}

// SolveZeroTEpsGround solves the zero-temperature equations as eps-series
// (SolveZeroTEps with p and with the variants epsVariants) and extracts
// alpha_G from joint fits of all orders (FitAlphaGEps) with the
// exponents of EpsExponents(dims): dims[n-1] is the eps-series of h_n from
// the exact conformal data (supplied by the caller, at least p.Order + 1
// coefficients each). The noise of each datum is its largest difference
// between the solutions. alpha_G per order is the median of the fits of
// the main solution over epsWindows and epsEmax; its error is half the
// range over all fits of all solutions plus the largest statistical error.
// E_0 is the main solution's, its error the largest difference from the
// variants plus 1e-15 of the largest coefficient (a margin over the
// rounding of the double-double sums to float64). All three solutions are
// refined in double-double (p.Extended is set).
func SolveZeroTEpsGround(p EpsSeriesParams, dims [][]float64) (*ZeroTEpsGround, error) {
	if len(dims) == 0 {
		return nil, fmt.Errorf("%w: the zero-temperature fits need at least h_1", ErrInput)
	}
	k := p.Order + 1
	// The solves are independent: one goroutine each (progress, when given,
	// is serialised and shows their mean).
	if _, err := EpsExponents(dims, k, epsEmax[0]); err != nil {
		return nil, err
	}
	tilt := p.Grid.Tilt
	if tilt == 0 {
		tilt = DefaultZeroTTilt
	}
	p.Extended = true
	runs := []EpsSeriesParams{p}
	for _, v := range epsVariants {
		pv := p
		if v.Grid.Tilt != 0 {
			pv.Grid.Tilt = tilt + v.Grid.Tilt
		}
		if v.Grid.TauMin < 0 {
			tmin, step := p.Grid.TauMin, p.Grid.Step
			if tmin == 0 {
				tmin = DefaultZeroTTauMin
			}
			if step == 0 {
				step = DefaultZeroTStep
			}
			pv.Grid.TauMin = math.Min(tmin*math.Exp(epsTauMinSteps*step), 1e-6)
		}
		pv.Extended = true
		runs = append(runs, pv)
	}
	var mu sync.Mutex
	frac := make([]float64, len(runs))
	sols := make([]*ZeroTEpsSeries, len(runs))
	errs := make([]error, len(runs))
	var wg sync.WaitGroup
	for i, pv := range runs {
		if p.Grid.Progress != nil {
			i := i
			pv.Grid.Progress = func(f float64, d string) {
				mu.Lock()
				defer mu.Unlock()
				frac[i] = f
				sum := 0.0
				for _, x := range frac {
					sum += x
				}
				p.Grid.Progress(sum/float64(len(frac)), d)
			}
		}
		wg.Add(1)
		go func(i int, pv EpsSeriesParams) {
			defer wg.Done()
			sols[i], errs[i] = SolveZeroTEps(pv)
		}(i, pv)
	}
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return nil, err
		}
	}
	a := sols[0]
	g := &ZeroTEpsGround{Solutions: sols}
	var main, all []*EpsAlphaGFit
	for si, s := range sols {
		var others []*ZeroTEpsSeries
		for oi, o := range sols {
			if oi != si {
				others = append(others, o)
			}
		}
		// The differences between solutions understate the scatter about
		// the fitted models (chi^2 per degree of freedom 20..1000 at the
		// highest orders); the fits inflate their statistical errors by
		// sqrt(chi^2), and the spread over windows, models and solutions
		// carries the rest.
		noise := epsNoise(s, others)
		for _, emax := range epsEmax {
			exps, err := EpsExponents(dims, k, emax)
			if err != nil {
				return nil, err
			}
			for _, w := range epsWindows {
				f, err := FitAlphaGEps(s, exps, noise, w[0], w[1])
				if err != nil {
					return nil, fmt.Errorf("numeric: eps-series alpha_G fit (tau %g..%g, exponents to %g): %w", w[0], w[1], emax, err)
				}
				all = append(all, f)
				if si == 0 {
					main = append(main, f)
				}
			}
		}
	}
	g.Fits = all
	g.AlphaG = make([]float64, k)
	g.AlphaGErr = make([]float64, k)
	for l := 0; l < k; l++ {
		var vm, va []float64
		stat := 0.0
		for _, f := range main {
			vm = append(vm, f.AlphaG[l])
		}
		for _, f := range all {
			va = append(va, f.AlphaG[l])
			stat = math.Max(stat, f.Stat[l])
		}
		sort.Float64s(va)
		med, _ := MedianSpread(vm)
		g.AlphaG[l] = med
		g.AlphaGErr[l] = (va[len(va)-1]-va[0])/2 + stat
	}
	g.E0 = append([]float64(nil), a.E0...)
	g.E0Err = make([]float64, k)
	big := 0.0
	for _, v := range a.E0 {
		big = math.Max(big, math.Abs(v))
	}
	for l := range g.E0Err {
		d := 0.0
		for _, o := range sols[1:] {
			d = math.Max(d, math.Abs(a.E0[l]-o.E0[l]))
		}
		g.E0Err[l] = d + 1e-15*big
	}
	pp := a.Params.Grid
	wlo, whi := math.Inf(1), 0.0
	for _, w := range epsWindows {
		wlo, whi = math.Min(wlo, w[0]), math.Max(whi, w[1])
	}
	var sb strings.Builder
	fmt.Fprintf(&sb, "T = 0 Schwinger-Dyson solve as power series in eps to order %d (on a log grid of %d points, step %.3g, tau %.0e..%.0e then conformal, tilt %.2g; Mellin weights of the moving tilts expanded in eps by Cauchy sums at %.2g of the distance to their pole; float64 iteration refined in double-double, residuals <= %.0e), and two variants (tilt %.2g; tau from %.1e), ", p.Order, a.Points, pp.Step, pp.TauMin, pp.TauPin, pp.Tilt, a.Params.KernelRadius, maxOf(a.RefinedResidual), sols[1].Params.Grid.Tilt, sols[2].Params.Grid.TauMin)
	fmt.Fprintf(&sb, "alpha_G from joint fits of all orders of G/G_c - 1 with exponents 1 and h_n(eps) - 1 and their sums up to %g at eps = 0 (the log tau terms of the moving exponents carried exactly), over %d windows in tau %g..%g, noise = largest difference from the variants; ", epsEmax[len(epsEmax)-1], len(epsWindows), wlo, whi)
	sb.WriteString("error = half the range of all fits of the three solutions + largest statistical error; E_0 error = largest difference from the variants")
	g.Method = sb.String()
	return g, nil
}
