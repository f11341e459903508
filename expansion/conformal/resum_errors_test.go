package conformal

import (
	"fmt"
	"math"
	"math/big"
	"runtime"
	"strings"
	"sync"
	"testing"
)

// The stated error of every resummation estimate is checked against the
// true error, |estimate - exact|, where the exact value is the root of
// k_A(h) = 1 (h_n) or the closed form (b, S_0), both checked against
// mpmath in golden_test.go.

// tableDigits is the working precision of the series and of Resum's
// evaluation in the stated-versus-true table; the exact values are computed
// at tableExactDigits, so that their own error is negligible.
const (
	tableDigits      = 30
	tableExactDigits = 45
	tableOrder       = 40
)

// tableSeries caches the order-40 series of each resummed function at both
// ends (lower orders are their truncations), one entry per quantity, each
// computed once even when asked for from several goroutines.
var tableSeries = struct {
	sync.Mutex
	m map[string]*tableEntry
}{m: map[string]*tableEntry{}}

type tableEntry struct {
	once     sync.Once
	two, inf *Coefficients
	err      error
}

// tableSeriesOf returns the cached order-40 series of the quantity.
func tableSeriesOf(quantity string, n int) (two, inf *Coefficients, err error) {
	key := fmt.Sprintf("%s/%d", quantity, n)
	tableSeries.Lock()
	e, ok := tableSeries.m[key]
	if !ok {
		e = &tableEntry{}
		tableSeries.m[key] = e
	}
	tableSeries.Unlock()
	e.once.Do(func() { e.two, e.inf, e.err = bothEnds(quantity, n, tableOrder, tableDigits) })
	return e.two, e.inf, e.err
}

func tableBothEnds(t *testing.T, quantity string, n int) (two, inf *Coefficients) {
	t.Helper()
	two, inf, err := tableSeriesOf(quantity, n)
	if err != nil {
		t.Fatal(err)
	}
	return two, inf
}

// truncated returns the series cut at the order (the radius is the same).
func truncated(c *Coefficients, order int) *Coefficients {
	out := *c
	out.Values = c.Values[:order+1]
	out.Errors = c.Errors[:order+1]
	return &out
}

func tableExact(quantity string, n int, q QPoint) (*Value, error) {
	switch quantity {
	case QuantityDims:
		return Dimension(q, n, tableExactDigits)
	case QuantityB:
		return B(q, tableExactDigits)
	}
	return S0(q, tableExactDigits)
}

// errRow is one line of the stated-versus-true table.
type errRow struct {
	name, method string
	q            string
	order        int
	stated, true float64 // stated < 0: not estimated; true < 0: no value
	detail       string
}

// stateVsTrue runs every estimate of Resum for the quantity at the q and
// orders of the table.
func stateVsTrue(quantity string, n int, qs []string, orders []int) ([]errRow, error) {
	two40, inf40, err := tableSeriesOf(quantity, n)
	if err != nil {
		return nil, err
	}
	var rows []errRow
	name := quantity
	if quantity == QuantityDims {
		name = fmt.Sprintf("h_%d", n)
	}
	for _, qs := range qs {
		q, err := ParseQ(qs, 300)
		if err != nil {
			return nil, err
		}
		ex, err := tableExact(quantity, n, q)
		if err != nil {
			return nil, err
		}
		for _, order := range orders {
			ests, err := resumEstimates(quantity, q, truncated(two40, order), truncated(inf40, order), bitsFor(tableDigits, order))
			if err != nil {
				return nil, err
			}
			for _, e := range ests {
				row := errRow{name: name, method: e.Method, q: qs, order: order, stated: -1, true: -1, detail: e.Detail}
				if e.Value != nil {
					d := new(big.Float).Sub(e.Value, ex.Value)
					row.true, _ = new(big.Float).Abs(d).Float64()
				}
				if e.Err != nil {
					row.stated, _ = e.Err.Float64()
				}
				rows = append(rows, row)
			}
		}
	}
	return rows, nil
}

// tableMethods are the estimates resumEstimates gives, in its order.
var tableMethods = []string{"eps partial sum", "eps Pade", "eps conformal map", "1/q partial sum", "1/q Pade", "1/q conformal map", "two-point Pade"}

// TestResumStatedErrorCoversTrue is the table of stated versus true error
// for every method, quantity and q of the convergence note: the stated
// error must cover the true one (ratio true/stated <= 1), an estimate
// with a value but without an error must say why ("not estimated"), and
// a failed or inapplicable estimate must have no value. The quantities
// run side by side (the series of each are built once and shared with the
// other tests of the package).
func TestResumStatedErrorCoversTrue(t *testing.T) {
	qs := []string{"2.5", "3", "4", "6", "10"}
	orders := []int{16, tableOrder}
	type qty struct {
		quantity string
		n        int
	}
	list := []qty{{QuantityDims, 1}, {QuantityDims, 2}, {QuantityDims, 3}, {QuantityDims, 4}, {QuantityB, -1}, {QuantityS0, -1}}
	if testing.Short() {
		list = []qty{{QuantityDims, 1}, {QuantityB, -1}, {QuantityS0, -1}}
	}
	results := make([][]errRow, len(list))
	errs := make([]error, len(list))
	var wg sync.WaitGroup
	sem := make(chan struct{}, runtime.GOMAXPROCS(0))
	for i, c := range list {
		wg.Add(1)
		go func() {
			defer wg.Done()
			sem <- struct{}{}
			defer func() { <-sem }()
			results[i], errs[i] = stateVsTrue(c.quantity, c.n, qs, orders)
		}()
	}
	wg.Wait()
	worst := map[string]float64{}
	var b strings.Builder
	fmt.Fprintf(&b, "%-5s %-17s %-4s %-5s %-9s %-9s %s\n", "qty", "method", "q", "order", "stated", "true", "true/stated")
	for i, c := range list {
		if errs[i] != nil {
			t.Fatalf("%s %d: %v", c.quantity, c.n, errs[i])
		}
		rows := results[i]
		if want := len(qs) * len(orders) * len(tableMethods); len(rows) != want {
			t.Fatalf("%s %d: %d estimates, want %d", c.quantity, c.n, len(rows), want)
		}
		for j, r := range rows {
			if m := tableMethods[j%len(tableMethods)]; r.method != m {
				t.Errorf("%s at q = %s, order %d: estimate %d is %q, want %q", r.name, r.q, r.order, j%len(tableMethods), r.method, m)
			}
			ratio := "-"
			switch {
			case r.true < 0:
				ratio = "no value"
				if r.stated >= 0 {
					t.Errorf("%s %s at q = %s, order %d: an error %g without a value", r.name, r.method, r.q, r.order, r.stated)
				}
			case r.stated < 0:
				ratio = "not estimated"
				if !strings.Contains(r.detail, "not estimated") {
					t.Errorf("%s %s at q = %s, order %d: no error and no reason: %s", r.name, r.method, r.q, r.order, r.detail)
				}
			default:
				f := r.true / r.stated
				ratio = fmt.Sprintf("%.2g", f)
				if f > worst[r.method] || math.IsNaN(f) {
					worst[r.method] = f
				}
				if !(f <= 1) {
					t.Errorf("%s %s at q = %s, order %d: true error %.2g exceeds the stated %.2g", r.name, r.method, r.q, r.order, r.true, r.stated)
				}
				if r.stated == 0 || math.IsInf(r.stated, 0) || math.IsNaN(r.stated) {
					t.Errorf("%s %s at q = %s, order %d: stated error %g", r.name, r.method, r.q, r.order, r.stated)
				}
			}
			stated, tru := fmt.Sprintf("%.2g", r.stated), fmt.Sprintf("%.2g", r.true)
			if r.stated < 0 {
				stated = "-"
			}
			if r.true < 0 {
				tru = "-"
			}
			fmt.Fprintf(&b, "%-5s %-17s %-4s %-5d %-9s %-9s %s\n", r.name, r.method, r.q, r.order, stated, tru, ratio)
		}
	}
	t.Logf("stated vs true error:\n%s", b.String())
	t.Logf("worst true/stated per method: %v", worst)
}
