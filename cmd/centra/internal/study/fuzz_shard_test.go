package study

import "testing"

// FuzzParseShard: any text either fails with a *study.Error or gives a
// shard whose ranges tile a study without gaps or overlaps.
func FuzzParseShard(f *testing.F) {
	for _, s := range []string{"1/1", "3/8", " 2 / 2 ", "0/1", "2/1", "1/0", "1/1000001", "-1/3", "a/b", "1", "1/2/3", "9223372036854775807/9223372036854775807"} {
		f.Add(s, 10)
	}
	f.Fuzz(func(t *testing.T, s string, total int) {
		sh, err := ParseShard(s)
		if err != nil {
			isStudyError(t, s, err)
			return
		}
		if sh.K < 1 || sh.K > sh.N || sh.N > MaxShards {
			t.Fatalf("ParseShard(%q) = %+v", s, sh)
		}
		if total < 0 || total > MaxCases {
			return
		}
		lo, hi := sh.Range(total)
		if lo < 0 || hi > total || lo > hi {
			t.Fatalf("%+v.Range(%d) = [%d, %d)", sh, total, lo, hi)
		}
		if sh.K > 1 {
			if _, prevHi := (Shard{K: sh.K - 1, N: sh.N}).Range(total); prevHi != lo {
				t.Fatalf("shard %d/%d starts at %d, the one before ends at %d", sh.K, sh.N, lo, prevHi)
			}
		}
	})
}
