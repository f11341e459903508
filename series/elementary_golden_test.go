package series

import (
	"encoding/json"
	"math/big"
	"os"
	"testing"
)

// elemTGolden is the layout of testdata/elementary_golden.json, written by
// testdata/gen_elementary.py from mpmath.taylor at 40 digits.
type elemTGolden struct {
	Source string `json:"source"`
	Cases  []struct {
		Name   string   `json:"name"`
		Coeffs []string `json:"coeffs"`
	} `json:"cases"`
}

// Compare compositions of elementary functions with mpmath 1.3.0 Taylor
// coefficients (40 significant digits).
func TestElementaryGoldenMpmath(t *testing.T) {
	raw, err := os.ReadFile("../testdata/elementary_golden.json")
	if err != nil {
		t.Fatal(err)
	}
	var g elemTGolden
	if err := json.Unmarshal(raw, &g); err != nil {
		t.Fatal(err)
	}
	const prec = 256
	build := map[string]func(n int) (*Series, error){
		"exp(sin(t))": func(n int) (*Series, error) {
			s, err := Sin(elemTVar(n, prec))
			if err != nil {
				return nil, err
			}
			return Exp(s)
		},
		"log(1+t+t^2/3)": func(n int) (*Series, error) {
			a := newZero(n, prec)
			a.c[0].SetInt64(1)
			a.c[1].SetInt64(1)
			a.c[2].Set(elemTRat(1, 3, prec))
			return Log(a)
		},
		"tan(0.3+t)": func(n int) (*Series, error) {
			x0, _ := new(big.Float).SetPrec(prec).SetString("0.3")
			v, _ := Variable(n, prec, x0)
			return Tan(v)
		},
		"sqrt(2+t-t^3)": func(n int) (*Series, error) {
			a := newZero(n, prec)
			a.c[0].SetInt64(2)
			a.c[1].SetInt64(1)
			a.c[3].SetInt64(-1)
			return Sqrt(a)
		},
		"(1.5+t)^0.7": func(n int) (*Series, error) {
			v, _ := Variable(n, prec, big.NewFloat(1.5))
			p, _ := new(big.Float).SetPrec(prec).SetString("0.7")
			return Pow(v, p)
		},
		"atan(0.5+2t+t^2)": func(n int) (*Series, error) {
			a := newZero(n, prec)
			a.c[0].SetFloat64(0.5)
			a.c[1].SetInt64(2)
			a.c[2].SetInt64(1)
			return Atan(a)
		},
		"cos(1+t-t^2)": func(n int) (*Series, error) {
			a := newZero(n, prec)
			a.c[0].SetInt64(1)
			a.c[1].SetInt64(1)
			a.c[2].SetInt64(-1)
			return Cos(a)
		},
	}
	if len(g.Cases) != len(build) {
		t.Fatalf("golden file has %d cases, test knows %d", len(g.Cases), len(build))
	}
	// 40 printed digits: relative error below 1e-39; floor for exact zeros.
	tol, _ := new(big.Float).SetPrec(prec).SetString("1e-38")
	floor, _ := new(big.Float).SetPrec(prec).SetString("1e-60")
	for _, c := range g.Cases {
		f, ok := build[c.Name]
		if !ok {
			t.Fatalf("unknown golden case %q", c.Name)
		}
		got, err := f(len(c.Coeffs))
		if err != nil {
			t.Fatalf("%s: %v", c.Name, err)
		}
		for k, ws := range c.Coeffs {
			want, _, err := big.ParseFloat(ws, 10, prec, big.ToNearestEven)
			if err != nil {
				t.Fatalf("%s: coefficient %d: %v", c.Name, k, err)
			}
			d := new(big.Float).SetPrec(prec).Sub(got.c[k], want)
			d.Abs(d)
			bound := new(big.Float).SetPrec(prec).Abs(want)
			bound.Mul(bound, tol)
			bound.Add(bound, floor)
			if d.Cmp(bound) > 0 {
				t.Errorf("%s: coefficient %d = %s, mpmath %s", c.Name, k, got.c[k].Text('g', 42), ws)
			}
		}
	}
}
