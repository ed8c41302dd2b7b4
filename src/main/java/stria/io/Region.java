package stria.io;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import stria.Intervals;
import stria.StriaException;

/**
 * A stretch of one contig, 0-based, end exclusive: the only form used inside stria. The 1-based inclusive
 * form people type is converted once, in {@link #parse}.
 */
public record Region(String contig, int start, int end) {
    public Region {
        if (contig == null || start < 0 || end < start) {
            throw new IllegalArgumentException("bad region " + contig + " " + start + " " + end);
        }
    }

    public int length() {
        return end - start;
    }

    /** As people type regions: {@code contig:start-end}, 1-based, inclusive (the inverse of {@link #parse}). */
    public String toText() {
        return contig + ":" + (start + 1) + "-" + end;
    }

    /**
     * The union of {@code regions} in genome order: sorted by the contig's place in {@code genome}, then by
     * start, overlapping and touching regions merged, empty ones dropped.
     *
     * @throws IllegalArgumentException when a region names a contig not in {@code genome}
     */
    public static List<Region> union(List<Region> regions, List<ContigInfo> genome) {
        Map<String, Integer> rank = new HashMap<>();
        for (int i = 0; i < genome.size(); i++) {
            rank.put(genome.get(i).name(), i);
        }
        List<Region> sorted = new ArrayList<>(regions);
        for (Region r : sorted) {
            if (!rank.containsKey(r.contig())) {
                throw new IllegalArgumentException("region " + r + " is not on a contig of the genome");
            }
        }
        sorted.sort(Comparator.<Region>comparingInt(r -> rank.get(r.contig())).thenComparingInt(Region::start));
        int n = sorted.size();
        int[] starts = new int[n];
        int[] ends = new int[n];
        List<Region> out = new ArrayList<>();
        for (int a = 0; a < n; ) {
            String contig = sorted.get(a).contig();
            int b = a;
            while (b < n && sorted.get(b).contig().equals(contig)) {
                starts[b - a] = sorted.get(b).start();
                ends[b - a] = sorted.get(b).end();
                b++;
            }
            int m = Intervals.union(starts, ends, b - a);
            for (int i = 0; i < m; i++) {
                out.add(new Region(contig, starts[i], ends[i]));
            }
            a = b;
        }
        return out;
    }

    /**
     * Parses {@code chr2}, {@code chr2:1,001-2,000} (1-based, inclusive, commas allowed) or
     * {@code chr2:1001} and {@code chr2:1001-} (to the end of the contig). A name that exists as a whole
     * wins over splitting at its last colon, because contig names may contain colons.
     *
     * @throws IllegalArgumentException when the text is not a region at all (a usage error)
     * @throws StriaException when the contig is not in the genome or the range does not fit in it
     */
    public static Region parse(String text, List<ContigInfo> contigs) {
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException("empty region");
        }
        String t = text.strip();
        ContigInfo whole = find(t, contigs);
        if (whole != null) {
            return new Region(whole.name(), 0, whole.length());
        }
        int colon = t.lastIndexOf(':');
        if (colon < 0) {
            throw new StriaException("region " + t + ": no contig of that name in the genome");
        }
        String name = t.substring(0, colon);
        String range = t.substring(colon + 1).replace(",", "");
        if (name.isEmpty()) {
            throw new IllegalArgumentException("region '" + t + "' has no contig name");
        }
        if (!range.matches("[0-9]+(-[0-9]*)?")) {
            throw new IllegalArgumentException("region '" + t
                    + "': expected NAME, NAME:START-END or NAME:START (1-based positions, commas allowed)");
        }
        int dash = range.indexOf('-');
        long first = number(dash < 0 ? range : range.substring(0, dash));
        boolean toEnd = dash < 0 || dash == range.length() - 1;
        long last = toEnd ? Long.MAX_VALUE : number(range.substring(dash + 1));
        if (first < 1) {
            throw new IllegalArgumentException("region '" + t + "': positions start at 1");
        }
        if (last < first) {
            throw new IllegalArgumentException("region '" + t + "': end is before start");
        }
        ContigInfo c = find(name, contigs);
        if (c == null) {
            throw new StriaException("region " + t + ": no contig " + name + " in the genome");
        }
        if (toEnd) {
            last = c.length();
        }
        if (first > c.length() || last > c.length()) {
            throw new StriaException("region " + t + " is outside " + c.name() + " (length " + c.length() + ")");
        }
        return new Region(c.name(), (int) (first - 1), (int) last);
    }

    private static long number(String digits) {
        // more digits than any contig length can have: keep it out of range without overflowing
        return digits.length() > 12 ? Long.MAX_VALUE / 2 : Long.parseLong(digits);
    }

    private static ContigInfo find(String name, List<ContigInfo> contigs) {
        for (ContigInfo c : contigs) {
            if (c.name().equals(name)) {
                return c;
            }
        }
        return null;
    }
}
