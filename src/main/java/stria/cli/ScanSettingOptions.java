package stria.cli;

import picocli.CommandLine;
import picocli.CommandLine.Option;
import stria.pipeline.ScanOptions;
import stria.pipeline.ScanSettings;

/**
 * The options that shape a scan's loci, and its threads and window, mixed into every command that scans
 * ({@code scan}, {@code compare}), so they are typed, checked and documented alike. The settings are built
 * and checked by {@link ScanOptions}; a bad value is a usage error naming the option.
 */
final class ScanSettingOptions {
    @Option(names = "--exact", description = "Report exact runs (maximal repetitions, purity 1) instead of "
            + "imperfect loci.")
    boolean exact;

    @Option(names = "--min-period", paramLabel = "N", description = "Smallest period reported (default: "
            + ScanOptions.MIN_PERIOD + ").")
    Integer minPeriod;

    @Option(names = "--max-period", paramLabel = "N", description = "Largest period reported (default: "
            + ScanOptions.MAX_PERIOD + "; up to 1,000,000).")
    Integer maxPeriod;

    @Option(names = "--min-copies", paramLabel = "X", description = "Smallest copy number (length / period) "
            + "reported (default: " + ScanOptions.EXACT_MIN_COPIES + " exact, " + ScanOptions.IMPERFECT_MIN_COPIES
            + " imperfect).")
    Double minCopies;

    @Option(names = "--min-length", paramLabel = "N", description = "Shortest locus reported, in bases "
            + "(default: " + ScanOptions.EXACT_MIN_LENGTH + " exact, " + ScanOptions.IMPERFECT_MIN_LENGTH
            + " imperfect).")
    Integer minLength;

    @Option(names = "--min-purity", paramLabel = "X", description = "Lowest purity (0..1) of an imperfect locus "
            + "(default: " + ScanOptions.IMPERFECT_MIN_PURITY + ").")
    Double minPurity;

    @Option(names = "--min-score", paramLabel = "BITS", description = "Lowest score of an imperfect locus, in "
            + "bits (default: " + ScanOptions.IMPERFECT_MIN_SCORE + "). A score of S bits means the repeated "
            + "consensus explains the locus' bases 2^S times better than random bases of the genome's "
            + "composition do.")
    Double minScore;

    @Option(names = "--max-evalue", paramLabel = "X", description = "Highest evalue of an imperfect locus "
            + "(default: " + ScanOptions.IMPERFECT_MAX_EVALUE + "; Infinity for none). The evalue of a locus is "
            + "the number of loci scoring at least as well that chance alone would give in one million bases. "
            + "It assumes random i.i.d. sequence of the scanned composition; real genomes are not random, so "
            + "it ranks loci and is not the probability that a locus is real.")
    Double maxEvalue;

    @Option(names = {"-t", "--threads"}, paramLabel = "N", description = "Worker threads (default: all cores, "
            + "here ${DEFAULT-VALUE}). The output is the same for any value.")
    int threads = Runtime.getRuntime().availableProcessors();

    @Option(names = "--window", paramLabel = "SIZE", description = "Advanced: bases per window (default: 256K, or "
            + "64 x --max-period up to 4M when that is more). Memory grows with window x threads; the output is "
            + "the same for any value.")
    String window;

    /** The settings, or a usage error of {@code cl}. */
    ScanSettings settings(CommandLine cl) {
        try {
            return new ScanOptions(exact ? ScanSettings.Mode.EXACT : ScanSettings.Mode.IMPERFECT)
                    .minPeriod(minPeriod).maxPeriod(maxPeriod).minCopies(minCopies).minLength(minLength)
                    .minPurity(minPurity).minScore(minScore).maxEvalue(maxEvalue).threads(threads)
                    .window(window == null ? null : parseSize(cl, window, "--window")).settings();
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(cl, e.getMessage());
        }
    }

    /** Parses 4000000, 4,000,000, 4M, 500k. */
    static long parseSize(CommandLine cl, String text, String option) {
        String t = text.trim().replace(",", "").replace("_", "");
        long mult = 1;
        char last = t.isEmpty() ? ' ' : Character.toLowerCase(t.charAt(t.length() - 1));
        if (last == 'k') {
            mult = 1_000;
        } else if (last == 'm') {
            mult = 1_000_000;
        } else if (last == 'g') {
            mult = 1_000_000_000;
        }
        if (mult != 1) {
            t = t.substring(0, t.length() - 1);
        }
        try {
            return Math.multiplyExact(Long.parseLong(t), mult);
        } catch (NumberFormatException | ArithmeticException e) {
            throw new CommandLine.ParameterException(cl, option + " takes a size such as 4000000, "
                    + "4,000,000 or 4M (got " + text + ")");
        }
    }
}
