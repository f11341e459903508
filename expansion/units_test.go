package expansion

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"testing"

	"qbridge/expansion/conformal"
	"qbridge/series"
)

// The J-unit factors: r(q) = script-J/J = sqrt(q/2^(q-1)) (script-J^2 =
// q J^2/2^(q-1), PHYSICS.md sec. 1): 1 at q = 2, where the couplings agree
// (<J_ij^2> = J^2/N, the semicircle of radius 2J), sqrt(4/8) at q = 4;
// E_0 multiplies r, alpha_S, alpha_G and alpha_K divide by it.
func TestUnitsFactor(t *testing.T) {
	for _, c := range []struct {
		s    Scaling
		q    float64
		want float64
	}{
		{ScaleEnergy, 2, 1}, {ScaleInverseEnergy, 2, 1},
		{ScaleEnergy, 4, math.Sqrt(4.0 / 8)}, {ScaleInverseEnergy, 4, math.Sqrt(8.0 / 4)},
		{ScaleEnergy, 3, math.Sqrt(3.0 / 4)}, {ScaleNone, 6, 1},
		{ScaleEnergy, 10, math.Sqrt(10.0 / 512)},
	} {
		got, err := UnitsJ.Factor(c.s, c.q)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got-c.want) > 1e-15*c.want {
			t.Errorf("scaling %d at q = %g: %.17g, want %.17g", c.s, c.q, got, c.want)
		}
		if f, _ := UnitsScriptJ.Factor(c.s, c.q); f != 1 {
			t.Errorf("script-J factor %g", f)
		}
	}
	if f, err := UnitsJ.Factor(ScaleEnergy, math.Inf(1)); err != nil || f != 0 {
		t.Errorf("energy factor at q = inf: %g, %v; want 0", f, err)
	}
	if _, err := UnitsJ.Factor(ScaleInverseEnergy, math.Inf(1)); !errors.Is(err, ErrInput) {
		t.Errorf("inverse-energy factor at q = inf: %v, want ErrInput", err)
	}
	if b := UnitsJ.BetaScriptJ(10, 4); math.Abs(b-10/math.Sqrt2) > 1e-14 {
		t.Errorf("beta J = 10 at q = 4 is beta script-J %g, want 10/sqrt(2)", b)
	}
	for _, c := range []struct {
		in   string
		want Units
		ok   bool
	}{{"J", UnitsJ, true}, {"script-J", UnitsScriptJ, true}, {"Script-J", UnitsScriptJ, true}, {"j", 0, false}, {"eV", 0, false}} {
		u, err := ParseUnits(c.in)
		if (err == nil) != c.ok || (c.ok && u != c.want) {
			t.Errorf("ParseUnits(%q) = %v, %v", c.in, u, err)
		}
	}
}

// E_0 in J units: at q = 2 the free-fermion value -2J/(3 pi) (semicircle
// of radius 2J, PHYSICS.md sec. 5), unchanged from script-J; at q = 4 the
// published -0.0406 J is -0.05746 script-J times sqrt(4/8) (MS 2016,
// arXiv:1604.07818; Garcia-Garcia-Verbaarschot arXiv:1610.03816; from
// memory, three digits).
func TestUnitsEnergy(t *testing.T) {
	f2, _ := UnitsJ.Factor(ScaleEnergy, 2)
	if e := -2 / (3 * math.Pi) * f2; e != -2/(3*math.Pi) {
		t.Errorf("E_0(q=2) in J units %.17g, want -2/(3 pi)", e)
	}
	f4, _ := UnitsJ.Factor(ScaleEnergy, 4)
	if e := -0.05746 * f4; math.Abs(e-(-0.0406)) > 0.00005 {
		t.Errorf("E_0(q=4) = -0.05746 script-J is %.5f J, published -0.0406 J", e)
	}
}

// The eps series of r and 1/r (FactorSeries) summed at eps = 1/2 and
// eps = 1/3 give sqrt(q/2^(q-1)) at q = 4 and 3 (radius 1: log(1-eps) and
// 1/(1-eps)), start at 1 (q = 2), and carry the first-order term
// (1/2 - log 2) eps of log r = (1/2) log q - ((q-1)/2) log 2. Around
// q = infinity there is no series (ErrInput).
func TestUnitsFactorSeries(t *testing.T) {
	const n = 80
	for _, c := range []struct {
		s    Scaling
		eps  float64
		want float64
	}{
		{ScaleEnergy, 0.5, math.Sqrt(0.5)}, {ScaleInverseEnergy, 0.5, math.Sqrt(2)},
		{ScaleEnergy, 1.0 / 3, math.Sqrt(0.75)}, {ScaleInverseEnergy, 1.0 / 3, math.Sqrt(4.0 / 3)},
	} {
		s, err := UnitsJ.FactorSeries(c.s, conformal.AroundTwo, n, 200)
		if err != nil {
			t.Fatal(err)
		}
		got, _ := series.Eval(s, big.NewFloat(c.eps)).Float64()
		if math.Abs(got-c.want) > 1e-14 {
			t.Errorf("scaling %d at eps = %g: %.17g, want %.17g", c.s, c.eps, got, c.want)
		}
		c0, _ := s.Coeff(0).Float64()
		c1, _ := s.Coeff(1).Float64()
		sign := 1.0
		if c.s == ScaleInverseEnergy {
			sign = -1
		}
		if c0 != 1 || math.Abs(c1-sign*(0.5-math.Ln2)) > 1e-15 {
			t.Errorf("scaling %d: series starts %g + %g eps, want 1 + %g eps", c.s, c0, c1, sign*(0.5-math.Ln2))
		}
	}
	if _, err := UnitsJ.FactorSeries(ScaleEnergy, conformal.AroundInf, 4, 64); !errors.Is(err, ErrInput) {
		t.Errorf("series around inf in J units: %v, want ErrInput", err)
	}
	if err := UnitsJ.CheckSeries(Quantity{Name: LogZ, NeedsBeta: true}, conformal.AroundTwo); !errors.Is(err, ErrInput) {
		t.Errorf("logZ series in J units: %v, want ErrInput", err)
	}
}

// ConvertSeries multiplies a coefficient list by the factor series with
// errors propagated; ConvertResummation and ConvertTable scale values and
// errors by the factor at q and leave pure numbers alone.
func TestUnitsConvert(t *testing.T) {
	c := &conformal.Coefficients{Quantity: E0, End: conformal.AroundTwo, N: -1, Prec: 53,
		Values: []*big.Float{big.NewFloat(-2 / (3 * math.Pi)), big.NewFloat(0.39)}, Errors: []*big.Float{big.NewFloat(1e-12), big.NewFloat(2e-12)}}
	r := &SeriesResult{Parts: []*conformal.Coefficients{c}}
	if err := ConvertSeries(r, E0, conformal.AroundTwo, UnitsJ); err != nil {
		t.Fatal(err)
	}
	r1 := 0.5 - math.Ln2
	v0, _ := c.Values[0].Float64()
	v1, _ := c.Values[1].Float64()
	e1, _ := c.Errors[1].Float64()
	if v0 != -2/(3*math.Pi) || math.Abs(v1-(0.39+r1*v0)) > 1e-15 || math.Abs(e1-(2e-12+math.Abs(r1)*1e-12)) > 1e-24 {
		t.Errorf("converted E_0 series %g, %g (error %g)", v0, v1, e1)
	}
	if err := ConvertSeries(&SeriesResult{Parts: []*conformal.Coefficients{c}}, AlphaS, conformal.AroundInf, UnitsJ); !errors.Is(err, ErrInput) {
		t.Errorf("alpha_S around inf in J units: %v", err)
	}
	q4 := conformal.QPoint{Q: big.NewFloat(4)}
	res := &Resummation{Name: AlphaK, Q: q4, Reference: &Reference{Value: big.NewFloat(2), Err: big.NewFloat(0.1)},
		Estimates: []conformal.Estimate{{Method: MethodTwoPoint, Value: big.NewFloat(1), Err: big.NewFloat(0.01)}}}
	if err := ConvertResummation(res, UnitsJ); err != nil {
		t.Fatal(err)
	}
	rv, _ := res.Reference.Value.Float64()
	ee, _ := res.Estimates[0].Err.Float64()
	if math.Abs(rv-2*math.Sqrt2) > 1e-15 || math.Abs(ee-0.01*math.Sqrt2) > 1e-17 {
		t.Errorf("alpha_K at q = 4 in J units: reference %g, estimate error %g", rv, ee)
	}
	tab := &TableResult{Columns: []TableColumn{{Name: S0}, {Name: AlphaS}},
		Rows: []TableRow{
			{Q: q4, Cells: [][]TableCell{{{Value: big.NewFloat(0.23)}}, {{Value: big.NewFloat(0.007), Err: big.NewFloat(1e-9)}}}},
			{Q: conformal.QPoint{Inf: true}, Cells: [][]TableCell{{{Value: big.NewFloat(0.34)}}, {{Value: big.NewFloat(0)}}}},
		}}
	ConvertTable(tab, UnitsJ)
	s0, _ := tab.Rows[0].Cells[0][0].Value.Float64()
	a4, _ := tab.Rows[0].Cells[1][0].Value.Float64()
	if s0 != 0.23 || math.Abs(a4-0.007*math.Sqrt2) > 1e-17 {
		t.Errorf("table in J units: S_0 %g, alpha_S %g", s0, a4)
	}
	if cell := tab.Rows[1].Cells[1][0]; cell.Value != nil || cell.Missing == "" || cell.Failed {
		t.Errorf("alpha_S at q = inf in J units: %+v, want missing", cell)
	}
}

// At q = 4, script-J = J sqrt(4/8): E_0 = -0.05746 script-J is -0.04063 J,
// and alpha_S as the coefficient of 1/J is sqrt(2) times its script-J value.
func ExampleUnits_Factor() {
	fe, _ := UnitsJ.Factor(ScaleEnergy, 4)
	fa, _ := UnitsJ.Factor(ScaleInverseEnergy, 4)
	fmt.Printf("E_0: %.5f J\n", -0.05746*fe)
	fmt.Printf("alpha_S factor: %.6f\n", fa)
	fmt.Println(UnitsJ.Statement())
	// Output:
	// E_0: -0.04063 J
	// alpha_S factor: 1.414214
	// J = 1
}
