package main

import (
	"fmt"
	"math/big"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
	"qbridge/expansion/hightemp"
)

var htFlags struct {
	order int
	q     string
	beta  string
}

var hightempCmd = &cobra.Command{
	Use:   "hightemp QUANTITY",
	Short: "Exact high-temperature series in (beta script-J)^2, exact in q",
	Long: `Solve the large-N Schwinger-Dyson equations exactly in powers of
t = (beta script-J)^2, in rational arithmetic, and print the coefficients.
QUANTITY is one of
  logz       log Z/N = (1/2) log 2 + sum_k a_k (beta script-J)^(2k)
  energy     E/N = -d(log Z/N)/d beta: coefficients of beta^(2k-1)
  entropy    S/N = log Z/N + beta E/N
  heat       specific heat C/N = beta^2 d^2(log Z/N)/d beta^2
  cumulants  kappa_2k/N = (2k)! a_k, the cumulants of the many-body spectral
             density per fermion (odd ones vanish), in units script-J^(2k)
  moments    mu_2k = (2k)! [beta^(2k)] (Z/2^(N/2))^(1/N): the formal moments
             that go with the cumulants kappa_2k/N (mu_2 = kappa_2/N,
             mu_4 = kappa_4/N + 3 (kappa_2/N)^2, ...). They are not the
             moments of a positive density: at q = 4, mu_4 < 0.
Without --q every coefficient is printed as an exact polynomial in 1/q (and
as one fraction N(q)/(D q^m)): it is exact for every q. With --q (a number,
a fraction such as 9/2, or a list 3,4,9/2) the coefficients are exact
rationals at each q, printed beside their decimals, and the nearest
singularity of log Z in the complex t plane is estimated from them: beyond
beta script-J = sqrt(|t_c|) the series diverges (the Pade sum in t still
converges where the singularity lies on the negative t axis). --beta B sums
the quantity at beta script-J = B (beta J with --units J) by the partial sum
and by Pade in t, each with its error. --units J (integer q up to 4096)
prints the coefficients of (beta J)^p, still exact: the factor is
(q/2^(q-1))^(p/2), and (q/2^(q-1))^((p+1)/2) for the energy, always a
whole power.`,
	Example: `  qbridge hightemp logz --order 8
  qbridge hightemp cumulants --order 6 --q 4
  qbridge hightemp logz --order 30 --q 4 --beta 1
  qbridge hightemp heat --order 12 --q 9/2 --format json`,
	Args: cobra.ArbitraryArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		if len(args) != 1 {
			return usageErr("hightemp needs one quantity: %s", kindNames())
		}
		if _, err := hightemp.ParseKind(args[0]); err != nil {
			return usageErr("unknown quantity %q for hightemp: expected one of %s", args[0], kindNames())
		}
		if htFlags.order < 1 || htFlags.order > hightemp.MaxOrder {
			return usageErr("--order must be between 1 and %d (got %d)", hightemp.MaxOrder, htFlags.order)
		}
		req := expansion.HighTempRequest{Kind: args[0], Order: htFlags.order, Units: opts.units, Prec: digitsToBits(opts.Digits + 10)}
		if cmd.Flags().Changed("q") {
			qs, err := parseRationalList(htFlags.q)
			if err != nil {
				return err
			}
			req.Qs = qs
		}
		if cmd.Flags().Changed("beta") {
			b, ok := new(big.Float).SetPrec(req.Prec).SetString(strings.TrimSpace(htFlags.beta))
			if !ok || b.Sign() <= 0 || b.IsInf() {
				return usageErr("--beta %q: expected a positive number such as 1 or 0.5", htFlags.beta)
			}
			if len(req.Qs) == 0 {
				return usageErr("--beta sums the series at given q: add --q")
			}
			if k, _ := hightemp.ParseKind(args[0]); !hightemp.Summable(k) {
				return usageErr("--beta applies to logz, energy, entropy and heat; %s is a set of numbers", k)
			}
			req.Beta = b
		}
		if len(req.Qs) == 0 && opts.units == expansion.UnitsJ {
			return usageErr("in J units the coefficients carry (q/2^(q-1))^k, not a rational function of q: give --q or use --units script-J (J units need integer q)")
		}
		pr := newProgress(cmd, "hightemp")
		req.Progress = pr.Update
		res, err := expansion.HighTemp(req)
		pr.Done()
		if err != nil {
			return libErr(err)
		}
		return emit(cmd, hightempOutput(res, req))
	},
}

func kindNames() string {
	var n []string
	for _, k := range hightemp.Kinds {
		n = append(n, k.Name)
	}
	return strings.Join(n, ", ")
}

// digitsToBits is the binary precision of d decimal digits.
func digitsToBits(d int) uint { return uint(float64(d)*3.3219280948873626) + 1 }

// parseRationalList reads q values given as integers, decimals (read
// exactly: 4.5 is 9/2) or fractions, separated by commas.
func parseRationalList(s string) ([]*big.Rat, error) {
	var out []*big.Rat
	for _, f := range strings.Split(s, ",") {
		f = strings.TrimSpace(f)
		if strings.EqualFold(f, "inf") {
			return nil, usageErr("--q inf: the high-temperature coefficients at q = infinity vanish beyond the (1/2) log 2 (the 1/q^2 parts are the large-q formula): drop --q to see every power of 1/q")
		}
		num, den, _ := strings.Cut(f, "/")
		q, ok := new(big.Rat).SetString(f)
		if !ok || !conformal.PlainDecimal(num) || (den != "" && !conformal.PlainDecimal(den)) || strings.Count(f, "/") > 1 {
			return nil, usageErr("--q %q: expected numbers or fractions such as 4, 4.5 or 9/2, separated by commas", f)
		}
		if q.Cmp(big.NewRat(2, 1)) < 0 {
			return nil, usageErr("--q %s: q must be at least 2", f)
		}
		if q.Num().BitLen() > 64 || q.Denom().BitLen() > 64 {
			return nil, usageErr("--q %s: numerator and denominator must fit in 64 bits", f)
		}
		out = append(out, q)
	}
	return out, nil
}

func columnName(kind hightemp.Kind) string {
	switch kind {
	case hightemp.Cumulants:
		return "2k of kappa_2k/N"
	case hightemp.Moments:
		return "2k of mu_2k"
	}
	return "power of beta"
}

func hightempOutput(res *expansion.HighTempResult, req expansion.HighTempRequest) *Output {
	out := &Output{}
	unit := "script-J"
	if req.Units == expansion.UnitsJ {
		unit = "J"
	}
	name := res.Kind.String()
	scale := " (beta in units 1/" + unit + ")"
	if res.Kind == hightemp.Cumulants || res.Kind == hightemp.Moments {
		scale = " (in units " + unit + "^(2k))"
	}
	out.Notes = append(out.Notes, name+": "+res.Doc+scale, "method: "+res.Method)
	if res.Symbolic != nil {
		tab := Table{
			Title:  fmt.Sprintf("exact high-temperature series of %s, coefficients as polynomials in 1/q (units %s = 1)", name, unit),
			Header: []string{columnName(res.Kind), "coefficient", "as one fraction"},
		}
		var coefs []map[string]any
		for _, t := range res.Symbolic {
			if t.HalfLog2 {
				half := "(1/2) log 2"
				if opts.Format == "tex" {
					half = `$\frac{1}{2}\log 2$`
				}
				tab.Rows = append(tab.Rows, []string{"0", half, half})
				coefs = append(coefs, map[string]any{"power": t.Power, "constant": "(1/2) log 2"})
				continue
			}
			num, den := oneFraction(t.Value)
			poly, frac := t.Value.String(), fractionText(num, den)
			if opts.Format == "tex" {
				poly = "$" + texPoly(t.Value) + "$"
				frac = `$\frac{` + texProducts(num) + "}{" + texProducts(den) + "}$"
				if den == "1" {
					frac = "$" + texProducts(num) + "$"
				}
			}
			tab.Rows = append(tab.Rows, []string{strconv.Itoa(t.Power), poly, frac})
			var terms []map[string]any
			for j, c := range t.Value.C {
				if c.Sign() != 0 {
					terms = append(terms, map[string]any{"inverse_q_power": j, "numerator": c.Num().String(), "denominator": c.Denom().String()})
				}
			}
			coefs = append(coefs, map[string]any{"power": t.Power, "inverse_q_terms": terms, "numerator": num, "denominator": den})
		}
		out.Tables = append(out.Tables, tab)
		doc := map[string]any{"quantity": name, "definition": res.Doc, "order": req.Order, "variable": "beta " + unit,
			"coefficients": coefs, "method": res.Method}
		return finishOutput(out, []map[string]any{doc})
	}
	var docs []map[string]any
	d := opts.Digits
	for _, at := range res.AtQ {
		qs := at.Q.RatString()
		tab := Table{
			Title:  fmt.Sprintf("exact high-temperature series of %s at q = %s (units %s = 1)", name, qs, unit),
			Header: []string{columnName(res.Kind), "exact", "decimal"},
		}
		var coefs []map[string]any
		for _, t := range at.Terms {
			if t.HalfLog2 {
				half := expansion.HalfLog2(req.Prec)
				tab.Rows = append(tab.Rows, []string{"0", "(1/2) log 2", fmtBig(half, d)})
				coefs = append(coefs, map[string]any{"power": 0, "constant": "(1/2) log 2", "value": fmtBig(half, d)})
				continue
			}
			dec := fmtBig(new(big.Float).SetPrec(req.Prec).SetRat(t.Value), d)
			exact := t.Value.RatString()
			if opts.Format == "tex" {
				exact = texRat(t.Value)
			}
			tab.Rows = append(tab.Rows, []string{strconv.Itoa(t.Power), exact, dec})
			coefs = append(coefs, map[string]any{"power": t.Power, "numerator": t.Value.Num().String(), "denominator": t.Value.Denom().String(), "value": dec})
		}
		out.Tables = append(out.Tables, tab)
		doc := map[string]any{"quantity": name, "q": qs, "order": req.Order, "coefficients": coefs}
		rad := at.Radius
		if rad.T != nil {
			bmax, bmaxErr := at.BetaMax, at.BetaMaxErr
			out.Notes = append(out.Notes, fmt.Sprintf("q = %s: nearest singularity of log Z at t = (beta script-J)^2 = %s +- %s, so the series in t converges for beta %s < %s +- %s (%s)",
				qs, fmtKnown(rad.T, rad.TErr, d), fmtErr(rad.TErr), unit, fmtKnown(bmax, bmaxErr, d), fmtErr(bmaxErr), rad.Method))
			doc["singularity_t"], doc["singularity_t_error"] = fmtKnown(rad.T, rad.TErr, d), fmtErr(rad.TErr)
			doc["beta_max"], doc["beta_max_error"] = fmtKnown(bmax, bmaxErr, d), fmtErr(bmaxErr)
			doc["singularity_method"] = rad.Method
		} else {
			out.Notes = append(out.Notes, fmt.Sprintf("q = %s: radius in t %s", qs, rad.Reason))
			doc["singularity_t"], doc["singularity_t_error"] = nil, nil
			doc["singularity_reason"] = rad.Reason
		}
		if s := at.Sum; s != nil {
			st := Table{
				Title:  fmt.Sprintf("%s at q = %s, beta %s = %s", name, qs, unit, req.Beta.Text('g', 10)),
				Header: []string{"method", "value", "error"},
			}
			var sums []map[string]any
			for _, m := range []struct {
				key string
				s   hightemp.Sum
			}{{"partial sum", s.Partial}, {"Pade in t", s.Pade}} {
				if m.s.Value == nil {
					st.Rows = append(st.Rows, []string{m.key, "failed", notEstimated})
					out.Notes = append(out.Notes, fmt.Sprintf("q = %s, %s: %s", qs, m.key, m.s.Reason))
					sums = append(sums, map[string]any{"method": m.key, "value": nil, "value_error": nil, "reason": m.s.Reason})
					continue
				}
				detail := m.s.Method
				if m.s.Err == nil {
					detail += "; " + m.s.Reason
				}
				out.Notes = append(out.Notes, fmt.Sprintf("q = %s, %s: %s", qs, m.key, detail))
				if m.s.Diverges {
					st.Rows = append(st.Rows, []string{m.key, "diverges", notEstimated})
					sums = append(sums, map[string]any{"method": m.key, "value": nil, "value_error": nil, "diverges": true, "how": detail})
					continue
				}
				v := fmtKnown(m.s.Value, m.s.Err, d)
				st.Rows = append(st.Rows, []string{m.key, v, fmtErr(m.s.Err)})
				sums = append(sums, map[string]any{"method": m.key, "value": v, "value_error": jsonErr(m.s.Err), "diverges": false, "how": detail})
			}
			out.Tables = append(out.Tables, st)
			doc["beta"] = req.Beta.Text('g', 17)
			doc["sums"] = sums
		}
		docs = append(docs, doc)
	}
	return finishOutput(out, docs)
}

// jsonErr is an error for JSON: a string, or nil (null) when not estimated.
func jsonErr(e *big.Float) any {
	if s := fmtErr(e); s != notEstimated {
		return s
	}
	return nil
}

// oneFraction writes sum_j c_j q^-j as N(q)/(D q^m) with integer
// coefficients: D the least common denominator, m the top power.
func oneFraction(p hightemp.InvQPoly) (num, den string) {
	m := len(p.C) - 1
	for m > 0 && p.C[m].Sign() == 0 {
		m--
	}
	d := big.NewInt(1)
	for _, c := range p.C {
		g := new(big.Int).GCD(nil, nil, d, c.Denom())
		d.Mul(d, new(big.Int).Quo(c.Denom(), g))
	}
	var parts []string
	for j := 0; j <= m; j++ {
		c := p.C[j]
		if c.Sign() == 0 {
			continue
		}
		n := new(big.Int).Mul(c.Num(), new(big.Int).Quo(d, c.Denom()))
		pw := m - j
		var term string
		switch {
		case pw == 0:
			term = new(big.Int).Abs(n).String()
		case new(big.Int).Abs(n).Cmp(big.NewInt(1)) == 0:
			term = qPower(pw)
		default:
			term = new(big.Int).Abs(n).String() + "*" + qPower(pw)
		}
		switch {
		case len(parts) == 0 && n.Sign() < 0:
			parts = append(parts, "-"+term)
		case len(parts) == 0:
			parts = append(parts, term)
		case n.Sign() < 0:
			parts = append(parts, "- "+term)
		default:
			parts = append(parts, "+ "+term)
		}
	}
	if len(parts) == 0 {
		return "0", "1"
	}
	den = d.String()
	if m > 0 {
		den += "*" + qPower(m)
	}
	return strings.Join(parts, " "), den
}

// fractionText writes num/den with parentheses only where a sum or a
// product needs them: 1/(2*q^2), (3*q - 1)/(24*q^3), 1.
func fractionText(num, den string) string {
	if strings.Contains(num, " ") {
		num = "(" + num + ")"
	}
	if den == "1" {
		return num
	}
	if strings.Contains(den, "*") {
		den = "(" + den + ")"
	}
	return num + "/" + den
}

// texRat typesets an exact rational.
func texRat(r *big.Rat) string {
	if r.IsInt() {
		return "$" + r.Num().String() + "$"
	}
	sign := ""
	if r.Sign() < 0 {
		sign = "-"
	}
	return "$" + sign + `\frac{` + new(big.Int).Abs(r.Num()).String() + "}{" + r.Denom().String() + "}$"
}

func qPower(n int) string {
	if n == 1 {
		return "q"
	}
	return "q^" + strconv.Itoa(n)
}

// texProducts typesets "3*q^2 - q" as "3 q^{2} - q".
func texProducts(s string) string {
	s = strings.ReplaceAll(s, "*", " ")
	var b strings.Builder
	for i := 0; i < len(s); i++ {
		if s[i] != '^' {
			b.WriteByte(s[i])
			continue
		}
		j := i + 1
		for j < len(s) && s[j] >= '0' && s[j] <= '9' {
			j++
		}
		b.WriteString("^{" + s[i+1:j] + "}")
		i = j - 1
	}
	return b.String()
}

// texPoly typesets sum_j c_j q^-j as a sum of fractions.
func texPoly(p hightemp.InvQPoly) string {
	var b strings.Builder
	for j, c := range p.C {
		if c.Sign() == 0 {
			continue
		}
		switch {
		case c.Sign() < 0:
			b.WriteString(" - ")
		case b.Len() > 0:
			b.WriteString(" + ")
		}
		n := new(big.Int).Abs(c.Num())
		den := c.Denom().String()
		if j > 0 {
			den += " q^{" + strconv.Itoa(j) + "}"
		}
		fmt.Fprintf(&b, `\frac{%s}{%s}`, n, den)
	}
	if b.Len() == 0 {
		return "0"
	}
	return strings.TrimSpace(b.String())
}

func init() {
	f := hightempCmd.Flags()
	f.IntVar(&htFlags.order, "order", 12, fmt.Sprintf("highest power k of t = (beta script-J)^2 (1..%d)", hightemp.MaxOrder))
	f.StringVar(&htFlags.q, "q", "", "interaction order(s): a number, a fraction 9/2, or a list 3,4,9/2; without it the coefficients are polynomials in 1/q")
	f.StringVar(&htFlags.beta, "beta", "", "with --q, sum the quantity at this beta script-J (beta J with --units J)")
	rootCmd.AddCommand(hightempCmd)
}
