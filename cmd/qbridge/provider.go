package main

import (
	"errors"
	"fmt"
	"strconv"
	"strings"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

// quantityArg resolves the one quantity argument of a command through the
// vocabulary of package expansion. For the dimensions it returns the
// indices to compute: the one the name carries (h_3), else those of the
// --n flag (nFlag, a number, list or range).
func quantityArg(args []string, nFlag string, nGiven bool) (expansion.Provider, []int, error) {
	if len(args) != 1 {
		return nil, nil, usageErr("name one quantity: %s", expansion.KnownNames())
	}
	p, n, err := expansion.ParseName(args[0])
	if err != nil {
		return nil, nil, usageErr("%v", err)
	}
	q := p.Quantity()
	if !q.Indexed {
		if nGiven {
			return nil, nil, usageErr("--n does not apply to %s (only to the dimensions h_n)", q.Name)
		}
		return p, []int{-1}, nil
	}
	if n >= 0 {
		if nGiven {
			return nil, nil, usageErr("%s already names its index: drop --n, or name the family h_n with --n", args[0])
		}
		if n > conformal.MaxN {
			return nil, nil, usageErr("dimension index %d is above the supported %d", n, conformal.MaxN)
		}
		return p, []int{n}, nil
	}
	ns, err := parseNList(nFlag)
	if err != nil {
		return nil, nil, err
	}
	return p, ns, nil
}

// parseNList reads --n: an index "3", a list "1,3" or a range "1..6".
func parseNList(text string) ([]int, error) {
	var out []int
	for _, part := range strings.Split(text, ",") {
		lo, hi, err := parseNRange(part)
		if err != nil {
			return nil, usageErr("cannot read --n %q: give an index such as 3, a list such as 1,3 or a range such as 1..6", text)
		}
		if hi > conformal.MaxN {
			return nil, usageErr("--n goes up to %d (got %q)", conformal.MaxN, text)
		}
		for n := lo; n <= hi; n++ {
			out = append(out, n)
		}
	}
	return out, nil
}

// libErr turns a request the library refused (expansion.ErrInput) into a
// usage error (exit status 2); other errors stay computation failures.
func libErr(err error) error {
	if err == nil {
		return nil
	}
	if errors.Is(err, expansion.ErrInput) {
		msg := strings.TrimPrefix(err.Error(), expansion.ErrInput.Error()+": ")
		return usageErr("%s", msg)
	}
	return err
}

// itoaN prints a dimension index ("" for none).
func itoaN(n int) string {
	if n < 0 {
		return ""
	}
	return strconv.Itoa(n)
}

// setFlags lists which optional request flags were given.
func setFlags(given map[string]bool) map[string]bool {
	out := map[string]bool{}
	for k, v := range given {
		if v {
			out[k] = true
		}
	}
	return out
}

// methodKey turns a method name into a JSON key: "1/q Pade" -> "x_pade",
// "two-point Pade" -> "two_point_pade".
func methodKey(m string) string {
	m = strings.ReplaceAll(strings.ToLower(m), "1/q", "x")
	return strings.NewReplacer(" ", "_", "-", "_", "/", "_").Replace(m)
}

// finishOutput adds the units note and sets the JSON document: the one
// result itself, or the list of them.
func finishOutput(out *Output, docs []map[string]any) *Output {
	out.Notes = append(out.Notes, unitsNote())
	if len(docs) == 1 {
		out.JSON = docs[0]
	} else {
		out.JSON = docs
	}
	return out
}

var _ = fmt.Sprint
