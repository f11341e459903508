package main

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"qbridge/expansion"
	"qbridge/expansion/energy"
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
the grid spacing) and fits one expansion
log Z = -beta E_0 + S_0 + 2 pi^2 alpha_S T + sum_k c_k T^{p_k}
(p_k = 2, h_1 - 1, 3, h_1, 4, ...) to log Z and E = -d log Z/d beta at once,
over several windows and orders. Values are medians of the accepted fits,
errors half their spread plus the typical statistical error. The exact S_0
(Kitaev's integral) is printed beside the fitted one as a check.
With the default ladder a last table gives the direct values that resum,
report and table print: per quantity the more accurate of this ladder and
the zero-temperature solve (alpha_G measured on G/G_c at T = 0,
alpha_S = alpha_K/(6 q^2 alpha_0); at q = 4 about 1e-12 against 5e-9).
Units script-J = 1; with --units J, E_0 is printed in units of J, alpha_S
as the coefficient of 1/J, and --beta-max, --beta-min are beta J (the
default ladder is the same in both units: its values are those of resum,
report and table --method direct). Values never carry more than 15 digits
(float64 solves).`,
	Args: cobra.NoArgs,
	RunE: runGround,
}

func init() {
	f := groundCmd.Flags()
	f.Float64Var(&groundFlags.Q, "q", 4, "interaction order q (real, >= 2)")
	f.Float64Var(&groundFlags.BetaMax, "beta-max", numeric.GroundBetaMax, "largest beta*script-J of the ladder")
	f.Float64Var(&groundFlags.BetaMin, "beta-min", 0, "smallest beta*script-J of the ladder (0 = beta-max/160)")
	f.IntVar(&groundFlags.Steps, "steps", numeric.GroundSteps, "number of beta values in the ladder (>= 8)")
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
	pr := newProgress(cmd, "ground")
	// --beta-max, --beta-min in J units are beta J: beta script-J =
	// beta J sqrt(q/2^(q-1)) (expansion.Units.BetaScriptJ). The default
	// ladder is GroundLadder(q, 0) in either units.
	bmax := 0.0
	if cmd.Flags().Changed("beta-max") {
		bmax = opts.units.BetaScriptJ(fl.BetaMax, fl.Q)
		if !(bmax > 0) || bmax > 1e5 {
			return usageErr("--beta-max %g is beta*script-J = %g, outside the supported (0, 1e5]", fl.BetaMax, bmax)
		}
	}
	lp := numeric.GroundLadder(fl.Q, bmax, pr.Update)
	if fl.BetaMin != 0 {
		lp.BetaMin = opts.units.BetaScriptJ(fl.BetaMin, fl.Q)
	}
	if !(lp.BetaMin > 0) || lp.BetaMin >= lp.BetaMax {
		return usageErr("--beta-min must be positive and below --beta-max (got %g)", fl.BetaMin)
	}
	lp.Steps = fl.Steps
	g, err := energy.Ground(lp)
	if errors.Is(err, numeric.ErrInput) {
		pr.Done()
		return usageErr("%v", err)
	}
	if err != nil {
		pr.Done()
		return err
	}
	// With the default ladder, also the direct values that resum, report
	// and table print (the more accurate of this ladder and the T = 0
	// route, energy.DirectGround).
	var d *energy.Direct
	if !cmd.Flags().Changed("beta-max") && !cmd.Flags().Changed("beta-min") && !cmd.Flags().Changed("steps") {
		d, err = energy.DirectGround(fl.Q, pr.Update)
		if err != nil {
			pr.Done()
			return err
		}
	}
	pr.Done()
	return emit(cmd, groundOutput(g, d))
}

func groundOutput(g *numeric.Ground, direct *energy.Direct) *Output {
	d := min(opts.Digits, 15) // float64 solves
	// Units (expansion.Units): E_0 times fe, alpha_S times fa, beta times
	// fb = 1/r (beta J = beta script-J / r), a fit coefficient of T^p times
	// r^(-p) (T/J = (T/script-J) r); all 1 in script-J units.
	fe, _ := opts.units.Factor(expansion.ScaleEnergy, g.Q)
	fa, _ := opts.units.Factor(expansion.ScaleInverseEnergy, g.Q)
	fb := fa
	bname := "beta*" + opts.units.String()
	type fitJSON struct {
		BetaMin   string    `json:"beta_min"`
		BetaMax   string    `json:"beta_max"`
		Exponents []float64 `json:"exponents"`
		E0        string    `json:"E0"`
		S0        string    `json:"S0"`
		AlphaS    string    `json:"alphaS"`
		AlphaSErr string    `json:"alphaS_err"`
		Coef      []string  `json:"coef"`
		Chi2      string    `json:"chi2_per_dof"`
		Accepted  bool      `json:"accepted"`
	}
	var fits []fitJSON
	var fitRows [][]string
	for _, f := range g.Fits {
		c := make([]string, len(f.Coef))
		for i, v := range f.Coef {
			if i < len(f.Exponents) {
				v *= math.Pow(fe, -f.Exponents[i])
			}
			c[i] = fmtFloat(v, 12)
		}
		fits = append(fits, fitJSON{fmtFloat(f.BetaMin*fb, 6), fmtFloat(f.BetaMax*fb, 6), f.Exponents, fmtFloat(f.E0*fe, 15), fmtFloat(f.S0, 12), fmtFloat(f.AlphaS*fa, 10), fmtErr64(f.AlphaSErr * fa), c, fmtErr64(f.Chi2), f.Accepted})
		acc := "no"
		if f.Accepted {
			acc = "yes"
		}
		fitRows = append(fitRows, []string{fmtFloat(f.BetaMin*fb, 5) + ".." + fmtFloat(f.BetaMax*fb, 5), strconv.Itoa(len(f.Exponents) - 1), fmtFloat(f.E0*fe, 15), fmtFloat(f.S0, 12), fmtFloat(f.AlphaS*fa, 10), fmtErr64(f.Chi2), acc})
	}
	betas := make([]string, len(g.Ladder))
	for i, s := range g.Ladder {
		betas[i] = fmtFloat(s.Beta*fb, 8)
	}
	js := map[string]any{
		"q":  fmtG(g.Q),
		"E0": fmtFloat(g.E0*fe, d), "E0_err": fmtErr64(g.E0Err * fe),
		"S0": fmtFloat(g.S0, d), "S0_err": fmtErr64(g.S0Err),
		"alphaS": fmtFloat(g.AlphaS*fa, d), "alphaS_err": fmtErr64(g.AlphaSErr * fa),
		"S0_exact": fmtFloat(g.S0Exact, d),
		"h1":       fmtFloat(g.H1, 12),
		"betas":    betas,
		"fits":     fits,
		"units":    unitsStatement(),
	}
	out := &Output{
		JSON: js,
		Tables: []Table{
			{
				Title:  fmt.Sprintf("SYK q = %s, low-temperature extraction (%s)", fmtG(g.Q), unitsStatement()),
				Header: []string{"quantity", "value", "error"},
				Rows: [][]string{
					{"E_0", fmtFloat(g.E0*fe, d), fmtErr64(g.E0Err * fe)},
					{"S_0 (fit)", fmtFloat(g.S0, d), fmtErr64(g.S0Err)},
					{"S_0 (exact)", fmtFloat(g.S0Exact, d), ""},
					{"alpha_S", fmtFloat(g.AlphaS*fa, d), fmtErr64(g.AlphaSErr * fa)},
				},
			},
			{Title: "joint fits of log Z and E", Header: []string{"beta window", "corrections", "E_0", "S_0", "alpha_S", "chi2/dof", "accepted"}, Rows: fitRows},
		},
		Notes: []string{
			fmt.Sprintf("ladder of %d solves, %s from %s to %s, each Richardson-extrapolated in the grid spacing", len(g.Ladder), bname, fmtFloat(g.Ladder[0].Beta*fb, 6), fmtFloat(g.Ladder[len(g.Ladder)-1].Beta*fb, 6)),
			fmt.Sprintf("log Z = -beta E_0 + S_0 + 2 pi^2 alpha_S T + corrections T^p, p from {2, h_1 - 1, 3, h_1, 4, 2 h_1 - 2, 5, 6}, h_1 = %s", fmtFloat(g.H1, 8)),
			"value = median of accepted fits, error = half their spread + median statistical error",
			"S_0 (exact) = (1/2) log 2 - int_0^{1/q} pi (1/2 - x) tan(pi x) dx and h_1 (root of k_A(h) = 1) from the exact conformal data (package expansion/conformal)",
			unitsNote() + "; JSON fit coefficients coef are those of T^p with T in the same units",
		},
	}
	if direct != nil {
		js["direct"] = map[string]any{
			"E_0": fmtFloat(direct.E0*fe, d), "E_0_err": fmtErr64(direct.E0Err * fe), "E_0_method": direct.E0Method,
			"alpha_S": fmtFloat(direct.AlphaS*fa, d), "alpha_S_err": fmtErr64(direct.AlphaSErr * fa), "alpha_S_method": direct.AlphaSMethod,
		}
		out.Tables = append(out.Tables, Table{
			Title:  "direct values (as printed by resum, report and table: per quantity the more accurate of this ladder and the T = 0 route)",
			Header: []string{"quantity", "value", "error", "route"},
			Rows: [][]string{
				{"E_0", fmtFloat(direct.E0*fe, d), fmtErr64(direct.E0Err * fe), routeName(direct.E0Method)},
				{"alpha_S", fmtFloat(direct.AlphaS*fa, d), fmtErr64(direct.AlphaSErr * fa), routeName(direct.AlphaSMethod)},
			},
		})
		out.Notes = append(out.Notes, "direct E_0: "+direct.E0Method, "direct alpha_S: "+direct.AlphaSMethod)
	}
	return out
}

// routeName is the short name of a direct value's route.
func routeName(method string) string {
	if strings.HasPrefix(method, energy.DirectZeroTMethod) {
		return "T = 0 solve"
	}
	return "this ladder"
}
