package stria.report;

/**
 * Loci counted in cells of {@link LengthBins} and purity: a scatter of a million points would be
 * unreadable. Purity bins are 0.01 wide (0.02 when purities spread over more than 0.3) from a multiple of
 * 0.05 at or below the lowest purity; the top bin holds purity 1 exactly.
 *
 * @param lengths the length bins
 * @param y0      lower edge of the first purity bin
 * @param dy      purity bin width
 * @param counts  per length bin, per purity bin: loci
 * @param most    loci in the fullest cell, at least 1
 */
record LengthPurityGrid(LengthBins lengths, double y0, double dy, long[][] counts, long most) {

    /** The cells that hold loci: lower-left corner and log10 of the count. */
    record Cells(double[] x, double[] y, double[] log10Count) {
    }

    static LengthPurityGrid of(ResultSet r) {
        LengthBins bins = LengthBins.of(r);
        float minPurity = 1;
        long total = 0;
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                minPurity = Math.min(minPurity, l.purity(i));
                total++;
            }
        }
        if (total == 0) {
            minPurity = 0.8f;
        }
        double y0 = Math.max(0, Math.floor(minPurity * 20) / 20);
        double dy = (1 - y0) <= 0.3 ? 0.01 : 0.02;
        int ny = (int) Math.round((1 - y0) / dy) + 1;
        long[][] n = new long[bins.count()][ny];
        long most = 1;
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                int bx = bins.bin(l.end(i) - l.start(i));
                int by = (int) Math.min(ny - 1, Math.max(0, Math.floor((l.purity(i) - y0) / dy + 1e-6)));
                most = Math.max(most, ++n[bx][by]);
            }
        }
        return new LengthPurityGrid(bins, y0, dy, n, most);
    }

    /** Purity bins. */
    int rows() {
        return counts.length == 0 ? 0 : counts[0].length;
    }

    /** Every cell that holds loci, by length bin and then purity bin. */
    Cells cells() {
        int cells = 0;
        for (long[] col : counts) {
            for (long v : col) {
                cells += v > 0 ? 1 : 0;
            }
        }
        double[] x = new double[cells];
        double[] y = new double[cells];
        double[] z = new double[cells];
        int k = 0;
        for (int bx = 0; bx < counts.length; bx++) {
            for (int by = 0; by < counts[bx].length; by++) {
                if (counts[bx][by] > 0) {
                    x[k] = lengths.start(bx);
                    y[k] = y0 + by * dy;
                    z[k] = Math.log10(counts[bx][by]);
                    k++;
                }
            }
        }
        return new Cells(x, y, z);
    }

    /** Top of the colour scale: log10 of the fullest cell, at least 1. */
    double zMax() {
        return Math.max(1, Math.log10(most));
    }
}
