package study

import (
	"encoding/binary"
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strconv"
	"strings"

	"centra/cmd/centra/internal/quantity"
)

// MaxCases bounds the number of cases of one plan (and of one grid
// dimension): a billion rows is far beyond any study that finishes.
const MaxCases = 1_000_000_000

// Sentinels classify the errors of the parsers.
var (
	// ErrSyntax: the expression is not of a known form.
	ErrSyntax = errors.New("study: malformed expression")
	// ErrRange: the numbers do not make a study (zero step, a step that
	// moves away from TO, a negative sigma, LO not below HI, non-finite).
	ErrRange = errors.New("study: values out of range")
	// ErrUnit: the parts of one expression carry different units.
	ErrUnit = errors.New("study: mixed units")
	// ErrTooMany: more than MaxCases cases.
	ErrTooMany = errors.New("study: too many cases")
)

// Error reports a malformed --vary, --draw, --shard or plan: which text,
// what is wrong with it (Err wraps a sentinel) and how to fix it.
type Error struct {
	Input string // the expression as given
	Err   error  // the reason, wrapping ErrSyntax, ErrRange, ErrUnit or ErrTooMany
	Hint  string // how to fix it
}

func (e *Error) Error() string { return fmt.Sprintf("%q: %v", e.Input, e.Err) }

func (e *Error) Unwrap() error { return e.Err }

func errorf(input string, sentinel error, hint, format string, args ...any) error {
	return &Error{Input: input, Err: fmt.Errorf("%w: %s", sentinel, fmt.Sprintf(format, args...)), Hint: hint}
}

// Value is one parameter value of a case.
type Value struct {
	Name    string  // flag name, "inclination"
	Text    string  // the flag's value text: "45deg", "2.0973km/s", "j2"
	Num     float64 // the number in Unit (Numeric values only)
	Unit    string  // the unit as written; "" for a bare number or a word
	Numeric bool    // false for words such as "j2"
}

// Vary is one dimension of a grid: a range FROM:TO:STEP or a list of
// values.
type Vary struct {
	Name string
	Unit string // shared unit of the numbers, "" when bare or words

	from, step float64
	n          int      // number of values of a range
	list       []string // texts of a list (words or numbers)
	nums       []float64
	numeric    bool
}

const (
	varyHint = "write --vary NAME=FROM:TO:STEP (e.g. altitude=400km:800km:100km) or NAME=V1,V2,... (e.g. model=point,j2)"
	drawHint = "write --draw NAME=normal(MEAN,SIGMA) or NAME=uniform(LO,HI), e.g. speed=normal(2.1km/s,0.02km/s)"
)

// splitName splits "NAME=REST" and checks NAME is a flag name.
func splitName(s, hint string) (name, rest string, err error) {
	name, rest, ok := strings.Cut(s, "=")
	name = strings.TrimPrefix(strings.TrimSpace(name), "--")
	if !ok {
		return "", "", errorf(s, ErrSyntax, hint, "no NAME=")
	}
	if name == "" {
		return "", "", errorf(s, ErrSyntax, hint, "empty NAME")
	}
	for i, r := range name {
		ok := r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r == '-' || r == '_' || i > 0 && r >= '0' && r <= '9'
		if !ok {
			return "", "", errorf(s, ErrSyntax, hint, "NAME %q is not a flag name (letters, digits and '-')", name)
		}
	}
	rest = strings.TrimSpace(rest)
	if rest == "" {
		return "", "", errorf(s, ErrSyntax, hint, "no values after %s=", name)
	}
	return name, rest, nil
}

// number is a parsed number with its unit text.
type number struct {
	v    float64
	unit string
}

// splitNumber is the quantity parser's number splitter, so sweep values
// read exactly as flags do.
func splitNumber(s string) (num, rest string) { return quantity.SplitNumber(s) }

// parseNumber reads "12.5km/s" as 12.5 and "km/s". ok is false when s
// does not start with a number or the unit is not a unit word.
func parseNumber(s string) (number, bool) {
	s = strings.TrimSpace(s)
	num, unit := splitNumber(s)
	if num == "" {
		return number{}, false
	}
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return number{}, false
	}
	unit = strings.TrimSpace(unit)
	if unit != "" {
		c := unit[0]
		if !(c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z') {
			return number{}, false
		}
		for _, r := range unit {
			if !(r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '/' || r == '^') {
				return number{}, false
			}
		}
	}
	return number{v: v, unit: unit}, true
}

// compound reports a unit such as "d6h" (from 1d6h), which cannot be
// stepped as one number.
func compound(unit string) bool {
	for i := 1; i < len(unit); i++ {
		d := unit[i-1] >= '0' && unit[i-1] <= '9'
		l := unit[i] >= 'a' && unit[i] <= 'z' || unit[i] >= 'A' && unit[i] <= 'Z'
		if d && l {
			return true
		}
	}
	return false
}

// commonUnit returns the one unit of nums (bare numbers take it).
func commonUnit(input, hint string, nums []number) (string, error) {
	unit := ""
	for _, n := range nums {
		if compound(n.unit) {
			return "", errorf(input, ErrUnit, hint, "%q is a compound quantity; write it in one unit (30h, not 1d6h)", n.unit)
		}
		if n.unit == "" {
			continue
		}
		if unit == "" {
			unit = n.unit
		} else if n.unit != unit {
			return "", errorf(input, ErrUnit, hint, "units %q and %q differ; write every part in one unit", unit, n.unit)
		}
	}
	return unit, nil
}

// ParseVary reads one grid dimension: "NAME=FROM:TO:STEP", each part a
// number with an optional shared unit, or "NAME=V1,V2,..." (numbers in
// one unit, or words). A range holds FROM, FROM+STEP, ... up to TO
// (included when it falls on a step, within 1e-9 of a step); STEP must
// move from FROM towards TO, and FROM:FROM:STEP is the single value FROM.
func ParseVary(s string) (Vary, error) {
	name, rest, err := splitName(s, varyHint)
	if err != nil {
		return Vary{}, err
	}
	v := Vary{Name: name}
	if strings.ContainsAny(rest, "()") {
		return Vary{}, errorf(s, ErrSyntax, "distributions belong to --draw: "+drawHint, "%q is a distribution, not a grid", rest)
	}
	if strings.Contains(rest, ",") || !strings.Contains(rest, ":") {
		return parseList(s, v, rest)
	}
	parts := strings.Split(rest, ":")
	if len(parts) != 3 {
		return Vary{}, errorf(s, ErrSyntax, varyHint+"; for values that contain ':' (times) use a list A,B,...", "a range has three parts FROM:TO:STEP, got %d", len(parts))
	}
	nums := make([]number, 3)
	for i, p := range parts {
		n, ok := parseNumber(p)
		if !ok {
			what := [...]string{"FROM", "TO", "STEP"}[i]
			return Vary{}, errorf(s, ErrSyntax, varyHint+"; for values that contain ':' (times) use a list A,B,...", "%s %q is not a number with a unit", what, strings.TrimSpace(p))
		}
		nums[i] = n
	}
	if v.Unit, err = commonUnit(s, varyHint, nums); err != nil {
		return Vary{}, err
	}
	from, to, step := nums[0].v, nums[1].v, nums[2].v
	span := to - from
	switch {
	case math.IsInf(span, 0):
		return Vary{}, errorf(s, ErrRange, "give FROM and TO of a sensible size", "TO - FROM overflows")
	case step == 0:
		return Vary{}, errorf(s, ErrRange, "give a nonzero STEP", "STEP is zero")
	case span != 0 && math.Signbit(span) != math.Signbit(step):
		return Vary{}, errorf(s, ErrRange, fmt.Sprintf("use STEP %s to go from %s to %s", strconv.FormatFloat(-step, 'g', -1, 64), strings.TrimSpace(parts[0]), strings.TrimSpace(parts[1])), "STEP %g moves away from TO", step)
	}
	count := span/step + 1e-9
	if !(count < MaxCases) {
		return Vary{}, errorf(s, ErrTooMany, "lengthen STEP or narrow FROM:TO", "%.3g values, more than %d", math.Floor(count)+1, MaxCases)
	}
	v.from, v.step, v.n, v.numeric = from, step, int(math.Floor(count))+1, true
	// The last value must print as a finite number distinct in order.
	if last := v.rangeValue(v.n - 1); math.IsInf(last, 0) || math.IsNaN(last) {
		return Vary{}, errorf(s, ErrRange, "give finite values", "values overflow")
	}
	return v, nil
}

func parseList(s string, v Vary, rest string) (Vary, error) {
	items := strings.Split(rest, ",")
	if len(items) > MaxCases {
		return Vary{}, errorf(s, ErrTooMany, "split the study", "%d values", len(items))
	}
	nums := make([]number, 0, len(items))
	numeric := true
	for i, it := range items {
		it = strings.TrimSpace(it)
		if it == "" {
			return Vary{}, errorf(s, ErrSyntax, varyHint, "value %d of the list is empty", i+1)
		}
		items[i] = it
		if n, ok := parseNumber(it); ok && numeric {
			nums = append(nums, n)
		} else {
			numeric = false
		}
	}
	v.list, v.n = items, len(items)
	if !numeric {
		return v, nil
	}
	unit, err := commonUnit(s, varyHint, nums)
	if err != nil {
		return Vary{}, err
	}
	v.Unit, v.numeric = unit, true
	v.nums = make([]float64, len(nums))
	for i, n := range nums {
		v.nums[i] = n.v
	}
	return v, nil
}

// Len returns the number of values of the dimension.
func (v Vary) Len() int { return v.n }

// Numeric reports whether the values are numbers (in [Vary.Unit]).
func (v Vary) Numeric() bool { return v.numeric }

func (v Vary) rangeValue(k int) float64 {
	x := v.from + float64(k)*v.step
	// 15 significant digits remove the rounding of from + k*step
	// (0.1*3 = 0.30000000000000004) without touching any written digit.
	y, _ := strconv.ParseFloat(strconv.FormatFloat(x, 'g', 15, 64), 64)
	return y
}

// At returns value k (0 <= k < Len) of the dimension.
func (v Vary) At(k int) Value {
	if k < 0 || k >= v.Len() {
		panic(fmt.Sprintf("study: value %d of %d", k, v.Len()))
	}
	switch {
	case v.list == nil: // range
		x := v.rangeValue(k)
		return Value{Name: v.Name, Text: formatNum(x) + v.Unit, Num: x, Unit: v.Unit, Numeric: true}
	case v.numeric:
		x := v.nums[k]
		return Value{Name: v.Name, Text: formatNum(x) + v.Unit, Num: x, Unit: v.Unit, Numeric: true}
	}
	return Value{Name: v.Name, Text: v.list[k]}
}

func formatNum(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// Dist is a probability distribution of a draw.
type Dist int

const (
	Normal  Dist = iota // normal(MEAN, SIGMA), SIGMA > 0
	Uniform             // uniform(LO, HI), LO < HI, on [LO, HI)
)

func (d Dist) String() string {
	if d == Uniform {
		return "uniform"
	}
	return "normal"
}

// Draw is one Monte Carlo parameter.
type Draw struct {
	Name string
	Dist Dist
	A, B float64 // MEAN and SIGMA, or LO and HI, in Unit
	Unit string
}

// ParseDraw reads "NAME=normal(MEAN,SIGMA)" or "NAME=uniform(LO,HI)";
// the two numbers share one unit.
func ParseDraw(s string) (Draw, error) {
	name, rest, err := splitName(s, drawHint)
	if err != nil {
		return Draw{}, err
	}
	fn, args, ok := strings.Cut(rest, "(")
	if !ok || !strings.HasSuffix(args, ")") {
		return Draw{}, errorf(s, ErrSyntax, drawHint, "%q is not normal(...) or uniform(...)", rest)
	}
	d := Draw{Name: name}
	switch strings.ToLower(strings.TrimSpace(fn)) {
	case "normal", "gauss", "gaussian":
		d.Dist = Normal
	case "uniform":
		d.Dist = Uniform
	default:
		return Draw{}, errorf(s, ErrSyntax, drawHint, "unknown distribution %q", strings.TrimSpace(fn))
	}
	parts := strings.Split(strings.TrimSuffix(args, ")"), ",")
	if len(parts) != 2 {
		return Draw{}, errorf(s, ErrSyntax, drawHint, "%s takes two numbers, got %d", d.Dist, len(parts))
	}
	nums := make([]number, 2)
	for i, p := range parts {
		n, ok := parseNumber(p)
		if !ok {
			return Draw{}, errorf(s, ErrSyntax, drawHint, "%q is not a number with a unit", strings.TrimSpace(p))
		}
		nums[i] = n
	}
	if d.Unit, err = commonUnit(s, drawHint, nums); err != nil {
		return Draw{}, err
	}
	d.A, d.B = nums[0].v, nums[1].v
	switch {
	case d.Dist == Normal && !(d.B > 0):
		return Draw{}, errorf(s, ErrRange, "give a positive SIGMA (for a fixed value pass the flag itself)", "SIGMA %g is not positive", d.B)
	case d.Dist == Uniform && !(d.A < d.B):
		return Draw{}, errorf(s, ErrRange, "give LO below HI (for a fixed value pass the flag itself)", "LO %g is not below HI %g", d.A, d.B)
	case math.IsInf(d.B-d.A, 0) || math.IsInf(d.A+8*d.B, 0) || math.IsInf(d.A-8*d.B, 0):
		return Draw{}, errorf(s, ErrRange, "give values of a sensible size", "the distribution overflows")
	}
	return d, nil
}

// Nominal returns the centre of the distribution: MEAN, or (LO+HI)/2.
func (d Draw) Nominal() Value {
	x := d.A
	if d.Dist == Uniform {
		x = d.A + (d.B-d.A)/2
	}
	return d.value(x)
}

func (d Draw) value(x float64) Value {
	return Value{Name: d.Name, Text: formatNum(x) + d.Unit, Num: x, Unit: d.Unit, Numeric: true}
}

// Source is the random stream of one case.
type Source struct{ c *rand.ChaCha8 }

// NewSource returns the stream of case i of a study seeded with seed: a
// ChaCha8 generator keyed by the seed and the index (little-endian, in
// the first 16 bytes of the key).
func NewSource(seed uint64, i int) *Source {
	var key [32]byte
	binary.LittleEndian.PutUint64(key[0:8], seed)
	binary.LittleEndian.PutUint64(key[8:16], uint64(i))
	return &Source{rand.NewChaCha8(key)}
}

// Float64 returns a uniform deviate in [0, 1) with 53 random bits.
func (s *Source) Float64() float64 { return float64(s.c.Uint64()>>11) * 0x1p-53 }

// Normal returns a standard normal deviate by the Box-Muller transform
// (Box and Muller, Ann. Math. Statist. 29 (1958) 610): two uniforms per
// deviate, the cosine branch only, so each deviate uses a fixed amount of
// the stream.
func (s *Source) Normal() float64 {
	u1 := 1 - s.Float64() // (0, 1]: the logarithm stays finite
	u2 := s.Float64()
	return math.Sqrt(-2*math.Log(u1)) * math.Cos(2*math.Pi*u2)
}

// Sample draws one value from the source.
func (d Draw) Sample(s *Source) Value {
	if d.Dist == Uniform {
		x := d.A + (d.B-d.A)*s.Float64()
		if x >= d.B { // rounding of A + (B-A) u
			x = math.Nextafter(d.B, d.A)
		}
		return d.value(x)
	}
	return d.value(d.A + d.B*s.Normal())
}

// Plan is a study: a grid (possibly of one point) times Draws Monte Carlo
// draws per grid point.
type Plan struct {
	Vary  []Vary
	Draw  []Draw
	Draws int    // draws per grid point (--cases); 1 when there are no draws
	Seed  uint64 // seed of the draws

	n     int
	radix []int // values per grid dimension
}

// NewPlan checks a study and returns its plan. Parameter names must be
// distinct; draws need cases >= 1; without draws cases must be 0 (the
// grid alone fixes the count) and at least one --vary is needed.
func NewPlan(vary []Vary, draw []Draw, cases int, seed uint64) (*Plan, error) {
	seen := map[string]bool{}
	for _, v := range vary {
		if seen[v.Name] {
			return nil, errorf(v.Name, ErrSyntax, "vary or draw each flag once", "%s is varied twice", v.Name)
		}
		seen[v.Name] = true
	}
	for _, d := range draw {
		if seen[d.Name] {
			return nil, errorf(d.Name, ErrSyntax, "vary or draw each flag once", "%s is varied twice", d.Name)
		}
		seen[d.Name] = true
	}
	p := &Plan{Vary: vary, Draw: draw, Draws: 1, Seed: seed}
	switch {
	case len(vary) == 0 && len(draw) == 0:
		return nil, errorf("", ErrSyntax, "add --vary NAME=FROM:TO:STEP or --draw NAME=normal(MEAN,SIGMA) with --cases N", "nothing is varied")
	case len(draw) > 0 && cases < 1:
		return nil, errorf(strconv.Itoa(cases), ErrRange, "give --cases N, the number of Monte Carlo draws (per grid point)", "draws need --cases of at least 1")
	case len(draw) == 0 && cases != 0:
		return nil, errorf(strconv.Itoa(cases), ErrSyntax, "drop --cases: the grid fixes the number of cases (or add a --draw)", "--cases needs a --draw")
	case len(draw) > 0:
		p.Draws = cases
	}
	n := p.Draws
	for _, v := range vary {
		k := v.Len()
		p.radix = append(p.radix, k)
		if k == 0 || n > MaxCases/k {
			return nil, errorf(v.Name, ErrTooMany, "coarsen the grid or split it into several studies", "more than %d cases", MaxCases)
		}
		n *= k
	}
	p.n = n
	return p, nil
}

// Len returns the number of cases.
func (p *Plan) Len() int { return p.n }

// Case returns the values of case i (0 <= i < Len): one per --vary in
// order, then one per --draw.
func (p *Plan) Case(i int) []Value {
	if i < 0 || i >= p.n {
		panic(fmt.Sprintf("study: case %d of %d", i, p.n))
	}
	out := make([]Value, len(p.Vary)+len(p.Draw))
	g := i / p.Draws
	for k := len(p.Vary) - 1; k >= 0; k-- {
		out[k] = p.Vary[k].At(g % p.radix[k])
		g /= p.radix[k]
	}
	if len(p.Draw) > 0 {
		src := NewSource(p.Seed, i)
		for k, d := range p.Draw {
			out[len(p.Vary)+k] = d.Sample(src)
		}
	}
	return out
}

// Nominal returns the values of the nominal case: the first grid value of
// each dimension and the centre of each distribution. Callers run it
// first to check the command line before a study starts.
func (p *Plan) Nominal() []Value {
	out := make([]Value, 0, len(p.Vary)+len(p.Draw))
	for _, v := range p.Vary {
		out = append(out, v.At(0))
	}
	for _, d := range p.Draw {
		out = append(out, d.Nominal())
	}
	return out
}

// Shard is slice K of N of a study (1 <= K <= N).
type Shard struct{ K, N int }

// MaxShards bounds N.
const MaxShards = 1_000_000

const shardHint = "write --shard K/N with 1 <= K <= N, e.g. --shard 3/8; a 0-based index i (JOB_COMPLETION_INDEX) is --shard $((i+1))/N"

// ParseShard reads "K/N".
func ParseShard(s string) (Shard, error) {
	ks, ns, ok := strings.Cut(strings.TrimSpace(s), "/")
	if !ok {
		return Shard{}, errorf(s, ErrSyntax, shardHint, "no '/'")
	}
	k, err1 := strconv.Atoi(strings.TrimSpace(ks))
	n, err2 := strconv.Atoi(strings.TrimSpace(ns))
	if err1 != nil || err2 != nil {
		return Shard{}, errorf(s, ErrSyntax, shardHint, "K and N must be whole numbers")
	}
	if n < 1 || n > MaxShards {
		return Shard{}, errorf(s, ErrRange, shardHint, "N = %d is outside 1..%d", n, MaxShards)
	}
	if k < 1 || k > n {
		return Shard{}, errorf(s, ErrRange, shardHint, "K = %d is outside 1..%d", k, n)
	}
	return Shard{K: k, N: n}, nil
}

// Range returns the cases [lo, hi) of the shard in a study of total cases:
// contiguous blocks whose sizes differ by at most one. The zero Shard is
// the whole study.
func (s Shard) Range(total int) (lo, hi int) {
	if s.N <= 1 {
		return 0, total
	}
	t := int64(total)
	return int(int64(s.K-1) * t / int64(s.N)), int(int64(s.K) * t / int64(s.N))
}

// Column returns the output column of a parameter: the flag name with '-'
// as '_', then the unit as a key suffix ("km/s" -> "_km_s", "deg" ->
// "_deg"), so that every column says its unit. unit "" adds nothing.
func Column(name, unit string) string {
	col := strings.ReplaceAll(name, "-", "_")
	if unit == "" {
		return col
	}
	u := strings.NewReplacer("/", "_", "^", "").Replace(unit)
	return col + "_" + u
}
