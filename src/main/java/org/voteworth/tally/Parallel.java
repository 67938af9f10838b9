package org.voteworth.tally;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Numbered pieces of work on a few threads of their own: either in any order, or produced in
 * parallel and consumed strictly in number order with a bounded number of results waiting (so
 * that results as large as a partition of the reviewer table do not pile up in memory). The
 * first failure stops the rest and is thrown once every thread has stopped.
 */
final class Parallel {
    private Parallel() {
    }

    /** One of several numbered pieces of work. */
    @FunctionalInterface
    interface Task {
        void run(int i) throws IOException;
    }

    /** Makes the result of piece {@code i}. */
    @FunctionalInterface
    interface Producer<T> {
        T make(int i) throws IOException;
    }

    /** Takes the results, in order. */
    @FunctionalInterface
    interface Consumer<T> {
        void take(T result) throws IOException;
    }

    /** Runs {@code task} for 0 .. n-1 on up to {@code threads} threads (the caller's among them). */
    static void forEach(int n, int threads, Task task) throws IOException {
        AtomicInteger next = new AtomicInteger();
        Failure failure = new Failure();
        Runnable loop = () -> {
            int i;
            while (!failure.happened() && (i = next.getAndIncrement()) < n) {
                try {
                    task.run(i);
                } catch (Throwable t) {
                    failure.set(t);
                }
            }
        };
        List<Thread> pool = start(Math.min(threads, n) - 1, loop, "merge-");
        loop.run();
        join(pool);
        failure.rethrow();
    }

    /**
     * Makes the results of 0 .. n-1 on {@code threads} threads and hands them to {@code consumer}
     * on the caller's thread in order 0, 1, 2, ...; a producer waits while {@code threads} results
     * ahead of the next one to consume are made or waiting.
     */
    static <T> void inOrder(int n, int threads, Producer<T> producer, Consumer<T> consumer) throws IOException {
        Object lock = new Object();
        Object[] results = new Object[n];
        int[] consumed = {0};
        AtomicInteger next = new AtomicInteger();
        Failure failure = new Failure();
        int window = Math.max(1, threads);
        Runnable loop = () -> {
            int i;
            while (!failure.happened() && (i = next.getAndIncrement()) < n) {
                try {
                    synchronized (lock) {
                        while (i - consumed[0] >= window && !failure.happened()) {
                            lock.wait();
                        }
                    }
                    if (failure.happened()) {
                        return;
                    }
                    T made = producer.make(i);
                    synchronized (lock) {
                        results[i] = made;
                        lock.notifyAll();
                    }
                } catch (Throwable t) {
                    failure.set(t);
                    synchronized (lock) {
                        lock.notifyAll();
                    }
                }
            }
        };
        List<Thread> pool = start(Math.min(threads, n), loop, "write-");
        try {
            for (int i = 0; i < n; i++) {
                Object r;
                synchronized (lock) {
                    while ((r = results[i]) == null && !failure.happened()) {
                        lock.wait();
                    }
                    results[i] = null;
                }
                if (r == null) {
                    break;
                }
                @SuppressWarnings("unchecked")
                T made = (T) r;
                consumer.take(made);
                synchronized (lock) {
                    consumed[0] = i + 1;
                    lock.notifyAll();
                }
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            failure.set(new InterruptedIOException("interrupted while merging tallies"));
        } catch (Throwable t) {
            failure.set(t);
        } finally {
            synchronized (lock) {
                lock.notifyAll();
            }
            for (Thread th : pool) {
                if (failure.happened()) {
                    th.interrupt();
                }
            }
            join(pool);
        }
        failure.rethrow();
    }

    private static List<Thread> start(int count, Runnable loop, String name) {
        List<Thread> pool = new ArrayList<>();
        for (int t = 0; t < count; t++) {
            Thread th = new Thread(loop, name + (t + 1));
            th.setDaemon(true);
            th.start();
            pool.add(th);
        }
        return pool;
    }

    private static void join(List<Thread> pool) throws InterruptedIOException {
        for (Thread th : pool) {
            try {
                th.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new InterruptedIOException("interrupted while merging tallies");
            }
        }
    }

    /** The first failure of any thread. */
    private static final class Failure {
        private volatile Throwable first;

        boolean happened() {
            return first != null;
        }

        synchronized void set(Throwable t) {
            if (first == null) {
                first = t;
            }
        }

        void rethrow() throws IOException {
            Throwable t = first;
            if (t == null) {
                return;
            }
            if (t instanceof IOException io) {
                throw io;
            }
            if (t instanceof RuntimeException r) {
                throw r;
            }
            if (t instanceof Error e) {
                throw e;
            }
            throw new IOException(t);
        }
    }
}
