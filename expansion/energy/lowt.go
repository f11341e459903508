package energy

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"
)

// corrTerm is a correction beta^{-P} (log beta)^J to the low-temperature
// form of log Z = -beta E_0 + S_0 + 2 pi^2 alpha_S/beta + ...
type corrTerm struct {
	P float64
	J int
}

// basis values of one correction term in E = -d log Z/d beta and in
// S = log Z + beta E.
func (c corrTerm) inE(beta float64) float64 {
	l := math.Log(beta)
	v := c.P * math.Pow(l, float64(c.J))
	if c.J > 0 {
		v -= float64(c.J) * math.Pow(l, float64(c.J-1))
	}
	return v * math.Pow(beta, -c.P-1)
}

func (c corrTerm) inS(beta float64) float64 {
	l := math.Log(beta)
	v := (1 + c.P) * math.Pow(l, float64(c.J))
	if c.J > 0 {
		v -= float64(c.J) * math.Pow(l, float64(c.J-1))
	}
	return v * math.Pow(beta, -c.P)
}

// lowTFit is one joint least-squares fit of E_k(beta) and S_k(beta).
type lowTFit struct {
	BetaMin, BetaMax float64
	Terms            []corrTerm
	E0, S0, AlphaS   float64
	// E0Sd, S0Sd, AlphaSSd are the standard errors propagated from the data
	// errors (covariance of the weighted fit, scaled up by RMS when > 1).
	E0Sd, S0Sd, AlphaSSd float64
	RMS                  float64 // weighted root-mean-square residual
	Accepted             bool
}

// fitLowT fits E = E_0 + 2 pi^2 alpha/beta^2 + sum a_t E_t(beta) and
// S = S_0 + 4 pi^2 alpha/beta + sum a_t S_t(beta) jointly (the same log Z
// model), each datum weighted by 1/(its error + scale*rel).
func fitLowT(beta, e, eErr, s, sErr []float64, terms []corrTerm) (lowTFit, error) {
	n := len(beta)
	np := 3 + len(terms)
	if 2*n <= np {
		return lowTFit{}, fmt.Errorf("energy: %d data for %d parameters", 2*n, np)
	}
	a := mat.NewDense(2*n, np, nil)
	y := mat.NewVecDense(2*n, nil)
	// Columns are scaled by their size at the smallest beta, for conditioning.
	b0 := beta[0]
	scale := make([]float64, np)
	scale[0], scale[1], scale[2] = 1, 1, 2*math.Pi*math.Pi/b0
	for j, t := range terms {
		scale[3+j] = math.Abs(t.inS(b0)) + math.Abs(t.inE(b0))*b0
		if scale[3+j] == 0 {
			scale[3+j] = 1
		}
	}
	for i, b := range beta {
		we := 1 / eErr[i]
		ws := 1 / sErr[i]
		a.Set(i, 0, we/scale[0])
		a.Set(i, 2, we*2*math.Pi*math.Pi/(b*b)/scale[2])
		y.SetVec(i, we*e[i])
		a.Set(n+i, 1, ws/scale[1])
		a.Set(n+i, 2, ws*4*math.Pi*math.Pi/b/scale[2])
		y.SetVec(n+i, ws*s[i])
		for j, t := range terms {
			a.Set(i, 3+j, we*t.inE(b)/scale[3+j])
			a.Set(n+i, 3+j, ws*t.inS(b)/scale[3+j])
		}
	}
	var x mat.VecDense
	if err := x.SolveVec(a, y); err != nil {
		return lowTFit{}, fmt.Errorf("energy: low-temperature fit: %v", err)
	}
	var r mat.VecDense
	r.MulVec(a, &x)
	r.SubVec(&r, y)
	f := lowTFit{BetaMin: beta[0], BetaMax: beta[n-1], Terms: terms}
	f.E0 = x.AtVec(0) / scale[0]
	f.S0 = x.AtVec(1) / scale[1]
	f.AlphaS = x.AtVec(2) / scale[2]
	f.RMS = math.Sqrt(mat.Dot(&r, &r) / float64(2*n-np))
	// Covariance (A^T A)^{-1} = V diag(1/sigma^2) V^T of the scaled
	// parameters, from the SVD (no squared condition number).
	var svd mat.SVD
	f.E0Sd, f.S0Sd, f.AlphaSSd = math.Inf(1), math.Inf(1), math.Inf(1)
	if svd.Factorize(a, mat.SVDThin) {
		sv := svd.Values(nil)
		var v mat.Dense
		svd.VTo(&v)
		inflate := math.Max(1, f.RMS)
		sd := func(i int) float64 {
			c := 0.0
			for j, sj := range sv {
				if sj <= sv[0]*1e-15 {
					return math.Inf(1)
				}
				c += v.At(i, j) * v.At(i, j) / (sj * sj)
			}
			return inflate * math.Sqrt(c) / scale[i]
		}
		f.E0Sd, f.S0Sd, f.AlphaSSd = sd(0), sd(1), sd(2)
	}
	return f, nil
}

// lowTEstimate is the extraction at one order: central values, error bars
// and the fits behind them.
type lowTEstimate struct {
	E0, E0Err, S0, S0Err, AlphaS, AlphaSErr float64
	Fits                                    []lowTFit
}

// extractLowT runs fits over windows (dropping the highest temperatures,
// at least minData temperatures left) and over the number of correction
// terms taken in order from terms. In each window the smallest model whose
// weighted residual is acceptable (RMS <= rmsOK, residuals within the data
// errors) and the next two larger ones are accepted: larger models fit the
// data equally well but only trade noise for freedom. The estimate is the
// median of the accepted fits and the error half their range plus the
// largest standard error propagated from the data among them.
func extractLowT(beta, e, eErr, s, sErr []float64, terms []corrTerm, minData int) (*lowTEstimate, error) {
	const rmsOK, extra = 2.0, 2
	n := len(beta)
	est := &lowTEstimate{}
	var e0, s0, al []float64
	var sdE, sdS, sdA float64
	for drop := 0; n-drop >= minData; drop++ {
		first := -1
		for nt := 0; nt <= len(terms); nt++ {
			if first >= 0 && nt > first+extra {
				break
			}
			f, err := fitLowT(beta[drop:], e[drop:], eErr[drop:], s[drop:], sErr[drop:], terms[:nt])
			if err != nil {
				break
			}
			if first < 0 && f.RMS <= rmsOK {
				first = nt
			}
			if first >= 0 {
				f.Accepted = true
				e0 = append(e0, f.E0)
				s0 = append(s0, f.S0)
				al = append(al, f.AlphaS)
				sdE = math.Max(sdE, f.E0Sd)
				sdS = math.Max(sdS, f.S0Sd)
				sdA = math.Max(sdA, f.AlphaSSd)
			}
			est.Fits = append(est.Fits, f)
		}
	}
	if len(e0) < 2 {
		return nil, fmt.Errorf("energy: low-temperature fits: only %d acceptable fits over %d temperatures (%.4g to %.4g); widen the range or add temperatures", len(e0), n, beta[0], beta[n-1])
	}
	est.E0, est.E0Err = medianSpread(e0)
	est.S0, est.S0Err = medianSpread(s0)
	est.AlphaS, est.AlphaSErr = medianSpread(al)
	est.E0Err += sdE
	est.S0Err += sdS
	est.AlphaSErr += sdA
	return est, nil
}

// medianSpread returns the median and half the range of v.
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
