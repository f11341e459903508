package main

import (
	"fmt"
	"strings"

	"github.com/spf13/cobra"
)

// opts holds the global flags shared by every command.
var opts struct {
	Digits int
	Format string
	Quiet  bool
}

// Limits of the global --digits flag.
const (
	minDigits = 1
	maxDigits = 1000
)

var formats = []string{"text", "json", "csv", "tex"}

var rootCmd = &cobra.Command{
	Use:   "qbridge",
	Short: "High-precision conformal data, energies and soft-mode coefficients of SYK models versus q",
	Long: `qbridge computes, to high precision and with error estimates, the quantities
tabulated for SYK-type models as functions of the interaction order q: operator
dimensions h_n, the conformal coefficient b, the zero-temperature entropy S_0,
the ground-state energy E_0 and the Schwarzian coefficient alpha_S. It builds
series around q = 2 (in eps = 1 - 2/q) and q = infinity (in x = 1/q), resums
them, and checks them against its own Schwinger-Dyson solver.

Units: script-J = 1 (script-J^2 = q J^2 / 2^(q-1)).`,
	SilenceUsage:  true,
	SilenceErrors: true,
	PersistentPreRunE: func(cmd *cobra.Command, args []string) error {
		if opts.Digits < minDigits || opts.Digits > maxDigits {
			return usageErr("--digits must be between %d and %d (got %d)", minDigits, maxDigits, opts.Digits)
		}
		ok := false
		for _, f := range formats {
			if opts.Format == f {
				ok = true
			}
		}
		if !ok {
			return usageErr("--format must be one of %s (got %q)", strings.Join(formats, ", "), opts.Format)
		}
		return nil
	},
}

func init() {
	pf := rootCmd.PersistentFlags()
	pf.IntVar(&opts.Digits, "digits", 16, fmt.Sprintf("significant digits printed (%d..%d); commands that compute at arbitrary precision also work at this precision plus guard digits", minDigits, maxDigits))
	pf.StringVar(&opts.Format, "format", "text", "output format: "+strings.Join(formats, ", "))
	pf.BoolVar(&opts.Quiet, "quiet", false, "no progress reports on stderr")
	// Flag-parsing errors are bad input: exit status 2.
	rootCmd.SetFlagErrorFunc(func(cmd *cobra.Command, err error) error {
		return &usageError{err}
	})
}
