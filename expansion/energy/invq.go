package energy

import (
	"fmt"
	"math"
)

// InvQParams selects an expansion around q = infinity at fixed beta.
type InvQParams struct {
	Beta float64 // inverse temperature beta*script-J, > 0
	// Order is the highest power of x = 1/q kept; it needs g_1..g_Order.
	// Between 2 and MaxInvQOrder.
	Order int
	// Points is the number of grid points on [0, beta) of the finest grid,
	// a power of two; 0 means DefaultDeltaPoints(Beta).
	Points int
	// Levels is the number of grids used in the Richardson extrapolation; 0 means 3.
	Levels int
}

// MaxInvQOrder is the highest order of the 1/q expansion accepted: the cost
// of the local source grows like order^3 x points, and the float64 variation
// of parameters loses about log10(beta^2) digits to the growth of the
// Liouville zero modes at low temperature.
const MaxInvQOrder = 16

// InvQExpand returns log Z and E at p.Beta as series in x = 1/q up to
// x^Order: G = (1/2) sgn(tau)[1 + g_1 x + g_2 x^2 + ...] with g_1 the
// Liouville solution (Maldacena-Stanford arXiv:1604.07818 sec. 2.4) and
// each g_k from a linear equation with the Liouville fluctuation operator.
// The coefficients of x^0 and x^1 are (1/2) log 2 and 0 for log Z and 0, 0
// for E. Every coefficient is extrapolated to zero grid spacing with an
// error bar; an order the grid cannot resolve is refused (ErrOrder).
func InvQExpand(p InvQParams) (*FiniteBeta, error) {
	switch {
	case math.IsNaN(p.Beta) || p.Beta <= 0 || math.IsInf(p.Beta, 0):
		return nil, fmt.Errorf("%w: beta must be positive and finite, got %g", ErrInput, p.Beta)
	case p.Order < 2:
		return nil, fmt.Errorf("%w: the 1/q expansion starts at order 2 (log Z and E are trivial below), got order %d", ErrInput, p.Order)
	case p.Order > MaxInvQOrder:
		return nil, fmt.Errorf("%w: order %d is above the maximum %d of the 1/q expansion (cost grows like order^3 x points)", ErrOrder, p.Order, MaxInvQOrder)
	}
	var err error
	if p.Points, p.Levels, err = gridLevels(p.Beta, p.Points, p.Levels); err != nil {
		return nil, err
	}
	return onGrids(p.Beta, p.Points, p.Levels, p.Order, VarX, func(m int) ([]float64, []float64, error) {
		lv, err := solveInvQLevel(p.Beta, m, p.Order)
		if err != nil {
			return nil, nil, err
		}
		return lv.logZ, lv.e, nil
	})
}
