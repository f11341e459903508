package main

import (
	"fmt"
	"math/big"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

var reportFlags struct {
	q     string
	order int
}

// reportRow is one line of the report: a quantity with every route to it.
type reportRow struct {
	r *expansion.Resummation
	// Estimates by method name.
	Estimates map[string]conformal.Estimate
}

// reportColumns are the resummations the report shows.
var reportColumns = []string{expansion.MethodPadeEps, expansion.MethodPadeX, expansion.MethodTwoPoint}

// reportQuantities are the rows of the report, in order.
var reportQuantities = []string{"h_1", "h_2", "h_3", "h_4", "h_5", "h_6", expansion.B, expansion.S0, expansion.E0, expansion.AlphaS, expansion.AlphaG, expansion.AlphaK}

var reportCmd = &cobra.Command{
	Use:   "report",
	Short: "One table of everything qbridge knows at one q (default q = 4)",
	Long: `The main job: at one q, for the dimensions h_1..h_6, the coefficient b, the
entropy S_0, the ground-state energy E_0, the Schwarzian coefficient alpha_S
and the soft-mode coefficients alpha_G and alpha_K, print the reference value
(exact where an exact value exists, else the direct Schwinger-Dyson solver's:
its ground ladder for E_0 and alpha_S, its zero-temperature route for alpha_G
and alpha_K), the values resummed from the eps-series
(around q = 2), from the 1/q-series (around q = infinity) and by the two-point
Pade that uses both, the published value with its source, and the differences
from the reference. Errors and methods are in the JSON output and the notes.
--units J prints E_0, alpha_S, alpha_G and alpha_K in units J = 1.`,
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
		pr := newProgress(cmd, "report")
		defer pr.Done()
		var rows []reportRow
		for i, name := range reportQuantities {
			pr.Update(float64(i)/float64(len(reportQuantities)), name)
			p, n, err := expansion.ParseName(name)
			if err != nil {
				return err
			}
			r, err := p.Resum(q, expansion.Request{N: n, Order: reportFlags.order, Digits: workDigits()})
			if err != nil {
				return libErr(err)
			}
			if err := expansion.ConvertResummation(r, opts.units); err != nil {
				return libErr(err)
			}
			row := reportRow{r: r, Estimates: map[string]conformal.Estimate{}}
			for _, e := range r.Estimates {
				row.Estimates[e.Method] = e
			}
			rows = append(rows, row)
		}
		pr.Done()
		return emit(cmd, reportOutput(q, rows))
	},
}

func reportOutput(q conformal.QPoint, rows []reportRow) *Output {
	d := opts.Digits
	header := []string{"quantity", "reference", "reference error", "kind"}
	for _, c := range reportColumns {
		header = append(header, c, c+" error", c+" - reference")
	}
	header = append(header, "published", "published - reference", "source")
	tab := Table{Title: fmt.Sprintf("qbridge report at q = %s (%s)", q, unitsStatement()), Header: header}
	var jrows []map[string]any
	var failures []string
	for _, r := range rows {
		ref := r.r.Reference
		for _, e := range r.r.Estimates {
			if e.Value == nil {
				failures = append(failures, fmt.Sprintf("%s %s: %s", r.r.Name, e.Method, e.Detail))
			}
		}
		cells := []string{r.r.Name, fmtBig(ref.Value, refDigits(ref)), fmtErr(ref.Err), ref.Kind}
		jr := map[string]any{"quantity": r.r.Name, "reference": fmtBig(ref.Value, refDigits(ref)), "reference_error": fmtErr(ref.Err), "reference_kind": ref.Kind}
		for _, c := range reportColumns {
			e, ok := r.Estimates[c]
			if !ok || e.Value == nil {
				cells = append(cells, "failed (see notes)", "", "")
				continue
			}
			diff := new(big.Float).Sub(e.Value, ref.Value)
			cells = append(cells, fmtBig(e.Value, refDigits(ref)), fmtErr(e.Err), fmtBig(diff, 2))
			jr[methodKey(c)] = map[string]string{"value": fmtBig(e.Value, refDigits(ref)), "error": fmtErr(e.Err), "difference": fmtBig(diff, 3)}
		}
		if p := r.r.Published; p != nil {
			diff := new(big.Float).Sub(p.Value, ref.Value)
			pd := d
			if p.Digits > 0 {
				pd = p.Digits
			}
			kind := "value at this q"
			if p.Limit {
				kind = "limiting formula"
				pd = min(d, 6)
			}
			cells = append(cells, fmtBig(p.Value, pd), fmtBig(diff, 2), p.Source)
			jr["published"] = map[string]string{"value": fmtBig(p.Value, pd), "difference": fmtBig(diff, 3), "source": p.Source, "kind": kind}
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
		"published: a value printed for this q where one exists; rows marked limiting formula evaluate a large-q formula at this q (a check of the trend, not a value at this q)",
		"diff = value - reference (the exact value, or the direct solver where no exact value exists); per-value errors are in --format json; b is resummed through b^q",
		"direct references: E_0 and alpha_S from the ground ladder (the values of qbridge ground and table --method direct), alpha_G and alpha_K from the zero-temperature route (alpha_G from the h = 2 correction of the T = 0 solution, alpha_K = -q k_A'(2) alpha_G)",
		unitsNote(),
	}
	notes = append(notes, failures...)
	return &Output{JSON: map[string]any{"q": jsonQ(q), "order": reportFlags.order, "rows": jrows}, Tables: []Table{tab}, Notes: notes}
}

func init() {
	f := reportCmd.Flags()
	f.StringVar(&reportFlags.q, "q", "4", "interaction order q (real >= 2)")
	f.IntVar(&reportFlags.order, "order", 16, "order of the series at each end")
	rootCmd.AddCommand(reportCmd)
}
