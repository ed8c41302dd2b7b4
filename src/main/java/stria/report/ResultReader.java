package stria.report;

import java.io.BufferedInputStream;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.zip.GZIPInputStream;
import stria.StriaException;
import stria.out.AtomicOutputs;
import stria.out.ResultHeader;

/**
 * Reads TSV results for a report. Several files must describe one genome: the same {@code #input}
 * fingerprint and the same {@code #settings}, because a summary that mixed genomes or settings would
 * look plausible and mean nothing. Columns are found by the names in the header row, so added columns do
 * not break old reports.
 */
public final class ResultReader {
    private static final String[] REQUIRED = {"chrom", "start", "end", "period", "motif", "motif_class", "purity"};

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
        TreeMap<Integer, String> shards = new TreeMap<>();
        Integer shardTotal = null;
        boolean wholeGenome = false;
        List<ResultHeader.Span> regions = new ArrayList<>();

        for (String path : paths) {
            try (BufferedReader in = open(path)) {
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
                ResultHeader h = ResultHeader.parse(hashLines);
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
                    for (ResultHeader.Contig c : h.contigs()) {
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
                    int[] kn = parseShard(path, h.shard());
                    if (shardTotal != null && shardTotal != kn[1]) {
                        throw new StriaException(path + ": shard " + h.shard() + " belongs to a split into "
                                + kn[1] + " parts, other files to a split into " + shardTotal);
                    }
                    shardTotal = kn[1];
                    shards.put(kn[0], h.shard());
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
            } catch (IOException e) {
                throw new StriaException("cannot read " + path + ": " + AtomicOutputs.describe(e));
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

    private static BufferedReader open(String path) throws IOException {
        InputStream raw = path.equals("-") ? System.in : Files.newInputStream(Path.of(path));
        BufferedInputStream in = new BufferedInputStream(raw, 1 << 16);
        in.mark(2);
        int b1 = in.read();
        int b2 = in.read();
        in.reset();
        // BGZF is a series of gzip members, which GZIPInputStream reads one after the other
        InputStream text = b1 == 0x1f && b2 == 0x8b ? new GZIPInputStream(in, 1 << 16) : in;
        return new BufferedReader(new InputStreamReader(text, StandardCharsets.UTF_8), 1 << 16);
    }

    private static int[] parseShard(String path, String shard) {
        String[] f = shard.split("/");
        try {
            int k = Integer.parseInt(f[0].trim());
            int n = Integer.parseInt(f[1].trim());
            if (f.length == 2 && k >= 1 && k <= n) {
                return new int[] {k, n};
            }
        } catch (NumberFormatException | ArrayIndexOutOfBoundsException e) {
            // reported below
        }
        throw new StriaException(path + ": cannot read the #shard line '" + shard + "'");
    }

    private static int[] columns(String path, long lineNo, String headerRow) {
        String[] names = headerRow.split("\t", -1);
        int[] col = new int[REQUIRED.length];
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
            loci.get(ci).add(s, e, p, motifId, classId, purity);
        } catch (NumberFormatException ex) {
            throw new StriaException(path + " line " + lineNo + ": not a number where one is expected ("
                    + ex.getMessage() + ")");
        }
    }

    private static List<long[]> scannedSpans(ResultHeader h, boolean wholeGenome, List<ResultHeader.Span> regions,
                                             Map<String, Integer> contigIndex) {
        List<long[]> out = new ArrayList<>();
        List<List<long[]>> per = new ArrayList<>();
        for (ResultHeader.Contig c : h.contigs()) {
            List<long[]> l = new ArrayList<>();
            if (wholeGenome) {
                l.add(new long[] {0, c.length()});
            }
            per.add(l);
        }
        if (!wholeGenome) {
            for (ResultHeader.Span r : regions) {
                Integer ci = contigIndex.get(r.contig());
                if (ci != null) {
                    long len = h.contigs().get(ci).length();
                    per.get(ci).add(new long[] {Math.max(0, r.start()), Math.min(len, r.end())});
                }
            }
        }
        for (List<long[]> l : per) {
            l.sort(Comparator.comparingLong(a -> a[0]));
            List<Long> merged = new ArrayList<>();
            long cs = -1, ce = -1;
            for (long[] s : l) {
                if (s[1] <= s[0]) {
                    continue;
                }
                if (cs < 0 || s[0] > ce) {
                    if (cs >= 0) {
                        merged.add(cs);
                        merged.add(ce);
                    }
                    cs = s[0];
                    ce = s[1];
                } else {
                    ce = Math.max(ce, s[1]);
                }
            }
            if (cs >= 0) {
                merged.add(cs);
                merged.add(ce);
            }
            long[] a = new long[merged.size()];
            for (int i = 0; i < a.length; i++) {
                a[i] = merged.get(i);
            }
            out.add(a);
        }
        return out;
    }
}
