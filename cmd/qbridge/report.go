package main

import (
	"fmt"
	"math/big"

	"github.com/spf13/cobra"

	"qbridge/expansion/conformal"
)

var reportFlags struct {
	q     string
	order int
}

// reportRow is one line of the report: a quantity with every route to it.
// Exact is the reference value the differences are taken from: the exact
// value where one exists, otherwise the direct solver's (ExactKind says which).
type reportRow struct {
	Quantity  string
	Exact     *big.Float
	ExactErr  *big.Float
	ExactKind string
	// Estimates by column name (see reportColumns).
	Estimates map[string]conformal.Estimate
	Published *conformal.Published
}

// reportRowProvider adds rows to the report; files that add quantities
// register one in reportRowProviders from their init().
type reportRowProvider func(cmd *cobra.Command, q conformal.QPoint, order int) ([]reportRow, error)

var reportRowProviders []reportRowProvider

var reportColumns = []string{"eps Pade", "1/q Pade", "two-point Pade"}

var reportCmd = &cobra.Command{
	Use:   "report",
	Short: "One table of everything qbridge knows at one q (default q = 4)",
	Long: `The main job: at one q, for the dimensions h_1..h_6, the coefficient b and the
entropy S_0, print the exact value, the values resummed from the eps-series
(around q = 2), from the 1/q-series (around q = infinity) and by the two-point
Pade that uses both, the published value with its source, and the differences
from the exact value. Errors and methods are in the JSON output and the notes.`,
	Example: `  qbridge report
  qbridge report --q 6 --format tex`,
	Args: cobra.NoArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		q, err := parseQFlag(reportFlags.q)
		if err != nil {
			return err
		}
		if q.Inf {
			return usageErr("report needs a finite q")
		}
		if reportFlags.order < 2 || reportFlags.order > conformal.MaxOrder {
			return usageErr("--order must be between 2 and %d (got %d)", conformal.MaxOrder, reportFlags.order)
		}
		type job struct {
			quantity string
			n        int
		}
		var jobs []job
		for n := 1; n <= 6; n++ {
			jobs = append(jobs, job{conformal.QuantityDims, n})
		}
		jobs = append(jobs, job{conformal.QuantityB, -1}, job{conformal.QuantityS0, -1})
		pr := newProgress(cmd, "report")
		var rows []reportRow
		for i, j := range jobs {
			pr.Update(float64(i)/float64(len(jobs)), j.quantity)
			r, err := conformal.Resum(j.quantity, q, max(j.n, 0), reportFlags.order, workDigits())
			if err != nil {
				pr.Done()
				return err
			}
			row := reportRow{Quantity: r.Quantity, Exact: r.Exact.Value, ExactErr: r.Exact.Err, ExactKind: "exact", Estimates: map[string]conformal.Estimate{}}
			for _, e := range r.Estimates {
				row.Estimates[e.Method] = e
			}
			switch j.quantity {
			case conformal.QuantityDims:
				if p, ok := conformal.PublishedDimension(q, j.n); ok {
					row.Published = &p
				}
			case conformal.QuantityS0:
				p := conformal.PublishedS0(q)
				row.Published = &p
			}
			rows = append(rows, row)
		}
		pr.Done()
		for _, p := range reportRowProviders {
			more, err := p(cmd, q, reportFlags.order)
			if err != nil {
				return err
			}
			rows = append(rows, more...)
		}
		return emit(cmd, reportOutput(q, rows))
	},
}

func reportOutput(q conformal.QPoint, rows []reportRow) *Output {
	d := opts.Digits
	header := []string{"quantity", "reference", "kind"}
	for _, c := range reportColumns {
		header = append(header, c, "diff")
	}
	header = append(header, "published", "diff", "source")
	tab := Table{Title: fmt.Sprintf("qbridge report at q = %s (script-J = 1)", q), Header: header}
	var jrows []map[string]any
	for _, r := range rows {
		cells := []string{r.Quantity, fmtBig(r.Exact, d), r.ExactKind}
		jr := map[string]any{"quantity": r.Quantity, "reference": fmtBig(r.Exact, d), "reference_error": fmtErr(r.ExactErr), "reference_kind": r.ExactKind}
		for _, c := range reportColumns {
			e, ok := r.Estimates[c]
			if !ok || e.Value == nil {
				cells = append(cells, "failed", "")
				continue
			}
			diff := new(big.Float).Sub(e.Value, r.Exact)
			cells = append(cells, fmtBig(e.Value, d), fmtBig(diff, 2))
			jr[c] = map[string]string{"value": fmtBig(e.Value, d), "error": fmtErr(e.Err), "difference": fmtBig(diff, 3)}
		}
		if p := r.Published; p != nil {
			diff := new(big.Float).Sub(p.Value, r.Exact)
			pd := d
			if p.Digits > 0 {
				pd = p.Digits
			}
			cells = append(cells, fmtBig(p.Value, pd), fmtBig(diff, 2), p.Source)
			jr["published"] = map[string]string{"value": fmtBig(p.Value, pd), "difference": fmtBig(diff, 3), "source": p.Source}
		} else {
			cells = append(cells, "", "", "")
		}
		tab.Rows = append(tab.Rows, cells)
		jrows = append(jrows, jr)
	}
	notes := []string{
		fmt.Sprintf("series of order %d at each end; eps = 1 - 2/q, x = 1/q", reportFlags.order),
		"exact: dimensions by bracketed root finding of k_A(h) = 1 with Newton polish; b and S_0 from closed forms",
		"Pade: best near-diagonal entry of the Pade table free of poles between the expansion point and q; two-point: rational function matching both series",
		"diff = value - reference (the exact value, or the direct solver where no exact value exists); per-value errors are in --format json; b is resummed through b^q",
	}
	return &Output{JSON: map[string]any{"q": jsonQ(q), "order": reportFlags.order, "rows": jrows}, Tables: []Table{tab}, Notes: notes}
}

func init() {
	f := reportCmd.Flags()
	f.StringVar(&reportFlags.q, "q", "4", "interaction order q (real >= 2)")
	f.IntVar(&reportFlags.order, "order", 16, "order of the series at each end")
	rootCmd.AddCommand(reportCmd)
}
