package main

import (
	"fmt"
	"regexp"
	"strings"

	"github.com/spf13/cobra"

	"qbridge/expansion"
)

// opts holds the global flags shared by every command.
var opts struct {
	Digits   int
	Format   string
	Quiet    bool
	Wide     bool
	CSVTable int
	// Units is the --units flag as given; units its parsed value.
	Units string
	units expansion.Units
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

Units: script-J = 1 (script-J^2 = q J^2 / 2^(q-1)); --units J prints E_0
(times sqrt(q/2^(q-1))), alpha_S, alpha_G and alpha_K (divided by it) in
units J = 1 and reads --beta as beta J. The series around q = inf, check and
resum --emit stay in script-J (refused with --units J: script-J/J has an
essential singularity at q = inf); the series around q = 2 are converted.`,
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
		u, err := expansion.ParseUnits(opts.Units)
		if err != nil {
			return usageErr("--units %q: expected script-J (default) or J", opts.Units)
		}
		opts.units = u
		return nil
	},
}

func init() {
	pf := rootCmd.PersistentFlags()
	pf.IntVar(&opts.Digits, "digits", 16, fmt.Sprintf("significant digits printed (%d..%d); commands that compute at arbitrary precision also work at this precision plus guard digits", minDigits, maxDigits))
	pf.StringVar(&opts.Format, "format", "text", "output format: "+strings.Join(formats, ", "))
	pf.BoolVar(&opts.Quiet, "quiet", false, "no progress reports on stderr")
	pf.BoolVar(&opts.Wide, "wide", false, fmt.Sprintf("text tables at full width (default: split at %d columns)", maxTextWidth))
	pf.IntVar(&opts.CSVTable, "csv-table", 1, "with --format csv, which table of the output to write (1 = the first; the others are listed on stderr)")
	pf.StringVar(&opts.Units, "units", "script-J", "energy unit of E_0, alpha_S, alpha_G, alpha_K, E and beta: script-J (script-J^2 = q J^2/2^(q-1)) or J; series around inf, check and --emit need script-J")
	// Flag-parsing errors are bad input: exit status 2, in one plain line.
	rootCmd.SetFlagErrorFunc(func(cmd *cobra.Command, err error) error {
		return usageErr("%s", flagMessage(err))
	})
}

// flagValueError matches pflag's message for a value that does not parse.
var flagValueError = regexp.MustCompile(`^invalid argument "(.*)" for "(.*?)" flag: (?:strconv\.Parse(\w+)|(.*))`)

// flagMessage rewrites a flag-parsing error as one line that names the
// flag, the value given and what is allowed, without parser internals.
func flagMessage(err error) string {
	m := flagValueError.FindStringSubmatch(err.Error())
	if m == nil {
		return err.Error()
	}
	value, flag := m[1], m[2]
	if i := strings.Index(flag, "--"); i >= 0 {
		flag = flag[i:]
	}
	want := "a valid value"
	switch m[3] {
	case "Int", "Uint":
		want = "an integer such as 12"
	case "Float":
		want = "a number such as 4 or 2.5e3"
	case "Bool":
		want = "true or false"
	}
	if value == "" {
		return fmt.Sprintf("%s needs a value: give %s", flag, want)
	}
	return fmt.Sprintf("%s %q: expected %s", flag, value, want)
}

// unitsStatement is the units every header and JSON document states.
func unitsStatement() string { return opts.units.Statement() }

// unitsNote is the units note of every output.
func unitsNote() string { return opts.units.Note() }

// inJ reports --units J.
func inJ() bool { return opts.units == expansion.UnitsJ }
