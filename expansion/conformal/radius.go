package conformal

import (
	"fmt"
	"math"
	"math/big"
	"sort"
	"strconv"
	"strings"
)

// radiusDigits is the precision at which the nearest singularity is
// refined for the radius of a series: far more than the radius is printed
// with, and cheap.
const radiusDigits = 20

// estimateRadius fills Radius, RadiusErr and RadiusMethod. Where the
// singularities of the function are known exactly it uses the nearest one:
// for h_n the collision of levels found by DimensionSingularities (its
// error from two refinement precisions), for b, b^q, S_0 and
// log(b)/x - log(x) the closed-form points (exact rationals). Elsewhere it
// falls back on a test of the coefficients (coefficientRadius), whose error
// bar is set from the spread of several fits.
func (c *Coefficients) estimateRadius() {
	c.Radius, c.RadiusErr, c.RadiusMethod = nil, nil, ""
	m, why := c.singularityMap()
	if m != nil {
		if len(m.Singularities) == 0 {
			return // h_0 = 2: no singularity at all
		}
		s := m.Singularities[0]
		c.Radius = new(big.Float).Set(s.Modulus)
		c.RadiusErr = new(big.Float).Set(s.ModulusErr)
		c.RadiusMethod = fmt.Sprintf("exact: modulus of the nearest singularity, %s at %s = %s (%s); see qbridge singularities",
			s.Kind, c.End.Variable(), complexText(s.S, 10), s.Levels)
		if m.SearchRadius == nil {
			c.RadiusMethod += "; error: rounding"
		} else {
			c.RadiusMethod += "; error: difference of two refinement precisions"
		}
		return
	}
	r, e, method, ok := coefficientRadius(c.Values, c.Errors)
	if !ok {
		return
	}
	c.Radius, c.RadiusErr = big.NewFloat(r), big.NewFloat(e)
	c.RadiusMethod = method
	if why != "" {
		c.RadiusMethod += " (no exact map: " + why + ")"
	}
}

// singularityMap returns the exact singularity map of the expanded
// function, or nil and the reason why there is none.
func (c *Coefficients) singularityMap() (*SingularityMap, string) {
	if rest, ok := strings.CutPrefix(c.Quantity, "h_"); ok {
		n, err := strconv.Atoi(rest)
		if err != nil {
			return nil, "unknown quantity " + c.Quantity
		}
		m, err := DimensionSingularities(c.End, n, 1, radiusDigits)
		if err != nil {
			return nil, err.Error()
		}
		if len(m.Singularities) == 0 && n != 0 {
			return nil, fmt.Sprintf("no collision of levels found within |%s| < %s", c.End.Variable(), m.SearchRadius.Text('g', 3))
		}
		return m, ""
	}
	switch c.Quantity {
	case "b", "b^q", "S_0", "log(b)/x - log(x)":
		m, err := ClosedFormSingularities(c.Quantity, c.End, 1, radiusDigits)
		if err != nil {
			return nil, err.Error()
		}
		return m, ""
	}
	return nil, "no closed form or collision map for " + c.Quantity
}

// complexText prints z with the given significant digits.
func complexText(z interface{ Complex128() complex128 }, digits int) string {
	v := z.Complex128()
	if imag(v) == 0 {
		return strconv.FormatFloat(real(v), 'g', digits, 64)
	}
	return fmt.Sprintf("%s %s %si", strconv.FormatFloat(real(v), 'g', digits, 64), map[bool]string{true: "+", false: "-"}[imag(v) >= 0],
		strconv.FormatFloat(math.Abs(imag(v)), 'g', digits, 64))
}

// coefficientRadius estimates the radius of convergence from the growth of
// the coefficients c_k, for a function whose nearest singularities are
// algebraic or logarithmic, |c_k| ~ A k^(-g) R^(-k) times an oscillation
// when several singularities share the modulus R (conjugate pairs). The
// oscillation is removed by keeping only the local maxima of log|c_k| (when there
// are at least six), which follow the envelope; on these points of the
// upper part of the series log|c_k| = a - k log R - g log k is fitted by
// least squares, for several windows and with g free or fixed at 0, 1/2,
// 1, 3/2 (poles, log and square-root points). The estimate is the fit over
// the upper half with g free; the error is twice the largest deviation of
// the other fits from it plus R log(K)/K (the size of the k^(-g) correction
// a fixed-exponent fit can miss at order K). Only coefficients known to 1% take part.
func coefficientRadius(values, errs []*big.Float) (r, rerr float64, method string, ok bool) {
	type pt struct{ k, l float64 }
	var pts []pt
	for k, v := range values {
		if k == 0 || v.Sign() == 0 {
			continue
		}
		if errs != nil && errs[k] != nil {
			q := new(big.Float).Quo(errs[k], new(big.Float).Abs(v))
			if f, _ := q.Float64(); f > 1e-2 {
				continue
			}
		}
		mant := new(big.Float)
		e := v.MantExp(mant)
		m, _ := mant.Float64()
		pts = append(pts, pt{float64(k), math.Log(math.Abs(m)) + float64(e)*math.Ln2})
	}
	if len(pts) < 6 {
		return 0, 0, "", false
	}
	// envelope: the local maxima of log|c_k| over the points kept, when
	// the coefficients oscillate (several singularities on one circle);
	// all points when they do not
	var peaks []pt
	for i := range pts {
		if (i == 0 || pts[i].l >= pts[i-1].l) && (i == len(pts)-1 || pts[i].l >= pts[i+1].l) {
			peaks = append(peaks, pts[i])
		}
	}
	hull := pts
	if len(peaks) >= 6 {
		hull = peaks
	}
	K := pts[len(pts)-1].k
	window := func(from float64) []pt {
		var w []pt
		for _, p := range hull {
			if p.k >= from {
				w = append(w, p)
			}
		}
		return w
	}
	// fit returns R from l = a - k lam - g log k (g fixed unless free).
	fit := func(ps []pt, g float64, free bool) (float64, bool) {
		if free {
			if len(ps) < 3 {
				return 0, false
			}
			// normal equations for (a, lam, g)
			var m [3][4]float64
			for _, p := range ps {
				row := [3]float64{1, -p.k, -math.Log(p.k)}
				for i := 0; i < 3; i++ {
					for j := 0; j < 3; j++ {
						m[i][j] += row[i] * row[j]
					}
					m[i][3] += row[i] * p.l
				}
			}
			x, ok := solve3(m)
			if !ok {
				return 0, false
			}
			return math.Exp(x[1]), true
		}
		if len(ps) < 2 {
			return 0, false
		}
		var sk, sl, skk, skl float64
		for _, p := range ps {
			l := p.l + g*math.Log(p.k)
			sk += p.k
			sl += l
			skk += p.k * p.k
			skl += p.k * l
		}
		n := float64(len(ps))
		den := n*skk - sk*sk
		if den == 0 {
			return 0, false
		}
		return math.Exp(-(n*skl - sk*sl) / den), true
	}
	central, ok := fit(window(K/2), 0, true)
	if !ok || math.IsNaN(central) || math.IsInf(central, 0) || central <= 0 {
		// too few hull points for a free exponent: fall back to g = 1
		if central, ok = fit(window(K/2), 1, false); !ok {
			return 0, 0, "", false
		}
	}
	var devs []float64
	for _, from := range []float64{K / 2, K / 3, 2 * K / 3} {
		for _, g := range []float64{0, 0.5, 1, 1.5} {
			if v, ok := fit(window(from), g, false); ok && v > 0 && !math.IsInf(v, 0) {
				devs = append(devs, math.Abs(v-central))
			}
		}
		if v, ok := fit(window(from), 0, true); ok && v > 0 && !math.IsInf(v, 0) && from != K/2 {
			devs = append(devs, math.Abs(v-central))
		}
	}
	if len(devs) == 0 {
		return 0, 0, "", false
	}
	sort.Float64s(devs)
	rerr = 2*devs[len(devs)-1] + central*math.Log(K)/K
	if math.IsNaN(rerr) || math.IsInf(rerr, 0) || math.IsNaN(central) || math.IsInf(central, 0) {
		return 0, 0, "", false
	}
	return central, rerr, fmt.Sprintf("coefficient test: local maxima of log|c_k|, least-squares fit a - k log R - g log k over k >= %d; error: twice the largest deviation of fits over other windows and with g fixed at 0, 1/2, 1, 3/2, plus R log(K)/K", int(K/2)), true
}

// solve3 solves the 3x3 system in the augmented matrix m by Gaussian
// elimination with partial pivoting.
func solve3(m [3][4]float64) ([3]float64, bool) {
	var x [3]float64
	for c := 0; c < 3; c++ {
		p := c
		for r := c + 1; r < 3; r++ {
			if math.Abs(m[r][c]) > math.Abs(m[p][c]) {
				p = r
			}
		}
		if m[p][c] == 0 {
			return x, false
		}
		m[c], m[p] = m[p], m[c]
		for r := c + 1; r < 3; r++ {
			f := m[r][c] / m[c][c]
			for j := c; j < 4; j++ {
				m[r][j] -= f * m[c][j]
			}
		}
	}
	for r := 2; r >= 0; r-- {
		s := m[r][3]
		for j := r + 1; j < 3; j++ {
			s -= m[r][j] * x[j]
		}
		x[r] = s / m[r][r]
	}
	return x, true
}
