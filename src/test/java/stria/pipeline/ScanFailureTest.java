package stria.pipeline;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import stria.StriaException;
import stria.io.BaseStream;
import stria.io.ContigInfo;
import stria.out.LocusSink;
import stria.score.Locus;

/**
 * A failure on any thread of a scan ends it promptly with the real cause: the reader failing at any point
 * of any unit (an input truncated while read, a full TMPDIR under a spooled contig), with windows in flight
 * or waiting for permits, in memory or spooled, in either mode and at any thread count; and the writing side
 * failing while the reader is blocked. Failures are injected, so every case is deterministic.
 */
class ScanFailureTest {
    private static final int CONTIG = 300_000;

    private static byte[] bases(long seed) {
        Random r = new Random(seed);
        byte[] s = new byte[CONTIG];
        for (int i = 0; i < s.length; i++) {
            s[i] = (byte) "ACGT".charAt(r.nextInt(4));
        }
        // a few repeats, so that the scorer has seeds to work on
        for (int at = 1000; at + 400 < s.length; at += 20_000) {
            for (int i = 0; i < 300; i++) {
                s[at + i] = (byte) "CAG".charAt(i % 3);
            }
        }
        return s;
    }

    /** Units of {@code contigs} contigs; the bases of contig {@code failing} stop after {@code failAt}. */
    private static List<ScanUnit> units(int contigs, int failing, long failAt, boolean regions, String cause) {
        List<ScanUnit> units = new ArrayList<>();
        byte[] seq = bases(1);
        for (int c = 0; c < contigs; c++) {
            ContigInfo info = new ContigInfo("c" + c, CONTIG);
            boolean fails = c == failing;
            ScanUnit.Source source = (contig, from) -> {
                AtomicLong at = new AtomicLong(from);
                return (BaseStream) (dst, off, n) -> {
                    if (fails && at.get() + n > failAt) {
                        throw new StriaException(cause);
                    }
                    System.arraycopy(seq, (int) at.get(), dst, off, n);
                    at.addAndGet(n);
                };
            };
            units.add(regions ? new ScanUnit(source, info, 100_000, 200_000) : new ScanUnit(source, info, 0, CONTIG));
        }
        return units;
    }

    private static GenomeScan scan(boolean exact, int threads, int inMemoryMax) {
        ScanSettings s = new ScanOptions(exact ? ScanSettings.Mode.EXACT : ScanSettings.Mode.IMPERFECT)
                .threads(threads).window(8_192L).settings();
        return new GenomeScan(s, Progress.none(), 20_000, 16_384, inMemoryMax, Geometry.COMPOSITION_BLOCK);
    }

    @ParameterizedTest(name = "exact={0} threads={1} inMemoryMax={2} failing={3} at={4} regions={5}")
    @CsvSource({
        "false, 1, 4000000, 0, 0, false", "false, 2, 4000000, 0, 150000, false", "true, 2, 1000, 0, 150000, false",
        "false, 4, 1000, 2, 299999, false", "true, 1, 1000, 3, 5000, false", "false, 2, 1000, 1, 190000, true",
        "true, 4, 4000000, 2, 120000, true", "false, 3, 1000, 3, 299000, false", "true, 2, 1000, 0, 1, false"})
    void aReaderFailureEndsTheScanWithItsCause(boolean exact, int threads, int inMemoryMax, int failing, long at,
                                               boolean regions) {
        String cause = "cannot keep a temporary copy of contig c" + failing + " (no space left on device)";
        List<ScanUnit> units = units(4, failing, at, regions, cause);
        List<String> seen = new ArrayList<>();
        assertTimeoutPreemptively(Duration.ofSeconds(20), () ->
                assertThatThrownBy(() -> scan(exact, threads, inMemoryMax).run(units, (contig, l) -> seen.add(contig)))
                        .isInstanceOf(StriaException.class).hasMessage(cause));
        // nothing after the failing contig was delivered (exact mode writes a contig's runs as they come, so
        // the failing contig's first loci may have been; the outputs are then never committed)
        assertThat(seen).allMatch(c -> Integer.parseInt(c.substring(1)) <= failing);
        assertNoScanThreadsLeft();
    }

    @ParameterizedTest(name = "exact={0} threads={1}")
    @CsvSource({"false, 1", "false, 2", "true, 2", "true, 4"})
    void aWriterFailureEndsTheScanWhileTheReaderWaits(boolean exact, int threads) {
        List<ScanUnit> units = units(6, -1, 0, false, "unused");
        LocusSink failing = new LocusSink() {
            int n;

            @Override
            public void locus(String contig, Locus l) {
                if (++n == 3) {
                    throw new StriaException("cannot write out.bed: no space left on device");
                }
            }
        };
        assertTimeoutPreemptively(Duration.ofSeconds(20), () ->
                assertThatThrownBy(() -> scan(exact, threads, 1000).run(units, failing))
                        .isInstanceOf(StriaException.class).hasMessageContaining("no space left"));
        assertNoScanThreadsLeft();
    }

    /** The reader thread and the pool are gone within a few seconds (daemons, but they must not linger). */
    private static void assertNoScanThreadsLeft() {
        long deadline = System.nanoTime() + 5_000_000_000L;
        while (System.nanoTime() < deadline && scanThreads() > 0) {
            Thread.onSpinWait();
        }
        assertThat(scanThreads()).as("stria threads still running").isZero();
    }

    private static long scanThreads() {
        return Thread.getAllStackTraces().keySet().stream()
                .filter(t -> t.isAlive() && (t.getName().equals("stria-reader") || t.getName().startsWith("stria-worker")))
                .count();
    }
}
