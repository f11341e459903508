package energy

import (
	"errors"
	"fmt"
	"math"

	"qbridge/expansion/conformal"
	"qbridge/numeric"
	"qbridge/series"
)

// ErrInput marks errors caused by invalid parameters (bad order, beta,
// grid). It is numeric.ErrInput, so that errors of the direct solver passed
// on by this package match it too.
var ErrInput = numeric.ErrInput

// ErrOrder marks an order the grid or the arithmetic cannot support.
var ErrOrder = errors.New("order not supported")

// Coeffs is a truncated power series with an error bar on every coefficient:
// Values[k] is the coefficient of t^k and Errors[k] its uncertainty (the
// float64 toolkit's numeric.Coeffs).
type Coeffs = numeric.Coeffs

// Variables of the expansions.
const (
	VarDelta = "delta" // q - 2
	VarEps   = "eps"   // 1 - 2/q
	VarX     = "x"     // 1/q
)

// FiniteBeta holds log Z and E at one inverse temperature as series in
// Variable, extrapolated to zero grid spacing.
type FiniteBeta struct {
	Beta     float64 // inverse temperature beta*script-J
	Variable string  // VarDelta, VarEps or VarX
	LogZ, E  Coeffs  // log Z and E per fermion, coefficient by coefficient
	Points   int     // grid points on [0, beta) of the finest grid
	Levels   int     // grids used in the Richardson extrapolation
}

// DeltaParams selects an expansion around q = 2 at fixed beta.
type DeltaParams struct {
	Beta  float64 // inverse temperature beta*script-J, > 0
	Order int     // highest power of delta, 0..MaxDeltaOrder
	// Points is the number of grid points on [0, beta) of the finest grid,
	// a power of two; 0 means DefaultDeltaPoints(Beta).
	Points int
	// Levels is the number of grids Points, Points/2, ... used in the
	// Richardson extrapolation in the grid spacing; 0 means 3.
	Levels int
	// Variable is VarDelta (the default when empty) or VarEps: with VarEps
	// every grid's series is converted to eps = 1 - 2/q by the exact
	// substitution delta = 2 eps/(1 - eps) (conformal.DeltaToEps) before the
	// Richardson extrapolation, so the error bars are those of the
	// eps-coefficients themselves.
	Variable string
}

// Limits of DeltaParams.
const (
	// MaxDeltaOrder is the highest order accepted. The per-point float64
	// series stay accurate well beyond it; the bound keeps the per-order
	// cost and memory (order x points) modest.
	MaxDeltaOrder = 40
	MinGridPoints = 64
	MaxGridPoints = 1 << 24
)

// DefaultDeltaPoints returns the smallest power of two with at least 32
// points per unit of beta*script-J, and at least 256.
func DefaultDeltaPoints(beta float64) int {
	n := 256
	for float64(n) < 32*beta && n < MaxGridPoints {
		n *= 2
	}
	return n
}

// richardsonPowers are the powers of the grid spacing removed by the
// extrapolation of both expansions: the discretisation error is O(h^4)
// (model functions carry the jumps, end-corrected trapezoid), then h^5 from
// the truncated Matsubara sum and h^6.
var richardsonPowers = []float64{4, 5, 6}

func (p *DeltaParams) validate() error {
	switch {
	case math.IsNaN(p.Beta) || p.Beta <= 0 || math.IsInf(p.Beta, 0):
		return fmt.Errorf("%w: beta must be positive and finite, got %g", ErrInput, p.Beta)
	case p.Order < 0:
		return fmt.Errorf("%w: order must be >= 0, got %d", ErrInput, p.Order)
	case p.Order > MaxDeltaOrder:
		return fmt.Errorf("%w: order %d is above the maximum %d of the q = 2 expansion (cost and memory grow like order x points)", ErrOrder, p.Order, MaxDeltaOrder)
	case p.Variable != "" && p.Variable != VarDelta && p.Variable != VarEps:
		return fmt.Errorf("%w: the q = 2 expansion variable is %q or %q, got %q", ErrInput, VarDelta, VarEps, p.Variable)
	}
	return nil
}

// gridLevels checks the finest grid size (0 means DefaultDeltaPoints(beta))
// and the number of Richardson levels (0 means 3) of an expansion, and
// returns them filled in.
func gridLevels(beta float64, points, levels int) (int, int, error) {
	switch {
	case levels < 0 || levels > 5:
		return 0, 0, fmt.Errorf("%w: levels must be between 1 and 5, got %d", ErrInput, levels)
	case points != 0 && (points < MinGridPoints || points > MaxGridPoints || points&(points-1) != 0):
		return 0, 0, fmt.Errorf("%w: points must be a power of two between %d and %d, got %d", ErrInput, MinGridPoints, MaxGridPoints, points)
	}
	if points == 0 {
		points = DefaultDeltaPoints(beta)
	}
	if levels == 0 {
		levels = 3
	}
	if points>>(levels-1) < MinGridPoints/2 {
		return 0, 0, fmt.Errorf("%w: %d points leave too few on the coarsest of %d grids", ErrInput, points, levels)
	}
	return points, levels, nil
}

// DeltaExpand returns log Z and E at p.Beta as series in delta = q - 2 up to
// delta^Order, each coefficient extrapolated to zero grid spacing with an
// error bar (the last Richardson correction plus a round-off floor).
//
// It refuses (ErrOrder) an order whose top coefficient the grid cannot
// resolve: when the error bar of the highest coefficient of E exceeds its
// size, the message names the grid spacing as the limit.
func DeltaExpand(p DeltaParams) (*FiniteBeta, error) {
	if err := p.validate(); err != nil {
		return nil, err
	}
	var err error
	if p.Points, p.Levels, err = gridLevels(p.Beta, p.Points, p.Levels); err != nil {
		return nil, err
	}
	if p.Variable == "" {
		p.Variable = VarDelta
	}
	return onGrids(p.Beta, p.Points, p.Levels, p.Order, p.Variable, func(m int) ([]float64, []float64, error) {
		lv, err := solveDeltaLevel(p.Beta, m, p.Order)
		if err != nil {
			return nil, nil, err
		}
		if p.Variable != VarEps {
			return lv.logZ, lv.e, nil
		}
		lz, err := substitute(lv.logZ, conformal.DeltaToEps)
		if err != nil {
			return nil, nil, err
		}
		e, err := substitute(lv.e, conformal.DeltaToEps)
		return lz, e, err
	})
}

// onGrids runs solve on the grids of points/2, points/4, ... half-interval
// points (levels of them, finest first), Richardson-extrapolates the log Z
// and E coefficients it returns to zero spacing, and refuses an order the
// grid cannot resolve (checkResolved).
func onGrids(beta float64, points, levels, order int, variable string, solve func(m int) (logZ, e []float64, err error)) (*FiniteBeta, error) {
	lz := make([][]float64, levels)
	e := make([][]float64, levels)
	for l := range lz {
		var err error
		if lz[l], e[l], err = solve(points >> (l + 1)); err != nil {
			return nil, err
		}
	}
	n := order + 1
	out := &FiniteBeta{Beta: beta, Variable: variable, Points: points, Levels: levels}
	out.LogZ = extrapolateRows(lz, n)
	out.E = extrapolateRows(e, n)
	if err := checkResolved(out.E, order, beta/float64(points)); err != nil {
		return nil, err
	}
	return out, nil
}

// checkResolved refuses a series whose top coefficient is lost in its error bar.
func checkResolved(c Coeffs, order int, h float64) error {
	if order == 0 {
		return nil
	}
	v, e := c.Values[order], c.Errors[order]
	if e > math.Abs(v) {
		return fmt.Errorf("%w: the coefficient of order %d is %.3g ± %.2g, not resolved on a grid of spacing %.3g: the grid limits the order; use more points or a lower order", ErrOrder, order, v, e, h)
	}
	return nil
}

// extrapolateRows Richardson-extrapolates the first n coefficients one by
// one in the grid spacing (numeric.Richardson with richardsonPowers); rows
// are the grids, finest first. Each error bar is the last correction plus
// a round-off floor: 2^-44 times the largest value of that coefficient on
// the grids, plus (k+1) 2^-50 times the largest coefficient of the row. The
// second, absolute part is there because every coefficient is a
// difference of float64 sums of the size of the largest one: the exact
// high-temperature coefficients (package expansion/hightemp) show small
// high-order coefficients off by about 1e-16 absolute, far beyond 2^-44 of
// their size, growing with the order through the change of variables.
// On one grid the error is numeric.Richardson's nominal 1e-3 relative.
func extrapolateRows(rows [][]float64, n int) Coeffs {
	c := Coeffs{Values: make([]float64, n), Errors: make([]float64, n)}
	v := make([]float64, len(rows))
	scale := 0.0
	for _, r := range rows {
		for k := 0; k < n && k < len(r); k++ {
			scale = math.Max(scale, math.Abs(r[k]))
		}
	}
	for k := 0; k < n; k++ {
		floor := 0.0
		for i, r := range rows {
			v[i] = r[k]
			floor = math.Max(floor, math.Abs(r[k]))
		}
		val, err := numeric.Richardson(v, richardsonPowers)
		if len(v) > 1 {
			err += floor*0x1p-44 + scale*0x1p-50*float64(k+1)
		}
		c.Values[k], c.Errors[k] = val, err
	}
	return c
}

// substitutePrec is the precision of the change of variables; the inputs
// are float64, the substitution adds exact binomial sums.
const substitutePrec = 128

func substitute(c []float64, f func(*series.Series) (*series.Series, error)) ([]float64, error) {
	s, err := series.FromFloat64(substitutePrec, c...)
	if err != nil {
		return nil, err
	}
	t, err := f(s)
	if err != nil {
		return nil, err
	}
	out := make([]float64, len(c))
	for k := range out {
		out[k], _ = t.Coeff(k).Float64()
	}
	return out, nil
}
