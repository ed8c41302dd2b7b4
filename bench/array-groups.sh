#!/usr/bin/env bash
# Fragmented arrays in a scan's TSV: groups of two or more loci, each starting no more than GAP bases
# (default 10) after the one before ends, with periods of 50 or more within 5 % of each other. A satellite
# array cut into pieces shows up as such a group; an array reported whole does not.
#   bench/array-groups.sh SCAN.tsv [GAP]      prints one line per group, then the count
# Each group line also says, for each break, whether the motif after it reads as the other strand of the
# motif before ("inverted": of its cyclic 6-mers, at least 0.3 found in the reverse complement of the
# motif before and more than twice as many there as in that motif itself), and the last line counts the groups split only at
# such strand changes, which the scan splits on purpose (README, Satellite arrays). The count of groups
# is the same with or without that line.
set -euo pipefail
tsv="$1"
gap="${2:-10}"
{ if [[ "$tsv" == *.gz ]]; then zcat "$tsv"; else cat "$tsv"; fi; } | awk -F'\t' -v gap="$gap" '
  /^#/ { next }
  !header { for (i = 1; i <= NF; i++) col[$i] = i; header = 1; next }
  function rc(s,   i, t, c) {
    t = ""
    for (i = length(s); i >= 1; i--) {
      c = substr(s, i, 1)
      t = t (c == "A" ? "T" : c == "C" ? "G" : c == "G" ? "C" : c == "T" ? "A" : "N")
    }
    return t
  }
  # share of the cyclic 6-mers of a found among the cyclic 6-mers of b
  function shared(a, b,   i, n, seen, ca, cb, hit) {
    ca = a substr(a, 1, 5); cb = b substr(b, 1, 5)
    split("", seen)
    for (i = 1; i <= length(b); i++) seen[substr(cb, i, 6)] = 1
    hit = 0; n = length(a)
    for (i = 1; i <= n; i++) if (substr(ca, i, 6) in seen) hit++
    return n > 0 ? hit / n : 0
  }
  function inverted(a, b,   f, r) {
    f = shared(b, a); r = shared(b, rc(a))
    return r >= 0.3 && r > 2 * f
  }
  function flush() {
    if (n >= 2) {
      groups++
      if (allinv) strand++
      printf "%s:%d-%d\t%d loci\tperiods %s\tbreaks %s\n", gc, gs, ge, n, gp, gb
    }
    n = 0
  }
  {
    c = $col["chrom"]; s = $col["start"] + 0; e = $col["end"] + 0; p = $col["period"] + 0; m = $col["motif"]
    if (n > 0 && c == gc && p >= 50 && s <= ge + gap && (p - lp < 0 ? lp - p : p - lp) <= 0.05 * lp) {
      inv = inverted(lm, m)
      if (!inv) allinv = 0
      n++; ge = e; gp = gp "," p; lp = p; gb = gb (gb == "" ? "" : ",") (inv ? "inverted" : "same strand"); lm = m
      next
    }
    flush()
    if (p >= 50) { n = 1; gc = c; gs = s; ge = e; gp = p; lp = p; lm = m; gb = ""; allinv = 1 }
  }
  END {
    flush()
    printf "groups\t%d\n", groups + 0
    printf "split only at strand changes\t%d\n", strand + 0
  }'
