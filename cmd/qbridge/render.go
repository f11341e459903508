package main

import (
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"math/big"
	"strconv"
	"strings"
	"text/tabwriter"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"
)

// Output is what a command produces: one value for JSON and a set of tables
// for the text, CSV and LaTeX renderings. Notes say how the numbers were
// obtained (method, order, grid, precision).
type Output struct {
	// JSON is the document written by --format json.
	JSON any
	// Tables are written by the text, CSV and LaTeX formats.
	Tables []Table
	// Notes say how the numbers were obtained.
	Notes []string
}

// Table is a titled grid of already formatted cells.
type Table struct {
	// Title is printed above the table (a caption in LaTeX).
	Title string
	// Header names the columns.
	Header []string
	// Rows are the formatted cells, one slice per row.
	Rows [][]string
}

// emit writes out in the format chosen by --format.
// Render options beyond the format, set from the global flags.
type renderOpts struct {
	// Format is text, json, csv or tex.
	Format string
	// Wide prints text tables at full width instead of splitting them at
	// maxTextWidth columns.
	Wide bool
	// CSVTable selects which table (1-based) a CSV stream carries.
	CSVTable int
	// Command is the invocation written into JSON documents.
	Command string
	// Errw receives what must not mix with machine-readable output (CSV
	// notes, the list of further tables).
	Errw io.Writer
}

// maxTextWidth is the width text tables are split at without --wide.
const maxTextWidth = 100

func emit(cmd *cobra.Command, out *Output) error {
	return renderWith(cmd.OutOrStdout(), renderOpts{
		Format: opts.Format, Wide: opts.Wide, CSVTable: opts.CSVTable,
		Command: invocation(cmd), Errw: cmd.ErrOrStderr(),
	}, out)
}

// invocation reconstructs the command line: the command path, its
// arguments and every flag that was set, so a document says how to make it
// again.
func invocation(cmd *cobra.Command) string {
	parts := []string{cmd.CommandPath()}
	parts = append(parts, cmd.Flags().Args()...)
	cmd.Flags().Visit(func(f *pflag.Flag) {
		if f.Name == "format" || f.Name == "quiet" {
			return
		}
		parts = append(parts, "--"+f.Name+"="+f.Value.String())
	})
	return strings.Join(parts, " ")
}

// render writes out in one format with default options (tests, examples).
func render(w io.Writer, format string, out *Output) error {
	return renderWith(w, renderOpts{Format: format, CSVTable: 1, Command: "qbridge", Errw: io.Discard}, out)
}

func renderWith(w io.Writer, o renderOpts, out *Output) error {
	switch o.Format {
	case "json":
		doc, err := jsonDocument(out, o.Command)
		if err != nil {
			return err
		}
		enc := json.NewEncoder(w)
		enc.SetIndent("", "  ")
		return enc.Encode(doc)
	case "csv":
		return renderCSV(w, o, out)
	case "tex":
		return renderTeX(w, out)
	default:
		return renderText(w, o.Wide, out)
	}
}

// jsonDocument gives every JSON document one shape: numbers as decimal
// strings, value/error pairs with the suffix _error, canonical quantity
// names as keys, and the keys command, version, units and notes. A list
// of results goes under "results".
func jsonDocument(out *Output, command string) (map[string]any, error) {
	raw, err := json.Marshal(out.JSON)
	if err != nil {
		return nil, err
	}
	dec := json.NewDecoder(strings.NewReader(string(raw)))
	dec.UseNumber()
	var v any
	if err := dec.Decode(&v); err != nil {
		return nil, err
	}
	v = normaliseJSON(v)
	doc, ok := v.(map[string]any)
	if !ok {
		doc = map[string]any{"results": v}
	}
	doc["command"] = command
	doc["version"] = version
	if _, ok := doc["units"]; !ok {
		doc["units"] = unitsStatement()
	}
	notes := out.Notes
	if notes == nil {
		notes = []string{}
	}
	doc["notes"] = notes
	return doc, nil
}

// jsonKeys maps legacy spellings to the vocabulary.
var jsonKeys = map[string]string{"E0": "E_0", "S0": "S_0", "alphaS": "alpha_S", "S0_exact": "S_0_exact"}

func normaliseJSON(v any) any {
	switch t := v.(type) {
	case map[string]any:
		m := make(map[string]any, len(t))
		for k, x := range t {
			if base, ok := strings.CutSuffix(k, "_err"); ok {
				k = base + "_error"
			}
			base, isErr := strings.CutSuffix(k, "_error")
			if r, ok := jsonKeys[base]; ok {
				k = r
				if isErr {
					k += "_error"
				}
			}
			m[k] = normaliseJSON(x)
		}
		return m
	case []any:
		for i := range t {
			t[i] = normaliseJSON(t[i])
		}
		return t
	case json.Number:
		return t.String()
	case string:
		if t == notEstimated {
			return nil
		}
	}
	return v
}

// textWidth is the printed width of a table at the tabwriter's padding.
func textWidth(t Table) []int {
	w := make([]int, len(t.Header))
	for i, h := range t.Header {
		w[i] = len(h)
	}
	for _, r := range t.Rows {
		for i, c := range r {
			if i < len(w) && len(c) > w[i] {
				w[i] = len(c)
			}
		}
	}
	return w
}

// splitWide splits a table wider than maxTextWidth into several that each
// repeat the first column and fit.
func splitWide(t Table) []Table {
	w := textWidth(t)
	total := 0
	for _, x := range w {
		total += x + 2
	}
	if total <= maxTextWidth || len(w) < 3 {
		return []Table{t}
	}
	var out []Table
	for start := 1; start < len(w); {
		width := w[0] + 2
		end := start
		for end < len(w) && (end == start || width+w[end]+2 <= maxTextWidth) {
			width += w[end] + 2
			end++
		}
		part := Table{Title: t.Title, Header: append([]string{t.Header[0]}, t.Header[start:end]...)}
		if len(out) > 0 {
			part.Title = t.Title + " (continued)"
		}
		for _, r := range t.Rows {
			row := []string{r[0]}
			for i := start; i < end; i++ {
				if i < len(r) {
					row = append(row, r[i])
				} else {
					row = append(row, "")
				}
			}
			part.Rows = append(part.Rows, row)
		}
		out = append(out, part)
		start = end
	}
	return out
}

func renderText(w io.Writer, wide bool, out *Output) error {
	var tables []Table
	for _, t := range out.Tables {
		if wide {
			tables = append(tables, t)
		} else {
			tables = append(tables, splitWide(t)...)
		}
	}
	for i, t := range tables {
		if i > 0 {
			fmt.Fprintln(w)
		}
		if t.Title != "" {
			fmt.Fprintln(w, t.Title)
		}
		tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, strings.Join(t.Header, "\t"))
		for _, r := range t.Rows {
			fmt.Fprintln(tw, strings.Join(r, "\t"))
		}
		if err := tw.Flush(); err != nil {
			return err
		}
	}
	if len(out.Notes) > 0 {
		fmt.Fprintln(w)
		for _, n := range out.Notes {
			fmt.Fprintln(w, "note: "+n)
		}
	}
	return nil
}

// renderCSV writes one table (o.CSVTable, 1-based) as one header line and
// data lines; notes and the list of other tables go to o.Errw.
func renderCSV(w io.Writer, o renderOpts, out *Output) error {
	if len(out.Tables) == 0 {
		return fmt.Errorf("this command has no table to write as CSV (use --format json)")
	}
	k := o.CSVTable
	if k < 1 || k > len(out.Tables) {
		return usageErr("--csv-table %d: this output has %d table(s)", k, len(out.Tables))
	}
	for _, n := range out.Notes {
		fmt.Fprintln(o.Errw, "note: "+n)
	}
	if len(out.Tables) > 1 {
		for i, t := range out.Tables {
			mark := " "
			if i+1 == k {
				mark = "*"
			}
			fmt.Fprintf(o.Errw, "csv table %s%d: %s\n", mark, i+1, t.Title)
		}
		fmt.Fprintf(o.Errw, "wrote table %d of %d; --csv-table N selects another\n", k, len(out.Tables))
	}
	t := out.Tables[k-1]
	cw := csv.NewWriter(w)
	if err := cw.Write(t.Header); err != nil {
		return err
	}
	if err := cw.WriteAll(t.Rows); err != nil {
		return err
	}
	cw.Flush()
	return cw.Error()
}

// texEscape makes text safe inside a LaTeX tabular.
func texEscape(s string) string {
	r := strings.NewReplacer(`\`, `\textbackslash{}`, "&", `\&`, "%", `\%`, "#", `\#`, "_", `\_`, "{", `\{`, "}", `\}`, "^", `\^{}`, "~", `\~{}`, "$", `\$`)
	return r.Replace(s)
}

// texMath lists the words that are mathematics in qbridge's titles and
// headers, with their LaTeX forms.
var texMath = []struct{ word, tex string }{
	{"alpha_S", `$\alpha_S$`}, {"alpha_G", `$\alpha_G$`}, {"alpha_K", `$\alpha_K$`},
	{"eps^k", `$\epsilon^{k}$`}, {"x^k", `$x^{k}$`}, {"eps", `$\epsilon$`},
	{"S_0", `$S_0$`}, {"E_0", `$E_0$`}, {"h_n", `$h_n$`}, {"log Z", `$\log Z$`}, {"logZ", `$\log Z$`},
	{"1/q", `$1/q$`}, {"b^q", `$b^q$`}, {"script-J", `$\mathcal{J}$`}, {"pi", `$\pi$`},
}

// texText typesets a title or header: known mathematical words (h_1,
// alpha_S, eps^k, ...) become math, everything else is escaped.
func texText(s string) string {
	var b strings.Builder
	prevWord := false // the previous byte continues a word
	for i := 0; i < len(s); {
		if !prevWord {
			if m := hIndex(s[i:]); m > 0 {
				b.WriteString("$h_{" + s[i+2:i+m] + "}$")
				i += m
				prevWord = true
				continue
			}
			matched := false
			for _, t := range texMath {
				if strings.HasPrefix(s[i:], t.word) && wordEnds(s[i:], len(t.word)) {
					b.WriteString(t.tex)
					i += len(t.word)
					matched = true
					break
				}
			}
			if matched {
				prevWord = true
				continue
			}
		}
		b.WriteString(texEscape(s[i : i+1]))
		prevWord = !wordEnds(s[i:], 0)
		i++
	}
	return b.String()
}

// wordEnds reports that s[n:] does not continue the word.
func wordEnds(s string, n int) bool {
	if n >= len(s) {
		return true
	}
	c := s[n]
	return !(c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_')
}

// hIndex returns the end of a leading h_<digits>, or 0.
func hIndex(s string) int {
	if !strings.HasPrefix(s, "h_") {
		return 0
	}
	i := 2
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		i++
	}
	if i == 2 || !wordEnds(s, i) {
		return 0
	}
	return i
}

// texCell leaves cells that are already LaTeX math (wrapped in $...$) alone.
func texCell(s string) string {
	if len(s) >= 2 && strings.HasPrefix(s, "$") && strings.HasSuffix(s, "$") {
		return s
	}
	return texText(s)
}

func renderTeX(w io.Writer, out *Output) error {
	for _, n := range out.Notes {
		fmt.Fprintln(w, "% "+strings.ReplaceAll(n, "\n", " "))
	}
	for _, t := range out.Tables {
		fmt.Fprintln(w, `\begin{table}[ht]`)
		fmt.Fprintln(w, `\centering`)
		fmt.Fprintf(w, "\\begin{tabular}{%s}\n", strings.Repeat("l", len(t.Header)))
		fmt.Fprintln(w, `\hline`)
		hdr := make([]string, len(t.Header))
		for i, h := range t.Header {
			hdr[i] = texCell(h)
		}
		fmt.Fprintln(w, strings.Join(hdr, " & ")+` \\`)
		fmt.Fprintln(w, `\hline`)
		for _, r := range t.Rows {
			cells := make([]string, len(r))
			for i, c := range r {
				cells[i] = texCell(c)
			}
			fmt.Fprintln(w, strings.Join(cells, " & ")+` \\`)
		}
		fmt.Fprintln(w, `\hline`)
		fmt.Fprintln(w, `\end{tabular}`)
		if t.Title != "" {
			fmt.Fprintf(w, "\\caption{%s}\n", texText(t.Title))
		}
		fmt.Fprintln(w, `\end{table}`)
	}
	return nil
}

// fmtBig formats x with the given number of significant digits, in plain
// decimal notation when that is short and in e-notation otherwise.
func fmtBig(x *big.Float, digits int) string {
	if x == nil {
		return ""
	}
	if x.Sign() == 0 {
		return "0"
	}
	s := x.Text('e', digits-1)
	_, exp, _ := strings.Cut(s, "e")
	e, err := strconv.Atoi(exp)
	if err != nil || e < -5 || e >= digits+2 || e > 20 {
		return s
	}
	return x.Text('f', max(digits-1-e, 0))
}

// fmtFloat formats a float64 with the given significant digits (capped at 17).
func fmtFloat(x float64, digits int) string {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return fmt.Sprint(x)
	}
	if digits > 17 {
		digits = 17
	}
	return fmtBig(new(big.Float).SetFloat64(x), digits)
}

// notEstimated is printed where an error could not be estimated; JSON
// documents carry null there, and the notes say why.
const notEstimated = "not estimated"

// fmtErr formats an error estimate with 2 significant digits; a missing,
// zero or infinite error is "not estimated" (an error bar of zero or
// infinity would claim something untrue).
func fmtErr(x *big.Float) string {
	if x == nil || x.Sign() == 0 || x.IsInf() {
		return notEstimated
	}
	return new(big.Float).Abs(x).Text('e', 1)
}

// fmtValue formats a computed value; one no larger than its own error
// estimate keeps two significant digits (it is compatible with zero, but a
// bare 0 would read as an exact zero).
func fmtValue(x, err *big.Float, digits int) string {
	if err != nil && x.Sign() != 0 && new(big.Float).Abs(x).Cmp(err) <= 0 {
		return fmtBig(x, min(2, digits))
	}
	return fmtBig(x, digits)
}

// fmtKnown formats x with the significant digits its error supports (two
// past the first uncertain one, at least two, at most digits); without an
// error, with digits.
func fmtKnown(x, err *big.Float, digits int) string {
	if x == nil {
		return ""
	}
	if err == nil || err.Sign() == 0 || x.Sign() == 0 {
		return fmtBig(x, digits)
	}
	n := x.MantExp(nil) - err.MantExp(nil) // binary orders of magnitude
	return fmtBig(x, min(max(int(float64(n)*0.30103)+2, 2), digits))
}
