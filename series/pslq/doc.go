// Package pslq finds integer relations between real numbers with the PSLQ
// algorithm (Ferguson, Bailey and Arno 1999), and FindRelation accepts a
// relation only when it still holds on extra digits beyond those used to
// find it.
//
// Working precision is always in bits, taken from the inputs or given
// explicitly (PSLQ); FindRelation's findDigits is not a precision but the
// number of leading digits of the data that the search may look at. It
// may import series/scalar only.
package pslq
