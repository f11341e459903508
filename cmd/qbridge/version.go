package main

import (
	"runtime"
	"runtime/debug"

	"github.com/spf13/cobra"
)

// version is the release number; builds from a checkout add the VCS revision.
const version = "0.1.0"

func init() {
	rootCmd.AddCommand(&cobra.Command{
		Use:   "version",
		Short: "Print the qbridge version, Go version and build revision",
		Args:  cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			rev := "unknown"
			if bi, ok := debug.ReadBuildInfo(); ok {
				for _, s := range bi.Settings {
					if s.Key == "vcs.revision" {
						rev = s.Value
					}
				}
			}
			return emit(cmd, &Output{
				JSON: map[string]string{"version": version, "go": runtime.Version(), "revision": rev},
				Tables: []Table{{
					Header: []string{"qbridge", "go", "revision"},
					Rows:   [][]string{{version, runtime.Version(), rev}},
				}},
			})
		},
	})
}
