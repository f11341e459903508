package main

import (
	"errors"
	"fmt"
	"os"
	"strings"
)

func main() {
	if err := rootCmd.Execute(); err != nil {
		var cf *claimFailed
		if errors.As(err, &cf) {
			os.Exit(1) // the verdict is printed already
		}
		fmt.Fprintf(os.Stderr, "qbridge: %v\n", err)
		var ue *usageError
		if errors.As(err, &ue) || isCobraUsage(err) {
			os.Exit(2)
		}
		os.Exit(1)
	}
}

// isCobraUsage recognises the errors cobra itself returns for a command
// line it cannot take (an unknown command, a wrong number of arguments):
// bad input, exit status 2.
func isCobraUsage(err error) bool {
	msg := err.Error()
	for _, p := range []string{"unknown command", "unknown flag", "unknown shorthand flag", "accepts ", "requires at least", "invalid argument"} {
		if strings.HasPrefix(msg, p) {
			return true
		}
	}
	return false
}
