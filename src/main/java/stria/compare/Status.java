package stria.compare;

import java.util.Locale;

/** What became of a locus between the two assemblies (the package doc has the rules). */
public enum Status {
    SAME, CHANGED, LOST, NEW, UNPLACED;

    /** The word written in the status column. */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }
}
