package conformal

import (
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// TestDimensionSeriesCauchyMpmath holds the order-40 series of h_1 around
// q = 2 against testdata/cauchy_dims.py, which computes the same
// coefficients with mpmath alone by a different route (Cauchy sums of the
// exact root on a circle of radius 0.6) and fails when any coefficient
// differs by more than 1e-25 * max(1, |c_k|). Skipped where python3 with
// mpmath is missing.
func TestDimensionSeriesCauchyMpmath(t *testing.T) {
	if testing.Short() {
		t.Skip("short mode")
	}
	if _, err := exec.LookPath("python3"); err != nil {
		t.Skip("python3 not found; skipping the mpmath Cauchy-sum cross-check")
	}
	if err := exec.Command("python3", "-c", "import mpmath").Run(); err != nil {
		t.Skip("mpmath not importable; skipping the mpmath Cauchy-sum cross-check")
	}
	c, err := DimensionSeries(AroundTwo, 1, 40, 40)
	if err != nil {
		t.Fatal(err)
	}
	doc := map[string]any{"quantity": "h_1", "variable": "eps"}
	var coeffs []string
	for _, v := range c.Values {
		coeffs = append(coeffs, v.Text('g', 40))
	}
	doc["coefficients"] = coeffs
	b, err := json.Marshal(doc)
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "h1.json")
	if err := os.WriteFile(path, b, 0o644); err != nil {
		t.Fatal(err)
	}
	out, err := exec.Command("python3", filepath.Join("..", "..", "testdata", "cauchy_dims.py"), path, "--tol", "1e-25").CombinedOutput()
	if err != nil {
		t.Fatalf("cauchy_dims.py: %v\n%s", err, out)
	}
	t.Logf("%s", lastLine(out))
}

func lastLine(b []byte) string {
	s := strings.TrimSpace(string(b))
	return s[strings.LastIndex(s, "\n")+1:]
}
