package stria.cli;

import stria.score.ScoreSettings;

/**
 * Defaults of the imperfect mode (chosen by the scorer on the planted-truth benchmark), as compile-time
 * text so that {@code --help} can show them.
 */
final class ImperfectDefaults {
    static final String MIN_COPIES = "" + ScoreSettings.DEFAULT_MIN_COPIES;
    static final String MIN_LENGTH = "" + ScoreSettings.DEFAULT_MIN_LENGTH;
    static final String MIN_PURITY = "" + ScoreSettings.DEFAULT_MIN_PURITY;
    static final String MIN_SCORE = "" + ScoreSettings.DEFAULT_MIN_SCORE;

    private ImperfectDefaults() {
    }

    static ScoreSettings settings(int maxPeriod) {
        return ScoreSettings.defaults().withMaxPeriod(maxPeriod);
    }
}
