package scalar

import (
	"math/big"
	"testing"
)

func TestConstants100Digits(t *testing.T) {
	const prec = 340
	cases := []struct {
		name string
		v    *big.Float
		want string
	}{
		// OEIS A001620 (Euler-Mascheroni), from memory; also checked against mpmath below.
		{"EulerGamma", EulerGamma(prec),
			"0.5772156649015328606065120900824024310421593359399235988057672348848677267776646709369470632917467495"},
		// OEIS A002117 (zeta(3)), from memory.
		{"Zeta3", Zeta3(prec),
			"1.2020569031595942853997381615114499907649862923404988817922715553418382057863130901864558736093352581"},
		// OEIS A000796 (pi), from memory: checks Pi, used throughout.
		{"Pi", Pi(prec),
			"3.1415926535897932384626433832795028841971693993751058209749445923078164062862089986280348253421170679"},
	}
	for _, c := range cases {
		checkClose(t, c.name, c.v, c.want, 330)
	}
	// mpmath.euler, mpmath.zeta(3), mpmath.pi at 80 digits (golden file).
	g := loadGolden(t)
	checkClose(t, "EulerGamma vs mpmath", EulerGamma(260), g.Constants["euler"], 255)
	checkClose(t, "Zeta3 vs mpmath", Zeta3(260), g.Constants["zeta3"], 255)
	checkClose(t, "Pi vs mpmath", Pi(260), g.Constants["pi"], 255)
	if EulerGamma(0) != nil || Zeta3(0) != nil {
		t.Error("zero precision: want nil")
	}
}
