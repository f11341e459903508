package main

import (
	"errors"
	"math/big"
	"strings"
	"testing"

	"qbridge/expansion/conformal"
)

// exitStatus is what main makes of an error: 2 for bad input, 1 for a
// failed computation, 0 for none.
func exitStatus(err error) int {
	if err == nil {
		return 0
	}
	var ue *usageError
	if errors.As(err, &ue) || isCobraUsage(err) {
		return 2
	}
	return 1
}

// Bad input across the commands: the exit status and a message that names
// what is wrong, on one line, without parser internals.
func TestBadInputTable(t *testing.T) {
	cases := []struct {
		args []string
		want string // substring of the message
	}{
		{[]string{"--digits", "abc", "exact", "b"}, `--digits "abc": expected an integer`},
		{[]string{"--digits", "0", "exact", "b"}, "--digits must be between"},
		{[]string{"--digits", "5000", "exact", "b"}, "--digits must be between"},
		{[]string{"--format", "xml", "exact", "b"}, "--format must be one of"},
		{[]string{"--csv-table", "3", "--format", "csv", "exact", "b"}, "--csv-table 3"},
		{[]string{"nosuch"}, "unknown command"},
		{[]string{"exact"}, "name one quantity"},
		{[]string{"exact", "b", "s0"}, "name one quantity"},
		{[]string{"exact", "zeta"}, `unknown quantity "zeta"`},
		{[]string{"exact", "b", "--q", "1.5"}, "below 2"},
		{[]string{"exact", "b", "--q", "abc"}, `cannot read q = "abc"`},
		{[]string{"exact", "b", "--q", ""}, "cannot read q"},
		{[]string{"exact", "b", "--q", "nan"}, "cannot read q"},
		{[]string{"exact", "b", "--n", "2"}, "--n does not apply to b"},
		{[]string{"exact", "dims", "--n", "-1"}, "cannot read --n"},
		{[]string{"exact", "dims", "--n", "5..2"}, "cannot read --n"},
		{[]string{"exact", "dims", "--n", "x"}, "cannot read --n"},
		{[]string{"exact", "dims", "--n", "100000"}, "--n goes up to"},
		{[]string{"exact", "h_999999"}, "above the supported"},
		{[]string{"exact", "e0"}, "has no exact value"},
		{[]string{"exact", "alpha_S"}, "has no exact value"},
		{[]string{"series", "h_1", "--order", "-1"}, "--order must be between"},
		{[]string{"series", "h_1", "--order", ""}, "--order needs a value"},
		{[]string{"series", "h_1", "--order", "1.5"}, `--order "1.5": expected an integer`},
		{[]string{"series", "h_1", "--order", "300"}, "--order must be between"},
		{[]string{"series", "h_1", "--order", "190"}, "--no-time-limit"},
		{[]string{"series", "h_1", "--around", "3"}, "--around must be 2 or inf"},
		{[]string{"series", "h_1", "--n", "2"}, "already names its index"},
		{[]string{"series", "b", "--n", "1"}, "--n does not apply to b"},
		{[]string{"series", "s0", "--beta", "3"}, "--beta does not apply to S_0"},
		{[]string{"series", "e0", "--closed-form"}, "--closed-form applies to h_n, b and S_0"},
		{[]string{"series", "e0", "--order", "41"}, "takes orders 0..40"},
		{[]string{"series", "alpha", "--around", "inf", "--order", "1"}, "takes orders 2.."},
		{[]string{"series", "logz", "--order", "3"}, "needs --beta"},
		{[]string{"series", "logz", "--order", "3", "--beta", "-1"}, "--beta must be positive"},
		{[]string{"series", "logz", "--order", "3", "--beta", "1e9"}, "--beta must be positive and at most"},
		{[]string{"series", "h_1", "--closed-form=maybe"}, `--closed-form "maybe": expected true or false`},
		{[]string{"resum", "h_1", "--q", "inf"}, "resum needs a finite q"},
		{[]string{"resum", "h_1", "--order", "1"}, "--order must be between 2"},
		{[]string{"resum", "e0", "--q", "1.9"}, "below 2"},
		{[]string{"resum", "b", "--n", "3"}, "--n does not apply to b"},
		{[]string{"resum", "logz"}, "logZ is not resummed"},
		{[]string{"report", "--q", "inf"}, "report needs a finite q"},
		{[]string{"report", "--order", "0"}, "--order must be between 2"},
		{[]string{"report", "extra"}, "unknown command"},
		{[]string{"solve", "--q", "abc"}, `--q "abc": expected a number`},
		{[]string{"solve", "--beta", "1e9"}, "beyond what one solve resolves"},
		{[]string{"solve", "--points", "1000"}, "--points"},
		{[]string{"solve", "--out", ""}, "--out needs a file name"},
		{[]string{"solve", "--out", "/no/such/dir/g.csv"}, "does not exist"},
		{[]string{"solve", "--out", "g.txt"}, "must end in .csv or .json"},
		{[]string{"ground", "--steps", "1e3"}, `--steps "1e3": expected an integer`},
		{[]string{"ground", "--q", "1"}, "q"},
		{[]string{"--units", "eV", "exact", "b"}, `--units "eV": expected script-J (default) or J`},
		{[]string{"series", "e0", "--around", "inf", "--units", "J"}, "essential singularity"},
		{[]string{"series", "alpha_G", "--around", "inf", "--units", "J"}, "essential singularity"},
		{[]string{"series", "logz", "--beta", "3", "--units", "J"}, "varies with q"},
		{[]string{"check", "E_0 = 0", "--units", "J"}, "check compares claims with the series in script-J units"},
		{[]string{"resum", "alpha_K", "--emit", "python", "--units", "J"}, "--emit writes alpha_K in script-J units"},
		{[]string{"series", "alpha_K", "--around", "inf", "--order", "15"}, "takes orders 0..14"},
		{[]string{"series", "alpha_G", "--around", "2", "--order", "42"}, "takes orders 0..41"},
		{[]string{"table", "alpha_G", "--q", "4", "--method", "exact"}, "has no exact value"},
		{[]string{"hightemp"}, "hightemp needs one quantity"},
		{[]string{"hightemp", "zeta"}, `unknown quantity "zeta" for hightemp`},
		{[]string{"hightemp", "logz", "--order", "-1"}, "--order must be between 1 and"},
		{[]string{"hightemp", "logz", "--order", "61"}, "--order must be between 1 and"},
		{[]string{"hightemp", "logz", "--q", "1.5"}, "q must be at least 2"},
		{[]string{"hightemp", "logz", "--q", "4,x"}, `--q "x": expected numbers or fractions`},
		{[]string{"hightemp", "logz", "--q", "inf"}, "drop --q"},
		{[]string{"hightemp", "logz", "--beta", "1"}, "add --q"},
		{[]string{"hightemp", "logz", "--q", "4", "--beta", "-1"}, "expected a positive number"},
		{[]string{"hightemp", "cumulants", "--q", "4", "--beta", "1"}, "--beta applies to logz"},
		{[]string{"hightemp", "logz", "--units", "J"}, "give --q or use --units script-J"},
		{[]string{"hightemp", "logz", "--q", "9/2", "--units", "J"}, "exist only for integer q"},
		{[]string{"hightemp", "logz", "--q", "70000", "--units", "J"}, "offered up to q = 4096"},
		{[]string{"hightemp", "logz", "--q", "0x10"}, `--q "0x10": expected numbers or fractions`},
		{[]string{"exact", "h_1", "--q", "0x10"}, `cannot read q = "0x10"`},
	}
	if len(cases) < 40 {
		t.Fatalf("only %d cases", len(cases))
	}
	for _, c := range cases {
		_, err := runCLI(t, c.args...)
		if got := exitStatus(err); got != 2 {
			t.Errorf("%v: exit status %d (%v), want 2", c.args, got, err)
			continue
		}
		msg := err.Error()
		if !strings.Contains(msg, c.want) {
			t.Errorf("%v: message %q, want it to contain %q", c.args, msg, c.want)
		}
		if strings.Contains(msg, "strconv.") || strings.Contains(msg, "\n") {
			t.Errorf("%v: message is not one plain line: %q", c.args, msg)
		}
	}
}

// The parsers never panic, whatever the input (go test -fuzz=FuzzNList
// explores further; the seeds run in every go test).
func FuzzNList(f *testing.F) {
	for _, s := range []string{"3", "1,3", "1..6", "0..0", "", ",", "..", "1..", "-1", "1,,2", "99999999999999999999", "1..3,5"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		ns, err := parseNList(s)
		if err == nil {
			for _, n := range ns {
				if n < 0 || n > conformal.MaxN {
					t.Fatalf("%q gave index %d", s, n)
				}
			}
		}
	})
}

func FuzzParseQ(f *testing.F) {
	for _, s := range []string{"4", "2", "2.5", "inf", "1e300", "1e-300", "nan", "-inf", "", "0x10", "1.5", "2e", "+inf"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		q, err := conformal.ParseQ(s, 128)
		if err != nil {
			return
		}
		if !q.Inf && (q.Q == nil || q.Q.IsInf() || q.Q.Cmp(big.NewFloat(2)) < 0) {
			t.Fatalf("%q accepted as %v", s, q)
		}
	})
}

func FuzzFlagMessage(f *testing.F) {
	for _, s := range []string{`invalid argument "abc" for "--digits" flag: strconv.ParseInt: parsing "abc": invalid syntax`, "", `invalid argument "" for "-n, --n" flag: x`, "bad flag syntax: ---x"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		if m := flagMessage(errors.New(s)); strings.Contains(m, "strconv.Parse") && !strings.Contains(s, "strconv.Parse") {
			t.Fatalf("message %q", m)
		}
	})
}

func FuzzTexText(f *testing.F) {
	for _, s := range []string{"h_1 around q = 2", "alpha_S", "eps^k", "$", "\\", "h_", "h_12x", "50%"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		out := texText(s)
		if strings.Count(strings.ReplaceAll(out, `\$`, ""), "$")%2 != 0 {
			t.Fatalf("unbalanced math in %q -> %q", s, out)
		}
	})
}

func FuzzEnd(f *testing.F) {
	for _, s := range []string{"2", "inf", "", "3", "INF"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		if _, err := parseEnd(s); err == nil && s != "2" && s != "inf" {
			t.Fatalf("accepted %q", s)
		}
	})
}
