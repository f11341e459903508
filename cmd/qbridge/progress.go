package main

import (
	"fmt"
	"io"
	"os"
	"time"

	"github.com/spf13/cobra"
)

// progress prints a one-line, self-overwriting progress report on stderr.
// It is silent with --quiet and when stderr is not a terminal.
type progress struct {
	w     io.Writer
	label string
	start time.Time
	last  time.Time
}

func stderrIsTerminal() bool {
	fi, err := os.Stderr.Stat()
	return err == nil && fi.Mode()&os.ModeCharDevice != 0
}

func newProgress(cmd *cobra.Command, label string) *progress {
	p := &progress{label: label, start: time.Now()}
	if !opts.Quiet && stderrIsTerminal() {
		p.w = cmd.ErrOrStderr()
	}
	return p
}

// Update reports the fraction done and a short detail, at most ten times a second.
func (p *progress) Update(frac float64, detail string) {
	if p == nil || p.w == nil {
		return
	}
	now := time.Now()
	if now.Sub(p.last) < 100*time.Millisecond {
		return
	}
	p.last = now
	fmt.Fprintf(p.w, "\r\033[K%s: %3.0f%% %s (%.1fs)", p.label, 100*frac, detail, now.Sub(p.start).Seconds())
}

// Done clears the progress line.
func (p *progress) Done() {
	if p == nil || p.w == nil {
		return
	}
	fmt.Fprint(p.w, "\r\033[K")
}
