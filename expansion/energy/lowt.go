package energy

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"

	"qbridge/numeric"
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
// model), each datum weighted by 1/its error (numeric.FitLinear).
func fitLowT(beta, e, eErr, s, sErr []float64, terms []corrTerm) (lowTFit, error) {
	n := len(beta)
	np := 3 + len(terms)
	if 2*n <= np {
		return lowTFit{}, fmt.Errorf("energy: %d data for %d parameters", 2*n, np)
	}
	a := mat.NewDense(2*n, np, nil)
	y := make([]float64, 2*n)
	sigma := make([]float64, 2*n)
	for i, b := range beta {
		a.Set(i, 0, 1)
		a.Set(i, 2, 2*math.Pi*math.Pi/(b*b))
		a.Set(n+i, 1, 1)
		a.Set(n+i, 2, 4*math.Pi*math.Pi/b)
		for j, t := range terms {
			a.Set(i, 3+j, t.inE(b))
			a.Set(n+i, 3+j, t.inS(b))
		}
		y[i], sigma[i] = e[i], eErr[i]
		y[n+i], sigma[n+i] = s[i], sErr[i]
	}
	lf, err := numeric.FitLinear(a, y, sigma)
	if err != nil {
		return lowTFit{}, fmt.Errorf("energy: low-temperature fit: %w", err)
	}
	return lowTFit{
		BetaMin: beta[0], BetaMax: beta[n-1], Terms: terms,
		E0: lf.Values[0], S0: lf.Values[1], AlphaS: lf.Values[2],
		E0Sd: lf.Errors[0], S0Sd: lf.Errors[1], AlphaSSd: lf.Errors[2],
		RMS: math.Sqrt(lf.Chi2),
	}, nil
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
	est.E0, est.E0Err = numeric.MedianSpread(e0)
	est.S0, est.S0Err = numeric.MedianSpread(s0)
	est.AlphaS, est.AlphaSErr = numeric.MedianSpread(al)
	est.E0Err += sdE
	est.S0Err += sdS
	est.AlphaSErr += sdA
	return est, nil
}
