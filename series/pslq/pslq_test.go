package pslq

import (
	"qbridge/series/scalar"

	"errors"
	"math/big"
	"math/rand/v2"
	"testing"
)

func pslqTestInts(v ...int64) []*big.Int {
	out := make([]*big.Int, len(v))
	for i, x := range v {
		out[i] = big.NewInt(x)
	}
	return out
}

func pslqTestEqual(a, b []*big.Int) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i].Cmp(b[i]) != 0 {
			return false
		}
	}
	return true
}

// pslqTestVectors are numbers with known integer relations, at prec bits.
func pslqTestVectors(prec uint) []struct {
	name string
	x    []*big.Float
	want []*big.Int
} {
	p := prec + 16
	pi := scalar.Pi(p)
	pi2 := new(big.Float).SetPrec(p).Mul(pi, pi)
	ln2 := scalar.Ln2(p)
	ln3, _ := scalar.BigLog(big.NewFloat(3), p)
	ln6, _ := scalar.BigLog(big.NewFloat(6), p)
	// planted: 3 pi - 2 pi^2 + 5 log 2
	planted := new(big.Float).SetPrec(p).Mul(pi, big.NewFloat(3))
	planted.Sub(planted, new(big.Float).SetPrec(p).Mul(pi2, big.NewFloat(2)))
	planted.Add(planted, new(big.Float).SetPrec(p).Mul(ln2, big.NewFloat(5)))
	one := new(big.Float).SetPrec(p).SetInt64(1)
	phi := new(big.Float).SetPrec(p).Sqrt(big.NewFloat(5))
	phi.Add(phi, one)
	phi.Quo(phi, big.NewFloat(2))
	phi2 := new(big.Float).SetPrec(p).Mul(phi, phi)
	a5 := scalar.BigAtan(new(big.Float).SetPrec(p).Quo(one, big.NewFloat(5)), p)
	a239 := scalar.BigAtan(new(big.Float).SetPrec(p).Quo(one, big.NewFloat(239)), p)
	r := func(v ...*big.Float) []*big.Float {
		out := make([]*big.Float, len(v))
		for i := range v {
			out[i] = new(big.Float).SetPrec(prec).Set(v[i])
		}
		return out
	}
	return []struct {
		name string
		x    []*big.Float
		want []*big.Int
	}{
		// log 6 = log 2 + log 3.
		{"logs", r(ln2, ln3, ln6), pslqTestInts(1, 1, -1)},
		// Planted: 3 pi - 2 pi^2 + 5 log 2 - planted = 0.
		{"planted", r(pi, pi2, ln2, planted), pslqTestInts(3, -2, 5, -1)},
		// Golden ratio: phi^2 = phi + 1.
		{"golden", r(one, phi, phi2), pslqTestInts(1, 1, -1)},
		// Machin's formula: pi = 16 atan(1/5) - 4 atan(1/239).
		{"Machin", r(pi, a5, a239), pslqTestInts(1, -16, 4)},
	}
}

func TestPSLQKnownRelations(t *testing.T) {
	for _, prec := range []uint{64, 256, 1024} {
		for _, tc := range pslqTestVectors(prec) {
			got, err := PSLQ(tc.x, prec, big.NewInt(1000))
			if err != nil {
				t.Errorf("%s at %d bits: %v", tc.name, prec, err)
				continue
			}
			if !pslqTestEqual(got, tc.want) {
				t.Errorf("%s at %d bits: got %v, want %v", tc.name, prec, got, tc.want)
			}
		}
	}
}

func TestFindRelationAccepts(t *testing.T) {
	for _, tc := range pslqTestVectors(300) { // about 90 digits
		rel, err := FindRelation(tc.x, 30, 1000)
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if !pslqTestEqual(rel.Coeffs, tc.want) {
			t.Errorf("%s: got %v, want %v", tc.name, rel.Coeffs, tc.want)
		}
		if rel.Digits < 80 {
			t.Errorf("%s: holds to %d digits, want about 90", tc.name, rel.Digits)
		}
		if rel.Residual == nil || rel.Residual.MantExp(nil) > -250 {
			t.Errorf("%s: residual %v too large", tc.name, rel.Residual)
		}
	}
}

// Random 80-digit numbers have no small relation: whatever PSLQ turns up
// in the first 20 digits must fail the check on the remaining digits.
func TestFindRelationRejectsRandom(t *testing.T) {
	const prec = 270 // about 81 digits
	rng := rand.New(rand.NewPCG(7, 11))
	spurious := 0
	for trial := 0; trial < 5; trial++ {
		x := make([]*big.Float, 5)
		for i := range x {
			v := new(big.Float).SetPrec(prec)
			for k := 0; k < 5; k++ { // 5 x 64 random bits
				v.SetMantExp(v, 64)
				v.Add(v, new(big.Float).SetUint64(rng.Uint64()))
			}
			x[i] = v.SetMantExp(v, -320)
		}
		rel, err := FindRelation(x, 20, 1000)
		if !errors.Is(err, ErrNoRelation) {
			t.Errorf("trial %d: got %v, %v; want ErrNoRelation", trial, rel, err)
		}
		// With a loose bound, 20 digits do admit chance relations (norm about
		// 10^(20/4) for 5 numbers); the full-precision check must catch them.
		if _, err := PSLQ(x, pslqDigitsToBits(20), big.NewInt(1e6)); err == nil {
			spurious++
		}
		rel, err = FindRelation(x, 20, 1e6)
		if !errors.Is(err, ErrNoRelation) {
			t.Errorf("trial %d, bound 1e6: got %v, %v; want ErrNoRelation", trial, rel, err)
		}
	}
	if spurious == 0 {
		t.Error("no chance relation at 20 digits: the check path was not exercised")
	}
}

// A near miss: y = 3 pi + 2 e + 1e-35 satisfies 3 pi + 2 e - y = 0 to 35
// digits. Searching with 30 digits finds (3, 2, -1); the 40-digit check on
// the full 80 digits rejects it.
func TestFindRelationRejectsNearMiss(t *testing.T) {
	const prec uint = 270
	p := prec + 16
	pi := scalar.Pi(p)
	e := scalar.BigExp(big.NewFloat(1), p)
	y := new(big.Float).SetPrec(p).Mul(pi, big.NewFloat(3))
	y.Add(y, new(big.Float).SetPrec(p).Mul(e, big.NewFloat(2)))
	tiny, _, _ := big.ParseFloat("1e-35", 10, p, big.ToNearestEven)
	y.Add(y, tiny)
	x := []*big.Float{pi.SetPrec(prec), e.SetPrec(prec), y.SetPrec(prec)}
	got, err := PSLQ(x, pslqDigitsToBits(30), big.NewInt(1000))
	if err != nil || !pslqTestEqual(got, pslqTestInts(3, 2, -1)) {
		t.Fatalf("PSLQ at 30 digits: %v, %v; want the near-miss (3, 2, -1)", got, err)
	}
	rel, err := FindRelation(x, 30, 1000)
	if !errors.Is(err, ErrNoRelation) {
		t.Errorf("got %v, %v; want ErrNoRelation", rel, err)
	}
	// With 20 search digits the check asks for only 30 digits, which the
	// near miss does satisfy (35 digits).
	rel, err = FindRelation(x, 20, 1000)
	if err != nil || rel.Digits < 34 || rel.Digits > 36 {
		t.Errorf("20-digit search: %v, %v; want the relation, holding to 35 digits", rel, err)
	}
}

func TestPSLQBadInput(t *testing.T) {
	one, two := big.NewFloat(1), big.NewFloat(2)
	for _, tc := range []struct {
		name     string
		x        []*big.Float
		prec     uint
		maxCoeff *big.Int
	}{
		{"one element", []*big.Float{one}, 64, nil},
		{"empty", nil, 64, nil},
		{"zero precision", []*big.Float{one, two}, 0, nil},
		{"nil entry", []*big.Float{one, nil}, 64, nil},
		{"non-positive bound", []*big.Float{one, two}, 64, big.NewInt(0)},
	} {
		if r, err := PSLQ(tc.x, tc.prec, tc.maxCoeff); err == nil {
			t.Errorf("%s: got %v, want error", tc.name, r)
		}
	}
	// A zero entry gives the trivial relation.
	r, err := PSLQ([]*big.Float{one, new(big.Float), two}, 64, nil)
	if err != nil || !pslqTestEqual(r, pslqTestInts(0, 1, 0)) {
		t.Errorf("zero entry: %v, %v", r, err)
	}
	// (1, sqrt 2) has no relation; at 64 bits only small norms are checkable.
	sqrt2 := new(big.Float).SetPrec(64).Sqrt(two)
	if r, err := PSLQ([]*big.Float{one, sqrt2}, 64, big.NewInt(100)); !errors.Is(err, ErrNoRelation) {
		t.Errorf("(1, sqrt 2): %v, %v; want ErrNoRelation", r, err)
	}

	x := []*big.Float{new(big.Float).SetPrec(100).Set(one), new(big.Float).SetPrec(100).Set(two)}
	for _, tc := range []struct {
		name     string
		x        []*big.Float
		digits   int
		maxCoeff int64
	}{
		{"one element", x[:1], 5, 10},
		{"zero digits", x, 0, 10},
		{"zero bound", x, 5, 0},
		{"not enough digits in x", x, 25, 10}, // 100 bits ~ 30 digits < 35
	} {
		if r, err := FindRelation(tc.x, tc.digits, tc.maxCoeff); err == nil {
			t.Errorf("FindRelation %s: got %v, want error", tc.name, r)
		}
	}
}
