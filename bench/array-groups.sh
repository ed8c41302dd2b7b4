#!/usr/bin/env bash
# Fragmented arrays in a scan's TSV: groups of two or more loci, each starting no more than GAP bases
# (default 10) after the one before ends, with periods of 50 or more within 5 % of each other. A satellite
# array cut into pieces shows up as such a group; an array reported whole does not.
#   bench/array-groups.sh SCAN.tsv [GAP]      prints one line per group, then the count
set -euo pipefail
tsv="$1"
gap="${2:-10}"
{ if [[ "$tsv" == *.gz ]]; then zcat "$tsv"; else cat "$tsv"; fi; } | awk -F'\t' -v gap="$gap" '
  /^#/ { next }
  !header { for (i = 1; i <= NF; i++) col[$i] = i; header = 1; next }
  function flush() {
    if (n >= 2) { groups++; printf "%s:%d-%d\t%d loci\tperiods %s\n", gc, gs, ge, n, gp }
    n = 0
  }
  {
    c = $col["chrom"]; s = $col["start"] + 0; e = $col["end"] + 0; p = $col["period"] + 0
    if (n > 0 && c == gc && p >= 50 && s <= ge + gap && (p - lp < 0 ? lp - p : p - lp) <= 0.05 * lp) {
      n++; ge = e; gp = gp "," p; lp = p; next
    }
    flush()
    if (p >= 50) { n = 1; gc = c; gs = s; ge = e; gp = p; lp = p }
  }
  END { flush(); printf "groups\t%d\n", groups + 0 }'
