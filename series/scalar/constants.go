package scalar

import (
	"math/big"
	"sync"
)

// constCache caches one constant at the highest precision asked for so far.
type constCache struct {
	sync.Mutex
	prec uint
	v    *big.Float
}

// get returns the constant rounded to prec bits, computing it with compute
// (which must return the value correct to at least the precision it is
// given) when the cached value is not precise enough.
func (c *constCache) get(prec uint, compute func(prec uint) (*big.Float, error)) (*big.Float, error) {
	c.Lock()
	defer c.Unlock()
	if c.v == nil || c.prec < prec {
		v, err := compute(prec + Guard)
		if err != nil {
			return nil, err
		}
		c.v, c.prec = v, prec
	}
	return new(big.Float).SetPrec(prec).Set(c.v), nil
}

// The one set of constant caches of the project.
var (
	piCache         constCache
	ln2Cache        constCache
	eulerGammaCache constCache
	halfLog2PiCache constCache
	logPiCache      constCache
)

// EulerGamma returns the Euler-Mascheroni constant gamma = 0.5772... rounded
// to prec bits, as -psi(1) from the digamma function (cached at the highest
// precision asked for so far). It returns nil for a precision outside
// [1, MaxPrec].
func EulerGamma(prec uint) *big.Float {
	if CheckPrec(prec) != nil {
		return nil
	}
	v, err := eulerGammaCache.get(prec, func(p uint) (*big.Float, error) {
		one := new(big.Float).SetPrec(p).SetInt64(1)
		v, err := zivRefine(p, func(wp uint) (*big.Float, int, error) {
			return psiPositive(one, wp)
		})
		if err != nil {
			return nil, err
		}
		return v.Neg(v), nil
	})
	if err != nil {
		return nil
	}
	return v
}

// Zeta3 returns Apery's constant zeta(3) = 1.2020... rounded to prec bits.
// It returns nil for a precision outside [1, MaxPrec].
func Zeta3(prec uint) *big.Float {
	v, err := BigZeta(big.NewFloat(3), prec)
	if err != nil {
		return nil
	}
	return v
}

// halfLog2Pi returns log(2 pi)/2, the constant of Stirling's series.
func halfLog2Pi(prec uint) *big.Float {
	v, _ := halfLog2PiCache.get(prec, func(p uint) (*big.Float, error) {
		twoPi := Pi(p + 8)
		twoPi.SetMantExp(twoPi, 1)
		v, err := BigLog(twoPi, p)
		if err != nil {
			return nil, err
		}
		return v.SetMantExp(v, -1), nil
	})
	return v
}

// logPi returns log pi, used by the reflection formula.
func logPi(prec uint) *big.Float {
	v, _ := logPiCache.get(prec, func(p uint) (*big.Float, error) {
		return BigLog(Pi(p+8), p)
	})
	return v
}
