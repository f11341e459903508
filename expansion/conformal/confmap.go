package conformal

import (
	"fmt"
	"math"
	"math/big"
	"strings"

	"qbridge/series"
	"qbridge/series/scalar"
)

// Conformal-mapping resummation. A series f(s) = sum c_k s^k converges in
// the disc reaching its nearest singularity; f itself is analytic in a
// larger domain, the s plane cut from its singularities outward. A
// conformal map s = S(w) of the unit disc |w| < 1 onto that domain, with
// S(0) = 0, turns f into F(w) = f(S(w)), whose Taylor series in w (read off
// the first K coefficients of f by series composition) converges in the
// whole cut plane, at the rate |w(s)|^K (Le Guillou and Zinn-Justin, Phys.
// Rev. B 21, 3976 (1980); Zinn-Justin, Quantum Field Theory and Critical
// Phenomena, chapter on the summation of divergent series; from memory).
// At a square-root branch point at the tip of a cut, where two levels
// h_n and h_(n+1) collide, the map opens the angle 2 pi of the slit tip to
// pi, s - s* ~ (w - w*)^2, so F is analytic there as well.
//
// The maps are built from three pieces, composed:
//
//   - one real cut from R outward (R > 0: [R, inf); R < 0: (-inf, R]):
//     s = 4 |R| w / (1 + sgn(R) w)^2, the map of Le Guillou and Zinn-Justin;
//   - two rays from a complex-conjugate pair s*, conj(s*) = a +- i b (b > 0)
//     outward in the directions exp(+-i phi): the Schwarz-Christoffel map
//     (Driscoll and Trefethen, Schwarz-Christoffel Mapping, Cambridge 2002,
//     ch. 2, from memory) of the upper half zeta-plane onto the plane
//     without the two rays, a degenerate polygon with two slit tips (angle
//     2 pi) at zeta = +-1 and its two ends at infinity (openings 2 phi and
//     2 pi - 2 phi) at zeta = 0 and zeta = inf:
//     ds/dzeta = C (zeta^2 - 1) zeta^(-1 - gamma), gamma = 2 phi/pi, so
//     s = D + B [y0^(-gamma) p^(-gamma)/gamma - y0^(2-gamma) p^(2-gamma)/(2-gamma)]
//     with zeta = i y0 p, p = (1 - w)/(1 + w), B = b gamma (2-gamma)/(2 sin phi),
//     D = a - b cot phi, and y0 > 0 fixed by S(0) = 0. phi = pi/2 gives the
//     textbook map of the plane cut along two collinear rays (here
//     vertical), the rotated form of s = 2w/(1 + w^2); phi = arg s* cuts
//     along the rays from the branch points away from the origin;
//   - removal of a slit of the unit disc along the radius from a real point
//     r (0 < |r| < 1) to the circle, where a further real singularity lands
//     after the first map: with the Koebe function k(w) = w/(1 - w)^2
//     (which maps the disc onto the plane cut along (-inf, -1/4]) the slit
//     disc is the preimage of the plane cut along (-inf, -rho],
//     rho = |r|/(1 + |r|)^2, and k(w) = 4 rho k(v) maps it onto |v| < 1
//     (for r > 0 by the mirror image w -> -w).
//
// Conjugate pairs beyond the nearest are left inside the domain: they
// limit the radius of convergence in w to below 1.

// mapStep is one conformal map of a composition: the outer variable as a
// function of the inner, both 0 at 0, real on the real axis, increasing.
type mapStep interface {
	// series returns the map as a power series of n coefficients at prec bits.
	series(n int, prec uint) (*series.Series, error)
	// inverse returns the inner variable at the real outer value x, and
	// false when x is not the image of a point of (-1, 1).
	inverse(x *big.Float, prec uint) (*big.Float, bool)
	// text describes the map.
	text() string
}

// realCut maps |w| < 1 onto the plane cut along the real axis from R
// outward: s = 4 |R| w/(1 + sgn(R) w)^2.
type realCut struct{ r *big.Float }

func (m realCut) series(n int, prec uint) (*series.Series, error) {
	c := make([]*big.Float, n)
	four := new(big.Float).SetPrec(prec).Abs(m.r)
	four.Mul(four, big.NewFloat(4))
	sg := -m.r.Sign() // coefficient of w^k: 4|R| k (-sgn R)^(k-1)
	for k := range c {
		c[k] = new(big.Float).SetPrec(prec)
		if k == 0 {
			continue
		}
		c[k].Mul(four, big.NewFloat(float64(k)))
		if sg < 0 && k%2 == 0 {
			c[k].Neg(c[k])
		}
	}
	return series.FromBig(prec, c)
}

func (m realCut) inverse(x *big.Float, prec uint) (*big.Float, bool) {
	// y = s/R < 1, w = sgn(R) y/(1 + sqrt(1 - y))^2
	y := new(big.Float).SetPrec(prec).Quo(x, m.r)
	om := new(big.Float).SetPrec(prec).Sub(bigInt(1, prec), y)
	if om.Sign() < 0 {
		return nil, false
	}
	om.Sqrt(om)
	om.Add(om, bigInt(1, prec))
	om.Mul(om, om)
	w := y.Quo(y, om)
	if m.r.Sign() < 0 {
		w.Neg(w)
	}
	return w, true
}

func (m realCut) text() string {
	if m.r.Sign() > 0 {
		return fmt.Sprintf("cut [%s, inf): s = 4R w/(1 + w)^2", m.r.Text('g', 10))
	}
	return fmt.Sprintf("cut (-inf, %s]: s = 4|R| w/(1 - w)^2", m.r.Text('g', 10))
}

// pairCut maps |w| < 1 onto the plane cut along the rays from a +- i b in
// the directions exp(+-i phi) (Schwarz-Christoffel, see above).
type pairCut struct {
	a, b, phi *big.Float // phi in (0, pi), radians
	// derived: gamma, B, D, y0
	gamma, bb, d, y0 *big.Float
}

// newPairCut fixes the constants of the map at prec bits.
func newPairCut(a, b, phi *big.Float, prec uint) (*pairCut, error) {
	if b.Sign() <= 0 || phi.Sign() <= 0 || phi.Cmp(scalar.Pi(prec)) >= 0 {
		return nil, fmt.Errorf("conformal map: need b > 0 and 0 < phi < pi")
	}
	m := &pairCut{a: a, b: b, phi: phi}
	pi := scalar.Pi(prec)
	m.gamma = new(big.Float).SetPrec(prec).Quo(new(big.Float).SetPrec(prec).Mul(phi, bigInt(2, prec)), pi)
	sin, cos := scalar.BigSinCos(phi, prec)
	twoMinus := new(big.Float).SetPrec(prec).Sub(bigInt(2, prec), m.gamma)
	m.bb = new(big.Float).SetPrec(prec).Mul(b, m.gamma)
	m.bb.Mul(m.bb, twoMinus)
	m.bb.Quo(m.bb, new(big.Float).SetPrec(prec).Mul(sin, bigInt(2, prec)))
	m.d = new(big.Float).SetPrec(prec).Mul(b, cos)
	m.d.Quo(m.d, sin)
	m.d.Sub(a, m.d)
	y0, err := m.solveY(new(big.Float).SetPrec(prec), prec)
	if err != nil {
		return nil, err
	}
	m.y0 = y0
	return m, nil
}

// solveY returns y > 0 with D + B [y^(-gamma)/gamma - y^(2-gamma)/(2-gamma)] = s
// (the point s of the real axis is the image of zeta = i y), by Newton's
// method in tau = log y, safeguarded by bisection: the left side falls
// monotonically from +inf to -inf.
func (m *pairCut) solveY(s *big.Float, prec uint) (*big.Float, error) {
	wp := prec + 16
	target := new(big.Float).SetPrec(wp).Sub(s, m.d)
	target.Quo(target, m.bb)
	g := m.gamma
	twoMinus := new(big.Float).SetPrec(wp).Sub(bigInt(2, wp), g)
	ng := new(big.Float).SetPrec(wp).Neg(g)
	// h(tau) = e^(-g tau)/g - e^((2-g) tau)/(2-g) - target, h' = -e^(-g tau) - e^((2-g) tau)
	h := func(tau *big.Float) (*big.Float, *big.Float) {
		e1 := scalar.BigExp(new(big.Float).SetPrec(wp).Mul(ng, tau), wp)
		e2 := scalar.BigExp(new(big.Float).SetPrec(wp).Mul(twoMinus, tau), wp)
		v := new(big.Float).SetPrec(wp).Quo(e1, g)
		v.Sub(v, new(big.Float).SetPrec(wp).Quo(e2, twoMinus))
		v.Sub(v, target)
		d := new(big.Float).SetPrec(wp).Add(e1, e2)
		return v, d.Neg(d)
	}
	lo, hi := big.NewFloat(-1).SetPrec(wp), big.NewFloat(1).SetPrec(wp)
	for i := 0; ; i++ {
		if v, _ := h(lo); v.Sign() > 0 {
			break
		}
		if i > 60 {
			return nil, fmt.Errorf("conformal map: no bracket for the preimage of %s", s.Text('g', 10))
		}
		lo.Mul(lo, big.NewFloat(2))
	}
	for i := 0; ; i++ {
		if v, _ := h(hi); v.Sign() < 0 {
			break
		}
		if i > 60 {
			return nil, fmt.Errorf("conformal map: no bracket for the preimage of %s", s.Text('g', 10))
		}
		hi.Mul(hi, big.NewFloat(2))
	}
	tau := new(big.Float).SetPrec(wp).Add(lo, hi)
	tau.Quo(tau, bigInt(2, wp))
	tol := new(big.Float).SetMantExp(big.NewFloat(1), -int(prec)-4)
	for it := 0; it < 400; it++ {
		v, d := h(tau)
		if v.Sign() > 0 {
			lo.Set(tau)
		} else {
			hi.Set(tau)
		}
		step := new(big.Float).SetPrec(wp).Quo(v, d)
		next := new(big.Float).SetPrec(wp).Sub(tau, step)
		if next.Cmp(lo) <= 0 || next.Cmp(hi) >= 0 {
			next.Add(lo, hi)
			next.Quo(next, bigInt(2, wp))
		}
		diff := new(big.Float).Sub(next, tau)
		tau = next
		if diff.Abs(diff).Cmp(tol) <= 0 {
			return scalar.BigExp(tau, prec), nil
		}
	}
	return nil, fmt.Errorf("conformal map: Newton's method for the preimage of %s did not converge", s.Text('g', 10))
}

// powP returns the series of p^alpha, p = (1 - w)/(1 + w):
// exp(-2 alpha artanh w).
func powP(alpha *big.Float, n int, prec uint) (*series.Series, error) {
	c := make([]*big.Float, n)
	for k := range c {
		c[k] = new(big.Float).SetPrec(prec)
		if k%2 == 1 {
			c[k].Quo(new(big.Float).SetPrec(prec).Mul(alpha, bigInt(-2, prec)), bigInt(int64(k), prec))
		}
	}
	l, err := series.FromBig(prec, c)
	if err != nil {
		return nil, err
	}
	return series.Exp(l)
}

func (m *pairCut) series(n int, prec uint) (*series.Series, error) {
	g := m.gamma
	twoMinus := new(big.Float).SetPrec(prec).Sub(bigInt(2, prec), g)
	p1, err := powP(new(big.Float).SetPrec(prec).Neg(g), n, prec)
	if err != nil {
		return nil, err
	}
	p2, err := powP(twoMinus, n, prec)
	if err != nil {
		return nil, err
	}
	ly0, err := scalar.BigLog(m.y0, prec)
	if err != nil {
		return nil, err
	}
	c1 := scalar.BigExp(new(big.Float).SetPrec(prec).Mul(new(big.Float).Neg(g), ly0), prec)
	c1.Quo(c1, g)
	c1.Mul(c1, m.bb)
	c2 := scalar.BigExp(new(big.Float).SetPrec(prec).Mul(twoMinus, ly0), prec)
	c2.Quo(c2, twoMinus)
	c2.Mul(c2, m.bb)
	s := series.Sub(series.Scale(p1, c1), series.Scale(p2, c2))
	// S(0) = D + c1 - c2 = 0 by the choice of y0: set it exactly
	if err := s.SetCoeff(0, new(big.Float).SetPrec(prec)); err != nil {
		return nil, err
	}
	return s, nil
}

func (m *pairCut) inverse(x *big.Float, prec uint) (*big.Float, bool) {
	y, err := m.solveY(x, prec)
	if err != nil {
		return nil, false
	}
	// p = y/y0 = (1 - w)/(1 + w): w = (y0 - y)/(y0 + y)
	num := new(big.Float).SetPrec(prec).Sub(m.y0, y)
	return num.Quo(num, new(big.Float).SetPrec(prec).Add(m.y0, y)), true
}

func (m *pairCut) text() string {
	deg := new(big.Float).Quo(new(big.Float).Mul(m.phi, big.NewFloat(180)), scalar.Pi(64))
	return fmt.Sprintf("cuts from %s +- %si along the rays at +-%s deg: Schwarz-Christoffel map", m.a.Text('g', 10), m.b.Text('g', 10), deg.Text('f', 1))
}

// slitCut maps |v| < 1 onto the disc |w| < 1 without the radius from r
// to sgn(r): for r < 0, k(w) = 4 rho k(v) with the Koebe function
// k(w) = w/(1 - w)^2 and rho = |r|/(1 + |r|)^2 = -k(r); for r > 0 the
// mirror image w(v) = -T(-v) of the map T for -r.
type slitCut struct{ r *big.Float }

// koebeInv returns k^(-1)(y) = 2y/(1 + 2y + sqrt(1 + 4y)) for y > -1/4.
func koebeInv(y *big.Float, prec uint) (*big.Float, bool) {
	d := new(big.Float).SetPrec(prec).Mul(y, bigInt(4, prec))
	d.Add(d, bigInt(1, prec))
	if d.Sign() < 0 {
		return nil, false
	}
	d.Sqrt(d)
	d.Add(d, bigInt(1, prec))
	d.Add(d, new(big.Float).SetPrec(prec).Mul(y, bigInt(2, prec)))
	return new(big.Float).SetPrec(prec).Quo(new(big.Float).SetPrec(prec).Mul(y, bigInt(2, prec)), d), true
}

func (m slitCut) rho(prec uint) *big.Float {
	a := new(big.Float).SetPrec(prec).Abs(m.r)
	d := new(big.Float).SetPrec(prec).Add(a, bigInt(1, prec))
	d.Mul(d, d)
	return a.Quo(a, d)
}

func (m slitCut) series(n int, prec uint) (*series.Series, error) {
	// r < 0: y(v) = 4 rho v/(1 - v)^2 = sum 4 rho k v^k, w = k^(-1)(y);
	// r > 0: the mirror image w(v) = -T(-v), i.e. y(-v) and -k^(-1)
	four := new(big.Float).SetPrec(prec).Mul(m.rho(prec), bigInt(4, prec))
	c := make([]*big.Float, n)
	for k := range c {
		c[k] = new(big.Float).SetPrec(prec).Mul(four, big.NewFloat(float64(k)))
		if m.r.Sign() > 0 && k%2 == 1 {
			c[k].Neg(c[k])
		}
	}
	y, err := series.FromBig(prec, c)
	if err != nil {
		return nil, err
	}
	sq, err := series.Sqrt(series.AddConst(series.Scale(y, bigInt(4, prec)), bigInt(1, prec)))
	if err != nil {
		return nil, err
	}
	den := series.AddConst(series.Add(sq, series.Scale(y, bigInt(2, prec))), bigInt(1, prec))
	w, err := series.Div(series.Scale(y, bigInt(2, prec)), den)
	if err != nil {
		return nil, err
	}
	if m.r.Sign() > 0 {
		w = series.Neg(w)
	}
	return w, nil
}

func (m slitCut) inverse(x *big.Float, prec uint) (*big.Float, bool) {
	w := new(big.Float).SetPrec(prec).Set(x)
	if m.r.Sign() > 0 {
		w.Neg(w)
	}
	if w.Cmp(big.NewFloat(-1)) <= 0 || w.Cmp(big.NewFloat(1)) >= 0 {
		return nil, false
	}
	om := new(big.Float).SetPrec(prec).Sub(bigInt(1, prec), w)
	y := new(big.Float).SetPrec(prec).Quo(w, new(big.Float).SetPrec(prec).Mul(om, om))
	y.Quo(y, new(big.Float).SetPrec(prec).Mul(m.rho(prec), bigInt(4, prec)))
	v, ok := koebeInv(y, prec)
	if !ok {
		return nil, false
	}
	if m.r.Sign() > 0 {
		v.Neg(v)
	}
	return v, true
}

func (m slitCut) text() string {
	return fmt.Sprintf("slit from %s to the circle removed (Koebe function)", m.r.Text('g', 6))
}

// confMap is a composition of map steps: s = T1(T2(...Tn(v))).
type confMap struct{ steps []mapStep }

// series returns s(v) to n coefficients.
func (c *confMap) series(n int, prec uint) (*series.Series, error) {
	var out *series.Series
	for _, st := range c.steps {
		s, err := st.series(n, prec)
		if err != nil {
			return nil, err
		}
		if out == nil {
			out = s
			continue
		}
		if out, err = series.Compose(out, s); err != nil {
			return nil, err
		}
	}
	return out, nil
}

// inverse returns v at the real point s of the domain, false if s is not
// in it (on a cut or beyond).
func (c *confMap) inverse(s *big.Float, prec uint) (*big.Float, bool) {
	x := s
	for _, st := range c.steps {
		var ok bool
		if x, ok = st.inverse(x, prec); !ok {
			return nil, false
		}
	}
	return x, true
}

func (c *confMap) text() string {
	var parts []string
	for _, st := range c.steps {
		parts = append(parts, st.text())
	}
	return strings.Join(parts, ", then ")
}

// singPoint is a singularity in the variable the map is built for.
type singPoint struct{ re, im *big.Float }

func (p singPoint) abs(prec uint) *big.Float {
	return scalar.CAbs(scalar.NewComplex(p.re, p.im, prec), prec)
}

// buildConfMap makes the map for singularities pts (sorted by modulus,
// upper member of each conjugate pair only, real ones with im = 0): the
// nearest one or pair is cut (a pair along rays at phiOf(a, b)), then every
// real singularity that lands inside the disc is slit off. target is the
// real point the series is to be evaluated at; it must lie in the domain.
func buildConfMap(pts []singPoint, target *big.Float, phiOf func(a, b *big.Float) *big.Float, prec uint) (*confMap, error) {
	if len(pts) == 0 {
		return nil, fmt.Errorf("no singularity known")
	}
	m := &confMap{}
	first := pts[0]
	if first.im.Sign() == 0 {
		m.steps = append(m.steps, realCut{r: first.re})
	} else {
		pc, err := newPairCut(first.re, first.im, phiOf(first.re, first.im), prec)
		if err != nil {
			return nil, err
		}
		m.steps = append(m.steps, pc)
	}
	if _, ok := m.inverse(target, prec); !ok {
		return nil, fmt.Errorf("the point %s lies on the cut from the nearest singularity", target.Text('g', 10))
	}
	for _, p := range pts[1:] {
		if p.im.Sign() != 0 {
			continue
		}
		r, ok := m.inverse(p.re, prec)
		if !ok {
			continue // on a cut already
		}
		if new(big.Float).Abs(r).Cmp(big.NewFloat(1-1e-12)) >= 0 || r.Sign() == 0 {
			continue
		}
		wt, _ := m.inverse(target, prec)
		if wt.Sign() == r.Sign() && new(big.Float).Abs(wt).Cmp(new(big.Float).Abs(r)) >= 0 {
			return nil, fmt.Errorf("the real singularity at %s lies between the expansion point and %s", p.re.Text('g', 10), target.Text('g', 10))
		}
		m.steps = append(m.steps, slitCut{r: r})
	}
	return m, nil
}

// radialPhi cuts a conjugate pair along the rays from the origin through
// the branch points: phi = arg(a + i b).
func radialPhi(a, b *big.Float) *big.Float {
	fa, _ := a.Float64()
	fb, _ := b.Float64()
	return big.NewFloat(math.Atan2(fb, fa))
}

// seriesParity reports whether the series is even (0) or odd (1) in its
// variable to within the errors of its coefficients, or neither (-1):
// h_n and b^q are even in eps and S_0 is odd: eps -> -eps is
// x -> 1 - x, which turns k_A(h) (PHYSICS.md section 4) into 1/k_A(h),
// so the roots of k_A = 1 stay, leaves b^q = (1/2 - x) tan(pi x)/pi
// unchanged and the integrand of S_0 too (S_0 = 0 at eps = 0).
func seriesParity(c *Coefficients) int {
	if len(c.Values) < 4 {
		return -1
	}
	for p := 0; p <= 1; p++ {
		ok, some := true, false
		for k, v := range c.Values {
			if k%2 == p {
				if v.Sign() != 0 {
					some = true
				}
				continue
			}
			// zero within its error, or rounding noise far below its
			// neighbours (2^(-prec/2) of them)
			tol := new(big.Float).Mul(c.Errors[k], big.NewFloat(4))
			for _, j := range []int{k - 1, k + 1} {
				if j >= 0 && j < len(c.Values) {
					nb := new(big.Float).Abs(c.Values[j])
					nb.SetMantExp(nb, -int(max(c.Values[j].Prec(), 64)/2))
					if nb.Cmp(tol) > 0 {
						tol = nb
					}
				}
			}
			if new(big.Float).Abs(v).Cmp(tol) > 0 {
				ok = false
				break
			}
		}
		if ok && some {
			return p
		}
	}
	return -1
}

// reduceParity returns the coefficients g of f = t^p g(t^2) (p the
// parity) and their errors.
func reduceParity(c *Coefficients, p int) (g, ge []*big.Float) {
	for k := p; k < len(c.Values); k += 2 {
		g = append(g, c.Values[k])
		ge = append(ge, c.Errors[k])
	}
	return g, ge
}

// mapDigits is the precision at which the singularities that fix a
// conformal map are refined: a branch point misplaced by d leaves a
// singular part of size d^(1/4) on the circle |w| = 1, which the factor
// |w(s)|^K makes negligible.
const mapDigits = 30

// mapCount is how many of the nearest singularities (conjugates counted
// apart) are looked up for a map: the nearest pair and the real ones
// among the next few, which are slit off.
const mapCount = 4

// confSingularities returns the known singularities of the function the
// series c expands, in its variable, nearest first, upper member of each
// conjugate pair only (real ones with a zero imaginary part), and the
// reason when there is no exact map.
func confSingularities(c *Coefficients, prec uint) ([]singPoint, string) {
	var m *SingularityMap
	var err error
	if rest, ok := strings.CutPrefix(c.Quantity, "h_"); ok {
		var n int
		if _, e := fmt.Sscanf(rest, "%d", &n); e != nil {
			return nil, "unknown quantity " + c.Quantity
		}
		m, err = DimensionSingularities(c.End, n, mapCount, mapDigits)
	} else {
		switch c.Quantity {
		case "b^q", "S_0", "b", "log(b)/x - log(x)":
			m, err = ClosedFormSingularities(c.Quantity, c.End, mapCount, mapDigits)
		default:
			return nil, "no exact singularity map for " + c.Quantity
		}
	}
	if err != nil {
		return nil, err.Error()
	}
	if len(m.Singularities) == 0 {
		return nil, fmt.Sprintf("%s has no singularity within |%s| < %s: its series needs no map", c.Quantity, c.End.Variable(), m.SearchRadius.Text('g', 3))
	}
	var out []singPoint
	for _, s := range m.Singularities {
		re := new(big.Float).SetPrec(prec).Set(s.S.Re)
		im := new(big.Float).SetPrec(prec)
		if s.S.Im != nil {
			im.Set(s.S.Im)
		}
		tiny := new(big.Float).Mul(s.SErr, big.NewFloat(16))
		if new(big.Float).Abs(im).Cmp(tiny) <= 0 {
			im.SetInt64(0)
		}
		if im.Sign() < 0 {
			continue // the lower member of a pair
		}
		out = append(out, singPoint{re, im})
	}
	return out, ""
}

// squarePoints maps singularities in t to u = t^2 (upper members, merged
// where t and -t give the same point).
func squarePoints(pts []singPoint, prec uint) []singPoint {
	var out []singPoint
	for _, p := range pts {
		z := scalar.CMul(scalar.NewComplex(p.re, p.im, prec), scalar.NewComplex(p.re, p.im, prec), prec)
		q := singPoint{z.Re, new(big.Float).Abs(z.Im)}
		// a real t gives a real u; tiny imaginary parts come from rounding
		if p.im.Sign() == 0 {
			q.im.SetInt64(0)
		}
		dup := false
		for _, o := range out {
			d := scalar.CAbs(scalar.CSub(scalar.NewComplex(o.re, o.im, prec), scalar.NewComplex(q.re, q.im, prec), prec), prec)
			tol := new(big.Float).Mul(q.abs(prec), big.NewFloat(1e-15))
			if d.Cmp(tol) <= 0 {
				dup = true
			}
		}
		if !dup {
			out = append(out, q)
		}
	}
	return out
}

// confMapped is the series of a quantity re-expanded in the variable of
// a conformal map, ready to be summed at one point.
type confMapped struct {
	m      *confMap
	parity int            // -1, or the power p of f = t^p g(t^2)
	f      *series.Series // F(v) = g(S(v)) (or f(S(v)))
	abs    *big.Float     // sum_k |err_k| sigma^k: the effect of the coefficient errors
	wt     *big.Float     // the image of the point
	scale  *big.Float     // t^p (1 without parity)
	detail string
}

// mapSeries re-expands the series c (order K) in the variable of the
// conformal map of the plane of its variable cut from the known
// singularities, for evaluation at the real point at.
func mapSeries(c *Coefficients, at *big.Float, prec uint, phiOf func(a, b *big.Float) *big.Float) (*confMapped, error) {
	pts, why := confSingularities(c, prec)
	if why != "" {
		return nil, fmt.Errorf("%s", why)
	}
	par := seriesParity(c)
	vals, errs := c.Values, c.Errors
	t := new(big.Float).SetPrec(prec).Set(at)
	scale := bigInt(1, prec)
	variable := c.End.Variable()
	if par >= 0 {
		vals, errs = reduceParity(c, par)
		pts = squarePoints(pts, prec)
		if par == 1 {
			scale.Set(at)
		}
		t.Mul(t, at)
		variable += "^2"
	}
	sortPoints(pts, prec)
	m, err := buildConfMap(pts, t, phiOf, prec)
	if err != nil {
		return nil, err
	}
	n := len(vals)
	sw, err := m.series(n, prec)
	if err != nil {
		return nil, err
	}
	g, err := series.FromBig(prec, vals)
	if err != nil {
		return nil, err
	}
	f, err := series.Compose(g, sw)
	if err != nil {
		return nil, err
	}
	wt, _ := m.inverse(t, prec)
	// |coefficient errors| through the map: sum_k err_k sigma^k with sigma
	// the map's series with absolute coefficients at |w_t|
	awt := new(big.Float).Abs(wt)
	sigma := new(big.Float).SetPrec(64)
	for k := n - 1; k >= 1; k-- {
		sigma.Mul(sigma, awt)
		sigma.Add(sigma, new(big.Float).Abs(sw.Coeff(k)))
	}
	sigma.Mul(sigma, awt)
	abs := new(big.Float).SetPrec(64)
	for k := n - 1; k >= 0; k-- {
		abs.Mul(abs, sigma)
		abs.Add(abs, errs[k])
	}
	abs.Mul(abs, new(big.Float).Abs(scale))
	out := &confMapped{m: m, parity: par, f: f, abs: abs, wt: wt, scale: scale}
	out.detail = fmt.Sprintf("in %s: %s; %s = %s maps to w = %s", variable, m.text(), variable, t.Text('g', 8), wt.Text('g', 6))
	return out, nil
}

// sortPoints orders singularities by modulus, real before complex on ties.
func sortPoints(pts []singPoint, prec uint) {
	for i := 1; i < len(pts); i++ {
		for j := i; j > 0; j-- {
			a, b := pts[j-1].abs(prec), pts[j].abs(prec)
			if a.Cmp(b) > 0 {
				pts[j-1], pts[j] = pts[j], pts[j-1]
			}
		}
	}
}

// conformalEstimate resums the series c at the point at by conformal
// mapping (mapSeries, with the cuts of a conjugate pair along the rays
// through the branch points away from the origin) and then the Pade
// table of the series in w at w(at) (padeEntries, padeFromEntries: the
// leading entry, its error twice the largest deviation of the entries of
// the three next lower orders). Where no pole-free Pade entries exist, the
// partial sums in w are used with the same rule. When no exact
// singularity map exists the estimate is not applicable and has no value.
func conformalEstimate(name string, c *Coefficients, at *big.Float, prec uint) Estimate {
	est := Estimate{Method: name + " conformal map"}
	cm, err := mapSeries(c, at, prec, radialPhi)
	if err != nil {
		est.Detail = "not applicable: " + err.Error()
		return est
	}
	es := padeEntries(cm.f, cm.wt)
	how := "Pade"
	v, e, used, ok := padeFromEntries(es, prec)
	if !ok {
		// the partial sums in w, highest order first
		ps := series.PartialSums(cm.f, cm.wt)
		es = es[:0]
		for k := len(ps) - 1; k >= 0 && k >= len(ps)-1-padeRungs; k-- {
			es = append(es, padeEntry{n: k, l: k, v: ps[k]})
		}
		how = "partial sum"
		if v, e, used, ok = padeFromEntries(es, prec); !ok {
			est.Detail = "failed: too few terms for an error estimate; " + cm.detail
			return est
		}
	}
	e.Mul(e, new(big.Float).Abs(cm.scale))
	e.Add(e, cm.abs)
	est.Value = new(big.Float).SetPrec(prec).Mul(v, cm.scale)
	est.Err = e
	entry := fmt.Sprintf("[%d/%d]", es[0].l, es[0].m)
	if how != "Pade" {
		entry = fmt.Sprintf("of %d terms", es[0].n+1)
	}
	est.Detail = fmt.Sprintf("%s %s of the series re-expanded in w; %s; error: twice the max deviation of the %d %s values of order %d..%d, plus the coefficient errors carried through the map",
		how, entry, cm.detail, used-1, how, es[0].n-padeWindow, es[0].n-1)
	return est
}
