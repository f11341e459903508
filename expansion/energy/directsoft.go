package energy

import (
	"sync"
)

// softCacheEntry is one zero-temperature solution; ready is closed once r
// and err are set.
type softCacheEntry struct {
	ready chan struct{}
	r     *SoftModeRoute
	err   error
}

// softCache holds the zero-temperature routes of this process, one per q.
var softCache = struct {
	sync.Mutex
	m map[float64]*softCacheEntry
}{m: map[float64]*softCacheEntry{}}

// DirectSoftMode is the direct reference value of alpha_G and alpha_K at q:
// the zero-temperature route of SoftMode (SoftModeZeroT: alpha_G measured
// on the T = 0 solution, alpha_K = -q k_A'(2) alpha_G), once per q in a
// process, so that resum, report and table print one value per q. A
// repeated call, also a concurrent one, waits for the first and shares its
// result (progress is then only told that it is done); failures are not
// cached. The result is shared and must not be modified. It needs a finite
// q > 2 (about a second on one core).
func DirectSoftMode(q float64, progress func(float64, string)) (*SoftModeRoute, error) {
	if err := checkSoftModeQ(q); err != nil {
		return nil, err
	}
	softCache.Lock()
	e, ok := softCache.m[q]
	if !ok {
		e = &softCacheEntry{ready: make(chan struct{})}
		softCache.m[q] = e
	}
	softCache.Unlock()
	if ok {
		<-e.ready
		if e.err == nil && progress != nil {
			progress(1, "cached")
		}
		return e.r, e.err
	}
	e.r, e.err = SoftModeZeroT(q, progress)
	if e.err != nil {
		softCache.Lock()
		delete(softCache.m, q)
		softCache.Unlock()
	}
	close(e.ready)
	return e.r, e.err
}
