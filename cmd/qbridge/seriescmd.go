package main

import (
	"fmt"
	"math/big"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

// closedFormDigits is the working precision for --closed-form.
const closedFormDigits = 80

var seriesFlags struct {
	around     string
	order      int
	n          string
	closedForm bool
	beta       float64
	noLimit    bool
}

// maxSeconds is the longest a command runs without --no-time-limit.
const maxSeconds = 60

func parseEnd(text string) (conformal.End, error) {
	switch text {
	case "2":
		return conformal.AroundTwo, nil
	case "inf":
		return conformal.AroundInf, nil
	}
	return 0, usageErr("--around must be 2 or inf (got %q)", text)
}

var seriesCmd = &cobra.Command{
	Use:   "series QUANTITY",
	Short: "Taylor coefficients around q = 2 (in eps = 1 - 2/q) or q = infinity (in x = 1/q)",
	Long: `Print the Taylor coefficients of a quantity around one end of the q axis,
each with an error estimate and, where the coefficients allow, an estimate of
the radius of convergence:
  --around 2    coefficients in eps = 1 - 2/q (q = 2 is eps = 0, q = 4 is eps = 1/2)
  --around inf  coefficients in x = 1/q
Quantities: h_1, h_2, ... (or h_n with --n 1,3 or --n 1..6; alias dims), b,
S_0 (s0), E_0 (e0), alpha_S (alpha), alpha_G, alpha_K, logZ (needs --beta).
Around infinity b has x log x terms, so the series of b^q and of
log(b)/x - log(x) are printed instead of b. E_0 and alpha_S come from
low-temperature fits of the finite-temperature series, with the fitted S_0
against its exact series as a built-in check, and around q = 2 per
coefficient from the zero-temperature eps-series (refined in double-double)
where that states the smaller error; alpha_G and alpha_K are the
alpha_S series times the exact series of 6 q^2 alpha_0 (alpha_K) and
6 q^2 alpha_0/(-q k_A'(2)) (alpha_G), both analytic at q = 2.
--units J: around q = 2 the series of E_0, alpha_S, alpha_G, alpha_K are
converted (times the eps series of sqrt(q/2^(q-1)) or its inverse); around
q = inf and for logZ they are refused (no series in 1/q exists in J units).
With --closed-form (h_n, b, S_0 only) each coefficient is matched by PSLQ
against a basis of rationals times products of pi^2, zeta(3), zeta(5), log 2;
a form is printed only when it holds on 10 digits beyond those used to find it.`,
	Example: `  qbridge series h_1 --around 2 --order 20
  qbridge series s0 --around inf --order 12 --closed-form
  qbridge series alpha_S --around inf --order 6`,
	Args: cobra.ArbitraryArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		end, err := parseEnd(seriesFlags.around)
		if err != nil {
			return err
		}
		if seriesFlags.order < 0 || seriesFlags.order > conformal.MaxOrder {
			return usageErr("--order must be between 0 and %d (got %d)", conformal.MaxOrder, seriesFlags.order)
		}
		p, ns, err := quantityArg(args, seriesFlags.n, cmd.Flags().Changed("n"))
		if err != nil {
			return err
		}
		if err := opts.units.CheckSeries(p.Quantity(), end); err != nil {
			return libErr(err)
		}
		if seriesFlags.closedForm && !p.Quantity().Exact {
			return usageErr("--closed-form applies to h_n, b and S_0, whose coefficients are known to working precision; the %s coefficients are numerical (a few digits), too few for PSLQ", p.Quantity().Name)
		}
		digits := workDigits()
		if seriesFlags.closedForm && digits < closedFormDigits {
			digits = closedFormDigits // PSLQ needs digits to find a relation and 10 more to verify it
		}
		if c, ok := p.(expansion.Coster); ok && !seriesFlags.noLimit {
			est := 0.0
			for _, n := range ns {
				est += c.SeriesSeconds(expansion.Request{N: n, End: end, Order: seriesFlags.order, Digits: digits})
			}
			if est > maxSeconds {
				return usageErr("this series would take about %.0f s (order %d at %d digits, %d series; the cost grows as order^3): the limit is %d s; lower --order, or add --no-time-limit to run it anyway", est, seriesFlags.order, digits, len(ns), maxSeconds)
			}
		}
		pr := newProgress(cmd, "series")
		defer pr.Done()
		var results []*expansion.SeriesResult
		for i, n := range ns {
			pr.Update(float64(i)/float64(len(ns)), p.Quantity().Named(n))
			r, err := p.Series(expansion.Request{
				N: n, End: end, Order: seriesFlags.order, Digits: digits, Beta: seriesFlags.beta,
				Set:      setFlags(map[string]bool{"beta": cmd.Flags().Changed("beta")}),
				Progress: pr.Update,
			})
			if err != nil {
				return libErr(err)
			}
			if err := expansion.ConvertSeries(r, p.Quantity().Named(n), end, opts.units); err != nil {
				return libErr(err)
			}
			results = append(results, r)
		}
		pr.Done()
		var forms [][][]*conformal.ClosedForm
		if seriesFlags.closedForm {
			for _, r := range results {
				var fr [][]*conformal.ClosedForm
				for _, c := range r.Parts {
					f, err := conformal.IdentifyCoefficients(c)
					if err != nil {
						return err
					}
					fr = append(fr, f)
				}
				forms = append(forms, fr)
			}
		}
		return emit(cmd, seriesOutput(end, results, forms))
	},
}

// seriesOutput formats the series of one or more requests (several
// dimensions): one table per series part, one JSON document per request
// (a list when there are several).
func seriesOutput(end conformal.End, results []*expansion.SeriesResult, forms [][][]*conformal.ClosedForm) *Output {
	out := &Output{}
	var docs []map[string]any
	for ri, r := range results {
		var jsList []map[string]any
		for i, c := range r.Parts {
			var f []*conformal.ClosedForm
			if forms != nil {
				f = forms[ri][i]
			}
			tab, js := coefficientsTable(c, end, f, forms != nil)
			out.Tables = append(out.Tables, tab)
			jsList = append(jsList, js)
			out.Notes = append(out.Notes, fmt.Sprintf("%s: %s", c.Quantity, c.Method))
			if c.Radius != nil {
				out.Notes = append(out.Notes, fmt.Sprintf("%s: radius of convergence in %s about %s +- %s (%s)",
					c.Quantity, end.Variable(), fmtBig(c.Radius, 4), fmtErr(c.RadiusErr), c.RadiusMethod))
			}
		}
		if ck := r.Check; ck != nil {
			tab, js := checkTable(ck, end)
			out.Tables = append(out.Tables, tab)
			jsList[0]["check"] = js
		}
		out.Notes = append(out.Notes, r.Notes...)
		// The first part is the main one; analytic companions (b around
		// infinity, E beside log Z) ride along under "also".
		if len(jsList) > 1 {
			jsList[0]["also"] = jsList[1:]
		}
		docs = append(docs, jsList[0])
	}
	if forms != nil {
		out.Notes = append(out.Notes, "closed forms: "+conformal.ClosedFormBasisDoc)
	}
	return finishOutput(out, docs)
}

func coefficientsTable(c *conformal.Coefficients, end conformal.End, forms []*conformal.ClosedForm, withForms bool) (Table, map[string]any) {
	name := c.Quantity
	if c.N >= 0 {
		name = "h_" + strconv.Itoa(c.N)
	}
	tab := Table{
		Title:  fmt.Sprintf("%s around q = %s, coefficients of %s^k", name, end, end.Variable()),
		Header: []string{"k", "coefficient", "error"},
	}
	if withForms {
		tab.Header = append(tab.Header, "closed form")
	}
	js := map[string]any{
		"quantity":     name,
		"around":       end.String(),
		"variable":     end.Variable(),
		"coefficients": valueStrings(c.Values, c.Errors, digitsFor(c.Prec)),
		"errors":       coeffErrs(c.Values, c.Errors),
		"method":       c.Method,
	}
	if c.N >= 0 {
		js["n"] = c.N
	}
	if c.Radius != nil {
		js["radius"] = fmtBig(c.Radius, 4)
		js["radius_error"] = fmtErr(c.RadiusErr)
	}
	var texts, texs []string
	for k, v := range c.Values {
		row := []string{strconv.Itoa(k), fmtValue(v, c.Errors[k], digitsFor(c.Prec)), coeffErr(v, c.Errors[k])}
		if withForms {
			text, tex := "", ""
			if f := forms[k]; f != nil {
				text, tex = f.Text, f.TeX
			}
			if opts.Format == "tex" && tex != "" {
				row = append(row, "$"+tex+"$")
			} else {
				row = append(row, text)
			}
			texts = append(texts, text)
			texs = append(texs, tex)
		}
		tab.Rows = append(tab.Rows, row)
	}
	if withForms {
		js["closed_forms"] = texts
		js["closed_forms_tex"] = texs
	}
	return tab, js
}

// checkTable prints a built-in check: fitted coefficients against exact ones.
func checkTable(ck *expansion.SeriesCheck, end conformal.End) (Table, map[string]any) {
	if ck.ExactErr != nil {
		return checkTableWithErrors(ck, end)
	}
	tab := Table{
		Title:  fmt.Sprintf("built-in check: %s fitted against its exact series around q = %s", ck.Name, end),
		Header: []string{"k", ck.Name + " fitted", "error", ck.Name + " exact", "(fitted-exact)/error"},
	}
	var sig []string
	d := digitsFor(53) // fitted from float64 solves
	for k := range ck.Fitted {
		s := sigmaString(ck.Fitted[k], ck.Exact[k], ck.FittedErr[k])
		sig = append(sig, s)
		tab.Rows = append(tab.Rows, []string{strconv.Itoa(k), fmtValue(ck.Fitted[k], ck.FittedErr[k], d), fmtErr(ck.FittedErr[k]), fmtBig(ck.Exact[k], d), s})
	}
	return tab, map[string]any{
		"quantity":     ck.Name,
		"coefficients": valueStrings(ck.Fitted, ck.FittedErr, d),
		"errors":       errStrings(ck.FittedErr),
		"exact":        errFreeStrings(ck.Exact),
		"sigma":        sig,
	}
}

// checkTableWithErrors prints a check whose exact column is an exact
// formula summed numerically, with its own error: the deviation is in
// units of the combined error.
func checkTableWithErrors(ck *expansion.SeriesCheck, end conformal.End) (Table, map[string]any) {
	tab := Table{
		Title:  fmt.Sprintf("cross-check: %s on grids against exact high-temperature coefficients, around q = %s, coefficients of %s^k", ck.Name, end, end.Variable()),
		Header: []string{"k", "grids", "error", "exact high-T", "error", "(grids-exact)/error"},
	}
	var sig []string
	var exactErrs []any
	d := digitsFor(53)
	for k := range ck.Fitted {
		if k >= len(ck.Exact) {
			break
		}
		e := new(big.Float).Set(ck.FittedErr[k])
		exErr := fmtErr(ck.ExactErr[k])
		if ck.ExactErr[k] != nil {
			e.Add(e, ck.ExactErr[k])
			exactErrs = append(exactErrs, exErr)
		} else {
			if ck.ExactReason[k] != "" && !strings.HasPrefix(ck.ExactReason[k], "exact") {
				e = nil // the exact column's error is unknown: no verdict
			}
			exErr = ck.ExactReason[k]
			if exErr == "" {
				exErr = "exact"
			}
			exactErrs = append(exactErrs, nil)
		}
		s := "-"
		if e != nil {
			s = sigmaString(ck.Fitted[k], ck.Exact[k], e)
		}
		sig = append(sig, s)
		tab.Rows = append(tab.Rows, []string{strconv.Itoa(k), fmtValue(ck.Fitted[k], ck.FittedErr[k], d), fmtErr(ck.FittedErr[k]),
			exactCell(ck.Exact[k], ck.ExactErr[k], d), exErr, s})
	}
	return tab, map[string]any{
		"quantity":     ck.Name,
		"coefficients": valueStrings(ck.Fitted, ck.FittedErr, d),
		"errors":       errStrings(ck.FittedErr),
		"exact":        errFreeStrings(ck.Exact[:len(sig)]),
		"exact_errors": exactErrs,
		"exact_method": ck.Against,
		"sigma":        sig,
	}
}

// sigmaString prints (a - b)/e with two decimals, "-" when e is zero.
func sigmaString(a, b, e *big.Float) string {
	if e == nil || e.Sign() == 0 {
		return "-"
	}
	d := new(big.Float).Sub(a, b)
	s, _ := d.Quo(d, e).Float64()
	return fmt.Sprintf("%.2f", s)
}

// exactCell formats a reference value, "-" where there is none (a sum
// that diverges; the error column says why).
func exactCell(x, err *big.Float, d int) string {
	if x == nil {
		return "-"
	}
	return fmtValue(x, err, d)
}

// errFreeStrings formats values without an error column; a missing value
// is null.
func errFreeStrings(xs []*big.Float) []any {
	out := make([]any, len(xs))
	for i, x := range xs {
		if x != nil {
			out[i] = fmtBig(x, opts.Digits)
		}
	}
	return out
}

func init() {
	f := seriesCmd.Flags()
	f.StringVar(&seriesFlags.around, "around", "2", "expansion point: 2 (variable eps = 1 - 2/q) or inf (variable x = 1/q)")
	f.IntVar(&seriesFlags.order, "order", 12, fmt.Sprintf("highest power kept (h_n, b, S_0: 0..%d; E_0, alpha_S, logZ: 0..%d around 2, 2..%d around inf; alpha_K: 0..%d around 2, 0..%d around inf; alpha_G one more at each end)", conformal.MaxOrder, expansion.MaxEnergyOrderEps, expansion.MaxEnergyOrderX, expansion.MaxEnergyOrderEps, expansion.MaxEnergyOrderX-2))
	f.StringVar(&seriesFlags.n, "n", "1", "dimension index for h_n: a number, a list 1,3 or a range 1..6")
	f.BoolVar(&seriesFlags.closedForm, "closed-form", false, "identify closed forms of the coefficients by PSLQ (h_n, b, S_0)")
	f.Float64Var(&seriesFlags.beta, "beta", 0, "inverse temperature beta*script-J (logZ only, required there)")
	f.BoolVar(&seriesFlags.noLimit, "no-time-limit", false, fmt.Sprintf("run even when the estimated time exceeds %d s", maxSeconds))
	rootCmd.AddCommand(seriesCmd)
}

// digitsFor caps the printed digits at what a computation at prec bits
// holds (15 for float64), so no value carries digits it does not have.
func digitsFor(prec uint) int {
	if prec == 0 {
		return opts.Digits
	}
	return min(opts.Digits, max(int(float64(prec)*0.30103), 1))
}

// exactZero is printed as the error of a coefficient that vanishes by
// construction (the 1/q series of E_0 and alpha_S start at 1/q^2).
const exactZero = "exact"

// coeffErr formats a coefficient's error: "exact" for a coefficient that
// is zero with zero error (a structural zero), else as fmtErr.
func coeffErr(v, e *big.Float) string {
	if v != nil && e != nil && v.Sign() == 0 && e.Sign() == 0 {
		return exactZero
	}
	return fmtErr(e)
}

func coeffErrs(vs, es []*big.Float) []string {
	out := make([]string, len(es))
	for i := range es {
		out[i] = coeffErr(vs[i], es[i])
	}
	return out
}
