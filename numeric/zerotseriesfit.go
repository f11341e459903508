package numeric

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"
)

// EpsExponent is one correction exponent of G/G_c - 1 as a series in eps:
// e(eps) = m_0 + sum_n m_n (h_n(eps) - 1), a sum of the generators 1 (the
// h = 2 mode) and h_n - 1 (SoftModeExponents at every eps).
type EpsExponent struct {
	Series []float64 // e(eps), coefficients from eps^0
	Label  string    // which sum of generators, e.g. "1+(h_1-1)"
}

// EpsExponents returns the exponents of SoftModeExponents as eps-series,
// from the generators 1 and h_n(eps) - 1 (dims[n-1] the eps-series of
// h_n, each of length k), keeping those whose value at eps = 0 is at most
// emax. The pure soft-mode exponent 1 comes first; exponents equal at
// eps = 0 but different as series are kept apart.
func EpsExponents(dims [][]float64, k int, emax float64) ([]EpsExponent, error) {
	gens := []EpsExponent{{Series: make([]float64, k), Label: "1"}}
	gens[0].Series[0] = 1
	for n, h := range dims {
		if len(h) < k {
			return nil, fmt.Errorf("%w: the eps-series of h_%d has %d coefficients, %d needed", ErrInput, n+1, len(h), k)
		}
		if !(h[0] > 2) {
			return nil, fmt.Errorf("%w: h_%d(q = 2) must lie above 2, got %g", ErrInput, n+1, h[0])
		}
		g := EpsExponent{Series: append([]float64(nil), h[:k]...), Label: fmt.Sprintf("(h_%d-1)", n+1)}
		g.Series[0]--
		gens = append(gens, g)
	}
	// Enumerate multiplicities (non-decreasing generator index avoids repeats).
	var out []EpsExponent
	var rec func(start int, cur []float64, label string)
	rec = func(start int, cur []float64, label string) {
		for i := start; i < len(gens); i++ {
			if cur[0]+gens[i].Series[0] > emax+1e-9 {
				continue
			}
			next := make([]float64, k)
			for j := range next {
				next[j] = cur[j] + gens[i].Series[j]
			}
			l := gens[i].Label
			if label != "" {
				l = label + "+" + l
			}
			out = append(out, EpsExponent{Series: next, Label: l})
			rec(i, next, l)
		}
	}
	rec(0, make([]float64, k), "")
	sort.SliceStable(out, func(a, b int) bool { return out[a].Series[0] < out[b].Series[0] })
	return out, nil
}

// EpsAlphaGFit is the eps-series of alpha_G from one joint fit
// (FitAlphaGEps).
type EpsAlphaGFit struct {
	TauMin, TauMax float64
	AlphaG         []float64 // coefficients of eps^l
	Stat           []float64 // their statistical errors
	Chi2           float64
}

// FitAlphaGEps fits the eps-series of G/G_c - 1 of the solution s over
// tau in [lo, hi] jointly at all orders 0..len(s.Ratio)-1 with the model
// sum_i A_i(eps) tau^{-e_i(eps)} (the exponents of EpsExponents): at order
// j the datum is sum_i sum_{l <= j} A_il [eps^(j-l)] tau^{-e_i(eps)}, which
// carries the log tau terms of the moving exponents exactly, so each
// family costs one unknown per order. noise[j][i] is the error of datum
// Ratio[j][i]. Families that coincide at eps = 0 are told apart only by
// the higher orders; the combinations the data cannot fix are dropped by
// a truncated singular-value solve (minimum norm in the equilibrated
// unknowns; alpha_G, the family e = 1, is alone at eps = 0 and so stays
// determined, but Stat leaves out the dropped directions). alpha_G = -A_1.
func FitAlphaGEps(s *ZeroTEpsSeries, exps []EpsExponent, noise [][]float64, lo, hi float64) (*EpsAlphaGFit, error) {
	if s == nil || len(s.Ratio) == 0 {
		return nil, fmt.Errorf("%w: no eps-series solution to fit", ErrInput)
	}
	k := len(s.Ratio)
	if len(exps) == 0 || len(exps[0].Series) == 0 || exps[0].Series[0] != 1 {
		return nil, fmt.Errorf("%w: the exponents must start with the soft-mode family e = 1", ErrInput)
	}
	for _, e := range exps {
		if len(e.Series) < k {
			return nil, fmt.Errorf("%w: exponent %s has %d coefficients, %d needed", ErrInput, e.Label, len(e.Series), k)
		}
	}
	if len(exps[0].Series) > 1 {
		for _, c := range exps[0].Series[1:k] {
			if c != 0 {
				return nil, fmt.Errorf("%w: the first exponent must be the constant 1 (the h = 2 mode)", ErrInput)
			}
		}
	}
	if !(lo > 0 && hi > lo) || math.IsInf(hi, 0) {
		return nil, fmt.Errorf("%w: fit window tau %g..%g", ErrInput, lo, hi)
	}
	if len(noise) < k {
		return nil, fmt.Errorf("%w: noise for %d orders, %d needed", ErrInput, len(noise), k)
	}
	for j := 0; j < k; j++ {
		if len(noise[j]) < len(s.Tau) {
			return nil, fmt.Errorf("%w: noise of order %d has %d points, %d needed", ErrInput, j, len(noise[j]), len(s.Tau))
		}
		for _, v := range noise[j] {
			if !(v > 0) || math.IsInf(v, 0) {
				return nil, fmt.Errorf("%w: noise %g of order %d is not positive and finite", ErrInput, v, j)
			}
		}
	}
	var rows []int
	for i, t := range s.Tau {
		if t >= lo && t <= hi {
			rows = append(rows, i)
		}
	}
	nf := len(exps)
	np := nf * k
	nr := len(rows) * k
	if nr <= np+8 {
		return nil, fmt.Errorf("%w: %d data in tau %g..%g for %d unknowns", ErrInput, nr, lo, hi, np)
	}
	// basis[f][r][row] = [eps^r] tau^{-e_f(eps)} at the row's tau.
	basis := make([][][]float64, nf)
	ex, tr := make([]float64, k), make([]float64, k)
	for f, e := range exps {
		basis[f] = make([][]float64, k)
		for r := range basis[f] {
			basis[f][r] = make([]float64, len(rows))
		}
		for m, i := range rows {
			x := math.Log(s.Tau[i])
			for j := range ex {
				ex[j] = -e.Series[j] * x
			}
			ExpSeriesInto(tr, ex)
			for r := range tr {
				basis[f][r][m] = tr[r]
			}
		}
	}
	a := mat.NewDense(nr, np, nil)
	y := make([]float64, nr)
	for j := 0; j < k; j++ {
		for m, i := range rows {
			row := j*len(rows) + m
			w := 1 / noise[j][i]
			v := s.Ratio[j][i]
			if j == 0 {
				v--
			}
			y[row] = v * w
			for f := 0; f < nf; f++ {
				for l := 0; l <= j; l++ {
					a.Set(row, f*k+l, basis[f][j-l][m]*w)
				}
			}
		}
	}
	// Equilibrate the columns, then a truncated SVD solve.
	scale := make([]float64, np)
	for c := range scale {
		scale[c] = mat.Norm(a.ColView(c), 2)
		if !(scale[c] > 0) {
			scale[c] = 1
		}
		for r := 0; r < nr; r++ {
			a.Set(r, c, a.At(r, c)/scale[c])
		}
	}
	var svd mat.SVD
	if !svd.Factorize(a, mat.SVDThin) {
		return nil, fmt.Errorf("numeric: eps-series alpha_G fit: the singular value decomposition failed")
	}
	sv := svd.Values(nil)
	var u, v mat.Dense
	svd.UTo(&u)
	svd.VTo(&v)
	cut := 1e-11 * sv[0]
	sol := make([]float64, np)
	kept := 0
	for c, sval := range sv {
		if sval <= cut {
			continue
		}
		kept++
		dot := 0.0
		for r := 0; r < nr; r++ {
			dot += u.At(r, c) * y[r]
		}
		for p := 0; p < np; p++ {
			sol[p] += v.At(p, c) * dot / sval
		}
	}
	// chi^2 per degree of freedom.
	chi2 := 0.0
	for r := 0; r < nr; r++ {
		m := 0.0
		for p := 0; p < np; p++ {
			m += a.At(r, p) * sol[p]
		}
		chi2 += (m - y[r]) * (m - y[r])
	}
	chi2 /= float64(nr - kept)
	fit := &EpsAlphaGFit{TauMin: s.Tau[rows[0]], TauMax: s.Tau[rows[len(rows)-1]], Chi2: chi2,
		AlphaG: make([]float64, k), Stat: make([]float64, k)}
	infl := math.Sqrt(math.Max(1, chi2))
	for l := 0; l < k; l++ {
		p := l // family 0 is e = 1
		fit.AlphaG[l] = -sol[p] / scale[p]
		varp := 0.0
		for c, sval := range sv {
			if sval <= cut {
				continue
			}
			varp += (v.At(p, c) / sval) * (v.At(p, c) / sval)
		}
		fit.Stat[l] = math.Sqrt(varp) / scale[p] * infl
	}
	if math.IsNaN(chi2) {
		return nil, fmt.Errorf("numeric: eps-series alpha_G fit over tau %g..%g gave NaN", lo, hi)
	}
	return fit, nil
}
