package numeric

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// LinearFit is the result of FitLinear.
type LinearFit struct {
	// Coeffs holds the fitted parameters (Values) and their standard errors
	// (Errors), the latter multiplied by sqrt(Chi2) when Chi2 > 1.
	Coeffs
	// Chi2 is chi^2 per degree of freedom with the given data errors.
	Chi2 float64
}

// FitLinear is the weighted linear least-squares fit of
// y_i = sum_j design_ij x_j, each datum weighted by 1/sigma_i.
//
// The columns of the weighted design matrix are scaled to unit 2-norm
// (equilibration, which leaves the solution unchanged and tames the
// condition number of fits in powers of T) and the problem is solved by QR;
// the standard errors are the square roots of the diagonal of
// (A^T A)^{-1} = R^{-1} R^{-T}, multiplied by sqrt(Chi2) when Chi2 > 1 (the
// scatter of the data then says the errors were underestimated). design, y
// and sigma are not modified.
//
// It fails for fewer data than parameters + 1, mismatched lengths, a sigma
// that is not positive and finite, a zero column, a numerically singular
// design, or NaN results.
func FitLinear(design *mat.Dense, y, sigma []float64) (*LinearFit, error) {
	n, np := design.Dims()
	switch {
	case len(y) != n || len(sigma) != n:
		return nil, fmt.Errorf("%w: linear fit of %d rows with %d data and %d errors", ErrInput, n, len(y), len(sigma))
	case n <= np:
		return nil, fmt.Errorf("%w: linear fit of %d parameters to %d data", ErrInput, np, n)
	}
	a := mat.NewDense(n, np, nil)
	yw := mat.NewVecDense(n, nil)
	for i := 0; i < n; i++ {
		if !(sigma[i] > 0) || math.IsInf(sigma[i], 0) {
			return nil, fmt.Errorf("%w: linear fit: error %g of datum %d is not positive and finite", ErrInput, sigma[i], i)
		}
		w := 1 / sigma[i]
		for j := 0; j < np; j++ {
			a.Set(i, j, design.At(i, j)*w)
		}
		yw.SetVec(i, y[i]*w)
	}
	scale := make([]float64, np)
	for j := range scale {
		scale[j] = mat.Norm(a.ColView(j), 2)
		if !(scale[j] > 0) || math.IsInf(scale[j], 0) {
			return nil, fmt.Errorf("numeric: linear fit: column %d of the design has norm %g", j, scale[j])
		}
		for i := 0; i < n; i++ {
			a.Set(i, j, a.At(i, j)/scale[j])
		}
	}
	var qr mat.QR
	qr.Factorize(a)
	var x mat.VecDense
	if err := qr.SolveVecTo(&x, false, yw); err != nil {
		return nil, fmt.Errorf("numeric: linear fit: %v", err)
	}
	var r mat.VecDense
	r.MulVec(a, &x)
	r.SubVec(&r, yw)
	chi2 := mat.Dot(&r, &r) / float64(n-np)
	var rd mat.Dense
	qr.RTo(&rd)
	upper := make([]float64, np*np)
	for i := 0; i < np; i++ {
		for j := i; j < np; j++ {
			upper[i*np+j] = rd.At(i, j)
		}
	}
	var rinv mat.TriDense
	if err := rinv.InverseTri(mat.NewTriDense(np, mat.Upper, upper)); err != nil {
		return nil, fmt.Errorf("numeric: linear fit: %v", err)
	}
	f := &LinearFit{Coeffs: Coeffs{Values: make([]float64, np), Errors: make([]float64, np)}, Chi2: chi2}
	for j := 0; j < np; j++ {
		// Row j of R^{-1} gives the variance of parameter j in the scaled variables.
		s := 0.0
		for k := j; k < np; k++ {
			v := rinv.At(j, k)
			s += v * v
		}
		f.Values[j] = x.AtVec(j) / scale[j]
		f.Errors[j] = math.Sqrt(s*math.Max(1, chi2)) / scale[j]
		if math.IsNaN(f.Values[j]) || math.IsNaN(f.Errors[j]) {
			return nil, fmt.Errorf("numeric: linear fit: NaN in parameter %d", j)
		}
	}
	if math.IsNaN(chi2) {
		return nil, fmt.Errorf("numeric: linear fit: NaN residual")
	}
	return f, nil
}
