package main

import (
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

var texEnv = regexp.MustCompile(`\\(begin|end)\{(\w+)\}`)

// checkTeX verifies that LaTeX output is balanced: braces, inline math and
// begin/end environments; every line outside comments.
func checkTeX(t *testing.T, what, src string) {
	t.Helper()
	var stack []string
	for _, line := range strings.Split(src, "\n") {
		if strings.HasPrefix(line, "%") {
			continue
		}
		plain := strings.NewReplacer(`\{`, "", `\}`, "", `\$`, "", `\%`, "", `\&`, "", `\_`, "", `\#`, "").Replace(line)
		if strings.Count(plain, "{") != strings.Count(plain, "}") {
			t.Errorf("%s: unbalanced braces in %q", what, line)
		}
		if strings.Count(plain, "$")%2 != 0 {
			t.Errorf("%s: unbalanced $ in %q", what, line)
		}
		if strings.Contains(plain, "%") {
			t.Errorf("%s: unescaped %% in %q", what, line)
		}
		for _, m := range texEnv.FindAllStringSubmatch(line, -1) {
			if m[1] == "begin" {
				stack = append(stack, m[2])
			} else if len(stack) == 0 || stack[len(stack)-1] != m[2] {
				t.Errorf("%s: \\end{%s} without its \\begin", what, m[2])
			} else {
				stack = stack[:len(stack)-1]
			}
		}
	}
	if len(stack) > 0 {
		t.Errorf("%s: unclosed environments %v", what, stack)
	}
}

// LaTeX output of the commands is balanced markup and typesets the
// mathematics; where a LaTeX engine is installed it must also compile.
func TestTeXOutput(t *testing.T) {
	runs := [][]string{
		{"series", "h_1", "--order", "6", "--closed-form"},
		{"resum", "S_0", "--q", "4", "--order", "8"},
		{"exact", "dims", "--q", "4", "--n", "0..3"},
		{"series", "b", "--around", "inf", "--order", "6"},
		{"hightemp", "logz", "--order", "6"},
		{"hightemp", "moments", "--order", "4", "--q", "4"},
	}
	engine, _ := exec.LookPath("pdflatex")
	for _, args := range runs {
		out, err := runCLI(t, append(args, "--format", "tex")...)
		if err != nil {
			t.Fatal(err)
		}
		what := strings.Join(args, " ")
		checkTeX(t, what, out)
		if strings.Contains(out, `h\_1`) || strings.Contains(out, `\^{}`) {
			t.Errorf("%s: mathematics escaped instead of typeset:\n%s", what, out)
		}
		if engine == "" {
			continue
		}
		dir := t.TempDir()
		doc := "\\documentclass{article}\n\\begin{document}\n" + out + "\\end{document}\n"
		if err := os.WriteFile(filepath.Join(dir, "t.tex"), []byte(doc), 0o644); err != nil {
			t.Fatal(err)
		}
		cmd := exec.Command(engine, "-interaction=nonstopmode", "-halt-on-error", "t.tex")
		cmd.Dir = dir
		if b, err := cmd.CombinedOutput(); err != nil {
			t.Errorf("%s: pdflatex failed: %v\n%s", what, err, b)
		}
	}
	if engine == "" {
		t.Log("no pdflatex on this machine: checked the markup only")
	}
}
