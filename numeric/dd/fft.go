package dd

import "fmt"

// FFT is the real discrete Fourier transform of length n (a power of two,
// at least 4) with the conventions of gonum's fourier.FFT: Coefficients
// sets X_k = sum_j x_j e^{-2 pi i jk/n}, k = 0..n/2, and Sequence is the
// unnormalised inverse x_j = sum_{k=0}^{n-1} X_k e^{2 pi i jk/n} with
// X_{n-k} = conj(X_k). It packs the real sequence into a complex one of
// length n/2 (even and odd samples as real and imaginary parts) and runs
// an iterative radix-2 transform on it. An FFT is not safe for concurrent
// use (it keeps a work array).
type FFT struct {
	n    int
	tw   []Complex // e^{-2 pi i k/n}, k = 0..n/2
	rev  []int     // bit reversal of 0..n/2-1
	work []Complex
}

// NewFFT returns the transform of length n.
func NewFFT(n int) (*FFT, error) {
	if n < 4 || n&(n-1) != 0 {
		return nil, fmt.Errorf("dd: the FFT length must be a power of two >= 4, got %d", n)
	}
	h := n / 2
	f := &FFT{n: n, tw: make([]Complex, h+1), rev: make([]int, h), work: make([]Complex, h)}
	// The angles 2 pi k/n are exact multiples of Pi (n is a power of two);
	// the eighth k <= n/8 is computed and the rest follows by symmetry, so
	// every twiddle has the accuracy of a small argument.
	q := n / 8
	for k := 0; k <= q; k++ {
		s, c := SinCos(Pi.MulFloat(float64(2*k) / float64(n)))
		f.tw[k] = Complex{c, s.Neg()}
	}
	for k := q + 1; k <= n/4; k++ { // angle pi/2 - theta: swap sin and cos
		t := f.tw[n/4-k]
		f.tw[k] = Complex{t.Im.Neg(), t.Re.Neg()}
	}
	for k := n/4 + 1; k <= h; k++ { // angle pi - theta: cos changes sign
		t := f.tw[h-k]
		f.tw[k] = Complex{t.Re.Neg(), t.Im}
	}
	bits := 0
	for 1<<bits < h {
		bits++
	}
	for i := range f.rev {
		r := 0
		for b := 0; b < bits; b++ {
			if i&(1<<b) != 0 {
				r |= 1 << (bits - 1 - b)
			}
		}
		f.rev[i] = r
	}
	return f, nil
}

// Len returns n.
func (f *FFT) Len() int { return f.n }

// complexFFT transforms a (length n/2) in place: sign -1 is the forward
// transform e^{-2 pi i jk/(n/2)}, +1 the unnormalised inverse.
func (f *FFT) complexFFT(a []Complex, sign int) {
	h := len(a)
	for i, r := range f.rev {
		if i < r {
			a[i], a[r] = a[r], a[i]
		}
	}
	for size := 2; size <= h; size <<= 1 {
		half := size / 2
		stride := f.n / size // twiddle e^{-2 pi i j/size} = tw[j stride]
		for start := 0; start < h; start += size {
			for j := 0; j < half; j++ {
				w := f.tw[j*stride]
				if sign > 0 {
					w = w.Conj()
				}
				u := a[start+j]
				v := a[start+j+half].Mul(w)
				a[start+j] = u.Add(v)
				a[start+j+half] = u.Sub(v)
			}
		}
	}
}

// Coefficients sets dst[k] (length n/2+1) to the transform of seq (length n).
func (f *FFT) Coefficients(dst []Complex, seq []Float) {
	if len(seq) != f.n || len(dst) != f.n/2+1 {
		panic(fmt.Sprintf("dd: FFT of length %d given %d samples and %d coefficients", f.n, len(seq), len(dst)))
	}
	h := f.n / 2
	z := f.work
	for j := range z {
		z[j] = Complex{seq[2*j], seq[2*j+1]}
	}
	f.complexFFT(z, -1)
	for k := 0; k <= h; k++ {
		zk := z[k%h]
		zc := z[(h-k)%h].Conj()
		e := zk.Add(zc)
		o := zk.Sub(zc) // 2i O_k
		// X_k = (e - i w_k o)/2 with w_k = tw[k].
		wo := f.tw[k].Mul(o)
		x := Complex{e.Re.Add(wo.Im), e.Im.Sub(wo.Re)}
		dst[k] = Complex{x.Re.Ldexp(-1), x.Im.Ldexp(-1)}
	}
}

// Sequence sets dst (length n) to the unnormalised inverse transform of
// coeff (length n/2+1; the imaginary parts of coeff[0] and coeff[n/2] are
// ignored, as for a real sequence).
func (f *FFT) Sequence(dst []Float, coeff []Complex) {
	if len(dst) != f.n || len(coeff) != f.n/2+1 {
		panic(fmt.Sprintf("dd: inverse FFT of length %d given %d coefficients and %d samples", f.n, len(coeff), len(dst)))
	}
	h := f.n / 2
	z := f.work
	for k := 0; k < h; k++ {
		xk := coeff[k]
		xc := coeff[h-k].Conj()
		if k == 0 {
			xk.Im, xc = Float{}, Complex{coeff[h].Re, Float{}}
		}
		a := xk.Add(xc)
		b := xk.Sub(xc).Mul(f.tw[k].Conj())
		z[k] = Complex{a.Re.Sub(b.Im), a.Im.Add(b.Re)} // a + i b
	}
	f.complexFFT(z, +1)
	for j := range z {
		dst[2*j], dst[2*j+1] = z[j].Re, z[j].Im
	}
}
