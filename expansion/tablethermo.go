package expansion

import (
	"fmt"
	"math/big"
	"sync"

	"qbridge/expansion/conformal"
	"qbridge/numeric"
)

// Columns of a table at fixed inverse temperature: log Z comes with the
// energy E and the entropy S = log Z + beta E of the same solve.
const (
	// ThermoE is the energy per Majorana fermion at the table's beta.
	ThermoE = "E"
	// ThermoS is the entropy per Majorana fermion at the table's beta.
	ThermoS = "S"
)

// thermoSolves runs one direct Schwinger-Dyson solve per q at the
// request's beta and shares it between the log Z, E and S columns.
type thermoSolves struct {
	beta  float64
	units Units
	mu    sync.Mutex
	once  map[string]*sync.Once
	sol   map[string]*numeric.Solution
	err   map[string]error
}

func newThermoSolves(beta float64, u Units) *thermoSolves {
	return &thermoSolves{beta: beta, units: u, once: map[string]*sync.Once{}, sol: map[string]*numeric.Solution{}, err: map[string]error{}}
}

// at returns the solve at q (computed on first use).
func (t *thermoSolves) at(q conformal.QPoint) (*numeric.Solution, float64, error) {
	key := q.String()
	t.mu.Lock()
	o, ok := t.once[key]
	if !ok {
		o = &sync.Once{}
		t.once[key] = o
	}
	t.mu.Unlock()
	qf := qFloat(q)
	beta := t.units.BetaScriptJ(t.beta, qf)
	o.Do(func() {
		s, err := numeric.Solve(numeric.Params{Q: qf, Beta: beta})
		t.mu.Lock()
		t.sol[key], t.err[key] = s, err
		t.mu.Unlock()
	})
	t.mu.Lock()
	defer t.mu.Unlock()
	return t.sol[key], beta, t.err[key]
}

// thermoColumns returns the log Z, E and S columns for the direct solver.
func thermoColumns(p Provider, src string) ([]*tableColumn, error) {
	switch src {
	case "", SourceDirect, SourceAll:
	default:
		return nil, fmt.Errorf("%w: log Z, E and S at fixed beta come from the direct solver only (no resummation over q exists yet): use --method direct", ErrInput)
	}
	var cols []*tableColumn
	for _, c := range []struct{ name, unit string }{
		{LogZ, "1 (per Majorana fermion)"}, {ThermoE, "script-J (per Majorana fermion)"}, {ThermoS, "1 (per Majorana fermion)"},
	} {
		cols = append(cols, &tableColumn{
			TableColumn: TableColumn{Name: c.name, Unit: c.unit, Sources: []string{SourceDirect},
				Note: c.name + ": direct Schwinger-Dyson solver at the table's beta, Richardson-extrapolated in the grid spacing over 3 grids (one solve per q for log Z, E and S)"},
			p: p, n: -1, thermo: true})
	}
	return cols, nil
}

// thermoCell is one log Z, E or S value at q.
func (c *tableColumn) thermoCell(q conformal.QPoint) TableCell {
	if q.Inf {
		return TableCell{Missing: "the direct solver needs a finite q"}
	}
	s, beta, err := c.solves.at(q)
	if err != nil {
		return TableCell{Missing: "failed: " + err.Error(), Failed: true}
	}
	v, e := s.LogZ, s.LogZErr
	switch c.Name {
	case ThermoE:
		v, e = s.E, s.EErr
	case ThermoS:
		v, e = s.S, s.SErr
	}
	return floatCell(v, e, fmt.Sprintf("direct Schwinger-Dyson solve at beta script-J = %.6g, %d grid points, Richardson over 3 grids", beta, numeric.DefaultPoints(beta)), "the extrapolation gave no spread")
}

// floatCell is a float64 value of the direct solver with its error; an
// error that is not a positive finite number is "not estimated" with the
// reason noErr, a non-finite value a failure.
func floatCell(v, e float64, method, noErr string) TableCell {
	if !finite(v) {
		return TableCell{Missing: "failed: the direct solver returned a non-finite value", Failed: true}
	}
	cell := TableCell{Value: big.NewFloat(v), Method: method}
	if e > 0 && finite(e) {
		cell.Err = big.NewFloat(e)
	} else {
		cell.ErrNote = noErr
	}
	return cell
}
