package main

import (
	"fmt"
	"strconv"

	"github.com/spf13/cobra"

	"qbridge/expansion/conformal"
)

// seriesProvider prints the series of a quantity that lives outside the
// conformal-data code (energy, soft mode, log Z). Files that add such
// quantities register them in seriesProviders from their init().
type seriesProvider func(cmd *cobra.Command, end conformal.End, order int) (*Output, error)

// seriesProviders maps extra quantity names to their providers.
var seriesProviders = map[string]seriesProvider{}

// closedFormDigits is the working precision for --closed-form.
const closedFormDigits = 80

var seriesFlags struct {
	around     string
	order      int
	n          int
	closedForm bool
}

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
	Use:   "series dims|b|s0",
	Short: "Taylor coefficients around q = 2 (in eps = 1 - 2/q) or q = infinity (in x = 1/q)",
	Long: `Print the Taylor coefficients of a conformal quantity around one end of the q axis,
each with an error estimate (two working precisions) and an estimate of the
radius of convergence:
  --around 2    coefficients in eps = 1 - 2/q (q = 2 is eps = 0, q = 4 is eps = 1/2)
  --around inf  coefficients in x = 1/q
Around infinity b has x log x terms, so the series of b^q and of
log(b)/x - log(x) are printed instead of b.
With --closed-form each coefficient is matched by PSLQ against a basis of
rationals times products of pi^2, zeta(3), log 2 (see the notes in the output);
a form is printed only when it holds on 10 digits beyond those used to find it.`,
	Example: `  qbridge series dims --around 2 --order 20 --n 1
  qbridge series s0 --around inf --order 12 --closed-form`,
	Args: cobra.ArbitraryArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		end, err := parseEnd(seriesFlags.around)
		if err != nil {
			return err
		}
		if seriesFlags.order < 0 || seriesFlags.order > conformal.MaxOrder {
			return usageErr("--order must be between 0 and %d (got %d)", conformal.MaxOrder, seriesFlags.order)
		}
		if len(args) == 1 {
			if p, ok := seriesProviders[args[0]]; ok {
				out, err := p(cmd, end, seriesFlags.order)
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
		if seriesFlags.n < 0 || seriesFlags.n > conformal.MaxN {
			return usageErr("--n must be between 0 and %d (got %d)", conformal.MaxN, seriesFlags.n)
		}
		digits := workDigits()
		if seriesFlags.closedForm && digits < closedFormDigits {
			digits = closedFormDigits // PSLQ needs digits to find a relation and 10 more to verify it
		}
		pr := newProgress(cmd, "series")
		pr.Update(0, quantity)
		var cs []*conformal.Coefficients
		switch quantity {
		case conformal.QuantityDims:
			c, err := conformal.DimensionSeries(end, seriesFlags.n, seriesFlags.order, digits)
			if err != nil {
				pr.Done()
				return err
			}
			cs = append(cs, c)
		case conformal.QuantityB:
			cs, err = conformal.BSeries(end, seriesFlags.order, digits)
		case conformal.QuantityS0:
			var c *conformal.Coefficients
			c, err = conformal.S0Series(end, seriesFlags.order, digits)
			cs = append(cs, c)
		}
		pr.Done()
		if err != nil {
			return err
		}
		var forms [][]*conformal.ClosedForm
		if seriesFlags.closedForm {
			for _, c := range cs {
				f, err := conformal.IdentifyCoefficients(c)
				if err != nil {
					return err
				}
				forms = append(forms, f)
			}
		}
		return emit(cmd, seriesOutput(quantity, end, cs, forms))
	},
}

func seriesOutput(quantity string, end conformal.End, cs []*conformal.Coefficients, forms [][]*conformal.ClosedForm) *Output {
	out := &Output{}
	var jsList []map[string]any
	for i, c := range cs {
		tab := Table{
			Title:  fmt.Sprintf("%s around q = %s, coefficients of %s^k", c.Quantity, end, end.Variable()),
			Header: []string{"k", "coefficient", "error"},
		}
		if forms != nil {
			tab.Header = append(tab.Header, "closed form")
		}
		js := map[string]any{
			"quantity":     c.Quantity,
			"around":       end.String(),
			"variable":     end.Variable(),
			"coefficients": valueStrings(c.Values, c.Errors, opts.Digits),
			"errors":       errStrings(c.Errors),
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
			row := []string{strconv.Itoa(k), fmtValue(v, c.Errors[k], opts.Digits), fmtErr(c.Errors[k])}
			if forms != nil {
				f := forms[i][k]
				text, tex := "", ""
				if f != nil {
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
		if forms != nil {
			js["closed_forms"] = texts
			js["closed_forms_tex"] = texs
		}
		out.Tables = append(out.Tables, tab)
		jsList = append(jsList, js)
		out.Notes = append(out.Notes, fmt.Sprintf("%s: %s", c.Quantity, c.Method))
		if c.Radius != nil {
			out.Notes = append(out.Notes, fmt.Sprintf("%s: radius of convergence in %s about %s +- %s (%s)",
				c.Quantity, end.Variable(), fmtBig(c.Radius, 4), fmtErr(c.RadiusErr), c.RadiusMethod))
		} else {
			out.Notes = append(out.Notes, fmt.Sprintf("%s: too few reliable coefficients for a radius estimate", c.Quantity))
		}
	}
	if quantity == conformal.QuantityB && end == conformal.AroundInf {
		out.Notes = append(out.Notes, "b is not a power series in x = 1/q: log b = x log x + x R(x); printed are b^q and R(x) = log(b)/x - log(x)")
	}
	if forms != nil {
		out.Notes = append(out.Notes, "closed forms: "+conformal.ClosedFormBasisDoc)
	}
	// The first series is the main one; further analytic companions (b
	// around infinity) ride along under "also".
	out.JSON = jsList[0]
	if len(jsList) > 1 {
		jsList[0]["also"] = jsList[1:]
	}
	return out
}

func init() {
	f := seriesCmd.Flags()
	f.StringVar(&seriesFlags.around, "around", "2", "expansion point: 2 (variable eps = 1 - 2/q) or inf (variable x = 1/q)")
	f.IntVar(&seriesFlags.order, "order", 12, fmt.Sprintf("highest power kept (0..%d)", conformal.MaxOrder))
	f.IntVar(&seriesFlags.n, "n", 1, "dimension index n (dims only)")
	f.BoolVar(&seriesFlags.closedForm, "closed-form", false, "identify closed forms of the coefficients by PSLQ")
	rootCmd.AddCommand(seriesCmd)
}
