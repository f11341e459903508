package claim_test

import (
	"fmt"

	"qbridge/expansion/claim"
)

// Parse reads a claim; its O() term names the end and the order.
func ExampleParse() {
	c, err := claim.Parse("alpha_S = 1/(4*q^2) + O(1/q^3)")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(c.LHS, "=", c.RHS)
	fmt.Println(c.Order.Text, "around q =", c.Order.End, "claims orders below", c.Order.Power)

	_, err = claim.Parse("h_1 = 4 - (5/6)*eps^2 + alpha_s2")
	fmt.Println(err.(*claim.Error).Short())
	// Output:
	// alpha_S = (1 / (4 * (q ^ 2)))
	// O(1/q^3) around q = inf claims orders below 3
	// at column 25: unknown name "alpha_s2"
}

// Check compares the two sides order by order: the eps^2 coefficient of
// h_1 is -5/6, so -4/5 fails there by -1/30.
func ExampleEvaluator_Check() {
	ev := claim.NewEvaluator(30)
	for _, text := range []string{
		"h_1 = 4 - (5/6)*eps^2 + O(eps^4)",
		"h_1 = 4 - (4/5)*eps^2 + O(eps^4)",
	} {
		c, err := claim.Parse(text)
		if err != nil {
			fmt.Println(err)
			return
		}
		plan, err := c.Plan(nil, -1)
		if err != nil {
			fmt.Println(err)
			return
		}
		r, err := ev.Check(c, plan.Ends[0], plan.Order, nil)
		if err != nil {
			fmt.Println(err)
			return
		}
		if f := r.FirstDisagreement(); f != nil {
			fmt.Printf("%s: fails at order %d by %s\n", text, f.K, f.Diff.Text('g', 6))
			continue
		}
		fmt.Printf("%s: %s\n", text, r.Verdict(6))
	}
	// Output:
	// h_1 = 4 - (5/6)*eps^2 + O(eps^4): holds to order 3
	// h_1 = 4 - (4/5)*eps^2 + O(eps^4): fails at order 2 by -0.0333333
}
