package main

import (
	"fmt"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

var resumFlags struct {
	q     string
	order int
	n     string
}

var resumCmd = &cobra.Command{
	Use:   "resum QUANTITY",
	Short: "Resum the series from both ends at one q and compare with the exact or direct value",
	Long: `Evaluate a quantity at one q from its series around q = 2 and q = infinity, by
the methods in one fixed order: eps partial sum, eps Pade (best pole-free entry
of the Pade table), 1/q partial sum, 1/q Pade, and the two-point Pade that
matches both ends. Each estimate carries an error estimate and is printed
beside the reference value (exact for h_n, b, S_0; the direct Schwinger-Dyson
solver: its ground ladder for E_0 and alpha_S, its zero-temperature route
for alpha_G and alpha_K) and its difference from it.
Quantities: h_1, h_2, ... (or h_n with --n; alias dims), b, S_0 (s0),
E_0 (e0), alpha_S (alpha), alpha_G, alpha_K. b is resummed through b^q,
analytic at both ends; alpha_G through q alpha_G, alpha_K as it is, from
their series (those of alpha_S times exact factors). --units J converts E_0,
alpha_S, alpha_G and alpha_K at this q; --emit needs --units script-J.`,
	Example: `  qbridge resum h_1 --q 4 --order 20
  qbridge resum s0 --q 3 --format json
  qbridge resum alpha_S --q 6`,
	Args: cobra.ArbitraryArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		if cmd.Flags().Changed("emit") {
			return runEmit(cmd, args)
		}
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
		p, ns, err := quantityArg(args, resumFlags.n, cmd.Flags().Changed("n"))
		if err != nil {
			return err
		}
		pr := newProgress(cmd, "resummation")
		defer pr.Done()
		var rs []*expansion.Resummation
		for _, n := range ns {
			pr.Update(0, p.Quantity().Named(n))
			r, err := p.Resum(q, expansion.Request{N: n, Order: resumFlags.order, Digits: workDigits(), Progress: pr.Update})
			if err != nil {
				return libErr(err)
			}
			if err := expansion.ConvertResummation(r, opts.units); err != nil {
				return libErr(err)
			}
			rs = append(rs, r)
		}
		pr.Done()
		return emit(cmd, resumOutput(rs))
	},
}

func resumOutput(rs []*expansion.Resummation) *Output {
	out := &Output{}
	var docs []map[string]any
	for _, r := range rs {
		tab, js, notes := resumTable(r)
		out.Tables = append(out.Tables, tab)
		out.Notes = append(out.Notes, notes...)
		docs = append(docs, js)
	}
	return finishOutput(out, docs)
}

func resumTable(r *expansion.Resummation) (Table, map[string]any, []string) {
	ref := r.Reference
	tab := Table{
		Title:  fmt.Sprintf("%s at q = %s from series of order %d (eps) and %d (1/q) (%s)", r.Name, r.Q, r.OrderEps, r.OrderX, unitsStatement()),
		Header: []string{"method", "value", "error", "minus " + ref.Kind},
	}
	tab.Rows = append(tab.Rows, []string{ref.Kind, fmtBig(ref.Value, refDigits(ref)), fmtErr(ref.Err), ""})
	var methods, values, errs, diffs []string
	notes := []string{r.Name + " " + ref.Kind + ": " + ref.Method}
	for _, e := range r.Estimates {
		v, er, d := "failed (see notes)", "", ""
		if e.Value != nil {
			v, er, d = fmtBig(e.Value, refDigits(ref)), fmtErr(e.Err), fmtBig(r.Difference(e), 3)
		}
		tab.Rows = append(tab.Rows, []string{e.Method, v, er, d})
		methods = append(methods, e.Method)
		values = append(values, v)
		errs = append(errs, er)
		diffs = append(diffs, d)
		notes = append(notes, r.Name+" "+e.Method+": "+e.Detail)
	}
	notes = append(notes, r.Notes...)
	js := map[string]any{
		"quantity":        r.Name,
		"q":               jsonQ(r.Q),
		"order":           r.OrderEps,
		"order_eps":       r.OrderEps,
		"order_x":         r.OrderX,
		"methods":         methods,
		"values":          values,
		"errors":          errs,
		"differences":     diffs,
		"reference":       fmtBig(ref.Value, refDigits(ref)),
		"reference_error": fmtErr(ref.Err),
		"reference_kind":  ref.Kind,
	}
	if ref.Kind == "exact" {
		js["exact"], js["exact_error"] = js["reference"], js["reference_error"]
	}
	return tab, js, notes
}

// refDigits caps the printed digits where the reference and the estimates
// come from float64 solves (the direct solver, the energy series) at what
// float64 holds.
func refDigits(ref *expansion.Reference) int {
	if ref.Kind == "direct" {
		return min(opts.Digits, 15)
	}
	return opts.Digits
}

func init() {
	f := resumCmd.Flags()
	f.StringVar(&resumFlags.q, "q", "4", "interaction order q (real >= 2)")
	f.IntVar(&resumFlags.order, "order", 16, fmt.Sprintf("order of the series at each end (2..%d; E_0 and alpha_S use at most 10 around 2 and 8 around inf)", conformal.MaxOrder))
	f.StringVar(&resumFlags.n, "n", "1", "dimension index for h_n: a number, a list 1,3 or a range 1..6")
	f.StringVar(&emitFormat, "emit", "", emitUsage)
	rootCmd.AddCommand(resumCmd)
}
