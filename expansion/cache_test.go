package expansion

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"qbridge/expansion/conformal"
)

// testCache returns a cache in a fresh temporary directory, with the
// user's cache directory pointed there too, so that no test touches the
// real one.
func testCache(t *testing.T, version string) (*Cache, *bytes.Buffer) {
	t.Helper()
	t.Setenv("XDG_CACHE_HOME", t.TempDir())
	t.Setenv("HOME", t.TempDir())
	dir, err := DefaultCacheDir()
	if err != nil {
		t.Fatal(err)
	}
	var warn bytes.Buffer
	return &Cache{Dir: dir, Version: version, Warn: &warn}, &warn
}

func coefficientsEqual(a, b *conformal.Coefficients) bool {
	if len(a.Values) != len(b.Values) || a.Prec != b.Prec || a.Method != b.Method || a.N != b.N {
		return false
	}
	for i := range a.Values {
		if a.Values[i].Cmp(b.Values[i]) != 0 || a.Errors[i].Cmp(b.Errors[i]) != 0 {
			return false
		}
	}
	return true
}

// A second build reads the series back from the cache, bit for bit, and
// says so; the files live under os.UserCacheDir()/qbridge.
func TestCacheHit(t *testing.T) {
	c, warn := testCache(t, "v-test-1")
	if !strings.HasPrefix(c.Dir, os.Getenv("XDG_CACHE_HOME")) || filepath.Base(c.Dir) != "qbridge" {
		t.Fatalf("cache dir %s is not $XDG_CACHE_HOME/qbridge", c.Dir)
	}
	a, err := NewApproximant("h_2", 8, 20, c)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(a.Notes[0], "computed") {
		t.Errorf("first build: %s", a.Notes[0])
	}
	files, _ := c.Files()
	if len(files) != 2 {
		t.Fatalf("cache files %v, want one per end", files)
	}
	b, err := NewApproximant("h_2", 8, 20, c)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(b.Notes[0], "read from the cache") {
		t.Errorf("second build: %s", b.Notes[0])
	}
	if !coefficientsEqual(a.Two, b.Two) || !coefficientsEqual(a.Inf, b.Inf) {
		t.Error("cached coefficients differ from the computed ones")
	}
	q := qp(t, "5")
	ea, _ := a.TwoPoint(q)
	eb, _ := b.TwoPoint(q)
	if ea.Value.Cmp(eb.Value) != 0 || ea.Err.Cmp(eb.Err) != 0 {
		t.Errorf("two-point from the cache %v, computed %v", eb.Value, ea.Value)
	}
	if warn.Len() != 0 {
		t.Errorf("warnings: %s", warn.String())
	}
	// Another order or precision is another key.
	if d, _ := NewApproximant("h_2", 8, 25, c); !strings.Contains(d.Notes[0], "computed") {
		t.Errorf("other precision: %s", d.Notes[0])
	}
}

// A file written by another code version is not used: a warning, a fresh
// computation, and the file is rewritten under the new version.
func TestCacheVersionChange(t *testing.T) {
	c, warn := testCache(t, "v-old")
	if _, err := NewApproximant("b", 6, 20, c); err != nil {
		t.Fatal(err)
	}
	c2 := &Cache{Dir: c.Dir, Version: "v-new", Warn: warn}
	a, err := NewApproximant("b", 6, 20, c2)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(a.Notes[0], "computed") || !strings.Contains(warn.String(), "another code version") {
		t.Errorf("note %q, warnings %q", a.Notes[0], warn.String())
	}
	warn.Reset()
	a, _ = NewApproximant("b", 6, 20, c2)
	if !strings.Contains(a.Notes[0], "read from the cache") || warn.Len() != 0 {
		t.Errorf("after the rewrite: note %q, warnings %q", a.Notes[0], warn.String())
	}
}

// Corrupt and foreign files are ignored with a warning, never trusted:
// garbage bytes, a changed coefficient under the old checksum, another
// file's contents under this key's name, an unknown format. Each time the
// result equals a fresh computation.
func TestCacheCorruptFiles(t *testing.T) {
	c, warn := testCache(t, "v-test")
	fresh, err := NewApproximant("s0", 6, 20, nil)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := NewApproximant("s0", 6, 20, c); err != nil {
		t.Fatal(err)
	}
	key := CacheKey{Quantity: "S_0", End: "2", Order: 6, Precision: "20 digits"}
	path := c.Path(key)
	good, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := NewApproximant("h_1", 6, 20, c); err != nil {
		t.Fatal(err)
	}
	other, err := os.ReadFile(c.Path(CacheKey{Quantity: "h_1", End: "2", Order: 6, Precision: "20 digits"}))
	if err != nil {
		t.Fatal(err)
	}
	tamper := func(data []byte) []byte {
		var f cacheFile
		if err := json.Unmarshal(data, &f); err != nil {
			t.Fatal(err)
		}
		var p storedCoefficients
		if err := json.Unmarshal(f.Payload, &p); err != nil {
			t.Fatal(err)
		}
		p.Values[2] = "0.125"
		f.Payload, _ = json.Marshal(p)
		out, _ := json.Marshal(f)
		return out
	}
	reformat := func(data []byte) []byte {
		return bytes.Replace(data, []byte(cacheFormat), []byte("some other program"), 1)
	}
	for _, c2 := range []struct {
		name, want string
		data       []byte
	}{
		{"garbage", "corrupt", []byte("\x00\x01 not json")},
		{"truncated", "corrupt", good[:len(good)/2]},
		{"tampered value", "checksum", tamper(good)},
		{"another key", "foreign", other},
		{"another format", "foreign", reformat(good)},
	} {
		if err := os.WriteFile(path, c2.data, 0o644); err != nil {
			t.Fatal(err)
		}
		warn.Reset()
		a, err := NewApproximant("s0", 6, 20, c)
		if err != nil {
			t.Fatalf("%s: %v", c2.name, err)
		}
		if !strings.Contains(warn.String(), c2.want) || strings.Count(warn.String(), "\n") != 1 {
			t.Errorf("%s: warnings %q, want one line with %q", c2.name, warn.String(), c2.want)
		}
		if !coefficientsEqual(a.Two, fresh.Two) {
			t.Errorf("%s: coefficients differ from a fresh computation", c2.name)
		}
	}
}

// Clear removes the coefficient files and nothing else.
func TestCacheClear(t *testing.T) {
	c, _ := testCache(t, "v")
	if _, err := NewApproximant("h_1", 4, 20, c); err != nil {
		t.Fatal(err)
	}
	keep := filepath.Join(c.Dir, "unrelated.txt")
	if err := os.WriteFile(keep, []byte("x"), 0o644); err != nil {
		t.Fatal(err)
	}
	n, err := c.Clear()
	if err != nil || n != 2 {
		t.Fatalf("Clear: %d files, %v; want 2", n, err)
	}
	if files, _ := c.Files(); len(files) != 0 {
		t.Errorf("left %v", files)
	}
	if _, err := os.Stat(keep); err != nil {
		t.Errorf("Clear removed an unrelated file: %v", err)
	}
}

// The ground series of the energies survive the round trip through the
// cache payload bit for bit.
func TestStoredGroundRoundTrip(t *testing.T) {
	g := storedGround{Variable: "eps", BetaMin: 50, BetaMax: 6400,
		E0:      coeffJSON{[]float64{-0.2122065907892921, 0.1 / 3}, []float64{1e-15, 2.5e-13}},
		S0:      coeffJSON{[]float64{0, 0.3}, []float64{1e-12, 1e-11}},
		AlphaS:  coeffJSON{[]float64{0.01326291192432, 1.0 / 7}, []float64{1e-9, 1e-8}},
		S0Exact: []float64{0, 0.3},
		E0Route: []string{"T = 0 eps-series", "finite-T ladder"}, AlphaSRoute: []string{"T = 0 eps-series", "T = 0 eps-series"}, ZeroTMethod: "zero-T"}
	raw, err := json.Marshal(g)
	if err != nil {
		t.Fatal(err)
	}
	var back storedGround
	if err := json.Unmarshal(raw, &back); err != nil {
		t.Fatal(err)
	}
	gs, err := back.ground("eps", 1)
	if err != nil {
		t.Fatal(err)
	}
	if gs.E0.Values[1] != 0.1/3 || gs.AlphaS.Values[1] != 1.0/7 || gs.E0.Errors[1] != 2.5e-13 {
		t.Errorf("round trip changed values: %+v", gs)
	}
	if _, err := back.ground("x", 1); err == nil {
		t.Error("wrong variable accepted")
	}
	if _, err := back.ground("eps", 2); err == nil {
		t.Error("wrong order accepted")
	}
}
