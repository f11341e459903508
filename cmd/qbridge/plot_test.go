package main

import (
	"encoding/csv"
	"encoding/xml"
	"errors"
	"image"
	_ "image/png"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// svgSize parses an SVG file as XML and returns the width and height of
// its root element in points.
func svgSize(t *testing.T, path string) (w, h float64) {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	var root struct {
		XMLName xml.Name
		Width   string `xml:"width,attr"`
		Height  string `xml:"height,attr"`
		Inner   []byte `xml:",innerxml"`
	}
	if err := xml.NewDecoder(f).Decode(&root); err != nil {
		t.Fatalf("%s is not valid XML: %v", path, err)
	}
	if root.XMLName.Local != "svg" {
		t.Fatalf("%s: root element %q", path, root.XMLName.Local)
	}
	pt := func(s string) float64 {
		v, err := strconv.ParseFloat(strings.TrimSuffix(s, "pt"), 64)
		if err != nil {
			t.Fatalf("size %q", s)
		}
		return v
	}
	if len(root.Inner) < 1000 {
		t.Errorf("%s: almost empty (%d bytes)", path, len(root.Inner))
	}
	return pt(root.Width), pt(root.Height)
}

// pngSize decodes a PNG and returns its size in pixels.
func pngSize(t *testing.T, path string) (w, h int) {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	img, format, err := image.Decode(f)
	if err != nil || format != "png" {
		t.Fatalf("%s: %v (format %q)", path, err, format)
	}
	b := img.Bounds()
	return b.Dx(), b.Dy()
}

// The main figure as SVG and PNG: valid files of the requested size, and
// the CSV behind it carries the table's two-point values at the same q.
func TestPlotFiles(t *testing.T) {
	isolateCache(t)
	dir := t.TempDir()
	svg, png, data := filepath.Join(dir, "h1.svg"), filepath.Join(dir, "h1.png"), filepath.Join(dir, "h1.csv")
	if _, err := runCLI(t, "plot", "h_1", "--q", "2..6:0.5", "--order", "8", "--out", svg, "--data", data); err != nil {
		t.Fatal(err)
	}
	w, h := svgSize(t, svg)
	if math.Abs(w-3.4*72) > 0.01 || math.Abs(h-3.4*72*0.75*2) > 0.01 {
		t.Errorf("SVG %gx%g pt, want 244.8 x 367.2 (3.4 in wide, two panels)", w, h)
	}
	if _, err := runCLI(t, "plot", "h_1", "--q", "2..6:0.5", "--order", "8", "--out", png, "--width", "8.6cm", "--dpi", "100", "--residual=false"); err != nil {
		t.Fatal(err)
	}
	pw, ph := pngSize(t, png)
	if want := int(math.Round(8.6 / 2.54 * 100)); pw != want || ph != int(math.Round(8.6/2.54*100*0.75)) {
		t.Errorf("PNG %dx%d px, want %d wide at 100 dpi", pw, ph, want)
	}
	f, err := os.Open(data)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	recs, err := csv.NewReader(f).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if strings.Join(recs[0], ",") != "curve,x,y,y_error" {
		t.Fatalf("CSV header %v", recs[0])
	}
	tp := map[string]float64{}
	for _, r := range recs[1:] {
		if r[0] == "two-point Pade" {
			y, _ := strconv.ParseFloat(r[2], 64)
			tp[r[1]] = y
		}
	}
	out, err := runCLI(t, "table", "h_1", "--q", "2..6:0.5", "--method", "resummed", "--order", "8", "--format", "json")
	if err != nil {
		t.Fatal(err)
	}
	rows := tableRows(t, out)
	if len(tp) != len(rows) {
		t.Fatalf("CSV has %d two-point points, table %d rows", len(tp), len(rows))
	}
	for _, r := range rows {
		v, _ := decimal(t, r["h_1"].(map[string]any)["value"]).Float64()
		if got := tp[r["q"].(string)]; math.Abs(got-v) > 1e-15*math.Abs(v) {
			t.Errorf("q=%s: CSV %v, table %v", r["q"], got, v)
		}
	}
}

// The coefficient and pole figures are valid files; the CSV of the
// coefficients holds |c_k| of the series (h_1 around q = 2: c_2 = -5/6,
// an exact closed form, PSLQ-verified and checked against mpmath in
// expansion/conformal).
func TestPlotCoefficientsAndPoles(t *testing.T) {
	isolateCache(t)
	dir := t.TempDir()
	data := filepath.Join(dir, "c.csv")
	if _, err := runCLI(t, "plot", "coefficients", "h_1", "--around", "2", "--order", "12", "--out", filepath.Join(dir, "c.svg"), "--data", data); err != nil {
		t.Fatal(err)
	}
	svgSize(t, filepath.Join(dir, "c.svg"))
	raw, err := os.ReadFile(data)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(raw), "|c_k|,2,0.8333333333333333") {
		t.Errorf("CSV lacks |c_2| = 5/6:\n%s", raw)
	}
	if _, err := runCLI(t, "plot", "poles", "s0", "--around", "inf", "--order", "10", "--out", filepath.Join(dir, "p.png"), "--dpi", "72"); err != nil {
		t.Fatal(err)
	}
	if w, h := pngSize(t, filepath.Join(dir, "p.png")); w != 245 || h != 245 {
		t.Errorf("poles PNG %dx%d, want 245x245 (3.4 in at 72 dpi, square)", w, h)
	}
}

// The committed example figure (README) is a valid SVG, 3.4 in wide.
func TestExampleFigure(t *testing.T) {
	w, _ := svgSize(t, "../../testdata/figures/alpha_S.svg")
	if math.Abs(w-3.4*72) > 0.01 {
		t.Errorf("example figure %g pt wide, want 244.8", w)
	}
}

// Bad plot requests are usage errors.
func TestPlotBadInput(t *testing.T) {
	isolateCache(t)
	dir := t.TempDir()
	for _, args := range [][]string{
		{"plot", "h_1", "--q", "2..4:1"},
		{"plot", "h_1", "--q", "2..4:1", "--out", filepath.Join(dir, "x.pdf")},
		{"plot", "h_1", "--q", "2..4:1", "--out", filepath.Join(dir, "x.svg"), "--width", "wide"},
		{"plot", "h_1", "--q", "2..4:1", "--out", filepath.Join(dir, "x.svg"), "--show", "everything"},
		{"plot", "h_1", "--q", "4", "--out", filepath.Join(dir, "x.svg")},
		{"plot", "h_n", "--q", "2..4:1", "--out", filepath.Join(dir, "x.svg")},
		{"plot", "coefficients", "h_1", "--around", "3", "--out", filepath.Join(dir, "x.svg")},
		{"plot", "poles", "logz", "--out", filepath.Join(dir, "x.svg")},
	} {
		_, err := runCLI(t, args...)
		var ue *usageError
		if !errors.As(err, &ue) {
			t.Errorf("%v: got %v, want a usage error", args, err)
		}
	}
}
