package reports

import (
	"bufio"
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"strings"

	"github.com/olekukonko/tablewriter"
	"github.com/olekukonko/tablewriter/renderer"
	"github.com/olekukonko/tablewriter/tw"
)

// WriteJSON writes r as one indented JSON object with keys in order.
func WriteJSON(w io.Writer, r Record) error {
	if err := r.Validate(); err != nil {
		return err
	}
	bw := bufio.NewWriter(w)
	writeObject(bw, r, "")
	bw.WriteString("\n")
	return bw.Flush()
}

func writeObject(w *bufio.Writer, r Record, indent string) {
	if len(r) == 0 {
		w.WriteString("{}")
		return
	}
	w.WriteString("{\n")
	inner := indent + "  "
	for i, f := range r {
		w.WriteString(inner)
		writeString(w, f.Key)
		w.WriteString(": ")
		writeValue(w, f.Value, inner)
		if i < len(r)-1 {
			w.WriteString(",")
		}
		w.WriteString("\n")
	}
	w.WriteString(indent + "}")
}

func writeString(w *bufio.Writer, s string) {
	b, _ := json.Marshal(s) // a string always marshals
	w.Write(b)
}

func writeValue(w *bufio.Writer, v any, indent string) {
	switch x := v.(type) {
	case nil:
		w.WriteString("null")
	case float64:
		w.WriteString(FormatFloat(x))
	case int:
		fmt.Fprint(w, x)
	case bool:
		fmt.Fprint(w, x)
	case string:
		writeString(w, x)
	case [3]float64:
		fmt.Fprintf(w, "[%s, %s, %s]", FormatFloat(x[0]), FormatFloat(x[1]), FormatFloat(x[2]))
	case []string:
		w.WriteString("[")
		for i, s := range x {
			if i > 0 {
				w.WriteString(", ")
			}
			writeString(w, s)
		}
		w.WriteString("]")
	case Record:
		writeObject(w, x, indent)
	case []Record:
		if len(x) == 0 {
			w.WriteString("[]")
			return
		}
		w.WriteString("[\n")
		inner := indent + "  "
		for i, r := range x {
			w.WriteString(inner)
			writeObject(w, r, inner)
			if i < len(x)-1 {
				w.WriteString(",")
			}
			w.WriteString("\n")
		}
		w.WriteString(indent + "]")
	default:
		panic(fmt.Sprintf("reports: unsupported value type %T", v))
	}
}

// vectorKeys splits a vector key into its three column names:
// position_km -> position_x_km, position_y_km, position_z_km.
func vectorKeys(key string) [3]string {
	suffix, _ := unitSuffixOf(key)
	base := strings.TrimSuffix(key, suffix)
	return [3]string{base + "_x" + suffix, base + "_y" + suffix, base + "_z" + suffix}
}

// CSVHeader returns the CSV column names of r: scalar keys as they are,
// vectors as three columns, lists and nested objects left out.
func CSVHeader(r Record) []string {
	var h []string
	for _, f := range r {
		switch f.Value.(type) {
		case []Record, Record, []string:
			continue
		case [3]float64:
			k := vectorKeys(f.Key)
			h = append(h, k[:]...)
		default:
			h = append(h, f.Key)
		}
	}
	return h
}

// CSVRow returns the cells that go under CSVHeader(r).
func CSVRow(r Record) []string {
	var row []string
	for _, f := range r {
		switch x := f.Value.(type) {
		case []Record, Record, []string:
			continue
		case nil:
			row = append(row, "")
		case float64:
			row = append(row, FormatFloat(x))
		case [3]float64:
			row = append(row, FormatFloat(x[0]), FormatFloat(x[1]), FormatFloat(x[2]))
		default:
			row = append(row, fmt.Sprint(x))
		}
	}
	return row
}

// WriteCSV writes r as a header line and one data line.
func WriteCSV(w io.Writer, r Record) error {
	if err := r.Validate(); err != nil {
		return err
	}
	cw := csv.NewWriter(w)
	cw.Write(CSVHeader(r))
	cw.Write(CSVRow(r))
	cw.Flush()
	return cw.Error()
}

// WriteCSVList writes a list of records with the header of the first.
func WriteCSVList(w io.Writer, header []string, rows []Record) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(header); err != nil {
		return err
	}
	for _, r := range rows {
		if err := r.Validate(); err != nil {
			return err
		}
		if err := cw.Write(CSVRow(r)); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// newTable makes the house table style: ASCII rules, unit-bearing
// header names kept as written.
func newTable(w io.Writer, align []tw.Align) *tablewriter.Table {
	return tablewriter.NewTable(w,
		tablewriter.WithRenderer(renderer.NewBlueprint(tw.Rendition{Symbols: tw.NewSymbols(tw.StyleASCII)})),
		tablewriter.WithHeaderAutoFormat(tw.Off),
		tablewriter.WithHeaderAlignment(tw.AlignLeft),
		tablewriter.WithAlignment(tw.Alignment(align)),
	)
}

// WriteTitle writes a section heading.
func WriteTitle(w io.Writer, title string) error {
	_, err := fmt.Fprintf(w, "%s\n%s\n", title, strings.Repeat("~", len([]rune(title))))
	return err
}

// WriteSummaryTable writes r as rows of quantity, value and unit. Lists
// and nested objects are left to their own tables.
func WriteSummaryTable(w io.Writer, r Record) error {
	if err := r.Validate(); err != nil {
		return err
	}
	t := newTable(w, []tw.Align{tw.AlignLeft, tw.AlignRight, tw.AlignLeft, tw.AlignLeft})
	t.Header("quantity", "value", "unit", "key")
	for _, f := range r {
		switch f.Value.(type) {
		case []Record, Record, []string:
			continue
		}
		label := f.Label
		if label == "" {
			label = f.Key
		}
		if err := t.Append(label, tableTextKey(f.Key, f.Value, f.Digits), UnitOf(f.Key), f.Key); err != nil {
			return err
		}
	}
	return t.Render()
}

// WriteListTable writes rows of records as a table with one column per
// key of the first record (lists and nested objects left out).
func WriteListTable(w io.Writer, rows []Record) error {
	if len(rows) == 0 {
		return nil
	}
	var header []string
	var align []tw.Align
	for _, f := range rows[0] {
		switch f.Value.(type) {
		case []Record, Record, []string:
			continue
		case string, bool:
			align = append(align, tw.AlignLeft)
		default:
			align = append(align, tw.AlignRight)
		}
		header = append(header, f.Key)
	}
	t := newTable(w, align)
	hdr := make([]any, len(header))
	for i, h := range header {
		hdr[i] = h
	}
	t.Header(hdr...)
	for _, r := range rows {
		if err := r.Validate(); err != nil {
			return err
		}
		var cells []any
		for _, f := range r {
			switch f.Value.(type) {
			case []Record, Record, []string:
				continue
			}
			cells = append(cells, tableTextKey(f.Key, f.Value, f.Digits))
		}
		if err := t.Append(cells...); err != nil {
			return err
		}
	}
	return t.Render()
}
