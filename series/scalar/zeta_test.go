package scalar

import (
	"errors"
	"math/big"
	"testing"
)

func TestHurwitzZetaGolden(t *testing.T) {
	// Reference: mpmath.zeta(s, a) and mpmath.zeta(s) at 80 digits
	// (testdata/gen_special.py).
	g := loadGolden(t)
	const prec, bits = 256, 248
	for _, c := range g.Zeta {
		v, err := BigHurwitzZeta(parseBig(t, c.S, 512), parseBig(t, c.A, 512), prec)
		if err != nil {
			t.Errorf("zeta(%s, %s): %v", c.S, c.A, err)
			continue
		}
		checkClose(t, "zeta("+c.S+", "+c.A+")", v, c.V, bits)
	}
	for _, c := range g.RiemannZeta {
		v, err := BigZeta(parseBig(t, c.S, 512), prec)
		if err != nil {
			t.Errorf("zeta(%s): %v", c.S, err)
			continue
		}
		checkClose(t, "zeta("+c.S+")", v, c.V, bits)
	}
}

func TestZetaExactValues(t *testing.T) {
	const prec = 340
	pi := Pi(prec)
	pi2 := new(big.Float).SetPrec(prec).Mul(pi, pi)
	// DLMF 25.6.1: zeta(2) = pi^2/6, zeta(4) = pi^4/90.
	z2 := new(big.Float).SetPrec(prec).Quo(pi2, big.NewFloat(6))
	z4 := new(big.Float).SetPrec(prec).Mul(pi2, pi2)
	z4.Quo(z4, big.NewFloat(90))
	// DLMF 25.11.11 (Hurwitz at a = 1/2): zeta(2, 1/2) = (2^2 - 1) zeta(2) = pi^2/2.
	zh := new(big.Float).SetPrec(prec).Quo(pi2, big.NewFloat(2))
	cases := []struct {
		s, a float64
		want *big.Float
	}{{2, 1, z2}, {4, 1, z4}, {2, 0.5, zh}}
	for _, c := range cases {
		v, err := BigHurwitzZeta(big.NewFloat(c.s), big.NewFloat(c.a), prec)
		if err != nil || !closeTo(v, c.want, 330) {
			t.Errorf("zeta(%g, %g) = %v (%v), want %s", c.s, c.a, v, err, c.want.Text('g', 30))
		}
	}
	// DLMF 25.6.3: zeta(-n) = -B_{n+1}/(n+1); zeta(-1) = -1/12.
	v, err := BigZeta(big.NewFloat(-1), prec)
	if err != nil || !closeTo(v, new(big.Float).SetPrec(prec).Quo(big.NewFloat(-1), big.NewFloat(12)), 330) {
		t.Errorf("zeta(-1) = %v, want -1/12", v)
	}
	// Trivial zero (DLMF 25.6.5): exactly zero.
	if v, err := BigZeta(big.NewFloat(-4), prec); err != nil || v.Sign() != 0 {
		t.Errorf("zeta(-4) = %v, want 0", v)
	}
}

func TestHurwitzZetaIntsAgree(t *testing.T) {
	// The batched routine must agree with the one-at-a-time one
	// (DLMF 25.11.1 both ways), including large k where only a^-k matters.
	const prec = 300
	for _, as := range []string{"0.25", "1", "7.5", "150.3"} {
		a := parseBig(t, as, prec)
		z, err := hurwitzZetaInts(a, 80, prec)
		if err != nil {
			t.Fatal(err)
		}
		for _, k := range []int{2, 3, 10, 41, 80} {
			v, err := BigHurwitzZeta(big.NewFloat(float64(k)), a, prec)
			if err != nil {
				t.Fatal(err)
			}
			if !closeTo(z[k], v, 295) {
				t.Errorf("a=%s k=%d: batch %s, single %s", as, k, z[k].Text('g', 25), v.Text('g', 25))
			}
		}
	}
}

func TestZetaPrecisionControl(t *testing.T) {
	s := parseBig(t, "2.5", 64)
	a := parseBig(t, "0.3", 1100)
	var prev *big.Float
	var pp uint
	for _, p := range []uint{64, 256, 1024} {
		v, err := BigHurwitzZeta(s, a, p)
		if err != nil {
			t.Fatal(err)
		}
		if prev != nil && !closeTo(prev, v, int(pp)-1) {
			t.Errorf("zeta(2.5, 0.3) at %d bits disagrees with %d bits", pp, p)
		}
		prev, pp = v, p
	}
}

func TestZetaBadInput(t *testing.T) {
	one := big.NewFloat(1)
	if _, err := BigHurwitzZeta(one, big.NewFloat(2), 64); !errors.Is(err, ErrPole) {
		t.Errorf("zeta(1, 2): err = %v, want ErrPole", err)
	}
	if _, err := BigZeta(one, 64); !errors.Is(err, ErrPole) {
		t.Errorf("zeta(1): err = %v, want ErrPole", err)
	}
	for _, a := range []float64{0, -0.5} {
		if _, err := BigHurwitzZeta(big.NewFloat(2), big.NewFloat(a), 64); !errors.Is(err, ErrDomain) {
			t.Errorf("zeta(2, %g): err = %v, want ErrDomain", a, err)
		}
	}
	if _, err := BigHurwitzZeta(big.NewFloat(2), one, 0); !errors.Is(err, ErrPrec) {
		t.Errorf("zero precision: err = %v", err)
	}
	if _, err := hurwitzZetaInts(big.NewFloat(-1), 5, 64); err == nil {
		t.Error("hurwitzZetaInts at a < 0: want error")
	}
}
