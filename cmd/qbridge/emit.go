package main

import (
	"encoding/json"
	"fmt"
	"math/big"
	"strconv"
	"strings"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

// emitFormat is resum's --emit flag: json, go, c or python.
var emitFormat string

// emitFormats are the languages --emit writes.
var emitFormats = []string{"json", "go", "c", "python"}

// emitUsage is the help text of --emit.
const emitUsage = "write the two-point Pade as code instead of resumming at one q: json, go, c or python (a self-contained function of q, checked against exact or direct values)"

// runEmit is resum --emit: the approximant as rational-function
// coefficients in x = 1/q, checked against reference values, as JSON or as
// a function in Go, C or Python.
func runEmit(cmd *cobra.Command, args []string) error {
	lang := emitFormat
	ok := false
	for _, f := range emitFormats {
		ok = ok || f == lang
	}
	if !ok {
		return usageErr("--emit must be one of %s (got %q)", strings.Join(emitFormats, ", "), lang)
	}
	if cmd.Flags().Changed("q") {
		return usageErr("--emit writes a function of q, checked over 2 <= q <= inf: drop --q")
	}
	if resumFlags.order < 2 || resumFlags.order > conformal.MaxOrder {
		return usageErr("--order must be between 2 and %d (got %d)", conformal.MaxOrder, resumFlags.order)
	}
	p, ns, err := quantityArg(args, resumFlags.n, cmd.Flags().Changed("n"))
	if err != nil {
		return err
	}
	if len(ns) != 1 {
		return usageErr("--emit writes one function: name one dimension (h_3, or --n 3)")
	}
	name := p.Quantity().Named(ns[0])
	if inJ() && p.Quantity().Scaling != expansion.ScaleNone {
		return usageErr("--emit writes %s in script-J units (the approximated %s is a rational function of 1/q only there; in J units it gains the factor sqrt(q/2^(q-1))^(+-1), essential at q = inf): drop --units J and convert in your code", name, name)
	}
	pr := newProgress(cmd, "emit")
	defer pr.Done()
	a, err := expansion.NewApproximant(name, resumFlags.order, workDigits(), newCache(cmd, false))
	if err != nil {
		return libErr(err)
	}
	r, err := a.Rational()
	if err != nil {
		return err
	}
	if err := a.CheckRational(r, workDigits(), pr.Update); err != nil {
		return err
	}
	pr.Done()
	text, err := emitCode(lang, r, emitInvocation(cmd, args))
	if err != nil {
		return err
	}
	_, err = fmt.Fprint(cmd.OutOrStdout(), text)
	return err
}

// emitInvocation is the command line that produced the code.
func emitInvocation(cmd *cobra.Command, args []string) string {
	parts := append([]string{cmd.CommandPath()}, args...)
	cmd.Flags().Visit(func(f *pflag.Flag) {
		if f.Name != "quiet" && f.Name != "format" {
			parts = append(parts, "--"+f.Name+"="+f.Value.String())
		}
	})
	return strings.Join(parts, " ")
}

// coeff64 prints a coefficient as the shortest decimal of its float64.
func coeff64(x *big.Float) string {
	f, _ := x.Float64()
	s := strconv.FormatFloat(f, 'e', -1, 64)
	if !strings.ContainsAny(s, ".e") {
		s += ".0"
	}
	return s
}

// emitIdent is the quantity as an identifier: h_1 -> h1, alpha_S -> alphaS.
func emitIdent(name string) string {
	return strings.NewReplacer("_", "", "^", "").Replace(name)
}

// emitHeader is the comment block every emitted function starts with.
func emitHeader(r *expansion.Rational, invocation string) []string {
	c := r.Check
	formula := map[string]string{
		expansion.TransformNone:   r.Name + "(q) = P(x)/Q(x)",
		expansion.TransformPow:    r.Name + "(q) = (P(x)/Q(x))^x, P/Q approximating b^q",
		expansion.TransformSquare: r.Name + "(q) = x^2 P(x)/Q(x), P/Q approximating q^2 " + r.Name,
		expansion.TransformLinear: r.Name + "(q) = x P(x)/Q(x), P/Q approximating q " + r.Name,
	}[r.Transform]
	lines := []string{
		fmt.Sprintf("%s as a function of the interaction order q (units script-J = 1).", r.Name),
		fmt.Sprintf("Two-point Pade approximant [%d/%d] in the variable x = 1/q: %s,", r.L, r.M, formula),
		fmt.Sprintf("matching %d terms of the series at x = 0 (q = infinity) and %d at x = 1/2 (q = 2),", r.K1, r.K2),
		fmt.Sprintf("built from series of order %d around q = 2 (in eps = 1 - 2/q) and %d around q = infinity.", r.OrderEps, r.OrderX),
		"Pole-free for 2 <= q <= infinity; defined for q >= 2 only (q = +infinity allowed).",
		fmt.Sprintf("Checked at %d points of q in [2, inf] against the %s values:", len(c.Q), c.Reference),
		fmt.Sprintf("  max |error| = %.2g at q = %s in float64 arithmetic (reference errors up to %s).", c.MaxErr, c.MaxAt, refErrText(c.MaxRefErr)),
		fmt.Sprintf("Produced by: %s (qbridge %s).", invocation, version),
	}
	return lines
}

func refErrText(e float64) string {
	if e == 0 {
		return "none: exact limits"
	}
	return fmt.Sprintf("%.1g", e)
}

// emitCode writes the approximant in one language.
func emitCode(lang string, r *expansion.Rational, invocation string) (string, error) {
	head := emitHeader(r, invocation)
	var ps, qs []string
	for _, c := range r.P {
		ps = append(ps, coeff64(c))
	}
	for _, c := range r.Q {
		qs = append(qs, coeff64(c))
	}
	id := emitIdent(r.Name)
	var b strings.Builder
	comment := func(prefix string) {
		for _, l := range head {
			b.WriteString(strings.TrimRight(prefix+l, " ") + "\n")
		}
	}
	switch lang {
	case "json":
		doc := map[string]any{
			"quantity": r.Name, "function": r.Function, "variable": "x = 1/q",
			"formula":   strings.TrimSuffix(strings.SplitN(head[1], ": ", 2)[1], ","),
			"transform": r.Transform, "numerator": ps, "denominator": qs,
			"degrees": []int{r.L, r.M}, "matched_terms": map[string]int{"at_x_0": r.K1, "at_x_half": r.K2},
			"order_eps": r.OrderEps, "order_x": r.OrderX, "valid_q": []string{"2", "inf"},
			"check": map[string]any{
				"reference": r.Check.Reference, "points": len(r.Check.Q), "max_error": fmt.Sprintf("%.2g", r.Check.MaxErr),
				"max_error_at_q": r.Check.MaxAt.String(), "arithmetic": "float64, Horner's rule in x",
			},
			"command": invocation, "version": version, "units": "script-J = 1",
		}
		out, err := json.MarshalIndent(doc, "", "  ")
		return string(out) + "\n", err
	case "go":
		comment("// ")
		b.WriteString("//\n// Needs: import (\"errors\"; \"math\")\n")
		fmt.Fprintf(&b, "func %s(q float64) (float64, error) {\n", strings.ToUpper(id[:1])+id[1:])
		b.WriteString("\tif math.IsNaN(q) || q < 2 {\n\t\treturn math.NaN(), errors.New(\"q must be >= 2\")\n\t}\n")
		fmt.Fprintf(&b, "\tp := []float64{%s}\n\tc := []float64{%s}\n", strings.Join(ps, ", "), strings.Join(qs, ", "))
		b.WriteString("\tx := 1 / q\n\tnum, den := 0.0, 0.0\n")
		b.WriteString("\tfor i := len(p) - 1; i >= 0; i-- {\n\t\tnum = num*x + p[i]\n\t}\n")
		b.WriteString("\tfor i := len(c) - 1; i >= 0; i-- {\n\t\tden = den*x + c[i]\n\t}\n")
		b.WriteString("\tr := num / den\n")
		switch r.Transform {
		case expansion.TransformPow:
			b.WriteString("\treturn math.Pow(r, x), nil\n")
		case expansion.TransformSquare:
			b.WriteString("\treturn x * x * r, nil\n")
		case expansion.TransformLinear:
			b.WriteString("\treturn x * r, nil\n")
		default:
			b.WriteString("\treturn r, nil\n")
		}
		b.WriteString("}\n")
	case "c":
		b.WriteString("/*\n")
		comment(" * ")
		b.WriteString(" * Returns NAN and sets errno = EDOM for q < 2 (or q NaN).\n */\n")
		b.WriteString("#include <errno.h>\n#include <math.h>\n\n")
		fmt.Fprintf(&b, "double qbridge_%s(double q)\n{\n", id)
		fmt.Fprintf(&b, "    static const double p[%d] = {%s};\n", len(ps), strings.Join(ps, ", "))
		fmt.Fprintf(&b, "    static const double c[%d] = {%s};\n", len(qs), strings.Join(qs, ", "))
		b.WriteString("    double x, num = 0.0, den = 0.0, r;\n    int i;\n")
		b.WriteString("    if (isnan(q) || q < 2) {\n        errno = EDOM;\n        return NAN;\n    }\n")
		b.WriteString("    x = 1.0 / q;\n")
		fmt.Fprintf(&b, "    for (i = %d; i >= 0; i--)\n        num = num * x + p[i];\n", len(ps)-1)
		fmt.Fprintf(&b, "    for (i = %d; i >= 0; i--)\n        den = den * x + c[i];\n", len(qs)-1)
		b.WriteString("    r = num / den;\n")
		switch r.Transform {
		case expansion.TransformPow:
			b.WriteString("    return pow(r, x);\n")
		case expansion.TransformSquare:
			b.WriteString("    return x * x * r;\n")
		case expansion.TransformLinear:
			b.WriteString("    return x * r;\n")
		default:
			b.WriteString("    return r;\n")
		}
		b.WriteString("}\n")
	case "python":
		comment("# ")
		b.WriteString("import math\n\n\n")
		fmt.Fprintf(&b, "def %s(q):\n", strings.ToLower(id))
		fmt.Fprintf(&b, "    \"\"\"%s at real q >= 2 (q = math.inf allowed); see the header.\"\"\"\n", r.Name)
		b.WriteString("    q = float(q)\n    if math.isnan(q) or q < 2:\n        raise ValueError(\"q must be >= 2, got %r\" % q)\n")
		fmt.Fprintf(&b, "    p = (%s,)\n    c = (%s,)\n", strings.Join(ps, ", "), strings.Join(qs, ", "))
		b.WriteString("    x = 1.0 / q\n    num = 0.0\n    for a in reversed(p):\n        num = num * x + a\n")
		b.WriteString("    den = 0.0\n    for a in reversed(c):\n        den = den * x + a\n    r = num / den\n")
		switch r.Transform {
		case expansion.TransformPow:
			b.WriteString("    return math.pow(r, x)\n")
		case expansion.TransformSquare:
			b.WriteString("    return x * x * r\n")
		case expansion.TransformLinear:
			b.WriteString("    return x * r\n")
		default:
			b.WriteString("    return r\n")
		}
	}
	return b.String(), nil
}
