package main

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"github.com/spf13/cobra"

	"qbridge/numeric"
)

var groundFlags struct {
	Q, BetaMax, BetaMin float64
	Steps               int
}

var groundCmd = &cobra.Command{
	Use:   "ground",
	Short: "Low-temperature extraction of E_0, S_0 and alpha_S from a ladder of SD solves",
	Long: `ground solves the Schwinger-Dyson equations on a geometric ladder of beta
values (each solve started from the previous one, each Richardson-extrapolated in
the grid spacing) and fits E(T) = E_0 + 2 pi^2 alpha_S T^2 + ... and
S(T) = S_0 + 4 pi^2 alpha_S T + ... with correction terms T^p (p = 2, 3, 4,
h_1 - 1, h_1) over several windows and orders. Values are medians of the
accepted fits, errors half their spread. The exact S_0 (Kitaev's integral)
is printed beside the fitted one as a check. Units script-J = 1.`,
	Args: cobra.NoArgs,
	RunE: runGround,
}

func init() {
	f := groundCmd.Flags()
	f.Float64Var(&groundFlags.Q, "q", 4, "interaction order q (real, >= 2)")
	f.Float64Var(&groundFlags.BetaMax, "beta-max", 4000, "largest beta*script-J of the ladder")
	f.Float64Var(&groundFlags.BetaMin, "beta-min", 0, "smallest beta*script-J of the ladder (0 = beta-max/40)")
	f.IntVar(&groundFlags.Steps, "steps", 16, "number of beta values in the ladder (>= 8)")
	rootCmd.AddCommand(groundCmd)
}

func runGround(cmd *cobra.Command, args []string) error {
	fl := groundFlags
	switch {
	case math.IsNaN(fl.Q) || fl.Q < 2 || math.IsInf(fl.Q, 0):
		return usageErr("--q must be a real number >= 2 (got %g)", fl.Q)
	case math.IsNaN(fl.BetaMax) || fl.BetaMax <= 0 || math.IsInf(fl.BetaMax, 0):
		return usageErr("--beta-max must be positive and finite (got %g)", fl.BetaMax)
	case fl.BetaMax > 1e5:
		return usageErr("--beta-max %g is beyond the supported 1e5", fl.BetaMax)
	case fl.Steps < 8 || fl.Steps > 200:
		return usageErr("--steps must be between 8 and 200 (got %d)", fl.Steps)
	}
	if fl.BetaMin == 0 {
		fl.BetaMin = fl.BetaMax / 40
	}
	if !(fl.BetaMin > 0) || fl.BetaMin >= fl.BetaMax {
		return usageErr("--beta-min must be positive and below --beta-max (got %g)", fl.BetaMin)
	}
	pr := newProgress(cmd, "ground")
	lad, err := numeric.Ladder(numeric.LadderParams{Q: fl.Q, BetaMin: fl.BetaMin, BetaMax: fl.BetaMax, Steps: fl.Steps, Progress: pr.Update})
	pr.Done()
	if errors.Is(err, numeric.ErrInput) {
		return usageErr("%v", err)
	}
	if err != nil {
		return err
	}
	g, err := numeric.FitGround(fl.Q, lad)
	if err != nil {
		return err
	}
	return emit(cmd, groundOutput(g))
}

func groundOutput(g *numeric.Ground) *Output {
	d := opts.Digits
	type fitJSON struct {
		Quantity  string    `json:"quantity"`
		BetaMin   string    `json:"beta_min"`
		BetaMax   string    `json:"beta_max"`
		Exponents []float64 `json:"exponents"`
		Coef      []string  `json:"coef"`
		RMS       string    `json:"rms"`
		Accepted  bool      `json:"accepted"`
	}
	var fits []fitJSON
	var fitRows [][]string
	for _, f := range g.Fits {
		c := make([]string, len(f.Coef))
		for i, v := range f.Coef {
			c[i] = fmtFloat(v, 12)
		}
		fits = append(fits, fitJSON{f.Quantity, fmtFloat(f.BetaMin, 6), fmtFloat(f.BetaMax, 6), f.Exponents, c, fmtErr64(f.RMS), f.Accepted})
		exps := make([]string, len(f.Exponents))
		for i, e := range f.Exponents {
			exps[i] = fmtFloat(e, 5)
		}
		acc := "no"
		if f.Accepted {
			acc = "yes"
		}
		fitRows = append(fitRows, []string{f.Quantity, fmtFloat(f.BetaMin, 5) + ".." + fmtFloat(f.BetaMax, 5), strings.Join(exps, " "), fmtFloat(f.Coef[0], 14), fmtErr64(f.RMS), acc})
	}
	betas := make([]string, len(g.Ladder))
	for i, s := range g.Ladder {
		betas[i] = fmtFloat(s.Beta, 8)
	}
	js := map[string]any{
		"q":  fmtG(g.Q),
		"E0": fmtFloat(g.E0, d), "E0_err": fmtErr64(g.E0Err),
		"S0": fmtFloat(g.S0, d), "S0_err": fmtErr64(g.S0Err),
		"alphaS": fmtFloat(g.AlphaS, d), "alphaS_err": fmtErr64(g.AlphaSErr),
		"S0_exact": fmtFloat(g.S0Exact, d),
		"h1":       fmtFloat(g.H1, 12),
		"betas":    betas,
		"fits":     fits,
		"units":    "script-J = 1",
	}
	return &Output{
		JSON: js,
		Tables: []Table{
			{
				Title:  fmt.Sprintf("SYK q = %s, low-temperature extraction", fmtG(g.Q)),
				Header: []string{"quantity", "value", "error"},
				Rows: [][]string{
					{"E_0", fmtFloat(g.E0, d), fmtErr64(g.E0Err)},
					{"S_0 (fit)", fmtFloat(g.S0, d), fmtErr64(g.S0Err)},
					{"S_0 (exact)", fmtFloat(g.S0Exact, d), ""},
					{"alpha_S", fmtFloat(g.AlphaS, d), fmtErr64(g.AlphaSErr)},
				},
			},
			{Title: "fits (leading coefficient = E_0 or S_0)", Header: []string{"fit", "beta window", "powers of T", "leading", "rms", "accepted"}, Rows: fitRows},
		},
		Notes: []string{
			fmt.Sprintf("ladder of %d solves, beta*script-J from %s to %s, each Richardson-extrapolated in the grid spacing", len(g.Ladder), fmtFloat(g.Ladder[0].Beta, 6), fmtFloat(g.Ladder[len(g.Ladder)-1].Beta, 6)),
			fmt.Sprintf("correction powers from h_1 = %s; value = median of accepted fits, error = half their spread + largest data error", fmtFloat(g.H1, 8)),
			"S_0 (exact) = (1/2) log 2 - int_0^{1/q} pi (1/2 - x) tan(pi x) dx by Gauss-Legendre quadrature",
			"units script-J = 1",
		},
	}
}
