// Package csvtext holds the text rules shared by pvrec's CSV readers (profile, lifetime): what
// a plain decimal number is, and how a header field names its unit.
package csvtext

import "strings"

// PlainDecimal reports whether s is a plain decimal number: an optional sign, digits with an
// optional fraction ("1.5", ".5", "2."), and an optional exponent ("e-3"). It rejects what
// strconv.ParseFloat would also accept — hexadecimal floats, "Inf", "NaN", digit separators.
func PlainDecimal(s string) bool {
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	digits := 0
	for ; i < len(s) && s[i] >= '0' && s[i] <= '9'; i++ {
		digits++
	}
	if i < len(s) && s[i] == '.' {
		for i++; i < len(s) && s[i] >= '0' && s[i] <= '9'; i++ {
			digits++
		}
	}
	if digits == 0 {
		return false
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		i++
		if i < len(s) && (s[i] == '+' || s[i] == '-') {
			i++
		}
		exp := 0
		for ; i < len(s) && s[i] >= '0' && s[i] <= '9'; i++ {
			exp++
		}
		if exp == 0 {
			return false
		}
	}
	return i == len(s)
}

// SplitUnit splits a header field "name (unit)" into name and unit, trimmed; ok is false
// without the parentheses.
func SplitUnit(f string) (name, unit string, ok bool) {
	f = strings.TrimSpace(f)
	i := strings.IndexByte(f, '(')
	if i < 0 || !strings.HasSuffix(f, ")") {
		return f, "", false
	}
	return strings.TrimSpace(f[:i]), strings.TrimSpace(f[i+1 : len(f)-1]), true
}
