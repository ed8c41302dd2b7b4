package stria.out;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import stria.score.CopyAlignment;
import stria.score.Locus;

/**
 * One locus drawn for a person checking the call: the consensus on top, below it the copies one per line
 * as {@link CopyAlignment} aligns them, each labelled with the 1-based position of its first base (in a
 * wrapped block, of its first base in that block). Columns
 * line up: every consensus letter has a column, and each gap between two letters is as wide as the longest
 * insertion any copy has there. A base that agrees with the consensus is upper case, a mismatch is lower
 * case under its consensus letter, an insertion is lower case under a {@code .} of the consensus, and a
 * deleted letter is {@code -}. A unit wider than the line is wrapped: the consensus and all copies are drawn
 * block by block. As text every line fits {@code width} columns; as HTML the same lines are coloured.
 */
public final class LocusView {
    /** Narrowest drawing accepted: the label and a few columns. */
    public static final int MIN_WIDTH = 40;

    /** A cell of the grid: a character and what it shows. */
    private enum Kind { MATCH, MISMATCH, INSERTION, DELETION, FILLER, CONSENSUS }

    private final String title;
    private final List<String> notes = new ArrayList<>();
    private final List<String> labels = new ArrayList<>();
    /** Per row: the 0-based position of its first base, or -1 for the consensus. */
    private final List<Integer> firstBases = new ArrayList<>();
    private final List<char[]> rows = new ArrayList<>();
    private final List<Kind[]> kinds = new ArrayList<>();

    private LocusView(String title) {
        this.title = title;
    }

    /**
     * The view of {@code locus} on {@code contig}, whose bases {@code [start, end)} are {@code text[0, length)}.
     */
    public static LocusView of(String contig, Locus locus, byte[] text) {
        String motif = locus.motif();
        String title = contig + ":" + count(locus.start() + 1) + "-" + count(locus.end()) + "  period "
                + locus.period() + "  " + copies(locus) + " copies  purity "
                + String.format(Locale.ROOT, "%.3f", locus.purity()) + "  class " + shorten(locus.motifClass(), 24);
        LocusView v = new LocusView(title);
        v.notes.add("scan: " + locus.mismatches() + " mismatches, " + locus.insertions() + " insertions, "
                + locus.deletions() + " deletions");
        CopyAlignment a = CopyAlignment.of(text, 0, locus.length(), motif);
        if (a == null) {
            v.notes.add("not drawn: " + count(locus.length()) + " bases x period " + locus.period()
                    + " is more than this view aligns");
            return v;
        }
        v.layout(locus, motif, a);
        return v;
    }

    private void layout(Locus locus, String motif, CopyAlignment a) {
        int p = motif.length();
        // copies: ranges of columns; a copy starts where phase 0 comes round again
        List<int[]> copies = new ArrayList<>();
        int copyStart = 0;
        boolean seenPhase = false;
        for (int k = 0; k < a.size(); k++) {
            int ph = a.phases()[k];
            if (ph == 0 && seenPhase) {
                copies.add(new int[] {copyStart, k});
                copyStart = k;
            }
            seenPhase |= ph >= 0;
        }
        copies.add(new int[] {copyStart, a.size()});
        // widest insertion in each gap: slot j is before letter j, slot p after the last
        int[] slot = new int[p + 1];
        for (int[] c : copies) {
            int[] here = new int[p + 1];
            int next = 0;
            for (int k = c[0]; k < c[1]; k++) {
                int ph = a.phases()[k];
                if (ph < 0) {
                    here[next]++;
                } else {
                    next = ph + 1;
                }
            }
            for (int j = 0; j <= p; j++) {
                slot[j] = Math.max(slot[j], here[j]);
            }
        }
        int[] offset = new int[p + 1]; // grid column of letter j (and of the slot p)
        int width = 0;
        for (int j = 0; j <= p; j++) {
            width += slot[j];
            offset[j] = width;
            width += j < p ? 1 : 0;
        }
        char[] cons = filled(width, '.');
        Kind[] consKinds = new Kind[width];
        java.util.Arrays.fill(consKinds, Kind.FILLER);
        for (int j = 0; j < p; j++) {
            cons[offset[j]] = motif.charAt(j);
            consKinds[offset[j]] = Kind.CONSENSUS;
        }
        labels.add("consensus");
        firstBases.add(-1);
        rows.add(cons);
        kinds.add(consKinds);
        int pos = locus.start();
        int mism = 0, ins = 0, del = 0;
        for (int[] c : copies) {
            char[] row = filled(width, ' ');
            Kind[] kind = new Kind[width];
            java.util.Arrays.fill(kind, Kind.FILLER);
            for (int j = 0; j <= p; j++) {
                for (int x = offset[j] - slot[j]; x < offset[j]; x++) {
                    row[x] = '.';
                }
            }
            int firstBase = pos;
            int next = 0, used = 0;
            for (int k = c[0]; k < c[1]; k++) {
                int ph = a.phases()[k];
                char b = (char) a.bases()[k];
                if (ph < 0) {
                    int x = offset[next] - slot[next] + used++;
                    row[x] = Character.toLowerCase(b);
                    kind[x] = Kind.INSERTION;
                    ins++;
                    pos++;
                } else {
                    int x = offset[ph];
                    next = ph + 1;
                    used = 0;
                    if (b == '-') {
                        row[x] = '-';
                        kind[x] = Kind.DELETION;
                        del++;
                    } else if (a.matches(k, motif)) {
                        row[x] = Character.toUpperCase(b);
                        kind[x] = Kind.MATCH;
                        pos++;
                    } else {
                        row[x] = Character.toLowerCase(b);
                        kind[x] = Kind.MISMATCH;
                        mism++;
                        pos++;
                    }
                }
            }
            // a partial last copy ends where its bases end
            for (int x = width - 1; x >= 0 && kind[x] == Kind.FILLER; x--) {
                row[x] = ' ';
            }
            labels.add(count(firstBase + 1));
            firstBases.add(firstBase);
            rows.add(row);
            kinds.add(kind);
        }
        notes.add("drawn: " + mism + " mismatches, " + ins + " insertions, " + del + " deletions in "
                + copies.size() + (copies.size() == 1 ? " copy" : " copies"));
    }

    /** The view as text lines, none wider than {@code width}. */
    public List<String> text(int width) {
        List<String> out = new ArrayList<>();
        out.add(fit(title, width));
        for (String n : notes) {
            out.add(fit("  " + n, width));
        }
        out.add(fit("  upper case: as the consensus; lower case: mismatch, or insertion under '.'; -: deletion",
                width));
        for (Block b : blocks(width)) {
            out.add("");
            for (int r = 0; r < rows.size(); r++) {
                String drawn = new String(rows.get(r), b.from, b.to - b.from).stripTrailing();
                if (!drawn.isEmpty()) { // a partial last copy may end before the block
                    out.add(pad(label(r, b.from), b.labelWidth) + "  " + drawn);
                }
            }
        }
        return out;
    }

    /** The view as an HTML fragment ({@code <section class="locus">}), coloured by {@link #CSS}. */
    public String html(int width) {
        StringBuilder sb = new StringBuilder("<section class=\"locus\"><h2>").append(esc(title)).append("</h2>");
        for (String n : notes) {
            sb.append("<p class=\"note\">").append(esc(n)).append("</p>");
        }
        sb.append("<pre>");
        boolean firstBlock = true;
        for (Block b : blocks(width)) {
            if (!firstBlock) {
                sb.append('\n');
            }
            firstBlock = false;
            for (int r = 0; r < rows.size(); r++) {
                char[] row = rows.get(r);
                if (new String(row, b.from, b.to - b.from).isBlank()) {
                    continue; // a partial last copy may end before the block
                }
                sb.append(esc(pad(label(r, b.from), b.labelWidth))).append("  ");
                Kind[] kind = kinds.get(r);
                for (int x = b.from; x < b.to; x++) {
                    String cls = switch (kind[x]) {
                        case MISMATCH -> "x";
                        case INSERTION -> "i";
                        case DELETION -> "d";
                        case CONSENSUS -> "c";
                        default -> null;
                    };
                    String ch = esc(String.valueOf(row[x]));
                    sb.append(cls == null ? ch : "<span class=\"" + cls + "\">" + ch + "</span>");
                }
                sb.append('\n');
            }
        }
        return sb.append("</pre></section>").toString();
    }

    /** Styles of {@link #html}: mismatches, insertions, deletions and the consensus told apart by colour. */
    public static final String CSS = "section.locus pre{font:13px/1.35 'DejaVu Sans Mono',Menlo,Consolas,monospace}"
            + " section.locus .x{background:#fde2e1;color:#b42318} section.locus .i{background:#e3f4e6;color:#1e7b34}"
            + " section.locus .d{color:#8a94a6} section.locus .c{font-weight:700}"
            + " section.locus .note{color:#52606d;margin:2px 0}";

    private record Block(int from, int to, int labelWidth) {
    }

    /**
     * Row {@code r}'s label in a block that starts at column {@code from}: the 1-based position of the copy's
     * first base drawn in the block (its bases in earlier blocks counted), so a wrapped copy reads on.
     */
    private String label(int r, int from) {
        int first = firstBases.get(r);
        if (first < 0) {
            return labels.get(r);
        }
        char[] row = rows.get(r);
        int before = 0;
        for (int x = 0; x < from; x++) {
            before += Character.isLetter(row[x]) ? 1 : 0;
        }
        return count(first + before + 1L);
    }

    private List<Block> blocks(int width) {
        List<Block> out = new ArrayList<>();
        if (rows.isEmpty()) {
            return out;
        }
        int label = 0;
        for (String l : labels) {
            label = Math.max(label, l.length());
        }
        int grid = rows.get(0).length;
        int last = firstBases.get(firstBases.size() - 1);
        if (last >= 0 && grid > width - label - 2) {
            // wrapped blocks label copies further on: room for the widest position in the locus
            label = Math.max(label, count(last + (long) grid + 1).length());
        }
        int room = Math.max(1, width - label - 2);
        for (int from = 0; from < grid; from += room) {
            out.add(new Block(from, Math.min(grid, from + room), label));
        }
        return out;
    }

    private static char[] filled(int n, char c) {
        char[] a = new char[n];
        java.util.Arrays.fill(a, c);
        return a;
    }

    private static String pad(String s, int w) {
        return " ".repeat(Math.max(0, w - s.length())) + s;
    }

    private static String fit(String s, int width) {
        return s.length() <= width ? s : s.substring(0, width - 3) + "...";
    }

    private static String shorten(String s, int max) {
        return s.length() <= max ? s : s.substring(0, max - 3) + "...";
    }

    static String count(long n) {
        return String.format(Locale.ROOT, "%,d", n);
    }

    static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }

    /** Copies as the TSV writes them. */
    private static String copies(Locus l) {
        StringBuilder sb = new StringBuilder();
        LocusFormat.copies(sb, l);
        return sb.toString();
    }
}
