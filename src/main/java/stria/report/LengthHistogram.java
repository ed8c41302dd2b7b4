package stria.report;

/**
 * Loci by length in {@link LengthBins}, split by period class: the chart for exact results, where purity
 * carries no information.
 *
 * @param loci per period class (ordinal), per bin: loci
 */
record LengthHistogram(LengthBins bins, long[][] loci) {
    static LengthHistogram of(ResultSet r) {
        LengthBins bins = LengthBins.of(r);
        long[][] n = new long[PeriodClass.values().length][bins.count()];
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                n[PeriodClass.of(l.period(i)).ordinal()][bins.bin(l.end(i) - l.start(i))]++;
            }
        }
        return new LengthHistogram(bins, n);
    }
}
