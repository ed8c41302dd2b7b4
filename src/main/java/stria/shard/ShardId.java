package stria.shard;

/**
 * Shard {@code k} of {@code n} of a split run (1-based, as job-array indexes are), written {@code K/N} on the
 * command line and in result headers. The one parser of that text.
 */
public record ShardId(int k, int n) {
    public ShardId {
        if (n < 1 || k < 1 || k > n) {
            throw new IllegalArgumentException("shard " + k + "/" + n + " needs 1 <= K <= N");
        }
    }

    /**
     * Parses {@code K/N} (spaces around the numbers allowed).
     *
     * @throws IllegalArgumentException naming what is wrong: not two numbers, or not {@code 1 <= K <= N}
     */
    public static ShardId parse(String text) {
        String[] f = text.split("/", -1);
        if (f.length != 2) {
            throw new IllegalArgumentException("takes K/N, e.g. 3/16 (got " + text + ")");
        }
        int k;
        int n;
        try {
            k = Integer.parseInt(f[0].trim());
            n = Integer.parseInt(f[1].trim());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("takes K/N with whole numbers, e.g. 3/16 (got " + text + ")");
        }
        if (n < 1 || k < 1 || k > n) {
            throw new IllegalArgumentException("K/N needs 1 <= K <= N (got " + text + ")");
        }
        return new ShardId(k, n);
    }

    /** {@code K/N}, as result headers carry it. */
    @Override
    public String toString() {
        return k + "/" + n;
    }
}
