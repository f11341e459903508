package hightemp

import (
	"math"
	"math/big"
	"testing"

	"qbridge/expansion/energy"
)

// TestEndSeriesAgreeWithGridSeries holds the eps and 1/q coefficients of
// log Z at fixed beta from the exact coefficients against the ones package
// energy computes by solving the expanded Schwinger-Dyson equations on
// grids (a different route: finite-beta expansion around each end, float64
// grids, Richardson extrapolation), within the combined errors.
func TestEndSeriesAgreeWithGridSeries(t *testing.T) {
	if testing.Short() {
		t.Skip("grid expansions")
	}
	s, err := SymbolicLogZ(24, nil)
	if err != nil {
		t.Fatal(err)
	}
	const order = 6
	for _, beta := range []float64{0.5, 1.2} {
		endSeriesAgree(t, s, beta, order)
	}
}

func endSeriesAgree(t *testing.T, s *Symbolic, beta float64, order int) {
	eps, err := energy.DeltaExpand(energy.DeltaParams{Beta: beta, Order: order, Variable: energy.VarEps})
	if err != nil {
		t.Fatal(err)
	}
	inv, err := energy.InvQExpand(energy.InvQParams{Beta: beta, Order: order})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		variable string
		grid     energy.Coeffs
	}{{VarEps, eps.LogZ}, {VarX, inv.LogZ}} {
		exact, err := s.EndSeries(c.variable, big.NewFloat(beta), order, 200)
		if err != nil {
			t.Fatal(err)
		}
		for m := 0; m <= order && m < len(c.grid.Values); m++ {
			v, _ := exact[m].Value.Float64()
			e := 0.0
			if exact[m].Err != nil {
				e, _ = exact[m].Err.Float64()
			}
			d := math.Abs(v - c.grid.Values[m])
			if exact[m].Err == nil && exact[m].Reason != exactReason {
				t.Logf("beta=%g %s^%d: exact sum not estimated (%s)", beta, c.variable, m, exact[m].Reason)
				continue
			}
			t.Logf("beta=%g %s^%d: exact %.15g +- %.1g, grid %.15g +- %.1g, difference %.2g", beta, c.variable, m, v, e, c.grid.Values[m], c.grid.Errors[m], d)
			if d > e+c.grid.Errors[m] {
				t.Errorf("%s^%d: exact %.15g and grid %.15g differ by %.3g, beyond errors %.2g + %.2g", c.variable, m, v, c.grid.Values[m], d, e, c.grid.Errors[m])
			}
		}
	}
}

// TestSymbolicMatchesDirect evaluates the polynomials in 1/q at values of q
// that were not interpolation nodes (rational ones among them) and
// compares with a solve at that q.
func TestSymbolicMatchesDirect(t *testing.T) {
	s, err := SymbolicLogZ(12, nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, q := range []*big.Rat{big.NewRat(9, 2), big.NewRat(7, 3), big.NewRat(100, 1)} {
		c, err := Solve(q, 12)
		if err != nil {
			t.Fatal(err)
		}
		for k := 1; k <= 12; k++ {
			if got := s.A[k].At(q); got.Cmp(c.A[k]) != 0 {
				t.Errorf("q = %s, t^%d: polynomial gives %s, solve %s", q.RatString(), k, got.RatString(), c.A[k].RatString())
			}
		}
	}
}

// TestEnergyTwoWays checks E = G'(0+)/q (how a_k is read off) against the
// other form of the energy, E = -(J^2/q) int_0^beta G^q, which in beta = 1
// units is d(log Z/N)/dt = (1/(4 q^2)) int_0^1 (2G)^q dtau (PHYSICS.md
// sec. 2): the two agree only if the solution satisfies the equations.
func TestEnergyTwoWays(t *testing.T) {
	for _, qq := range []*big.Rat{big.NewRat(4, 1), big.NewRat(5, 2)} {
		const K = 10
		b := newBasis(2 * K)
		c, gf := solveFull(qq, K, b)
		// (2G)^q by Miller's recurrence with exponent q
		pw := []ratVec{constVec(big.NewRat(1, 1))}
		qn, qd := qq.Num(), qq.Denom()
		for m := 1; m < K; m++ {
			acc := zeroVec(2*m + 1)
			for j := 1; j <= m; j++ {
				tj := convolve(gf[j], pw[m-j])
				f := new(big.Int).Sub(new(big.Int).Mul(new(big.Int).Add(qn, qd), big.NewInt(int64(j))), new(big.Int).Mul(qd, big.NewInt(int64(m))))
				tj.scale(f, bigOne)
				acc.addInto(tj)
			}
			acc.scale(bigOne, new(big.Int).Mul(qd, big.NewInt(int64(m))))
			acc.normalize()
			pw = append(pw, acc)
		}
		for k := 1; k <= K; k++ {
			integral := new(big.Rat)
			p := pw[k-1]
			for i := range p.num {
				integral.Add(integral, new(big.Rat).Quo(p.at(i), big.NewRat(int64(i+1), 1)))
			}
			want := integral.Quo(integral, new(big.Rat).Mul(big.NewRat(int64(4*k), 1), new(big.Rat).Mul(qq, qq)))
			if c.A[k].Cmp(want) != 0 {
				t.Errorf("q = %s, t^%d: slope gives %s, integral %s", qq.RatString(), k, c.A[k].RatString(), want.RatString())
			}
		}
	}
}
