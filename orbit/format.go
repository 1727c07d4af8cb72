package orbit

import "strconv"

// fmtVal formats "name = value unit" for error details.
func fmtVal(name string, v float64, unit string) string {
	s := name + " = " + strconv.FormatFloat(v, 'g', -1, 64)
	if unit != "" {
		s += " " + unit
	}
	return s
}
