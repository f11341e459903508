package expansion

import (
	"errors"
	"math"
	"math/big"
	"strconv"
	"testing"

	"qbridge/expansion/conformal"
)

func qs(t testing.TB, list ...string) []conformal.QPoint {
	var out []conformal.QPoint
	for _, s := range list {
		out = append(out, qp(t, s))
	}
	return out
}

func cellCovers(c TableCell, truth *big.Float, floor float64) bool {
	d := new(big.Float).Sub(c.Value, truth)
	d.Abs(d)
	tol := big.NewFloat(floor)
	if c.Err != nil {
		tol.Add(tol, c.Err)
	}
	return d.Cmp(tol) <= 0
}

// The exact and resummed columns against mpmath (testdata/
// conformal_golden.json, 40 digits): every value within its stated error.
// Rows computed on one worker and on several are identical.
func TestTabulateAgainstMpmath(t *testing.T) {
	g := loadGolden(t)
	truth := map[string]map[string]string{"h_1": {}, "h_2": {}, "b": {}, "S_0": {}}
	var qlist []string
	for _, d := range g.S0 {
		truth["S_0"][d.Q] = d.Value
		qlist = append(qlist, d.Q)
	}
	for _, d := range g.B {
		truth["b"][d.Q] = d.Value
	}
	for _, d := range g.Dims {
		if d.N <= 2 {
			truth["h_"+strconv.Itoa(d.N)][d.Q] = d.H
		}
	}
	all, err := Tabulate(TableRequest{Names: []string{"h_1", "b"}, Q: qs(t, "3"), Source: SourceAll, Order: 16, Digits: 20})
	if err != nil {
		t.Fatal(err)
	}
	for i, c := range all.Columns {
		if len(c.Sources) != 2 || c.Sources[0] != SourceExact || c.Sources[1] != SourceResummed || c.Reference != SourceExact {
			t.Errorf("--method all, column %d: %+v", i, c)
		}
	}
	for _, src := range []string{SourceExact, SourceResummed} {
		req := TableRequest{Names: []string{"h_1", "h_2", "b", "s0"}, Q: qs(t, qlist...), Source: src, Order: 16, Digits: 20}
		res, err := Tabulate(req)
		if err != nil {
			t.Fatal(err)
		}
		want := []string{"h_1", "h_2", "b", "S_0"}
		for i, c := range res.Columns {
			if c.Name != want[i] || len(c.Sources) != 1 || c.Sources[0] != src {
				t.Errorf("column %d: %+v", i, c)
			}
		}
		for _, row := range res.Rows {
			for ci, c := range res.Columns {
				tv := bigOf(t, truth[c.Name][row.Q.String()])
				for si, cell := range row.Cells[ci] {
					if cell.Value == nil || cell.Err == nil {
						t.Errorf("%s %s q=%s: no value or error (%s)", c.Name, c.Sources[si], row.Q, cell.Missing)
						continue
					}
					if !cellCovers(cell, tv, 1e-38) {
						t.Errorf("%s %s q=%s: %s ± %s, mpmath %s", c.Name, c.Sources[si], row.Q, cell.Value.Text('g', 25), cell.Err.Text('e', 2), tv.Text('g', 25))
					}
				}
			}
		}
		req.Workers = 1
		one, err := Tabulate(req)
		if err != nil {
			t.Fatal(err)
		}
		for i := range one.Rows {
			for ci := range one.Rows[i].Cells {
				for si := range one.Rows[i].Cells[ci] {
					a, b := one.Rows[i].Cells[ci][si], res.Rows[i].Cells[ci][si]
					if a.Value.Cmp(b.Value) != 0 || a.Err.Cmp(b.Err) != 0 {
						t.Errorf("row %d col %d: one worker %v, several %v", i, ci, a.Value, b.Value)
					}
				}
			}
		}
	}
}

// The limits q = 2 and q = infinity (PHYSICS sec. 4 and 5): h_1 = 4 and 3,
// b = 1/pi and 1, S_0 = 0 and log(2)/2, E_0 -> 0 at infinity; the direct
// solver has no value at infinity and says so.
func TestTabulateEnds(t *testing.T) {
	res, err := Tabulate(TableRequest{Names: []string{"h_1", "b", "S_0"}, Q: qs(t, "2", "inf"), Source: SourceResummed, Order: 12, Digits: 20})
	if err != nil {
		t.Fatal(err)
	}
	want := [][]float64{{4, 1 / math.Pi, 0}, {3, 1, math.Ln2 / 2}}
	for r, row := range res.Rows {
		for ci := range res.Columns {
			c := row.Cells[ci][0]
			v, _ := c.Value.Float64()
			if math.Abs(v-want[r][ci]) > 1e-14 {
				t.Errorf("%s at q = %s: %v, want %v", res.Columns[ci].Name, row.Q, v, want[r][ci])
			}
			if c.Err == nil && c.ErrNote == "" {
				t.Errorf("%s at q = %s: no error and no reason", res.Columns[ci].Name, row.Q)
			}
		}
	}
}

// Requests that do not apply are input errors.
func TestTabulateBadInput(t *testing.T) {
	for _, r := range []TableRequest{
		{Names: []string{"e0"}, Q: qs(t, "4"), Source: SourceExact, Order: 8, Digits: 20},
		{Names: []string{"h_1"}, Q: qs(t, "4"), Source: SourceDirect, Order: 8, Digits: 20},
		{Names: []string{"logz"}, Q: qs(t, "4"), Order: 8, Digits: 20},
		{Names: []string{"h_n"}, Q: qs(t, "4"), Order: 8, Digits: 20},
		{Names: []string{"nonsense"}, Q: qs(t, "4"), Order: 8, Digits: 20},
		{Names: []string{"h_1"}, Q: qs(t, "4"), Source: "best", Order: 8, Digits: 20},
		{Names: []string{"h_1"}, Q: qs(t, "4"), Order: 1, Digits: 20},
		{Names: []string{"h_1"}, Order: 8, Digits: 20},
	} {
		if _, err := Tabulate(r); !errors.Is(err, ErrInput) {
			t.Errorf("%+v: %v, want ErrInput", r, err)
		}
	}
}

// The direct column at q = 4 against the exact S_0 (mpmath quad, golden
// file) and the published E_0 = -0.05746 script-J (MS 2016
// arXiv:1604.07818, -0.0406 J; from memory, four digits) and alpha_S ~
// 0.007 (MS 2016); the resummed E_0 and alpha_S agree with the direct ones
// within 3 combined sigma.
func TestTabulateDirect(t *testing.T) {
	if testing.Short() {
		t.Skip("direct ladders and ground series take many seconds")
	}
	res, err := Tabulate(TableRequest{Names: []string{"E_0", "S_0", "alpha_S"}, Q: qs(t, "4"), Source: SourceAll, Order: 6, Digits: 20})
	if err != nil {
		t.Fatal(err)
	}
	row := res.Rows[0]
	get := func(ci int, src string) TableCell {
		for si, s := range res.Columns[ci].Sources {
			if s == src {
				return row.Cells[ci][si]
			}
		}
		t.Fatalf("%s has no %s", res.Columns[ci].Name, src)
		return TableCell{}
	}
	f := func(x *big.Float) float64 { v, _ := x.Float64(); return v }
	if e := get(0, SourceDirect); math.Abs(f(e.Value)+0.05746) > 1e-5 {
		t.Errorf("direct E_0(4) = %v, published -0.05746", f(e.Value))
	}
	s0 := bigOf(t, "0.2324238495854025537463462434164695304415")
	if e := get(1, SourceDirect); !cellCovers(TableCell{Value: e.Value, Err: new(big.Float).Mul(e.Err, big.NewFloat(3))}, s0, 0) {
		t.Errorf("direct S_0(4) = %v ± %v, exact %v", f(e.Value), f(e.Err), s0)
	}
	if e := get(2, SourceDirect); math.Abs(f(e.Value)-0.007) > 5e-4 {
		t.Errorf("direct alpha_S(4) = %v, published ~0.007", f(e.Value))
	}
	for _, ci := range []int{0, 2} {
		r, d := get(ci, SourceResummed), get(ci, SourceDirect)
		comb := math.Hypot(f(r.Err), f(d.Err))
		if math.Abs(f(r.Value)-f(d.Value)) > 3*comb {
			t.Errorf("%s: resummed %v ± %v, direct %v ± %v", res.Columns[ci].Name, f(r.Value), f(r.Err), f(d.Value), f(d.Err))
		}
	}
}
