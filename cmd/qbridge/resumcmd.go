package main

import (
	"fmt"

	"github.com/spf13/cobra"

	"qbridge/expansion/conformal"
)

// resumProvider resums a quantity that lives outside the conformal-data
// code; files that add one register it in resumProviders from init().
type resumProvider func(cmd *cobra.Command, q conformal.QPoint, order int) (*Output, error)

var resumProviders = map[string]resumProvider{}

var resumFlags struct {
	q     string
	order int
	n     int
}

var resumCmd = &cobra.Command{
	Use:   "resum dims|b|s0",
	Short: "Resum the series from both ends at one q and compare with the exact value",
	Long: `Evaluate a conformal quantity at one q from its series around q = 2 and
q = infinity: partial sums and the best Pade-table entry from each end, and the
two-point Pade that matches both ends. Each estimate carries an error estimate
and is printed beside the exact value and its difference from it.
b is resummed through b^q, which is analytic at both ends.`,
	Example: `  qbridge resum dims --q 4 --n 1 --order 20
  qbridge resum s0 --q 3 --format json`,
	Args: cobra.ArbitraryArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		q, err := parseQFlag(resumFlags.q)
		if err != nil {
			return err
		}
		if q.Inf {
			return usageErr("resum needs a finite q (the series around inf is exact there)")
		}
		if resumFlags.order < 2 || resumFlags.order > conformal.MaxOrder {
			return usageErr("--order must be between 2 and %d (got %d)", conformal.MaxOrder, resumFlags.order)
		}
		if len(args) == 1 {
			if p, ok := resumProviders[args[0]]; ok {
				out, err := p(cmd, q, resumFlags.order)
				if err != nil {
					return err
				}
				return emit(cmd, out)
			}
		}
		quantity, err := checkQuantity(args)
		if err != nil {
			return err
		}
		if resumFlags.n < 0 || resumFlags.n > conformal.MaxN {
			return usageErr("--n must be between 0 and %d (got %d)", conformal.MaxN, resumFlags.n)
		}
		pr := newProgress(cmd, "resummation")
		pr.Update(0, quantity)
		r, err := conformal.Resum(quantity, q, resumFlags.n, resumFlags.order, workDigits())
		pr.Done()
		if err != nil {
			return err
		}
		return emit(cmd, resumOutput(r))
	},
}

func resumOutput(r *conformal.Resummation) *Output {
	tab := Table{
		Title:  fmt.Sprintf("%s at q = %s from series of order %d", r.Quantity, r.Q, r.Order),
		Header: []string{"method", "value", "error", "minus exact"},
	}
	tab.Rows = append(tab.Rows, []string{"exact", fmtBig(r.Exact.Value, opts.Digits), fmtErr(r.Exact.Err), ""})
	var methods, values, errs, diffs []string
	notes := []string{"exact: " + r.Exact.Method}
	for _, e := range r.Estimates {
		v, er, d := "failed", "", ""
		if e.Value != nil {
			v, er, d = fmtBig(e.Value, opts.Digits), fmtErr(e.Err), fmtBig(r.Difference(e), 3)
		}
		tab.Rows = append(tab.Rows, []string{e.Method, v, er, d})
		methods = append(methods, e.Method)
		values = append(values, v)
		errs = append(errs, er)
		diffs = append(diffs, d)
		notes = append(notes, e.Method+": "+e.Detail)
	}
	js := map[string]any{
		"quantity":    r.Quantity,
		"q":           jsonQ(r.Q),
		"order":       r.Order,
		"methods":     methods,
		"values":      values,
		"errors":      errs,
		"differences": diffs,
		"exact":       fmtBig(r.Exact.Value, opts.Digits),
		"exact_error": fmtErr(r.Exact.Err),
	}
	if r.N >= 0 {
		js["n"] = r.N
	}
	return &Output{JSON: js, Tables: []Table{tab}, Notes: notes}
}

func init() {
	f := resumCmd.Flags()
	f.StringVar(&resumFlags.q, "q", "4", "interaction order q (real >= 2)")
	f.IntVar(&resumFlags.order, "order", 16, fmt.Sprintf("order of the series at each end (2..%d)", conformal.MaxOrder))
	f.IntVar(&resumFlags.n, "n", 1, "dimension index n (dims only)")
	rootCmd.AddCommand(resumCmd)
}
