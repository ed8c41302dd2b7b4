package stria.report;

/**
 * Repeat classes by period, the grouping used in the summary tables. The boundaries follow common
 * practice in genome annotation; groups disagree about where micro ends, so they are kept in one place.
 */
public enum PeriodClass {
    HOMOPOLYMER("homopolymer", 1, 1),
    MICRO("micro", 2, 6),
    MINI("mini", 7, 99),
    SATELLITE("satellite", 100, Integer.MAX_VALUE);

    private final String label;
    private final int min;
    private final int max;

    PeriodClass(String label, int min, int max) {
        this.label = label;
        this.min = min;
        this.max = max;
    }

    public String label() {
        return label;
    }

    /** Period range as people write it: {@code 1}, {@code 2-6}, {@code >=100}. */
    public String range() {
        if (min == max) {
            return Integer.toString(min);
        }
        return max == Integer.MAX_VALUE ? ">=" + min : min + "-" + max;
    }

    /** Column-name suffix in the summary TSV: p1, p2_6, p7_99, p100. */
    public String key() {
        if (min == max) {
            return "p" + min;
        }
        return max == Integer.MAX_VALUE ? "p" + min : "p" + min + "_" + max;
    }

    public static PeriodClass of(int period) {
        if (period <= 1) {
            return HOMOPOLYMER;
        }
        if (period <= 6) {
            return MICRO;
        }
        return period <= 99 ? MINI : SATELLITE;
    }
}
