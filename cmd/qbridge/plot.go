package main

import (
	"encoding/csv"
	"fmt"
	"image/color"
	"io"
	"math"
	"math/big"
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
	"sync"

	"github.com/spf13/cobra"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
	"qbridge/series"
	"qbridge/series/pade"
)

var plotFlags struct {
	q        string
	out      string
	data     string
	order    int
	show     string
	points   string
	residual bool
	width    string
	height   string
	around   string
	dpi      int
}

// plotShows are the curve families of the main figure.
var plotShows = []string{"partial", "pade", "twopoint", "reference"}

var plotCmd = &cobra.Command{
	Use:   "plot QUANTITY",
	Short: "Figures (SVG or PNG): a quantity vs q with both expansions and their resummations",
	Long: `Draw a quantity against q: partial sums of both series at three orders (thin
lines), the best Pade of each series (dashed), the two-point Pade (thick), and
reference values as points with error bars (exact for h_n, b, S_0; the direct
solver for E_0 and alpha_S, at --points, seconds each). A second panel shows
the difference from the reference on a log scale (--residual=false drops it).
  qbridge plot coefficients QUANTITY --around 2|inf   |c_k| and the radius estimates
  qbridge plot poles QUANTITY --around 2|inf          poles and zeros of the Pade approximants
The file type follows --out (.svg or .png); the default size suits a journal
column (3.4 in wide) and scales for slides. --data FILE.csv writes the numbers
behind the figure (columns curve, x, y, y_error). Units script-J = 1; with
--units J the figure of E_0, alpha_S, alpha_G, alpha_K against q is drawn in
units J = 1 (every value times its factor at its q); the coefficient and
pole figures of those quantities need script-J (no series in 1/q exists in
J units).`,
	Example: `  qbridge plot alpha_S --q 2..12:0.25 --out alpha.svg
  qbridge plot h_1 --q 2..40:*1.05 --out h1.png --data h1.csv
  qbridge plot coefficients s0 --around inf --out s0coef.svg
  qbridge plot poles h_2 --around 2 --out poles.svg`,
	Args: cobra.ArbitraryArgs,
	RunE: runPlot,
}

var plotCoefCmd = &cobra.Command{
	Use:   "coefficients QUANTITY",
	Short: "|c_k| on a log scale and the root/ratio-test radius against k",
	Args:  cobra.ArbitraryArgs,
	RunE:  runPlotCoefficients,
}

var plotPolesCmd = &cobra.Command{
	Use:   "poles QUANTITY",
	Short: "Poles and zeros of the Pade approximants in the complex plane of eps or x",
	Args:  cobra.ArbitraryArgs,
	RunE:  runPlotPoles,
}

func init() {
	for _, c := range []*cobra.Command{plotCmd, plotCoefCmd, plotPolesCmd} {
		f := c.Flags()
		f.StringVar(&plotFlags.out, "out", "", "output file: FILE.svg or FILE.png (required)")
		f.StringVar(&plotFlags.data, "data", "", "also write the data behind the figure as CSV to this file")
		f.IntVar(&plotFlags.order, "order", 16, "series order at each end")
		f.StringVar(&plotFlags.width, "width", "3.4in", "figure width (in, cm, mm or pt)")
		f.StringVar(&plotFlags.height, "height", "", "figure height (default: 0.75 width per panel)")
		f.IntVar(&plotFlags.dpi, "dpi", 300, "PNG resolution in dots per inch")
	}
	f := plotCmd.Flags()
	f.StringVar(&plotFlags.q, "q", "2..20:0.25", "q range: a list, a range a..b:step or a..b:*factor (inf is left out)")
	f.StringVar(&plotFlags.show, "show", strings.Join(plotShows, ","), "curves to draw: "+strings.Join(plotShows, ", "))
	f.StringVar(&plotFlags.points, "points", "", "q values of the reference points (default: 12 of the --q values for exact quantities; 3,4,6 for the direct solver)")
	f.BoolVar(&plotFlags.residual, "residual", true, "add a panel with the difference from the reference on a log scale")
	for _, c := range []*cobra.Command{plotCoefCmd, plotPolesCmd} {
		c.Flags().StringVar(&plotFlags.around, "around", "2", "expansion point: 2 (variable eps) or inf (variable x = 1/q)")
	}
	plotCmd.AddCommand(plotCoefCmd, plotPolesCmd)
	rootCmd.AddCommand(plotCmd)
}

// curve is one data set of a figure: a line or points with errors.
type curve struct {
	name     string
	panel    int // 0 main, 1 residual
	points   bool
	style    int // index into the style table
	thick    bool
	x, y     []float64
	yerr     []float64    // nil for lines
	big      []*big.Float // the values at full precision, for differences (may be nil)
	nolegend bool
}

// figure is what a plot command draws and writes as CSV.
type figure struct {
	title  string
	xlabel string
	ylabel []string // per panel
	logX   bool
	logY   []bool
	curves []curve
	marks  []curve // drawn, not in the legend
	equal  bool    // equal axis scales (complex plane)
	// yRange fixes the main panel's y range (nil: automatic).
	yRange []float64
}

// lengthFlag reads 3.4in, 8.6cm, 86mm or 245pt.
func lengthFlag(name, s string) (vg.Length, error) {
	s = strings.TrimSpace(s)
	units := []struct {
		suffix string
		unit   vg.Length
	}{{"in", vg.Inch}, {"cm", vg.Centimeter}, {"mm", vg.Millimeter}, {"pt", vg.Points(1)}}
	for _, u := range units {
		if num, ok := strings.CutSuffix(s, u.suffix); ok {
			v, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
			if err != nil || !(v > 0) || math.IsInf(v, 0) {
				break
			}
			l := vg.Length(v) * u.unit
			if l < vg.Inch || l > 40*vg.Inch {
				return 0, usageErr("--%s %q: between 1 in and 40 in, please", name, s)
			}
			return l, nil
		}
	}
	return 0, usageErr("--%s %q: give a length such as 3.4in, 8.6cm, 86mm or 245pt", name, s)
}

// plotFormat is the file type from --out.
func plotFormat(out string) (string, error) {
	if out == "" {
		return "", usageErr("--out FILE.svg or FILE.png is required")
	}
	switch strings.ToLower(filepath.Ext(out)) {
	case ".svg":
		return "svg", nil
	case ".png":
		return "png", nil
	}
	return "", usageErr("--out %q: the file must end in .svg or .png", out)
}

// plotStyles survive greyscale printing: each has its own dash pattern and
// marker, and the colours differ in lightness as well as hue.
var plotStyles = []struct {
	c      color.Color
	dashes []vg.Length
	glyph  draw.GlyphDrawer
}{
	{color.RGBA{0, 0, 0, 255}, nil, draw.CircleGlyph{}},
	{color.RGBA{0, 90, 181, 255}, []vg.Length{vg.Points(4), vg.Points(2)}, draw.SquareGlyph{}},
	{color.RGBA{220, 50, 32, 255}, []vg.Length{vg.Points(1), vg.Points(1.5)}, draw.TriangleGlyph{}},
	{color.RGBA{0, 140, 70, 255}, []vg.Length{vg.Points(5), vg.Points(1.5), vg.Points(1), vg.Points(1.5)}, draw.CrossGlyph{}},
	{color.RGBA{150, 150, 150, 255}, []vg.Length{vg.Points(2), vg.Points(2)}, draw.PlusGlyph{}},
	{color.RGBA{120, 60, 160, 255}, []vg.Length{vg.Points(6), vg.Points(3)}, draw.RingGlyph{}},
	{color.RGBA{230, 159, 0, 255}, []vg.Length{vg.Points(1), vg.Points(3)}, draw.PyramidGlyph{}},
}

// decadeTicks marks the powers of ten of a log axis, labelling at most
// about six of them as 1e-10, 1e-8, ...
type decadeTicks struct{}

// Ticks implements plot.Ticker.
func (decadeTicks) Ticks(lo64, hi64 float64) []plot.Tick {
	min, max := lo64, hi64
	if !(min > 0) || !(max > min) {
		return nil
	}
	lo, hi := int(math.Floor(math.Log10(min))), int(math.Ceil(math.Log10(max)))
	every := (hi - lo + 5) / 6
	if every < 1 {
		every = 1
	}
	var ts []plot.Tick
	for e := lo; e <= hi; e++ {
		v := math.Pow(10, float64(e))
		if v < min*(1-1e-9) || v > max*(1+1e-9) {
			continue
		}
		t := plot.Tick{Value: v}
		if e%every == 0 {
			t.Label = "1e" + strconv.Itoa(e)
			if e >= 0 && e <= 3 {
				t.Label = strconv.FormatFloat(v, 'f', 0, 64)
			}
		}
		ts = append(ts, t)
	}
	return ts
}

// render draws the figure to a file of the given format and size.
func (f *figure) render(path, format string, w, h vg.Length, dpi int) error {
	panels := 1
	for _, c := range append(append([]curve{}, f.curves...), f.marks...) {
		panels = max(panels, c.panel+1)
	}
	if h == 0 {
		h = vg.Length(float64(w) * 0.75 * float64(panels))
	}
	var plots [][]*plot.Plot
	for pi := 0; pi < panels; pi++ {
		p := plot.New()
		p.Title.TextStyle.Font.Size = vg.Points(8)
		p.X.Label.TextStyle.Font.Size = vg.Points(8)
		p.Y.Label.TextStyle.Font.Size = vg.Points(8)
		p.X.Tick.Label.Font.Size = vg.Points(7)
		p.Y.Tick.Label.Font.Size = vg.Points(7)
		p.Legend.TextStyle.Font.Size = vg.Points(6)
		p.Legend.Top = true
		p.Legend.ThumbnailWidth = vg.Points(18)
		if pi == 0 {
			p.Title.Text = f.title
		}
		if pi == panels-1 {
			p.X.Label.Text = f.xlabel
		}
		p.Y.Label.Text = f.ylabel[pi]
		if f.logX {
			p.X.Scale = plot.LogScale{}
			p.X.Tick.Marker = decadeTicks{}
		}
		if f.logY[pi] {
			p.Y.Scale = plot.LogScale{}
			p.Y.Tick.Marker = decadeTicks{}
		}
		plots = append(plots, []*plot.Plot{p})
	}
	add := func(c curve, legend bool) error {
		p := plots[c.panel][0]
		st := plotStyles[c.style%len(plotStyles)]
		var xys plotter.XYs
		var errs plotter.YErrors
		for i := range c.x {
			if !finite(c.x[i]) || !finite(c.y[i]) || (f.logY[c.panel] && c.y[i] <= 0) || (f.logX && c.x[i] <= 0) {
				continue
			}
			xys = append(xys, plotter.XY{X: c.x[i], Y: c.y[i]})
			if c.yerr != nil {
				e := c.yerr[i]
				if !finite(e) {
					e = 0
				}
				errs = append(errs, struct{ Low, High float64 }{e, e})
			}
		}
		if len(xys) == 0 {
			return nil
		}
		if c.points {
			s, err := plotter.NewScatter(xys)
			if err != nil {
				return err
			}
			s.GlyphStyle = draw.GlyphStyle{Color: st.c, Radius: vg.Points(1.8), Shape: st.glyph}
			p.Add(s)
			if c.yerr != nil && !f.logY[c.panel] {
				eb, err := plotter.NewYErrorBars(struct {
					plotter.XYs
					plotter.YErrors
				}{xys, errs})
				if err != nil {
					return err
				}
				eb.LineStyle.Color = st.c
				eb.LineStyle.Width = vg.Points(0.6)
				eb.CapWidth = vg.Points(3)
				p.Add(eb)
			}
			if legend {
				p.Legend.Add(c.name, s)
			}
			return nil
		}
		l, err := plotter.NewLine(xys)
		if err != nil {
			return err
		}
		l.LineStyle = draw.LineStyle{Color: st.c, Width: vg.Points(0.6), Dashes: st.dashes}
		if c.thick {
			l.LineStyle.Width = vg.Points(1.6)
		}
		p.Add(l)
		if legend {
			p.Legend.Add(c.name, l)
		}
		return nil
	}
	for _, c := range f.marks {
		if err := add(c, false); err != nil {
			return err
		}
	}
	for _, c := range f.curves {
		if err := add(c, !c.nolegend); err != nil {
			return err
		}
	}
	if f.yRange != nil {
		p := plots[0][0]
		p.Y.Min, p.Y.Max = f.yRange[0], f.yRange[1]
	}
	if f.equal {
		p := plots[0][0]
		r := math.Max(math.Max(-p.X.Min, p.X.Max), math.Max(-p.Y.Min, p.Y.Max))
		p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = -r, r, -r, r
	}
	var cw vg.CanvasWriterTo
	switch format {
	case "png":
		cw = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(w, h), vgimg.UseDPI(dpi))}
	default:
		cw = vgsvg.New(w, h)
	}
	dc := draw.New(cw)
	tiles := draw.Tiles{Rows: panels, Cols: 1, PadY: vg.Points(4), PadTop: vg.Points(2), PadBottom: vg.Points(2), PadLeft: vg.Points(2), PadRight: vg.Points(4)}
	canvases := plot.Align(plots, tiles, dc)
	for i := range plots {
		plots[i][0].Draw(canvases[i][0])
	}
	file, err := os.Create(path)
	if err != nil {
		return err
	}
	if _, err := cw.WriteTo(file); err != nil {
		file.Close()
		return err
	}
	return file.Close()
}

// writeCSV writes every curve as rows curve, x, y, y_error (empty when
// the curve has none).
func (f *figure) writeCSV(w io.Writer) error {
	cw := csv.NewWriter(w)
	if err := cw.Write([]string{"curve", "x", "y", "y_error"}); err != nil {
		return err
	}
	for _, c := range append(append([]curve{}, f.curves...), f.marks...) {
		name := c.name
		if c.panel == 1 {
			name = "difference: " + name
		}
		for i := range c.x {
			if !finite(c.y[i]) {
				continue
			}
			e := ""
			if c.yerr != nil && finite(c.yerr[i]) {
				e = strconv.FormatFloat(c.yerr[i], 'g', 3, 64)
			}
			if err := cw.Write([]string{name, strconv.FormatFloat(c.x[i], 'g', -1, 64), strconv.FormatFloat(c.y[i], 'g', 17, 64), e}); err != nil {
				return err
			}
		}
	}
	cw.Flush()
	return cw.Error()
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

func f64(x *big.Float) float64 {
	if x == nil {
		return math.NaN()
	}
	v, _ := x.Float64()
	return v
}

// plotSetup checks the flags every plot command shares.
func plotSetup() (format string, w, h vg.Length, err error) {
	if format, err = plotFormat(plotFlags.out); err != nil {
		return
	}
	if w, err = lengthFlag("width", plotFlags.width); err != nil {
		return
	}
	if plotFlags.height != "" {
		if h, err = lengthFlag("height", plotFlags.height); err != nil {
			return
		}
	}
	if plotFlags.dpi < 50 || plotFlags.dpi > 1200 {
		err = usageErr("--dpi must be between 50 and 1200 (got %d)", plotFlags.dpi)
	}
	if plotFlags.order < 2 || plotFlags.order > conformal.MaxOrder {
		err = usageErr("--order must be between 2 and %d (got %d)", conformal.MaxOrder, plotFlags.order)
	}
	return
}

// plotName resolves the one quantity of a plot command.
func plotName(args []string) (string, error) {
	if len(args) != 1 {
		return "", usageErr("name one quantity: %s", expansion.KnownNames())
	}
	p, n, err := expansion.ParseName(args[0])
	if err != nil {
		return "", usageErr("%v", err)
	}
	q := p.Quantity()
	if q.NeedsBeta {
		return "", usageErr("%s depends on the inverse temperature and is not plotted over q", q.Name)
	}
	if q.Indexed && n < 0 {
		return "", usageErr("name one dimension: h_1, h_2, ...")
	}
	return q.Named(n), nil
}

// finish writes the figure and its data and reports the files.
func (f *figure) finish(cmd *cobra.Command, format string, w, h vg.Length, notes []string) error {
	if err := f.render(plotFlags.out, format, w, h, plotFlags.dpi); err != nil {
		return fmt.Errorf("writing %s: %v", plotFlags.out, err)
	}
	files := []string{plotFlags.out}
	if plotFlags.data != "" {
		df, err := os.Create(plotFlags.data)
		if err != nil {
			return err
		}
		if err := f.writeCSV(df); err != nil {
			df.Close()
			return err
		}
		if err := df.Close(); err != nil {
			return err
		}
		files = append(files, plotFlags.data)
	}
	tab := Table{Header: []string{"file"}}
	for _, fl := range files {
		tab.Rows = append(tab.Rows, []string{fl})
	}
	return emit(cmd, &Output{JSON: map[string]any{"files": files, "notes": notes}, Tables: []Table{tab}, Notes: notes})
}

func runPlot(cmd *cobra.Command, args []string) error {
	format, w, h, err := plotSetup()
	if err != nil {
		return err
	}
	name, err := plotName(args)
	if err != nil {
		return err
	}
	show := map[string]bool{}
	for _, s := range strings.Split(plotFlags.show, ",") {
		s = strings.TrimSpace(s)
		ok := false
		for _, k := range plotShows {
			ok = ok || k == s
		}
		if !ok {
			return usageErr("--show %q: choose from %s", s, strings.Join(plotShows, ", "))
		}
		show[s] = true
	}
	all, err := parseQList(plotFlags.q)
	if err != nil {
		return err
	}
	var qs []conformal.QPoint
	for _, q := range all {
		if !q.Inf {
			qs = append(qs, q)
		}
	}
	if len(qs) < 2 {
		return usageErr("--q must give at least two finite points to draw a curve")
	}
	pr := newProgress(cmd, "plot")
	defer pr.Done()
	a, err := expansion.NewApproximant(name, plotFlags.order, workDigits(), newCache(cmd, false))
	if err != nil {
		return libErr(err)
	}
	xs := make([]float64, len(qs))
	for i, q := range qs {
		xs[i] = f64(q.Q)
	}
	qmin, qmax := xs[0], xs[0]
	for _, x := range xs {
		qmin, qmax = math.Min(qmin, x), math.Max(qmax, x)
	}
	fig := &figure{
		title:  fmt.Sprintf("%s vs q: series of order %d (q = 2) and %d (q = inf)", name, a.OrderEps, a.OrderX),
		xlabel: "q",
		ylabel: []string{name + unitSuffix(name), "|difference from reference|"},
		logX:   qmax/qmin > 20,
		logY:   []bool{false, true},
	}
	// Estimates at every q, in parallel: the Pade tables depend on q.
	type atQ struct {
		tp  conformal.Estimate
		est []conformal.Estimate
	}
	vals := make([]atQ, len(qs))
	var perr error
	errs := make([]error, len(qs))
	var mu sync.Mutex
	done := 0
	parallelDo(len(qs), func(i int) {
		tp, err := a.TableEstimate(qs[i])
		if err != nil {
			errs[i] = err
			return
		}
		vals[i].tp = tp
		if show["pade"] {
			es, err := a.Estimates(qs[i])
			if err != nil {
				errs[i] = err
				return
			}
			vals[i].est = es
		}
		mu.Lock()
		done++
		pr.Update(float64(done)/float64(len(qs)), "q = "+qs[i].String())
		mu.Unlock()
	})
	for _, e := range errs {
		if e != nil && perr == nil {
			perr = e
		}
	}
	if perr != nil {
		return perr
	}
	style := 1
	var lines []curve
	if show["partial"] {
		for _, end := range []conformal.End{conformal.AroundTwo, conformal.AroundInf} {
			top := a.OrderEps
			label := "eps"
			if end == conformal.AroundInf {
				top, label = a.OrderX, "1/q"
			}
			ks := distinctOrders(top)
			var kt []string
			for _, k := range ks {
				kt = append(kt, strconv.Itoa(k))
			}
			for i, k := range ks {
				c := curve{name: fmt.Sprintf("%s partial sum, order %d", label, k), style: style, x: xs, nolegend: i < len(ks)-1}
				if i == len(ks)-1 {
					c.name = fmt.Sprintf("%s partial sums, orders %s", label, strings.Join(kt, ", "))
				}
				for _, q := range qs {
					v, err := a.PartialSum(end, k, q)
					c.y = append(c.y, f64OrNaN(v, err))
					c.big = append(c.big, v)
				}
				lines = append(lines, c)
			}
			style++
		}
	}
	if show["pade"] {
		for _, m := range []string{expansion.MethodPadeEps, expansion.MethodPadeX} {
			c := curve{name: m, style: style, x: xs}
			for _, v := range vals {
				y := math.NaN()
				var yb *big.Float
				for _, e := range v.est {
					if e.Method == m && e.Value != nil {
						y, yb = f64(e.Value), e.Value
					}
				}
				c.y = append(c.y, y)
				c.big = append(c.big, yb)
			}
			lines = append(lines, c)
			style++
		}
	}
	var twoPoint curve
	if show["twopoint"] {
		twoPoint = curve{name: expansion.MethodTwoPoint, style: 0, thick: true, x: xs}
		for _, v := range vals {
			twoPoint.y = append(twoPoint.y, f64(v.tp.Value))
			twoPoint.big = append(twoPoint.big, v.tp.Value)
			twoPoint.yerr = append(twoPoint.yerr, f64(v.tp.Err))
		}
	}
	// Thin lines first, the two-point on top.
	fig.curves = append(fig.curves, lines...)
	if show["twopoint"] {
		tc := twoPoint
		tc.yerr = nil
		fig.curves = append(fig.curves, tc)
	}
	if show["twopoint"] {
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, y := range twoPoint.y {
			if finite(y) {
				lo, hi = math.Min(lo, y), math.Max(hi, y)
			}
		}
		if span := hi - lo; span > 0 {
			fig.yRange = []float64{lo - 0.15*span, hi + 0.45*span}
		}
	}
	notes := append([]string{}, a.Notes...)
	// Reference points.
	var refQ []conformal.QPoint
	var ref curve
	refKind := "exact"
	if !a.HasExact() {
		refKind = "direct"
	}
	if show["reference"] || plotFlags.residual {
		pts := plotFlags.points
		if pts == "" && !a.HasExact() {
			pts = "3,4,6"
		}
		if pts != "" {
			all, err := parseQList(pts)
			if err != nil {
				return err
			}
			for _, q := range all {
				if !q.Inf {
					refQ = append(refQ, q)
				}
			}
		} else {
			step := max(1, len(qs)/12)
			for i := 0; i < len(qs); i += step {
				refQ = append(refQ, qs[i])
			}
		}
		res, err := expansion.Tabulate(expansion.TableRequest{Names: []string{name}, Q: refQ, Source: refKind, Order: plotFlags.order, Digits: workDigits(), Progress: pr.Update})
		if err != nil {
			return libErr(err)
		}
		ref = curve{name: refKind + " (points)", points: true, style: 0}
		for _, row := range res.Rows {
			c := row.Cells[0][0]
			if c.Value == nil {
				notes = append(notes, fmt.Sprintf("%s at q = %s: %s", refKind, row.Q, c.Missing))
				continue
			}
			ref.x = append(ref.x, f64(row.Q.Q))
			ref.y = append(ref.y, f64(c.Value))
			ref.yerr = append(ref.yerr, f64(c.Err))
		}
		if show["reference"] {
			fig.curves = append(fig.curves, ref)
		}
		notes = append(notes, res.Columns[0].Note)
	}
	if plotFlags.residual {
		// Exact quantities: each curve against the exact value at every q;
		// the energies: against the two-point Pade, with the direct points.
		var exactAt []float64
		var exactBig []*big.Float
		if a.HasExact() {
			res, err := expansion.Tabulate(expansion.TableRequest{Names: []string{name}, Q: qs, Source: expansion.SourceExact, Order: plotFlags.order, Digits: workDigits()})
			if err != nil {
				return libErr(err)
			}
			for _, row := range res.Rows {
				exactAt = append(exactAt, f64(row.Cells[0][0].Value))
				exactBig = append(exactBig, row.Cells[0][0].Value)
			}
			fig.ylabel[1] = "|curve - exact|"
		} else {
			exactAt, exactBig = twoPoint.y, twoPoint.big
			fig.ylabel[1] = "|curve - two-point Pade|"
		}
		for _, c := range fig.curves {
			if c.points || c.name == expansion.MethodTwoPoint && !a.HasExact() {
				continue
			}
			d := curve{name: c.name, panel: 1, style: c.style, thick: c.thick, x: c.x}
			for i := range c.y {
				if c.big != nil && c.big[i] != nil && exactBig != nil && exactBig[i] != nil {
					d.y = append(d.y, math.Abs(f64(new(big.Float).Sub(c.big[i], exactBig[i]))))
				} else {
					d.y = append(d.y, math.Abs(c.y[i]-exactAt[i]))
				}
			}
			fig.marks = append(fig.marks, d)
		}
		if show["twopoint"] {
			e := curve{name: "two-point error estimate", panel: 1, style: 5, x: xs, y: twoPoint.yerr}
			fig.marks = append(fig.marks, e)
		}
		if !a.HasExact() && len(ref.x) > 0 {
			d := curve{name: "direct", panel: 1, points: true, style: 0}
			for i, q := range ref.x {
				v, err := a.TableEstimate(conformal.QPoint{Q: big.NewFloat(q)})
				if err == nil && v.Value != nil {
					d.x = append(d.x, q)
					d.y = append(d.y, math.Abs(ref.y[i]-f64(v.Value)))
				}
			}
			fig.marks = append(fig.marks, d)
		}
	}
	pr.Done()
	if err := scaleFigure(fig, name); err != nil {
		return err
	}
	notes = append(notes, unitsNote())
	return fig.finish(cmd, format, w, h, notes)
}

// scaleFigure converts a figure against q from script-J units into the
// units of --units: every value and error of both panels times the factor
// of the quantity at its q (expansion.Units.Factor; the differences in the
// lower panel scale by its modulus). Pure numbers are left alone.
func scaleFigure(fig *figure, name string) error {
	s := expansion.ScalingOf(name)
	if !inJ() || s == expansion.ScaleNone {
		return nil
	}
	scale := func(c *curve) error {
		for i, q := range c.x {
			f, err := opts.units.Factor(s, q)
			if err != nil {
				return libErr(err)
			}
			if c.panel == 1 {
				f = math.Abs(f)
			}
			c.y[i] *= f
			if c.yerr != nil {
				c.yerr[i] *= math.Abs(f)
			}
			if c.big != nil && c.big[i] != nil {
				c.big[i] = new(big.Float).Mul(c.big[i], big.NewFloat(f))
			}
		}
		return nil
	}
	for i := range fig.curves {
		if err := scale(&fig.curves[i]); err != nil {
			return err
		}
	}
	for i := range fig.marks {
		if err := scale(&fig.marks[i]); err != nil {
			return err
		}
	}
	// The y range follows the scaled two-point curve, as in runPlot.
	fig.yRange = nil
	for _, c := range fig.curves {
		if c.panel != 0 || c.name != expansion.MethodTwoPoint {
			continue
		}
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, y := range c.y {
			if finite(y) {
				lo, hi = math.Min(lo, y), math.Max(hi, y)
			}
		}
		if span := hi - lo; span > 0 {
			fig.yRange = []float64{lo - 0.15*span, hi + 0.45*span}
		}
	}
	return nil
}

// unitSuffix labels the y axis with the unit.
func unitSuffix(name string) string {
	switch expansion.ScalingOf(name) {
	case expansion.ScaleEnergy:
		return " (units of " + opts.units.String() + ")"
	case expansion.ScaleInverseEnergy:
		if inJ() {
			return " (coefficient of 1/J)"
		}
	}
	return ""
}

// distinctOrders are the three orders of the partial sums drawn.
func distinctOrders(top int) []int {
	var out []int
	for _, k := range []int{top / 4, top / 2, top} {
		if k >= 1 && (len(out) == 0 || out[len(out)-1] != k) {
			out = append(out, k)
		}
	}
	return out
}

func f64OrNaN(v *big.Float, err error) float64 {
	if err != nil {
		return math.NaN()
	}
	return f64(v)
}

// parallelDo runs f(0..n-1) on two goroutines per core at most.
func parallelDo(n int, f func(i int)) {
	next := make(chan int)
	done := make(chan struct{})
	workers := min(n, 2*runtime.NumCPU())
	for w := 0; w < workers; w++ {
		go func() {
			for i := range next {
				f(i)
			}
			done <- struct{}{}
		}()
	}
	for i := 0; i < n; i++ {
		next <- i
	}
	close(next)
	for w := 0; w < workers; w++ {
		<-done
	}
}

// plotSeriesArgs resolves the quantity argument and --around of the
// coefficient and pole figures and returns the series there.
func plotSeriesArgs(args []string) (conformal.End, *conformal.Coefficients, *expansion.Approximant, error) {
	name, err := plotName(args)
	if err != nil {
		return 0, nil, nil, err
	}
	end, err := parseEnd(plotFlags.around)
	if err != nil {
		return 0, nil, nil, err
	}
	if inJ() && expansion.ScalingOf(name) != expansion.ScaleNone {
		return 0, nil, nil, usageErr("the coefficient and pole figures of %s are drawn for its series in script-J units (in J units there is no series in 1/q, and the approximated function changes): drop --units J", name)
	}
	c, a, err := plotSeries(name, end)
	return end, c, a, err
}

// plotSeries returns the coefficients of the quantity's resummed function
// around the end (those Resum uses: of b^q for b).
func plotSeries(name string, end conformal.End) (*conformal.Coefficients, *expansion.Approximant, error) {
	a, err := expansion.NewApproximant(name, plotFlags.order, workDigits(), nil)
	if err != nil {
		return nil, nil, libErr(err)
	}
	if end == conformal.AroundTwo {
		return a.Two, a, nil
	}
	return a.Inf, a, nil
}

func runPlotCoefficients(cmd *cobra.Command, args []string) error {
	format, w, h, err := plotSetup()
	if err != nil {
		return err
	}
	end, c, a, err := plotSeriesArgs(args)
	if err != nil {
		return err
	}
	v := end.Variable()
	fig := &figure{
		title:  fmt.Sprintf("%s around q = %s: coefficients of %s^k", a.Function, end, v),
		xlabel: "k",
		ylabel: []string{"|c_k|", "radius estimate in " + v},
		logY:   []bool{true, false},
	}
	mag := curve{name: "|c_k|", points: true, style: 0}
	root := curve{name: "root test |c_k|^(-1/k)", panel: 1, points: true, style: 1}
	ratio := curve{name: "ratio test |c_(k-1)/c_k|", panel: 1, points: true, style: 2}
	for k, val := range c.Values {
		m := math.Abs(f64(val))
		if m == 0 {
			continue
		}
		// Coefficients not known to 1% are left out.
		if e := f64(c.Errors[k]); e > 0.01*m {
			continue
		}
		mag.x = append(mag.x, float64(k))
		mag.y = append(mag.y, m)
		if k > 0 {
			lm := logAbs(val)
			root.x = append(root.x, float64(k))
			root.y = append(root.y, math.Exp(-lm/float64(k)))
			if k > 0 && c.Values[k-1].Sign() != 0 {
				ratio.x = append(ratio.x, float64(k))
				ratio.y = append(ratio.y, math.Exp(logAbs(c.Values[k-1])-lm))
			}
		}
	}
	fig.curves = []curve{mag, root, ratio}
	notes := []string{c.Method}
	if c.Radius != nil {
		r := f64(c.Radius)
		fig.curves = append(fig.curves, curve{name: fmt.Sprintf("fitted radius %.3g", r), panel: 1, style: 3,
			x: []float64{0, float64(len(c.Values) - 1)}, y: []float64{r, r}})
		notes = append(notes, fmt.Sprintf("radius of convergence in %s about %s +- %s (%s)", v, fmtBig(c.Radius, 4), fmtErr(c.RadiusErr), c.RadiusMethod))
	} else {
		notes = append(notes, "no radius estimate: too few coefficients known to 1%")
	}
	if len(mag.x) == 0 {
		return fmt.Errorf("no non-zero coefficient known to 1%% to draw")
	}
	return fig.finish(cmd, format, w, h, notes)
}

// logAbs is log|x| for big x (coefficients may exceed float64).
func logAbs(x *big.Float) float64 {
	m := new(big.Float)
	e := x.MantExp(m)
	mf, _ := m.Float64()
	return math.Log(math.Abs(mf)) + float64(e)*math.Ln2
}

func runPlotPoles(cmd *cobra.Command, args []string) error {
	format, w, h, err := plotSetup()
	if err != nil {
		return err
	}
	if plotFlags.height == "" {
		h = w
	}
	end, c, a, err := plotSeriesArgs(args)
	if err != nil {
		return err
	}
	prec := a.Prec()
	s, err := series.FromBig(prec, c.Values)
	if err != nil {
		return err
	}
	v := end.Variable()
	at4 := 0.5 // eps(4)
	if end == conformal.AroundInf {
		at4 = 0.25
	}
	fig := &figure{
		title:  fmt.Sprintf("Pade approximants of %s around q = %s: poles (filled) and zeros (open)", a.Function, end),
		xlabel: "Re " + v, ylabel: []string{"Im " + v}, logY: []bool{false}, equal: true,
	}
	circle := curve{name: "|" + v + "| = 1", style: 4}
	for i := 0; i <= 200; i++ {
		t := 2 * math.Pi * float64(i) / 200
		circle.x = append(circle.x, math.Cos(t))
		circle.y = append(circle.y, math.Sin(t))
	}
	fig.curves = append(fig.curves, circle)
	n := s.Len() - 1
	var notes []string
	const clip = 4.0
	clipped := 0
	style := 0
	for _, order := range []int{n, n - 1} {
		for L := order / 2; L <= (order+1)/2; L++ {
			M := order - L
			p, err := pade.NewPade(s, L, M)
			if err != nil {
				notes = append(notes, fmt.Sprintf("[%d/%d]: %v", L, M, err))
				continue
			}
			poles, err := p.Poles()
			if err != nil {
				continue
			}
			zeros, _ := p.Zeros()
			pc := curve{name: fmt.Sprintf("poles [%d/%d]", p.L, p.M), points: true, style: 1 + style}
			zc := curve{name: fmt.Sprintf("zeros [%d/%d]", p.L, p.M), points: true, style: 1 + style}
			zc.style = 5 + style%2
			for _, z := range poles {
				re, im := f64(z.Re), f64(z.Im)
				if math.Hypot(re, im) > clip {
					clipped++
					continue
				}
				pc.x, pc.y = append(pc.x, re), append(pc.y, im)
			}
			for _, z := range zeros {
				re, im := f64(z.Re), f64(z.Im)
				if math.Hypot(re, im) > clip {
					clipped++
					continue
				}
				zc.x, zc.y = append(zc.x, re), append(zc.y, im)
			}
			fig.curves = append(fig.curves, pc, zc)
			style++
		}
		if style >= 2 {
			break
		}
	}
	fig.curves = append(fig.curves, curve{name: fmt.Sprintf("q = 4 (%s = %g)", v, at4), points: true, style: 3, x: []float64{at4}, y: []float64{0}})
	if end == conformal.AroundTwo {
		fig.curves = append(fig.curves, curve{name: "q = inf (eps = 1)", points: true, style: 6, x: []float64{1}, y: []float64{0}})
	}
	if clipped > 0 {
		notes = append(notes, fmt.Sprintf("%d poles or zeros beyond |%s| = %g are not drawn", clipped, v, clip))
	}
	notes = append(notes, "near-diagonal Pade approximants of the two highest orders of the series; "+c.Method)
	return fig.finish(cmd, format, w, h, notes)
}
