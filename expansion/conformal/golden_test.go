package conformal

import (
	"encoding/json"
	"math/big"
	"os"
	"testing"
)

// conformalGolden mirrors testdata/conformal_golden.json, written by
// testdata/gen_conformal.py with mpmath (findroot, quad, taylor, clsin).
type conformalGolden struct {
	Dims []struct {
		Q string `json:"q"`
		N int    `json:"n"`
		H string `json:"h"`
	} `json:"dims"`
	S0 []struct {
		Q     string `json:"q"`
		Value string `json:"value"`
	} `json:"s0"`
	B []struct {
		Q     string `json:"q"`
		Value string `json:"value"`
	} `json:"b"`
	Clausen2 []struct {
		Theta string `json:"theta"`
		Value string `json:"value"`
	} `json:"clausen2"`
	TaylorDims []struct {
		Around       string   `json:"around"`
		N            int      `json:"n"`
		Coefficients []string `json:"coefficients"`
		Digits       int      `json:"digits"`
	} `json:"taylor_dims"`
}

func loadConformalGolden(t *testing.T) *conformalGolden {
	t.Helper()
	raw, err := os.ReadFile("../../testdata/conformal_golden.json")
	if err != nil {
		t.Fatalf("golden file: %v (regenerate with python3 testdata/gen_conformal.py > testdata/conformal_golden.json)", err)
	}
	var g conformalGolden
	if err := json.Unmarshal(raw, &g); err != nil {
		t.Fatal(err)
	}
	return &g
}

func parseBig(t *testing.T, s string) *big.Float {
	t.Helper()
	v, _, err := big.ParseFloat(s, 10, 300, big.ToNearestEven)
	if err != nil {
		t.Fatalf("parse %q: %v", s, err)
	}
	return v
}

func mustQ(t *testing.T, s string) QPoint {
	t.Helper()
	q, err := ParseQ(s, 300)
	if err != nil {
		t.Fatal(err)
	}
	return q
}

// relDiff returns |a - b| / max(|b|, 1).
func relDiff(a, b *big.Float) float64 {
	d := new(big.Float).SetPrec(300).Sub(a, b)
	d.Abs(d)
	s := new(big.Float).Abs(b)
	if s.Cmp(big.NewFloat(1)) < 0 {
		s.SetInt64(1)
	}
	f, _ := d.Quo(d, s).Float64()
	return f
}

// Dimensions against mpmath.findroot of k_A(h) = 1 (40 digits).
func TestDimensionGoldenMpmath(t *testing.T) {
	g := loadConformalGolden(t)
	for _, c := range g.Dims {
		v, err := Dimension(mustQ(t, c.Q), c.N, 45)
		if err != nil {
			t.Fatalf("q=%s n=%d: %v", c.Q, c.N, err)
		}
		if d := relDiff(v.Value, parseBig(t, c.H)); d > 1e-37 {
			t.Errorf("h_%d(q=%s) = %s, mpmath %s (rel diff %.1e)", c.N, c.Q, v.Value.Text('g', 40), c.H, d)
		}
	}
}

// Taylor coefficients of h_n against mpmath.taylor of the implicit root
// (numerical differentiation at 120 digits; 20 digits kept).
func TestDimensionSeriesGoldenMpmath(t *testing.T) {
	g := loadConformalGolden(t)
	for _, c := range g.TaylorDims {
		end := AroundTwo
		if c.Around == "inf" {
			end = AroundInf
		}
		got, err := DimensionSeries(end, c.N, len(c.Coefficients)-1, 30)
		if err != nil {
			t.Fatal(err)
		}
		for k, s := range c.Coefficients {
			want := parseBig(t, s)
			if d := relDiff(got.Values[k], want); d > 1e-17 {
				t.Errorf("around %s n=%d k=%d: %s, mpmath %s", c.Around, c.N, k, got.Values[k].Text('g', 22), s)
			}
		}
	}
}

func TestS0AndBGoldenMpmath(t *testing.T) {
	g := loadConformalGolden(t)
	for _, c := range g.S0 {
		v, err := S0(mustQ(t, c.Q), 45)
		if err != nil {
			t.Fatal(err)
		}
		if d := relDiff(v.Value, parseBig(t, c.Value)); d > 1e-37 {
			t.Errorf("S_0(q=%s) = %s, mpmath quad %s", c.Q, v.Value.Text('g', 40), c.Value)
		}
	}
	for _, c := range g.B {
		v, err := B(mustQ(t, c.Q), 45)
		if err != nil {
			t.Fatal(err)
		}
		if d := relDiff(v.Value, parseBig(t, c.Value)); d > 1e-37 {
			t.Errorf("b(q=%s) = %s, mpmath %s", c.Q, v.Value.Text('g', 40), c.Value)
		}
	}
	for _, c := range g.Clausen2 {
		v, err := clausen2(parseBig(t, c.Theta), 200)
		if err != nil {
			t.Fatal(err)
		}
		if d := relDiff(v, parseBig(t, c.Value)); d > 1e-37 {
			t.Errorf("Cl_2(%s) = %s, mpmath clsin %s", c.Theta, v.Text('g', 40), c.Value)
		}
	}
}
