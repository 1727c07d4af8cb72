package study

import (
	"errors"
	"math"
	"slices"
	"sort"
	"strconv"
	"strings"
	"testing"
)

// varyTests are the unit tests of ParseVary and the seed corpus of
// FuzzParseVary. texts are the flag values of the dimension in order.
var varyTests = []struct {
	in    string
	name  string
	unit  string
	texts []string
	err   error
}{
	{"inclination=40:60:5", "inclination", "", []string{"40", "45", "50", "55", "60"}, nil},
	{"altitude=400km:800km:100km", "altitude", "km", []string{"400km", "500km", "600km", "700km", "800km"}, nil},
	{"altitude=400:800:100km", "altitude", "km", []string{"400km", "500km", "600km", "700km", "800km"}, nil},
	{"--raan = 0 : 1 : 0.1", "raan", "", []string{"0", "0.1", "0.2", "0.3", "0.4", "0.5", "0.6", "0.7", "0.8", "0.9", "1"}, nil},
	{"span=1h:3h:1h", "span", "h", []string{"1h", "2h", "3h"}, nil},
	{"inclination=60:40:-10", "inclination", "", []string{"60", "50", "40"}, nil},
	{"inclination=40:41:0.3", "inclination", "", []string{"40", "40.3", "40.6", "40.9"}, nil},
	{"inclination=40:40:5", "inclination", "", []string{"40"}, nil},
	{"speed=7.5km/s:7.7km/s:0.1km/s", "speed", "km/s", []string{"7.5km/s", "7.6km/s", "7.7km/s"}, nil},
	{"tolerance=1e-8:1e-6:4.95e-7", "tolerance", "", []string{"1e-08", "5.05e-07", "1e-06"}, nil},
	{"model=point,j2,zonal", "model", "", []string{"point", "j2", "zonal"}, nil},
	{"tolerance=1e-6,1e-9,1e-12", "tolerance", "", []string{"1e-06", "1e-09", "1e-12"}, nil},
	{"altitude=400, 500km ,600", "altitude", "km", []string{"400km", "500km", "600km"}, nil},
	{"epoch=2027-01-01T00:00:00Z,2027-07-01T00:00:00Z", "epoch", "", []string{"2027-01-01T00:00:00Z", "2027-07-01T00:00:00Z"}, nil},
	{"degree=4", "degree", "", []string{"4"}, nil},
	{"inclination", "", "", nil, ErrSyntax},
	{"=40:60:5", "", "", nil, ErrSyntax},
	{"incl ination=40:60:5", "", "", nil, ErrSyntax},
	{"inclination=", "", "", nil, ErrSyntax},
	{"inclination=40:60", "", "", nil, ErrSyntax},
	{"inclination=40:60:5:1", "", "", nil, ErrSyntax},
	{"inclination=40:sixty:5", "", "", nil, ErrSyntax},
	{"epoch=2027-01-01T00:00:00Z", "", "", nil, ErrSyntax},
	{"inclination=40:60:0", "", "", nil, ErrRange},
	{"inclination=40:60:-5", "", "", nil, ErrRange},
	{"inclination=NaN:60:5", "", "", nil, ErrSyntax},
	{"inclination=0:1e308:1e-308", "", "", nil, ErrTooMany},
	{"inclination=-1.7e308:1.7e308:1", "", "", nil, ErrRange},
	{"altitude=400km:0.8e6m:100km", "", "", nil, ErrUnit},
	{"span=1d:2d:1d6h", "", "", nil, ErrUnit},
	{"altitude=400km,500m", "", "", nil, ErrUnit},
	{"model=point,,j2", "", "", nil, ErrSyntax},
	{"speed=normal(2,1)", "", "", nil, ErrSyntax},
	{"altitude=400km:800km:100 km", "altitude", "km", []string{"400km", "500km", "600km", "700km", "800km"}, nil},
	{"altitude=400:800:100*km", "", "", nil, ErrSyntax},
}

func TestParseVary(t *testing.T) {
	for _, tt := range varyTests {
		t.Run(tt.in, func(t *testing.T) {
			v, err := ParseVary(tt.in)
			if tt.err != nil {
				if !errors.Is(err, tt.err) {
					t.Fatalf("ParseVary(%q) error %v, want %v", tt.in, err, tt.err)
				}
				var se *Error
				if !errors.As(err, &se) || se.Hint == "" || se.Input != tt.in {
					t.Errorf("ParseVary(%q) error %#v: want an *Error with the input and a hint", tt.in, err)
				}
				return
			}
			if err != nil {
				t.Fatalf("ParseVary(%q): %v", tt.in, err)
			}
			if v.Name != tt.name || v.Unit != tt.unit {
				t.Errorf("ParseVary(%q) = name %q unit %q, want %q %q", tt.in, v.Name, v.Unit, tt.name, tt.unit)
			}
			var got []string
			for k := range v.Len() {
				got = append(got, v.At(k).Text)
			}
			if !slices.Equal(got, tt.texts) {
				t.Errorf("ParseVary(%q) values %q, want %q", tt.in, got, tt.texts)
			}
		})
	}
}

var drawTests = []struct {
	in   string
	want Draw
	err  error
}{
	{"speed=normal(2.1km/s,0.02km/s)", Draw{Name: "speed", Dist: Normal, A: 2.1, B: 0.02, Unit: "km/s"}, nil},
	{"speed = Normal( 2.1 , 0.02km/s )", Draw{Name: "speed", Dist: Normal, A: 2.1, B: 0.02, Unit: "km/s"}, nil},
	{"raan=uniform(0,360)", Draw{Name: "raan", Dist: Uniform, A: 0, B: 360}, nil},
	{"altitude=uniform(300km,1200km)", Draw{Name: "altitude", Dist: Uniform, A: 300, B: 1200, Unit: "km"}, nil},
	{"inclination=gauss(51.6,0.1)", Draw{Name: "inclination", Dist: Normal, A: 51.6, B: 0.1}, nil},
	{"speed=normal(2.1km/s,20m/s)", Draw{}, ErrUnit},
	{"speed=normal(2.1,0)", Draw{}, ErrRange},
	{"speed=normal(2.1,-1)", Draw{}, ErrRange},
	{"raan=uniform(360,0)", Draw{}, ErrRange},
	{"raan=uniform(1,1)", Draw{}, ErrRange},
	{"raan=uniform(0,360", Draw{}, ErrSyntax},
	{"raan=uniform(0)", Draw{}, ErrSyntax},
	{"raan=uniform(0,1,2)", Draw{}, ErrSyntax},
	{"raan=poisson(3,1)", Draw{}, ErrSyntax},
	{"raan=uniform(a,b)", Draw{}, ErrSyntax},
	{"raan=40:60:5", Draw{}, ErrSyntax},
	{"raan", Draw{}, ErrSyntax},
	{"speed=normal(1e308,1e308)", Draw{}, ErrRange},
	{"speed=normal(inf,1)", Draw{}, ErrSyntax},
}

func TestParseDraw(t *testing.T) {
	for _, tt := range drawTests {
		t.Run(tt.in, func(t *testing.T) {
			d, err := ParseDraw(tt.in)
			if tt.err != nil {
				if !errors.Is(err, tt.err) {
					t.Fatalf("ParseDraw(%q) error %v, want %v", tt.in, err, tt.err)
				}
				var se *Error
				if !errors.As(err, &se) || se.Hint == "" {
					t.Errorf("ParseDraw(%q) error %#v: want an *Error with a hint", tt.in, err)
				}
				return
			}
			if err != nil {
				t.Fatalf("ParseDraw(%q): %v", tt.in, err)
			}
			if d != tt.want {
				t.Errorf("ParseDraw(%q) = %+v, want %+v", tt.in, d, tt.want)
			}
		})
	}
}

func TestParseShard(t *testing.T) {
	tests := []struct {
		in   string
		want Shard
		err  error
	}{
		{"1/1", Shard{1, 1}, nil},
		{"3/8", Shard{3, 8}, nil},
		{" 8 / 8 ", Shard{8, 8}, nil},
		{"0/8", Shard{}, ErrRange},
		{"9/8", Shard{}, ErrRange},
		{"1/0", Shard{}, ErrRange},
		{"-1/4", Shard{}, ErrRange},
		{"1/2000000", Shard{}, ErrRange},
		{"3", Shard{}, ErrSyntax},
		{"a/b", Shard{}, ErrSyntax},
		{"1.5/4", Shard{}, ErrSyntax},
	}
	for _, tt := range tests {
		got, err := ParseShard(tt.in)
		if !errors.Is(err, tt.err) || got != tt.want {
			t.Errorf("ParseShard(%q) = %v, %v; want %v, %v", tt.in, got, err, tt.want, tt.err)
		}
	}
}

// The shards of a study partition its cases: contiguous, in order,
// disjoint, covering, sizes within one of each other.
func TestShardsPartition(t *testing.T) {
	for _, total := range []int{0, 1, 2, 7, 10, 100, 9973, MaxCases} {
		for _, n := range []int{1, 2, 3, 8, 64, 1000} {
			next, minSize, maxSize := 0, math.MaxInt, 0
			for k := 1; k <= n; k++ {
				lo, hi := Shard{k, n}.Range(total)
				if lo != next || hi < lo {
					t.Fatalf("total %d, shard %d/%d = [%d, %d), want it to start at %d", total, k, n, lo, hi, next)
				}
				next = hi
				minSize, maxSize = min(minSize, hi-lo), max(maxSize, hi-lo)
			}
			if next != total || maxSize-minSize > 1 {
				t.Errorf("total %d in %d shards: covers %d, sizes %d..%d", total, n, next, minSize, maxSize)
			}
		}
	}
	if lo, hi := (Shard{}).Range(5); lo != 0 || hi != 5 {
		t.Errorf("zero Shard range = [%d, %d), want [0, 5)", lo, hi)
	}
}

func mustVary(t testing.TB, s string) Vary {
	v, err := ParseVary(s)
	if err != nil {
		t.Fatal(err)
	}
	return v
}

func mustDraw(t testing.TB, s string) Draw {
	d, err := ParseDraw(s)
	if err != nil {
		t.Fatal(err)
	}
	return d
}

func texts(vs []Value) string {
	var b []string
	for _, v := range vs {
		b = append(b, v.Name+"="+v.Text)
	}
	return strings.Join(b, " ")
}

// The first --vary is the outer loop; draws repeat per grid point.
func TestPlanOrder(t *testing.T) {
	p, err := NewPlan([]Vary{mustVary(t, "inclination=40:50:10"), mustVary(t, "altitude=400km,500km,600km")}, nil, 0, 0)
	if err != nil {
		t.Fatal(err)
	}
	want := []string{
		"inclination=40 altitude=400km", "inclination=40 altitude=500km", "inclination=40 altitude=600km",
		"inclination=50 altitude=400km", "inclination=50 altitude=500km", "inclination=50 altitude=600km",
	}
	if p.Len() != len(want) {
		t.Fatalf("Len = %d, want %d", p.Len(), len(want))
	}
	for i, w := range want {
		if got := texts(p.Case(i)); got != w {
			t.Errorf("Case(%d) = %s, want %s", i, got, w)
		}
	}
	if got := texts(p.Nominal()); got != want[0] {
		t.Errorf("Nominal = %s, want %s", got, want[0])
	}

	pd, err := NewPlan([]Vary{mustVary(t, "model=point,j2")}, []Draw{mustDraw(t, "speed=uniform(1,2)")}, 3, 7)
	if err != nil {
		t.Fatal(err)
	}
	if pd.Len() != 6 {
		t.Fatalf("Len = %d, want 6", pd.Len())
	}
	for i := range 6 {
		c := pd.Case(i)
		if m := []string{"point", "j2"}[i/3]; c[0].Text != m {
			t.Errorf("Case(%d) model %s, want %s", i, c[0].Text, m)
		}
		if c[1].Num < 1 || c[1].Num >= 2 || c[1].Unit != "" || !c[1].Numeric {
			t.Errorf("Case(%d) speed %+v, want in [1, 2)", i, c[1])
		}
	}
	if got := pd.Nominal()[1].Text; got != "1.5" {
		t.Errorf("nominal of uniform(1,2) = %s, want 1.5", got)
	}
}

func TestNewPlanErrors(t *testing.T) {
	v := mustVary(t, "inclination=40:60:5")
	d := mustDraw(t, "inclination=normal(50,1)")
	big := mustVary(t, "raan=0:99999:1")
	tests := []struct {
		name  string
		vary  []Vary
		draw  []Draw
		cases int
		err   error
	}{
		{"nothing", nil, nil, 0, ErrSyntax},
		{"twice", []Vary{v, v}, nil, 0, ErrSyntax},
		{"vary and draw same", []Vary{v}, []Draw{d}, 10, ErrSyntax},
		{"draw without cases", nil, []Draw{d}, 0, ErrRange},
		{"cases without draw", []Vary{v}, nil, 10, ErrSyntax},
		{"too many", []Vary{big, mustVary(t, "argp=0:99999:1")}, nil, 0, ErrTooMany},
		{"too many draws", []Vary{big}, []Draw{mustDraw(t, "speed=normal(1,1)")}, 100000, ErrTooMany},
	}
	for _, tt := range tests {
		if _, err := NewPlan(tt.vary, tt.draw, tt.cases, 1); !errors.Is(err, tt.err) {
			t.Errorf("%s: NewPlan error %v, want %v", tt.name, err, tt.err)
		}
	}
}

// A case's draws depend on (seed, index) only: the same in any order and
// in another plan with the same seed, different for another seed.
func TestDrawsDeterministic(t *testing.T) {
	draws := []Draw{mustDraw(t, "speed=normal(2.1km/s,0.02km/s)"), mustDraw(t, "raan=uniform(0,360)")}
	p1, _ := NewPlan(nil, draws, 1000, 42)
	p2, _ := NewPlan(nil, draws, 1000, 42)
	p3, _ := NewPlan(nil, draws, 1000, 43)
	forward := make([]string, p1.Len())
	for i := range p1.Len() {
		forward[i] = texts(p1.Case(i))
	}
	same := 0
	for i := p2.Len() - 1; i >= 0; i-- {
		if got := texts(p2.Case(i)); got != forward[i] {
			t.Fatalf("case %d: %s backwards, %s forwards", i, got, forward[i])
		}
		if texts(p3.Case(i)) == forward[i] {
			same++
		}
	}
	if same > 0 {
		t.Errorf("%d cases equal under seeds 42 and 43", same)
	}
	// Values round-trip through their text, the form the command reads.
	for i := range 100 {
		for _, v := range p1.Case(i) {
			x, err := strconv.ParseFloat(strings.TrimSuffix(v.Text, v.Unit), 64)
			if err != nil || x != v.Num {
				t.Errorf("case %d: %s=%s reads back as %v (%v), want %v", i, v.Name, v.Text, x, err, v.Num)
			}
		}
	}
}

// ksCritical01 is the 1% critical value of the Kolmogorov-Smirnov
// statistic times sqrt(n) for large n: 1.63, from memory (Massey, "The
// Kolmogorov-Smirnov test for goodness of fit", J. Amer. Statist. Assoc.
// 46 (1951), Table 1, "over 35" row). TestKSCritical recomputes it from
// Kolmogorov's limiting distribution.
const ksCritical01 = 1.63

// kolmogorovCDF is P(sqrt(n) D_n <= x) in the limit n -> infinity,
// 1 - 2 sum_{k>=1} (-1)^(k-1) exp(-2 k^2 x^2) (Kolmogorov 1933).
func kolmogorovCDF(x float64) float64 {
	s := 0.0
	for k := 1; k <= 100; k++ {
		term := math.Exp(-2 * float64(k*k) * x * x)
		if k%2 == 0 {
			term = -term
		}
		s += term
	}
	return 1 - 2*s
}

func TestKSCritical(t *testing.T) {
	// The printed 1.63 is rounded from 1.6276: P = 0.99 within 0.0005.
	if p := kolmogorovCDF(ksCritical01); math.Abs(p-0.99) > 5e-4 {
		t.Errorf("Kolmogorov CDF(%.2f) = %.5f, want 0.99 +- 0.0005", ksCritical01, p)
	}
}

// ksStatistic returns sqrt(n) times the largest distance between the
// empirical distribution of xs and cdf.
func ksStatistic(xs []float64, cdf func(float64) float64) float64 {
	sort.Float64s(xs)
	n := float64(len(xs))
	d := 0.0
	for i, x := range xs {
		f := cdf(x)
		d = math.Max(d, math.Max(float64(i+1)/n-f, f-float64(i)/n))
	}
	return d * math.Sqrt(n)
}

// The draws follow their distributions: mean and standard deviation
// within 4 standard errors (central limit theorem), and the
// Kolmogorov-Smirnov statistic below its 1% critical value. The seeds
// are fixed, so the test is deterministic; it fails if the transform or
// the stream is wrong, not by chance on a rerun.
func TestDrawDistributions(t *testing.T) {
	const n = 20000
	tests := []struct {
		expr      string
		mean, std float64
		cdf       func(float64) float64
	}{
		// normal CDF 0.5 (1 + erf((x - mean) / (sigma sqrt 2)))
		{"x=normal(2.1km/s,0.02km/s)", 2.1, 0.02, func(x float64) float64 { return 0.5 * (1 + math.Erf((x-2.1)/(0.02*math.Sqrt2))) }},
		{"x=normal(-3,7)", -3, 7, func(x float64) float64 { return 0.5 * (1 + math.Erf((x+3)/(7*math.Sqrt2))) }},
		// uniform on [a, b): mean (a+b)/2, standard deviation (b-a)/sqrt(12)
		{"x=uniform(300km,1200km)", 750, 900 / math.Sqrt(12), func(x float64) float64 { return math.Min(1, math.Max(0, (x-300)/900)) }},
	}
	for _, tt := range tests {
		t.Run(tt.expr, func(t *testing.T) {
			p, err := NewPlan(nil, []Draw{mustDraw(t, tt.expr)}, n, 2027)
			if err != nil {
				t.Fatal(err)
			}
			xs := make([]float64, n)
			var sum, sum2 float64
			for i := range n {
				x := p.Case(i)[0].Num
				xs[i] = x
				sum += x
				sum2 += x * x
			}
			mean := sum / n
			std := math.Sqrt((sum2 - n*mean*mean) / (n - 1))
			if se := tt.std / math.Sqrt(n); math.Abs(mean-tt.mean) > 4*se {
				t.Errorf("mean %.6g, want %.6g within 4 standard errors (%.3g)", mean, tt.mean, 4*se)
			}
			// standard error of the sample standard deviation, normal
			// case sigma/sqrt(2(n-1)); the uniform one is smaller
			if se := tt.std / math.Sqrt(2*(n-1)); math.Abs(std-tt.std) > 4*se {
				t.Errorf("standard deviation %.6g, want %.6g within %.3g", std, tt.std, 4*se)
			}
			if ks := ksStatistic(xs, tt.cdf); ks > ksCritical01 {
				t.Errorf("Kolmogorov-Smirnov sqrt(n) D = %.3f, above the 1%% critical value %.2f", ks, ksCritical01)
			}
		})
	}
}

// Uniform draws never reach HI, even when A + (B-A) u rounds up.
func TestUniformHalfOpen(t *testing.T) {
	d := mustDraw(t, "x=uniform(1,1.0000000000000002)")
	src := NewSource(1, 1)
	for range 1000 {
		if v := d.Sample(src); v.Num < d.A || v.Num >= d.B {
			t.Fatalf("sample %v outside [%v, %v)", v.Num, d.A, d.B)
		}
	}
}

func TestColumn(t *testing.T) {
	tests := []struct{ name, unit, want string }{
		{"inclination", "deg", "inclination_deg"},
		{"periapsis-alt", "km", "periapsis_alt_km"},
		{"speed", "km/s", "speed_km_s"},
		{"area", "m^2", "area_m2"},
		{"eccentricity", "", "eccentricity"},
	}
	for _, tt := range tests {
		if got := Column(tt.name, tt.unit); got != tt.want {
			t.Errorf("Column(%q, %q) = %q, want %q", tt.name, tt.unit, got, tt.want)
		}
	}
}

func TestErrorMessage(t *testing.T) {
	_, err := ParseVary("inclination=40:60:0")
	want := `"inclination=40:60:0": study: values out of range: STEP is zero`
	if err == nil || err.Error() != want {
		t.Errorf("error %q, want %q", err, want)
	}
}
