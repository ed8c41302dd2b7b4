package stria.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.time.Duration;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/** Components shared between calls: solved once, waited for outside the lock. */
class SharedComponentsTest {
    private static Locus locus(int start) {
        return new Locus(start, start + 10, 2, "AC", "AC", 5, 1, 0, 0, 0, 17, 0, 1);
    }

    @Test
    void aComponentIsSolvedOnceAndTheSolverMayMeetTheNextWhileOthersWait() throws Exception {
        SharedComponents shared = new SharedComponents();
        AtomicInteger solves = new AtomicInteger();
        CountDownLatch registered = new CountDownLatch(1);
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            assertTimeoutPreemptively(Duration.ofSeconds(20), () -> {
                Future<List<Locus>> first = pool.submit(() -> shared.solve(0, 100, () -> {
                    solves.incrementAndGet();
                    registered.countDown();
                    // let the other call start waiting for this component, then meet the next one
                    sleep(300);
                    shared.solve(100, 200, () -> List.of(locus(150)));
                    return List.of(locus(5), locus(50));
                }));
                registered.await();
                Future<List<Locus>> second = pool.submit(() -> shared.solve(0, 100, () -> {
                    solves.incrementAndGet();
                    return List.of();
                }));
                assertThat(first.get()).isEqualTo(second.get());
                assertThat(solves).hasValue(1);
                assertThat(shared.covering(40, 60)).containsExactly(locus(50));
                assertThat(shared.covering(120, 180)).containsExactly(locus(150));
                assertThat(shared.covering(90, 110)).isNull();
            });
        } finally {
            pool.shutdownNow();
        }
    }

    private static void sleep(long ms) {
        try {
            Thread.sleep(ms);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }
}
