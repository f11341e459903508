package expansion_test

import (
	"fmt"

	"qbridge/expansion"
	"qbridge/expansion/conformal"
)

// Build the two-point approximant of h_1 once and evaluate it at several q
// (h_1(4) = 3.7735..., MS 2016 arXiv:1604.07818; h_1 -> 3 at infinity).
func ExampleNewApproximant() {
	a, err := expansion.NewApproximant("h_1", 12, 20, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, s := range []string{"3", "4", "inf"} {
		q, _ := conformal.ParseQ(s, 128)
		e, _ := a.TwoPoint(q)
		fmt.Printf("h_1(%s) = %s\n", s, e.Value.Text('f', 8))
	}
	// Output:
	// h_1(3) = 3.90366170
	// h_1(4) = 3.77353562
	// h_1(inf) = 3.00000000
}

// A table of b and S_0 from their exact values at three q.
func ExampleTabulate() {
	var qs []conformal.QPoint
	for _, s := range []string{"2", "4", "inf"} {
		q, _ := conformal.ParseQ(s, 128)
		qs = append(qs, q)
	}
	res, err := expansion.Tabulate(expansion.TableRequest{Names: []string{"b", "s0"}, Q: qs, Order: 12, Digits: 20})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, row := range res.Rows {
		fmt.Printf("q = %s: b = %s, S_0 = %s\n", row.Q, row.Cells[0][0].Value.Text('f', 6), row.Cells[1][0].Value.Text('f', 6))
	}
	// Output:
	// q = 2: b = 0.318310, S_0 = 0.000000
	// q = 4: b = 0.531126, S_0 = 0.232424
	// q = inf: b = 1.000000, S_0 = 0.346574
}
