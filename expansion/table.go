package expansion

import (
	"fmt"
	"math/big"
	"runtime"
	"slices"
	"sync"

	"qbridge/expansion/conformal"
	"qbridge/expansion/energy"
)

// Sources of a table value, in the order a table lists them.
const (
	// SourceExact is the exact value (h_n, b, S_0), from two working
	// precisions.
	SourceExact = "exact"
	// SourceResummed is the two-point Pade of the series at both ends.
	SourceResummed = "resummed"
	// SourceDirect is the direct Schwinger-Dyson solver: its ground ladder
	// and low-temperature fits (E_0, S_0 fitted, alpha_S) and its
	// zero-temperature route (alpha_G, alpha_K; energy.DirectSoftMode).
	SourceDirect = "direct"
	// SourceAll asks for every source a quantity has, side by side.
	SourceAll = "all"
)

// SourceOrder is the order in which table sources are listed.
var SourceOrder = []string{SourceExact, SourceResummed, SourceDirect}

// TableRequest asks for quantities as functions of q.
type TableRequest struct {
	// Names are the quantities, one each (h_1, b, S_0, E_0, alpha_S or
	// any alias ParseName knows).
	Names []string
	// Q are the points, in the order of the rows.
	Q []conformal.QPoint
	// Source is SourceExact, SourceResummed, SourceDirect, SourceAll, or
	// "" for the most accurate cheap one: exact where it exists, else
	// resummed.
	Source string
	// Order is the series order at each end for the resummation.
	Order int
	// Digits is the working precision of the exact values and the series.
	Digits int
	// Cache stores the series between runs; nil computes them.
	Cache *Cache
	// Workers is the number of q points computed at once; 0 means
	// runtime.NumCPU().
	Workers int
	// Progress, when not nil, receives the fraction done and a status.
	Progress func(frac float64, detail string)
	// Beta is the inverse temperature of log Z, E and S columns (in
	// BetaUnits: beta script-J or beta J); 0 when there are none.
	Beta float64
	// BetaUnits says in which units Beta is given.
	BetaUnits Units
}

// TableColumn is one quantity of a table with the sources shown for it.
type TableColumn struct {
	// Name is the printed (canonical) name.
	Name string
	// Unit is the quantity's unit.
	Unit string
	// Sources are the sources shown, in SourceOrder.
	Sources []string
	// Reference is the source the others are compared with when there are
	// several: exact where it exists, else direct; "" when there is none.
	Reference string
	// Note says how the column's values are obtained.
	Note string
}

// TableCell is one value of a table.
type TableCell struct {
	// Value and Err are the value and its error (Err nil: not estimated,
	// ErrNote says why). Value is nil when the source has no value at this
	// q (Missing says why).
	Value, Err *big.Float
	// Method says how the value was obtained.
	Method string
	// ErrNote says why there is no error estimate.
	ErrNote string
	// Missing says why there is no value.
	Missing string
	// Failed marks a computation that failed (Missing has the error), as
	// opposed to a source that does not apply at this q.
	Failed bool
}

// TableRow is the values at one q: Cells[column][source], in the order of
// the columns and of their Sources.
type TableRow struct {
	// Q is the point.
	Q conformal.QPoint
	// Cells holds the values per column and source.
	Cells [][]TableCell
}

// TableResult is a table of quantities over q.
type TableResult struct {
	// Columns describe the quantities.
	Columns []TableColumn
	// Rows are the values, one per q, in the order asked.
	Rows []TableRow
	// Notes say how the series were obtained (computed or from the cache).
	Notes []string
}

// sourcesFor returns the sources a quantity shows for the requested one,
// or an ErrInput error when it has none of them.
func sourcesFor(q Quantity, name, src string) ([]string, error) {
	direct := q.Name == E0 || q.Name == S0 || q.Name == AlphaS || q.Name == AlphaG || q.Name == AlphaK
	switch src {
	case "":
		if q.Exact {
			return []string{SourceExact}, nil
		}
		return []string{SourceResummed}, nil
	case SourceExact:
		if !q.Exact {
			return nil, fmt.Errorf("%w: %s has no exact value at finite q: use --method resummed or direct", ErrInput, name)
		}
		return []string{SourceExact}, nil
	case SourceResummed:
		return []string{SourceResummed}, nil
	case SourceDirect:
		if !direct {
			return nil, fmt.Errorf("%w: the direct solver gives E_0, S_0, alpha_S, alpha_G and alpha_K, not %s: use --method exact or resummed", ErrInput, name)
		}
		return []string{SourceDirect}, nil
	case SourceAll:
		var out []string
		if q.Exact {
			out = append(out, SourceExact)
		}
		out = append(out, SourceResummed)
		if direct {
			out = append(out, SourceDirect)
		}
		return out, nil
	}
	return nil, fmt.Errorf("%w: unknown method %q: use exact, resummed, direct or all", ErrInput, src)
}

// tableColumn is a column with what computes it.
type tableColumn struct {
	TableColumn
	p   Provider
	n   int
	app *Approximant
	// thermo marks a log Z, E or S column, computed from solves.
	thermo bool
	solves *thermoSolves
}

// Tabulate computes the quantities at every q of the request. The series
// of each quantity are computed (or read from the cache) once, and the q
// points are processed in parallel, Workers at a time. A value that cannot
// be computed at one q (a failed direct solve) is marked Failed in its cell
// and does not stop the others.
func Tabulate(r TableRequest) (*TableResult, error) {
	if len(r.Names) == 0 || len(r.Q) == 0 {
		return nil, fmt.Errorf("%w: a table needs at least one quantity and one q", ErrInput)
	}
	if r.Order < 2 || r.Order > conformal.MaxOrder {
		return nil, fmt.Errorf("%w: order %d: resummation takes orders 2..%d", ErrInput, r.Order, conformal.MaxOrder)
	}
	var cols []*tableColumn
	var solves *thermoSolves
	for _, name := range r.Names {
		p, n, err := ParseName(name)
		if err != nil {
			return nil, fmt.Errorf("%w: %v", ErrInput, err)
		}
		q := p.Quantity()
		if q.NeedsBeta {
			if !(r.Beta > 0) || r.Beta > MaxBeta {
				return nil, fmt.Errorf("%w: %s over q needs an inverse temperature beta in (0, %g] (--beta)", ErrInput, q.Name, MaxBeta)
			}
			tc, err := thermoColumns(p, r.Source)
			if err != nil {
				return nil, err
			}
			if solves == nil {
				solves = newThermoSolves(r.Beta, r.BetaUnits)
			}
			for _, c := range tc {
				c.solves = solves
			}
			cols = append(cols, tc...)
			continue
		}
		if q.Indexed && n < 0 {
			return nil, fmt.Errorf("%w: name the dimensions one by one (h_1, h_2, ...) or give the family with an index range", ErrInput)
		}
		src, err := sourcesFor(q, q.Named(n), r.Source)
		if err != nil {
			return nil, err
		}
		c := &tableColumn{TableColumn: TableColumn{Name: q.Named(n), Unit: q.Unit, Sources: src}, p: p, n: n}
		switch {
		case slices.Contains(src, SourceExact) && len(src) > 1:
			c.Reference = SourceExact
		case slices.Contains(src, SourceDirect) && len(src) > 1:
			c.Reference = SourceDirect
		}
		cols = append(cols, c)
	}
	if solves == nil && r.Beta != 0 {
		return nil, fmt.Errorf("%w: --beta applies to log Z (with E and S) only", ErrInput)
	}
	for _, q := range r.Q {
		if !q.Inf && (q.Q == nil || q.Q.Cmp(big.NewFloat(2)) < 0) {
			return nil, fmt.Errorf("%w: q must be >= 2 (got %s)", ErrInput, q)
		}
	}
	workers := r.Workers
	if workers <= 0 {
		workers = runtime.NumCPU()
	}
	progress := func(f float64, d string) {
		if r.Progress != nil {
			r.Progress(f, d)
		}
	}
	res := &TableResult{}
	// The q-independent part: every approximant, side by side.
	var need []*tableColumn
	for _, c := range cols {
		if slices.Contains(c.Sources, SourceResummed) {
			need = append(need, c)
		}
	}
	progress(0, "series at both ends")
	if err := parallel(len(need), workers, func(i int) error {
		a, err := NewApproximant(need[i].Name, r.Order, r.Digits, r.Cache)
		if err != nil {
			return err
		}
		need[i].app = a
		return nil
	}); err != nil {
		return nil, err
	}
	for _, c := range cols {
		if !c.thermo {
			c.Note = columnNote(c)
		}
		if c.app != nil {
			res.Notes = append(res.Notes, c.app.Notes...)
		}
		res.Columns = append(res.Columns, c.TableColumn)
	}
	// The q-dependent part: one row per q, Workers rows at a time.
	res.Rows = make([]TableRow, len(r.Q))
	var mu sync.Mutex
	done := 0
	_ = parallel(len(r.Q), workers, func(i int) error {
		q := r.Q[i]
		row := TableRow{Q: q, Cells: make([][]TableCell, len(cols))}
		for ci, c := range cols {
			for _, s := range c.Sources {
				row.Cells[ci] = append(row.Cells[ci], c.cell(s, q, r.Digits))
			}
		}
		res.Rows[i] = row
		mu.Lock()
		done++
		progress(float64(done)/float64(len(r.Q)), "q = "+q.String())
		mu.Unlock()
		return nil
	})
	return res, nil
}

// parallel runs f(0..n-1) on up to workers goroutines and returns the
// first error (in index order).
func parallel(n, workers int, f func(i int) error) error {
	errs := make([]error, n)
	next := make(chan int)
	var wg sync.WaitGroup
	for w := 0; w < min(workers, n); w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				errs[i] = f(i)
			}
		}()
	}
	for i := 0; i < n; i++ {
		next <- i
	}
	close(next)
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return err
		}
	}
	return nil
}

// columnNote says how a column's sources are obtained.
func columnNote(c *tableColumn) string {
	s := c.Name + ": "
	for i, src := range c.Sources {
		if i > 0 {
			s += "; "
		}
		switch src {
		case SourceExact:
			s += "exact: " + exactDoc(c.p)
		case SourceResummed:
			s += fmt.Sprintf("resummed: two-point Pade of %s in x = 1/q from series of order %d around q = 2 and %d around q = infinity (median of the pole-free entries of the two highest total orders; error = the larger of their largest deviation", c.app.Function, c.app.OrderEps, c.app.OrderX)
			if c.app.sets != nil {
				s += " plus the shift under the coefficient error bars"
			}
			s += " and the change from the two-point Pade one order lower)"
		case SourceDirect:
			if c.Name == AlphaG || c.Name == AlphaK {
				s += "direct: zero-temperature Schwinger-Dyson route (alpha_G from the h = 2 correction of the T = 0 solution, alpha_K = -q k_A'(2) alpha_G); needs q > 2"
				break
			}
			s += "direct: Schwinger-Dyson solver, ladder of solves in beta and joint low-temperature fits of log Z and E"
			if c.Name == S0 {
				s += " (S_0 fitted)"
			}
		}
	}
	return s
}

// exactDoc describes the exact value of a conformal quantity.
func exactDoc(p Provider) string {
	switch p.Quantity().Name {
	case HN:
		return "root of k_A(h) = 1 by bracketing and Newton, at two working precisions"
	case B:
		return "b^q pi = (1/2 - 1/q) tan(pi/q), at two working precisions"
	case S0:
		return "S_0 = (1/2) log 2 - int_0^{1/q} pi (1/2 - x) tan(pi x) dx, at two working precisions"
	}
	return "closed form"
}

// cell computes one value.
func (c *tableColumn) cell(src string, q conformal.QPoint, digits int) TableCell {
	if c.thermo {
		return c.thermoCell(q)
	}
	switch src {
	case SourceExact:
		ep := c.p.(ExactProvider)
		v, err := ep.Exact(q, Request{N: max(c.n, 0), Digits: digits})
		if err != nil {
			return TableCell{Missing: "failed: " + err.Error(), Failed: true}
		}
		return TableCell{Value: v.Value, Err: v.Err, Method: v.Method}
	case SourceResummed:
		e, err := c.app.TableEstimate(q)
		if err != nil || e.Value == nil {
			msg := e.Detail
			if err != nil {
				msg = err.Error()
			}
			return TableCell{Missing: "failed: " + msg, Failed: true}
		}
		cell := TableCell{Value: e.Value, Err: e.Err, Method: MethodTwoPoint + ": " + e.Detail}
		if e.Err == nil {
			cell.ErrNote = "exact limit"
		}
		return cell
	case SourceDirect:
		if q.Inf {
			return TableCell{Missing: "the direct solver needs a finite q"}
		}
		if c.Name == AlphaG || c.Name == AlphaK {
			return softCell(c.Name, qFloat(q))
		}
		d, err := energy.DirectGround(qFloat(q), nil)
		if err != nil {
			return TableCell{Missing: "failed: " + err.Error(), Failed: true}
		}
		v, e, m := d.E0, d.E0Err, d.E0Method
		switch c.Name {
		case S0:
			v, e, m = d.S0, d.S0Err, energy.DirectLadderMethod
		case AlphaS:
			v, e, m = d.AlphaS, d.AlphaSErr, d.AlphaSMethod
		}
		return floatCell(v, e, m, "the fits gave no spread")
	}
	return TableCell{Missing: "unknown source " + src, Failed: true}
}

// softCell is the direct value of alpha_G or alpha_K at q: the
// zero-temperature route (energy.DirectSoftMode, the value resum and report
// use), or at q = 2 the exact limit alpha_K = pi, alpha_G = 0.
func softCell(name string, q float64) TableCell {
	kind := energy.QuantityAlphaG
	if name == AlphaK {
		kind = energy.QuantityAlphaK
	}
	if q == 2 {
		ref := softLimitAtTwo(kind)
		cell := TableCell{Value: ref.Value, Err: ref.Err, Method: ref.Method}
		if ref.Err == nil {
			cell.ErrNote = "an exact zero"
		}
		return cell
	}
	d, err := energy.DirectSoftMode(q, nil)
	if err != nil {
		return TableCell{Missing: "failed: " + err.Error(), Failed: true}
	}
	v, e, m := d.AlphaG, d.AlphaGErr, d.MethodG
	if kind == energy.QuantityAlphaK {
		v, e, m = d.AlphaK, d.AlphaKErr, d.MethodK
	}
	return floatCell(v, e, "direct zero-temperature Schwinger-Dyson route: "+m, "the route gave no spread")
}
