package main

import (
	"bufio"
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/numeric"
)

var solveFlags struct {
	Q, Beta float64
	Points  int
	Tol     float64
	Out     string
}

var solveCmd = &cobra.Command{
	Use:   "solve",
	Short: "Solve the large-N Schwinger-Dyson equations at one q and temperature: log Z, E, S with errors",
	Long: `solve finds G(tau) from the imaginary-time Schwinger-Dyson equations at
interaction order q and inverse temperature beta (units script-J = 1), on three
nested grids, and Richardson-extrapolates log Z, E and S = log Z + beta E to
zero grid spacing. Each number carries an error estimate; E is checked against
-d log Z / d beta and the mismatch reported. --out writes G(tau) on the finest
grid (tau in [0, beta/2]; G(beta - tau) = G(tau)) as CSV or JSON by extension.
With --units J, --beta is beta J (solved at beta script-J = beta J
sqrt(q/2^(q-1))), E and -d log Z/d beta are printed in units of J and tau
in units 1/J; log Z and S are pure numbers.`,
	Args: cobra.NoArgs,
	RunE: runSolve,
}

func init() {
	f := solveCmd.Flags()
	f.Float64Var(&solveFlags.Q, "q", 4, "interaction order q (real, >= 2)")
	f.Float64Var(&solveFlags.Beta, "beta", 10, "inverse temperature beta*script-J (> 0)")
	f.IntVar(&solveFlags.Points, "points", 0, fmt.Sprintf("grid points on [0, beta) of the finest grid: a power of two in [%d, %d]; 0 = automatic (spacing <= 1/32)", numeric.MinPoints, numeric.MaxPoints))
	f.Float64Var(&solveFlags.Tol, "tol", numeric.DefaultTol, "residual tolerance of the fixed-point iteration (> 0)")
	f.StringVar(&solveFlags.Out, "out", "", "write G(tau) to this file (.csv or .json)")
	rootCmd.AddCommand(solveCmd)
}

// solvePointsPerBeta is the grid density the automatic grid keeps
// (numeric.DefaultPoints), and maxSolveBeta the largest beta it reaches.
const (
	solvePointsPerBeta = 32
	maxSolveBeta       = float64(numeric.MaxPoints) / solvePointsPerBeta
)

// fmtErr64 formats an error estimate with two significant digits.
func fmtErr64(x float64) string {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return notEstimated
	}
	return strconv.FormatFloat(math.Abs(x), 'e', 1, 64)
}

// fmtResidual prints a reached residual; 0 means the iteration reproduced
// itself to the last bit (it is a measured value, not an error estimate).
func fmtResidual(x float64) string {
	if x == 0 {
		return "0, a fixed point to the last bit"
	}
	return fmtErr64(x)
}

// checkSolveInput rejects bad flags with a one-line usage error.
func checkSolveInput(q, beta float64, points int, tol float64, out string, outGiven bool) error {
	switch {
	case math.IsNaN(q) || q < 2 || math.IsInf(q, 0):
		return usageErr("--q must be a real number >= 2 (got %g)", q)
	case math.IsNaN(beta) || beta <= 0 || math.IsInf(beta, 0):
		return usageErr("--beta must be positive and finite (got %g)", beta)
	case beta > maxSolveBeta:
		return usageErr("--beta %g is beyond what one solve resolves: the finest grid has at most %d points and needs %d per unit of beta, so beta <= %g; for the T -> 0 limit use qbridge ground", beta, numeric.MaxPoints, solvePointsPerBeta, maxSolveBeta)
	case math.IsNaN(tol) || tol <= 0:
		return usageErr("--tol must be positive (got %g)", tol)
	case tol >= 1e-2:
		return usageErr("--tol must be below 1e-2 (got %g)", tol)
	}
	if points != 0 {
		if err := numeric.ValidatePoints(points); err != nil {
			return usageErr("--points: %v", err)
		}
		if float64(points) < 2*beta {
			return usageErr("--points %d is too coarse for beta %g: need at least 2 points per unit of beta (try %d)", points, beta, numeric.DefaultPoints(beta))
		}
	}
	if outGiven && strings.TrimSpace(out) == "" {
		return usageErr("--out needs a file name ending in .csv or .json")
	}
	if out != "" {
		switch strings.ToLower(filepath.Ext(out)) {
		case ".csv", ".json":
		default:
			return usageErr("--out %q: the file name must end in .csv or .json", out)
		}
		if fi, err := os.Stat(filepath.Dir(out)); err != nil || !fi.IsDir() {
			return usageErr("--out %q: the directory %q does not exist", out, filepath.Dir(out))
		}
	}
	return nil
}

func runSolve(cmd *cobra.Command, args []string) error {
	fl := solveFlags
	given := fl.Beta
	if !math.IsNaN(fl.Q) && fl.Q >= 2 && !math.IsInf(fl.Q, 0) {
		fl.Beta = opts.units.BetaScriptJ(fl.Beta, fl.Q) // beta J -> beta script-J
	}
	if err := checkSolveInput(fl.Q, fl.Beta, fl.Points, fl.Tol, fl.Out, cmd.Flags().Changed("out")); err != nil {
		return err
	}
	pr := newProgress(cmd, "solve")
	sol, err := numeric.Solve(numeric.Params{Q: fl.Q, Beta: fl.Beta, Points: fl.Points, Tol: fl.Tol, Progress: pr.Update})
	pr.Done()
	if errors.Is(err, numeric.ErrInput) {
		return usageErr("%v", err)
	}
	if err != nil {
		return err
	}
	if fl.Out != "" {
		if err := writeG(fl.Out, sol.Levels[0]); err != nil {
			return err
		}
	}
	return emit(cmd, solveOutput(sol, given))
}

// solveOutput formats a solution; beta is the inverse temperature as the
// user gave it (in the units of --units).
func solveOutput(sol *numeric.Solution, beta float64) *Output {
	d := opts.Digits
	// Units: energies times fe = r in J units (expansion.Units); log Z and
	// S are pure numbers.
	fe, _ := opts.units.Factor(expansion.ScaleEnergy, sol.Q)
	bname := "beta*" + opts.units.String()
	fine := sol.Levels[0]
	grids := make([]int, len(sol.Levels))
	for i, lv := range sol.Levels {
		grids[i] = lv.Points
	}
	js := map[string]any{
		"q": fmtG(sol.Q), "beta": fmtG(beta),
		"logZ": fmtFloat(sol.LogZ, d), "logZ_err": fmtErr64(sol.LogZErr),
		"E": fmtFloat(sol.E*fe, d), "E_err": fmtErr64(sol.EErr * fe),
		"S": fmtFloat(sol.S, d), "S_err": fmtErr64(sol.SErr),
		"grids":      grids,
		"iterations": sol.Iterations,
		"residual":   strconv.FormatFloat(fine.Residual, 'e', 1, 64),
		"tol":        fmtErr64(sol.Tol),
		"units":      unitsStatement(),
	}
	if inJ() {
		js["beta_script_J"] = fmtG(sol.Beta)
	}
	rows := [][]string{
		{"log Z / N", fmtFloat(sol.LogZ, d), fmtErr64(sol.LogZErr)},
		{"E / N", fmtFloat(sol.E*fe, d), fmtErr64(sol.EErr * fe)},
		{"S / N", fmtFloat(sol.S, d), fmtErr64(sol.SErr)},
	}
	if sol.Checked {
		js["dlogZ"] = fmtFloat(sol.DLogZ*fe, d)
		js["mismatch"] = fmtFloat(sol.Mismatch*fe, 3)
		js["mismatch_err"] = fmtErr64(sol.MismatchErr * fe)
		rows = append(rows, []string{"-d log Z/d beta", fmtFloat(sol.DLogZ*fe, d), fmtErr64(sol.MismatchErr * fe)})
	}
	notes := []string{
		fmt.Sprintf("large-N SD equations at q = %s, %s = %s (beta*script-J = %s), %s", fmtG(sol.Q), bname, fmtG(beta), fmtG(sol.Beta), unitsNote()),
		fmt.Sprintf("sine-transform solver, tails 1/w and 1/w^3 subtracted analytically, Anderson-accelerated iteration to residual %s (reached %s, %d iterations in all)", fmtErr64(sol.Tol), fmtResidual(fine.Residual), sol.Iterations),
		fmt.Sprintf("grids of %v points on [0, beta), Richardson extrapolation in h^4, h^6; error = size of the last correction + tolerance effect", grids),
	}
	if sol.Checked {
		notes = append(notes, fmt.Sprintf("check: E - (-d log Z/d beta) = %s (estimated uncertainty %s)", fmtFloat(sol.Mismatch*fe, 3), fmtErr64(sol.MismatchErr*fe)))
	}
	return &Output{
		JSON: js,
		Tables: []Table{{
			Title:  fmt.Sprintf("SYK q = %s, %s = %s (%s)", fmtG(sol.Q), bname, fmtG(beta), unitsStatement()),
			Header: []string{"quantity", "value", "error"},
			Rows:   rows,
		}},
		Notes: notes,
	}
}

// writeG writes G(tau) of one grid as CSV (tau,G) or JSON by the file's
// extension, tau and beta in the units of --units (times 1/r = J/script-J
// in J units; G is a pure number).
func writeG(path string, lv *numeric.Level) error {
	ft, _ := opts.units.Factor(expansion.ScaleInverseEnergy, lv.Q)
	tau := make([]float64, len(lv.Tau))
	for k, t := range lv.Tau {
		tau[k] = t * ft
	}
	f, err := os.Create(path)
	if err != nil {
		return err
	}
	switch strings.ToLower(filepath.Ext(path)) {
	case ".json":
		err = json.NewEncoder(f).Encode(map[string]any{
			"q": lv.Q, "beta": lv.Beta * ft, "points": lv.Points,
			"note":  "G(beta - tau) = G(tau); tau in [0, beta/2]",
			"units": unitsStatement(),
			"tau":   tau, "G": lv.G,
		})
	default:
		w := bufio.NewWriter(f)
		fmt.Fprintf(w, "# q=%g beta=%g points=%d units: %s; G(beta-tau)=G(tau)\ntau,G\n", lv.Q, lv.Beta*ft, lv.Points, unitsStatement())
		for k := range tau {
			fmt.Fprintf(w, "%s,%s\n", strconv.FormatFloat(tau[k], 'g', 17, 64), strconv.FormatFloat(lv.G[k], 'g', 17, 64))
		}
		err = w.Flush()
	}
	if cerr := f.Close(); err == nil {
		err = cerr
	}
	return err
}

// fmtG formats an input parameter exactly as the shortest decimal that round-trips.
func fmtG(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }
