// Command qbridge computes conformal data, ground-state energy and the
// Schwarzian coefficient of SYK-type models as functions of the interaction
// order q, from series around q = 2 and q = infinity, their resummation, and
// a direct Schwinger-Dyson solver. Run `qbridge --help` for the commands.
package main
