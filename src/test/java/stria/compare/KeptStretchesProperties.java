package stria.compare;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;

/** What is kept reads back base for base, packed or not, however it was grown or replaced. */
class KeptStretchesProperties {
    @Property(tries = 300)
    void keptBasesReadBackAsTheyWere(@ForAll long seed) {
        Random r = new Random(seed);
        int size = 1 << 12;
        byte[] ring = new byte[size];
        for (int i = 0; i < size; i++) {
            ring[i] = (byte) (r.nextInt(200) == 0 ? 4 : r.nextInt(4));
        }
        KeptStretches k = new KeptStretches(3);
        int[] from = new int[3];
        int[] to = new int[3];
        for (int step = 0; step < 20; step++) {
            int g = r.nextInt(3);
            if (to[g] > 0 && r.nextInt(3) > 0) {
                to[g] = Math.min(size - 1, to[g] + r.nextInt(100));
            } else {
                from[g] = r.nextInt(size / 2);
                to[g] = from[g] + 1 + r.nextInt(size / 2 - 1);
            }
            k.keep(g, 0, true, from[g], to[g], ring, size - 1);
            assertThat(k.covers(g, 0, true, from[g], to[g])).isTrue();
            assertThat(k.covers(g, 1, true, from[g], to[g])).isFalse();
            for (int x = 0; x < 3; x++) {
                if (to[x] == 0) {
                    continue;
                }
                int a = from[x] + r.nextInt(to[x] - from[x]);
                int n = r.nextInt(to[x] - a + 1);
                byte[] got = new byte[n];
                k.copy(x, a, n, got);
                for (int i = 0; i < n; i++) {
                    assertThat(got[i]).isEqualTo(ring[a + i]);
                }
            }
        }
    }
}
