package stria.report;

/**
 * Bins of equal width in log10 of locus length, from the power of ten at or below the shortest locus to a
 * little above the longest (at least one decade): about 48 bins, but none narrower than one base at the
 * short end, where otherwise short loci would leave empty bins between the integer lengths.
 *
 * @param x0    log10 of the first bin's lower edge
 * @param x1    log10 of the last bin's upper edge (at or above it)
 * @param dx    bin width in log10
 * @param count number of bins
 */
record LengthBins(double x0, double x1, double dx, int count) {
    /** The bins for every locus of {@code r}; for none, those of loci of 10 to 100 bases. */
    static LengthBins of(ResultSet r) {
        int minLen = Integer.MAX_VALUE, maxLen = 1;
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                minLen = Math.min(minLen, l.end(i) - l.start(i));
                maxLen = Math.max(maxLen, l.end(i) - l.start(i));
            }
        }
        if (minLen == Integer.MAX_VALUE) {
            minLen = 10;
            maxLen = 100;
        }
        return of(minLen, maxLen);
    }

    static LengthBins of(int minLen, int maxLen) {
        double x0 = Math.floor(Math.log10(minLen));
        double x1 = Math.max(x0 + 1, Math.ceil(Math.log10(maxLen) * 10) / 10 + 0.05);
        double dx = Math.max((x1 - x0) / 48, Math.log10(1 + 1 / Math.pow(10, x0)));
        int nx = (int) Math.ceil((x1 - x0) / dx - 1e-9);
        return new LengthBins(x0, x1, dx, nx);
    }

    /** The bin of a locus of {@code length} bases. */
    int bin(int length) {
        return (int) Math.min(count - 1, Math.max(0, (Math.log10(length) - x0) / dx));
    }

    /** log10 of the lower edge of bin {@code b}. */
    double start(int b) {
        return x0 + b * dx;
    }

    /** log10 of the middle of bin {@code b}. */
    double middle(int b) {
        return x0 + (b + 0.5) * dx;
    }
}
