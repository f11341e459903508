package main

import (
	"crypto/sha256"
	"encoding/hex"
	"fmt"
	"io"
	"os"
	"runtime/debug"

	"github.com/spf13/cobra"

	"qbridge/expansion"
)

// codeVersion identifies the code that computes cached coefficients: the
// release and the VCS revision of a clean build, else (a modified tree, or
// a build without VCS stamps) the SHA-256 of the executable itself, so
// that no change of code ever reads another code's numbers.
func codeVersion() string {
	rev, modified := "", true
	if bi, ok := debug.ReadBuildInfo(); ok {
		for _, s := range bi.Settings {
			switch s.Key {
			case "vcs.revision":
				rev = s.Value
			case "vcs.modified":
				modified = s.Value == "true"
			}
		}
	}
	if rev != "" && !modified {
		return version + "+" + rev
	}
	if exe, err := os.Executable(); err == nil {
		if f, err := os.Open(exe); err == nil {
			defer f.Close()
			h := sha256.New()
			if _, err := io.Copy(h, f); err == nil {
				return version + "+exe-" + hex.EncodeToString(h.Sum(nil))[:16]
			}
		}
	}
	return version + "+unknown-build"
}

// newCache returns the coefficient cache in os.UserCacheDir()/qbridge, or
// nil with --no-cache or when there is no cache directory (a warning).
func newCache(cmd *cobra.Command, noCache bool) *expansion.Cache {
	if noCache {
		return nil
	}
	dir, err := expansion.DefaultCacheDir()
	if err != nil {
		fmt.Fprintf(cmd.ErrOrStderr(), "qbridge: warning: no cache directory (%v); computing the series afresh\n", err)
		return nil
	}
	return &expansion.Cache{Dir: dir, Version: codeVersion(), Warn: cmd.ErrOrStderr()}
}

var cacheCmd = &cobra.Command{
	Use:   "cache",
	Short: "The store of computed series (os.UserCacheDir()/qbridge)",
	Long: `qbridge keeps the series it computes (they do not depend on q) in the user's
cache directory, one JSON file per quantity, end, order and precision, each
stamped with the code version and a checksum; a file from another version,
or one that is corrupt, is ignored with a warning and recomputed.
  qbridge cache info    where the cache is and what it holds
  qbridge cache clear   remove every stored series`,
	Args: cobra.NoArgs,
	RunE: func(cmd *cobra.Command, args []string) error { return cmd.Help() },
}

var cacheClearCmd = &cobra.Command{
	Use:   "clear",
	Short: "Remove every stored series",
	Args:  cobra.NoArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		c := newCache(cmd, false)
		if c == nil {
			return fmt.Errorf("no cache directory to clear")
		}
		n, err := c.Clear()
		if err != nil {
			return fmt.Errorf("clearing %s: %v", c.Dir, err)
		}
		return emit(cmd, &Output{
			JSON:   map[string]any{"directory": c.Dir, "removed": n},
			Tables: []Table{{Header: []string{"directory", "files removed"}, Rows: [][]string{{c.Dir, fmt.Sprint(n)}}}},
		})
	},
}

var cacheInfoCmd = &cobra.Command{
	Use:   "info",
	Short: "Where the cache is, its code version and its files",
	Args:  cobra.NoArgs,
	RunE: func(cmd *cobra.Command, args []string) error {
		c := newCache(cmd, false)
		if c == nil {
			return fmt.Errorf("no cache directory")
		}
		files, err := c.Files()
		if err != nil {
			return err
		}
		if files == nil {
			files = []string{}
		}
		tab := Table{Header: []string{"file"}}
		for _, f := range files {
			tab.Rows = append(tab.Rows, []string{f})
		}
		return emit(cmd, &Output{
			JSON:   map[string]any{"directory": c.Dir, "code_version": c.Version, "files": files},
			Tables: []Table{tab},
			Notes:  []string{"directory: " + c.Dir, "code version: " + c.Version},
		})
	},
}

func init() {
	cacheCmd.AddCommand(cacheClearCmd, cacheInfoCmd)
	rootCmd.AddCommand(cacheCmd)
}
