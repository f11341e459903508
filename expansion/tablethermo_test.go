package expansion

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"qbridge/expansion/conformal"
)

// semicircle returns the exact log Z and E per Majorana fermion of the
// q = 2 model (free fermions with the semicircle density of states
// rho(e) = sqrt(4 - e^2)/(2 pi), script-J = 1, the exactly solvable limit
// of PHYSICS.md section 5): log Z = (1/2) int rho(e) log(2 cosh(beta e/2)) de,
// E = -d log Z/d beta. With e = 2 sin(t) the integrands are smooth.
func semicircle(beta float64) (logZ, e float64) {
	w := func(t float64) float64 { return 2 * math.Cos(t) * math.Cos(t) / math.Pi }
	logZ = quad.Fixed(func(t float64) float64 {
		x := 2 * math.Sin(t)
		return 0.5 * w(t) * (math.Abs(beta*x/2) + math.Log1p(math.Exp(-math.Abs(beta*x))))
	}, -math.Pi/2, math.Pi/2, 400, quad.Legendre{}, 0)
	e = quad.Fixed(func(t float64) float64 {
		x := 2 * math.Sin(t)
		return -0.5 * w(t) * (x / 2) * math.Tanh(beta*x/2)
	}, -math.Pi/2, math.Pi/2, 400, quad.Legendre{}, 0)
	return logZ, e
}

// log Z, E and S over q at fixed beta: at q = 2 against the exact
// semicircle values (within the stated errors, plus the quadrature's
// 1e-13), everywhere S = log Z + beta E, q = inf has no value, and bad
// requests are refused.
func TestTableThermo(t *testing.T) {
	qs := []conformal.QPoint{}
	for _, s := range []string{"2", "4", "inf"} {
		q, err := conformal.ParseQ(s, 64)
		if err != nil {
			t.Fatal(err)
		}
		qs = append(qs, q)
	}
	const beta = 10
	res, err := Tabulate(TableRequest{Names: []string{"logz"}, Q: qs, Order: 8, Digits: 20, Beta: beta})
	if err != nil {
		t.Fatal(err)
	}
	if len(res.Columns) != 3 || res.Columns[0].Name != LogZ || res.Columns[1].Name != ThermoE || res.Columns[2].Name != ThermoS {
		t.Fatalf("columns %+v, want logZ, E, S", res.Columns)
	}
	val := func(row, col int) (float64, float64) {
		c := res.Rows[row].Cells[col][0]
		if c.Value == nil || c.Err == nil {
			t.Fatalf("row %d column %d: no value or error (%s)", row, col, c.Missing)
		}
		v, _ := c.Value.Float64()
		e, _ := c.Err.Float64()
		return v, e
	}
	lz, lze := val(0, 0)
	en, ene := val(0, 1)
	xlz, xen := semicircle(beta)
	if d := math.Abs(lz - xlz); d > lze+1e-13 {
		t.Errorf("q = 2: log Z %.15g +- %.2g, exact %.15g (off %.2g)", lz, lze, xlz, d)
	}
	if d := math.Abs(en - xen); d > ene+1e-13 {
		t.Errorf("q = 2: E %.15g +- %.2g, exact %.15g (off %.2g)", en, ene, xen, d)
	}
	for row := 0; row < 2; row++ {
		l, le := val(row, 0)
		e, ee := val(row, 1)
		s, se := val(row, 2)
		if d := math.Abs(s - (l + beta*e)); d > se+le+beta*ee {
			t.Errorf("row %d: S = %.15g, log Z + beta E = %.15g", row, s, l+beta*e)
		}
	}
	if c := res.Rows[2].Cells[0][0]; c.Value != nil || c.Failed {
		t.Errorf("q = inf: got %+v, want a missing value (not a failure)", c)
	}
	for _, bad := range []TableRequest{
		{Names: []string{"logZ"}, Q: qs[:1], Order: 8, Digits: 20},
		{Names: []string{"logZ"}, Q: qs[:1], Order: 8, Digits: 20, Beta: -1},
		{Names: []string{"logZ"}, Q: qs[:1], Order: 8, Digits: 20, Beta: 10, Source: SourceResummed},
		{Names: []string{"h_1"}, Q: qs[:1], Order: 8, Digits: 20, Beta: 10},
	} {
		if _, err := Tabulate(bad); !errors.Is(err, ErrInput) {
			t.Errorf("%+v: got %v, want ErrInput", bad, err)
		}
	}
}
