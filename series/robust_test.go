package series

import (
	"math/big"
	"testing"

	"qbridge/series/scalar"
)

// No exported function panics on nil or zero-value input: each returns an
// error, or (for the error-free arithmetic) nil.
func TestNilAndZeroInputs(t *testing.T) {
	var zero Series
	ok, _ := FromFloat64(64, 1, 2, 3)
	one := big.NewFloat(1)
	inputs := map[string]*Series{"nil": nil, "zero value": &zero}
	for name, s := range inputs {
		calls := map[string]func(){
			"Add":         func() { _ = Add(s, ok); _ = Add(ok, s) },
			"Sub":         func() { _ = Sub(s, ok) },
			"Neg":         func() { _ = Neg(s) },
			"Scale":       func() { _ = Scale(s, one); _ = Scale(ok, nil) },
			"AddConst":    func() { _ = AddConst(s, one); _ = AddConst(ok, nil) },
			"Mul":         func() { _ = Mul(s, ok) },
			"Inv":         func() { _, _ = Inv(s) },
			"Div":         func() { _, _ = Div(ok, s); _, _ = Div(s, ok) },
			"Deriv":       func() { _ = Deriv(s) },
			"Integral":    func() { _ = Integral(s, one); _ = Integral(ok, nil) },
			"Eval":        func() { _ = Eval(s, one); _ = Eval(ok, nil) },
			"EvalComplex": func() { _ = EvalComplex(s, scalar.Complex{}); _ = EvalComplex(ok, scalar.Complex{}) },
			"PartialSums": func() { _ = PartialSums(s, one); _ = PartialSums(ok, nil) },
			"Compose":     func() { _, _ = Compose(s, ok); _, _ = Compose(ok, s) },
			"Revert":      func() { _, _ = Revert(s) },
			"Mobius":      func() { _, _ = Mobius(s, one, one, one, one); _, _ = Mobius(ok, nil, nil, nil, nil) },
			"Affine":      func() { _, _ = Affine(s, one, one); _, _ = Affine(ok, nil, nil) },
			"ComposeTaylor": func() {
				_, _ = ComposeTaylor([]*big.Float{one}, s)
				_, _ = ComposeTaylor(nil, ok)
				_, _ = ComposeTaylor([]*big.Float{nil}, ok)
			},
			"Exp":    func() { _, _ = Exp(s) },
			"Log":    func() { _, _ = Log(s) },
			"Pow":    func() { _, _ = Pow(s, one); _, _ = Pow(ok, nil) },
			"Sqrt":   func() { _, _ = Sqrt(s) },
			"SinCos": func() { _, _, _ = SinCos(s) },
			"Tan":    func() { _, _ = Tan(s) },
			"Atan":   func() { _, _ = Atan(s) },
			"methods": func() {
				_ = s.Len()
				_ = s.Prec()
				_ = s.Coeff(0)
				_ = s.Coeffs()
				_ = s.Copy()
				_ = s.String()
			},
			"Truncate": func() { _, _ = s.Truncate(2); _, _ = s.WithPrec(64); _ = s.SetCoeff(0, one) },
			"FromBig":  func() { _, _ = FromBig(64, []*big.Float{nil}); _, _ = FromBig(64, nil) },
			"Variable": func() { _, _ = Variable(0, 64, nil); _, _ = Variable(3, 0, one) },
		}
		for fn, call := range calls {
			func() {
				defer func() {
					if r := recover(); r != nil {
						t.Errorf("%s with a %s series panics: %v", fn, name, r)
					}
				}()
				call()
			}()
		}
	}
}
