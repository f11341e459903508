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
func emit(cmd *cobra.Command, out *Output) error {
	return render(cmd.OutOrStdout(), opts.Format, out)
}

func render(w io.Writer, format string, out *Output) error {
	switch format {
	case "json":
		enc := json.NewEncoder(w)
		enc.SetIndent("", "  ")
		return enc.Encode(out.JSON)
	case "csv":
		return renderCSV(w, out)
	case "tex":
		return renderTeX(w, out)
	default:
		return renderText(w, out)
	}
}

func renderText(w io.Writer, out *Output) error {
	for i, t := range out.Tables {
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

func renderCSV(w io.Writer, out *Output) error {
	for _, n := range out.Notes {
		fmt.Fprintln(w, "# "+n)
	}
	cw := csv.NewWriter(w)
	for i, t := range out.Tables {
		if i > 0 || len(out.Notes) > 0 {
			cw.Flush()
			fmt.Fprintln(w)
		}
		if t.Title != "" {
			cw.Flush()
			fmt.Fprintln(w, "# "+t.Title)
		}
		if err := cw.Write(t.Header); err != nil {
			return err
		}
		if err := cw.WriteAll(t.Rows); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// texEscape makes a cell safe inside a LaTeX tabular.
func texEscape(s string) string {
	r := strings.NewReplacer(`\`, `\textbackslash{}`, "&", `\&`, "%", `\%`, "#", `\#`, "_", `\_`, "{", `\{`, "}", `\}`, "^", `\^{}`, "~", `\~{}`, "$", `\$`)
	return r.Replace(s)
}

// texCell leaves cells that are already LaTeX math (wrapped in $...$) alone.
func texCell(s string) string {
	if len(s) >= 2 && strings.HasPrefix(s, "$") && strings.HasSuffix(s, "$") {
		return s
	}
	return texEscape(s)
}

func renderTeX(w io.Writer, out *Output) error {
	for _, n := range out.Notes {
		fmt.Fprintln(w, "% "+n)
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
			fmt.Fprintf(w, "\\caption{%s}\n", texEscape(t.Title))
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

// fmtErr formats an error estimate with 2 significant digits.
func fmtErr(x *big.Float) string {
	if x == nil {
		return ""
	}
	return new(big.Float).Abs(x).Text('e', 1)
}

// fmtValue formats a computed value; one no larger than its own error
// estimate is printed as 0 (it is zero to the accuracy known).
func fmtValue(x, err *big.Float, digits int) string {
	if err != nil && new(big.Float).Abs(x).Cmp(err) <= 0 {
		return "0"
	}
	return fmtBig(x, digits)
}
