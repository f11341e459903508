package series

import (
	"math/big"
	"testing"
)

// elemBenchInput returns a dense series of length n at prec bits with
// positive constant term and coefficients of moderate size.
func elemBenchInput(n int, prec uint, shift int64) *Series {
	s := newZero(n, prec)
	for k := range s.c {
		s.c[k].SetRat(big.NewRat(int64((k*7+int(shift))%11)-5, int64(k+3)))
	}
	s.c[0].SetRat(big.NewRat(3, 2))
	return s
}

const (
	elemBenchLen  = 64
	elemBenchPrec = 256
)

func BenchmarkSeriesMulLen64Prec256(b *testing.B) {
	x := elemBenchInput(elemBenchLen, elemBenchPrec, 1)
	y := elemBenchInput(elemBenchLen, elemBenchPrec, 2)
	for b.Loop() {
		Mul(x, y)
	}
}

func BenchmarkSeriesExpLen64Prec256(b *testing.B) {
	x := elemBenchInput(elemBenchLen, elemBenchPrec, 1)
	for b.Loop() {
		if _, err := Exp(x); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkSeriesLogLen64Prec256(b *testing.B) {
	x := elemBenchInput(elemBenchLen, elemBenchPrec, 1)
	for b.Loop() {
		if _, err := Log(x); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkSeriesComposeLen64Prec256(b *testing.B) {
	f := elemBenchInput(elemBenchLen, elemBenchPrec, 1)
	g := elemBenchInput(elemBenchLen, elemBenchPrec, 2)
	g.c[0].SetInt64(0)
	for b.Loop() {
		if _, err := Compose(f, g); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkSeriesRevertLen64Prec256(b *testing.B) {
	f := elemBenchInput(elemBenchLen, elemBenchPrec, 1)
	f.c[0].SetInt64(0)
	f.c[1].SetInt64(1)
	for b.Loop() {
		if _, err := Revert(f); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkSeriesTanLen64Prec256(b *testing.B) {
	x := elemBenchInput(elemBenchLen, elemBenchPrec, 1)
	for b.Loop() {
		if _, err := Tan(x); err != nil {
			b.Fatal(err)
		}
	}
}
