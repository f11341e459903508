package main

import (
	"fmt"
	"math/big"
	"strconv"

	"github.com/spf13/cobra"

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

func checkQuantity(args []string) (string, error) {
	if len(args) != 1 {
		return "", usageErr("name one quantity: dims, b or s0")
	}
	switch args[0] {
	case conformal.QuantityDims, conformal.QuantityB, conformal.QuantityS0:
		return args[0], nil
	}
	return "", usageErr("unknown quantity %q: known are dims, b, s0", args[0])
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
	Use:   "exact dims|b|s0",
	Short: "Exact conformal data at one q: dimensions h_n, coefficient b, entropy S_0",
	Long: `Evaluate a conformal quantity at one value of q from its exact definition:
  dims  operator dimensions h_n, the solutions of k_A(h) = 1 (h_0 = 2 is the soft mode)
  b     the coefficient of the conformal two-point function, b^q pi = (1/2 - 1/q) tan(pi/q)
  s0    the zero-temperature entropy per Majorana fermion
q may be any real number >= 2 or inf. Each value carries an error estimate
from two working precisions.`,
	Example: `  qbridge exact dims --q 4 --n 0..10 --digits 30
  qbridge exact s0 --q 4 --format json`,
	Args: cobra.ArbitraryArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		quantity, err := checkQuantity(args)
		if err != nil {
			return err
		}
		q, err := parseQFlag(exactFlags.q)
		if err != nil {
			return err
		}
		var vals []*conformal.Value
		switch quantity {
		case conformal.QuantityDims:
			lo, hi, err := parseNRange(exactFlags.n)
			if err != nil {
				return err
			}
			if hi > conformal.MaxN {
				return usageErr("--n goes up to %d (got %d)", conformal.MaxN, hi)
			}
			pr := newProgress(cmd, "dimensions")
			for n := lo; n <= hi; n++ {
				pr.Update(float64(n-lo)/float64(hi-lo+1), "h_"+strconv.Itoa(n))
				v, err := conformal.Dimension(q, n, workDigits())
				if err != nil {
					pr.Done()
					return err
				}
				vals = append(vals, v)
			}
			pr.Done()
		case conformal.QuantityB:
			v, err := conformal.B(q, workDigits())
			if err != nil {
				return err
			}
			vals = append(vals, v)
		case conformal.QuantityS0:
			v, err := conformal.S0(q, workDigits())
			if err != nil {
				return err
			}
			vals = append(vals, v)
		}
		return emit(cmd, exactOutput(quantity, q, vals))
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
	return &Output{JSON: js, Tables: []Table{tab}, Notes: []string{"method: " + vals[0].Method, "units: script-J = 1"}}
}

func init() {
	f := exactCmd.Flags()
	f.StringVar(&exactFlags.q, "q", "4", "interaction order q (real >= 2, or inf)")
	f.StringVar(&exactFlags.n, "n", "0..6", "dimension index n, or an inclusive range such as 0..20 (dims only)")
	rootCmd.AddCommand(exactCmd)
}
