package stria.score;

/**
 * Canonical motif class: the lexicographically smallest of all rotations of a motif and of all rotations
 * of its reverse complement, so AC, CA, GT and TG fall in one class (common practice in STR catalogues).
 * Rotations are compared with Booth's least-rotation algorithm (Booth 1980), linear in the motif length.
 */
public final class MotifClass {
    private MotifClass() {
    }

    /** Canonical class of an upper-case motif over ACGT (other letters are kept and complemented to N). */
    public static String of(String motif) {
        String a = leastRotation(motif);
        String b = leastRotation(reverseComplement(motif));
        return a.compareTo(b) <= 0 ? a : b;
    }

    public static String reverseComplement(String s) {
        char[] out = new char[s.length()];
        for (int i = 0, n = s.length(); i < n; i++) {
            char c = s.charAt(n - 1 - i);
            out[i] = switch (c) {
                case 'A' -> 'T';
                case 'C' -> 'G';
                case 'G' -> 'C';
                case 'T' -> 'A';
                default -> 'N';
            };
        }
        return new String(out);
    }

    /** Smallest rotation (Booth 1980). */
    public static String leastRotation(String s) {
        int n = s.length();
        if (n < 2) {
            return s;
        }
        int[] f = new int[2 * n];
        java.util.Arrays.fill(f, -1);
        int k = 0;
        for (int j = 1; j < 2 * n; j++) {
            char sj = s.charAt(j % n);
            int i = f[j - k - 1];
            while (i != -1 && sj != s.charAt((k + i + 1) % n)) {
                if (sj < s.charAt((k + i + 1) % n)) {
                    k = j - i - 1;
                }
                i = f[i];
            }
            if (sj != s.charAt((k + i + 1) % n)) {
                if (sj < s.charAt(k % n)) {
                    k = j;
                }
                f[j - k] = -1;
            } else {
                f[j - k] = i + 1;
            }
        }
        return s.substring(k) + s.substring(0, k);
    }

    /** Length of the shortest prefix whose repetition makes the motif (the motif's length when primitive). */
    public static int primitiveRoot(byte[] m) {
        int n = m.length;
        outer:
        for (int d = 1; d < n; d++) {
            if (n % d != 0) {
                continue;
            }
            for (int i = d; i < n; i++) {
                if (m[i] != m[i - d]) {
                    continue outer;
                }
            }
            return d;
        }
        return n;
    }
}
