package reports

import (
	"bytes"
	"math"
	"strconv"
	"strings"
)

// sigFigs is the number of significant figures shown on the sheets.
const sigFigs = 4

// num is a number formatted for display: a mantissa and, for very large or very small
// magnitudes only, a power of ten.
type num struct {
	m string // mantissa with an ASCII '-' for negatives, e.g. "-21.33"
	e int    // power of ten; 0 when none is shown
}

// plain returns the number in ASCII, e.g. "21.33" or "3.2e-7".
func (n num) plain() string {
	if n.e == 0 {
		return n.m
	}
	return n.m + "e" + strconv.Itoa(n.e)
}

// fmtNum formats v with 4 significant figures, trailing zeros trimmed, without an exponent
// for magnitudes from 1e-4 up to 1e12: values of 1000 and above are shown as whole numbers,
// rounded to 4 significant figures from 10000 on (123456.7 as 123500), the significance of a
// hand calculation; results.json keeps every digit. Non-finite values, which the engine never
// records, are shown as "?".
func fmtNum(v float64) num {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return num{m: "?"}
	}
	a := math.Abs(v)
	if a == 0 {
		return num{m: "0"}
	}
	var buf [32]byte // the digits, formatted without a string of their own
	if a >= 1e-4 && a < 1e12 {
		var s []byte
		if a >= 1000 {
			p := math.Pow(10, math.Floor(math.Log10(a))-(sigFigs-1))
			if p < 1 {
				p = 1
			}
			s = strconv.AppendFloat(buf[:0], math.Round(v/p)*p, 'f', 0, 64)
		} else {
			dec := sigFigs - 1 - int(math.Floor(math.Log10(a)))
			if dec < 0 {
				dec = 0
			}
			s = trimZeros(strconv.AppendFloat(buf[:0], v, 'f', dec, 64))
		}
		if string(s) == "-0" {
			return num{m: "0"}
		}
		return num{m: string(s)}
	}
	s := strconv.AppendFloat(buf[:0], v, 'e', sigFigs-1, 64)
	i := bytes.IndexByte(s, 'e')
	e, _ := strconv.Atoi(string(s[i+1:]))
	return num{m: string(trimZeros(s[:i])), e: e}
}

// trimZeros drops the trailing zeros of a decimal fraction, and its point if nothing follows.
func trimZeros(s []byte) []byte {
	if bytes.IndexByte(s, '.') < 0 {
		return s
	}
	s = bytes.TrimRight(s, "0")
	return bytes.TrimSuffix(s, []byte("."))
}

// DisplayUnit maps an engine unit to the unit shown on the sheets and the factor that
// converts a value in the engine unit to it: "N" to kN (×1e-3), "Nmm" to kNm (×1e-6),
// "mm2" to mm², "mm4" to ×10⁶ mm⁴ (×1e-6), "N/mm" to kN/m (same number), "N/mm2" to kN/m²
// (×1e3), "N/mm3" to kN/m³ (×1e6); others are shown as is. A quantity whose unit depends on
// what it measures (a floor area) is mapped by DisplayQuantity.
func DisplayUnit(engine string) (scale float64, unit string) {
	switch engine {
	case "N":
		return 1e-3, "kN"
	case "Nmm", "N·mm", "N*mm":
		return 1e-6, "kNm"
	case "mm2":
		return 1, "mm²"
	case "mm3":
		return 1, "mm³"
	case "mm4":
		return 1e-6, "× 10⁶ mm⁴"
	case "N/mm":
		return 1, "kN/m"
	case "N/mm2":
		return 1e3, "kN/m²"
	case "N/mm3":
		return 1e6, "kN/m³"
	case "Nmm2":
		return 1e-9, "kNm²"
	case "deg":
		return 1, "°"
	case "d":
		return 1, "days"
	}
	return 1, engine
}

// DisplayQuantity maps the engine unit of the quantity called symbol to the unit shown on the
// sheets, as DisplayUnit, except that floor areas (the symbols A_slab…, the tributary area A
// and the reference area A_0 of EN 1991-1-1 6.3.1.2(10)) are shown in m² (×1e-6), where the
// areas of bars and sections stay in mm².
func DisplayQuantity(symbol, engine string) (scale float64, unit string) {
	if engine == "mm2" && floorArea(symbol) {
		return 1e-6, "m²"
	}
	return DisplayUnit(engine)
}

// floorArea reports whether a symbol names an area of floor: A, A_0 or A_slab with any
// further subscript ("A_slab,A1–B1").
func floorArea(symbol string) bool {
	switch base, sub := splitSymbol(symbol); {
	case base != "A":
		return false
	case sub == "" || sub == "0":
		return true
	default:
		return sub == "slab" || strings.HasPrefix(sub, "slab,")
	}
}

// quantity returns v in engine unit u converted for display, with the display unit.
func quantity(v float64, u string) (num, string) {
	s, du := DisplayUnit(u)
	return fmtNum(v * s), du
}

// quantityOf returns v, the value of the quantity called symbol in engine unit u, converted
// for display (DisplayQuantity), with the display unit.
func quantityOf(v float64, u, symbol string) (num, string) {
	s, du := DisplayQuantity(symbol, u)
	return fmtNum(v * s), du
}
