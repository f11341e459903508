package main

import (
	"fmt"
	"math"
	"math/big"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

var tableFlags struct {
	q       string
	method  string
	order   int
	n       string
	noCache bool
	beta    float64
}

var tableCmd = &cobra.Command{
	Use:   "table QUANTITIES",
	Short: "Quantities as functions of q: one row per q, value and error per quantity",
	Long: `Tabulate one or more quantities over a list of q values. QUANTITIES is a
comma-separated list (or several arguments) of the names the other commands
use: h_1, h_2, ... (or h_n with --n RANGE; alias dims), b, S_0 (s0),
E_0 (e0), alpha_S (alpha), alpha_G, alpha_K, and logZ with --beta B: at
fixed inverse temperature, log Z with the energy E and the entropy
S = log Z + beta E beside it, from one direct Schwinger-Dyson solve per q
(grid spacing 1/32, Richardson over 3 grids; --method direct only).

--q takes a list 3,4,6, a range with a step 2.5..20:0.5, a geometric range
2.5..1000:*1.25, and inf, in any combination (3,4..6:1,inf).

--method chooses where the values come from:
  exact     the exact value (h_n, b, S_0), from two working precisions
  resummed  the two-point Pade of the series around q = 2 and q = infinity
  direct    the direct Schwinger-Dyson solver's ground ladder (E_0, S_0 fitted,
            alpha_S; seconds per q) and its zero-temperature route (alpha_G,
            alpha_K; about a second per q); the same values as resum and report
  all       every source the quantity has, side by side, with differences
            from the reference (exact, else direct)
Default: exact where it exists, else resummed; a note per column says which.

The series at both ends are computed once per run (and kept in the user's
cache directory, so a second run is instant; --no-cache bypasses it, and
'qbridge cache clear' empties it), and the q values are computed in parallel
on all cores. With --format tex every value is printed as value(error),
rounded to its error. --units J converts E_0, alpha_S, alpha_G, alpha_K at
each q (at q = inf alpha_S, alpha_G and alpha_K have no value in J units).`,
	Example: `  qbridge table alpha_S,E_0 --q 2.5..20:0.5
  qbridge table h_n --n 1..4 --q 3,4,6,inf --format tex
  qbridge table s0 --q 2.5..1000:*1.25 --method all --format csv
  qbridge table logZ --q 2..8:0.5 --beta 20 --format csv`,
	Args: cobra.ArbitraryArgs,
	RunE: runTable,
}

func init() {
	f := tableCmd.Flags()
	f.StringVar(&tableFlags.q, "q", "", "q values: a list 3,4,6, a range 2.5..20:0.5, a geometric range 2.5..1000:*1.25, inf (required)")
	f.StringVar(&tableFlags.method, "method", "", "exact, resummed, direct or all (default: exact where it exists, else resummed)")
	f.IntVar(&tableFlags.order, "order", 16, fmt.Sprintf("series order at each end for the resummation (2..%d; E_0 and alpha_S use at most 10 around 2 and 8 around inf)", conformal.MaxOrder))
	f.StringVar(&tableFlags.n, "n", "", "dimension indices for h_n: a number, a list 1,3 or a range 1..6")
	f.BoolVar(&tableFlags.noCache, "no-cache", false, "compute the series afresh and do not store them")
	f.Float64Var(&tableFlags.beta, "beta", 0, "inverse temperature beta*script-J (beta*J with --units J) of logZ, which brings E and S beside it (direct solver)")
	rootCmd.AddCommand(tableCmd)
}

// tableNames expands the QUANTITIES arguments into one name per column.
func tableNames(args []string, nFlag string, nGiven, betaGiven bool) ([]string, error) {
	var names []string
	for _, a := range args {
		for _, part := range strings.Split(a, ",") {
			if part = strings.TrimSpace(part); part != "" {
				names = append(names, part)
			}
		}
	}
	if len(names) == 0 {
		return nil, usageErr("name at least one quantity: %s", expansion.KnownNames())
	}
	var out []string
	usedN := false
	for _, name := range names {
		p, n, err := expansion.ParseName(name)
		if err != nil {
			return nil, usageErr("%v", err)
		}
		q := p.Quantity()
		if q.NeedsBeta {
			if !betaGiven {
				return nil, usageErr("%s depends on the inverse temperature: give --beta B (log Z, E and S at every q, from the direct solver)", q.Name)
			}
			out = append(out, q.Name)
			continue
		}
		if !q.Indexed {
			out = append(out, q.Name)
			continue
		}
		if n >= 0 {
			if n > conformal.MaxN {
				return nil, usageErr("dimension index %d is above the supported %d", n, conformal.MaxN)
			}
			out = append(out, q.Named(n))
			continue
		}
		if !nGiven {
			return nil, usageErr("%s names the family of dimensions: give --n (1..6) or name them (h_1,h_2)", name)
		}
		ns, err := parseNList(nFlag)
		if err != nil {
			return nil, err
		}
		usedN = true
		for _, k := range ns {
			out = append(out, q.Named(k))
		}
	}
	if nGiven && !usedN {
		return nil, usageErr("--n applies to the family h_n (or dims) only")
	}
	return out, nil
}

func runTable(cmd *cobra.Command, args []string) error {
	if cmd.Flags().Changed("beta") {
		if b := tableFlags.beta; !(b > 0) || b > maxSolveBeta {
			return usageErr("--beta must be in (0, %g] (got %g): one solve per q resolves at most that", maxSolveBeta, b)
		}
	}
	if tableFlags.q == "" {
		return usageErr("--q is required: a list 3,4,6, a range 2.5..20:0.5, a geometric range 2.5..1000:*1.25, or inf")
	}
	qs, err := parseQList(tableFlags.q)
	if err != nil {
		return err
	}
	if tableFlags.order < 2 || tableFlags.order > conformal.MaxOrder {
		return usageErr("--order must be between 2 and %d (got %d)", conformal.MaxOrder, tableFlags.order)
	}
	switch tableFlags.method {
	case "", expansion.SourceExact, expansion.SourceResummed, expansion.SourceDirect, expansion.SourceAll:
	default:
		return usageErr("--method must be exact, resummed, direct or all (got %q)", tableFlags.method)
	}
	names, err := tableNames(args, tableFlags.n, cmd.Flags().Changed("n"), cmd.Flags().Changed("beta"))
	if err != nil {
		return err
	}
	pr := newProgress(cmd, "table")
	defer pr.Done()
	res, err := expansion.Tabulate(expansion.TableRequest{
		Names: names, Q: qs, Source: tableFlags.method, Order: tableFlags.order, Digits: workDigits(),
		Cache: newCache(cmd, tableFlags.noCache), Progress: pr.Update,
		Beta: tableFlags.beta, BetaUnits: opts.units,
	})
	pr.Done()
	if err != nil {
		return libErr(err)
	}
	expansion.ConvertTable(res, opts.units)
	if err := emit(cmd, tableOutput(res, opts.Format == "tex")); err != nil {
		return err
	}
	failed := 0
	for _, row := range res.Rows {
		for _, cells := range row.Cells {
			for _, c := range cells {
				if c.Failed {
					failed++
				}
			}
		}
	}
	if failed > 0 {
		return fmt.Errorf("%d value(s) could not be computed; they are marked \"failed\" in the table and explained in the JSON output", failed)
	}
	return nil
}

// tableHeader names a value column: the quantity, with its source when a
// column shows several.
func tableHeader(c expansion.TableColumn, src string) string {
	if len(c.Sources) == 1 {
		return c.Name
	}
	return c.Name + " " + src
}

// tableOutput renders a table: one row per q; text and CSV carry a value
// and an error column per quantity and source (and, with several sources,
// the differences from the reference); LaTeX one value(error) cell each.
func tableOutput(res *expansion.TableResult, tex bool) *Output {
	d := opts.Digits
	header := []string{"q"}
	for _, c := range res.Columns {
		for _, s := range c.Sources {
			h := tableHeader(c, s)
			if tex {
				header = append(header, h)
				continue
			}
			header = append(header, h, h+" error")
			if c.Reference != "" && s != c.Reference {
				header = append(header, h+" - "+c.Reference)
			}
		}
	}
	tab := Table{Title: "qbridge table (" + unitsStatement() + ")", Header: header}
	var rows []map[string]any
	for _, row := range res.Rows {
		cells := []string{row.Q.String()}
		js := map[string]any{"q": jsonQ(row.Q)}
		for ci, c := range res.Columns {
			var ref *expansion.TableCell
			for si, s := range c.Sources {
				if s == c.Reference {
					ref = &row.Cells[ci][si]
				}
			}
			per := map[string]any{}
			for si, s := range c.Sources {
				cell := row.Cells[ci][si]
				cj := cellJSON(cell, cellDigits(cell, s, d))
				var diff string
				if ref != nil && s != c.Reference && cell.Value != nil && ref.Value != nil {
					diff = fmtBig(new(big.Float).Sub(cell.Value, ref.Value), 3)
					cj["difference"] = diff
					cj["difference_from"] = c.Reference
				}
				if len(c.Sources) == 1 {
					js[c.Name] = cj
				} else {
					per[s] = cj
				}
				if tex {
					cells = append(cells, texUncertain(cell, d))
					continue
				}
				v, e := "n/a", ""
				if cell.Failed {
					v = "failed"
				}
				if cell.Value != nil {
					v = fmtBig(cell.Value, cellDigits(cell, s, d))
					e = fmtErr(cell.Err)
					if cell.Err == nil {
						e = "not estimated (" + cell.ErrNote + ")"
					}
				}
				cells = append(cells, v, e)
				if c.Reference != "" && s != c.Reference {
					cells = append(cells, diff)
				}
			}
			if len(c.Sources) > 1 {
				js[c.Name] = per
			}
		}
		tab.Rows = append(tab.Rows, cells)
		rows = append(rows, js)
	}
	var notes []string
	for _, c := range res.Columns {
		notes = append(notes, c.Note)
	}
	notes = append(notes, res.Notes...)
	for _, row := range res.Rows {
		for ci, c := range res.Columns {
			for si, cell := range row.Cells[ci] {
				if cell.Value == nil {
					notes = append(notes, fmt.Sprintf("%s %s at q = %s: %s", c.Name, c.Sources[si], row.Q, cell.Missing))
				}
			}
		}
	}
	if tex {
		notes = append(notes, "values are rounded to their error: 0.0070931(5) means 0.0070931 +- 0.0000005; the error is rounded up to one significant digit (two when it starts with 1)")
	}
	notes = append(notes, unitsNote())
	return &Output{JSON: rows, Tables: []Table{tab}, Notes: notes}
}

// cellDigits caps the digits of float64 values (the direct solver).
func cellDigits(c expansion.TableCell, src string, d int) int {
	if src == expansion.SourceDirect {
		return min(d, 15)
	}
	return d
}

// cellJSON is one value as {"value", "error", "method"} (decimal strings;
// null where there is none, with the reason under "note" or
// "error_note").
func cellJSON(c expansion.TableCell, d int) map[string]any {
	m := map[string]any{"value": nil, "error": nil, "method": c.Method}
	if c.Value == nil {
		m["note"] = c.Missing
		return m
	}
	m["value"] = fmtBig(c.Value, d)
	if c.Err != nil {
		m["error"] = fmtErr(c.Err)
	} else {
		m["error_note"] = "not estimated: " + c.ErrNote
	}
	return m
}

// texUncertain is a table cell for LaTeX.
func texUncertain(c expansion.TableCell, d int) string {
	switch {
	case c.Failed:
		return "failed"
	case c.Value == nil:
		return "---"
	case c.Err == nil:
		return fmtBig(c.Value, d) + " (" + c.ErrNote + ")"
	}
	return "$" + fmtUncertain(c.Value, c.Err, d) + "$"
}

// fmtUncertain prints value(error) with the value rounded to its error:
// the error rounded up to one significant digit (two when that digit
// would be 1), the value to the same decimal place, e.g. 0.0070931(5) or
// 3.7735(12); never more than maxDigits significant digits of the value
// (the error is then stated in units of its last digit, at least 1).
// Numbers below 1e-4 or from 1e7 up are written as m(e)\times 10^{k}.
func fmtUncertain(v, e *big.Float, maxDigits int) string {
	ef, _ := new(big.Float).Abs(e).Float64()
	vf, _ := v.Float64()
	if !(ef > 0) || math.IsInf(ef, 0) {
		return fmtBig(v, maxDigits)
	}
	// Very small or large numbers: m(e)\times 10^{k}.
	if mag := math.Max(math.Abs(vf), ef); mag < 1e-4 || mag >= 1e7 {
		k := int(math.Floor(math.Log10(mag)))
		s := pow10(absInt(k), v.Prec()+64)
		vs := new(big.Float).SetPrec(v.Prec() + 64)
		es := new(big.Float).SetPrec(64)
		if k < 0 {
			vs.Mul(v, s)
			es.Mul(e, s)
		} else {
			vs.Quo(v, s)
			es.Quo(e, s)
		}
		return fmt.Sprintf(`%s\times 10^{%d}`, fmtUncertain(vs, es, maxDigits), k)
	}
	// Decimal place of the error's leading digit.
	p := int(math.Floor(math.Log10(ef)))
	lead := ef / math.Pow(10, float64(p))
	if lead < 2 { // leading digit 1: keep two digits
		p--
	}
	// The value's leading place limits the digits shown.
	if vf != 0 {
		vp := int(math.Floor(math.Log10(math.Abs(vf))))
		p = max(p, vp-maxDigits+1)
	}
	units := math.Ceil(ef/math.Pow(10, float64(p)) - 1e-9)
	if units < 1 {
		units = 1
	}
	// Round the value to place p exactly (big arithmetic).
	scale := new(big.Float).SetPrec(v.Prec() + 64)
	pow := pow10(absInt(p), v.Prec()+64)
	if p < 0 {
		scale.Mul(v, pow)
	} else {
		scale.Quo(v, pow)
	}
	n := roundBig(scale) // value in units of 10^p
	digits := n.String()
	neg := strings.HasPrefix(digits, "-")
	digits = strings.TrimPrefix(digits, "-")
	u := strconv.FormatInt(int64(units), 10)
	sign := ""
	if neg {
		sign = "-"
	}
	if p >= 0 {
		return sign + digits + strings.Repeat("0", p) + "(" + u + strings.Repeat("0", p) + ")"
	}
	k := -p
	if len(digits) <= k {
		digits = strings.Repeat("0", k-len(digits)+1) + digits
	}
	return sign + digits[:len(digits)-k] + "." + digits[len(digits)-k:] + "(" + u + ")"
}

// pow10 is 10^n (n >= 0), exact while it fits prec bits.
func pow10(n int, prec uint) *big.Float {
	p := new(big.Int).Exp(big.NewInt(10), big.NewInt(int64(n)), nil)
	return new(big.Float).SetPrec(prec).SetInt(p)
}

// roundBig rounds x to the nearest integer (halves away from zero).
func roundBig(x *big.Float) *big.Int {
	h := new(big.Float).SetPrec(x.Prec()).Abs(x)
	h.Add(h, big.NewFloat(0.5))
	n, _ := h.Int(nil)
	if x.Sign() < 0 {
		n.Neg(n)
	}
	return n
}

func absInt(n int) int {
	if n < 0 {
		return -n
	}
	return n
}

// maxQPoints bounds the length of a --q list.
const maxQPoints = 100000

// parseQList reads --q: comma-separated items, each a number >= 2, inf, a
// range a..b:step (arithmetic, b included when reached) or a..b:*f
// (geometric, f > 1). Arithmetic points are rounded to the decimals of a
// and step, geometric ones to 12 significant digits, so that the printed q
// is the q computed at.
func parseQList(text string) ([]conformal.QPoint, error) {
	var out []conformal.QPoint
	if strings.TrimSpace(text) == "" {
		return nil, usageErr("--q is empty: give a list 3,4,6, a range 2.5..20:0.5, a geometric range 2.5..1000:*1.25, or inf")
	}
	for _, item := range strings.Split(text, ",") {
		item = strings.TrimSpace(item)
		if a, rest, ok := strings.Cut(item, ".."); ok {
			pts, err := parseQRange(item, a, rest)
			if err != nil {
				return nil, err
			}
			out = append(out, pts...)
		} else {
			q, err := conformal.ParseQ(item, 256)
			if err != nil {
				return nil, usageErr("--q %q: %v", item, err)
			}
			out = append(out, q)
		}
		if len(out) > maxQPoints {
			return nil, usageErr("--q %q gives more than %d points", text, maxQPoints)
		}
	}
	return out, nil
}

// decimals counts the digits after the decimal point of a plain decimal.
func decimals(s string) int {
	s = strings.TrimSpace(s)
	if strings.ContainsAny(s, "eE") {
		return -1
	}
	if _, frac, ok := strings.Cut(s, "."); ok {
		return len(frac)
	}
	return 0
}

func parseQRange(item, a, rest string) ([]conformal.QPoint, error) {
	bad := func(why string) error {
		return usageErr("--q %q: %s (a range is a..b:step or a..b:*factor, e.g. 2.5..20:0.5 or 2.5..1000:*1.25)", item, why)
	}
	b, step, ok := strings.Cut(rest, ":")
	if !ok {
		return nil, bad("no step")
	}
	lo, err1 := strconv.ParseFloat(strings.TrimSpace(a), 64)
	hi, err2 := strconv.ParseFloat(strings.TrimSpace(b), 64)
	if err1 != nil || err2 != nil || math.IsNaN(lo) || math.IsNaN(hi) {
		return nil, bad("the ends must be finite numbers")
	}
	if math.IsInf(lo, 0) || math.IsInf(hi, 0) {
		return nil, bad("a range must have finite ends (add inf as a separate item)")
	}
	if lo < 2 {
		return nil, bad("q must be >= 2")
	}
	if hi < lo {
		return nil, bad("the range is empty (the first end exceeds the last)")
	}
	step = strings.TrimSpace(step)
	var vals []float64
	if f, isGeo := strings.CutPrefix(step, "*"); isGeo {
		fac, err := strconv.ParseFloat(strings.TrimSpace(f), 64)
		if err != nil || math.IsNaN(fac) || math.IsInf(fac, 0) || fac <= 1 {
			return nil, bad("the factor must be a number > 1")
		}
		n := int(math.Floor(math.Log(hi/lo)/math.Log(fac)*(1+1e-12))) + 1
		if n > maxQPoints {
			return nil, bad(fmt.Sprintf("more than %d points", maxQPoints))
		}
		for i := 0; i < n; i++ {
			v, _ := strconv.ParseFloat(strconv.FormatFloat(lo*math.Pow(fac, float64(i)), 'g', 12, 64), 64)
			vals = append(vals, v)
		}
	} else {
		st, err := strconv.ParseFloat(step, 64)
		if err != nil || math.IsNaN(st) || math.IsInf(st, 0) || st <= 0 {
			return nil, bad("the step must be a positive number")
		}
		span := (hi - lo) / st
		if span > maxQPoints {
			return nil, bad(fmt.Sprintf("more than %d points", maxQPoints))
		}
		n := int(math.Floor(span*(1+1e-12)+1e-9)) + 1
		dec := max(decimals(a), decimals(step))
		for i := 0; i < n; i++ {
			v := lo + float64(i)*st
			if dec >= 0 {
				v, _ = strconv.ParseFloat(strconv.FormatFloat(v, 'f', dec, 64), 64)
			}
			vals = append(vals, v)
		}
	}
	var out []conformal.QPoint
	for _, v := range vals {
		q, err := conformal.ParseQ(strconv.FormatFloat(v, 'g', -1, 64), 256)
		if err != nil {
			return nil, bad(err.Error())
		}
		out = append(out, q)
	}
	return out, nil
}
