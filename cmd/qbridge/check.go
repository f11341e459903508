package main

import (
	"bufio"
	"errors"
	"fmt"
	"math"
	"math/big"
	"os"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/claim"
	"qbridge/expansion/conformal"
)

var checkFlags struct {
	around string
	order  int
	q      string
	tol    string
	file   string
}

// claimFailed is returned when a claim was computed and does not hold: the
// tables are already printed, so main exits with status 1 without a
// further message.
type claimFailed struct {
	// Failed and Total count the failing and the checked claims (one claim
	// checked at both ends counts twice).
	Failed, Total int
}

func (e *claimFailed) Error() string {
	return fmt.Sprintf("check: %d of %d checks fail", e.Failed, e.Total)
}

var checkCmd = &cobra.Command{
	Use:   "check 'LHS = RHS'",
	Short: "Check an analytic claim order by order against the computed expansions",
	Long: `Expand both sides of a claim around one end of the q axis and compare them
coefficient by coefficient:
  qbridge check 'h_1 = 4 - (5/6)*eps^2 + O(eps^4)'
  qbridge check 'q^2*E_0 = -1 + O(1/q)'
The language: numbers (5, 0.25, 5/6 is read as the rational), + - * / ^ and
parentheses, multiplication always written with *; the constant pi and
zeta(n) (integer n >= 2); sqrt, exp, log, sin, cos, tan, Gamma, psi; the
variables q, eps = 1 - 2/q and x = 1/q (each usable around either end); the
quantities h_1, h_2, ..., b, S_0, E_0, alpha_S, alpha_G, alpha_K (and their aliases);
the exact high-temperature coefficients (qbridge hightemp) logz_p, energy_p,
entropy_p, heat_p (of (beta script-J)^p), kappa_n (the cumulant kappa_n/N)
and mu_n (the moment), exact polynomials in 1/q; and the
order term O(eps^k), O(x^k) or O(1/q^k), which names the end and the order
the claim is made to. Without an O() term the claim's variable names the end
(with none, both ends are checked) and --order (default 6) the order.
Each coefficient of LHS - RHS is printed with its propagated error, its size
in standard errors, and whether it agrees: |difference| <= max(3 error, tol).
With --q the two sides are also evaluated at each q (exact values of h_n, b,
S_0; the two-point Pade of E_0 and alpha_S), O() terms left out.
--file FILE checks one claim per line (# starts a comment) and prints one row
per claim.
Exit status: 0 the claim holds, 1 it fails (or could not be computed), 2 a
malformed claim or bad flags. Claims are in script-J units (--units J is
refused).`,
	Example: `  qbridge check 'h_1 = 4 - (5/6)*eps^2 + O(eps^4)'
  qbridge check 'alpha_S = 1/(4*q^2) + O(1/q^3)' --format json
  qbridge check 'h_1 = 4 - (5/6)*eps^2 + O(eps^4)' --q 3,4
  qbridge check --file claims.txt`,
	Args: cobra.ArbitraryArgs,
	RunE: runCheck,
}

// checkSettings are the validated flags.
type checkSettings struct {
	around *conformal.End
	order  int
	tol    *big.Float
	qs     []conformal.QPoint
}

func parseCheckFlags(cmd *cobra.Command) (*checkSettings, error) {
	s := &checkSettings{order: -1}
	if cmd.Flags().Changed("around") {
		end, err := parseEnd(checkFlags.around)
		if err != nil {
			return nil, err
		}
		s.around = &end
	}
	if cmd.Flags().Changed("order") {
		if checkFlags.order < 0 || checkFlags.order > conformal.MaxOrder {
			return nil, usageErr("--order must be between 0 and %d (got %d)", conformal.MaxOrder, checkFlags.order)
		}
		s.order = checkFlags.order
	}
	tol, err := strconv.ParseFloat(strings.TrimSpace(checkFlags.tol), 64)
	if err != nil || math.IsNaN(tol) || math.IsInf(tol, 0) || tol < 0 {
		return nil, usageErr("--tol must be a finite number >= 0 (got %q)", checkFlags.tol)
	}
	s.tol = big.NewFloat(tol)
	if cmd.Flags().Changed("q") {
		for _, part := range strings.Split(checkFlags.q, ",") {
			q, err := parseQFlag(part)
			if err != nil {
				return nil, err
			}
			if q.Inf {
				return nil, usageErr("--q takes finite values (at q = inf the expansion around inf is the claim itself)")
			}
			s.qs = append(s.qs, q)
		}
	}
	return s, nil
}

// claimLine is one claim to check: its text and, from a file, its line.
type claimLine struct {
	line int
	text string
}

// checkRun is what became of one claim.
type checkRun struct {
	claimLine
	// malformed or failed says why there are no results (a fault of the
	// claim, or a computation that failed).
	malformed, failed error
	plan              *claim.Plan
	results           []*claim.Result
	values            []*claim.PointValue
}

func readClaims(path string) ([]claimLine, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, usageErr("--file: %v", err)
	}
	defer f.Close()
	var out []claimLine
	sc := bufio.NewScanner(f)
	for n := 1; sc.Scan(); n++ {
		text, _, _ := strings.Cut(sc.Text(), "#")
		if text = strings.TrimSpace(text); text != "" {
			out = append(out, claimLine{n, text})
		}
	}
	if err := sc.Err(); err != nil {
		return nil, fmt.Errorf("--file %s: %v", path, err)
	}
	if len(out) == 0 {
		return nil, usageErr("--file %s holds no claim (one claim per line; # starts a comment)", path)
	}
	return out, nil
}

func runCheck(cmd *cobra.Command, args []string) error {
	if inJ() {
		return usageErr("check compares claims with the series in script-J units (in J units the energies have no series in 1/q: sqrt(q/2^(q-1)) is essential at q = inf); drop --units J and write the factor into the claim if you need it")
	}
	s, err := parseCheckFlags(cmd)
	if err != nil {
		return err
	}
	var lines []claimLine
	switch {
	case checkFlags.file != "" && len(args) > 0:
		return usageErr("give one claim as the argument or --file FILE, not both")
	case checkFlags.file != "":
		if lines, err = readClaims(checkFlags.file); err != nil {
			return err
		}
	case len(args) == 0:
		return usageErr("name a claim, e.g. qbridge check 'h_1 = 4 - (5/6)*eps^2 + O(eps^4)', or --file FILE")
	default:
		// An unquoted claim arrives in pieces: h_1 = 4 - ...
		lines = []claimLine{{0, strings.Join(args, " ")}}
	}
	pr := newProgress(cmd, "check")
	defer pr.Done()
	ev := claim.NewEvaluator(workDigits())
	ev.Progress = pr.Update
	var runs []*checkRun
	for _, l := range lines {
		r := checkOne(ev, l, s)
		if checkFlags.file == "" {
			if r.malformed != nil {
				return usageErr("check: %v", r.malformed)
			}
			if r.failed != nil {
				return fmt.Errorf("check: %v", r.failed)
			}
		}
		runs = append(runs, r)
	}
	pr.Done()
	var out *Output
	if checkFlags.file == "" {
		out = checkOutput(runs[0], s)
	} else {
		out = checkFileOutput(runs, s)
	}
	if err := emit(cmd, out); err != nil {
		return err
	}
	return checkStatus(runs)
}

// checkOne parses, plans, checks and evaluates one claim. Faults of the
// claim (and requests the quantities refuse) are malformed; other errors
// are failed computations.
func checkOne(ev *claim.Evaluator, l claimLine, s *checkSettings) *checkRun {
	r := &checkRun{claimLine: l}
	sort := func(err error) *checkRun {
		var ce *claim.Error
		if errors.As(err, &ce) || errors.Is(err, expansion.ErrInput) {
			r.malformed = err
		} else {
			r.failed = err
		}
		return r
	}
	c, err := claim.Parse(l.text)
	if err != nil {
		return sort(err)
	}
	if r.plan, err = c.Plan(s.around, s.order); err != nil {
		return sort(err)
	}
	for _, end := range r.plan.Ends {
		res, err := ev.Check(c, end, r.plan.Order, s.tol)
		if err != nil {
			return sort(err)
		}
		r.results = append(r.results, res)
	}
	for _, q := range s.qs {
		v, err := ev.At(c, q.Q)
		if err != nil {
			return sort(err)
		}
		r.values = append(r.values, v)
	}
	return r
}

// checkStatus turns the runs into the exit status: 2 when a claim was
// malformed, 1 when one failed or could not be computed, else 0.
func checkStatus(runs []*checkRun) error {
	var malformed, failed []string
	fails, total := 0, 0
	for _, r := range runs {
		switch {
		case r.malformed != nil:
			malformed = append(malformed, strconv.Itoa(r.line))
		case r.failed != nil:
			failed = append(failed, strconv.Itoa(r.line))
		}
		for _, res := range r.results {
			total++
			if !res.Holds() {
				fails++
			}
		}
	}
	if len(malformed) > 0 {
		return usageErr("check: %s: %d malformed claim(s), line %s", checkFlags.file, len(malformed), strings.Join(malformed, ", "))
	}
	if len(failed) > 0 {
		return fmt.Errorf("check: %s: %d claim(s) could not be computed, line %s", checkFlags.file, len(failed), strings.Join(failed, ", "))
	}
	if fails > 0 {
		return &claimFailed{Failed: fails, Total: total}
	}
	return nil
}

// checkNotes are the notes every check output carries.
func checkNotes(s *checkSettings, prec string) []string {
	tol := "0"
	if s.tol.Sign() > 0 {
		tol = s.tol.Text('g', 6)
	}
	return []string{
		"agrees: |LHS - RHS| <= max(3 error, tol), tol = " + tol + " (--tol)",
		"errors: the coefficient errors of the quantities (two working precisions for h_n, b, S_0; the low-temperature fits for E_0, alpha_S and, through exact factors, alpha_G, alpha_K), propagated coefficient-wise to first order through every operation, plus the rounding at " + prec + "; numbers, pi, zeta(n), q, eps and x are exact",
		"sigma = |LHS - RHS| / error; an error of \"exact\" marks an exact zero that no inexact input or rounding reaches",
	}
}

// orderRows formats the comparison of one end.
func orderRows(res *claim.Result) (Table, []map[string]any) {
	v := res.End.Variable()
	tab := Table{
		Title:  fmt.Sprintf("%s around q = %s: coefficients of %s^k in LHS - RHS", res.Claim, res.End, v),
		Header: []string{"k", "LHS - RHS", "error", "sigma", "agrees"},
	}
	var js []map[string]any
	for _, o := range res.Orders {
		d, e, sg := orderCells(o)
		agrees := "yes"
		if !o.Agrees {
			agrees = "NO"
		}
		tab.Rows = append(tab.Rows, []string{strconv.Itoa(o.K), d, orExact(e), orDash(sg), agrees})
		js = append(js, map[string]any{"k": o.K, "difference": d, "error": nullable(e), "sigma": nullable(sg), "agrees": o.Agrees})
	}
	return tab, js
}

// orderCells formats one order: difference, error and sigma ("" for the
// last two at an exact zero).
func orderCells(o claim.OrderCheck) (d, e, sigma string) {
	s, ok := o.Sigma()
	if !ok {
		return fmtBig(o.Diff, opts.Digits), "", ""
	}
	return fmtValue(o.Diff, o.Err, claim.DiffDigits(o.Diff, o.Err, opts.Digits)), fmtErr(o.Err), claim.SigmaText(s)
}

func orExact(s string) string {
	if s == "" {
		return "exact"
	}
	return s
}

func orDash(s string) string {
	if s == "" {
		return "-"
	}
	return s
}

// nullable is nil (JSON null) for an empty string.
func nullable(s string) any {
	if s == "" {
		return nil
	}
	return s
}

// verdictText is the verdict of one end in words.
func verdictText(res *claim.Result) string {
	f := res.FirstDisagreement()
	if f == nil {
		return fmt.Sprintf("holds to order %d", res.Order)
	}
	d, e, s := orderCells(*f)
	if e == "" {
		return fmt.Sprintf("first fails at order %d: difference %s (exact)", f.K, d)
	}
	return fmt.Sprintf("first fails at order %d: difference %s +- %s (%s sigma)", f.K, d, e, s)
}

// ordersSpan prints the compared orders "0..3".
func ordersSpan(res *claim.Result) string {
	return fmt.Sprintf("%d..%d", res.Orders[0].K, res.Order)
}

// resultJSON is the document of one claim at one end.
func resultJSON(res *claim.Result, vals []map[string]any) map[string]any {
	_, orders := orderRows(res)
	doc := map[string]any{
		"claim":              res.Claim,
		"around":             res.End.String(),
		"variable":           res.End.Variable(),
		"order":              res.Order,
		"orders":             orders,
		"holds_to":           nil,
		"first_disagreement": nil,
		"values":             vals,
		"verdict":            verdictText(res),
	}
	if k, ok := res.HoldsTo(); ok {
		doc["holds_to"] = k
	}
	if f := res.FirstDisagreement(); f != nil {
		d, e, s := orderCells(*f)
		doc["first_disagreement"] = map[string]any{"k": f.K, "difference": d, "error": nullable(e), "sigma": nullable(s)}
	}
	return doc
}

// valueCells formats a value with its error ("exact" when zero).
func valueCells(v, e *big.Float) (string, string) {
	if e.Sign() == 0 {
		return fmtBig(v, opts.Digits), ""
	}
	return fmtBig(v, claim.DiffDigits(v, e, opts.Digits)), fmtErr(e)
}

// valuesRows formats the values at each q.
func valuesRows(vals []*claim.PointValue) ([][]string, []map[string]any) {
	var rows [][]string
	js := []map[string]any{}
	for _, v := range vals {
		q := v.Q.Text('g', 10)
		l, le := valueCells(v.LHS, v.LHSErr)
		r, re := valueCells(v.RHS, v.RHSErr)
		d, de := valueCells(v.Diff, v.DiffErr)
		rows = append(rows, []string{q, l, orExact(le), r, orExact(re), d, orExact(de)})
		js = append(js, map[string]any{"q": q, "lhs": l, "lhs_error": nullable(le), "rhs": r, "rhs_error": nullable(re), "difference": d, "error": nullable(de)})
	}
	return rows, js
}

var valuesHeader = []string{"q", "LHS", "error", "RHS", "error", "LHS - RHS", "error"}

// notes collects notes without repeats, in order.
type notes struct {
	list []string
	seen map[string]bool
}

func (n *notes) add(ss ...string) {
	if n.seen == nil {
		n.seen = map[string]bool{}
	}
	for _, s := range ss {
		if !n.seen[s] {
			n.seen[s] = true
			n.list = append(n.list, s)
		}
	}
}

func precNote() string {
	return fmt.Sprintf("%d digits", workDigits())
}

// checkOutput formats one claim: a table of orders per end, the verdict,
// and the values at each q.
func checkOutput(r *checkRun, s *checkSettings) *Output {
	out := &Output{}
	var ns notes
	ns.add(r.plan.Notes...)
	verdict := Table{Title: "verdict: " + r.text, Header: []string{"around", "orders", "verdict"}}
	rows, vals := valuesRows(r.values)
	var docs []map[string]any
	for _, res := range r.results {
		tab, _ := orderRows(res)
		out.Tables = append(out.Tables, tab)
		verdict.Rows = append(verdict.Rows, []string{res.End.String(), ordersSpan(res), verdictText(res)})
		docs = append(docs, resultJSON(res, vals))
		ns.add(res.Notes...)
	}
	out.Tables = append(out.Tables, verdict)
	if len(r.values) > 0 {
		out.Tables = append(out.Tables, Table{Title: "LHS and RHS at each q (O() terms left out)", Header: valuesHeader, Rows: rows})
		for _, v := range r.values {
			ns.add(v.Notes...)
		}
	}
	ns.add(checkNotes(s, precNote())...)
	ns.add("units: script-J = 1")
	out.Notes = ns.list
	if len(docs) == 1 {
		out.JSON = docs[0]
	} else {
		out.JSON = docs
	}
	return out
}

// checkFileOutput formats the claims of a file: one row per claim and end.
func checkFileOutput(runs []*checkRun, s *checkSettings) *Output {
	out := &Output{}
	var ns notes
	tab := Table{Title: "claims of " + checkFlags.file, Header: []string{"line", "claim", "around", "orders", "verdict"}}
	values := Table{Title: "LHS and RHS at each q (O() terms left out)", Header: append([]string{"line"}, valuesHeader...)}
	docs := []map[string]any{}
	for _, r := range runs {
		line := strconv.Itoa(r.line)
		switch {
		case r.malformed != nil:
			msg := r.malformed.Error()
			var ce *claim.Error
			if errors.As(r.malformed, &ce) {
				msg = ce.Short() // the vocabulary once, in the notes
				if ce.Hint != "" {
					ns.add(ce.Hint)
				}
			}
			tab.Rows = append(tab.Rows, []string{line, r.text, "", "", "malformed: " + msg})
			docs = append(docs, map[string]any{"line": r.line, "claim": r.text, "error": "malformed: " + msg})
			continue
		case r.failed != nil:
			tab.Rows = append(tab.Rows, []string{line, r.text, "", "", "not computed: " + r.failed.Error()})
			docs = append(docs, map[string]any{"line": r.line, "claim": r.text, "error": "not computed: " + r.failed.Error()})
			continue
		}
		rows, vals := valuesRows(r.values)
		for _, row := range rows {
			values.Rows = append(values.Rows, append([]string{line}, row...))
		}
		for _, res := range r.results {
			tab.Rows = append(tab.Rows, []string{line, r.text, res.End.String(), ordersSpan(res), verdictText(res)})
			doc := resultJSON(res, vals)
			doc["line"] = r.line
			docs = append(docs, doc)
			ns.add(res.Notes...)
		}
		for _, n := range r.plan.Notes {
			ns.add("line " + line + ": " + n)
		}
		for _, v := range r.values {
			ns.add(v.Notes...)
		}
	}
	out.Tables = []Table{tab}
	if len(s.qs) > 0 {
		out.Tables = append(out.Tables, values)
	}
	ns.add(checkNotes(s, precNote())...)
	ns.add("units: script-J = 1")
	out.Notes = ns.list
	out.JSON = docs
	return out
}

func init() {
	f := checkCmd.Flags()
	f.StringVar(&checkFlags.around, "around", "", "expansion point: 2 (in eps) or inf (in x = 1/q); default: the end the claim's O() term or variable names, else both")
	f.IntVar(&checkFlags.order, "order", claim.DefaultOrder, "highest power compared (default: one below the claim's O() term, else 6)")
	f.StringVar(&checkFlags.q, "q", "", "also evaluate both sides at these q: a comma list of numbers >= 2")
	f.StringVar(&checkFlags.tol, "tol", "0", "absolute tolerance: a coefficient agrees when |difference| <= max(3 error, tol)")
	f.StringVar(&checkFlags.file, "file", "", "check the claims of FILE, one a line (# starts a comment)")
	rootCmd.AddCommand(checkCmd)
}
