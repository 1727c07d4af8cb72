// Package study enumerates the cases of a parameter study: Cartesian grids
// of flag values (--vary NAME=FROM:TO:STEP or NAME=V1,V2,...), Monte Carlo
// draws (--draw NAME=normal(MEAN,SIGMA) or uniform(LO,HI)), the seed of
// each case, and the slices (--shard K/N) that split a study across jobs.
// It knows nothing of orbits or commands: a case is a list of flag values
// that the caller passes to a command.
//
// The common calls are
//
//	v, err := study.ParseVary("inclination=40:60:5")
//	d, err := study.ParseDraw("speed=normal(2.1km/s,0.02km/s)")
//	p, err := study.NewPlan([]study.Vary{v}, []study.Draw{d}, 1000, 42)
//	sh, err := study.ParseShard("2/8")
//	lo, hi := sh.Range(p.Len())
//	for i := lo; i < hi; i++ {
//		values := p.Case(i) // grid values, then drawn values
//	}
//
// # Units
//
// The package does arithmetic on the numbers as written and keeps their
// unit text: "400km:800km:100km" steps in km, "normal(2.1km/s,0.02km/s)"
// draws in km/s. The parts of one expression share one unit (a part
// without a unit takes the unit of the others); the caller's flag parser
// gives the unit its meaning and supplies the default unit of a bare
// number. [Value.Text] is the number followed by its unit, ready to be
// passed as the flag's value.
//
// # Frames
//
// None: values are flag values, not vectors.
//
// # Conventions
//
// Case indices run from 0 to [Plan.Len]-1. The first --vary is the
// outermost loop and the last the innermost; with draws, each grid point
// gets [Plan.Draws] consecutive cases. The draws of case i depend only on
// (seed, i): they come from a ChaCha8 stream keyed by the seed and the
// index (C2SP chacha8rand, so the same on every platform and Go release),
// turned into normal deviates by the Box-Muller transform. A case
// therefore gets the same values however the study is sharded. Shards are
// numbered 1..N and are contiguous blocks of cases, so the shards' outputs
// concatenated in order are the unsharded output.
//
// Every malformed expression is a returned [*Error] carrying the text, the
// reason (one of the sentinels [ErrSyntax], [ErrRange], [ErrUnit],
// [ErrTooMany]) and a hint; nothing here panics on user input.
package study
