package stria.compare;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.out.LocusFormat;
import stria.out.ResultHeader;
import stria.out.ResultInput;
import stria.score.Locus;

/**
 * The loci of one genome for a comparison, per contig in genome order: read back from a scan's TSV result,
 * or as the scan delivered them. Either way every locus is what its TSV row says (purity, copies and entropy
 * at the decimals written), so a comparison that reuses results writes the same bytes as one that scans.
 */
public final class ScanResults {
    private static final String[] COLUMNS = LocusFormat.TSV_HEADER.split("\t");

    private ScanResults() {
    }

    /**
     * The loci of {@code path}, a TSV written by {@code stria scan --tsv} for the genome {@code contigs} with
     * the settings {@code settings} (as {@code #settings} writes them); refused, naming the file and what
     * differs, when it was made from another genome, with other settings, for a part of the genome only, or
     * is not such a result.
     *
     * @param genome how to name the genome in messages (its file)
     */
    public static List<List<Locus>> read(String path, String genome, List<ContigInfo> contigs, String settings) {
        Map<String, Integer> index = new HashMap<>();
        List<List<Locus>> out = new ArrayList<>();
        for (ContigInfo c : contigs) {
            index.put(c.name(), index.size());
            out.add(new ArrayList<>());
        }
        try (ResultInput in = ResultInput.open(path, StandardCharsets.UTF_8)) {
            List<String> hash = new ArrayList<>();
            String line;
            long lineNo = 0;
            while ((line = in.readLine()) != null && line.startsWith("#")) {
                lineNo++;
                hash.add(line);
            }
            lineNo++;
            ResultHeader h;
            try {
                h = ResultHeader.parse(hash);
            } catch (RuntimeException e) {
                throw new StriaException(path + " has a damaged header: " + e.getMessage());
            }
            if (h == null) {
                throw new StriaException(path + " is not a stria result (no #stria line)");
            }
            for (String l : hash) {
                if (l.startsWith(CompareHeader.PREFIX_OTHER_INPUT)) {
                    throw new StriaException(path + " is a comparison, not a scan result: give the TSV of stria scan");
                }
            }
            if (!h.inputLineMatches(hash)) {
                throw new StriaException(path + " has a damaged header: its #input line does not match its #contig lines");
            }
            String want = ResultHeader.fingerprint(contigs);
            if (!h.fingerprint().equals(want)) {
                throw new StriaException(path + " is not a result of " + genome + " (input fingerprint "
                        + h.fingerprint() + ", " + genome + " has " + want + ")");
            }
            if (!h.settings().equals(settings)) {
                throw new StriaException(path + " was made with other settings (" + h.settings() + "; this comparison: "
                        + settings + ")");
            }
            if (h.shard() != null) {
                throw new StriaException(path + " is shard " + h.shard() + " of a split scan: merge the shards first");
            }
            if (!h.regions().isEmpty()) {
                throw new StriaException(path + " covers only some regions of " + genome + ": give a whole-genome result");
            }
            if (line == null || !line.startsWith("chrom\t")) {
                throw new StriaException(path + " is not a TSV result (a BED result lacks figures the comparison "
                        + "needs): give the output of stria scan --tsv");
            }
            int[] col = columns(path, line);
            int last = -1;
            int lastStart = -1;
            while ((line = in.readLine()) != null) {
                lineNo++;
                if (line.isEmpty() || line.startsWith("#")) {
                    continue;
                }
                String[] f = line.split("\t", -1);
                Integer c = f.length < COLUMNS.length ? null : index.get(f[col[0]]);
                if (c == null) {
                    throw new StriaException(path + " line " + lineNo + ": not a locus of " + genome);
                }
                Locus l;
                try {
                    l = locus(f, col);
                } catch (RuntimeException e) {
                    throw new StriaException(path + " line " + lineNo + ": cannot read the locus (" + e.getMessage() + ")");
                }
                if (l.start() < 0 || l.end() <= l.start() || l.end() > contigs.get(c).length() || l.period() < 1) {
                    throw new StriaException(path + " line " + lineNo + ": locus outside its contig");
                }
                if (c < last || (c == last && l.start() < lastStart)) {
                    throw new StriaException(path + " line " + lineNo + ": loci out of order");
                }
                last = c;
                lastStart = l.start();
                out.get(c).add(l);
            }
        }
        return out;
    }

    /** A locus as its TSV row would be read back. */
    public static Locus asWritten(Locus l) {
        StringBuilder sb = new StringBuilder(96);
        LocusFormat.tsv(sb, ".", l);
        String[] f = sb.substring(0, sb.length() - 1).split("\t", -1);
        int[] col = new int[COLUMNS.length];
        for (int i = 0; i < col.length; i++) {
            col[i] = i;
        }
        return locus(f, col);
    }

    private static Locus locus(String[] f, int[] col) {
        int start = Integer.parseInt(f[col[1]]);
        int end = Integer.parseInt(f[col[2]]);
        int period = Integer.parseInt(f[col[3]]);
        String motif = f[col[4]];
        if (motif.length() != period) {
            throw new IllegalArgumentException("motif " + motif + " is not of period " + period);
        }
        return new Locus(start, end, period, motif, f[col[at("motif_class")]],
                Double.parseDouble(f[col[at("copies")]]), Double.parseDouble(f[col[at("purity")]]),
                Integer.parseInt(f[col[at("mismatches")]]), Integer.parseInt(f[col[at("insertions")]]),
                Integer.parseInt(f[col[at("deletions")]]), Double.parseDouble(f[col[at("score")]]),
                Double.parseDouble(f[col[at("evalue")]]), Double.parseDouble(f[col[at("entropy")]]));
    }

    /** Index in {@link #COLUMNS} of the column named {@code name}. */
    private static int at(String name) {
        for (int i = 0; i < COLUMNS.length; i++) {
            if (COLUMNS[i].equals(name)) {
                return i;
            }
        }
        throw new IllegalStateException("no column " + name);
    }

    /** Where each column of the scan's TSV is, by name. */
    private static int[] columns(String path, String row) {
        String[] names = row.split("\t", -1);
        int[] col = new int[COLUMNS.length];
        for (int i = 0; i < COLUMNS.length; i++) {
            col[i] = -1;
            for (int j = 0; j < names.length; j++) {
                if (names[j].equals(COLUMNS[i])) {
                    col[i] = j;
                }
            }
            if (col[i] < 0) {
                throw new StriaException(path + " has no column " + COLUMNS[i] + ": give the output of stria scan --tsv");
            }
        }
        return col;
    }
}
