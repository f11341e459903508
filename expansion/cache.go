package expansion

import (
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math/big"
	"os"
	"path/filepath"
	"strings"

	"qbridge/expansion/conformal"
	"qbridge/expansion/energy"
)

// Cache stores computed coefficient sets (they do not depend on q) as JSON
// files, one per quantity, end, order and precision, stamped with the code
// version that wrote them and a checksum. A file that does not parse, whose
// checksum does not match, or that another version or another key wrote is
// ignored with a warning and overwritten by a fresh computation: nothing
// from the cache is used without these checks. A nil *Cache, or one with
// an empty Dir, stores nothing.
type Cache struct {
	// Dir is the directory of the files (see DefaultCacheDir).
	Dir string
	// Version identifies the code that computes the coefficients; a file
	// written under another version is not used.
	Version string
	// Warn receives one line per ignored file or failed write; nil discards.
	Warn io.Writer
}

// cacheFormat names the layout of the files, so that a change of layout is
// recognised as foreign, too.
const cacheFormat = "qbridge coefficient cache 1"

// cacheSubdir is the subdirectory of Dir holding the coefficient files.
const cacheSubdir = "series"

// DefaultCacheDir returns os.UserCacheDir()/qbridge.
func DefaultCacheDir() (string, error) {
	d, err := os.UserCacheDir()
	if err != nil {
		return "", err
	}
	return filepath.Join(d, "qbridge"), nil
}

// CacheKey identifies one stored coefficient set.
type CacheKey struct {
	// Quantity is the function expanded: h_1, b^q, S_0, E_0 ground, ...
	Quantity string `json:"quantity"`
	// End is "2" or "inf".
	End string `json:"end"`
	// Order is the highest power.
	Order int `json:"order"`
	// Precision is the working precision: "21 digits" or "float64".
	Precision string `json:"precision"`
}

// fileName is the key as a file name: only letters, digits, '-', '_', '.'.
func (k CacheKey) fileName() string {
	s := fmt.Sprintf("%s_around-%s_order-%d_%s", k.Quantity, k.End, k.Order, k.Precision)
	s = strings.NewReplacer("^", "pow", " ", "-", "/", "-").Replace(s)
	var b strings.Builder
	for _, r := range s {
		if r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '-' || r == '_' || r == '.' {
			b.WriteRune(r)
		} else {
			b.WriteByte('-')
		}
	}
	return b.String() + ".json"
}

// cacheFile is the stored document. Checksum is the SHA-256 of the JSON
// encoding of the same document with an empty Checksum.
type cacheFile struct {
	Format   string          `json:"format"`
	Version  string          `json:"version"`
	Key      CacheKey        `json:"key"`
	Payload  json.RawMessage `json:"payload"`
	Checksum string          `json:"checksum"`
}

func (f cacheFile) sum() (string, error) {
	f.Checksum = ""
	b, err := json.Marshal(f)
	if err != nil {
		return "", err
	}
	h := sha256.Sum256(b)
	return "sha256:" + hex.EncodeToString(h[:]), nil
}

func (c *Cache) enabled() bool { return c != nil && c.Dir != "" }

func (c *Cache) warnf(format string, a ...any) {
	if c != nil && c.Warn != nil {
		fmt.Fprintf(c.Warn, "qbridge: warning: "+format+"\n", a...)
	}
}

// Path returns the file that holds key.
func (c *Cache) Path(key CacheKey) string {
	return filepath.Join(c.Dir, cacheSubdir, key.fileName())
}

// load decodes the payload stored under key into v and reports whether it
// did; a missing file is a silent miss, every other failure a warning.
func (c *Cache) load(key CacheKey, v any, valid func() error) bool {
	if !c.enabled() {
		return false
	}
	path := c.Path(key)
	data, err := os.ReadFile(path)
	if errors.Is(err, os.ErrNotExist) {
		return false
	}
	if err != nil {
		c.warnf("cannot read cache file %s (%v); recomputing", path, err)
		return false
	}
	var f cacheFile
	if err := json.Unmarshal(data, &f); err != nil {
		c.warnf("ignoring corrupt cache file %s (%v); recomputing", path, err)
		return false
	}
	if f.Format != cacheFormat {
		c.warnf("ignoring foreign cache file %s (format %q, want %q); recomputing", path, f.Format, cacheFormat)
		return false
	}
	if want, err := f.sum(); err != nil || want != f.Checksum {
		c.warnf("ignoring corrupt cache file %s (checksum does not match its contents); recomputing", path)
		return false
	}
	if f.Version != c.Version {
		c.warnf("ignoring cache file %s written by another code version (%q, this is %q); recomputing", path, f.Version, c.Version)
		return false
	}
	if f.Key != key {
		c.warnf("ignoring foreign cache file %s (it holds %+v, wanted %+v); recomputing", path, f.Key, key)
		return false
	}
	if err := json.Unmarshal(f.Payload, v); err != nil {
		c.warnf("ignoring corrupt cache file %s (%v); recomputing", path, err)
		return false
	}
	if err := valid(); err != nil {
		c.warnf("ignoring corrupt cache file %s (%v); recomputing", path, err)
		return false
	}
	return true
}

// store writes v under key (atomically: a temporary file renamed into
// place); a failure is a warning, the computation goes on.
func (c *Cache) store(key CacheKey, v any) {
	if !c.enabled() {
		return
	}
	payload, err := json.Marshal(v)
	if err != nil {
		c.warnf("cannot encode %s for the cache: %v", key.fileName(), err)
		return
	}
	f := cacheFile{Format: cacheFormat, Version: c.Version, Key: key, Payload: payload}
	if f.Checksum, err = f.sum(); err != nil {
		c.warnf("cannot encode %s for the cache: %v", key.fileName(), err)
		return
	}
	data, err := json.MarshalIndent(f, "", " ")
	if err != nil {
		c.warnf("cannot encode %s for the cache: %v", key.fileName(), err)
		return
	}
	dir := filepath.Join(c.Dir, cacheSubdir)
	if err := os.MkdirAll(dir, 0o755); err != nil {
		c.warnf("cannot create cache directory %s: %v", dir, err)
		return
	}
	tmp, err := os.CreateTemp(dir, ".tmp-*")
	if err != nil {
		c.warnf("cannot write to cache directory %s: %v", dir, err)
		return
	}
	_, werr := tmp.Write(append(data, '\n'))
	cerr := tmp.Close()
	if werr != nil || cerr != nil {
		os.Remove(tmp.Name())
		c.warnf("cannot write cache file in %s: %v", dir, errors.Join(werr, cerr))
		return
	}
	if err := os.Rename(tmp.Name(), c.Path(key)); err != nil {
		os.Remove(tmp.Name())
		c.warnf("cannot write cache file %s: %v", c.Path(key), err)
	}
}

// Clear removes every coefficient file (and leftover temporary file) of
// the cache and returns how many it removed. Files of other programs in
// Dir are left alone.
func (c *Cache) Clear() (int, error) {
	if !c.enabled() {
		return 0, errors.New("no cache directory")
	}
	dir := filepath.Join(c.Dir, cacheSubdir)
	ents, err := os.ReadDir(dir)
	if errors.Is(err, os.ErrNotExist) {
		return 0, nil
	}
	if err != nil {
		return 0, err
	}
	n := 0
	for _, e := range ents {
		name := e.Name()
		if e.IsDir() || !(strings.HasSuffix(name, ".json") || strings.HasPrefix(name, ".tmp-")) {
			continue
		}
		if err := os.Remove(filepath.Join(dir, name)); err != nil {
			return n, err
		}
		n++
	}
	if err := os.Remove(dir); err != nil && !errors.Is(err, os.ErrNotExist) {
		// Not empty (files of someone else): leave it.
		return n, nil
	}
	return n, nil
}

// Files lists the coefficient files in the cache.
func (c *Cache) Files() ([]string, error) {
	if !c.enabled() {
		return nil, nil
	}
	m, err := filepath.Glob(filepath.Join(c.Dir, cacheSubdir, "*.json"))
	return m, err
}

// storedCoefficients is the cache payload of one conformal.Coefficients:
// numbers as decimal strings that round-trip at the stated precision.
type storedCoefficients struct {
	Quantity     string   `json:"quantity"`
	End          string   `json:"end"`
	N            int      `json:"n"`
	Prec         uint     `json:"prec"`
	Values       []string `json:"values"`
	Errors       []string `json:"errors"`
	Radius       string   `json:"radius,omitempty"`
	RadiusErr    string   `json:"radius_error,omitempty"`
	RadiusMethod string   `json:"radius_method,omitempty"`
	Method       string   `json:"method"`
}

// exactText is x as a decimal that parses back to x at x's precision.
func exactText(x *big.Float) string {
	if x == nil {
		return ""
	}
	return x.Text('g', -1)
}

func parseAt(s string, prec uint) (*big.Float, error) {
	x, _, err := big.ParseFloat(s, 10, prec, big.ToNearestEven)
	if err != nil {
		return nil, fmt.Errorf("number %q: %v", s, err)
	}
	if x.IsInf() {
		return nil, fmt.Errorf("number %q is infinite", s)
	}
	return x, nil
}

func storeCoefficients(c *conformal.Coefficients) storedCoefficients {
	s := storedCoefficients{Quantity: c.Quantity, End: c.End.String(), N: c.N, Prec: c.Prec, Method: c.Method,
		Radius: exactText(c.Radius), RadiusErr: exactText(c.RadiusErr), RadiusMethod: c.RadiusMethod}
	for i, v := range c.Values {
		s.Values = append(s.Values, exactText(v))
		s.Errors = append(s.Errors, exactText(c.Errors[i]))
	}
	return s
}

// coefficients rebuilds the set, checking that it is complete and finite
// and has the expected length.
func (s storedCoefficients) coefficients(end conformal.End, order int) (*conformal.Coefficients, error) {
	if s.End != end.String() {
		return nil, fmt.Errorf("end %q, want %q", s.End, end)
	}
	if len(s.Values) != order+1 || len(s.Errors) != order+1 {
		return nil, fmt.Errorf("%d values and %d errors, want %d", len(s.Values), len(s.Errors), order+1)
	}
	if s.Prec < 53 || s.Prec > 1<<16 {
		return nil, fmt.Errorf("precision %d bits out of range", s.Prec)
	}
	c := &conformal.Coefficients{Quantity: s.Quantity, End: end, N: s.N, Prec: s.Prec, Method: s.Method, RadiusMethod: s.RadiusMethod}
	for i := range s.Values {
		v, err := parseAt(s.Values[i], s.Prec)
		if err != nil {
			return nil, err
		}
		e, err := parseAt(s.Errors[i], 64)
		if err != nil {
			return nil, err
		}
		if e.Sign() < 0 {
			return nil, fmt.Errorf("negative error %s", s.Errors[i])
		}
		c.Values = append(c.Values, v)
		c.Errors = append(c.Errors, e)
	}
	if s.Radius != "" {
		r, err := parseAt(s.Radius, 64)
		if err != nil {
			return nil, err
		}
		re, err := parseAt(s.RadiusErr, 64)
		if err != nil {
			return nil, err
		}
		c.Radius, c.RadiusErr = r, re
	}
	return c, nil
}

// storedGround is the cache payload of an energy.GroundSeries: what the
// resummation, the series command's notes and its S_0 check use (the
// finite-beta ladder itself is not kept; LadderLen records its length).
type storedGround struct {
	Variable          string    `json:"variable"`
	E0                coeffJSON `json:"E_0"`
	S0                coeffJSON `json:"S_0"`
	AlphaS            coeffJSON `json:"alpha_S"`
	S0Exact           []float64 `json:"S_0_exact"`
	BetaMin           float64   `json:"beta_min"`
	BetaMax           float64   `json:"beta_max"`
	LadderLen         int       `json:"ladder_length"`
	FitsPerOrder      []int     `json:"fits_per_order"`
	TotalFitsPerOrder []int     `json:"total_fits_per_order"`
	E0Route           []string  `json:"E_0_route"`
	AlphaSRoute       []string  `json:"alpha_S_route"`
	ZeroTMethod       string    `json:"zero_T_method,omitempty"`
	ZeroTFailure      string    `json:"zero_T_failure,omitempty"`
	ZeroTAlphaG       coeffJSON `json:"alpha_G_zero_T"`
}

// coeffJSON is a float64 series; encoding/json writes float64 values so
// that they parse back to the same bits.
type coeffJSON struct {
	Values []float64 `json:"values"`
	Errors []float64 `json:"errors"`
}

func storeGround(g *energy.GroundSeries) storedGround {
	cj := func(c energy.Coeffs) coeffJSON { return coeffJSON{c.Values, c.Errors} }
	return storedGround{Variable: g.Variable, E0: cj(g.E0), S0: cj(g.S0), AlphaS: cj(g.AlphaS), S0Exact: g.S0Exact,
		BetaMin: g.BetaMin, BetaMax: g.BetaMax, LadderLen: len(g.Ladder), FitsPerOrder: g.FitsPerOrder, TotalFitsPerOrder: g.TotalFitsPerOrder,
		E0Route: g.E0Route, AlphaSRoute: g.AlphaSRoute, ZeroTMethod: g.ZeroTMethod, ZeroTFailure: g.ZeroTFailure, ZeroTAlphaG: cj(g.ZeroTAlphaG)}
}

func (s storedGround) ground(variable string, order int) (*energy.GroundSeries, error) {
	if s.Variable != variable {
		return nil, fmt.Errorf("variable %q, want %q", s.Variable, variable)
	}
	for i, c := range []coeffJSON{s.E0, s.S0, s.AlphaS} {
		// S_0 holds the ladder's fitted orders only (all, unless the fits
		// failed and the zero-temperature route completed E_0 and alpha_S).
		if len(c.Errors) != len(c.Values) || (i != 1 && len(c.Values) != order+1) || (i == 1 && (len(c.Values) < 1 || len(c.Values) > order+1)) {
			return nil, fmt.Errorf("%d coefficients and %d errors, want %d", len(c.Values), len(c.Errors), order+1)
		}
		for i := range c.Values {
			if !finite(c.Values[i]) || !finite(c.Errors[i]) || c.Errors[i] < 0 {
				return nil, fmt.Errorf("coefficient %d: %g +- %g", i, c.Values[i], c.Errors[i])
			}
		}
	}
	if len(s.S0Exact) != order+1 {
		return nil, fmt.Errorf("%d exact S_0 coefficients, want %d", len(s.S0Exact), order+1)
	}
	if len(s.ZeroTAlphaG.Values) != len(s.ZeroTAlphaG.Errors) {
		return nil, fmt.Errorf("zero-temperature alpha_G: %d coefficients and %d errors", len(s.ZeroTAlphaG.Values), len(s.ZeroTAlphaG.Errors))
	}
	for i := range s.ZeroTAlphaG.Values {
		if !finite(s.ZeroTAlphaG.Values[i]) || !finite(s.ZeroTAlphaG.Errors[i]) || s.ZeroTAlphaG.Errors[i] < 0 {
			return nil, fmt.Errorf("zero-temperature alpha_G coefficient %d: %g +- %g", i, s.ZeroTAlphaG.Values[i], s.ZeroTAlphaG.Errors[i])
		}
	}
	if len(s.E0Route) != order+1 || len(s.AlphaSRoute) != order+1 {
		return nil, fmt.Errorf("%d and %d coefficient routes, want %d", len(s.E0Route), len(s.AlphaSRoute), order+1)
	}
	co := func(c coeffJSON) energy.Coeffs { return energy.Coeffs{Values: c.Values, Errors: c.Errors} }
	return &energy.GroundSeries{Variable: s.Variable, E0: co(s.E0), S0: co(s.S0), AlphaS: co(s.AlphaS), S0Exact: s.S0Exact,
		BetaMin: s.BetaMin, BetaMax: s.BetaMax, FitsPerOrder: s.FitsPerOrder, TotalFitsPerOrder: s.TotalFitsPerOrder,
		E0Route: s.E0Route, AlphaSRoute: s.AlphaSRoute, ZeroTMethod: s.ZeroTMethod, ZeroTFailure: s.ZeroTFailure, LadderOrders: len(s.S0.Values),
		ZeroTAlphaG: co(s.ZeroTAlphaG)}, nil
}
