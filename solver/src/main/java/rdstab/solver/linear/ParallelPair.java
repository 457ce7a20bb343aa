package rdstab.solver.linear;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.BooleanSupplier;

/**
 * Two pieces of work at once: the first in the calling thread, the second in the common fork-join pool
 * when it has a free worker, otherwise in the caller after the first. Used for the two halves of a tree
 * split, of a nested dissection and of long vector operations. The pieces must not write the same memory;
 * callers arrange their arithmetic so that the result does not depend on which thread ran what.
 */
public final class ParallelPair {

    private ParallelPair() {
    }

    /** Runs both; an exception from either is rethrown (the first one's preferred) after both have finished. */
    public static void run(Runnable first, Runnable second) {
        both(() -> {
            first.run();
            return true;
        }, () -> {
            second.run();
            return true;
        });
    }

    /**
     * Runs {@code first} in the calling thread and {@code second} in the common fork-join pool when it has a
     * free worker (otherwise the caller runs it too, after {@code first}); returns both results. An exception
     * from either is rethrown (the first one's preferred) after both have finished.
     */
    public static boolean[] both(BooleanSupplier first, BooleanSupplier second) {
        AtomicBoolean claimed = new AtomicBoolean();
        CountDownLatch done = new CountDownLatch(1);
        boolean[] result = new boolean[2];
        RuntimeException[] failure = new RuntimeException[2];
        Runnable task = () -> {
            if (claimed.compareAndSet(false, true)) {
                try {
                    result[1] = second.getAsBoolean();
                } catch (RuntimeException | Error e) {
                    failure[1] = e instanceof RuntimeException r ? r : new IllegalStateException(e);
                } finally {
                    done.countDown();
                }
            }
        };
        boolean parallel = ForkJoinPool.getCommonPoolParallelism() > 0 && Runtime.getRuntime().availableProcessors() > 1;
        if (parallel) {
            ForkJoinPool.commonPool().execute(task);
        }
        try {
            result[0] = first.getAsBoolean();
        } catch (RuntimeException e) {
            failure[0] = e;
        }
        task.run(); // no-op when a pool worker has claimed it
        // wait without giving up: the other half writes into the caller's arrays and takes milliseconds; an
        // interrupt is kept for the caller to see afterwards (as it would be after the same work in one thread)
        boolean interrupted = false;
        while (true) {
            try {
                done.await();
                break;
            } catch (InterruptedException e) {
                interrupted = true;
            }
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
        }
        if (failure[0] != null) {
            throw failure[0];
        }
        if (failure[1] != null) {
            throw failure[1];
        }
        return result;
    }
}
