package expansion

import (
	"fmt"
	"strconv"
	"strings"
)

// Canonical quantity names, as every command prints them and every JSON
// document keys them. A dimension is named h_1, h_2, ...; HN is the family.
const (
	// HN names the family of operator dimensions h_1, h_2, ...
	HN = "h_n"
	// B is the coefficient of the conformal two-point function.
	B = "b"
	// S0 is the zero-temperature entropy per Majorana fermion.
	S0 = "S_0"
	// E0 is the ground-state energy per Majorana fermion (script-J = 1).
	E0 = "E_0"
	// AlphaS is the Schwarzian coefficient.
	AlphaS = "alpha_S"
	// AlphaG is the h = 2 correction to the zero-temperature two-point
	// function, G = G_c [1 - alpha_G/(script-J |tau|) + ...].
	AlphaG = "alpha_G"
	// AlphaK is the shift of the h = 2 kernel eigenvalue at finite
	// temperature, k(2, n) = 1 - alpha_K |n|/(beta script-J) + ...
	AlphaK = "alpha_K"
	// LogZ is log Z per Majorana fermion at one inverse temperature.
	LogZ = "logZ"
)

// Quantity describes one entry of the vocabulary.
type Quantity struct {
	// Name is the canonical name (HN for the dimensions).
	Name string
	// Aliases are further accepted spellings (matched without case and
	// without underscores).
	Aliases []string
	// Unit is the unit the values are printed in (script-J units; UnitIn
	// gives it in other units).
	Unit string
	// Scaling says how the values convert between script-J and J units.
	Scaling Scaling
	// Summary is a one-line description for help texts.
	Summary string
	// Indexed quantities take a dimension index n (h_n).
	Indexed bool
	// Exact reports that an exact value exists at every q.
	Exact bool
	// NeedsBeta reports a finite-temperature quantity (log Z), which needs an
	// inverse temperature.
	NeedsBeta bool
}

// Named returns the printed name of the quantity for index n: h_1 for
// (HN, 1), and Name otherwise.
func (q Quantity) Named(n int) string {
	if q.Indexed {
		return "h_" + strconv.Itoa(n)
	}
	return q.Name
}

// normalise folds case and drops underscores and spaces, so that S_0, s0
// and S0 are one name.
func normalise(s string) string {
	s = strings.ToLower(strings.TrimSpace(s))
	return strings.NewReplacer("_", "", " ", "").Replace(s)
}

// ParseName resolves a quantity name to its provider and, for h_1, h_2, ...,
// the index it names (n = -1 when the name carries none, as "dims" or
// "h_n"). Matching ignores case and underscores.
func ParseName(name string) (Provider, int, error) {
	key := normalise(name)
	if rest, ok := strings.CutPrefix(key, "h"); ok && rest != "" && rest != "n" {
		n, err := strconv.Atoi(rest)
		if err != nil || n < 0 {
			return nil, 0, fmt.Errorf("unknown quantity %q: known are %s", name, KnownNames())
		}
		p, ok := byKey[normalise(HN)]
		if !ok {
			return nil, 0, fmt.Errorf("no provider for the dimensions is registered")
		}
		return p, n, nil
	}
	p, ok := byKey[key]
	if !ok {
		return nil, 0, fmt.Errorf("unknown quantity %q: known are %s", name, KnownNames())
	}
	return p, -1, nil
}

// KnownNames lists the canonical names and aliases for messages and help.
func KnownNames() string {
	var parts []string
	for _, p := range registry {
		q := p.Quantity()
		s := q.Name
		if q.Indexed {
			s = "h_1, h_2, ... (h_n)"
		}
		if len(q.Aliases) > 0 {
			s += " [" + strings.Join(q.Aliases, ", ") + "]"
		}
		parts = append(parts, s)
	}
	return strings.Join(parts, "; ")
}
