package expansion

import (
	"math"
	"strconv"
	"testing"

	"qbridge/expansion/conformal"
)

// tableNames are the quantities of the speed target: h_1..h_6, b, S_0,
// E_0 and alpha_S.
var tableNames = []string{"h_1", "h_2", "h_3", "h_4", "h_5", "h_6", "b", "s0", "e0", "alpha"}

// geometricQ returns n points from lo to hi, geometrically spaced.
func geometricQ(b *testing.B, lo, hi float64, n int) []conformal.QPoint {
	var out []conformal.QPoint
	for i := 0; i < n; i++ {
		q := lo * math.Pow(hi/lo, float64(i)/float64(n-1))
		out = append(out, qp(b, strconv.FormatFloat(q, 'g', 10, 64)))
	}
	return out
}

func resetMemo() {
	seriesMemo.Lock()
	seriesMemo.m = map[string]*memoEntry{}
	seriesMemo.Unlock()
}

// Speed target of issue 11: every quantity by resummation at 200 q values
// in under 3 s on 2 cores, with the series read from the cache (a second
// run). Each iteration starts with an empty process memo, so the series
// are read from disk and the approximants built anew.
func BenchmarkTable200Resummed(b *testing.B) {
	c := &Cache{Dir: b.TempDir(), Version: "bench"}
	req := TableRequest{Names: tableNames, Q: geometricQ(b, 2.5, 1000, 200), Source: SourceResummed, Order: 16, Digits: 21, Cache: c}
	if _, err := Tabulate(req); err != nil { // fills the cache
		b.Fatal(err)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		resetMemo()
		if _, err := Tabulate(req); err != nil {
			b.Fatal(err)
		}
	}
}

// The same with an empty cache: the series at both ends computed once
// (run with -benchtime 1x).
func BenchmarkTable200ResummedCold(b *testing.B) {
	for i := 0; i < b.N; i++ {
		resetMemo()
		req := TableRequest{Names: tableNames, Q: geometricQ(b, 2.5, 1000, 200), Source: SourceResummed, Order: 16, Digits: 21}
		if _, err := Tabulate(req); err != nil {
			b.Fatal(err)
		}
	}
}

// Speed target of issue 11: E_0 and alpha_S from the direct solver at 10 q
// values in under 30 s on 2 cores (run with -benchtime 1x: the solver's
// process cache makes later iterations free).
func BenchmarkTable10Direct(b *testing.B) {
	var q []conformal.QPoint
	for i := 0; i < 10; i++ {
		q = append(q, qp(b, strconv.FormatFloat(2.5+0.5*float64(i), 'g', -1, 64)))
	}
	for i := 0; i < b.N; i++ {
		if _, err := Tabulate(TableRequest{Names: []string{"e0", "alpha"}, Q: q, Source: SourceDirect, Order: 16, Digits: 21}); err != nil {
			b.Fatal(err)
		}
	}
}
