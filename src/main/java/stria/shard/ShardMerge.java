package stria.shard;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.out.Gff3;
import stria.out.ResultFormat;
import stria.out.ResultHeader;
import stria.out.ResultInput;
import stria.out.ResultSeal;

/**
 * Joins the results of the shards of one split run into the result a single run would have written.
 *
 * <p>Because shards own consecutive stretches of the genome in order (see {@link Partition}), the data
 * lines of shards 1..n, each sorted, concatenate to sorted output; nothing is re-sorted or re-parsed, the
 * lines are copied as bytes. What needs care is the set itself: a missing, repeated or foreign shard would
 * silently lose or duplicate loci, so the headers are checked against each other before any data is
 * written.
 */
public final class ShardMerge {

    /** The {@code #} lines of the result header; others (a format's own) are copied from the first shard. */
    private static final List<String> HEADER_PREFIXES = List.of(ResultHeader.PREFIX_TOOL,
            ResultHeader.PREFIX_COMMAND, ResultHeader.PREFIX_SETTINGS, ResultHeader.PREFIX_INPUT,
            ResultHeader.PREFIX_CONTIG, ResultHeader.PREFIX_SHARD, ResultHeader.PREFIX_REGION);

    /**
     * What the header of one shard result says. {@code leading} are the lines before the {@code #stria} line
     * (GFF3 pragmas), {@code extra} the format's own {@code #} lines after the result header.
     */
    record Part(String file, ResultHeader header, String inputLine, String columns, ResultFormat format, ShardId id,
                List<String> leading, List<String> extra) {
        int k() {
            return id.k();
        }

        int n() {
            return id.n();
        }
    }

    private final List<Part> parts;
    private final ResultFormat format;
    private final List<ContigInfo> contigs;

    private ShardMerge(List<Part> parts, ResultFormat format, List<ContigInfo> contigs) {
        this.parts = parts;
        this.format = format;
        this.contigs = contigs;
    }

    /**
     * Reads the headers of {@code files} and checks that they are the complete shard set of one run in
     * {@code format}; throws a {@link StriaException} naming the offending files otherwise.
     */
    public static ShardMerge check(List<String> files, ResultFormat format) {
        if (files.isEmpty()) {
            throw new StriaException("no shard results given");
        }
        List<Part> parts = new ArrayList<>();
        for (String f : files) {
            // one contig list is enough (equal #input lines mean equal lists), and a fragmented assembly split
            // a thousand ways would otherwise hold a thousand copies of a long list
            parts.add(readPart(f, parts.isEmpty()));
        }
        Part first = parts.get(0);
        for (Part p : parts) {
            if (p.format != first.format) {
                throw new StriaException(first.file + " is " + first.format.name() + " but " + p.file + " is "
                        + p.format.name() + ": merge the results of one format at a time");
            }
        }
        if (first.format != format) {
            throw new StriaException(first.file + " is a " + first.format.name() + " result, not "
                    + format.name() + ": merge it with " + first.format.option());
        }
        for (Part p : parts) {
            if (p.n() != first.n()) {
                throw new StriaException(first.file + " is shard " + first.id + " but " + p.file
                        + " is shard " + p.id + ": they come from runs split differently");
            }
            if (!p.inputLine.equals(first.inputLine)) {
                throw new StriaException(first.file + " and " + p.file + " were made from different inputs ("
                        + first.inputLine.substring(1) + " vs " + p.inputLine.substring(1) + ")");
            }
            if (!p.header.settings().equals(first.header.settings())) {
                throw new StriaException(first.file + " and " + p.file + " were made with different settings ("
                        + first.header.settings() + " vs " + p.header.settings() + ")");
            }
            if (!p.header.regions().equals(first.header.regions())) {
                throw new StriaException(first.file + " and " + p.file + " scanned different regions");
            }
            if (!p.header.version().equals(first.header.version())) {
                throw new StriaException(first.file + " and " + p.file + " were made by different stria versions ("
                        + first.header.version() + " vs " + p.header.version() + ")");
            }
            if (p.columns != null && !p.columns.equals(first.columns)) {
                throw new StriaException(first.file + " and " + p.file + " have different TSV columns");
            }
            // the pragmas follow from the contigs, equal by the #input check
            if (!p.extra.equals(first.extra)) {
                throw new StriaException(first.file + " and " + p.file + " were written with different output "
                        + "settings (their own # lines differ)");
            }
        }
        Part[] byK = new Part[first.n() + 1];
        for (Part p : parts) {
            if (byK[p.k()] != null) {
                throw new StriaException(byK[p.k()].file + " and " + p.file + " are both shard " + p.id);
            }
            byK[p.k()] = p;
        }
        List<Integer> missing = new ArrayList<>();
        for (int k = 1; k <= first.n(); k++) {
            if (byK[k] == null) {
                missing.add(k);
            }
        }
        if (!missing.isEmpty()) {
            throw new StriaException("incomplete shard set: " + (missing.size() == 1 ? "shard " : "shards ")
                    + ranges(missing) + " of " + first.n() + " missing from " + fileList(files));
        }
        List<Part> ordered = new ArrayList<>(parts);
        ordered.sort(Comparator.comparingInt(Part::k));
        ShardMerge merge = new ShardMerge(ordered, format, first.header.contigs());
        // every shard proven whole before a byte is written (standard output cannot be taken back)
        Order order = merge.order();
        for (Part p : ordered) {
            copyData(p, null, order);
        }
        return merge;
    }

    /**
     * The header of the merged result: that of the shards without the {@code #shard} line, with
     * {@code command} as the command line.
     */
    public ResultHeader header(String command) {
        ResultHeader h = parts.get(0).header;
        return new ResultHeader(h.version(), command, h.settings(), contigs, null, h.regions());
    }

    /** Writes the merged result (header, TSV column row, data lines of shards 1..n) to {@code out}. */
    public void writeTo(OutputStream out, String command) {
        try {
            Part first = parts.get(0);
            // GFF3 pragmas list every contig: made again from the one contig list kept
            for (String l : format == ResultFormat.GFF ? Gff3.pragmas(contigs) : first.leading) {
                writeLine(out, l);
            }
            for (String l : header(command).lines()) {
                writeLine(out, l);
            }
            for (String l : first.extra) {
                writeLine(out, l);
            }
            if (format.columnRow() != null) {
                writeLine(out, first.columns);
            }
            Order order = order();
            for (Part p : parts) {
                copyData(p, out, order);
            }
        } catch (IOException e) {
            throw StriaException.io("cannot write merged result", e);
        }
    }

    private Order order() {
        int columns = format.columnRow() != null ? parts.get(0).columns.split("\t", -1).length : NINE_COLUMNS;
        return new Order(contigs, format, columns);
    }

    /** BED6+3 (chrom start end motif score strand period copies motif_class) and GFF3 both have nine. */
    private static final int NINE_COLUMNS = 9;

    /**
     * Tracks the position of the last data line. Shards of one run own disjoint, ordered stretches, so a
     * line that goes backwards, or repeats the line before it, means shards that do not fit together (an
     * overlap would report loci twice); merge stops rather than write such a result.
     */
    private static final class Order {
        private final java.util.Map<String, Integer> rank = new java.util.HashMap<>();
        private final int[] lengths;
        private final int columns;
        private int lastRank = -1;
        private long lastStart = -1;
        private String lastLine = "";
        private String lastFile = "";
        private final ResultFormat format;

        Order(List<ContigInfo> contigs, ResultFormat format, int columns) {
            this.format = format;
            this.lengths = new int[contigs.size()];
            this.columns = columns;
            for (int i = 0; i < contigs.size(); i++) {
                rank.put(format.contigText(contigs.get(i).name()), i);
                lengths[i] = contigs.get(i).length();
            }
        }

        void check(String file, long lineNo, String line) {
            String where = file + " line " + lineNo;
            int sc = format.startColumn();
            String[] f = line.split("\t", Math.max(format.contigColumn(), sc + 1) + 2);
            boolean enough = f.length > Math.max(format.contigColumn(), sc + 1);
            Integer r = enough ? rank.get(f[format.contigColumn()]) : null;
            long start;
            long end;
            try {
                start = r == null ? -1 : Long.parseLong(f[sc]);
                end = r == null ? -1 : Long.parseLong(f[sc + 1]);
                if (format == ResultFormat.GFF && r != null) {
                    start--; // 1-based inclusive
                }
            } catch (NumberFormatException e) {
                start = -1;
                end = -1;
            }
            if (r == null || start < 0 || end <= start || end > lengths[r]) {
                throw new StriaException(where + ": not a locus of this genome: " + abbreviate(line));
            }
            int n = 1;
            for (int i = line.indexOf('\t'); i >= 0; i = line.indexOf('\t', i + 1)) {
                n++;
            }
            if (n != columns) {
                throw new StriaException(where + ": " + n + " columns where a result has " + columns + ": "
                        + abbreviate(line));
            }
            if (r < lastRank || (r == lastRank && start < lastStart) || line.equals(lastLine)) {
                throw new StriaException(where + ": locus " + abbreviate(line) + " comes after "
                        + abbreviate(lastLine) + (lastFile.equals(file) ? "" : " of " + lastFile)
                        + "; these shard results overlap or are out of order");
            }
            lastRank = r;
            lastStart = start;
            lastLine = line;
            lastFile = file;
        }

        private static String abbreviate(String line) {
            String l = line.replace('\t', ' ');
            return l.length() > 60 ? l.substring(0, 57) + "..." : l;
        }
    }

    /**
     * Reads the data lines of one shard, checks each ({@link Order}) and the closing line against the body
     * ({@link ResultSeal}), and copies them to {@code out} unless it is null.
     */
    private static void copyData(Part p, OutputStream out, Order order) {
        ResultSeal body = new ResultSeal();
        String closing = null;
        try (ResultInput r = ResultInput.open(p.file, StandardCharsets.ISO_8859_1)) {
            String line;
            boolean inHeader = true;
            long lineNo = 0;
            while ((line = r.readLine()) != null) {
                lineNo++;
                if (closing != null) {
                    throw new StriaException(p.file + " line " + lineNo + ": a line after the closing "
                            + ResultSeal.PREFIX.strip() + " line; the file is damaged");
                }
                if (line.startsWith(ResultSeal.PREFIX)) {
                    closing = line;
                    continue;
                }
                if (inHeader) {
                    if (line.startsWith("#")) {
                        continue;
                    }
                    inHeader = false;
                    if (p.format.columnRow() != null) {
                        continue; // the column row
                    }
                }
                order.check(p.file, lineNo, line);
                body.line(line);
                if (out != null) {
                    writeOrFail(out, line);
                }
            }
        }
        body.check(p.file, closing, "scan --shard", "loci", "scan shard " + p.id + " again");
    }

    private static void writeOrFail(OutputStream out, String line) {
        try {
            writeLine(out, line);
        } catch (IOException e) {
            throw StriaException.io("cannot write merged result", e);
        }
    }

    private static void writeLine(OutputStream out, String line) throws IOException {
        // ISO-8859-1 maps chars to bytes one to one, so lines leave exactly as they came in
        out.write(line.getBytes(StandardCharsets.ISO_8859_1));
        out.write('\n');
    }

    private static Part readPart(String file, boolean keepContigs) {
        List<String> lines = new ArrayList<>();
        List<String> leading = new ArrayList<>();
        List<String> extra = new ArrayList<>();
        boolean started = false;
        String firstOther = null;
        try (ResultInput r = ResultInput.open(file, StandardCharsets.ISO_8859_1)) {
            String line;
            while ((line = r.readLine()) != null) {
                if (line.startsWith(stria.out.ResultSeal.PREFIX)) {
                    break; // the closing line of a shard without loci: the body check reads it
                }
                if (!line.startsWith("#")) {
                    firstOther = line;
                    break;
                }
                lines.add(line);
                started |= line.startsWith(ResultHeader.PREFIX_TOOL);
                if (!started) {
                    leading.add(line);
                } else if (HEADER_PREFIXES.stream().noneMatch(line::startsWith)) {
                    extra.add(line);
                }
            }
        }
        ResultHeader h;
        try {
            h = ResultHeader.parse(lines);
        } catch (RuntimeException e) {
            throw new StriaException(file + " has a damaged header: " + e.getMessage());
        }
        if (h == null) {
            throw new StriaException(file + " is not a stria result (no #stria line)");
        }
        if (h.shard() == null) {
            throw new StriaException(file + " has no #shard line, so it is not the result of one shard of a split run");
        }
        String inputLine = null;
        for (String l : lines) {
            if (l.startsWith(ResultHeader.PREFIX_INPUT)) {
                inputLine = l;
            }
        }
        if (inputLine == null || !h.inputLineMatches(lines)) {
            throw new StriaException(file + " has a damaged header: its #input line does not match its #contig lines");
        }
        ShardId id;
        try {
            id = ShardId.parse(h.shard());
        } catch (IllegalArgumentException e) {
            throw new StriaException(file + " has a damaged #shard line: " + h.shard());
        }
        ResultFormat format = ResultFormat.BED;
        if (!leading.isEmpty() && leading.get(0).equals(Gff3.VERSION_PRAGMA)) {
            format = ResultFormat.GFF;
        } else if (firstOther != null && firstOther.startsWith(ResultFormat.TSV.columnRow().split("\t")[0] + "\t")) {
            format = ResultFormat.TSV;
        } else if (firstOther != null && firstOther.startsWith("id\tchrom\t")) {
            format = ResultFormat.CATALOG;
        }
        if (!keepContigs) {
            h = new ResultHeader(h.version(), h.command(), h.settings(), List.of(), h.shard(), h.regions());
            leading = format == ResultFormat.GFF ? List.of(Gff3.VERSION_PRAGMA) : leading;
        }
        return new Part(file, h, inputLine, format.columnRow() != null ? firstOther : null, format, id,
                List.copyOf(leading), List.copyOf(extra));
    }

    /** 1, 3, 4, 5, 9 as "1, 3-5, 9". */
    static String ranges(List<Integer> ks) {
        StringBuilder sb = new StringBuilder();
        int i = 0;
        while (i < ks.size()) {
            int j = i;
            while (j + 1 < ks.size() && ks.get(j + 1) == ks.get(j) + 1) {
                j++;
            }
            if (sb.length() > 0) {
                sb.append(", ");
            }
            sb.append(ks.get(i));
            if (j > i) {
                sb.append('-').append(ks.get(j));
            }
            i = j + 1;
        }
        return sb.toString();
    }

    private static String fileList(List<String> files) {
        if (files.size() <= 4) {
            return String.join(", ", files);
        }
        return files.get(0) + ", " + files.get(1) + ", ... " + files.get(files.size() - 1) + " (" + files.size()
                + " files)";
    }
}
