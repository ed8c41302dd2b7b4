package stria.score;

import java.util.Arrays;

/**
 * A consensus motif voted by aligned copies (codes 0..3), with {@code phase}: where the phase the vote
 * was asked about lies in it.
 */
record Consensus(byte[] motif, int phase) {

    /**
     * Majority consensus of the {@link VoteTally} counts {@code cnt} over the phases of {@code base}, with
     * gaps as votes: a phase most copies lack is dropped, and where most copies insert, as many bases as
     * they insert on average are added (placeholder letters, replaced by the next vote). Ties keep the
     * letter of {@code base}. Reduced to its primitive root. {@code phase} of {@code base} maps to where it
     * begins in the new motif (ahead of the bases inserted before it; a dropped phase maps to the letter
     * after it). Null when nothing is left.
     */
    static Consensus of(int[] cnt, byte[] base, int phase) {
        int p = base.length;
        byte[] m = new byte[p + 8];
        int n = 0;
        int mapped = 0;
        for (int ph = 0; ph < p; ph++) {
            int o = VoteTally.SLOTS * ph;
            int through = cnt[o] + cnt[o + 1] + cnt[o + 2] + cnt[o + 3] + cnt[o + VoteTally.DELETED];
            if (ph == phase) {
                mapped = n;
            }
            if (through > 0 && 2 * cnt[o + VoteTally.INSERTED] > through) {
                int extra = Math.max(1, Math.round(cnt[o + VoteTally.INSERTED_BASES]
                        / (float) cnt[o + VoteTally.INSERTED]));
                for (int x = 0; x < extra; x++) {
                    if (n == m.length) {
                        m = Arrays.copyOf(m, 2 * m.length);
                    }
                    m[n++] = base[ph];
                }
            }
            int best = base[ph];
            int bc = cnt[o + best];
            for (int b = 0; b < 4; b++) {
                if (cnt[o + b] > bc) {
                    bc = cnt[o + b];
                    best = b;
                }
            }
            if (cnt[o + VoteTally.DELETED] > bc) {
                continue;
            }
            if (n == m.length) {
                m = Arrays.copyOf(m, 2 * m.length);
            }
            m[n++] = (byte) best;
        }
        if (n == 0) {
            return null;
        }
        m = Arrays.copyOf(m, n);
        mapped = Math.min(mapped, n - 1);
        int root = MotifClass.primitiveRoot(m);
        if (root < n) {
            m = Arrays.copyOf(m, root);
            mapped %= root;
        }
        return new Consensus(m, mapped);
    }
}
