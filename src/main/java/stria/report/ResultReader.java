package stria.report;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.io.Region;
import stria.out.ResultHeader;
import stria.out.ResultInput;
import stria.shard.ShardId;

/**
 * Reads TSV results for a report. Several files must describe one genome: the same {@code #input}
 * fingerprint and the same {@code #settings}, because a summary that mixed genomes or settings would
 * look plausible and mean nothing. Columns are found by the names in the header row, so added columns do
 * not break old reports.
 */
public final class ResultReader {
    private static final String[] REQUIRED = {"chrom", "start", "end", "period", "motif", "motif_class", "purity"};
    /** Read when present (results written before nested periodicity lack them): empty cells mean none. */
    private static final String[] OPTIONAL = {"subunit_period", "subunits"};

    private ResultReader() {
    }

    public static ResultSet read(List<String> paths) {
        if (paths.isEmpty()) {
            throw new StriaException("no result files given");
        }
        ResultHeader first = null;
        String firstPath = null;
        Map<String, Integer> contigIndex = new HashMap<>();
        List<ContigLoci> loci = new ArrayList<>();
        Map<String, Integer> motifIds = new HashMap<>();
        Map<String, Integer> classIds = new HashMap<>();
        List<String> classNames = new ArrayList<>();
        LinkedHashSet<String> commands = new LinkedHashSet<>();
        TreeMap<Integer, ShardId> shards = new TreeMap<>();
        Integer shardTotal = null;
        boolean wholeGenome = false;
        List<Region> regions = new ArrayList<>();

        for (String path : paths) {
            try (ResultInput in = ResultInput.open(path, StandardCharsets.UTF_8)) {
                List<String> hashLines = new ArrayList<>();
                String line;
                long lineNo = 0;
                while ((line = in.readLine()) != null) {
                    lineNo++;
                    if (!line.startsWith("#")) {
                        break;
                    }
                    hashLines.add(line);
                }
                ResultHeader h;
                try {
                    h = ResultHeader.parse(hashLines);
                } catch (IllegalArgumentException e) {
                    throw new StriaException(path + ": damaged header: " + e.getMessage());
                }
                if (h == null) {
                    throw new StriaException(path + ": not a stria result (no #stria header line)");
                }
                if (!h.inputLineMatches(hashLines)) {
                    throw new StriaException(path + ": the #input line does not match the #contig lines "
                            + "(edited or damaged header)");
                }
                if (first == null) {
                    first = h;
                    firstPath = path;
                    for (ContigInfo c : h.contigs()) {
                        contigIndex.put(c.name(), contigIndex.size());
                        loci.add(new ContigLoci());
                    }
                } else {
                    if (!h.fingerprint().equals(first.fingerprint())) {
                        throw new StriaException(firstPath + " and " + path + " are results of different genomes "
                                + "(input fingerprints " + first.fingerprint() + " and " + h.fingerprint()
                                + "); a report covers one genome");
                    }
                    if (!h.settings().equals(first.settings())) {
                        throw new StriaException(firstPath + " and " + path + " were made with different settings ("
                                + first.settings() + " / " + h.settings() + "); a report covers one run");
                    }
                }
                commands.add(h.command());
                if (h.shard() != null) {
                    ShardId id = parseShard(path, h.shard());
                    if (shardTotal != null && shardTotal != id.n()) {
                        throw new StriaException(path + ": shard " + h.shard() + " belongs to a split into "
                                + id.n() + " parts, other files to a split into " + shardTotal);
                    }
                    shardTotal = id.n();
                    shards.put(id.k(), id);
                }
                if (h.regions().isEmpty()) {
                    wholeGenome = true;
                } else {
                    regions.addAll(h.regions());
                }
                if (line == null) {
                    continue; // header only: a run that found nothing, or an empty shard
                }
                int[] col = columns(path, lineNo, line);
                while ((line = in.readLine()) != null) {
                    lineNo++;
                    if (line.isEmpty() || line.startsWith("#")) {
                        continue;
                    }
                    readRow(path, lineNo, line, col, first, contigIndex, loci, motifIds, classIds, classNames);
                }
            }
        }
        for (ContigLoci l : loci) {
            l.sortAndDeduplicate();
        }
        List<Integer> missing = new ArrayList<>();
        if (shardTotal != null) {
            for (int k = 1; k <= shardTotal; k++) {
                if (!shards.containsKey(k)) {
                    missing.add(k);
                }
            }
        }
        List<long[]> scanned = scannedSpans(first, wholeGenome, regions, contigIndex);
        return new ResultSet(List.copyOf(paths), first, List.copyOf(commands), List.copyOf(shards.values()),
                List.copyOf(missing), !wholeGenome, scanned, loci, List.copyOf(classNames));
    }

    private static ShardId parseShard(String path, String shard) {
        try {
            return ShardId.parse(shard);
        } catch (IllegalArgumentException e) {
            throw new StriaException(path + ": cannot read the #shard line '" + shard + "'");
        }
    }

    private static int[] columns(String path, long lineNo, String headerRow) {
        String[] names = headerRow.split("\t", -1);
        int[] col = new int[REQUIRED.length + OPTIONAL.length];
        for (int r = 0; r < OPTIONAL.length; r++) {
            col[REQUIRED.length + r] = -1;
            for (int i = 0; i < names.length; i++) {
                if (names[i].equals(OPTIONAL[r])) {
                    col[REQUIRED.length + r] = i;
                }
            }
        }
        for (int r = 0; r < REQUIRED.length; r++) {
            col[r] = -1;
            for (int i = 0; i < names.length; i++) {
                if (names[i].equals(REQUIRED[r])) {
                    col[r] = i;
                }
            }
            if (col[r] < 0) {
                throw new StriaException(path + " line " + lineNo + ": expected the TSV header row with a '"
                        + REQUIRED[r] + "' column (is this a BED file? the report reads the TSV output)");
            }
        }
        return col;
    }

    private static void readRow(String path, long lineNo, String line, int[] col, ResultHeader h,
                                Map<String, Integer> contigIndex, List<ContigLoci> loci,
                                Map<String, Integer> motifIds, Map<String, Integer> classIds,
                                List<String> classNames) {
        String[] f = line.split("\t", -1);
        int need = 0;
        for (int c : col) {
            need = Math.max(need, c + 1);
        }
        if (f.length < need) {
            throw new StriaException(path + " line " + lineNo + ": " + f.length + " columns, expected at least " + need);
        }
        Integer ci = contigIndex.get(f[col[0]]);
        if (ci == null) {
            throw new StriaException(path + " line " + lineNo + ": contig '" + f[col[0]]
                    + "' is not among the #contig lines");
        }
        try {
            int s = Integer.parseInt(f[col[1]]);
            int e = Integer.parseInt(f[col[2]]);
            int p = Integer.parseInt(f[col[3]]);
            float purity = Float.parseFloat(f[col[6]]);
            long len = h.contigs().get(ci).length();
            if (s < 0 || e <= s || e > len || p < 1) {
                throw new StriaException(path + " line " + lineNo + ": locus " + s + "-" + e + " (period " + p
                        + ") does not fit contig " + f[col[0]] + " of length " + len);
            }
            int motifId = motifIds.computeIfAbsent(f[col[4]], k -> motifIds.size());
            String cls = f[col[5]];
            Integer classId = classIds.get(cls);
            if (classId == null) {
                classId = classNames.size();
                classIds.put(cls, classId);
                classNames.add(cls);
            }
            int subPeriod = optionalCount(f, col[REQUIRED.length]);
            int units = optionalCount(f, col[REQUIRED.length + 1]);
            if ((subPeriod == 0) != (units == 0)) {
                throw new StriaException(path + " line " + lineNo + ": subunit_period and subunits must be both"
                        + " empty or both set");
            }
            loci.get(ci).add(s, e, p, motifId, classId, purity, subPeriod, units);
        } catch (NumberFormatException ex) {
            throw new StriaException(path + " line " + lineNo + ": not a number where one is expected ("
                    + ex.getMessage() + ")");
        }
    }

    /** The positive count in column {@code c} of {@code f}; 0 when the column is missing or the cell empty. */
    private static int optionalCount(String[] f, int c) {
        if (c < 0 || c >= f.length || f[c].isEmpty()) {
            return 0;
        }
        int v = Integer.parseInt(f[c]);
        if (v < 1) {
            throw new NumberFormatException("'" + f[c] + "' is not a positive count");
        }
        return v;
    }

    /** Per contig, the scanned spans as flattened {@code [start, end)} pairs: whole contigs, or the regions' union. */
    private static List<long[]> scannedSpans(ResultHeader h, boolean wholeGenome, List<Region> regions,
                                             Map<String, Integer> contigIndex) {
        List<Region> spans = new ArrayList<>();
        if (wholeGenome) {
            for (ContigInfo c : h.contigs()) {
                spans.add(new Region(c.name(), 0, c.length()));
            }
        } else {
            for (Region r : regions) {
                Integer ci = contigIndex.get(r.contig());
                if (ci != null) {
                    int len = h.contigs().get(ci).length();
                    spans.add(new Region(r.contig(), Math.min(len, r.start()), Math.min(len, r.end())));
                }
            }
        }
        List<List<Long>> per = new ArrayList<>();
        for (int c = 0; c < h.contigs().size(); c++) {
            per.add(new ArrayList<>());
        }
        for (Region r : Region.union(spans, h.contigs())) {
            List<Long> l = per.get(contigIndex.get(r.contig()));
            l.add((long) r.start());
            l.add((long) r.end());
        }
        List<long[]> out = new ArrayList<>();
        for (List<Long> l : per) {
            long[] a = new long[l.size()];
            for (int i = 0; i < a.length; i++) {
                a[i] = l.get(i);
            }
            out.add(a);
        }
        return out;
    }
}
