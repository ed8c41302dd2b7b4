package stria.io;

import java.util.List;

/**
 * Manual benchmark, not a test: times opening (pre-pass or index check), loading every contig in file
 * order, reading every contig again through a stream in 1 MiB pieces, and starting streams at 100
 * random places (1000 bases read from each). Usage: ReadSpeed FILE...
 */
public final class ReadSpeed {
    private static final int PIECE = 1 << 20;
    private static final int STARTS = 100;

    private ReadSpeed() {
    }

    public static void main(String[] args) {
        for (String file : args) {
            for (int round = 0; round < 2; round++) {
                java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
                long c0 = mx.getCurrentThreadCpuTime();
                long t0 = System.nanoTime();
                try (GenomeReader r = GenomeReader.open(file, System.err::println)) {
                    long t1 = System.nanoTime();
                    long c1 = mx.getCurrentThreadCpuTime();
                    List<ContigInfo> contigs = r.contigs();
                    long bases = 0;
                    long check = 0;
                    for (ContigInfo c : contigs) {
                        byte[] s = r.sequence(c);
                        bases += s.length;
                        check += s[s.length / 2];
                    }
                    long t2 = System.nanoTime();
                    long c2 = mx.getCurrentThreadCpuTime();
                    byte[] piece = new byte[PIECE];
                    for (ContigInfo c : contigs) {
                        BaseStream in = r.stream(c);
                        for (int done = 0; done < c.length(); done += PIECE) {
                            int n = Math.min(PIECE, c.length() - done);
                            in.read(piece, 0, n);
                            check += piece[n / 2];
                        }
                    }
                    long t3 = System.nanoTime();
                    long c3 = mx.getCurrentThreadCpuTime();
                    java.util.Random rnd = new java.util.Random(round);
                    for (int k = 0; k < STARTS; k++) {
                        ContigInfo c = contigs.get(rnd.nextInt(contigs.size()));
                        int n = Math.min(1000, c.length());
                        r.stream(c, rnd.nextInt(c.length() - n + 1)).read(piece, 0, n);
                        check += piece[n / 2];
                    }
                    long t4 = System.nanoTime();
                    long c4 = mx.getCurrentThreadCpuTime();
                    // wall time suffers when the machine is shared; CPU time of this thread is the honest figure
                    System.out.printf("%s round %d: %d contigs, %d bases; open %.2f s wall, %.2f s cpu (%.0f MB/s);"
                                    + " load %.2f s wall, %.2f s cpu (%.0f MB/s);"
                                    + " stream %.2f s wall, %.2f s cpu (%.0f MB/s);"
                                    + " starts %.3f ms wall, %.3f ms cpu each [%d]%n",
                            file, round, contigs.size(), bases, (t1 - t0) / 1e9, (c1 - c0) / 1e9,
                            bases / 1e6 / ((c1 - c0) / 1e9), (t2 - t1) / 1e9, (c2 - c1) / 1e9,
                            bases / 1e6 / ((c2 - c1) / 1e9), (t3 - t2) / 1e9, (c3 - c2) / 1e9,
                            bases / 1e6 / ((c3 - c2) / 1e9), (t4 - t3) / 1e6 / STARTS, (c4 - c3) / 1e6 / STARTS,
                            check);
                }
            }
        }
    }
}
