package stria.cli;

import stria.score.ScoreSettings;

/** Defaults of the imperfect mode (placeholder until the scorer chooses them by measurement). */
final class ImperfectDefaults {
    private ImperfectDefaults() {
    }

    static ScoreSettings settings(int maxPeriod) {
        return new ScoreSettings(1, maxPeriod, 2.0, 12, 0.8, 30);
    }
}
