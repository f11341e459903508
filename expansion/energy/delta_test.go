package energy

import (
	"errors"
	"math"
	"testing"

	"qbridge/numeric"
)

// Order 0 is the free q = 2 model: log Z = (1/2) int rho(e) log(2 cosh(beta e/2)) de
// and E = -(1/4) int rho(e) e tanh(beta e/2) de with the semicircle
// rho(e) = sqrt(4 - e^2)/(2 pi) (PHYSICS sec. 5). Reference values: mpmath 1.3.0
// quad at 40 digits.
func TestDeltaOrderZeroSemicircle(t *testing.T) {
	cases := []struct{ beta, logZ, e float64 }{
		{1, 0.4045843968598106198399, -0.1082401869322279060463},
		{10, 2.148169871293433928111, -0.2096115176505340838557},
		{50, 10.61556492412733489958, -0.2121019072269263586191},
	}
	for _, c := range cases {
		f, err := DeltaExpand(DeltaParams{Beta: c.beta, Order: 2})
		if err != nil {
			t.Fatal(err)
		}
		if d := math.Abs(f.LogZ.Values[0] - c.logZ); d > 3*f.LogZ.Errors[0]+1e-13 || d > 1e-10*math.Abs(c.logZ) {
			t.Errorf("beta=%g: log Z_0 = %.16g ± %.1e, semicircle %.16g (diff %.1e)", c.beta, f.LogZ.Values[0], f.LogZ.Errors[0], c.logZ, d)
		}
		if d := math.Abs(f.E.Values[0] - c.e); d > 3*f.E.Errors[0]+1e-14 || d > 1e-12 {
			t.Errorf("beta=%g: E_0 = %.16g ± %.1e, semicircle %.16g (diff %.1e)", c.beta, f.E.Values[0], f.E.Errors[0], c.e, d)
		}
	}
}

// High temperature (PHYSICS sec. 6, exact): log Z = (1/2) log 2 + beta^2/(4 q^2)
// - beta^4/(48 q^2) + O(beta^6), so every delta-coefficient of log Z must match
// the expansion of 1/q^2 = 1/(2+delta)^2 to O(beta^6).
func TestDeltaHighTemperature(t *testing.T) {
	const order = 10
	for _, beta := range []float64{0.05, 0.1} {
		f, err := DeltaExpand(DeltaParams{Beta: beta, Order: order, Points: 256})
		if err != nil {
			t.Fatal(err)
		}
		invq2 := fsMul(fsGeometric(2, 1, order+1), fsGeometric(2, 1, order+1), order+1)
		for k := 0; k <= order; k++ {
			want := (beta*beta/4 - math.Pow(beta, 4)/48) * invq2[k]
			if k == 0 {
				want += 0.5 * math.Ln2
			}
			if d := math.Abs(f.LogZ.Values[k] - want); d > 0.05*math.Pow(beta, 6)+1e-15 {
				t.Errorf("beta=%g order %d: log Z_k = %.16g, high-T series %.16g, diff %.2e (beta^6 = %.1e)", beta, k, f.LogZ.Values[k], want, d, math.Pow(beta, 6))
			}
		}
	}
}

// E = -d log Z/d beta (PHYSICS sec. 2) must hold order by order; the
// derivative is a fourth-order central difference in beta.
func TestDeltaEnergyIsMinusDLogZ(t *testing.T) {
	const order, beta, step = 8, 20.0, 0.05
	f, err := DeltaExpand(DeltaParams{Beta: beta, Order: order})
	if err != nil {
		t.Fatal(err)
	}
	var lz [4][]float64
	for i, s := range []float64{-2, -1, 1, 2} {
		g, err := DeltaExpand(DeltaParams{Beta: beta + s*step, Order: order})
		if err != nil {
			t.Fatal(err)
		}
		lz[i] = g.LogZ.Values
	}
	for k := 0; k <= order; k++ {
		d := -(8*(lz[2][k]-lz[1][k]) - (lz[3][k] - lz[0][k])) / (12 * step)
		if diff := math.Abs(d - f.E.Values[k]); diff > 1e-8*(1+math.Abs(f.E.Values[k])) {
			t.Errorf("order %d: E_k = %.14g, -d logZ_k/d beta = %.14g (diff %.1e)", k, f.E.Values[k], d, diff)
		}
	}
}

// The first two eps-coefficients of E and log Z against the direct solver
// (numeric.Solve) at q = 2/(1-eps), eps = 0, h, ..., 5h: the interpolating
// polynomial through these six points (Richardson extrapolation of the
// one-sided difference quotients) gives the Taylor coefficients with an
// O(h^5) truncation, estimated from the five-point polynomial.
func TestDeltaAgainstDirectSolver(t *testing.T) {
	for _, beta := range []float64{10, 100} {
		fe, err := DeltaExpand(DeltaParams{Beta: beta, Order: 6, Variable: VarEps})
		if err != nil {
			t.Fatal(err)
		}
		const h = 0.004
		var lz, e, dataErr []float64
		for j := 0; j <= 5; j++ {
			eps := float64(j) * h
			s, err := numeric.Solve(numeric.Params{Q: 2 / (1 - eps), Beta: beta, SkipCheck: true})
			if err != nil {
				t.Fatal(err)
			}
			lz = append(lz, s.LogZ)
			e = append(e, s.E)
			dataErr = append(dataErr, s.EErr)
		}
		for _, c := range []struct {
			name string
			y    []float64
			ser  Coeffs
		}{{"E", e, fe.E}, {"log Z", lz, fe.LogZ}} {
			p6 := polyCoeffs(c.y, h)
			p5 := polyCoeffs(c.y[:5], h)
			for k := 1; k <= 2; k++ {
				trunc := math.Abs(p6[k] - p5[k])
				// Data errors of the solver amplified by the k-th difference quotient.
				noise := 40 * maxAbs(dataErr) / math.Pow(h, float64(k))
				tol := 3*(trunc+c.ser.Errors[k]) + noise
				t.Logf("beta=%g %s eps^%d: series %.12g ± %.1e, direct %.12g, tol %.1e", beta, c.name, k, c.ser.Values[k], c.ser.Errors[k], p6[k], tol)
				if d := math.Abs(p6[k] - c.ser.Values[k]); d > tol {
					t.Errorf("beta=%g %s eps^%d: series %.12g ± %.1e, direct solver %.12g (truncation %.1e, noise %.1e), diff %.2e",
						beta, c.name, k, c.ser.Values[k], c.ser.Errors[k], p6[k], trunc, noise, d)
				}
			}
		}
	}
}

// polyCoeffs returns the Taylor coefficients at 0 of the polynomial through
// (j h, y_j), j = 0..len(y)-1 (Newton forward differences).
func polyCoeffs(y []float64, h float64) []float64 {
	n := len(y)
	d := append([]float64(nil), y...)
	newton := make([]float64, n)
	for k := 0; k < n; k++ {
		newton[k] = d[0]
		for i := 0; i+1 < len(d)-0 && i < n-1-k; i++ {
			d[i] = d[i+1] - d[i]
		}
	}
	// p(t) = sum_k newton[k] C(t/h, k); expand the falling factorials.
	out := make([]float64, n)
	basis := []float64{1} // coefficients of prod_{i<k} (t/h - i)/(i+1) in t
	for k := 0; k < n; k++ {
		for i, b := range basis {
			out[i] += newton[k] * b
		}
		next := make([]float64, len(basis)+1)
		for i, b := range basis {
			next[i+1] += b / h / float64(k+1)
			next[i] -= b * float64(k) / float64(k+1)
		}
		basis = next
	}
	return out
}

func maxAbs(v []float64) float64 {
	m := 0.0
	for _, x := range v {
		m = math.Max(m, math.Abs(x))
	}
	return m
}

func TestDeltaBadInput(t *testing.T) {
	for _, p := range []DeltaParams{
		{Beta: 0, Order: 2}, {Beta: math.NaN(), Order: 2}, {Beta: 10, Order: -1},
		{Beta: 10, Order: 2, Points: 1000}, {Beta: 10, Order: 2, Levels: 9},
	} {
		if _, err := DeltaExpand(p); !errors.Is(err, ErrInput) {
			t.Errorf("%+v: got %v, want ErrInput", p, err)
		}
	}
	if _, err := DeltaExpand(DeltaParams{Beta: 10, Order: MaxDeltaOrder + 1}); !errors.Is(err, ErrOrder) {
		t.Errorf("order above maximum: got %v, want ErrOrder", err)
	}
}
