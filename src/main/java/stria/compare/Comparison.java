package stria.compare;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import stria.io.BaseStream;
import stria.io.Bases;
import stria.io.ContigBytes;
import stria.score.Locus;

/**
 * The comparison engine: pairs every locus of assembly A with its place in assembly B by the sequence
 * beside it, and measures B's repeat there from B's own bases. The package doc has the rules; this class
 * holds the state and enforces the order of the four steps:
 * <ol>
 *   <li>{@link Builder#addContig} for every contig of A, in order, with its loci (random access to A's
 *       bases, which are read only around the loci); {@link Builder#build};
 *   <li>{@link #countA} for every contig of A (any order): counts every anchor word in A;
 *   <li>{@link #streamB} for every contig of B, each once, front to back: B is never held whole;
 *   <li>{@link #results} (one row per locus of A, in A's order), then {@link #newLoci} with B's own loci.
 * </ol>
 * Memory grows with the number of A's loci (see {@link #figures}), not with the length of either genome.
 * Nothing depends on thread count or timing: the results are the same for any {@code threads}.
 */
public final class Comparison {
    static final int LEFT = 0;
    static final int RIGHT = 1;
    /** Bases read from a stream at a time. */
    private static final int CHUNK = 1 << 16;

    final CompareSettings settings;
    final int m;
    final List<String> aNames;
    final Locus[] loci;
    final int[] contigOf;
    /** Per A contig, the index of its first locus; one entry more at the end. */
    final int[] contigFirst;
    /** Largest end among the loci of the contig up to each locus, for finding neighbours. */
    final int[] reachEnd;
    /** A position of each anchor's word ({@code g * 2m + side * m + j}), -1 when the side has fewer. */
    final int[] anchorPos;
    /** The stretch of A kept for each locus: [outerL, outerR), packed from stretchAt; -1 when none. */
    final int[] outerL;
    final int[] outerR;
    final long[] stretchAt;
    final PackedBases aBases;
    /** Why a locus has no anchors at all (null when it has). */
    final String[] unanchored;
    final AnchorTable table;
    private final boolean[] aCounted;
    private final int[] aLength;

    // B
    private final List<String> bNames = new ArrayList<>();
    private final Map<String, Integer> bIndex = new HashMap<>();
    final KeptStretches kept;
    private final int ringBits;
    private long bBases;
    private long aBasesCounted;

    /** The loci compared: {@code [selFrom, selTo)} of A's loci in the order added; the others are neighbours only. */
    final int selFrom;
    final int selTo;
    /** Per contig of A and of B: SHA-256 of its bases in upper case, filled while counting and streaming. */
    private final byte[][] aDigest;
    private final List<byte[]> bDigest = new ArrayList<>();
    private final List<Integer> bLength = new ArrayList<>();

    private List<ComparedLocus> results;
    private List<int[]> placedInB;

    private Comparison(Builder b) {
        settings = b.settings;
        m = settings.anchorsPerSide();
        aNames = List.copyOf(b.names);
        int n = b.loci.size();
        loci = b.loci.toArray(new Locus[0]);
        contigOf = Arrays.copyOf(b.contigOf, n);
        contigFirst = new int[aNames.size() + 1];
        for (int c = 0; c < aNames.size(); c++) {
            contigFirst[c] = b.firstOf.get(c);
        }
        contigFirst[aNames.size()] = n;
        reachEnd = new int[n];
        for (int g = 0; g < n; g++) {
            boolean first = g == 0 || contigOf[g - 1] != contigOf[g];
            reachEnd[g] = first ? loci[g].end() : Math.max(reachEnd[g - 1], loci[g].end());
        }
        anchorPos = Arrays.copyOf(b.anchorPos, n * 2 * m);
        outerL = Arrays.copyOf(b.outerL, n);
        outerR = Arrays.copyOf(b.outerR, n);
        stretchAt = Arrays.copyOf(b.stretchAt, n);
        unanchored = b.unanchored.toArray(new String[0]);
        aBases = b.packed;
        table = new AnchorTable(b.words, b.aFwd, n * 2 * m);
        aCounted = new boolean[aNames.size()];
        aDigest = new byte[aNames.size()][];
        aLength = new int[aNames.size()];
        selFrom = Math.min(b.selFrom, n);
        selTo = Math.max(selFrom, Math.min(b.selTo, n));
        kept = new KeptStretches(n);
        long longest = 0;
        for (int g = 0; g < n; g++) {
            longest = Math.max(longest, maxSpan(g));
        }
        long ring = Math.max(1L << 20, longest + CHUNK + Kmer.K + 1);
        int bits = 64 - Long.numberOfLeadingZeros(ring - 1);
        if (bits > 30) {
            throw new IllegalArgumentException("a locus of A spans " + longest / 2 + " bases or more: too long to compare");
        }
        ringBits = bits;
    }

    /** Longest stretch of B between a locus' outermost anchors that is still taken as its counterpart. */
    long maxSpan(int g) {
        if (outerL[g] < 0) {
            return 0;
        }
        return 2L * (outerR[g] - outerL[g]) + 16L * loci[g].period() + 4096;
    }

    public static Builder builder(CompareSettings settings) {
        return new Builder(settings);
    }

    /** Collects A's contigs and loci and chooses the anchors. */
    public static final class Builder {
        private final CompareSettings settings;
        private final int m;
        private final List<String> names = new ArrayList<>();
        private final List<Integer> firstOf = new ArrayList<>();
        private final List<Locus> loci = new ArrayList<>();
        private final List<String> unanchored = new ArrayList<>();
        private int[] contigOf = new int[1024];
        private int[] anchorPos;
        private long[] words;
        private boolean[] aFwd;
        private int[] outerL = new int[1024];
        private int[] outerR = new int[1024];
        private long[] stretchAt = new long[1024];
        private final PackedBases packed = new PackedBases();
        private byte[] codes = new byte[4096];
        private long[] canon = new long[4097];
        private boolean built;
        private int selFrom = 0;
        private int selTo = Integer.MAX_VALUE;

        /**
         * Compares only loci {@code [from, to)} (numbered in the order added, over all contigs): the others
         * are still neighbours (anchors avoid them, the aligner knows them), so each compared locus comes out
         * exactly as in a comparison of all, but they get no anchors and no row. For splitting a comparison.
         */
        public Builder select(int from, int to) {
            if (from < 0 || to < from) {
                throw new IllegalArgumentException("selection [" + from + ", " + to + ")");
            }
            selFrom = from;
            selTo = to;
            return this;
        }

        private Builder(CompareSettings settings) {
            this.settings = settings;
            this.m = settings.anchorsPerSide();
            anchorPos = new int[1024 * 2 * m];
            words = new long[1024 * 2 * m];
            aFwd = new boolean[1024 * 2 * m];
        }

        /**
         * Adds the next contig of A with its loci, sorted by start. Only the bases around the loci are
         * read; {@code bases} is not kept.
         */
        public Builder addContig(String name, ContigBytes bases, List<Locus> contigLoci) {
            if (built) {
                throw new IllegalStateException("already built");
            }
            int c = names.size();
            names.add(name);
            firstOf.add(loci.size());
            Locus[] ls = contigLoci.toArray(new Locus[0]);
            int[] maxEnd = new int[ls.length];
            for (int i = 0; i < ls.length; i++) {
                Locus l = ls[i];
                if (i > 0 && l.start() < ls[i - 1].start()) {
                    throw new IllegalArgumentException("loci of " + name + " are not sorted by start");
                }
                if (l.start() < 0 || l.end() > bases.length() || l.start() >= l.end()) {
                    throw new IllegalArgumentException("locus [" + l.start() + ", " + l.end() + ") outside " + name);
                }
                maxEnd[i] = i == 0 ? l.end() : Math.max(maxEnd[i - 1], l.end());
            }
            for (int i = 0; i < ls.length; i++) {
                add(c, bases, ls, maxEnd, i);
            }
            return this;
        }

        private void add(int c, ContigBytes bases, Locus[] ls, int[] maxEnd, int i) {
            Locus l = ls[i];
            int g = loci.size();
            grow(g + 1);
            loci.add(l);
            contigOf[g] = c;
            if (g < selFrom || g >= selTo) {
                int base = g * 2 * m;
                Arrays.fill(anchorPos, base, base + 2 * m, -1);
                Arrays.fill(words, base, base + 2 * m, -1);
                outerL[g] = outerR[g] = -1;
                stretchAt[g] = -1;
                unanchored.add("not-selected");
                return;
            }
            int s = l.start();
            int e = l.end();
            int flank = settings.flank();
            int skip = settings.maxSkip();
            int contigLen = bases.length();
            // the other loci nearby: anchors never overlap a repeat, and are sought beyond the ones beside
            blockedN = 0;
            long lowBound = (long) s - flank - skip;
            long highBound = (long) e + flank + skip;
            for (int h = i - 1; h >= 0 && maxEnd[h] > lowBound; h--) {
                block(ls[h].start(), ls[h].end());
            }
            for (int h = i + 1; h < ls.length && ls[h].start() < highBound; h++) {
                block(ls[h].start(), ls[h].end());
            }
            mergeBlocked();
            int wl = leftReach(s, flank, skip);
            int wr = rightReach(e, flank, skip, contigLen);
            int len = wr - wl;
            if (codes.length < len) {
                codes = new byte[Math.max(len, 2 * codes.length)];
                mask = new boolean[codes.length];
                canon = new long[codes.length + 1];
            }
            bases.copy(wl, wr, codes, 0);
            Bases.encode(codes, 0, len, codes);
            java.util.Arrays.fill(mask, 0, len, false);
            for (int k = 0; k < blockedN; k++) {
                for (int x = Math.max(wl, blocked[2 * k]); x < Math.min(wr, blocked[2 * k + 1]); x++) {
                    mask[x - wl] = true;
                }
            }
            int base = g * 2 * m;
            Arrays.fill(anchorPos, base, base + 2 * m, -1);
            Arrays.fill(words, base, base + 2 * m, -1);
            String why = null;
            for (int x = s - wl; x < e - wl; x++) {
                if (codes[x] < 0 || codes[x] > 3) {
                    why = "locus-not-ACGT";
                    break;
                }
            }
            int nl = why != null ? 0 : leftAnchors(s - wl, wl, base);
            int nr = why != null ? 0 : rightAnchors(e - wl, len, wl, base + m);
            if (why == null && nl == 0) {
                why = "no-left-anchor";
            } else if (why == null && nr == 0) {
                why = "no-right-anchor";
            }
            unanchored.add(why);
            if (why != null) {
                outerL[g] = outerR[g] = -1;
                stretchAt[g] = -1;
                Arrays.fill(words, base, base + 2 * m, -1);
                Arrays.fill(anchorPos, base, base + 2 * m, -1);
                return;
            }
            int lo = anchorPos[base + nl - 1];
            int hi = anchorPos[base + m + nr - 1] + Kmer.K;
            outerL[g] = lo;
            outerR[g] = hi;
            stretchAt[g] = packed.append(codes, lo - wl, hi - wl);
        }

        // other loci near the one being added, as sorted, disjoint [start, end) pairs
        private int[] blocked = new int[64];
        private int blockedN;
        private boolean[] mask = new boolean[4096];

        private void block(int a, int b) {
            if (2 * blockedN + 2 > blocked.length) {
                blocked = Arrays.copyOf(blocked, 2 * blocked.length);
            }
            blocked[2 * blockedN] = a;
            blocked[2 * blockedN + 1] = b;
            blockedN++;
        }

        private void mergeBlocked() {
            long[] key = new long[blockedN];
            for (int k = 0; k < blockedN; k++) {
                key[k] = ((long) blocked[2 * k] << 32) | (blocked[2 * k + 1] & 0xffffffffL);
            }
            Arrays.sort(key);
            int n = 0;
            for (long x : key) {
                int a = (int) (x >>> 32);
                int b = (int) x;
                if (n > 0 && a <= blocked[2 * n - 1]) {
                    blocked[2 * n - 1] = Math.max(blocked[2 * n - 1], b);
                } else {
                    blocked[2 * n] = a;
                    blocked[2 * n + 1] = b;
                    n++;
                }
            }
            blockedN = n;
        }

        /**
         * Where the search for left anchors ends: {@code flank} bases outside other loci, or the start of
         * the locus that would make the loci passed over longer than {@code skip}, or the contig start.
         */
        private int leftReach(int s, int flank, int skip) {
            int pos = s;
            int free = 0;
            int skipped = 0;
            for (int k = blockedN - 1; k >= 0; k--) {
                int bs = blocked[2 * k];
                int be = Math.min(blocked[2 * k + 1], pos);
                if (bs >= pos) {
                    continue;
                }
                if (free + (pos - be) >= flank) {
                    break;
                }
                free += pos - be;
                skipped += be - bs;
                if (skipped > skip) {
                    return be;
                }
                pos = bs;
            }
            return Math.max(0, pos - (flank - free));
        }

        /** As {@link #leftReach}, rightwards from the locus end {@code e}. */
        private int rightReach(int e, int flank, int skip, int contigLen) {
            int pos = e;
            int free = 0;
            int skipped = 0;
            for (int k = 0; k < blockedN; k++) {
                int bs = Math.max(blocked[2 * k], pos);
                int be = blocked[2 * k + 1];
                if (be <= pos) {
                    continue;
                }
                if (free + (bs - pos) >= flank) {
                    break;
                }
                free += bs - pos;
                skipped += be - bs;
                if (skipped > skip) {
                    return bs;
                }
                pos = be;
            }
            return (int) Math.min(contigLen, (long) pos + (flank - free));
        }

        /**
         * Words ending at or before the locus start {@code x} (window coordinates), nearest first, each
         * ending where the one before starts, sampled, outside other loci, and with only A, C, G, T
         * between it and the locus.
         */
        private int leftAnchors(int x, int wl, int at) {
            int from = x;
            while (from > 0 && codes[from - 1] >= 0 && codes[from - 1] <= 3) {
                from--;
            }
            roll(from, x);
            int n = 0;
            int limit = x;
            for (int end = x; end - Kmer.K >= from && n < m; end--) {
                long w = canon[end];
                if (end > limit || w < 0) {
                    continue;
                }
                if (Kmer.sampled(Kmer.hash(w >>> 1), settings.sampling())) {
                    put(at + n, end - Kmer.K + wl, w);
                    n++;
                    limit = end - Kmer.K;
                }
            }
            return n;
        }

        /** As {@link #leftAnchors}, outwards from the locus end {@code x} to the window end {@code len}. */
        private int rightAnchors(int x, int len, int wl, int at) {
            int to = x;
            while (to < len && codes[to] >= 0 && codes[to] <= 3) {
                to++;
            }
            roll(x, to);
            int n = 0;
            int limit = x;
            for (int start = x; start + Kmer.K <= to && n < m; start++) {
                long w = canon[start + Kmer.K];
                if (start < limit || w < 0) {
                    continue;
                }
                if (Kmer.sampled(Kmer.hash(w >>> 1), settings.sampling())) {
                    put(at + n, start + wl, w);
                    n++;
                    limit = start + Kmer.K;
                }
            }
            return n;
        }

        /**
         * canon[end] for every word codes[end - K, end) inside [from, to) (all A, C, G, T): the canonical
         * word shifted left one bit, its lowest bit set when A's + strand reads it in canonical form; -1
         * for a word that overlaps another locus.
         */
        private void roll(int from, int to) {
            long f = 0;
            long r = 0;
            int clean = 0;
            for (int i = from; i < to; i++) {
                int c = codes[i];
                f = ((f << 2) | c) & Kmer.MASK;
                r = (r >>> 2) | ((long) (3 - c) << Kmer.TOP_SHIFT);
                clean = mask[i] ? 0 : clean + 1;
                if (i - from + 1 >= Kmer.K) {
                    canon[i + 1] = clean < Kmer.K ? -1 : f < r ? (f << 1) | 1 : r << 1;
                }
            }
        }

        private void put(int a, int pos, long w) {
            anchorPos[a] = pos;
            words[a] = w >>> 1;
            aFwd[a] = (w & 1) != 0;
        }

        private void grow(int n) {
            if (n <= contigOf.length) {
                return;
            }
            int sz = Math.max(n, 2 * contigOf.length);
            contigOf = Arrays.copyOf(contigOf, sz);
            outerL = Arrays.copyOf(outerL, sz);
            outerR = Arrays.copyOf(outerR, sz);
            stretchAt = Arrays.copyOf(stretchAt, sz);
            anchorPos = Arrays.copyOf(anchorPos, sz * 2 * m);
            words = Arrays.copyOf(words, sz * 2 * m);
            aFwd = Arrays.copyOf(aFwd, sz * 2 * m);
        }

        public Comparison build() {
            if (built) {
                throw new IllegalStateException("already built");
            }
            built = true;
            return new Comparison(this);
        }
    }

    // ------------------------------------------------------------------ step 2: counting in A

    /** Counts the anchor words in contig {@code aContig} of A (its number in the order added). */
    public void countA(int aContig, ContigBytes bases) {
        beginCount(aContig);
        KmerScanner sc = new KmerScanner(table, settings.sampling());
        sc.begin();
        KmerScanner.Hits hits = (slot, start, fwd) -> table.addA(slot);
        int len = bases.length();
        MessageDigest md = sha256();
        byte[] buf = new byte[CHUNK];
        byte[] up = new byte[CHUNK];
        for (int at = 0; at < len; at += CHUNK) {
            int n = Math.min(CHUNK, len - at);
            bases.copy(at, at + n, buf, 0);
            sc.feed(buf, 0, n, hits);
            digest(md, buf, up, n);
        }
        aDigest[aContig] = md.digest();
        aLength[aContig] = len;
        aBasesCounted += len;
    }

    /** As {@link #countA(int, ContigBytes)}, reading the contig's {@code length} bases from a stream. */
    public void countA(int aContig, BaseStream bases, int length) {
        beginCount(aContig);
        KmerScanner sc = new KmerScanner(table, settings.sampling());
        sc.begin();
        KmerScanner.Hits hits = (slot, start, fwd) -> table.addA(slot);
        MessageDigest md = sha256();
        byte[] buf = new byte[CHUNK];
        byte[] up = new byte[CHUNK];
        for (int at = 0; at < length; at += CHUNK) {
            int n = Math.min(CHUNK, length - at);
            bases.read(buf, 0, n);
            sc.feed(buf, 0, n, hits);
            digest(md, buf, up, n);
        }
        aDigest[aContig] = md.digest();
        aLength[aContig] = length;
        aBasesCounted += length;
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Adds {@code buf[0, n)} in upper case: soft-masking does not make two contigs differ. */
    private static void digest(MessageDigest md, byte[] buf, byte[] up, int n) {
        for (int i = 0; i < n; i++) {
            byte x = buf[i];
            up[i] = x >= 'a' && x <= 'z' ? (byte) (x - 32) : x;
        }
        md.update(up, 0, n);
    }

    private void beginCount(int aContig) {
        if (!bNames.isEmpty()) {
            throw new IllegalStateException("A is counted before B streams");
        }
        if (aCounted[aContig]) {
            throw new IllegalStateException("contig " + aNames.get(aContig) + " of A counted twice");
        }
        aCounted[aContig] = true;
    }

    // ------------------------------------------------------------------ step 3: streaming B

    /** Streams the next contig of B past the anchors; its bases are read once, front to back. */
    public void streamB(String name, int length, BaseStream bases) {
        int c = beginB(name);
        BStream s = new BStream(c);
        MessageDigest md = sha256();
        byte[] buf = new byte[CHUNK];
        byte[] up = new byte[CHUNK];
        for (int at = 0; at < length; at += CHUNK) {
            int n = Math.min(CHUNK, length - at);
            bases.read(buf, 0, n);
            s.feed(buf, n);
            digest(md, buf, up, n);
        }
        bDigest.add(md.digest());
        bLength.add(length);
        bBases += length;
    }

    /** As {@link #streamB(String, int, BaseStream)} for a contig held in an array (ASCII, as read). */
    public void streamB(String name, byte[] seq) {
        int c = beginB(name);
        BStream s = new BStream(c);
        MessageDigest md = sha256();
        byte[] buf = new byte[CHUNK];
        byte[] up = new byte[CHUNK];
        for (int at = 0; at < seq.length; at += CHUNK) {
            int n = Math.min(CHUNK, seq.length - at);
            System.arraycopy(seq, at, buf, 0, n);
            s.feed(buf, n);
            digest(md, buf, up, n);
        }
        bDigest.add(md.digest());
        bLength.add(seq.length);
        bBases += seq.length;
    }

    /** The ring of B's last bases, one for all of B's contigs: an assembly may have many small ones. */
    private byte[] ring() {
        if (bRing == null) {
            bRing = new byte[1 << ringBits];
        }
        return bRing;
    }

    private byte[] bRing;

    private int beginB(String name) {
        if (results != null) {
            throw new IllegalStateException("results already taken");
        }
        if (bNames.isEmpty()) {
            for (int c = 0; c < aCounted.length; c++) {
                if (!aCounted[c]) {
                    throw new IllegalStateException("contig " + aNames.get(c) + " of A not counted");
                }
            }
        }
        if (bIndex.putIfAbsent(name, bNames.size()) != null) {
            throw new IllegalArgumentException("contig " + name + " of B streamed twice");
        }
        bNames.add(name);
        return bNames.size() - 1;
    }

    /**
     * One contig of B going past the index. Its last bases wait in a ring (as codes) long enough for any
     * locus' stretch between its outermost anchors: when an anchor of the second side of a locus (in B's
     * order) comes by and one of the first side came by shortly before on the same strand, both words seen
     * once in B so far, B's bases from that one on are copied to the locus.
     */
    private final class BStream implements KmerScanner.Hits {
        private final int contig;
        private final byte[] ring = ring();
        private final int mask = ring.length - 1;
        private final KmerScanner scanner = new KmerScanner(table, settings.sampling());
        private long fed;

        BStream(int contig) {
            this.contig = contig;
            scanner.begin();
        }

        void feed(byte[] buf, int n) {
            int at = (int) (fed & mask);
            int first = Math.min(n, ring.length - at);
            for (int i = 0; i < first; i++) {
                ring[at + i] = Bases.code(buf[i]);
            }
            for (int i = first; i < n; i++) {
                ring[i - first] = Bases.code(buf[i]);
            }
            fed += n;
            scanner.feed(buf, 0, n, this);
        }

        @Override
        public void hit(int slot, int start, boolean canonicalOnPlus) {
            AnchorTable t = table;
            t.addB(slot, contig, start, canonicalOnPlus);
            // a word seen twice in B anchors nothing: a stretch it would start or end must not take the
            // place of one kept for words that may still be unique, which B's order alone would decide
            if (t.countA(slot) != 1 || t.countB(slot) != 1) {
                return;
            }
            boolean plus = t.sameStrand(slot, canonicalOnPlus);
            int firstSide = plus ? LEFT : RIGHT;
            for (int i = t.refStart(slot), e = t.refEnd(slot); i < e; i++) {
                int a = t.ref(i);
                int g = a / (2 * m);
                int side = (a / m) & 1;
                if (side == firstSide) {
                    continue;
                }
                long span = maxSpan(g);
                int from = Integer.MAX_VALUE;
                int base = g * 2 * m + firstSide * m;
                for (int j = 0; j < m; j++) {
                    int q = t.slotOfAnchor[base + j];
                    if (q < 0 || t.countA(q) != 1 || t.countB(q) != 1 || t.hitContig(q) != contig
                            || t.sameStrand(q) != plus) {
                        continue;
                    }
                    int hp = t.hitPos(q);
                    if (hp < start && start - hp <= span) {
                        from = Math.min(from, hp);
                    }
                }
                if (from != Integer.MAX_VALUE) {
                    capture(g, plus, from, start + Kmer.K);
                }
            }
        }

        private void capture(int g, boolean plus, int from, int to) {
            kept.keep(g, contig, plus, from, to, ring, mask);
        }
    }

    // ------------------------------------------------------------------ step 4: results

    /**
     * One row per locus of A compared (all, unless {@link Builder#select} chose some), in A's order (contigs
     * as added, loci as given).
     */
    public List<ComparedLocus> results(int threads) {
        if (results != null) {
            return results;
        }
        bRing = null;
        int n = selTo - selFrom;
        ComparedLocus[] out = new ComparedLocus[n];
        int[] twin = identicalContigs();
        int block = 1024;
        if (threads <= 1 || n <= block) {
            Resolver r = new Resolver(this);
            for (int g = selFrom; g < selTo; g++) {
                out[g - selFrom] = decide(r, g, twin);
            }
        } else {
            ExecutorService pool = Executors.newFixedThreadPool(threads, task -> {
                Thread th = new Thread(task, "stria-compare");
                th.setDaemon(true);
                return th;
            });
            try {
                List<Future<?>> fs = new ArrayList<>();
                ThreadLocal<Resolver> own = ThreadLocal.withInitial(() -> new Resolver(this));
                for (int from = selFrom; from < selTo; from += block) {
                    int a = from;
                    int b = Math.min(selTo, from + block);
                    fs.add(pool.submit(() -> {
                        Resolver r = own.get();
                        for (int g = a; g < b; g++) {
                            out[g - selFrom] = decide(r, g, twin);
                        }
                    }));
                }
                for (Future<?> f : fs) {
                    f.get();
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("interrupted", e);
            } catch (ExecutionException e) {
                if (e.getCause() instanceof RuntimeException re) {
                    throw re;
                }
                throw new IllegalStateException(e.getCause());
            } finally {
                pool.shutdownNow();
            }
        }
        results = List.of(out);
        placedInB = new ArrayList<>();
        for (int c = 0; c < bNames.size(); c++) {
            placedInB.add(new int[0]);
        }
        indexPlaced(out);
        return results;
    }

    /** A locus of a contig that B holds unchanged is itself there; any other is resolved by its anchors. */
    private ComparedLocus decide(Resolver r, int g, int[] twin) {
        int b = twin[contigOf[g]];
        if (b < 0) {
            return r.resolve(g);
        }
        Locus l = loci[g];
        return new ComparedLocus(aNames.get(contigOf[g]), l, Status.SAME, bNames.get(b), l.start(), l.end(), '+',
                l.purity(), null, null);
    }

    /**
     * For each contig of A, the contig of B with the very same bases (case aside), or -1: where each of
     * them has exactly one such partner, every locus is at the same place in B, its flanks repeated or not.
     * Loci with no unique anchor (flanks inside interspersed repeats) are placed that way too, which makes
     * a genome compared with itself come out {@code same} throughout.
     */
    private int[] identicalContigs() {
        Map<String, List<Integer>> aBy = new HashMap<>();
        Map<String, List<Integer>> bBy = new HashMap<>();
        java.util.HexFormat hex = java.util.HexFormat.of();
        for (int c = 0; c < aNames.size(); c++) {
            aBy.computeIfAbsent(aLength[c] + ":" + hex.formatHex(aDigest[c]), k -> new ArrayList<>()).add(c);
        }
        for (int c = 0; c < bNames.size(); c++) {
            bBy.computeIfAbsent(bLength.get(c) + ":" + hex.formatHex(bDigest.get(c)), k -> new ArrayList<>()).add(c);
        }
        int[] twin = new int[aNames.size()];
        Arrays.fill(twin, -1);
        for (Map.Entry<String, List<Integer>> e : aBy.entrySet()) {
            List<Integer> bs = bBy.get(e.getKey());
            if (e.getValue().size() == 1 && bs != null && bs.size() == 1) {
                twin[e.getValue().get(0)] = bs.get(0);
            }
        }
        return twin;
    }

    /**
     * Per B contig, the stretches of B that belong to a locus of A: B's repeat of every placed locus, and
     * around every B-unique anchor of an unplaced one the stretch its counterpart could occupy (a locus of
     * B there is more likely a counterpart missed than a new repeat). Kept sorted by start as
     * {@code start, end} pairs.
     */
    private void indexPlaced(ComparedLocus[] out) {
        List<List<long[]>> per = new ArrayList<>();
        for (int c = 0; c < bNames.size(); c++) {
            per.add(new ArrayList<>());
        }
        for (int i = 0; i < out.length; i++) {
            ComparedLocus r = out[i];
            int g = selFrom + i;
            if (r.placed()) {
                int wide = r.otherStart() == r.otherEnd() ? 1 : 0;
                per.get(bIndex.get(r.otherChrom())).add(new long[] {r.otherStart() - wide, r.otherEnd() + wide});
            } else if (outerL[g] >= 0) {
                long half = maxSpan(g) / 2;
                for (int a = g * 2 * m; a < (g + 1) * 2 * m; a++) {
                    int q = table.slotOfAnchor[a];
                    if (q >= 0 && table.countA(q) == 1 && table.countB(q) == 1) {
                        int p = table.hitPos(q);
                        per.get(table.hitContig(q)).add(new long[] {p - half, p + Kmer.K + half});
                    }
                }
            }
        }
        for (int c = 0; c < per.size(); c++) {
            List<long[]> l = per.get(c);
            l.sort((x, y) -> Long.compare(x[0], y[0]));
            int[] flat = new int[2 * l.size()];
            for (int i = 0; i < l.size(); i++) {
                flat[2 * i] = (int) Math.max(Integer.MIN_VALUE, l.get(i)[0]);
                flat[2 * i + 1] = (int) Math.min(Integer.MAX_VALUE, l.get(i)[1]);
            }
            placedInB.set(c, flat);
        }
    }

    /**
     * The loci of B's contig {@code bContig} (B's own scan) that have no counterpart in A: they overlap no
     * placed locus of A there nor the stretch an unplaced one could occupy. A placed stretch that is empty
     * (nothing of the repeat left) still claims the base on each side of it.
     */
    public List<ComparedLocus> newLoci(String bContig, List<Locus> bLoci) {
        if (results == null) {
            throw new IllegalStateException("results first");
        }
        Integer c = bIndex.get(bContig);
        if (c == null) {
            throw new IllegalArgumentException("contig " + bContig + " of B was not streamed");
        }
        int[] iv = placedInB.get(c);
        int k = iv.length / 2;
        int[] maxEnd = new int[k];
        for (int i = 0; i < k; i++) {
            maxEnd[i] = i == 0 ? iv[1] : Math.max(maxEnd[i - 1], iv[2 * i + 1]);
        }
        List<ComparedLocus> out = new ArrayList<>();
        for (Locus l : bLoci) {
            // the stretches that start before the locus ends; one of them overlaps it if any ends after its start
            int lo = 0;
            int hi = k;
            while (lo < hi) {
                int mid = (lo + hi) >>> 1;
                if (iv[2 * mid] < l.end()) {
                    lo = mid + 1;
                } else {
                    hi = mid;
                }
            }
            if (lo == 0 || maxEnd[lo - 1] <= l.start()) {
                out.add(ComparedLocus.newInB(bContig, l));
            }
        }
        return out;
    }

    /** Memory held and work done, for the benchmark. */
    public record Figures(int loci, int anchors, int distinctWords, long tableBytes, long stretchBytes,
                          long captureBytes, long aBasesCounted, long bBasesStreamed) {
        public long bytes() {
            return tableBytes + stretchBytes + captureBytes;
        }
    }

    public Figures figures() {
        int anchors = 0;
        for (int p : anchorPos) {
            if (p >= 0) {
                anchors++;
            }
        }
        long capBytes = kept.bytes();
        int n = loci.length;
        // per-locus arrays of this class (references at 4 bytes); the Locus objects are the caller's
        long perLocus = 8L * m + 36;
        return new Figures(n, anchors, table.distinct(), table.bytes(), aBases.bytes() + perLocus * n,
                capBytes, aBasesCounted, bBases);
    }

    String bName(int c) {
        return bNames.get(c);
    }
}
