package stria.report;

import java.text.FieldPosition;
import java.text.NumberFormat;
import java.text.ParsePosition;
import java.util.Locale;

/** Number formats shared by the tables and the chart axes; always Locale.ROOT so output does not vary by host. */
final class Fmt {
    private Fmt() {
    }

    static String count(long n) {
        return String.format(Locale.ROOT, "%,d", n);
    }

    /** Bases with a unit people read at a glance: 950 bp, 12.4 kb, 3.21 Mb, 1.05 Gb. */
    static String bases(long n) {
        if (n < 1_000) {
            return n + " bp";
        }
        if (n < 1_000_000) {
            return String.format(Locale.ROOT, "%.1f kb", n / 1e3);
        }
        if (n < 1_000_000_000) {
            return String.format(Locale.ROOT, "%.2f Mb", n / 1e6);
        }
        return String.format(Locale.ROOT, "%.2f Gb", n / 1e9);
    }

    static String percent(double fraction) {
        double p = 100 * fraction;
        if (p != 0 && p < 0.01) {
            return "<0.01%";
        }
        return String.format(Locale.ROOT, p < 10 ? "%.2f%%" : "%.1f%%", p);
    }

    /** 1200 -> 1.2k, 3400000 -> 3.4M: axis ticks stay short whatever the genome size. */
    static String compact(double v) {
        double a = Math.abs(v);
        if (a < 1_000) {
            if (a == Math.rint(a)) {
                return Long.toString((long) v);
            }
            return new java.math.BigDecimal(v).round(new java.math.MathContext(3)).stripTrailingZeros()
                    .toPlainString();
        }
        String[] units = {"k", "M", "G", "T"};
        int u = -1;
        while (a >= 1_000 && u < units.length - 1) {
            a /= 1_000;
            v /= 1_000;
            u++;
        }
        String s = a >= 100 || a == Math.rint(a) ? String.format(Locale.ROOT, "%.0f", v)
                : String.format(Locale.ROOT, "%.1f", v);
        return s + units[u];
    }

    /** An axis format over compact numbers; with {@code log10} the axis holds log10 of the value shown. */
    static NumberFormat axis(boolean log10) {
        return new NumberFormat() {
            private static final long serialVersionUID = 1L;

            @Override
            public StringBuffer format(double number, StringBuffer to, FieldPosition pos) {
                return to.append(compact(log10 ? Math.rint(Math.pow(10, number)) : number));
            }

            @Override
            public StringBuffer format(long number, StringBuffer to, FieldPosition pos) {
                return format((double) number, to, pos);
            }

            @Override
            public Number parse(String source, ParsePosition pos) {
                throw new UnsupportedOperationException();
            }
        };
    }

    static String ellipsize(String s, int max) {
        return s.length() <= max ? s : s.substring(0, max - 1) + "\u2026";
    }
}
