package stria.compare;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.out.ResultHeader;
import stria.out.ResultInput;
import stria.out.ResultSeal;
import stria.shard.ShardId;

/**
 * Joins the parts of a split comparison ({@code compare --shard K/N}) into the result one unsplit run
 * writes, byte for byte. A's rows of parts 1..N follow each other in A's order and are copied as they are.
 * The {@code new} rows of a part are candidates, the loci of B that no locus of that part claims; a locus of
 * B is new when no part claims it, so the merged {@code new} rows are those every part has, in B's order
 * (each part lists them in B's order, so all parts are read side by side once).
 *
 * <p>Before anything is written the set is checked: every part 1..N once, all of the same A, B, settings
 * and version, and each part complete: it ends with the closing line ({@link ResultSeal}) that
 * {@code compare --shard} writes last, and its rows agree with it.
 */
public final class CompareMerge {
    private record Part(String file, CompareHeader header, String input, String otherInput, ShardId id) {
    }

    private final List<Part> parts;

    private CompareMerge(List<Part> parts) {
        this.parts = parts;
    }

    /** Whether {@code file} begins with the header of a comparison (rather than a scan result). */
    public static boolean isComparison(String file) {
        try {
            return CompareHeader.parse(headerLines(file).lines) != null;
        } catch (IllegalArgumentException e) {
            throw new StriaException(file + " has a damaged header: " + e.getMessage());
        }
    }

    public static CompareMerge check(List<String> files) {
        if (files.isEmpty()) {
            throw new StriaException("no comparison parts given");
        }
        List<Part> parts = new ArrayList<>();
        for (String f : files) {
            parts.add(part(f));
        }
        Part first = parts.get(0);
        Part[] byK = new Part[first.id.n() + 1];
        for (Part p : parts) {
            String why = null;
            if (p.id.n() != first.id.n()) {
                why = "they come from comparisons split differently (" + first.id + " vs " + p.id + ")";
            } else if (!p.input.equals(first.input)) {
                why = "their A differs (" + first.input.substring(1) + " vs " + p.input.substring(1) + ")";
            } else if (!p.otherInput.equals(first.otherInput)) {
                why = "their B differs (" + first.otherInput.substring(1) + " vs " + p.otherInput.substring(1) + ")";
            } else if (!p.header.a().settings().equals(first.header.a().settings())) {
                why = "they were made with different settings (" + first.header.a().settings() + " vs "
                        + p.header.a().settings() + ")";
            } else if (!p.header.a().version().equals(first.header.a().version())) {
                why = "they were made by different stria versions";
            }
            if (why != null) {
                throw new StriaException(first.file + " and " + p.file + " do not belong together: " + why);
            }
            if (byK[p.id.k()] != null) {
                throw new StriaException(byK[p.id.k()].file + " and " + p.file + " are both part " + p.id);
            }
            byK[p.id.k()] = p;
        }
        for (Part p : parts) {
            checkSeal(p);
        }
        List<Integer> missing = new ArrayList<>();
        for (int k = 1; k <= first.id.n(); k++) {
            if (byK[k] == null) {
                missing.add(k);
            }
        }
        if (!missing.isEmpty()) {
            throw new StriaException("incomplete set of comparison parts: " + missing.size() + " of " + first.id.n()
                    + " missing (part " + missing.get(0) + (missing.size() > 1 ? " and more" : "") + ")");
        }
        List<Part> ordered = new ArrayList<>();
        for (int k = 1; k <= first.id.n(); k++) {
            ordered.add(byK[k]);
        }
        return new CompareMerge(ordered);
    }

    /** The header of the joined result, with {@code command} as its command line. */
    public List<String> header(String command) {
        ResultHeader h = parts.get(0).header.a();
        return new CompareHeader(new ResultHeader(h.version(), command, h.settings(), h.contigs(), null, h.regions()),
                parts.get(0).header.other()).lines();
    }

    public List<ContigInfo> otherContigs() {
        return parts.get(0).header.other();
    }

    /** Hands every row of the joined result, in order, to {@code out}. */
    public void rows(CompareWriter out) {
        Map<String, Integer> aRank = rank(parts.get(0).header.a().contigs());
        for (Part p : parts) {
            try (ResultInput in = open(p)) {
                long[] last = {-1, -1};
                String line;
                while ((line = in.readLine()) != null && !line.startsWith(".\t")
                        && !line.startsWith(ResultSeal.PREFIX)) {
                    String[] f = line.split("\t", 3);
                    Integer r = aRank.get(f[0]);
                    long start = r == null || f.length < 3 ? -1 : parse(f[1]);
                    if (start < 0 || r < last[0] || (r == last[0] && start < last[1])) {
                        throw new StriaException(p.file + ": row out of order or not of A: " + abbreviate(line));
                    }
                    last[0] = r;
                    last[1] = start;
                    out.row(line);
                }
            }
        }
        intersectNew(out);
    }

    /** The rows of B's loci that every part has as new. */
    private void intersectNew(CompareWriter out) {
        Map<String, Integer> bRank = rank(otherContigs());
        int n = parts.size();
        ResultInput[] in = new ResultInput[n];
        String[] head = new String[n];
        long[][] key = new long[n][];
        try {
            for (int i = 0; i < n; i++) {
                in[i] = open(parts.get(i));
                String line;
                while ((line = in[i].readLine()) != null && !line.startsWith(".\t")
                        && !line.startsWith(ResultSeal.PREFIX)) {
                    // A's rows: read before
                }
                line = closing(line);
                head[i] = line;
                key[i] = line == null ? null : newKey(parts.get(i).file, line, bRank);
            }
            while (true) {
                long[] min = null;
                for (int i = 0; i < n; i++) {
                    if (head[i] == null) {
                        return;
                    }
                    if (min == null || compare(key[i], min) < 0) {
                        min = key[i];
                    }
                }
                boolean all = true;
                for (int i = 0; i < n && all; i++) {
                    all = compare(key[i], min) == 0 && head[i].equals(head[0]);
                }
                if (all) {
                    out.row(head[0]);
                }
                for (int i = 0; i < n; i++) {
                    if (compare(key[i], min) == 0) {
                        String next = closing(in[i].readLine());
                        long[] k = next == null ? null : newKey(parts.get(i).file, next, bRank);
                        if (k != null && compare(k, key[i]) <= 0) {
                            throw new StriaException(parts.get(i).file + ": new rows out of B's order at "
                                    + abbreviate(next));
                        }
                        head[i] = next;
                        key[i] = k;
                    }
                }
            }
        } finally {
            for (ResultInput r : in) {
                if (r != null) {
                    r.close();
                }
            }
        }
    }

    /** Null for the closing line (the end of a part's rows), else the line. */
    private static String closing(String line) {
        return line != null && line.startsWith(ResultSeal.PREFIX) ? null : line;
    }

    /** Refuses a part that does not end with its closing line, or whose rows disagree with it. */
    private static void checkSeal(Part p) {
        ResultSeal body = new ResultSeal();
        String closing = null;
        try (ResultInput in = ResultInput.open(p.file, StandardCharsets.ISO_8859_1)) {
            String line;
            while ((line = in.readLine()) != null && !line.equals(CompareRow.HEADER)) {
                // header lines
            }
            long lineNo = 0;
            while ((line = in.readLine()) != null) {
                lineNo++;
                if (closing != null) {
                    throw new StriaException(p.file + ": a line after the closing " + ResultSeal.PREFIX.strip()
                            + " line (row " + lineNo + "); the file is damaged");
                }
                if (line.startsWith(ResultSeal.PREFIX)) {
                    closing = line;
                } else {
                    body.line(line);
                }
            }
        }
        body.check(p.file, closing, "compare --shard", "rows", "compare part " + p.id + " again");
    }

    private static long[] newKey(String file, String line, Map<String, Integer> bRank) {
        String[] f = line.split("\t", 12);
        Integer r = f.length < 12 ? null : bRank.get(f[5]);
        if (r == null || !f[10].equals("new")) {
            throw new StriaException(file + ": not a new locus of B where new loci are: " + abbreviate(line));
        }
        return new long[] {r, parse(f[6]), parse(f[7]), parse(f[3])};
    }

    private static int compare(long[] x, long[] y) {
        for (int i = 0; i < x.length; i++) {
            int c = Long.compare(x[i], y[i]);
            if (c != 0) {
                return c;
            }
        }
        return 0;
    }

    private static long parse(String s) {
        try {
            return Long.parseLong(s);
        } catch (NumberFormatException e) {
            return -1;
        }
    }

    private static Map<String, Integer> rank(List<ContigInfo> contigs) {
        Map<String, Integer> m = new HashMap<>();
        for (ContigInfo c : contigs) {
            m.put(c.name(), m.size());
        }
        return m;
    }

    /** A part opened after its header and column row. */
    private static ResultInput open(Part p) {
        ResultInput in = ResultInput.open(p.file, StandardCharsets.UTF_8);
        String line;
        while ((line = in.readLine()) != null && line.startsWith("#")) {
            // header
        }
        if (line == null || !line.equals(CompareRow.HEADER)) {
            in.close();
            throw new StriaException(p.file + " has not the columns of a comparison");
        }
        return in;
    }

    private record Head(List<String> lines, String firstOther) {
    }

    private static Head headerLines(String file) {
        List<String> lines = new ArrayList<>();
        try (ResultInput in = ResultInput.open(file, StandardCharsets.UTF_8)) {
            String line;
            while ((line = in.readLine()) != null && line.startsWith("#")) {
                lines.add(line);
            }
            return new Head(lines, line);
        }
    }

    private static Part part(String file) {
        Head h = headerLines(file);
        CompareHeader ch;
        try {
            ch = CompareHeader.parse(h.lines);
        } catch (RuntimeException e) {
            throw new StriaException(file + " has a damaged header: " + e.getMessage());
        }
        if (ch == null) {
            throw new StriaException(file + " is not a comparison (no #stria and #other-input lines)");
        }
        if (!ch.a().inputLineMatches(h.lines) || !ch.otherInputMatches(h.lines)) {
            throw new StriaException(file + " has a damaged header: an input line does not match its contig lines");
        }
        if (ch.a().shard() == null) {
            throw new StriaException(file + " has no #shard line, so it is not a part of a split comparison");
        }
        if (!CompareRow.HEADER.equals(h.firstOther)) {
            throw new StriaException(file + " has not the columns of a comparison");
        }
        ShardId id;
        try {
            id = ShardId.parse(ch.a().shard());
        } catch (IllegalArgumentException e) {
            throw new StriaException(file + " has a damaged #shard line: " + ch.a().shard());
        }
        String input = null;
        String other = null;
        for (String l : h.lines) {
            if (l.startsWith(ResultHeader.PREFIX_INPUT)) {
                input = l;
            } else if (l.startsWith(CompareHeader.PREFIX_OTHER_INPUT)) {
                other = l;
            }
        }
        return new Part(file, ch, input, other, id);
    }

    private static String abbreviate(String line) {
        String l = line.replace('\t', ' ');
        return l.length() > 60 ? l.substring(0, 57) + "..." : l;
    }
}
