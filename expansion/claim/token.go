package claim

import (
	"fmt"
	"unicode"
)

// tokKind is the kind of a lexical token.
type tokKind int

const (
	tEOF tokKind = iota
	tNum
	tName
	tPlus
	tMinus
	tStar
	tSlash
	tCaret
	tLParen
	tRParen
	tComma
	tEquals
)

// token is one lexical unit with the 1-based column of its first character.
type token struct {
	kind tokKind
	text string
	col  int
}

// describe names a token for error messages.
func (t token) describe() string {
	switch t.kind {
	case tEOF:
		return "the end of the claim"
	case tNum:
		return fmt.Sprintf("number %s", t.text)
	case tName:
		return fmt.Sprintf("name %q", t.text)
	}
	return fmt.Sprintf("%q", t.text)
}

// singles maps one-character operators to their kinds.
var singles = map[rune]tokKind{
	'+': tPlus, '-': tMinus, '*': tStar, '/': tSlash, '^': tCaret,
	'(': tLParen, ')': tRParen, ',': tComma, '=': tEquals,
}

// hints suggests the spelling of characters people paste from papers.
var hints = map[rune]string{
	'ε': "write eps", 'π': "write pi", '·': "write *", '×': "write *", '−': "write -",
	'ψ': "write psi", 'Γ': "write Gamma", 'ζ': "write zeta", '²': "write ^2", '[': "use parentheses", ']': "use parentheses",
	'{': "use parentheses", '}': "use parentheses",
}

func isNameStart(r rune) bool { return r == '_' || r < 128 && unicode.IsLetter(r) }
func isNamePart(r rune) bool  { return isNameStart(r) || r >= '0' && r <= '9' }
func isDigit(r rune) bool     { return r >= '0' && r <= '9' }

// lex splits a claim into tokens; columns count characters from 1.
func lex(text string) ([]token, error) {
	rs := []rune(text)
	var out []token
	for i := 0; i < len(rs); {
		r := rs[i]
		col := i + 1
		switch {
		case r == ' ' || r == '\t':
			i++
		case isDigit(r) || r == '.' && i+1 < len(rs) && isDigit(rs[i+1]):
			j := i
			for j < len(rs) && isDigit(rs[j]) {
				j++
			}
			if j < len(rs) && rs[j] == '.' {
				j++
				for j < len(rs) && isDigit(rs[j]) {
					j++
				}
			}
			// An exponent only when digits follow: 2eps is 2 then eps.
			if j < len(rs) && (rs[j] == 'e' || rs[j] == 'E') {
				k := j + 1
				if k < len(rs) && (rs[k] == '+' || rs[k] == '-') {
					k++
				}
				if k < len(rs) && isDigit(rs[k]) {
					for k < len(rs) && isDigit(rs[k]) {
						k++
					}
					j = k
				}
			}
			if j < len(rs) && rs[j] == '.' {
				return nil, errAt(j+1, "a number has at most one decimal point")
			}
			out = append(out, token{tNum, string(rs[i:j]), col})
			i = j
		case isNameStart(r):
			j := i
			for j < len(rs) && isNamePart(rs[j]) {
				j++
			}
			out = append(out, token{tName, string(rs[i:j]), col})
			i = j
		default:
			k, ok := singles[r]
			if !ok {
				if h, ok := hints[r]; ok {
					return nil, errAt(col, "unexpected character %q (%s)", r, h)
				}
				return nil, errAt(col, "unexpected character %q", r)
			}
			if r == '*' && i+1 < len(rs) && rs[i+1] == '*' {
				return nil, errAt(col, "write powers with ^, not **")
			}
			if r == '=' && i+1 < len(rs) && rs[i+1] == '=' {
				return nil, errAt(col, "write the claim with one =, not ==")
			}
			out = append(out, token{k, string(r), col})
			i++
		}
	}
	return append(out, token{tEOF, "", len(rs) + 1}), nil
}
