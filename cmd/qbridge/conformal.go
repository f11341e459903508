package main

import (
	"fmt"
	"math/big"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

// workDigits is the precision the analytic commands compute at: the printed
// digits plus a margin, never below 20.
func workDigits() int {
	d := opts.Digits + 5
	if d < 20 {
		d = 20
	}
	if d > conformal.MaxDigits {
		d = conformal.MaxDigits
	}
	return d
}

func parseQFlag(text string) (conformal.QPoint, error) {
	q, err := conformal.ParseQ(text, 256)
	if err != nil {
		return q, usageErr("%v", err)
	}
	return q, nil
}

// jsonQ renders q for JSON: a decimal string, or "inf".
func jsonQ(q conformal.QPoint) string { return q.String() }

func valueStrings(xs, errs []*big.Float, digits int) []string {
	out := make([]string, len(xs))
	for i, x := range xs {
		out[i] = fmtValue(x, errs[i], digits)
	}
	return out
}

func errStrings(xs []*big.Float) []string {
	out := make([]string, len(xs))
	for i, x := range xs {
		out[i] = fmtErr(x)
	}
	return out
}

var exactFlags struct {
	q string
	n string
}

var exactCmd = &cobra.Command{
	Use:   "exact QUANTITY",
	Short: "Exact conformal data at one q: dimensions h_n, coefficient b, entropy S_0",
	Long: `Evaluate a conformal quantity at one value of q from its exact definition:
  h_n (dims)  operator dimensions, the solutions of k_A(h) = 1 (h_0 = 2 is the soft mode);
              h_3 names one, h_n with --n a list or range
  b           the coefficient of the conformal two-point function, b^q pi = (1/2 - 1/q) tan(pi/q)
  S_0 (s0)    the zero-temperature entropy per Majorana fermion
q may be any real number >= 2 or inf. Each value carries an error estimate
from two working precisions.`,
	Example: `  qbridge exact dims --q 4 --n 0..10 --digits 30
  qbridge exact s0 --q 4 --format json`,
	Args: cobra.ArbitraryArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		nGiven := cmd.Flags().Changed("n")
		p, ns, err := quantityArg(args, exactFlags.n, nGiven)
		if err != nil {
			return err
		}
		ep, ok := p.(expansion.ExactProvider)
		if !ok {
			return usageErr("%s has no exact value at finite q: use qbridge resum %s (resummed, beside the direct solver) or qbridge ground", p.Quantity().Name, args[0])
		}
		q, err := parseQFlag(exactFlags.q)
		if err != nil {
			return err
		}
		var vals []*conformal.Value
		pr := newProgress(cmd, "exact")
		for i, n := range ns {
			pr.Update(float64(i)/float64(len(ns)), p.Quantity().Named(n))
			v, err := ep.Exact(q, expansion.Request{N: n, Digits: workDigits()})
			if err != nil {
				pr.Done()
				return libErr(err)
			}
			vals = append(vals, v)
		}
		pr.Done()
		return emit(cmd, exactOutput(args[0], q, vals))
	},
}

func exactOutput(quantity string, q conformal.QPoint, vals []*conformal.Value) *Output {
	tab := Table{Title: fmt.Sprintf("%s at q = %s", quantity, q), Header: []string{"quantity", "value", "error"}}
	var values, errs []string
	var ns []int
	for _, v := range vals {
		s, e := fmtBig(v.Value, opts.Digits), fmtErr(v.Err)
		values = append(values, s)
		errs = append(errs, e)
		tab.Rows = append(tab.Rows, []string{v.Quantity, s, e})
		if v.N >= 0 {
			ns = append(ns, v.N)
		}
	}
	js := map[string]any{"quantity": quantity, "q": jsonQ(q), "values": values, "errors": errs, "method": vals[0].Method}
	if ns != nil {
		js["n"] = ns
	}
	return &Output{JSON: js, Tables: []Table{tab}, Notes: []string{"method: " + vals[0].Method, unitsNote()}}
}

func init() {
	f := exactCmd.Flags()
	f.StringVar(&exactFlags.q, "q", "4", "interaction order q (real >= 2, or inf)")
	f.StringVar(&exactFlags.n, "n", "0..6", "dimension indices for h_n: a number, a list 1,3 or a range 0..20")
	rootCmd.AddCommand(exactCmd)
}
