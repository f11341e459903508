package numeric

import "math"

// gaussLegendre returns the n-point Gauss-Legendre nodes and weights on
// [-1, 1], found by Newton iteration on the Legendre recurrence.
func gaussLegendre(n int) (x, w []float64) {
	x = make([]float64, n)
	w = make([]float64, n)
	for i := 0; i < (n+1)/2; i++ {
		z := math.Cos(math.Pi * (float64(i) + 0.75) / (float64(n) + 0.5))
		var dp float64
		for iter := 0; iter < 100; iter++ {
			p0, p1 := 1.0, z
			for k := 2; k <= n; k++ {
				p0, p1 = p1, (float64(2*k-1)*z*p1-float64(k-1)*p0)/float64(k)
			}
			if n == 1 {
				p0, p1 = 1, z
			}
			dp = float64(n) * (z*p1 - p0) / (z*z - 1)
			dz := p1 / dp
			z -= dz
			if math.Abs(dz) < 1e-16 {
				break
			}
		}
		p0, p1 := 1.0, z
		for k := 2; k <= n; k++ {
			p0, p1 = p1, (float64(2*k-1)*z*p1-float64(k-1)*p0)/float64(k)
		}
		dp = float64(n) * (z*p1 - p0) / (z*z - 1)
		x[i], x[n-1-i] = -z, z
		ww := 2 / ((1 - z*z) * dp * dp)
		w[i], w[n-1-i] = ww, ww
	}
	return x, w
}

// integrate returns int_a^b f by composite Gauss-Legendre on panels
// equally spaced between the given breakpoints.
func integrate(f func(float64) float64, breaks []float64, panels, order int) float64 {
	x, w := gaussLegendre(order)
	sum := 0.0
	for i := 0; i+1 < len(breaks); i++ {
		a, b := breaks[i], breaks[i+1]
		d := (b - a) / float64(panels)
		for p := 0; p < panels; p++ {
			lo := a + float64(p)*d
			c, h := lo+d/2, d/2
			for j := range x {
				sum += w[j] * h * f(c+h*x[j])
			}
		}
	}
	return sum
}

// ExactS0 returns the zero-temperature entropy per Majorana fermion,
// S_0 = (1/2) log 2 - int_0^{1/q} pi (1/2 - x) tan(pi x) dx
// (Kitaev; Maldacena-Stanford arXiv:1604.07818 sec. 2.6), by Gauss-Legendre
// quadrature. It needs q >= 2: at q = 2 the integrand's log singularity at
// x = 1/2 is integrable and handled by a graded split.
func ExactS0(q float64) float64 {
	f := func(x float64) float64 { return math.Pi * (0.5 - x) * math.Tan(math.Pi*x) }
	up := 1 / q
	// Near x = 1/2 (q near 2) (1/2 - x) tan(pi x) -> 1/pi is smooth; no singularity.
	return 0.5*math.Ln2 - integrate(f, []float64{0, up}, 4, 30)
}
