package conformal

import (
	"fmt"
	"math/cmplx"
	"testing"
)

// TestCollisionPartnersAgree checks the level labels of the map from both
// sides: where h_n meets h_m at s*, h_m's own map (continued along the same
// straight ray from the expansion point, which reaches s* too) must list
// s* or its conjugate as the point where it meets h_n. The partner of a
// collision is found by continuing the other root back to the start of the
// ray, which next to near-collisions can jump roots; the label must
// survive that check. (Before a forward confirmation was added, h_6 around
// infinity was reported meeting h_8 at |x| = 0.41985 where h_7's map says
// h_7 meets h_6.)
func TestCollisionPartnersAgree(t *testing.T) {
	maps := map[[3]int]*SingularityMap{}
	get := func(end End, n, count int) *SingularityMap {
		k := [3]int{int(end), n, count}
		if m, ok := maps[k]; ok {
			return m
		}
		m, err := DimensionSingularities(end, n, count, radiusDigits)
		if err != nil {
			t.Fatalf("h_%d around %s: %v", n, end, err)
		}
		maps[k] = m
		return m
	}
	checked := 0
	for _, end := range []End{AroundTwo, AroundInf} {
		for n := 1; n <= 8; n++ {
			for _, s := range get(end, n, 4).Singularities {
				var m int
				if _, err := fmt.Sscanf(s.Levels, fmt.Sprintf("h_%d and h_%%d", n), &m); err != nil {
					continue // a mirror root or an unidentified one
				}
				if m < 1 || m > 9 {
					continue
				}
				p := s.S.Complex128()
				found := false
				// the partner's map to more points: the order by modulus
				// is its own
				for _, o := range get(end, m, 12).Singularities {
					q := o.S.Complex128()
					if (cmplx.Abs(q-p) < 1e-12 || cmplx.Abs(q-cmplx.Conj(p)) < 1e-12) && o.Levels == fmt.Sprintf("h_%d and h_%d", m, n) {
						found = true
					}
				}
				if !found {
					t.Errorf("h_%d around %s meets h_%d at %v by its map, but h_%d's map does not list that point with h_%d", n, end, m, p, m, n)
				}
				checked++
			}
		}
	}
	if checked < 20 {
		t.Errorf("only %d labelled collisions checked", checked)
	}
}
