package stria.cli;

import stria.score.ScoreSettings;

/**
 * Defaults of the imperfect mode, chosen on the planted-truth benchmark (README, Benchmarks). Kept as
 * compile-time constants so that {@code --help} can show them.
 */
final class ImperfectDefaults {
    static final String MIN_COPIES = "2";
    static final String MIN_LENGTH = "12";
    static final String MIN_PURITY = "0.8";
    static final String MIN_SCORE = "30";

    private ImperfectDefaults() {
    }

    static ScoreSettings settings(int maxPeriod) {
        return new ScoreSettings(1, maxPeriod, Double.parseDouble(MIN_COPIES), Integer.parseInt(MIN_LENGTH),
                Double.parseDouble(MIN_PURITY), Integer.parseInt(MIN_SCORE));
    }
}
