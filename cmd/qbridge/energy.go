package main

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"strconv"

	"github.com/spf13/cobra"

	"qbridge/expansion/energy"
	"qbridge/expansion/conformal"
)

// Energy and soft-mode series: E_0, alpha_S and log Z around q = 2 (in eps)
// and q = infinity (in x = 1/q), registered with the series, resum and report
// commands.

var energyFlags struct {
	Beta float64
}

func init() {
	seriesProviders["e0"] = energySeries(energy.QuantityE0)
	seriesProviders["alpha"] = energySeries(energy.QuantityAlphaS)
	seriesProviders["logz"] = logZSeries
	seriesCmd.Flags().Float64Var(&energyFlags.Beta, "beta", 0, "inverse temperature beta*script-J for the logz series (required there)")
	resumProviders["e0"] = energyResum(energy.QuantityE0)
	resumProviders["alpha"] = energyResum(energy.QuantityAlphaS)
	reportRowProviders = append(reportRowProviders, energyReportRows)
}

// Orders used by resum and report: the q = 2 side is cheap, the 1/q side
// costs order^3 per grid point, so it is capped lower.
const (
	energyResumMaxEps  = 10
	energyResumMaxInvQ = 8
	energyResumMinInvQ = 3
	energyResumMinEps  = 2
)

var quantityNames = map[string]string{energy.QuantityE0: "E_0", energy.QuantityAlphaS: "alpha_S"}

// energyErr maps library errors to usage errors (exit status 2) where the
// input is at fault, including orders the grid cannot resolve.
func energyErr(err error) error {
	if errors.Is(err, energy.ErrInput) || errors.Is(err, energy.ErrOrder) {
		return usageErr("%v", err)
	}
	return err
}

func checkEnergyOrder(end conformal.End, order int) error {
	if end == conformal.AroundTwo {
		if order < 0 || order > energy.MaxDeltaOrder {
			return usageErr("--order %d: the q = 2 expansion takes orders 0..%d (the per-order cost and memory, order x grid points, set the limit)", order, energy.MaxDeltaOrder)
		}
		return nil
	}
	if order < 2 || order > energy.MaxInvQOrder {
		return usageErr("--order %d: the 1/q expansion takes orders 2..%d (orders 0 and 1 are trivial; above %d the order^3 cost of the local source per grid point sets the limit)", order, energy.MaxInvQOrder, energy.MaxInvQOrder)
	}
	return nil
}

func aroundName(end conformal.End) (around, variable string) {
	if end == conformal.AroundTwo {
		return "2", "eps"
	}
	return "inf", "x"
}

func decimals(v []float64) []string {
	out := make([]string, len(v))
	for i, x := range v {
		out[i] = fmtFloat(x, opts.Digits)
	}
	return out
}

func floatErrStrings(v []float64) []string {
	out := make([]string, len(v))
	for i, x := range v {
		out[i] = fmtErr(big.NewFloat(x))
	}
	return out
}

// groundFor runs the low-temperature extraction at one end.
func groundFor(cmd *cobra.Command, end conformal.End, order int) (*energy.GroundSeries, error) {
	pr := newProgress(cmd, "ground series")
	defer pr.Done()
	p := energy.GroundParams{Order: order, Progress: pr.Update}
	if end == conformal.AroundTwo {
		return energy.EpsGround(p)
	}
	return energy.InvQGround(p)
}

func energySeries(quantity string) seriesProvider {
	return func(cmd *cobra.Command, end conformal.End, order int) (*Output, error) {
		if err := checkEnergyOrder(end, order); err != nil {
			return nil, err
		}
		if cmd.Flags().Changed("beta") {
			return nil, usageErr("--beta applies to the logz series only: %s is a zero-temperature quantity", quantity)
		}
		g, err := groundFor(cmd, end, order)
		if err != nil {
			return nil, energyErr(err)
		}
		c := g.E0
		if quantity == energy.QuantityAlphaS {
			c = g.AlphaS
		}
		around, variable := aroundName(end)
		dev := g.S0Deviation()
		type s0JSON struct {
			Coefficients []string  `json:"coefficients"`
			Errors       []string  `json:"errors"`
			Exact        []string  `json:"exact"`
			Deviation    []float64 `json:"deviation_sigma"`
		}
		js := struct {
			Quantity     string   `json:"quantity"`
			Around       string   `json:"around"`
			Variable     string   `json:"variable"`
			Coefficients []string `json:"coefficients"`
			Errors       []string `json:"errors"`
			S0Check      s0JSON   `json:"s0_check"`
			BetaMin      float64  `json:"beta_min"`
			BetaMax      float64  `json:"beta_max"`
			Temperatures int      `json:"temperatures"`
			Units        string   `json:"units"`
		}{quantity, around, variable, decimals(c.Values), floatErrStrings(c.Errors),
			s0JSON{decimals(g.S0.Values), floatErrStrings(g.S0.Errors), decimals(g.S0Exact), finiteOrZero(dev)},
			g.BetaMin, g.BetaMax, len(g.Ladder), "script-J = 1"}
		rows := make([][]string, c.Len())
		for k := range rows {
			rows[k] = []string{fmt.Sprint(k), fmtFloat(c.Values[k], opts.Digits), fmtErr(big.NewFloat(c.Errors[k])),
				fmtFloat(g.S0.Values[k], opts.Digits), fmtErr(big.NewFloat(g.S0.Errors[k])), fmtFloat(g.S0Exact[k], opts.Digits), fmtSigma(dev[k])}
		}
		name := quantityNames[quantity]
		return &Output{
			JSON: js,
			Tables: []Table{{
				Title:  fmt.Sprintf("%s around q = %s in %s, with the fitted S_0 against the exact series (built-in check)", name, around, variableLong(end)),
				Header: []string{"k", name + " coefficient", "error", "S_0 fitted", "error", "S_0 exact", "(fit-exact)/error"},
				Rows:   rows,
			}},
			Notes: energyNotes(end, g),
		}, nil
	}
}

func variableLong(end conformal.End) string {
	if end == conformal.AroundTwo {
		return "eps = 1 - 2/q"
	}
	return "x = 1/q"
}

func finiteOrZero(v []float64) []float64 {
	out := make([]float64, len(v))
	for i, x := range v {
		if !math.IsNaN(x) && !math.IsInf(x, 0) {
			out[i] = x
		}
	}
	return out
}

func fmtSigma(x float64) string {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return "-"
	}
	return fmt.Sprintf("%.2f", x)
}

func energyNotes(end conformal.End, g *energy.GroundSeries) []string {
	var n []string
	if end == conformal.AroundTwo {
		n = append(n, "Perturbation theory of the SD equations in delta = q - 2 at finite beta (per-frequency algebraic solves, sources by pointwise series arithmetic), converted to eps by delta = 2 eps/(1-eps) on every grid, Richardson-extrapolated in the grid spacing.")
	} else {
		n = append(n, "G = (1/2) sgn(tau)[1 + g_1/q + ...]: g_1 the Liouville solution, each g_k from Liouville's fluctuation operator with local and non-local sources, at finite beta, Richardson-extrapolated in the grid spacing.")
	}
	n = append(n,
		fmt.Sprintf("Low-temperature fits of log Z_k = -beta E_0k + S_0k + 2 pi^2 alpha_Sk/beta + corrections over %d temperatures, beta = %.4g..%.4g; errors = spread over fit windows and models + propagated data errors.", len(g.Ladder), g.BetaMin, g.BetaMax),
		"log Z is evaluated from the converged G and Sigma at every order (the stationarity of log Z is not used).",
		"Units script-J = 1.")
	return n
}

func logZSeries(cmd *cobra.Command, end conformal.End, order int) (*Output, error) {
	if err := checkEnergyOrder(end, order); err != nil {
		return nil, err
	}
	b := energyFlags.Beta
	if !cmd.Flags().Changed("beta") {
		return nil, usageErr("the logz series needs --beta (inverse temperature beta*script-J)")
	}
	if math.IsNaN(b) || b <= 0 || math.IsInf(b, 0) || b > 1e5 {
		return nil, usageErr("--beta must be positive and at most 1e5 (got %g)", b)
	}
	var f *energy.FiniteBeta
	var err error
	if end == conformal.AroundTwo {
		f, err = energy.DeltaExpand(energy.DeltaParams{Beta: b, Order: order, Variable: energy.VarEps})
	} else {
		f, err = energy.InvQExpand(energy.InvQParams{Beta: b, Order: order})
	}
	if err != nil {
		return nil, energyErr(err)
	}
	around, variable := aroundName(end)
	js := struct {
		Quantity     string   `json:"quantity"`
		Around       string   `json:"around"`
		Variable     string   `json:"variable"`
		Beta         float64  `json:"beta"`
		Coefficients []string `json:"coefficients"`
		Errors       []string `json:"errors"`
		Energy       []string `json:"energy_coefficients"`
		EnergyErrors []string `json:"energy_errors"`
		Points       int      `json:"points"`
	}{"logz", around, variable, b, decimals(f.LogZ.Values), floatErrStrings(f.LogZ.Errors), decimals(f.E.Values), floatErrStrings(f.E.Errors), f.Points}
	rows := make([][]string, f.LogZ.Len())
	for k := range rows {
		rows[k] = []string{fmt.Sprint(k), fmtFloat(f.LogZ.Values[k], opts.Digits), fmtErr(big.NewFloat(f.LogZ.Errors[k])),
			fmtFloat(f.E.Values[k], opts.Digits), fmtErr(big.NewFloat(f.E.Errors[k]))}
	}
	return &Output{
		JSON: js,
		Tables: []Table{{
			Title:  fmt.Sprintf("log Z and E at beta = %g around q = %s in %s", b, around, variableLong(end)),
			Header: []string{"k", "log Z coefficient", "error", "E coefficient", "error"},
			Rows:   rows,
		}},
		Notes: []string{fmt.Sprintf("Finest grid %d points on [0, beta), %d grids, Richardson in the grid spacing. Units script-J = 1.", f.Points, f.Levels)},
	}, nil
}

// energyCache keeps the ground series of one run: resum and report use both
// ends for both quantities.
var energyCache = map[[2]int]*energy.GroundSeries{}

func cachedGround(cmd *cobra.Command, end conformal.End, order int) (*energy.GroundSeries, error) {
	key := [2]int{int(end), order}
	if g, ok := energyCache[key]; ok {
		return g, nil
	}
	g, err := groundFor(cmd, end, order)
	if err != nil {
		return nil, err
	}
	energyCache[key] = g
	return g, nil
}

func resumOrders(order int) (eps, inf int) {
	eps = min(max(order, energyResumMinEps), energyResumMaxEps)
	inf = min(max(order, energyResumMinInvQ), energyResumMaxInvQ)
	return eps, inf
}

func bothEnds(cmd *cobra.Command, order int) (*energy.GroundSeries, *energy.GroundSeries, error) {
	eo, io := resumOrders(order)
	ge, err := cachedGround(cmd, conformal.AroundTwo, eo)
	if err != nil {
		return nil, nil, err
	}
	gi, err := cachedGround(cmd, conformal.AroundInf, io)
	if err != nil {
		return nil, nil, err
	}
	return ge, gi, nil
}

func qValue(q conformal.QPoint) (float64, error) {
	if q.Inf {
		return 0, usageErr("--q inf: E_0 and alpha_S vanish at q = infinity; their 1/q series (qbridge series e0|alpha --around inf) start at -1/q^2 and 1/(4q^2)")
	}
	if q.Q == nil {
		return 0, usageErr("--q is required")
	}
	v, _ := q.Q.Float64()
	if math.IsNaN(v) || v < 2 || math.IsInf(v, 0) {
		return 0, usageErr("--q must be a real number >= 2 (got %g)", v)
	}
	return v, nil
}

func energyResum(quantity string) resumProvider {
	return func(cmd *cobra.Command, qp conformal.QPoint, order int) (*Output, error) {
		q, err := qValue(qp)
		if err != nil {
			return nil, err
		}
		ge, gi, err := bothEnds(cmd, order)
		if err != nil {
			return nil, energyErr(err)
		}
		r, err := energy.ResumGround(quantity, q, ge, gi)
		if err != nil {
			return nil, energyErr(err)
		}
		pr := newProgress(cmd, "direct solver")
		d, err := energy.DirectGround(q, pr.Update)
		pr.Done()
		if err != nil {
			return nil, err
		}
		dv, de := d.E0, d.E0Err
		if quantity == energy.QuantityAlphaS {
			dv, de = d.AlphaS, d.AlphaSErr
		}
		var methods, values, errs []string
		var sig []float64
		rows := [][]string{}
		for _, e := range r.Estimates {
			methods = append(methods, e.Method)
			values = append(values, fmtFloat(e.Value, opts.Digits))
			errs = append(errs, fmtErr(big.NewFloat(nanToZero(e.Err))))
			s := (e.Value - dv) / math.Hypot(e.Err, de)
			sig = append(sig, nanToZero(s))
			rows = append(rows, []string{e.Method, fmtFloat(e.Value, opts.Digits), fmtErr(big.NewFloat(nanToZero(e.Err))), fmtSigma(s), e.Detail})
		}
		rows = append(rows, []string{"direct SD solver", fmtFloat(dv, opts.Digits), fmtErr(big.NewFloat(de)), "", "numeric.Ladder beta 50..2000 + FitGround"})
		js := struct {
			Quantity      string    `json:"quantity"`
			Q             string    `json:"q"`
			Methods       []string  `json:"methods"`
			Values        []string  `json:"values"`
			Errors        []string  `json:"errors"`
			Direct        string    `json:"direct"`
			DirectError   string    `json:"direct_error"`
			SigmaVsDirect []float64 `json:"sigma_vs_direct"`
			Units         string    `json:"units"`
		}{quantity, strconv.FormatFloat(q, 'g', -1, 64), methods, values, errs, fmtFloat(dv, opts.Digits), fmtErr(big.NewFloat(de)), sig, "script-J = 1"}
		eo, io := resumOrders(order)
		return &Output{
			JSON: js,
			Tables: []Table{{
				Title:  fmt.Sprintf("%s at q = %g resummed from q = 2 (eps, order %d) and q = infinity (1/q, order %d)", quantityNames[quantity], q, eo, io),
				Header: []string{"method", "value", "error", "(value-direct)/combined error", "detail"},
				Rows:   rows,
			}},
			Notes: []string{
				"The two-point Pade uses q^2 " + quantityNames[quantity] + " as a function of x = 1/q, finite at both ends: its series at x = 0 and at x = 1/2 (from eps = 1 - 2x).",
				"Errors add the spread of the approximants and the shift under the coefficient error bars.",
				"Units script-J = 1.",
			},
		}, nil
	}
}

func nanToZero(x float64) float64 {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return 0
	}
	return x
}

// Published q = 4 values (PHYSICS sec. 8): E_0 = -0.0406 J = -0.05746
// script-J (Maldacena-Stanford arXiv:1604.07818; Garcia-Garcia-Verbaarschot
// arXiv:1610.03816; quoted from memory), alpha_S ~ 0.007 (MS 2016).
func energyPublished(quantity string, q float64) *conformal.Published {
	if q != 4 {
		return nil
	}
	if quantity == energy.QuantityE0 {
		return &conformal.Published{Value: big.NewFloat(-0.05746), Digits: 4, Source: "MS 2016 arXiv:1604.07818; Garcia-Garcia-Verbaarschot arXiv:1610.03816 (-0.0406 J, from memory)"}
	}
	return &conformal.Published{Value: big.NewFloat(0.007), Digits: 1, Source: "MS 2016 arXiv:1604.07818"}
}

func energyReportRows(cmd *cobra.Command, qp conformal.QPoint, order int) ([]reportRow, error) {
	if qp.Inf || qp.Q == nil {
		return nil, nil // both vanish at q = infinity; nothing to compare
	}
	q, err := qValue(qp)
	if err != nil {
		return nil, err
	}
	ge, gi, err := bothEnds(cmd, order)
	if err != nil {
		return nil, energyErr(err)
	}
	pr := newProgress(cmd, "direct solver")
	d, err := energy.DirectGround(q, pr.Update)
	pr.Done()
	if err != nil {
		return nil, err
	}
	var rows []reportRow
	for _, c := range []struct {
		qty    string
		dv, de float64
	}{{energy.QuantityE0, d.E0, d.E0Err}, {energy.QuantityAlphaS, d.AlphaS, d.AlphaSErr}} {
		r, err := energy.ResumGround(c.qty, q, ge, gi)
		if err != nil {
			return nil, energyErr(err)
		}
		est := map[string]conformal.Estimate{}
		for _, e := range r.Estimates {
			if e.Method != energy.MethodPadeEps && e.Method != energy.MethodPadeInvQ && e.Method != energy.MethodTwoPoint {
				continue
			}
			if math.IsNaN(e.Value) {
				est[e.Method] = conformal.Estimate{Method: e.Method, Detail: e.Detail}
				continue
			}
			est[e.Method] = conformal.Estimate{Method: e.Method, Value: big.NewFloat(e.Value), Err: big.NewFloat(e.Err), Detail: e.Detail}
		}
		rows = append(rows, reportRow{
			Quantity: quantityNames[c.qty], Exact: big.NewFloat(c.dv), ExactErr: big.NewFloat(c.de),
			ExactKind: "direct SD solver", Estimates: est, Published: energyPublished(c.qty, q),
		})
	}
	return rows, nil
}
