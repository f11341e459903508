package main

import (
	"fmt"
	"math/big"
	"strconv"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
	"qbridge/series/scalar"
)

var singFlags struct {
	n      string
	around string
	count  int
}

var singCmd = &cobra.Command{
	Use:   "singularities QUANTITY",
	Short: "The nearest singularities of h_n, b or S_0 in the complex plane of eps or x",
	Long: `Locate the singularities of a conformal quantity nearest to one end of the
q axis, in the complex plane of its expansion variable (eps = 1 - 2/q around
q = 2, x = 1/q around q = infinity). Their moduli are the radii of
convergence of the series there.
  h_n (dims)  exactly, not from the coefficients: the points where two roots
              of k_A(h) = 1 collide (k_A = 1 and dk_A/dh = 0 together),
              found by complex Newton from starts that cover the region and
              refined at two working precisions (their difference is the
              error); each is checked to be a square-root branch point
  b, S_0      from their closed forms: one list per analytic function the
              series use (b and b^q around q = 2; b^q and log(b)/x - log(x)
              around q = infinity; S_0)
For each: the point, its modulus, the point in q, what collides or what the
closed form does there, the type and the coefficient of the singular term.
E_0, alpha_S, alpha_G and alpha_K have no exact map: the radius that
qbridge series prints for them comes from a test of the coefficients.`,
	Example: `  qbridge singularities h_1 --around 2
  qbridge singularities dims --n 2 --around inf --count 4
  qbridge singularities s0 --around inf --format json`,
	Args: cobra.ArbitraryArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		end, err := parseEnd(singFlags.around)
		if err != nil {
			return err
		}
		if singFlags.count < 1 || singFlags.count > conformal.MaxSingularities {
			return usageErr("--count must be between 1 and %d (got %d)", conformal.MaxSingularities, singFlags.count)
		}
		nGiven := cmd.Flags().Changed("n")
		p, ns, err := quantityArg(args, singFlags.n, nGiven)
		if err != nil {
			return err
		}
		name := p.Quantity().Name
		var lib string
		switch name {
		case expansion.HN:
			lib = conformal.QuantityDims
		case expansion.B:
			lib = conformal.QuantityB
		case expansion.S0:
			lib = conformal.QuantityS0
		default:
			return usageErr("%s has no exact singularity map (only h_n, b and S_0 do): qbridge series %s --around %s prints a radius from a test of its coefficients", name, args[0], singFlags.around)
		}
		var maps []*conformal.SingularityMap
		pr := newProgress(cmd, "singularities")
		for i, n := range ns {
			pr.Update(float64(i)/float64(len(ns)), p.Quantity().Named(n))
			ms, err := conformal.Singularities(lib, end, max(n, 0), singFlags.count, workDigits())
			if err != nil {
				pr.Done()
				return libErr(err)
			}
			maps = append(maps, ms...)
		}
		pr.Done()
		return emit(cmd, singOutput(maps))
	},
}

// complexString prints z with digits significant digits per part; an
// imaginary part below the error err (nil: none) is rounding and dropped.
func complexString(z scalar.Complex, err *big.Float, digits int) string {
	re, im := fmtBig(z.Re, digits), fmtBig(new(big.Float).Abs(z.Im), digits)
	if z.Im.Sign() == 0 || (err != nil && new(big.Float).Abs(z.Im).Cmp(err) <= 0) {
		return re
	}
	sign := "+"
	if z.Im.Sign() < 0 {
		sign = "-"
	}
	return re + " " + sign + " " + im + "i"
}

// singOutput tabulates the maps: one table per analytic function.
func singOutput(maps []*conformal.SingularityMap) *Output {
	out := &Output{}
	var docs []map[string]any
	digits := opts.Digits
	for _, m := range maps {
		v := m.End.Variable()
		name := m.Quantity
		if m.N >= 0 {
			name = "h_" + strconv.Itoa(m.N)
		}
		tab := Table{
			Title:  fmt.Sprintf("singularities of %s around q = %s, in the plane of %s", name, m.End, v),
			Header: []string{"#", v, "error", "|" + v + "|", "|" + v + "| error", "q", "what meets there", "type", "coefficient", "coefficient error"},
		}
		var rows []map[string]any
		for i, s := range m.Singularities {
			qText := "inf"
			if !s.QInf {
				qText = complexString(s.Q, s.QErr, digits)
			}
			coef := "not estimated"
			if s.Coefficient.Re != nil {
				coef = complexString(s.Coefficient, s.CoefficientErr, digits)
			}
			tab.Rows = append(tab.Rows, []string{strconv.Itoa(i + 1), complexString(s.S, s.SErr, digits), fmtErr(s.SErr),
				fmtBig(s.Modulus, digits), fmtErr(s.ModulusErr), qText, s.Levels, s.Kind, coef, fmtErr(s.CoefficientErr)})
			row := map[string]any{
				"point_re": fmtBig(s.S.Re, digits), "point_im": fmtBig(s.S.Im, digits), "point_error": fmtErr(s.SErr),
				"modulus": fmtBig(s.Modulus, digits), "modulus_error": fmtErr(s.ModulusErr),
				"levels": s.Levels, "type": s.Kind, "form": s.Form, "check": s.Check,
			}
			if s.QInf {
				row["q"] = "inf"
			} else {
				row["q_re"], row["q_im"], row["q_error"] = fmtBig(s.Q.Re, digits), fmtBig(s.Q.Im, digits), fmtErr(s.QErr)
			}
			if s.H.Re != nil {
				row["h_re"], row["h_im"], row["h_error"] = fmtBig(s.H.Re, digits), fmtBig(s.H.Im, digits), fmtErr(s.HErr)
			}
			if s.Coefficient.Re != nil {
				row["coefficient_re"], row["coefficient_im"] = fmtBig(s.Coefficient.Re, digits), fmtBig(s.Coefficient.Im, digits)
				row["coefficient_error"] = fmtErr(s.CoefficientErr)
			}
			rows = append(rows, row)
			if i == 0 || s.Form != m.Singularities[i-1].Form {
				out.Notes = append(out.Notes, fmt.Sprintf("%s #%d: local form %s; %s", name, i+1, s.Form, s.Check))
			}
		}
		if len(m.Singularities) == 0 {
			tab.Rows = append(tab.Rows, []string{"-", "none found", "", "", "", "", "", "", "", ""})
		}
		out.Tables = append(out.Tables, tab)
		out.Notes = append(out.Notes, name+": "+m.Method)
		for _, n := range m.Notes {
			out.Notes = append(out.Notes, name+": "+n)
		}
		doc := map[string]any{"quantity": name, "function": m.Quantity, "around": m.End.String(), "variable": v,
			"method": m.Method, "singularities": rows}
		if m.N >= 0 {
			doc["n"] = strconv.Itoa(m.N)
		}
		if m.SearchRadius != nil {
			doc["search_radius"] = fmtBig(m.SearchRadius, 6)
		}
		docs = append(docs, doc)
	}
	return finishOutput(out, docs)
}

func init() {
	f := singCmd.Flags()
	f.StringVar(&singFlags.n, "n", "1", "dimension index for h_n: a number, a list 1,3 or a range 1..4")
	f.StringVar(&singFlags.around, "around", "2", "expansion point: 2 (variable eps = 1 - 2/q) or inf (variable x = 1/q)")
	f.IntVar(&singFlags.count, "count", 2, "how many singularities, nearest first (conjugate pairs count twice)")
	rootCmd.AddCommand(singCmd)
}
